package materials

import (
	"math"
	"regexp"
	"strings"
	"testing"
)

// TestLibrary checks every built-in entry: unique generic names, a source,
// the right Go type for its Kind, and for curves validation, Check and
// saturation: the table's last slope lies between μ0 and 1.3 μ0, so the
// curve is nearly saturated where the μ0 tail takes over (B = μ0 (H + M_s)
// past saturation; Jiles 1998, ch. 1).
func TestLibrary(t *testing.T) {
	name := regexp.MustCompile(`^[a-z][a-z0-9]*(-[a-z0-9]+)*$`)
	seen := map[string]bool{}
	lib := Library()
	if len(lib) < 8 {
		t.Fatalf("library has %d entries, want at least 8", len(lib))
	}
	for _, e := range lib {
		if !name.MatchString(e.Name) || seen[e.Name] {
			t.Errorf("%q: bad or repeated name", e.Name)
		}
		seen[e.Name] = true
		if e.Source == "" || e.Description == "" {
			t.Errorf("%s: missing source or description", e.Name)
		}
		m, got, ok := Lookup(e.Name)
		if !ok || got != e || m == nil {
			t.Errorf("%s: Lookup = %v, %+v, %v", e.Name, m, got, ok)
			continue
		}
		switch e.Kind {
		case KindNonlinear:
			c, ok := m.(*Curve)
			if !ok {
				t.Errorf("%s: %T, want *Curve", e.Name, m)
				continue
			}
			if c.Name() != e.Name {
				t.Errorf("%s: curve named %q", e.Name, c.Name())
			}
			if err := c.Check(); err != nil {
				t.Errorf("%s: %v", e.Name, err)
			}
			h, b := c.Table()
			n := len(h)
			if s := (b[n-1] - b[n-2]) / (h[n-1] - h[n-2]) / Mu0; s < 1 || s > 1.3 {
				t.Errorf("%s: last table slope %.3f μ0, want within [1, 1.3] μ0", e.Name, s)
			}
			if h[n-1] < 1e5 {
				t.Errorf("%s: table ends at %g A/m, before saturation", e.Name, h[n-1])
			}
		case KindLinear:
			if l, ok := m.(Linear); !ok || l.Check() != nil {
				t.Errorf("%s: %#v, want a valid Linear", e.Name, m)
			}
		case KindMagnet:
			if g, ok := m.(Magnet); !ok || g.Check() != nil || g.Remanence <= 0 {
				t.Errorf("%s: %#v, want a valid Magnet", e.Name, m)
			}
		default:
			t.Errorf("%s: kind %v", e.Name, e.Kind)
		}
	}
	for _, want := range []string{"pure-iron", "low-carbon-steel", "silicon-steel-no", "cobalt-iron", "cast-iron", "air", "copper", "linear-1000"} {
		if !seen[want] {
			t.Errorf("library lacks %s", want)
		}
	}
	if _, _, ok := Lookup("no-such-steel"); ok {
		t.Error("Lookup of an unknown name succeeded")
	}
	// Shared curves: the same pointer each time (built once).
	a, _, _ := Lookup("pure-iron")
	b, _, _ := Lookup("pure-iron")
	if a != b {
		t.Error("Lookup built pure-iron twice")
	}
}

// TestLibraryDescriptions keeps the figures quoted in the descriptions
// true of the tables: the largest secant μr B/(μ0 H) over the knots, within
// 10 %, and the polarisation J = B - μ0 H at the last knot within 0.02 T.
func TestLibraryDescriptions(t *testing.T) {
	cases := []struct {
		name      string
		murMax    float64 // 0: not quoted
		jSat      float64
		jSatSlack float64
	}{
		{"pure-iron", 9000, 2.16, 0.02},
		{"low-carbon-steel", 3000, 2.11, 0.02},
		{"cobalt-iron", 0, 2.35, 0.02},
		{"cast-iron", 300, 1.5, 0.03},
		{"team13-steel", 2300, 2.16, 0.02},
	}
	for _, tc := range cases {
		m, _, _ := Lookup(tc.name)
		h, b := m.(*Curve).Table()
		best := 0.0
		for i := 1; i < len(h); i++ {
			best = math.Max(best, b[i]/(Mu0*h[i]))
		}
		if tc.murMax > 0 && math.Abs(best-tc.murMax) > 0.1*tc.murMax {
			t.Errorf("%s: largest secant μr %.0f, description says about %.0f", tc.name, best, tc.murMax)
		}
		n := len(h)
		if j := b[n-1] - Mu0*h[n-1]; math.Abs(j-tc.jSat) > tc.jSatSlack {
			t.Errorf("%s: J at the last knot %.3f T, description says about %.2f T", tc.name, j, tc.jSat)
		}
	}
}

