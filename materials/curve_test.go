package materials

import (
	"errors"
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/stat"
)

// testCurves returns every built-in curve, some stacked versions and a
// short table that does not start at the origin.
func testCurves(t testing.TB) map[string]*Curve {
	t.Helper()
	out := map[string]*Curve{}
	for _, e := range Library() {
		if e.Kind != KindNonlinear {
			continue
		}
		m, _, _ := Lookup(e.Name)
		c := m.(*Curve)
		out[e.Name] = c
		s, err := c.Stacked(0.95)
		if err != nil {
			t.Fatalf("%s: Stacked(0.95): %v", e.Name, err)
		}
		out[e.Name+"@0.95"] = s
	}
	// Three points without the origin: the smallest valid table.
	c, err := NewCurve([]float64{100, 1e4, 1e5}, []float64{1, 1.8, 1.95})
	if err != nil {
		t.Fatalf("short table: %v", err)
	}
	out["short"] = c
	return out
}

// TestCurveKnots checks that the interpolant passes through every table
// point exactly, forwards (B at H_i) and backwards (H at B_i): a Hermite
// piece takes its end values exactly (de Boor, "A Practical Guide to
// Splines", 1978, ch. IV).
func TestCurveKnots(t *testing.T) {
	for name, c := range testCurves(t) {
		h, b := c.Table()
		for i := range h {
			if got := c.B(h[i]); got != b[i] {
				t.Errorf("%s: B(%g) = %.17g, table %.17g", name, h[i], got, b[i])
			}
			if got := c.H(b[i]); got != h[i] {
				t.Errorf("%s: H(%g) = %.17g, table %.17g", name, b[i], got, h[i])
			}
		}
		if err := c.Check(); err != nil {
			t.Errorf("%s: %v", name, err)
		}
	}
}

// TestCurveMonotone samples every piece densely: B and dB/dH must rise and
// stay positive. Steffen's slopes keep α = d_i/s_i and β = d_{i+1}/s_i in
// [0, 2] (M. Steffen, Astron. Astrophys. 239, 1990), the first piece in
// [1/2, 3/2] × [0, 2] and the last in [0, 2] × [0, 3] since its end slope is
// μ0 <= 3 s; all lie in the α, β <= 3 box of F. N. Fritsch and R. E.
// Carlson, "Monotone piecewise cubic interpolation", SIAM J. Numer. Anal.
// 17, 1980 (their sufficient condition α, β <= 3), where the cubic is
// monotone.
func TestCurveMonotone(t *testing.T) {
	const per = 400
	for name, c := range testCurves(t) {
		h, _ := c.Table()
		prevB := -1.0
		for i := 0; i+1 < len(h); i++ {
			for k := 0; k < per; k++ {
				x := h[i] + (h[i+1]-h[i])*float64(k)/per
				bv, s := c.B(x), c.Slope(x)
				if !(bv > prevB) || !(s > 0) {
					t.Fatalf("%s: piece %d at H = %g: B = %.17g after %.17g, slope %g", name, i, x, bv, prevB, s)
				}
				prevB = bv
			}
		}
	}
}

// TestCurveTail checks the slope μ0 past the last point and C1 continuity
// there. A saturated material has B = μ0 (H + M_s), so dB/dH = μ0 (e.g.
// D. Jiles, "Introduction to Magnetism and Magnetic Materials", 2nd ed.,
// 1998, ch. 1: B = μ0 (H + M)).
func TestCurveTail(t *testing.T) {
	for name, c := range testCurves(t) {
		h, b := c.Table()
		hl, bl := h[len(h)-1], b[len(b)-1]
		// Far tail: exact straight line; forward difference over a decade.
		if got := (c.B(10*hl) - c.B(hl)) / (9 * hl); !near(got, Mu0, 1e-12) {
			t.Errorf("%s: tail slope %.15g, want μ0 = %.15g", name, got, Mu0)
		}
		// At the last point: one-sided differences with δ = 1e-6 H_l. The left
		// one carries the truncation error δ·B''/2 of the last piece, of order
		// δ/w ≈ 1e-5 relative, so 1e-4.
		const rel = 1e-6
		dl := (c.B(hl) - c.B(hl*(1-rel))) / (hl * rel)
		dr := (c.B(hl*(1+rel)) - c.B(hl)) / (hl * rel)
		if !near(dl, Mu0, 1e-4) || !near(dr, Mu0, 1e-6) {
			t.Errorf("%s: slope at last point: left %.8g, right %.8g, want μ0 = %.8g", name, dl, dr, Mu0)
		}
		if got := c.B(hl+1e5) - bl; !near(got, Mu0*1e5, 1e-9) {
			t.Errorf("%s: B(H_l + 1e5) - B_l = %g, want %g", name, got, Mu0*1e5)
		}
	}
}

