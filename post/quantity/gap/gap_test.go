package gap

import (
	"bytes"
	"errors"
	"math"
	"strings"
	"testing"

	"polegap/internal/num"
)

// fieldFunc adapts a function to Field.
type fieldFunc func(x, y float64) (a, bx, by float64, ok bool)

func (f fieldFunc) At(x, y float64) (float64, float64, float64, bool) { return f(x, y) }

// uniform is the field B = (0, b0) everywhere inside |x|, |y| < half:
// A = −b0 x, since B = (∂A/∂y, −∂A/∂x).
func uniform(b0, half float64) Field {
	return fieldFunc(func(x, y float64) (float64, float64, float64, bool) {
		if math.Abs(x) > half || math.Abs(y) > half {
			return 0, 0, 0, false
		}
		return -b0 * x, 0, b0, true
	})
}

// parabolic has By = b0 (1 − (x/a)²), Bx = 0, A = −b0 (x − x³/(3a²)).
func parabolic(b0, a float64) Field {
	return fieldFunc(func(x, y float64) (float64, float64, float64, bool) {
		return -b0 * (x - x*x*x/(3*a*a)), 0, b0 * (1 - (x/a)*(x/a)), true
	})
}

// A uniform field: every number is exact (flux = B0 times the width).
func TestUniformExact(t *testing.T) {
	const b0, w = 1.25, 0.06
	f := uniform(b0, 1)
	p, q := [2]float64{-w / 2, 0.01}, [2]float64{w / 2, 0.01}
	phi, err := Flux(f, p, q)
	if err != nil || math.Abs(phi-b0*w) > 1e-15 {
		t.Errorf("Flux = %v, %v; want %v", phi, err, b0*w)
	}
	// Reversing the segment reverses the normal.
	if back, _ := Flux(f, q, p); math.Abs(back+b0*w) > 1e-15 {
		t.Errorf("reversed Flux = %v, want %v", back, -b0*w)
	}
	mean, _ := MeanNormal(f, p, q)
	if math.Abs(mean-b0) > 1e-14 {
		t.Errorf("MeanNormal = %v, want %v", mean, b0)
	}
	ss := ProfileTo(nil, f, p, q, 11)
	tr, err := TrapezoidFlux(ss)
	if err != nil || math.Abs(tr-b0*w) > 1e-15 {
		t.Errorf("TrapezoidFlux = %v, %v; want %v", tr, err, b0*w)
	}
	u, err := Deviation(ss, b0, ComponentY)
	if err != nil || u.MaxAbs != 0 || u.N != 11 || u.RMS != 0 {
		t.Errorf("Deviation = %+v, %v; want all zero over 11 samples", u, err)
	}
	gf, err := GoodFieldWidths(ss, w/2, b0, Normal, nil)
	if err != nil || len(gf) != 2 {
		t.Fatalf("GoodFieldWidths: %v, %v", gf, err)
	}
	for _, g := range gf {
		if g.Bounded() || math.Abs(g.HalfWidth()-w/2) > 1e-15 {
			t.Errorf("tol %g: %+v; want unbounded half-width %g (the whole line)", g.Tol, g, w/2)
		}
	}
	// An ideal gap: Factor 1, K 0, effective gap = g when NI = B0 g/μ0.
	const g = 0.01
	fr, err := Fringing(f, p, q, b0, FringeOptions{Gap: g, PoleWidth: w, AmpereTurns: b0 * g / num.Mu0})
	if err != nil || math.Abs(fr.Factor-1) > 1e-14 || math.Abs(fr.K) > 1e-12 || math.Abs(fr.GapEff-g) > 1e-15 {
		t.Errorf("Fringing = %+v, %v", fr, err)
	}
	// The field never falls off: the line is truncated.
	if !fr.Truncated || fr.EndRatio != 1 {
		t.Errorf("uniform field: Truncated = %v, EndRatio = %v; want true, 1", fr.Truncated, fr.EndRatio)
	}
	// Axisymmetric uniform Bz = b0: Aφ = b0 r / 2, flux π r² b0.
	ax := fieldFunc(func(r, z float64) (float64, float64, float64, bool) { return b0 * r / 2, 0, b0, true })
	if fl, _ := AxialFlux(ax, 0.03, 0); math.Abs(fl-math.Pi*0.03*0.03*b0) > 1e-16 {
		t.Errorf("AxialFlux = %v, want %v", fl, math.Pi*0.03*0.03*b0)
	}
}

