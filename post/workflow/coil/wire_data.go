package coil

import (
	"fmt"
	"math"
)

// AWGDiameter returns the bare diameter (m) of American Wire Gauge number n
// (0000 is -3, 000 is -2, 00 is -1, 0 is 0), by the defining formula of
// ASTM B258 ("Standard Specification for Standard Nominal Diameters and
// Cross-Sectional Areas of AWG Sizes of Solid Round Wires Used as
// Electrical Conductors"):
//
//	d_n = 0.127 mm × 92^((36 − n)/39)
//
// so that 0000 is 0.46 in and 36 is 0.005 in, with 39 equal ratios between.
// The standard's table rounds these diameters (to 4 significant figures in
// inches, from memory); the formula is the definition. n runs from -3 to 56;
// outside that it panics.
func AWGDiameter(n int) float64 {
	if n < -3 || n > 56 {
		panic(errBadAWG)
	}
	return 0.127e-3 * math.Pow(92, float64(36-n)/39)
}

// AWGName returns the usual name of gauge n: "4/0" for -3 ... "1/0" for 0,
// the number otherwise.
func AWGName(n int) string {
	if n < -3 || n > 56 {
		panic(errBadAWG)
	}
	if n <= 0 {
		return fmt.Sprintf("AWG %d/0", 1-n)
	}
	return fmt.Sprintf("AWG %d", n)
}

// Grade is the thickness class of the enamel on a round winding wire.
// IEC 60317-0-1 defines grade 1 (thin), grade 2 (medium) and grade 3
// (thick); grade 2 is the common choice for magnet coils (common practice).
type Grade uint8

const (
	Grade1 Grade = 1
	Grade2 Grade = 2
)

// Series is an IEC 60317 preferred series of nominal conductor diameters.
type Series uint8

const (
	R20 Series = 20 // every second R40 value
	R40 Series = 40 // the full series
)

// r40 holds the ISO 3 (1973, "Preferred numbers — Series of preferred
// numbers") rounded R40 values from 1.00 to 9.50. The R40 series is
// 10^(k/40) rounded; R20 is every second value (k even). IEC 60317-0-1
// takes its nominal winding-wire diameters from these series.
var r40 = [40]float64{
	1.00, 1.06, 1.12, 1.18, 1.25, 1.32, 1.40, 1.50, 1.60, 1.70,
	1.80, 1.90, 2.00, 2.12, 2.24, 2.36, 2.50, 2.65, 2.80, 3.00,
	3.15, 3.35, 3.55, 3.75, 4.00, 4.25, 4.50, 4.75, 5.00, 5.30,
	5.60, 6.00, 6.30, 6.70, 7.10, 7.50, 8.00, 8.50, 9.00, 9.50,
}

// enamelBuild is the maximum overall diameter minus the nominal conductor
// diameter (mm) of enamelled round copper wire for grades 1 and 2, at
// nominal diameters d (mm). From memory: typical values of the
// IEC 60317-0-1 dimension table (its "maximum overall diameter" columns);
// the standard's table governs, and builds between the rows are
// interpolated linearly in log d. Within about ±0.005 mm of the table
// (from memory).
var enamelBuild = []struct{ d, g1, g2 float64 }{
	{0.100, 0.017, 0.025},
	{0.200, 0.026, 0.039},
	{0.315, 0.034, 0.052},
	{0.500, 0.044, 0.066},
	{0.800, 0.055, 0.084},
	{1.000, 0.062, 0.093},
	{1.600, 0.070, 0.106},
	{2.000, 0.074, 0.112},
	{2.500, 0.079, 0.118},
	{3.150, 0.083, 0.125},
	{5.000, 0.092, 0.134},
}

// EnamelBuild returns the increase of diameter by the enamel (m) of a round
// wire of bare diameter d (m) for grade g: the maximum overall diameter
// less the nominal diameter, interpolated in log d from a table of typical
// IEC 60317-0-1 values (from memory). Below 0.1 mm and above 5 mm the end
// values of the table are held.
func EnamelBuild(d float64, g Grade) float64 {
	pick := func(i int) float64 {
		switch g {
		case Grade1:
			return enamelBuild[i].g1
		case Grade2:
			return enamelBuild[i].g2
		}
		panic(errBadGrade)
	}
	dm := d * 1e3
	n := len(enamelBuild)
	if dm <= enamelBuild[0].d {
		return pick(0) * 1e-3
	}
	if dm >= enamelBuild[n-1].d {
		return pick(n-1) * 1e-3
	}
	i := 1
	for enamelBuild[i].d < dm {
		i++
	}
	t := math.Log(dm/enamelBuild[i-1].d) / math.Log(enamelBuild[i].d/enamelBuild[i-1].d)
	return (pick(i-1) + t*(pick(i)-pick(i-1))) * 1e-3
}

