package materials

import "math"

// The reluctivity of a Curve as a function of b2 = B²:
//
//	ν(b2) = H(B)/B,   dν/db2 = (dH/dB - H/B) / (2 B²),   B = √b2.
//
// Nu is on the solver's hot path, so ν(b2) is tabulated once, at
// construction, as a C1 piecewise cubic Hermite function of b2 on
// [0, B_last²]. The cells are refined adaptively until the cubic matches
// the exact ν to nuTol = 1e-9 relative at three interior points; every
// table knot B_i² is a cell boundary, so the cubic never straddles a kink
// of d²B/dH². Nu returns the cubic and its own derivative, so the pair is
// exactly consistent (Newton's Jacobian is exact for the ν the residual
// uses). After the build every cell is sampled at nine points for ν > 0
// and d(νB)/dB > 0; a table failing that, or needing more than nuMaxCells
// cells or 40 bisections, is rejected (see irregular in curve.go).
//
// Near the origin the first piece is B = d0 H + c3 H³, whose inverse gives
// ν = 1/(d0 + c3 H²), smooth in b2 with dν/db2(0) = -c3/d0⁴.
//
// Past the last knot H = H_l + (B - B_l)/μ0, so ν = (H_l + (B - B_l)/μ0)/B
// = 1/μ0 + (H_l - B_l/μ0)/B and dν/db2 = -(H_l - B_l/μ0)/(2 B³), which join
// the table C1 at B_l.
//
// Look-up: a uniform bucket array over [0, B_last²] gives the range of cells
// that can hold b2, usually one; a binary search over that range finishes.

const (
	nuTol      = 1e-9    // relative value tolerance of the ν table
	nuMaxDepth = 40      // bisections per knot interval
	nuMinCells = 128     // cells at least over [0, B_last²] (caps cell width)
	nuMaxCells = 1 << 15 // the library curves need 1000-2000; wild random tables up to about 6000
)

type nuTable struct {
	x      []float64    // cell boundaries in b2, len = cells+1; x[0] = 0, x[cells] = xmax
	c      [][4]float64 // ν = c0 + t(c1 + t(c2 + t c3)), t = b2 - x[j]
	bucket []int32      // bucket[k]: the cell holding b2 = k/bscale; len nb+2
	bscale float64
	xmax   float64   // B_last²
	nu0    float64   // ν(0) = 1/initial slope
	g0     float64   // dν/db2 at 0
	tail   float64   // H_last - B_last/μ0 (negative for steels)
	hl, bl float64   // last knot
	w      []float64 // energy density at the cell boundaries, len cells+1 (see energy.go)
}

// Nu returns the reluctivity ν = H/B in m/H at b2 = |B|² in T², and its
// derivative dν/db2 in m/(H·T²). ν is positive, C1 in b2 and tends to 1/μ0
// as b2 grows; ν·B = H rises with B (checked at nine points per table cell
// when the curve is built). b2 = 0 gives the initial
// reluctivity and the finite limit of the derivative; a negative b2 counts
// as 0; a NaN panics. Nu does not allocate.
func (c *Curve) Nu(b2 float64) (nu, dnudb2 float64) {
	t := &c.nut
	if !(b2 > 0) {
		if b2 != b2 {
			panic(errNaNArgument)
		}
		return t.nu0, t.g0
	}
	if b2 >= t.xmax {
		if b2 > math.MaxFloat64 {
			return 1 / Mu0, 0
		}
		b := math.Sqrt(b2)
		r := 1 / b
		// ν = (H_l + (B - B_l)/μ0)/B: a sum of positive terms, where
		// 1/μ0 + tail/B would cancel when ν << 1/μ0.
		return (t.hl + (b-t.bl)*(1/Mu0)) * r, -0.5 * t.tail * r * (r * r)
	}
	// t.cell, written out: the call would not be inlined.
	k := int(b2 * t.bscale)
	j, hi := int(t.bucket[k]), int(t.bucket[k+1])
	if hi-j > 1 {
		j = t.search(b2, j, hi)
	} else {
		j += b2i(t.x[j+1] <= b2)
	}
	s := b2 - t.x[j]
	p := &t.c[j]
	return p[0] + s*(p[1]+s*(p[2]+s*p[3])), p[1] + s*(2*p[2]+3*s*p[3])
}

