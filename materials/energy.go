package materials

import "math"

// Energetic is implemented by materials whose stored energy density is a
// function of b2 = |B|² alone: *Curve and Linear. (A Magnet's energy also
// depends on the direction of B relative to its magnetisation.)
type Energetic interface {
	Material
	Energy(b2 float64) float64
	CoEnergy(b2 float64) float64
}

var (
	_ Energetic = (*Curve)(nil)
	_ Energetic = Linear{}
)

// setEnergy integrates the ν table: w(b2) = ½ ∫0^b2 ν(s) ds, since
// dw = H dB = ν B dB = ½ ν d(b2). Each cell is a cubic, so the integral is
// exact (up to round-off) and dw/db2 = ν/2 holds exactly for the ν that Nu
// returns.
func (t *nuTable) setEnergy() {
	cells := len(t.c)
	t.w = make([]float64, cells+1)
	for j := range cells {
		t.w[j+1] = t.w[j] + cellEnergy(&t.c[j], t.x[j+1]-t.x[j])
	}
}

// cellEnergy returns ½ ∫0^s p(u) du for the cubic p of a cell.
func cellEnergy(p *[4]float64, s float64) float64 {
	return 0.5 * s * (p[0] + s*(p[1]/2+s*(p[2]/3+s*p[3]/4)))
}

// Energy returns the magnetic energy density w = ∫0^B H dB in J/m³ at
// b2 = |B|² in T², consistent with Nu: dw/db2 = ν/2 exactly. Past the last
// knot w = w_l + H_l (B - B_l) + (B - B_l)²/(2 μ0). The total stored energy
// is the integral of w over the iron; its derivative with respect to a
// displacement at constant flux gives the force (virtual work). A negative
// b2 counts as 0; NaN panics; +Inf gives +Inf.
func (c *Curve) Energy(b2 float64) float64 {
	t := &c.nut
	if !(b2 > 0) {
		if b2 != b2 {
			panic(errNaNArgument)
		}
		return 0
	}
	if b2 >= t.xmax {
		d := math.Sqrt(b2) - t.bl
		return t.w[len(t.w)-1] + t.hl*d + d*d/(2*Mu0)
	}
	j := t.cell(b2)
	return t.w[j] + cellEnergy(&t.c[j], b2-t.x[j])
}

// CoEnergy returns the co-energy density w' = ∫0^H B dH = B H - w in J/m³
// at b2 = |B|², with B H = ν b2. Its derivative with respect to a
// displacement at constant current gives the force.
func (c *Curve) CoEnergy(b2 float64) float64 {
	if !(b2 > 0) {
		if b2 != b2 {
			panic(errNaNArgument)
		}
		return 0
	}
	if math.IsInf(b2, 1) {
		return math.Inf(1)
	}
	nu, _ := c.Nu(b2)
	return nu*b2 - c.Energy(b2)
}

// Energy returns B²/(2 μ0 μr) in J/m³ at b2 = |B|². It panics like Nu.
func (l Linear) Energy(b2 float64) float64 {
	nu, _ := l.Nu(b2)
	return 0.5 * nu * math.Max(b2, 0)
}

// CoEnergy equals Energy for a linear material.
func (l Linear) CoEnergy(b2 float64) float64 { return l.Energy(b2) }
