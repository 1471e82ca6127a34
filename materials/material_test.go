package materials

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"
)

// testMaterial is the conformance suite every Material passes: ν positive
// and finite, dν/db2 finite, at b2 from 0 to +Inf, without allocating.
func testMaterial(t *testing.T, name string, m Material) {
	t.Helper()
	for _, x := range []float64{0, 1e-300, 1e-12, 1e-3, 1, 4, 100, 1e12, math.MaxFloat64, math.Inf(1)} {
		nu, g := m.Nu(x)
		if !(nu > 0) || math.IsInf(nu, 0) || math.IsNaN(g) || math.IsInf(g, 0) {
			t.Errorf("%s: Nu(%g) = (%g, %g)", name, x, nu, g)
		}
	}
	if a := testing.AllocsPerRun(50, func() { m.Nu(1.7) }); a != 0 {
		t.Errorf("%s: Nu allocates %v times", name, a)
	}
}

func TestMaterialConformance(t *testing.T) {
	for _, e := range Library() {
		m, _, _ := Lookup(e.Name)
		testMaterial(t, e.Name, m)
	}
	testMaterial(t, "Linear{}", Linear{})
	testMaterial(t, "Magnet{}", Magnet{})
}

// TestLinear: B = μ0 μr H, so ν = 1/(μ0 μr) at every B; the zero value is
// vacuum.
func TestLinear(t *testing.T) {
	for _, tc := range []struct{ mur, want float64 }{{0, 1 / Mu0}, {1, 1 / Mu0}, {1000, 1 / (1000 * Mu0)}, {4e5, 1 / (4e5 * Mu0)}} {
		l := Linear{MuR: tc.mur}
		if err := l.Check(); err != nil {
			t.Errorf("Linear{%g}.Check: %v", tc.mur, err)
		}
		for _, x := range []float64{0, 1, 1e4} {
			if nu, g := l.Nu(x); !near(nu, tc.want, 1e-15) || g != 0 { // one rounding apart
				t.Errorf("Linear{%g}.Nu(%g) = (%g, %g), want (%g, 0)", tc.mur, x, nu, g, tc.want)
			}
		}
	}
	for _, bad := range []float64{-1, math.NaN(), math.Inf(1)} {
		l := Linear{MuR: bad}
		if err := l.Check(); !errors.Is(err, ErrBadValue) {
			t.Errorf("Linear{%g}.Check = %v", bad, err)
		}
		func() {
			defer func() {
				if r := recover(); r != errBadLinear {
					t.Errorf("Linear{%g}.Nu: recover() = %v", bad, r)
				}
			}()
			l.Nu(1)
		}()
	}
}

// TestMagnetRecoilLine checks the linear recoil-line model B = μ0 μrec H +
// Br û (common practice; E. P. Furlani, "Permanent Magnet and
// Electromechanical Devices", 2001): with ν from Nu and M from
// Magnetization, H = ν B - M must satisfy it for any B, to 1e-15 relative
// (a few roundings); at B = Br û the field H vanishes, and at B = 0 it is
// -Hc û with Hc = Br/(μ0 μrec) (by hand, 1.2 T and 1.05 give
// Hc = 909.46 kA/m).
func TestMagnetRecoilLine(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for _, m := range []Magnet{
		{Remanence: 1.2, MuRecoil: 1.05, Direction: 0},
		{Remanence: 0.4, MuRecoil: 1.1, Direction: math.Pi / 2},
		{Remanence: 1.05, MuRecoil: 1.03, Direction: -2.3},
		{Remanence: 1.0}, // MuRecoil 0 means 1
	} {
		if err := m.Check(); err != nil {
			t.Fatalf("%+v: %v", m, err)
		}
		nu, g := m.Nu(1)
		mx, my := m.Magnetization()
		ux, uy := math.Cos(m.Direction), math.Sin(m.Direction)
		mur := m.MuRecoil
		if mur == 0 {
			mur = 1
		}
		if g != 0 || !near(nu, 1/(Mu0*mur), 1e-15) {
			t.Errorf("%+v: Nu = (%g, %g)", m, nu, g)
		}
		for k := 0; k < 100; k++ {
			bx, by := 4*rng.Float64()-2, 4*rng.Float64()-2
			hx, hy := nu*bx-mx, nu*by-my
			wx, wy := Mu0*mur*hx+m.Remanence*ux, Mu0*mur*hy+m.Remanence*uy
			if math.Hypot(wx-bx, wy-by) > 1e-15*(math.Hypot(bx, by)+m.Remanence) {
				t.Fatalf("%+v: B = (%g, %g) gives recoil-line B = (%g, %g)", m, bx, by, wx, wy)
			}
		}
		// B = Br û: no field inside (the magnet in a closed ideal yoke).
		if hx, hy := nu*m.Remanence*ux-mx, nu*m.Remanence*uy-my; math.Hypot(hx, hy) > 1e-9 {
			t.Errorf("%+v: H at B = Br û is (%g, %g)", m, hx, hy)
		}
	}
	m := Magnet{Remanence: 1.2, MuRecoil: 1.05}
	if mx, _ := m.Magnetization(); math.Abs(mx-909.46e3) > 0.01e3 {
		t.Errorf("Hc = %g A/m, want 909.46 kA/m", mx)
	}
	for _, bad := range []Magnet{{Remanence: -1}, {Remanence: 1, MuRecoil: -1}, {Remanence: math.NaN()}, {Remanence: 1, Direction: math.Inf(1)}} {
		if err := bad.Check(); !errors.Is(err, ErrBadValue) {
			t.Errorf("%+v.Check = %v", bad, err)
		}
		func() {
			defer func() {
				if r := recover(); r != errBadMagnet {
					t.Errorf("%+v.Magnetization: recover() = %v", bad, r)
				}
			}()
			bad.Magnetization()
		}()
	}
}

