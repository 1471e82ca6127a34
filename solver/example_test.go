package solver_test

import (
	"fmt"
	"math"

	"polegap/mesh"
	"polegap/solver"
)

// air is a linear material of relative permeability MuR.
type air struct{ MuR float64 }

func (a air) Nu(float64) (float64, float64) { return 1 / (4e-7 * math.Pi * a.MuR), 0 }

// A C-shaped iron yoke with a 2 mm gap and 1000 ampere-turns: the gap field
// is μ0 N I / g = 0.628 T for ideal iron.
func ExampleSolve() {
	rect := func(x0, y0, x1, y1 float64, reg int32) mesh.Polygon {
		return mesh.Polygon{X: []float64{x0, x1, x1, x0}, Y: []float64{y0, y0, y1, y1}, Region: reg}
	}
	yoke := mesh.Polygon{
		X:      []float64{0, 0.2, 0.2, 0.15, 0.15, 0.05, 0.05, 0.15, 0.15, 0.2, 0.2, 0},
		Y:      []float64{0, 0, 0.099, 0.099, 0.05, 0.05, 0.15, 0.15, 0.101, 0.101, 0.2, 0.2},
		Region: 1,
	}
	coilIn := rect(0.055, 0.06, 0.075, 0.14, 2)
	coilOut := rect(-0.025, 0.06, -0.005, 0.14, 3)
	in, err := mesh.BuildInput([]mesh.Polygon{yoke, coilIn, coilOut}, rect(-0.2, -0.2, 0.4, 0.4, 0), mesh.GraphOptions{})
	if err != nil {
		fmt.Println(err)
		return
	}
	m, err := mesh.Triangulate(in, mesh.Options{Order: 2, Size: mesh.SizeField{
		Global: 0.02, Region: map[int32]float64{1: 0.006},
		Lines: []mesh.SizeLine{{X0: 0.15, Y0: 0.1, X1: 0.2, Y1: 0.1, Size: 0.0008}}, Grading: 0.2,
	}})
	if err != nil {
		fmt.Println(err)
		return
	}
	J := 1000 / (0.02 * 0.08) // A/m², 1000 ampere-turns per coil side
	p := &solver.Problem{
		Mesh:           m,
		Materials:      []solver.Material{air{1}, air{1e6}, air{1}, air{1}},
		CurrentDensity: []float64{0, 0, J, -J},
	}
	s, err := solver.Solve(p, solver.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	_, bx, by, _ := s.At(0.175, 0.1)
	fmt.Printf("gap centre: Bx = %.3f T, By = %.3f T after %d Newton step\n", math.Abs(bx), by, s.Iterations)
	// Output:
	// gap centre: Bx = 0.000 T, By = 0.628 T after 1 Newton step
}