// TestCurveInverse checks H(B(H)) = H to 1e-10 relative over 12 decades of
// H, and oddness B(-H) = -B(H) (B-H curves of soft materials are odd:
// reversing the current reverses the field).
func TestCurveInverse(t *testing.T) {
	for name, c := range testCurves(t) {
		for e := -4.0; e <= 8; e += 1.0 / 64 {
			hv := math.Pow(10, e)
			bv := c.B(hv)
			if got := c.H(bv); !near(got, hv, 1e-10) {
				t.Fatalf("%s: H(B(%g)) = %.17g", name, hv, got)
			}
			if c.B(-hv) != -bv || c.H(-bv) != -c.H(bv) {
				t.Fatalf("%s: not odd at H = %g", name, hv)
			}
		}
		if c.H(0) != 0 || c.B(0) != 0 {
			t.Errorf("%s: H(0) = %g, B(0) = %g", name, c.H(0), c.B(0))
		}
	}
}

// TestCurveMuR checks μr = B/(μ0 H) against the definition, and its limits:
// the initial permeability at B = 0 and μr -> 1 far in saturation.
func TestCurveMuR(t *testing.T) {
	for name, c := range testCurves(t) {
		for _, hv := range []float64{1, 50, 300, 3000, 3e4, 3e5} {
			bv := c.B(hv)
			if got, want := c.MuR(bv), bv/(Mu0*hv); !near(got, want, 1e-10) {
				t.Errorf("%s: MuR(%g) = %g, want %g", name, bv, got, want)
			}
		}
		if got, want := c.MuR(0), c.Slope(0)/Mu0; got != want {
			t.Errorf("%s: MuR(0) = %g, initial slope/μ0 = %g", name, got, want)
		}
		if got := c.MuR(1e4); math.Abs(got-1) > 1e-3 {
			t.Errorf("%s: MuR(1e4 T) = %g, want about 1", name, got)
		}
	}
}

// TestStacked checks the lamination mixing rule B_eff = k B + (1-k) μ0 H
// (common practice: equal tangential H in steel and insulation).
func TestStacked(t *testing.T) {
	m, _, _ := Lookup("silicon-steel-no")
	c := m.(*Curve)
	same, err := c.Stacked(1)
	if err != nil || same != c {
		t.Fatalf("Stacked(1) = %p, %v; want the curve itself", same, err)
	}
	for _, k := range []float64{0.97, 0.5, 1e-3} {
		s, err := c.Stacked(k)
		if err != nil {
			t.Fatalf("Stacked(%g): %v", k, err)
		}
		if err := s.Check(); err != nil {
			t.Fatalf("Stacked(%g): %v", k, err)
		}
		for e := -2.0; e <= 7; e += 0.125 {
			hv := math.Pow(10, e)
			want := k*c.B(hv) + (1-k)*Mu0*hv
			if got := s.B(hv); !near(got, want, 1e-13) {
				t.Errorf("Stacked(%g): B(%g) = %.17g, want %.17g", k, hv, got, want)
			}
		}
	}
	// k -> 0 tends to air: ν -> 1/μ0 everywhere. With k = 1e-6 the steel
	// adds at most k μr_max ≈ 1e-6 · 1e4 = 1e-2 relative to μ0.
	s, err := c.Stacked(1e-6)
	if err != nil {
		t.Fatal(err)
	}
	for _, bv := range []float64{0, 1e-3, 0.1, 1, 2, 5} {
		nu, _ := s.Nu(bv * bv)
		if !near(nu, 1/Mu0, 2e-2) {
			t.Errorf("Stacked(1e-6): ν(%g T) = %g, want about 1/μ0 = %g", bv, nu, 1/Mu0)
		}
	}
	// The smallest factors still give valid curves, and air in the limit.
	for _, k := range []float64{1e-300, 5e-324} {
		s, err := c.Stacked(k)
		if err != nil {
			t.Fatalf("Stacked(%g): %v", k, err)
		}
		if err := s.Check(); err != nil {
			t.Fatalf("Stacked(%g): %v", k, err)
		}
		if nu, _ := s.Nu(1); !near(nu, 1/Mu0, 1e-12) {
			t.Errorf("Stacked(%g): ν(1 T) = %g, want 1/μ0", k, nu)
		}
	}
	for _, k := range []float64{0, -0.5, 1.0000001, 2, math.NaN(), math.Inf(1)} {
		if _, err := c.Stacked(k); !errors.Is(err, ErrStacking) {
			t.Errorf("Stacked(%g): error %v, want ErrStacking", k, err)
		}
	}
}

