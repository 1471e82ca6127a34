package coil

import "math"

// Annealed copper as IEC 60028 defines it ("International standard of
// resistance for copper", IEC 60028:1925, the International Annealed Copper
// Standard adopted in 1913): a wire 1 m long and 1 mm² in cross-section has
// 1/58 Ω at 20 °C, the constant-mass temperature coefficient of resistance
// at 20 °C is 0.00393 /K, and the density is 8.89 g/cm³.
const (
	CopperResistivity20 = 1.0 / 58e6 // Ω·m at 20 °C (1/58 Ω·mm²/m), IEC 60028
	CopperAlpha20       = 0.00393    // 1/K, temperature coefficient at 20 °C, IEC 60028
	CopperDensity       = 8890.0     // kg/m³, IEC 60028
)

// Defaults used when a Spec field is zero.
const (
	DefaultFillFactor  = 0.6  // round enamelled wire, insulated-circle area over window area; common practice
	DefaultTemperature = 60.0 // °C, conductor temperature for design; common practice
	DefaultAmbient     = 20.0 // °C, surrounding air (or cooling water inlet); common practice
	DefaultWaterRise   = 20.0 // K, cooling-water temperature rise inlet to outlet; common practice
)

// CopperResistivity returns the resistivity of IEC 60028 annealed copper at
// temperature t (°C), ρ(t) = ρ20 (1 + α20 (t − 20)), in Ω·m. The linear law
// is the one IEC 60028 states; it holds to well under 1 % from about −50 °C
// to 200 °C (from memory). It panics for t at or below the temperature
// where the linear law reaches zero resistance (about −234.5 °C).
func CopperResistivity(t float64) float64 {
	f := 1 + CopperAlpha20*(t-20)
	if !(f > 0) || math.IsInf(t, 0) {
		panic(errBadTemperature)
	}
	return CopperResistivity20 * f
}

// CopperResistance returns the resistance (Ω) of a copper conductor of
// length l (m) and cross-section a (m²) at temperature t (°C):
// R(t) = ρ20 (1 + α20 (t − 20)) l / a.
func CopperResistance(l, a, t float64) float64 {
	if !(a > 0) || !(l >= 0) || math.IsInf(l, 0) || math.IsInf(a, 0) {
		panic(errBadConductor)
	}
	return CopperResistivity(t) * l / a
}