// IECDiameters returns the nominal conductor diameters (m) of the series s
// from 0.100 mm to 5.00 mm, ascending: the ISO 3 preferred numbers that
// IEC 60317-0-1 uses for enamelled round winding wire.
func IECDiameters(s Series) []float64 {
	step := 1
	switch s {
	case R40:
	case R20:
		step = 2
	default:
		panic(errBadSeries)
	}
	var out []float64
	for _, scale := range []float64{0.1e-3, 1e-3} {
		for k := 0; k < len(r40); k += step {
			d := r40[k] * scale
			if d > 5.0001e-3 {
				break
			}
			out = append(out, d)
		}
	}
	return out
}

// IECWires returns enamelled round copper winding wires per IEC 60317
// (nominal diameters of series s from 0.1 mm to 5 mm) with the maximum
// overall diameter of grade g rounded to the micrometre, thinnest first.
func IECWires(s Series, g Grade) []Wire {
	ds := IECDiameters(s)
	out := make([]Wire, len(ds))
	for i, d := range ds {
		out[i] = Wire{
			Name:     fmt.Sprintf("%.3f mm G%d", d*1e3, g),
			Shape:    Round,
			Source:   fmt.Sprintf("IEC 60317-0-1 nominal diameter (ISO 3 R%d), grade %d build typical (from memory)", s, g),
			Diameter: d,
			Overall:  roundMicron(d + EnamelBuild(d, g)),
		}
	}
	return out
}

// roundMicron rounds a length (m) to the micrometre, the resolution of
// the IEC 60317 dimension tables.
func roundMicron(x float64) float64 { return math.Round(x*1e6) / 1e6 }

// AWGWires returns enamelled round copper wires in the AWG sizes 5 to 38
// (4.62 mm to 0.101 mm, the span of the enamel table), thinnest first. The
// bare diameter is the ASTM B258 formula; the enamel build is the IEC
// 60317 grade build at the same diameter (the single and heavy builds of
// NEMA MW 1000 are close to grades 1 and 2, from memory).
func AWGWires(g Grade) []Wire {
	out := make([]Wire, 0, 34)
	for n := 38; n >= 5; n-- {
		d := AWGDiameter(n)
		out = append(out, Wire{
			Name:     fmt.Sprintf("%s G%d", AWGName(n), g),
			Shape:    Round,
			Source:   fmt.Sprintf("ASTM B258 formula; grade %d build typical (from memory)", g),
			Diameter: d,
			Overall:  roundMicron(d + EnamelBuild(d, g)),
		})
	}
	return out
}

// DefaultWires returns the wire table that suits the cooling: square
// hollow conductors for water, IEC 60317 round wire (series R20, grade 2)
// for air.
func DefaultWires(c Cooling) []Wire {
	if c == Water {
		return HollowWires()
	}
	return IECWires(R20, Grade2)
}

// hollowSizes lists square hollow copper conductors for water-cooled
// coils: outer side a and bore b (mm), corner radius r (mm). Typical sizes
// (from memory), not a standard series: take the exact dimensions from the
// drawing of the conductor actually bought.
var hollowSizes = []struct{ a, b, r float64 }{
	{5, 3, 0.5},
	{6, 3.5, 0.8},
	{7, 4, 1},
	{8, 5, 1},
	{9, 5, 1},
	{10, 6, 1},
	{12, 7, 1.5},
	{15, 9, 1.5},
}

// HollowInsulation is the insulation added on each side of a hollow
// conductor (m): half-lapped glass-fibre tape impregnated with epoxy, about
// 0.5 mm a side (common practice, from memory).
const HollowInsulation = 0.5e-3

// HollowWires returns typical square hollow copper conductors for
// water-cooled coils, with HollowInsulation on every side, thinnest first.
func HollowWires() []Wire {
	out := make([]Wire, len(hollowSizes))
	for i, h := range hollowSizes {
		a := h.a * 1e-3
		out[i] = Wire{
			Name:          fmt.Sprintf("%gx%g/%g hollow", h.a, h.a, h.b),
			Shape:         Hollow,
			Source:        "typical square hollow conductor (from memory); 0.5 mm taped insulation a side (common practice)",
			Width:         a,
			Height:        a,
			Corner:        h.r * 1e-3,
			Bore:          h.b * 1e-3,
			OverallWidth:  a + 2*HollowInsulation,
			OverallHeight: a + 2*HollowInsulation,
		}
	}
	return out
}
