package probes

import (
	"math"
	"testing"

	"polegap/models"
)

// field is B = (0, b0 + g x) inside the square [0,1]², nothing outside; its
// potential A = -(b0 x + g x²/2) makes curl A = B exactly.
type field struct{ b0, g float64 }

func (f field) At(x, y float64) (a, bx, by float64, ok bool) {
	if x < 0 || x > 1 || y < 0 || y > 1 {
		return 0, 0, 0, false
	}
	return -(f.b0*x + f.g*x*x/2), 0, f.b0 + f.g*x, true
}

func TestEvaluate(t *testing.T) {
	f := field{b0: 1.2, g: 0.1}
	ps := []models.Probe{
		{Name: "centre", Kind: models.ProbePoint, Point: [2]float64{0.5, 0.5}},
		{Name: "mid", Kind: models.ProbeLine, Line: [2][2]float64{{0, 0.5}, {1, 0.5}}, Samples: 11},
		{Name: "half-out", Kind: models.ProbeLine, Line: [2][2]float64{{0.5, 0.5}, {1.5, 0.5}}, Samples: 11},
		{Name: "box", Kind: models.ProbeBox, Box: [2][2]float64{{0.25, 0.25}, {0.75, 0.75}}},
		{Name: "away", Kind: models.ProbePoint, Point: [2]float64{5, 5}},
	}
	rs := Evaluate(f, ps)
	// The field is linear in x, so sampled means over symmetric sets are
	// exact up to rounding (1e-12 allows the summation error).
	const tol = 1e-12
	check := func(name string, got, want float64) {
		t.Helper()
		if math.Abs(got-want) > tol*math.Max(1, math.Abs(want)) {
			t.Errorf("%s = %.15g, want %.15g", name, got, want)
		}
	}
	check("centre By", rs[0].Point.By, 1.25)
	check("centre A", rs[0].Point.A, -(1.2*0.5 + 0.1*0.125))
	check("mid mean", rs[1].Stats.Mean, 1.25)
	check("mid min", rs[1].Stats.Min, 1.2)
	check("mid max", rs[1].Stats.Max, 1.3)
	check("mid uniformity", rs[1].Stats.Uniformity, 0.1/1.25)
	if rs[2].Outside != 5 || rs[2].Stats.N != 6 {
		t.Errorf("half-out: outside %d inside %d, want 5 and 6", rs[2].Outside, rs[2].Stats.N)
	}
	check("box mean", rs[3].Stats.Mean, 1.25)
	if rs[4].Valid || rs[4].Stats.Mean != 0 || math.IsNaN(rs[4].Stats.Uniformity) {
		t.Errorf("probe outside the mesh: %+v", rs[4])
	}
}