// TestRandomTables builds curves from random smooth magnetisation curves
// J(H) = Js (H/(a+H))^p, sampled at 3 to 40 random log-spaced H. This is
// the Frohlich-Kennelly law for p = 1 (common practice), and p > 1 gives
// the S-shaped start of real iron. Every table must give a curve that
// passes Check: no valid, physically shaped table may be rejected as
// irregular.
func TestRandomTables(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for trial := 0; trial < 300; trial++ {
		js := 0.5 + 2*rng.Float64()
		a := math.Pow(10, 1+3*rng.Float64())
		p := 1 + 2*rng.Float64()
		n := 3 + rng.IntN(38)
		h := make([]float64, n)
		b := make([]float64, n)
		lo, hi := math.Log10(a)-1.5, 5+1.5*rng.Float64()
		for i := range h {
			h[i] = math.Pow(10, lo+(hi-lo)*(float64(i)+0.8*rng.Float64())/float64(n))
			b[i] = js*math.Pow(h[i]/(a+h[i]), p) + Mu0*h[i]
		}
		c, err := NewCurve(h, b)
		if err != nil {
			t.Fatalf("trial %d (Js %g, a %g, p %g, n %d): %v", trial, js, a, p, n, err)
		}
		if err := c.Check(); err != nil {
			t.Fatalf("trial %d: %v", trial, err)
		}
	}
}

// TestIrregularTable: a slope that falls by 5e5 times at one row cannot be
// tabulated smoothly; NewCurve says so and names the row.
func TestIrregularTable(t *testing.T) {
	_, err := NewCurve([]float64{1e-6, 2e-6, 1e8}, []float64{1e-12, 1.000001e-6, 1e2})
	var te *TableError
	if !errors.As(err, &te) || !errors.Is(err, ErrSlope) || te.Row != 2 {
		t.Fatalf("got %v, want ErrSlope at row 2", err)
	}
}

// TestNuTo: the batch kernel equals point-wise Nu, grows nil destinations
// and reuses long enough ones without allocating.
func TestNuTo(t *testing.T) {
	b2 := []float64{0, 0.25, 1, 2.25, 4, 9}
	for _, e := range Library() {
		m, _, _ := Lookup(e.Name)
		nu, dnu := NuTo(nil, nil, m, b2)
		for i, x := range b2 {
			if v, g := m.Nu(x); nu[i] != v || dnu[i] != g {
				t.Errorf("%s: NuTo[%d] = (%g, %g), Nu = (%g, %g)", e.Name, i, nu[i], dnu[i], v, g)
			}
		}
		if a := testing.AllocsPerRun(20, func() { NuTo(nu, dnu, m, b2) }); a != 0 {
			t.Errorf("%s: NuTo with room allocates %v times", e.Name, a)
		}
	}
}

// BenchmarkNuTo evaluates 4096 random b2 values per call through the batch
// kernel (ns/op divided by 4096 gives the cost per element).
func BenchmarkNuTo(b *testing.B) {
	m, _, _ := Lookup("low-carbon-steel")
	c := m.(*Curve)
	rng := rand.New(rand.NewPCG(1, 1))
	xs := make([]float64, 4096)
	for i := range xs {
		bv := 1.2 * c.bl * rng.Float64()
		xs[i] = bv * bv
	}
	nu, dnu := NuTo(nil, nil, m, xs)
	b.ReportAllocs()
	for b.Loop() {
		nu, dnu = NuTo(nu, dnu, m, xs)
	}
}