// TestNewCurveErrors gives each kind of bad table its own message naming
// the row.
func TestNewCurveErrors(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	cases := []struct {
		name string
		h, b []float64
		err  error
		msg  string // substring of the message
	}{
		{"empty", nil, nil, ErrEmpty, "table is empty"},
		{"two points", []float64{0, 100}, []float64{0, 1}, ErrTooFewPoints, "has 2 points"},
		{"origin only", []float64{0}, []float64{0}, ErrTooFewPoints, "has 1 point counting the origin"},
		{"H not increasing", []float64{0, 100, 100, 300}, []float64{0, 1, 1.2, 1.5}, ErrHNotIncreasing, "row 3 (H = 100 A/m, B = 1.2 T): H is not above"},
		{"B not increasing", []float64{0, 100, 200, 300}, []float64{0, 1, 0.9, 1.5}, ErrBNotIncreasing, "row 3 (H = 200 A/m, B = 0.9 T): B is not above"},
		{"negative H", []float64{0, -100, 200}, []float64{0, 1, 1.5}, ErrNegative, "row 2"},
		{"negative B", []float64{0, 100, 200}, []float64{0, -1, 1.5}, ErrNegative, "first quadrant"},
		{"NaN H", []float64{0, nan, 200}, []float64{0, 1, 1.5}, ErrNotFinite, "row 2 (H = NaN A/m, B = 1 T): H is not a finite number"},
		{"Inf B", []float64{0, 100, 200}, []float64{0, 1, inf}, ErrNotFinite, "row 3"},
		{"remanence", []float64{0, 100, 200}, []float64{0.5, 1, 1.5}, ErrOrigin, "Magnet"},
		{"B zero at H > 0", []float64{50, 100, 200}, []float64{0, 1, 1.5}, ErrBNotIncreasing, "row 1"},
		{"too flat", []float64{0, 100, 1e6}, []float64{0, 1, 1.1}, ErrSlope, "row 3"},
		{"too steep", []float64{0, 1e-3, 200}, []float64{0, 1, 1.5}, ErrSlope, "check the units"},
		{"B in gauss", []float64{0, 100, 200}, []float64{0, 10000, 15000}, ErrOutOfRange, "not mT or gauss"},
		{"H huge", []float64{0, 100, 2e10}, []float64{0, 1, 1.5}, ErrOutOfRange, "row 3"},
	}
	seen := map[string]string{}
	for _, tc := range cases {
		c, err := NewCurve(tc.h, tc.b)
		if c != nil || !errors.Is(err, tc.err) {
			t.Errorf("%s: got %v, %v; want %v", tc.name, c, err, tc.err)
			continue
		}
		msg := err.Error()
		if !strings.Contains(msg, tc.msg) {
			t.Errorf("%s: message %q lacks %q", tc.name, msg, tc.msg)
		}
		if other, dup := seen[msg]; dup {
			t.Errorf("%s: same message as %s: %q", tc.name, other, msg)
		}
		seen[msg] = tc.name
	}
}

// TestNewCurveInputsUntouched: NewCurve copies its inputs.
func TestNewCurveInputsUntouched(t *testing.T) {
	h := []float64{100, 1e3, 1e5}
	b := []float64{1, 1.5, 2}
	c, err := NewCurve(h, b)
	if err != nil {
		t.Fatal(err)
	}
	if h[0] != 100 || b[0] != 1 || len(h) != 3 || c.Len() != 4 {
		t.Errorf("inputs changed or origin missing: %v %v, Len %d", h, b, c.Len())
	}
}

func TestNewCurvePanics(t *testing.T) {
	defer func() {
		if r := recover(); r != errLengthMismatch {
			t.Errorf("recover() = %v, want %q", r, errLengthMismatch)
		}
	}()
	NewCurve([]float64{0, 1, 2}, []float64{0, 1})
}

