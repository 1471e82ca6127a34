package solver

import (
	"fmt"
	"math"
	"testing"

	"polegap/mesh"
)

// Axisymmetric magnetisation: a sphere (radius a) magnetised uniformly
// along z with M, centred in a sphere of radius R held at A = 0. Alone,
// its inside field is B = (2/3) μ0 M (D. J. Griffiths, Introduction to
// Electrodynamics, 4th ed., 2013, example 6.1). The outer condition adds a
// uniform field: outside the magnet A = μ0 m sin θ/(4π r²) + C r sin θ with
// m = (4/3)π a³ M, and A(R) = 0 gives C = −μ0 m/(4π R³), whose uniform
// field 2C adds to the inside: B = (2/3) μ0 M (1 − a³/R³), exact for the
// finite domain. Checked at points inside the magnet, on and off the axis.
func TestMagnetizedSphereAxisymmetric(t *testing.T) {
	const M, a, R = 8e5, 0.05, 0.25
	half := func(r float64, reg int32) mesh.Polygon {
		// Half disk in the (r, z) plane: arc from (0,−r) through (r,0) to
		// (0,r), closed along the axis.
		return mesh.Polygon{X: []float64{0, r, 0}, Y: []float64{-r, 0, r},
			Sweep: []float64{math.Pi / 2, math.Pi / 2, 0}, Region: reg}
	}
	for _, c := range []struct {
		order int
		size  float64 // in the magnet
		air   float64 // in the air
		tol   float64 // DESIGN.md: 0.5 % P1, 0.1 % P2
	}{{1, a / 12, R / 40, 5e-3}, {2, a / 6, R / 10, 1e-3}} {
		name := fmt.Sprintf("P%d", c.order)
		in, err := mesh.BuildInput([]mesh.Polygon{half(a, 1)}, half(R, 0),
			mesh.GraphOptions{MaxArcAngle: 2 * math.Pi / 180, ChordTol: 1e-6})
		if err != nil {
			t.Fatal(err)
		}
		m, err := mesh.Triangulate(in, mesh.Options{Order: c.order, Size: mesh.SizeField{
			Global: c.air, Region: map[int32]float64{1: c.size}, Grading: 0.3}})
		if err != nil {
			t.Fatal(err)
		}
		p := &Problem{Mesh: m, Formulation: Axisymmetric, Materials: []Material{linear{1}, linear{1}},
			Magnetization: [][2]float64{{}, {0, M}}}
		s, err := Solve(p, Options{})
		checkSolution(t, s, err)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		want := 2.0 / 3 * mu0 * M * (1 - a*a*a/(R*R*R))
		var worst float64
		for _, pt := range [][2]float64{{0, 0}, {0, 0.03}, {0.01, -0.02}, {0.03, 0.01}, {0.02, 0.035}} {
			_, br, bz, ok := s.At(pt[0], pt[1])
			if !ok {
				t.Fatalf("%s: %v not found", name, pt)
			}
			worst = math.Max(worst, math.Hypot(br, bz-want)/want)
		}
		t.Logf("%s: %d nodes, B inside %.6g T expected, worst relative error %.3g", name, m.NumNodes(), want, worst)
		if worst > c.tol {
			t.Errorf("%s: relative error %.3g > %g", name, worst, c.tol)
		}
	}
}
