package solver_test

import (
	"fmt"
	"math"

	"polegap/mesh"
	"polegap/solver"
)

// squareProblem is a 1 m square of air with a uniform current density,
// held at A = 0 all round, meshed with second-order triangles.
func squareProblem() *solver.Problem {
	rect := mesh.Polygon{X: []float64{0, 1, 1, 0}, Y: []float64{0, 0, 1, 1}}
	in, _ := mesh.BuildInput(nil, rect, mesh.GraphOptions{})
	m, _ := mesh.Triangulate(in, mesh.Options{Order: 2, Size: mesh.SizeField{Global: 0.1}})
	return &solver.Problem{Mesh: m, Materials: []solver.Material{air{1}}, CurrentDensity: []float64{1e6}}
}

// Per-triangle flux density and field strength: in air H = B/μ0.
func ExampleSolution_HTo() {
	s, err := solver.Solve(squareProblem(), solver.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	b := s.BTo(nil)
	h := s.HTo(nil)
	ratio := h[0][0] / b[0][0] * 4e-7 * math.Pi
	fmt.Printf("one value per triangle: %v, μ0 H/B = %.6f\n", len(b) == s.Problem.Mesh.NumTriangles(), ratio)
	// Output:
	// one value per triangle: true, μ0 H/B = 1.000000
}

// The smoothed nodal field, one value per node (corners and midside
// nodes), for plots.
func ExampleSolution_NodalBTo() {
	s, err := solver.Solve(squareProblem(), solver.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	nb := s.NodalBTo(nil)
	fmt.Println(len(nb) == s.Problem.Mesh.NumNodes())
	// Output:
	// true
}

// Error indicators for adaptive refinement: the estimate shrinks when the
// mesh is refined.
func ExampleSolution_ErrorIndicatorTo() {
	p := squareProblem()
	s, _ := solver.Solve(p, solver.Options{})
	_, coarse := s.ErrorIndicatorTo(nil)

	rect := mesh.Polygon{X: []float64{0, 1, 1, 0}, Y: []float64{0, 0, 1, 1}}
	in, _ := mesh.BuildInput(nil, rect, mesh.GraphOptions{})
	p.Mesh, _ = mesh.Triangulate(in, mesh.Options{Order: 2, Size: mesh.SizeField{Global: 0.05}})
	s, _ = solver.Solve(p, solver.Options{})
	_, fine := s.ErrorIndicatorTo(nil)
	fmt.Println("halving h lowers the estimate:", fine < coarse/2)
	// Output:
	// halving h lowers the estimate: true
}

// Check reports inconsistent problem data before any work is done.
func ExampleProblem_Check() {
	p := squareProblem()
	p.Materials = nil
	fmt.Println(p.Check())
	// Output:
	// solver: problem.Materials: triangle 0 has region 0 without a material
}
