package solver

import (
	"math"
	"testing"

	"polegap/mesh"
)

// dirichletSolve solves the Laplace equation (air, no source) on m with
// every boundary node held at f: the discrete solution is f itself when f
// is harmonic and in the element space (the patch test, e.g. O. C.
// Zienkiewicz, R. L. Taylor, "The Finite Element Method", vol. 1, 5th
// ed., 2000, sec. 10.3).
func dirichletSolve(t *testing.T, m *mesh.Mesh, f func(x, y float64) float64) *Solution {
	t.Helper()
	p := &Problem{Mesh: m, Materials: []Material{linear{1}}}
	for _, v := range boundaryNodes(m) {
		p.Fixed = append(p.Fixed, NodeValue{Node: v, A: f(m.X[v], m.Y[v])})
	}
	s, err := Solve(p, Options{})
	checkSolution(t, s, err)
	if err != nil {
		t.Fatal(err)
	}
	return s
}

// InterpolateTo carries every field the old mesh's elements represent
// exactly to the new mesh: a linear field between first-order meshes and
// a quadratic one between second-order meshes, to rounding. Nodes of the
// new mesh outside the old one get finite values from their neighbours.
func TestInterpolateExact(t *testing.T) {
	for _, c := range []struct {
		name  string
		order int
		f     func(x, y float64) float64
	}{
		{"P1 linear", 1, func(x, y float64) float64 { return 2*x - 3*y + 0.5 }},
		{"P2 quadratic", 2, func(x, y float64) float64 { return x*x - y*y + x*y - 0.7*x + 0.2 }},
	} {
		old := rectMesh(7, 5, 0, 1, 0, 0.6, c.order, nil)
		s := dirichletSolve(t, old, c.f)
		// A finer mesh of a larger box: nodes inside the old mesh must be
		// exact, the others (beyond x = 1 or y = 0.6) filled.
		fine := rectMesh(26, 17, 0, 1.2, 0, 0.72, c.order, nil)
		got := s.InterpolateTo(nil, fine)
		if len(got) != fine.NumNodes() {
			t.Fatalf("%s: %d values for %d nodes", c.name, len(got), fine.NumNodes())
		}
		var worst float64
		outside := 0
		for i := range got {
			x, y := fine.X[i], fine.Y[i]
			if !(math.Abs(got[i]) < 10) {
				t.Errorf("%s: node %d at (%g, %g): %g", c.name, i, x, y, got[i])
			}
			if x > 1+1e-12 || y > 0.6+1e-12 {
				outside++
				continue
			}
			worst = math.Max(worst, math.Abs(got[i]-c.f(x, y)))
		}
		t.Logf("%s: largest error %.2g on %d nodes inside, %d filled outside", c.name, worst, fine.NumNodes()-outside, outside)
		// 1e-12: the solve's own rounding (a field of order 1, a
		// direct solve of a few hundred unknowns) and the locator's.
		if worst > 1e-12 {
			t.Errorf("%s: interpolation error %.3g", c.name, worst)
		}
		if outside == 0 {
			t.Errorf("%s: the test has no node outside the old mesh", c.name)
		}
		// A destination of the right length is reused.
		again := s.InterpolateTo(got[:0], fine)
		if &again[0] != &got[0] {
			t.Errorf("%s: dst not reused", c.name)
		}
	}
}

// Nested iteration: Newton on a refined mesh started from the solution
// of the coarse mesh interpolated to it converges in fewer steps than
// from zero, to the same solution within the solver's tolerances. The
// saturating ring of TestNewtonNonlinearRing, driven by a current
// density in a core of radius 0.1 instead of a line current (whose
// singular discrete field differs between any two meshes), on meshes of
// 48 and 96 sectors (the finer mesh's outer nodes lie outside the coarser
// polygon and are filled from their neighbours). The two polygonal
// rings differ, so the interpolated start puts iron's potential into
// elements that are now air and its residual starts above the zero
// start's; Newton still needs fewer steps from it.
func TestNestedIteration(t *testing.T) {
	const I, r1, r2, R = 6000.0, 0.2, 0.3, 0.5
	mat := saturating{1000, 1.5}
	ring := func(nth int) *Problem {
		radii := []float64{0.05}
		radii = append(radii, geometricRadii(0.1, r1, nth)...)
		radii = append(radii, geometricRadii(r1, r2, nth)[1:]...)
		radii = append(radii, geometricRadii(r2, R, nth)[1:]...)
		m := diskMesh(radii, nth, 2, func(r float64) int32 {
			switch {
			case r > r1 && r < r2:
				return 1
			case r < 0.1:
				return 2
			}
			return 0
		})
		return &Problem{Mesh: m, Materials: []Material{linear{1}, mat, linear{1}},
			CurrentDensity: []float64{0, 0, I / (math.Pi * 0.1 * 0.1)}}
	}
	coarse, err := Solve(ring(48), Options{})
	if err != nil {
		t.Fatal(err)
	}
	p := ring(96)
	cold, err := Solve(p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	warm, err := Solve(p, Options{Initial: coarse.InterpolateTo(nil, p.Mesh)})
	checkSolution(t, warm, err)
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("Newton steps: coarse %d, fine from zero %d, fine from the coarse solution %d (history %.2g)",
		coarse.Iterations, cold.Iterations, warm.Iterations, warm.History)
	if warm.Iterations >= cold.Iterations || warm.Iterations > 4 {
		t.Errorf("nested iteration took %d Newton steps, %d from zero", warm.Iterations, cold.Iterations)
	}
	// Both converged to relative residual 1e-8 with updates below 1e-6:
	// agreement to 1e-6 of max |A|.
	var worst, amax float64
	for i := range warm.A {
		worst = math.Max(worst, math.Abs(warm.A[i]-cold.A[i]))
		amax = math.Max(amax, math.Abs(cold.A[i]))
	}
	if worst > 1e-6*amax {
		t.Errorf("warm and cold solutions differ by %.3g of max |A|", worst/amax)
	}
}
