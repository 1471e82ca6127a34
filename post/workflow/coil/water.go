package coil

import "math"

// Water near 30-40 °C, the mean temperature of cooling water in a magnet
// (from memory of steam-table values: density 995 kg/m³, specific heat
// 4.18 kJ/(kg·K), kinematic viscosity about 0.7e-6 m²/s, which is 0.80e-6
// at 30 °C and 0.66e-6 at 40 °C; thermal conductivity 0.62 W/(m·K) and
// Prandtl number about 4.8 near 35 °C).
const (
	waterDensity       = 995.0                 // kg/m³
	waterHeatPerVolume = waterDensity * 4180.0 // J/(m³·K)
	waterViscosity     = 0.70e-6               // m²/s
	waterConductivity  = 0.62                  // W/(m·K)
	waterPrandtl       = 4.8                   // ν ρ c / k near 35 °C
	laminarLimit       = 2300.0                // Reynolds number; common practice
	blasiusCoefficient = 0.3164                // Blasius (1913): f = 0.3164 Re^(-1/4)
	laminarNusselt     = 4.36                  // fully developed laminar flow, uniform heat flux
)

// Limits of common practice for water-cooled hollow conductors, used by
// the command line as its defaults (the library applies them only when
// the Spec asks: zero means no limit there).
const (
	// CommonWaterPressure is the pressure drop a coil may ask of its
	// water supply: building and closed-circuit chiller supplies give
	// some 4-10 bar across a magnet (common practice, from memory).
	CommonWaterPressure = 6e5 // Pa
	// CommonWaterSpeed is the highest speed in a copper bore before
	// erosion-corrosion wears the wall: about 3 m/s (common practice,
	// from memory; figures of 2-4 m/s are quoted).
	CommonWaterSpeed = 3.0 // m/s
	// CommonWaterCircuits is the most parallel circuits the command line
	// tries when it chooses their number: more hoses and manifold joints
	// than this make a coil hard to build and to keep tight (judgement).
	CommonWaterCircuits = 32
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

// nusselt returns the Nusselt number of fully developed flow in a smooth
// round bore at Reynolds number re and Prandtl number pr: 4.36 in laminar
// flow (uniform wall heat flux; F. P. Incropera and D. P. DeWitt,
// Fundamentals of Heat and Mass Transfer, eq. 8.53), and above
// Re = 2300 the Gnielinski correlation
//
//	Nu = (f/8)(Re − 1000) Pr / (1 + 12.7 (f/8)^½ (Pr^⅔ − 1))
//
// with the Petukhov friction factor f = (0.790 ln Re − 1.64)^−2
// (V. Gnielinski, Int. Chem. Eng. 16, 1976, pp. 359-368; stated for
// 3000 ≤ Re ≤ 5e6), never below the laminar value.
func nusselt(re, pr float64) float64 {
	if re < laminarLimit {
		return laminarNusselt
	}
	f := math.Pow(0.790*math.Log(re)-1.64, -2)
	nu := (f / 8) * (re - 1000) * pr / (1 + 12.7*math.Sqrt(f/8)*(math.Pow(pr, 2.0/3)-1))
	return math.Max(nu, laminarNusselt)
}

// waterCircuit fills the water figures of a Water-cooled option: the flow
// that carries Power at the spec's water rise and, for a Hollow conductor
// split into parallel circuits of equal length, the speed in the bore,
// the Reynolds number, the pressure drop along one circuit by the
// Darcy–Weisbach equation Δp = f (L/D) ρ v²/2 (straight smooth bore;
// bends, fittings and hoses add to it) and the hottest conductor's
// temperature. With s.WaterCircuits = 0 and s.MaxWaterCircuits > 0 it
// takes the fewest circuits, up to that many and up to the turns, that
// meet the water limits (see bestCircuits).
func waterCircuit(o *Option, s *Spec) {
	o.WaterFlow = o.Power / (waterHeatPerVolume * s.WaterRise)
	o.WaterRise = s.WaterRise
	if o.Wire.BoreArea() == 0 {
		return
	}
	if s.WaterCircuits > 0 || s.MaxWaterCircuits == 0 {
		circuitFigures(o, s, max(s.WaterCircuits, 1))
		return
	}
	circuitFigures(o, s, bestCircuits(o, s))
}

// bestCircuits returns the fewest parallel circuits, from 1 up to
// s.MaxWaterCircuits and o.Turns, whose pressure drop, bore speed and
// hottest conductor meet s's limits; failing that the fewest that meet
// the pressure and speed limits (the heat then is flagged), and failing
// that the most tried. Fewer circuits mean faster water, better heat
// transfer and fewer joints.
func bestCircuits(o *Option, s *Spec) int {
	most := max(1, min(s.MaxWaterCircuits, o.Turns))
	firstFlow := 0
	for k := 1; k <= most; k++ {
		circuitFigures(o, s, k)
		if !waterOver(o, s) {
			return k
		}
		if firstFlow == 0 && (s.MaxWaterPressure == 0 || o.WaterPressure <= s.MaxWaterPressure) &&
			(s.MaxWaterSpeed == 0 || o.WaterSpeed <= s.MaxWaterSpeed) {
			firstFlow = k
		}
	}
	if firstFlow > 0 {
		return firstFlow
	}
	return most
}

// waterOver reports whether o, with its circuit figures filled, breaks a
// water limit of s (pressure, speed or the hottest conductor).
func waterOver(o *Option, s *Spec) bool {
	return (s.MaxWaterPressure > 0 && o.WaterPressure > s.MaxWaterPressure) ||
		(s.MaxWaterSpeed > 0 && o.WaterSpeed > s.MaxWaterSpeed) ||
		o.HotSpot > s.Temperature
}

// circuitFigures fills the bore figures of o for k parallel circuits: the
// flow splits equally, each circuit is Length/k long.
//
// The hottest conductor is at a circuit's outlet: inlet (s.Ambient) plus
// the water's rise plus the film drop q/h from the wall to the water,
// q = Power / (π D Length) the heat flux through the bore wall (the whole
// conductor length, all circuits) and h = Nu k/D (nusselt). The copper
// wall's own drop is neglected (copper conducts some 600 times better
// than water).
func circuitFigures(o *Option, s *Spec, k int) {
	ab := o.Wire.BoreArea()
	d := o.Wire.Bore
	kf := float64(k)
	o.WaterCircuits = k
	o.WaterSpeed = o.WaterFlow / (kf * ab)
	o.Reynolds = o.WaterSpeed * d / waterViscosity
	o.WaterPressure = darcyFriction(o.Reynolds) * (o.Length / kf / d) * waterDensity * o.WaterSpeed * o.WaterSpeed / 2
	h := nusselt(o.Reynolds, waterPrandtl) * waterConductivity / d
	q := o.Power / (math.Pi * d * o.Length)
	o.HotSpot = s.Ambient + s.WaterRise + q/h
}
