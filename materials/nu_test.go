package materials

import (
	"math"
	"math/rand/v2"
	"testing"
)

// b2Samples returns b2 values from 1e-14 T² to 1e6 T² (log spaced) plus
// dense linear samples over [0, (1.5 B_last)²], where the table lives.
func b2Samples(c *Curve) []float64 {
	var out []float64
	for e := -14.0; e <= 6; e += 1.0 / 16 {
		out = append(out, math.Pow(10, e))
	}
	top := 2.25 * c.bl * c.bl
	for k := 1; k <= 4000; k++ {
		out = append(out, top*float64(k)/4000)
	}
	return out
}

// nuFD returns a finite-difference dν/db2 with step δ = 1e-6 b2 above
// b2 = 1e-3 and δ = 1e-9 below: central where [b2-2δ, b2+2δ] lies inside
// one cell of the ν table, else the second-order one-sided formula
// (∓3 f0 ± 4 f1 ∓ f2)/(2δ) taken away from the cell boundary, since
// d²ν/db2² jumps there and a central difference straddling it carries an
// O(δ·jump) error. Truncation is O(δ²) in all cases.
func nuFD(c *Curve, x float64) float64 {
	d := 1e-9
	if x > 1e-3 {
		d = 1e-6 * x
	}
	cell := func(v float64) int {
		if v >= c.nut.xmax {
			return -1
		}
		j := 0
		for j+1 < len(c.nut.x) && c.nut.x[j+1] <= v {
			j++
		}
		return j
	}
	j := cell(x)
	if x-2*d > 0 && cell(x-2*d) == j && cell(x+2*d) == j {
		fp, _ := c.Nu(x + d)
		fm, _ := c.Nu(x - d)
		return (fp - fm) / (2 * d)
	}
	if cell(x+2*d) != j { // boundary ahead: step backwards
		d = -d
	}
	f0, _ := c.Nu(x)
	f1, _ := c.Nu(x + d)
	f2, _ := c.Nu(x + 2*d)
	return (-3*f0 + 4*f1 - f2) / (2 * d)
}

// TestNuDerivative compares dν/db2 with finite differences, relative 1e-6
// of the derivative's natural scale |dν/db2| + 1e-3 ν/max(b2, 1e-3). The
// second term covers points where dν/db2 crosses zero (at the maximum
// permeability, d/dB of H/B vanishes) and the round-off of the one-sided
// difference near 0 (ε ν/δ ≈ 1e-16 · 2e3/1e-9 ≈ 2e-4 absolute against
// dν/db2 ≈ 1e8 there).
func TestNuDerivative(t *testing.T) {
	for name, c := range testCurves(t) {
		worst := 0.0
		for _, x := range b2Samples(c) {
			nu, g := c.Nu(x)
			fd := nuFD(c, x)
			scale := math.Abs(g) + 1e-3*nu/math.Max(x, 1e-3)
			if e := math.Abs(fd-g) / scale; e > worst {
				worst = e
			}
			if math.Abs(fd-g) > 1e-6*scale {
				t.Errorf("%s: b2 = %g: dν/db2 = %.10g, finite difference %.10g", name, x, g, fd)
				break
			}
		}
		t.Logf("%s: worst derivative error %.2g of scale", name, worst)
	}
}

// TestNuMatchesCurve checks ν(b2)·B = H(B) to 2e-9 relative (the table
// tolerance nuTol = 1e-9 is enforced at the quarter points of each cell;
// the factor 2 allows for the fourth derivative varying within a cell), inside the table and in the tail, where
// ν = 1/μ0 + (H_l - B_l/μ0)/B holds exactly; and ν(0) = 1/(initial slope).
func TestNuMatchesCurve(t *testing.T) {
	for name, c := range testCurves(t) {
		for _, x := range b2Samples(c) {
			bv := math.Sqrt(x)
			nu, _ := c.Nu(x)
			if h := c.H(bv); !near(nu*bv, h, 2e-9) {
				t.Errorf("%s: B = %g: ν B = %.12g, H(B) = %.12g", name, bv, nu*bv, h)
				break
			}
		}
		nu0, g0 := c.Nu(0)
		if want := 1 / c.Slope(0); !near(nu0, want, 1e-15) {
			t.Errorf("%s: ν(0) = %g, want 1/initial slope %g", name, nu0, want)
		}
		// The limit b2 -> 0 is continuous in value and derivative.
		nu1, g1 := c.Nu(1e-300)
		if nu1 != nu0 || g1 != g0 {
			t.Errorf("%s: Nu(1e-300) = (%g, %g), Nu(0) = (%g, %g)", name, nu1, g1, nu0, g0)
		}
		if nuNeg, gNeg := c.Nu(-1); nuNeg != nu0 || gNeg != g0 {
			t.Errorf("%s: Nu(-1) = (%g, %g), want Nu(0)", name, nuNeg, gNeg)
		}
	}
}

