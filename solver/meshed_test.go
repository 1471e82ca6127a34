package solver

import (
	"fmt"
	"math"
	"testing"

	"polegap/mesh"
)

// meshedCCore meshes the C-core of cCore with the project's mesher
// (mesh.BuildInput + mesh.Triangulate): one C-shaped iron polygon with a
// 2 mm gap across the right leg, coil sides in the window and outside the
// left leg, and a box boundary at A = 0. Regions as in cCore.
func meshedCCore(t testing.TB, order int, gapSize float64) *mesh.Mesh {
	rect := func(x0, y0, x1, y1 float64, reg int32) mesh.Polygon {
		return mesh.Polygon{X: []float64{x0, x1, x1, x0}, Y: []float64{y0, y0, y1, y1}, Region: reg}
	}
	iron := mesh.Polygon{
		X:      []float64{0, 0.2, 0.2, 0.15, 0.15, 0.05, 0.05, 0.15, 0.15, 0.2, 0.2, 0},
		Y:      []float64{0, 0, 0.099, 0.099, 0.05, 0.05, 0.15, 0.15, 0.101, 0.101, 0.2, 0.2},
		Region: 1,
	}
	regions := []mesh.Polygon{iron, rect(0.055, 0.06, 0.075, 0.14, 2), rect(-0.025, 0.06, -0.005, 0.14, 3)}
	box := rect(-0.2, -0.2, 0.4, 0.4, 0)
	in, err := mesh.BuildInput(regions, box, mesh.GraphOptions{})
	if err != nil {
		t.Fatal(err)
	}
	m, err := mesh.Triangulate(in, mesh.Options{Order: order, Size: mesh.SizeField{
		Global:  0.02,
		Region:  map[int32]float64{1: 0.006, 2: 0.004, 3: 0.004},
		Lines:   []mesh.SizeLine{{X0: 0.15, Y0: 0.1, X1: 0.2, Y1: 0.1, Size: gapSize}},
		Grading: 0.2,
	}})
	if err != nil {
		t.Fatal(err)
	}
	return m
}

// The ideal C-core of TestIdealCCore on a mesh from the project's mesher:
// B = μ0 N I / g at the gap centre (ideal magnetic circuit, Ampère's law).
func TestIdealCCoreMeshed(t *testing.T) {
	for _, c := range []struct {
		order   int
		gapSize float64
		tol     float64 // DESIGN.md: 0.5 % P1, 0.1 % P2
	}{{1, 0.0004, 5e-3}, {2, 0.0008, 1e-3}} {
		name := fmt.Sprintf("P%d", c.order)
		m := meshedCCore(t, c.order, c.gapSize)
		const NI, g = 1000.0, 0.002
		J := NI / (0.02 * 0.08)
		p := &Problem{Mesh: m, Materials: []Material{linear{1}, linear{1e6}, linear{1}, linear{1}},
			CurrentDensity: []float64{0, 0, J, -J}}
		s, err := Solve(p, Options{})
		checkSolution(t, s, err)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		_, bx, by, ok := s.At(0.175, 0.1)
		if !ok {
			t.Fatalf("%s: gap centre not found", name)
		}
		want := mu0 * NI / g
		rel := (by - want) / want
		t.Logf("%s: %d nodes, %d triangles, gap centre B = (%.3g, %.6g) T, relative error %.3g", name, m.NumNodes(), m.NumTriangles(), bx, by, rel)
		if math.Abs(rel) > c.tol || math.Abs(bx) > c.tol*want {
			t.Errorf("%s: gap field relative error %.3g (Bx %.3g) > %g", name, rel, bx, c.tol)
		}
	}
}
