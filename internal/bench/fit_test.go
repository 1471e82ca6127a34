package bench

import (
	"math"
	"math/rand/v2"
	"testing"
)

// TestFitSynthetic recovers known exponents from synthetic costs
// c·N^p, exactly and with seeded multiplicative noise.
func TestFitSynthetic(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	ns := []float64{1e4, 3e4, 1e5, 3e5, 1e6}
	for _, tc := range []struct {
		name  string
		p, c  float64
		noise float64 // relative, uniform in ±noise
		tol   float64
	}{
		// Exact data: the slope is recovered to rounding (1e-12 covers the
		// logarithms of numbers up to 1e6).
		{"linear", 1, 2e-6, 0, 1e-12},
		{"n log n-like", 1.15, 3e-7, 0, 1e-12},
		{"quadratic", 2, 1e-11, 0, 1e-12},
		// ±5 % noise over two decades moves the slope by at most
		// 2·log(1.05/0.95)/log(100) ≈ 0.043 in the worst case.
		{"noisy 1.2", 1.2, 1e-6, 0.05, 0.045},
	} {
		cost := make([]float64, len(ns))
		for i, n := range ns {
			cost[i] = tc.c * math.Pow(n, tc.p) * (1 + tc.noise*(2*rng.Float64()-1))
		}
		p, c, ok := Fit(ns, cost)
		if !ok {
			t.Fatalf("%s: fit failed", tc.name)
		}
		if math.Abs(p-tc.p) > tc.tol {
			t.Errorf("%s: exponent %.6f, want %.6f ± %g", tc.name, p, tc.p, tc.tol)
		}
		if tc.noise == 0 && math.Abs(math.Exp(c)/tc.c-1) > 1e-9 {
			t.Errorf("%s: prefactor %g, want %g", tc.name, math.Exp(c), tc.c)
		}
	}
}

func TestFitDegenerate(t *testing.T) {
	for _, tc := range []struct {
		name    string
		n, cost []float64
	}{
		{"empty", nil, nil},
		{"one point", []float64{1e4}, []float64{1}},
		{"same size", []float64{1e4, 1e4}, []float64{1, 2}},
		{"zero costs", []float64{1e4, 1e5}, []float64{0, 1}},
		{"non-finite", []float64{1e4, math.Inf(1)}, []float64{1, 2}},
	} {
		if p, _, ok := Fit(tc.n, tc.cost); ok {
			t.Errorf("%s: got exponent %g, want no fit", tc.name, p)
		}
	}
	defer func() {
		if recover() == nil {
			t.Error("Fit with unequal lengths did not panic")
		}
	}()
	Fit([]float64{1, 2}, []float64{1})
}

// TestGoalCurve checks the goals at and between DESIGN.md's stated sizes.
func TestGoalCurve(t *testing.T) {
	for _, tc := range []struct {
		name   string
		g      goalCurve
		n      float64
		want   float64
		scaled bool
	}{
		{"linear at 100k", goalLinear, 1e5, 0.5, false},
		{"linear at 1M", goalLinear, 1e6, 8, false},
		{"linear near 100k", goalLinear, 100_500, 0.5, false},
		// Between stated sizes the goal follows the power law through
		// them: 0.5·16^(1/2) = 2 at the geometric mean √(1e5·1e6).
		{"linear between", goalLinear, math.Sqrt(1e11), 2, true},
		{"linear at 10k", goalLinear, 1e4, 0.05, true},
		{"linear at 2M", goalLinear, 2e6, 16, true},
		{"mesh at 200k triangles", goalMesh, 2e5, 0.25 * math.Pow(8, math.Log10(2)), true},
		{"nonlinear at 10k", goalNonlinear, 1e4, 0.2, true},
	} {
		got, scaled := tc.g.at(tc.n)
		if math.Abs(got/tc.want-1) > 1e-12 || scaled != tc.scaled {
			t.Errorf("%s: goal %g (scaled %v), want %g (scaled %v)", tc.name, got, scaled, tc.want, tc.scaled)
		}
	}
}

func TestMedian(t *testing.T) {
	for _, tc := range []struct {
		x    []float64
		want float64
	}{
		{nil, 0}, {[]float64{3}, 3}, {[]float64{3, 1, 2}, 2}, {[]float64{4, 1, 3, 2}, 2.5},
	} {
		if got := median(tc.x); got != tc.want {
			t.Errorf("median(%v) = %g, want %g", tc.x, got, tc.want)
		}
	}
}
