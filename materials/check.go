package materials

import (
	"fmt"
	"math"
)

// Check verifies the invariants of c and returns a *CheckError for the first
// one broken: knots start at the origin and strictly increase; knot slopes
// are positive, the last is μ0 and the first piece has no curvature; each
// piece meets the next knot (C0) with the next slope (C1) and has a positive
// slope at its end points and at its interior stationary point of slope;
// the ν table has ordered cells, positive ν, is C1 across cell boundaries,
// gives increasing H = ν B inside every cell and matches the exact ν at cell
// midpoints; the energy table starts at 0 and rises. Check costs O(cells) exact evaluations; tests and fuzz targets
// call it, the solver does not need to.
func (c *Curve) Check() error {
	n := len(c.h)
	fail := func(inv, format string, args ...any) error {
		return &CheckError{Invariant: inv, Detail: fmt.Sprintf(format, args...)}
	}
	if n < 3 || len(c.b) != n || len(c.d) != n || len(c.c2) != n-1 || len(c.c3) != n-1 {
		return fail("knots", "inconsistent lengths")
	}
	if c.h[0] != 0 || c.b[0] != 0 {
		return fail("knots", "first knot (%g, %g) is not the origin", c.h[0], c.b[0])
	}
	for i := 1; i < n; i++ {
		if !(c.h[i] > c.h[i-1] && c.b[i] > c.b[i-1]) {
			return fail("knots", "knot %d (%g, %g) does not rise above knot %d", i, c.h[i], c.b[i], i-1)
		}
	}
	if c.d[n-1] != Mu0 {
		return fail("slope", "last slope %g is not μ0", c.d[n-1])
	}
	if c.c2[0] != 0 {
		return fail("slope", "first piece has curvature %g at the origin", c.c2[0])
	}
	for i := 0; i < n-1; i++ {
		if !(c.d[i] > 0) {
			return fail("slope", "slope %g at knot %d is not positive", c.d[i], i)
		}
		w := c.h[i+1] - c.h[i]
		d, c2, c3 := c.d[i], c.c2[i], c.c3[i]
		bend := c.b[i] + w*(d+w*(c2+w*c3))
		if !near(bend, c.b[i+1], 1e-12) {
			return fail("C0", "piece %d ends at B = %.17g, knot is %.17g", i, bend, c.b[i+1])
		}
		dend := d + w*(2*c2+3*w*c3)
		s := (c.b[i+1] - c.b[i]) / w
		if math.Abs(dend-c.d[i+1]) > 1e-11*(d+s+c.d[i+1]) { // round-off of the coefficients
			return fail("C1", "piece %d ends with slope %.17g, knot slope is %.17g", i, dend, c.d[i+1])
		}
		// The slope is a quadratic in t; its extremum at t = -c2/(3 c3).
		if c3 != 0 {
			if t := -c2 / (3 * c3); t > 0 && t < w {
				if s := d + t*(2*c2+3*t*c3); !(s > 0) {
					return fail("monotone", "piece %d has slope %g at H = %g", i, s, c.h[i]+t)
				}
			}
		}
	}
	return c.checkNuTable()
}

func (c *Curve) checkNuTable() error {
	const eps = 0x1p-52
	t := &c.nut
	fail := func(inv, format string, args ...any) error {
		return &CheckError{Invariant: inv, Detail: fmt.Sprintf(format, args...)}
	}
	cells := len(t.c)
	if cells < 1 || len(t.x) != cells+1 || t.x[0] != 0 || t.x[cells] != t.xmax || t.xmax != c.bl*c.bl {
		return fail("nu-table", "bad cell layout")
	}
	if len(t.bucket) != int(t.xmax*t.bscale+0.5)+2 {
		return fail("nu-table", "bucket array has %d entries for scale %g", len(t.bucket), t.bscale)
	}
	for k, j := range t.bucket {
		if xk := float64(k) / t.bscale; xk < t.xmax && (t.x[j] > xk || t.x[j+1] <= xk) {
			return fail("nu-table", "bucket %d points at cell %d [%g, %g) not holding %g", k, j, t.x[j], t.x[j+1], xk)
		}
	}
	if len(t.w) != cells+1 || t.w[0] != 0 {
		return fail("energy", "bad energy table layout")
	}
	for j := 0; j < cells; j++ {
		if !(t.w[j+1] > t.w[j]) || math.IsInf(t.w[j+1], 0) {
			return fail("energy", "energy %g at cell %d does not rise from %g", t.w[j+1], j+1, t.w[j])
		}
	}
	for j := 0; j < cells; j++ {
		xa, xb := t.x[j], t.x[j+1]
		if !(xb > xa) {
			return fail("nu-table", "cell %d is empty: [%g, %g]", j, xa, xb)
		}
		w := xb - xa
		p := &t.c[j]
		fb, gb := evalCubic(p, w)
		var wantF, wantG float64
		if j+1 < cells {
			wantF, wantG = t.c[j+1][0], t.c[j+1][1]
		} else {
			wantF, wantG = c.Nu(xb) // the tail formula
		}
		// Round-off of the cubic summed at t = w: a few ε times its terms.
		mag := math.Abs(p[0]) + w*(math.Abs(p[1])+w*(math.Abs(p[2])+w*math.Abs(p[3])))
		magd := math.Abs(p[1]) + w*(2*math.Abs(p[2])+3*w*math.Abs(p[3]))
		if math.Abs(fb-wantF) > 1e-10*wantF+64*eps*mag ||
			math.Abs(gb-wantG) > 1e-6*(math.Abs(wantG)+wantF/xb)+64*eps*magd {
			return fail("nu-table", "cell %d ends at (%g, %g), next starts at (%g, %g)", j, fb, gb, wantF, wantG)
		}
		for q := 0; q <= 4; q++ {
			s := w * float64(q) / 4
			f, g := evalCubic(p, s)
			if !(f > 0) {
				return fail("nu-table", "ν = %g at b2 = %g", f, xa+s)
			}
			// d(ν B)/dB = ν + 2 b2 dν/db2 must be positive.
			if dh := f + 2*(xa+s)*g; !(dh > 0) {
				return fail("monotone", "d(νB)/dB = %g at b2 = %g", dh, xa+s)
			}
		}
		fm, _ := evalCubic(p, w/2)
		ef, eg := c.exactNu(math.Sqrt(xa + w/2))
		// The build's acceptance test (see refine), with a factor 10 margin.
		noise := 64 * eps * (ef + 2*(xa+w/2)*math.Abs(eg))
		if math.Abs(fm-ef) > 10*(nuTol*ef+noise) {
			return fail("nu-table", "cell %d midpoint ν = %.12g, exact %.12g", j, fm, ef)
		}
	}
	return nil
}

// near reports |a-b| <= tol·max(|a|, |b|).
func near(a, b, tol float64) bool {
	return math.Abs(a-b) <= tol*math.Max(math.Abs(a), math.Abs(b))
}
