package solver

import (
	"fmt"
	"math"
	"testing"
)

// checkOrientation verifies that every triangle of a test mesh is
// counter-clockwise.
func checkCCW(t *testing.T, s *Solution) {
	t.Helper()
	for e := 0; e < s.as.m.NumTriangles(); e++ {
		if _, _, _, _, _, _, det := s.as.affine(e); det <= 0 {
			t.Fatalf("triangle %d is not counter-clockwise (det %g)", e, det)
		}
	}
}

// Line current I at the centre of a circle held at A = 0. Inside the
// circle the field is exactly that of the line current,
// B = μ0 I / (2π r) (Ampère's circuital law; e.g. D. J. Griffiths,
// Introduction to Electrodynamics, 4th ed., 2013, eq. 5.38), since
// A = μ0 I/(2π) ln(R/r) vanishes on the circle r = R.
func TestLineCurrentInAir(t *testing.T) {
	const I = 100.0
	const R = 1.0
	for _, c := range []struct {
		order int
		nth   int
		tol   float64 // DESIGN.md accuracy figures: 0.5 % P1, 0.1 % P2
	}{
		{1, 128, 5e-3},
		{2, 128, 1e-3},
	} {
		name := fmt.Sprintf("P%d", c.order)
		m := diskMesh(geometricRadii(2e-3, R, c.nth), c.nth, c.order, nil)
		p := &Problem{Mesh: m, Materials: []Material{linear{1}},
			PointCurrents: []PointCurrent{{Node: 0, Current: I}}}
		s, err := Solve(p, Options{})
		checkSolution(t, s, err)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		checkCCW(t, s)
		var worst float64
		for _, r := range []float64{0.01, 0.03, 0.1, 0.3, 0.6} {
			for k := 0; k < 7; k++ {
				th := 0.3 + 2*math.Pi*float64(k)/7
				x, y := r*math.Cos(th), r*math.Sin(th)
				_, bx, by, ok := s.At(x, y)
				if !ok {
					t.Fatalf("%s: point (%g, %g) not found", name, x, y)
				}
				want := mu0 * I / (2 * math.Pi * r)
				// direction: counter-clockwise (right-hand rule)
				if bx*(-y)+by*x <= 0 {
					t.Errorf("%s: B at (%g,%g) = (%g,%g) not counter-clockwise", name, x, y, bx, by)
				}
				worst = math.Max(worst, math.Abs(math.Hypot(bx, by)-want)/want)
			}
		}
		// Smoothed nodal field at every node with 0.01 <= r <= 0.6.
		nb := s.NodalBTo(nil)
		var worstNodal float64
		for i := range nb {
			r := math.Hypot(m.X[i], m.Y[i])
			if r < 0.01 || r > 0.6 {
				continue
			}
			want := mu0 * I / (2 * math.Pi * r)
			worstNodal = math.Max(worstNodal, math.Abs(math.Hypot(nb[i][0], nb[i][1])-want)/want)
		}
		t.Logf("%s: %d nodes, worst relative error %.3g pointwise, %.3g smoothed nodal", name, m.NumNodes(), worst, worstNodal)
		if c.order == 1 {
			// The raw P1 field is constant per element: first order, with
			// a relative error up to about h/r = 2π/nth (5 % here).
			if worst > 2*math.Pi/float64(c.nth) {
				t.Errorf("%s: worst relative pointwise |B| error %.3g > 2π/nth", name, worst)
			}
			worst = worstNodal
		}
		if worst > c.tol {
			t.Errorf("%s: worst relative |B| error %.3g > %g", name, worst, c.tol)
		}
	}
}