// cell returns the cell holding 0 < b2 < xmax.
func (t *nuTable) cell(b2 float64) int {
	k := int(b2 * t.bscale)
	j, hi := int(t.bucket[k]), int(t.bucket[k+1])
	if hi-j > 1 {
		return t.search(b2, j, hi)
	}
	// The common case, one or two candidate cells: a conditional move
	// rather than an unpredictable branch.
	return j + b2i(t.x[j+1] <= b2)
}

func b2i(v bool) int {
	if v {
		return 1
	}
	return 0
}

// search returns the last cell j in [lo, hi] with x[j] <= b2.
func (t *nuTable) search(b2 float64, j, hi int) int {
	for j < hi { // binary search within a crowded bucket
		m := int(uint(j+hi+1) >> 1)
		if t.x[m] <= b2 {
			j = m
		} else {
			hi = m - 1
		}
	}
	return j
}

// exactNu returns ν and dν/db2 from the interpolant itself (not the table),
// for 0 <= b <= B_last.
func (c *Curve) exactNu(b float64) (nu, g float64) {
	d0, c3 := c.d[0], c.c3[0]
	if b == 0 {
		return 1 / d0, -c3 / (d0 * d0 * d0 * d0)
	}
	hv, _ := c.evalH(b)
	if hv <= c.h[1] {
		// First piece, closed form without cancellation.
		q := c3 * hv * hv
		e := d0 + q
		return 1 / e, -c3 / ((d0 + 3*q) * e * e * e)
	}
	_, slope := c.evalB(hv)
	if hv >= c.hl {
		slope = Mu0
	}
	nu = hv / b
	return nu, (1/slope - nu) / (2 * b * b)
}

// build tabulates ν(b2); it needs the knots and pieces. It fails, with the
// 1-based knot nearest the trouble, only for tables so irregular that ν
// cannot be tabulated within nuMaxCells cells with positive ν and rising H.
func (c *Curve) build() (badKnot int, ok bool) {
	t := &c.nut
	n := len(c.h)
	t.xmax = c.bl * c.bl
	t.nu0, t.g0 = c.exactNu(0)
	t.tail = c.hl - c.bl/Mu0
	t.hl, t.bl = c.hl, c.bl
	t.x = t.x[:0]
	t.c = t.c[:0]
	maxW := t.xmax / nuMinCells
	xa := 0.0
	fa, ga := t.nu0, t.g0
	for i := 1; i < n; i++ {
		xb := c.b[i] * c.b[i]
		if i == n-1 {
			xb = t.xmax
		}
		fb, gb := c.exactNu(c.b[i])
		// Split the knot interval into equal parts no wider than maxW,
		// then refine each adaptively.
		parts := int(math.Ceil((xb - xa) / maxW))
		if parts < 1 {
			parts = 1
		}
		pa, pfa, pga := xa, fa, ga
		for k := 1; k <= parts; k++ {
			pb, pfb, pgb := xb, fb, gb
			if k < parts {
				pb = xa + (xb-xa)*float64(k)/float64(parts)
				pfb, pgb = c.exactNu(math.Sqrt(pb))
			}
			if !c.refine(pa, pfa, pga, pb, pfb, pgb, 0) {
				return i, false
			}
			pa, pfa, pga = pb, pfb, pgb
		}
		xa, fa, ga = xb, fb, gb
	}
	t.x = append(t.x, t.xmax)
	cells := len(t.c)
	if j := t.badShape(); j >= 0 {
		// Report the knot whose interval holds the bad cell.
		k := 1
		for k < n-1 && c.b[k]*c.b[k] <= t.x[j] {
			k++
		}
		return k, false
	}
	t.setEnergy()
	nb := 4 * cells
	t.bscale = float64(nb) / t.xmax
	t.bucket = make([]int32, nb+2)
	j := 0
	for k := range t.bucket {
		xk := float64(k) / t.bscale
		for j < cells-1 && t.x[j+1] <= xk {
			j++
		}
		t.bucket[k] = int32(j)
	}
	return 0, true
}