// TestNuMonotoneH checks H = ν B strictly increasing in B and ν positive
// and finite, from 0 to 1e3 T (the condition for a convex magnetic energy,
// which Newton's method on ν(b2) relies on), and ν -> 1/μ0 at huge B.
func TestNuMonotoneH(t *testing.T) {
	for name, c := range testCurves(t) {
		prev := -1.0
		top := 1.5 * c.bl
		const n = 200000
		for k := 0; k <= n; k++ {
			bv := top * float64(k) / n
			nu, g := c.Nu(bv * bv)
			hv := nu * bv
			if !(nu > 0) || math.IsInf(nu, 0) || math.IsNaN(g) || math.IsInf(g, 0) || !(hv > prev) {
				t.Fatalf("%s: B = %g: ν = %g, dν/db2 = %g, H = %.17g after %.17g", name, bv, nu, g, hv, prev)
			}
			prev = hv
		}
		for _, x := range []float64{1e6, 1e100, 1e300, math.MaxFloat64, math.Inf(1)} {
			nu, g := c.Nu(x)
			if !near(nu, 1/Mu0, 1e-2) || math.IsNaN(g) || math.IsInf(g, 0) {
				t.Errorf("%s: Nu(%g) = (%g, %g), want about (1/μ0, 0)", name, x, nu, g)
			}
		}
	}
}

func TestNuAllocs(t *testing.T) {
	c := testCurves(t)["low-carbon-steel"]
	x := 0.0
	if a := testing.AllocsPerRun(100, func() {
		for k := 0; k < 100; k++ {
			nu, _ := c.Nu(float64(k) * 0.05)
			x += nu
		}
	}); a != 0 {
		t.Errorf("Nu allocates %v times per 100 calls", a)
	}
}

// BenchmarkCurveNu calls Nu at random b2 in [0, (1.2 B_last)²] (mostly in
// the table, some in the tail), the solver's access pattern.
func BenchmarkCurveNu(b *testing.B) {
	m, _, _ := Lookup("low-carbon-steel")
	c := m.(*Curve)
	rng := rand.New(rand.NewPCG(1, 1))
	xs := make([]float64, 4096)
	for i := range xs {
		bv := 1.2 * c.bl * rng.Float64()
		xs[i] = bv * bv
	}
	b.ReportAllocs()
	b.ResetTimer()
	s := 0.0
	for i := 0; b.Loop(); i++ {
		nu, g := c.Nu(xs[i&4095])
		s += nu + g
	}
	if math.IsNaN(s) {
		b.Fatal("NaN")
	}
}

// BenchmarkCurveNuExact is the reference without the table: invert the
// cubic piece by Newton's method at every call.
func BenchmarkCurveNuExact(b *testing.B) {
	m, _, _ := Lookup("low-carbon-steel")
	c := m.(*Curve)
	rng := rand.New(rand.NewPCG(1, 1))
	xs := make([]float64, 4096)
	for i := range xs {
		xs[i] = c.bl * rng.Float64()
	}
	b.ReportAllocs()
	s := 0.0
	for i := 0; b.Loop(); i++ {
		nu, g := c.exactNu(xs[i&4095])
		s += nu + g
	}
	if math.IsNaN(s) {
		b.Fatal("NaN")
	}
}

func BenchmarkLinearNu(b *testing.B) {
	var m Material = Linear{MuR: 1000}
	s := 0.0
	for i := 0; b.Loop(); i++ {
		nu, _ := m.Nu(float64(i&1023) * 1e-3)
		s += nu
	}
	_ = s
}

// BenchmarkNewCurve measures construction, dominated by the adaptive ν table.
func BenchmarkNewCurve(b *testing.B) {
	d := curveTables[1]
	b.ReportAllocs()
	for b.Loop() {
		if _, err := curveFromJ(d.h, d.j); err != nil {
			b.Fatal(err)
		}
	}
}