// TestConcurrentUse: curves and the library are safe for concurrent use
// (run with -race).
func TestConcurrentUse(t *testing.T) {
	done := make(chan float64)
	for g := 0; g < 4; g++ {
		go func() {
			s := 0.0
			for k := 0; k < 200; k++ {
				m, _, _ := Lookup("cobalt-iron")
				nu, _ := m.Nu(float64(k) * 0.03)
				s += nu + m.(*Curve).H(1.5) + m.(*Curve).Energy(2)
			}
			done <- s
		}()
	}
	first := <-done
	for g := 1; g < 4; g++ {
		if s := <-done; s != first {
			t.Errorf("goroutine results differ: %g vs %g", s, first)
		}
	}
}

// TestPublishedTables: each published curve passes through every point of
// its source's table (TEAM Workshop Problem 13, B-H table of the steel
// plates, 1990, as transcribed in library_data.go), and its rows past the
// table follow the source's Eq. (1) and B = μ0 H + M_s. Tolerance 1e-12 T:
// the interpolant is exact at its knots up to rounding.
func TestPublishedTables(t *testing.T) {
	for _, td := range curveTables {
		if td.entry.FromMemory() {
			continue
		}
		m, e, _ := Lookup(td.entry.Name)
		c := m.(*Curve)
		if td.published < 10 || td.b == nil {
			t.Fatalf("%s: published table of %d rows", e.Name, td.published)
		}
		for i := 0; i < td.published; i++ {
			if got := c.B(td.h[i]); math.Abs(got-td.b[i]) > 1e-12 {
				t.Errorf("%s: B(%g A/m) = %.15g T, table gives %g T", e.Name, td.h[i], got, td.b[i])
			}
		}
		if !strings.Contains(e.Source, "Table") && !strings.Contains(e.Source, "table") {
			t.Errorf("%s: source %q names no table", e.Name, e.Source)
		}
		if ce, ok := CurveEntry(c); !ok || ce != e {
			t.Errorf("%s: CurveEntry = %+v, %v", e.Name, ce, ok)
		}
	}
	// TEAM 13, Eq. (1): B = μ0 H + a H² + b H + c for 1.8 T < B < 2.22 T;
	// B = μ0 H + 2.16 T beyond. Checked midway between the rows computed
	// from it: 1e-3 T bounds the interpolation error |a| Δ²/4 of a
	// quadratic over rows Δ = 4000 A/m apart (1e-3 T with a = -2.381e-10),
	// about 0.05 % of B.
	m, _, _ := Lookup("team13-steel")
	c := m.(*Curve)
	for _, h := range []float64{12000, 14250, 23000, 35000, 43000} {
		want := Mu0*h + team13A*h*h + team13B*h + team13C
		if got := c.B(h); math.Abs(got-want) > 1e-3 {
			t.Errorf("team13-steel: B(%g) = %.4f T, Eq. (1) gives %.4f T", h, got, want)
		}
	}
	for _, h := range []float64{1e5, 3e5, 1e6} {
		want := Mu0*h + team13Ms
		if got := c.B(h); math.Abs(got-want) > 1e-9 {
			t.Errorf("team13-steel: B(%g) = %.6f T, B = μ0 H + M_s gives %.6f T", h, got, want)
		}
	}
	// A user's curve is not a library entry, even under a library name.
	u, err := NewCurve([]float64{100, 1000}, []float64{1, 1.5})
	if err != nil {
		t.Fatal(err)
	}
	u.name = "pure-iron"
	if _, ok := CurveEntry(u); ok {
		t.Error("CurveEntry accepted a user's curve")
	}
	st, _ := c.Stacked(0.95)
	if e, ok := CurveEntry(st); !ok || e.Name != "team13-steel" {
		t.Errorf("CurveEntry of a stacked library curve = %+v, %v", e, ok)
	}
}
