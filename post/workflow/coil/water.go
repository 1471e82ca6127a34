package coil

import "math"

// Water near 30-40 °C, the mean temperature of cooling water in a magnet
// (from memory of steam-table values: density 995 kg/m³, specific heat
// 4.18 kJ/(kg·K), kinematic viscosity about 0.7e-6 m²/s, which is 0.80e-6
// at 30 °C and 0.66e-6 at 40 °C).
const (
	waterDensity       = 995.0                 // kg/m³
	waterHeatPerVolume = waterDensity * 4180.0 // J/(m³·K)
	waterViscosity     = 0.70e-6               // m²/s
	laminarLimit       = 2300.0                // Reynolds number; common practice
	blasiusCoefficient = 0.3164                // Blasius (1913): f = 0.3164 Re^(-1/4)
)

// darcyFriction returns the Darcy friction factor of a smooth round pipe
// at Reynolds number re: 64/Re in laminar flow (Hagen–Poiseuille) and the
// Blasius correlation 0.3164 Re^(-1/4) (H. Blasius, "Das
// Ähnlichkeitsgesetz bei Reibungsvorgängen in Flüssigkeiten", 1913; valid
// for smooth pipes from about 4000 to 1e5) above, whichever is larger, so
// that the transition region is counted on the safe side.
func darcyFriction(re float64) float64 {
	if re <= 0 {
		return 0
	}
	return math.Max(64/re, blasiusCoefficient*math.Pow(re, -0.25))
}

// waterCircuit fills the water figures of a Water-cooled option: the flow
// that carries Power at the spec's water rise and, for a Hollow conductor
// split into s.WaterCircuits parallel circuits of equal length, the speed
// in the bore, the Reynolds number and the pressure drop along one
// circuit by the Darcy–Weisbach equation Δp = f (L/D) ρ v²/2 (straight
// smooth bore; bends, fittings and hoses add to it).
func waterCircuit(o *Option, s *Spec) {
	o.WaterFlow = o.Power / (waterHeatPerVolume * s.WaterRise)
	ab := o.Wire.BoreArea()
	if ab == 0 {
		return
	}
	k := float64(s.WaterCircuits)
	o.WaterSpeed = o.WaterFlow / (k * ab)
	d := o.Wire.Bore
	o.Reynolds = o.WaterSpeed * d / waterViscosity
	o.WaterPressure = darcyFriction(o.Reynolds) * (o.Length / k / d) * waterDensity * o.WaterSpeed * o.WaterSpeed / 2
}