// The half-width within tolerance of By = B0 (1 − (x/a)²) is a √tol
// exactly; linear interpolation of the crossing between samples h apart
// errs by at most h² f”/(8 f') = h²/(8 x*) for this f (the linear
// interpolation error bound, e.g. Burden and Faires, "Numerical Analysis",
// theorem 3.3 for n = 1), which is the tolerance used.
func TestGoodFieldParabola(t *testing.T) {
	const b0, a = 1.0, 0.05
	f := parabolic(b0, a)
	const n = 1001
	p, q := [2]float64{-0.05, 0}, [2]float64{0.05, 0}
	h := 0.1 / (n - 1)
	ss := ProfileTo(nil, f, p, q, n)
	gf, err := GoodFieldWidths(ss, 0.05, b0, ComponentY, []float64{1e-2, 1e-3, 1e-4})
	if err != nil {
		t.Fatal(err)
	}
	for _, g := range gf {
		want := a * math.Sqrt(g.Tol)
		tol := h * h / (8 * want)
		if !g.Bounded() || math.Abs(g.Plus-want) > tol || math.Abs(g.Minus-want) > tol {
			t.Errorf("tol %g: %+v, want half-width %g ± %g", g.Tol, g, want, tol)
		}
	}
	// Off-centre start: the distances are measured from the given centre.
	gf, _ = GoodFieldWidths(ss, 0.05+0.0001, b0, ComponentY, []float64{1e-2})
	want := a * math.Sqrt(1e-2)
	if math.Abs(gf[0].Plus-(want-0.0001)) > 1e-6 || math.Abs(gf[0].Minus-(want+0.0001)) > 1e-6 {
		t.Errorf("off-centre: %+v; want plus %g, minus %g", gf[0], want-0.0001, want+0.0001)
	}
	u, _ := Deviation(ss, b0, ComponentY)
	// Largest deviation at the ends: (0.05/a)² = 1.
	if math.Abs(u.MaxAbs-1) > 1e-12 || math.Abs(u.Min+1) > 1e-12 || u.Max > 1e-15 {
		t.Errorf("Deviation: %+v; want MaxAbs 1, Min -1, Max 0", u)
	}
}

func TestCSV(t *testing.T) {
	f := uniform(0.5, 0.1)
	ss := ProfileTo(nil, f, [2]float64{0, 0}, [2]float64{0.2, 0}, 3) // the last point lies outside
	var buf bytes.Buffer
	if err := WriteCSV(&buf, ss); err != nil {
		t.Fatal(err)
	}
	want := "x_m,y_m,bx_T,by_T,b_T\n0,0,0,0.5,0.5\n0.1,0,0,0.5,0.5\n"
	if buf.String() != want {
		t.Errorf("CSV:\n%s\nwant:\n%s", buf.String(), want)
	}
}

func TestErrors(t *testing.T) {
	f := uniform(1, 0.1)
	var oe *OutsideError
	if _, err := Flux(f, [2]float64{0, 0}, [2]float64{0.5, 0}); !errors.As(err, &oe) || oe.What != "Q" {
		t.Errorf("Flux outside: %v", err)
	}
	var ze *ZeroFieldError
	ss := ProfileTo(nil, f, [2]float64{-0.05, 0}, [2]float64{0.05, 0}, 5)
	if _, err := Deviation(ss, 0, Magnitude); !errors.As(err, &ze) {
		t.Errorf("Deviation with B0 = 0: %v", err)
	}
	if _, err := GoodFieldWidths(ss, 0.05, math.NaN(), Magnitude, nil); !errors.As(err, &ze) {
		t.Errorf("GoodFieldWidths with B0 = NaN: %v", err)
	}
	if _, err := GoodFieldWidths(ss, 0.5, 1, Magnitude, nil); !errors.As(err, &oe) {
		t.Errorf("GoodFieldWidths centre beyond the line: %v", err)
	}
	var ee *EmptyError
	out := ProfileTo(nil, f, [2]float64{1, 1}, [2]float64{2, 2}, 4)
	if _, err := Deviation(out, 1, Magnitude); !errors.As(err, &ee) {
		t.Errorf("Deviation outside: %v", err)
	}
	if _, err := TrapezoidFlux(out); !errors.As(err, &ee) {
		t.Errorf("TrapezoidFlux outside: %v", err)
	}
	if _, err := Fringing(f, [2]float64{-0.05, 0}, [2]float64{0.05, 0}, 0, FringeOptions{Gap: 1, PoleWidth: 1}); !errors.As(err, &ze) {
		t.Errorf("Fringing B0 = 0: %v", err)
	}
	for _, e := range []error{&OutsideError{What: "P"}, &ZeroFieldError{}, &EmptyError{}} {
		if !strings.HasPrefix(e.Error(), "gap: ") {
			t.Errorf("%T message %q lacks the package prefix", e, e.Error())
		}
	}
	mustPanic(t, "n < 2", func() { ProfileTo(nil, f, [2]float64{}, [2]float64{1, 0}, 1) })
	mustPanic(t, "nil field", func() { ProfileTo(nil, nil, [2]float64{}, [2]float64{1, 0}, 3) })
	mustPanic(t, "zero gap", func() { Fringing(f, [2]float64{}, [2]float64{0.01, 0}, 1, FringeOptions{}) })
	mustPanic(t, "bad tolerance", func() { GoodFieldWidths(ss, 0.05, 1, Magnitude, []float64{-1}) })
}

func mustPanic(t *testing.T, name string, f func()) {
	t.Helper()
	defer func() {
		r := recover()
		if s, ok := r.(string); !ok || !strings.HasPrefix(s, "gap: ") {
			t.Errorf("%s: recovered %v, want a \"gap: ...\" panic", name, r)
		}
	}()
	f()
}

// Reach on By = B0 (1 − (x/a)²) falls below frac B0 at a √(1 − frac).
func TestReach(t *testing.T) {
	f := parabolic(1, 0.05)
	d, ok := Reach(f, [2]float64{0, 0}, [2]float64{1, 0}, [2]float64{0, 1}, 1, 0.01, 1e-4, 1)
	want := 0.05 * math.Sqrt(0.99)
	// Linear interpolation over a 1e-4 step of a smooth function: error
	// below h² f''/(8 f') ≈ 1e-9 m; 1e-7 leaves room.
	if !ok || math.Abs(d-want) > 1e-7 {
		t.Errorf("Reach = %v, %v; want %v", d, ok, want)
	}
}