// badShape returns the first cell where ν is not positive or H = ν B does
// not rise (d(νB)/dB = ν + 2 b2 dν/db2 <= 0) at nine sample points, or -1.
func (t *nuTable) badShape() int {
	for j := range t.c {
		w := t.x[j+1] - t.x[j]
		for q := 0; q <= 8; q++ {
			s := w * float64(q) / 8
			f, g := evalCubic(&t.c[j], s)
			if !(f > 0) || !(f+2*(t.x[j]+s)*g > 0) {
				return j
			}
		}
	}
	return -1
}

// hermite returns the cubic coefficients on [xa, xb] in t = b2 - xa.
func hermite(xa, fa, ga, xb, fb, gb float64) [4]float64 {
	w := xb - xa
	s := (fb - fa) / w
	return [4]float64{fa, ga, (3*s - 2*ga - gb) / w, (ga + gb - 2*s) / (w * w)}
}

func evalCubic(p *[4]float64, s float64) (v, dv float64) {
	return p[0] + s*(p[1]+s*(p[2]+s*p[3])), p[1] + s*(2*p[2]+3*s*p[3])
}

// refine appends the cells of [xa, xb], bisecting until the cubic matches
// exactNu at the quarter points: ν to nuTol relative and dH/dB = ν + 2 b2
// dν/db2 to 1e-6 relative, each plus the round-off floor of the exact
// evaluation (ν is ill-conditioned where dH/dB >> H/B) and of the cubic's
// divided difference. It returns false when the cell budget is spent or a
// cell cannot be resolved (depth nuMaxDepth or the resolution of b2): ν then
// has a feature too sharp to tabulate and the table is rejected.
func (c *Curve) refine(xa, fa, ga, xb, fb, gb float64, depth int) bool {
	const eps = 0x1p-52
	t := &c.nut
	if len(t.c) >= nuMaxCells {
		return false
	}
	p := hermite(xa, fa, ga, xb, fb, gb)
	w := xb - xa
	if depth >= nuMaxDepth {
		return false // a feature finer than 2^-40 of a knot interval
	}
	var fm, gm float64
	accept := true
	{
		for _, q := range [3]int{2, 1, 3} {
			x := xa + w*float64(q)/4
			f, g := c.exactNu(math.Sqrt(x))
			if q == 2 {
				fm, gm = f, g
			}
			v, dv := evalCubic(&p, x-xa)
			dh := f + 2*x*math.Abs(g) // scale of dH/dB
			noise := 64 * eps * dh    // round-off of exactNu
			if math.Abs(v-f) > nuTol*f+noise || 2*x*math.Abs(dv-g) > 1e-6*dh+16*x*noise/w {
				accept = false
				break
			}
		}
	}
	xm := xa + w/2
	if !accept && xa > 0 && xb > 4*xa {
		// Geometric bisection: a knot interval may span many decades of b2,
		// and ν varies on the scale of xa near its left end.
		xm = math.Sqrt(xa) * math.Sqrt(xb)
		fm, gm = c.exactNu(math.Sqrt(xm))
	}
	if accept {
		t.x = append(t.x, xa)
		t.c = append(t.c, p)
		return true
	}
	if !(xm > xa && xm < xb) {
		return false // at the resolution of b2
	}
	return c.refine(xa, fa, ga, xm, fm, gm, depth+1) && c.refine(xm, fm, gm, xb, fb, gb, depth+1)
}