func TestNaNArgumentPanics(t *testing.T) {
	c := testCurves(t)["short"]
	for name, f := range map[string]func(){
		"B":     func() { c.B(math.NaN()) },
		"H":     func() { c.H(math.NaN()) },
		"MuR":   func() { c.MuR(math.NaN()) },
		"Slope": func() { c.Slope(math.NaN()) },
		"Nu":    func() { c.Nu(math.NaN()) },
	} {
		func() {
			defer func() {
				if r := recover(); r != errNaNArgument {
					t.Errorf("%s(NaN): recover() = %v", name, r)
				}
			}()
			f()
		}()
	}
}

// TestCurveOrder samples the Frohlich-Kennelly saturation law
// B = μ0 H + Js H/(a + H) (common practice as a smooth model of a soft
// iron's normal magnetisation curve) on uniform tables of 50, 100, 200 and
// 400 intervals over [0, 1e4] A/m and measures the largest interpolation
// error on [2000, 8000] A/m, away from the two end pieces whose slopes are
// set by our end conditions. Steffen's slope is the derivative of the
// parabola through three points, O(h²) accurate where the limiter is idle,
// so the cubic Hermite error is O(h³) (Steffen 1990; de Boor 1978,
// ch. IV). The least-squares log-log slope must be 3 ± 0.1.
func TestCurveOrder(t *testing.T) {
	const js, a, hmax = 2.0, 200.0, 1e4
	exact := func(h float64) float64 { return Mu0*h + js*h/(a+h) }
	var lx, ly []float64
	for _, n := range []int{50, 100, 200, 400} {
		hs := make([]float64, n+1)
		bs := make([]float64, n+1)
		for i := range hs {
			hs[i] = hmax * float64(i) / float64(n)
			bs[i] = exact(hs[i])
		}
		c, err := NewCurve(hs, bs)
		if err != nil {
			t.Fatalf("n = %d: %v", n, err)
		}
		worst := 0.0
		for k := 0; k <= 6000; k++ {
			h := 2000 + float64(k)
			worst = math.Max(worst, math.Abs(c.B(h)-exact(h)))
		}
		lx = append(lx, math.Log(hmax/float64(n)))
		ly = append(ly, math.Log(worst))
		t.Logf("n = %3d: max |B - B_exact| = %.3g T", n, worst)
	}
	p := lsqSlope(lx, ly)
	if math.Abs(p-3) > 0.1 {
		t.Errorf("convergence order %.3f, want 3 ± 0.1", p)
	}
}

// lsqSlope returns the least-squares slope of y against x.
func lsqSlope(x, y []float64) float64 {
	_, b := stat.LinearRegression(x, y, nil, false)
	return b
}

// The stacked curve is the effective medium of a laminated stack with the
// flux along the laminations: H is the same in steel and insulation, so
// B_eff = k B_steel + (1 - k) μ0 H (issue 18, item 5; common practice, the
// lamination mixing rule) and, integrating at fixed H, the co-energy
// densities mix the same way: w'_eff(H) = k w'_steel(H) + (1 - k) μ0 H²/2.
// The co-energy comes from the reluctivity table (energy.go), a different
// path from Stacked's Hermite mixture, so this checks the two agree;
// tolerance 1e-6 relative, the accuracy of the tabulated ν (about 1e-9)
// integrated over a table, with margin.
func TestStackedEffectiveMedium(t *testing.T) {
	m, _, _ := Lookup("silicon-steel-no")
	c := m.(*Curve)
	for _, k := range []float64{0.95, 0.7} {
		s, err := c.Stacked(k)
		if err != nil {
			t.Fatal(err)
		}
		for _, h := range []float64{30, 100, 300, 1e3, 5e3, 3e4, 2e5} {
			bs, be := c.B(h), s.B(h)
			if want := k*bs + (1-k)*Mu0*h; math.Abs(be-want) > 1e-12*want {
				t.Errorf("k %g, H %g: B_eff %.15g, want %.15g", k, h, be, want)
			}
			want := k*c.CoEnergy(bs*bs) + (1-k)*Mu0*h*h/2
			if got := s.CoEnergy(be * be); math.Abs(got-want) > 1e-6*want {
				t.Errorf("k %g, H %g: co-energy %.9g J/m³, mixture %.9g", k, h, got, want)
			}
		}
	}
}
