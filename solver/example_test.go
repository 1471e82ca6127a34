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
// cCoreMesh meshes a C-shaped yoke (region 1) with a 2 mm gap across its
// right leg, coil sides in the window (2) and outside the left leg (3), in
// an air box (0) whose edges are held at A = 0.
func cCoreMesh() (*mesh.Mesh, error) {
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
		return nil, err
	}
	return mesh.Triangulate(in, mesh.Options{Order: 2, Size: mesh.SizeField{
		Global: 0.02, Region: map[int32]float64{1: 0.006},
		Lines: []mesh.SizeLine{{X0: 0.15, Y0: 0.1, X1: 0.2, Y1: 0.1, Size: 0.0008}}, Grading: 0.2,
	}})
}

// A C-shaped iron yoke with a 2 mm gap and 1000 ampere-turns: the gap field
// is μ0 N I / g = 0.628 T for ideal iron.
func ExampleSolve() {
	m, err := cCoreMesh()
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

// Integrate x²y over the reference triangle with the degree-3 rule: the
// exact value is 2!·1!/5! = 1/60.
func ExampleRuleOfDegree() {
	r := solver.RuleOfDegree(3)
	var sum float64
	for q := range r.W {
		x, y := r.Point(q)
		sum += r.W[q] * x * x * y
	}
	sum *= 0.5 // area of the reference triangle
	fmt.Printf("%d points: %.12f (1/60 = %.12f)\n", r.NumPoints(), sum, 1.0/60)
	// Output:
	// 4 points: 0.016666666667 (1/60 = 0.016666666667)
}

// The quadratic basis at the midpoint of the edge opposite corner 0 is
// nodal: only the edge function 3 is one there.
func ExampleP2_EvalTo() {
	var val [6]float64
	var grad [6][2]float64
	solver.P2{}.EvalTo(val[:], grad[:], 0.5, 0.5)
	for i := range val {
		val[i] += 0 // print −0 as 0
	}
	fmt.Println(val)
	// Output:
	// [0 0 0 1 0 0]
}

// Stored energy per metre of a round conductor (radius a, current I) inside
// a zero-potential circle of radius b: W = μ0 I²/(4π) (ln(b/a) + 1/4), the
// coaxial line with a solid inner conductor (e.g. Griffiths, Introduction
// to Electrodynamics, problem 7.27, plus the internal term μ0/(8π)).
func ExampleSolution_Energy() {
	const a, b, I = 0.01, 0.1, 100.0
	circle := func(r float64, reg, marker int32) mesh.Polygon {
		return mesh.Polygon{X: []float64{r, 0, -r, 0}, Y: []float64{0, r, 0, -r},
			Sweep: []float64{math.Pi / 2, math.Pi / 2, math.Pi / 2, math.Pi / 2}, Region: reg, Marker: marker}
	}
	in, err := mesh.BuildInput([]mesh.Polygon{circle(a, 1, 2)}, circle(b, 0, 1),
		mesh.GraphOptions{MaxArcAngle: 3 * math.Pi / 180, ChordTol: 1e-6})
	if err != nil {
		fmt.Println(err)
		return
	}
	m, err := mesh.Triangulate(in, mesh.Options{Order: 2, Size: mesh.SizeField{
		Points: []mesh.SizePoint{{X: 0, Y: 0, Size: a / 5}}, Grading: 0.2}})
	if err != nil {
		fmt.Println(err)
		return
	}
	p := &solver.Problem{Mesh: m, Materials: []solver.Material{air{1}, air{1}},
		CurrentDensity: []float64{0, I / (math.Pi * a * a)}}
	s, err := solver.Solve(p, solver.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	want := 4e-7 * math.Pi * I * I / (4 * math.Pi) * (math.Log(b/a) + 0.25)
	fmt.Printf("W = %.3g J/m (formula %.3g J/m)\n", s.Energy(), want)
	// Output:
	// W = 0.00255 J/m (formula 0.00255 J/m)
}

// The flux density at a point of the solution, found by point location.
func ExampleSolution_At() {
	// Planar unit square at A = 0 all round with a uniform current:
	// the field circulates counter-clockwise about the centre.
	rect := mesh.Polygon{X: []float64{0, 1, 1, 0}, Y: []float64{0, 0, 1, 1}, Region: 0}
	in, _ := mesh.BuildInput(nil, rect, mesh.GraphOptions{})
	m, _ := mesh.Triangulate(in, mesh.Options{Order: 2, Size: mesh.SizeField{Global: 0.05}})
	p := &solver.Problem{Mesh: m, Materials: []solver.Material{air{1}}, CurrentDensity: []float64{1e6}}
	s, _ := solver.Solve(p, solver.Options{})
	_, bx, by, ok := s.At(0.75, 0.5) // right of the centre: B points up
	fmt.Printf("ok=%v Bx≈0: %v By>0: %v\n", ok, math.Abs(bx) < 1e-3*math.Abs(by), by > 0)
	_, _, _, ok = s.At(2, 2)
	fmt.Println("outside:", ok)
	// Output:
	// ok=true Bx≈0: true By>0: true
	// outside: false
}

// An excitation sweep: the prepared problem keeps its numbering, pattern
// and symbolic factorization; only the coil current changes between solves.
func ExamplePrepared_Solve() {
	m, err := cCoreMesh()
	if err != nil {
		fmt.Println(err)
		return
	}
	p := &solver.Problem{
		Mesh:           m,
		Materials:      []solver.Material{air{1}, air{1e6}, air{1}, air{1}},
		CurrentDensity: make([]float64, 4),
	}
	pr, err := solver.Prepare(p, solver.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, NI := range []float64{250, 500, 1000} {
		J := NI / (0.02 * 0.08)
		p.CurrentDensity[2], p.CurrentDensity[3] = J, -J
		s, err := pr.Solve(solver.Options{})
		if err != nil {
			fmt.Println(err)
			return
		}
		_, _, by, _ := s.At(0.175, 0.1)
		fmt.Printf("NI = %4.0f A: B = %.3f T\n", NI, by)
	}
	// Output:
	// NI =  250 A: B = 0.157 T
	// NI =  500 A: B = 0.314 T
	// NI = 1000 A: B = 0.628 T
}
