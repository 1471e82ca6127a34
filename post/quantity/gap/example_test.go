package gap_test

import (
	"fmt"
	"os"

	"polegap/materials"
	"polegap/mesh"
	"polegap/post/quantity/gap"
	"polegap/solver"
)

type mu float64

func (m mu) Nu(float64) (float64, float64) { return 1 / (materials.Mu0 * float64(m)), 0 }

// solveCCore solves a C-shaped yoke (μr 1e4) with a 2 mm gap across its
// right leg (pole faces 50 mm wide at y = 0.099 and 0.101 m) and 1000
// ampere-turns.
func solveCCore() (*solver.Solution, error) {
	rect := func(x0, y0, x1, y1 float64, reg int32) mesh.Polygon {
		return mesh.Polygon{X: []float64{x0, x1, x1, x0}, Y: []float64{y0, y0, y1, y1}, Region: reg}
	}
	yoke := mesh.Polygon{
		X:      []float64{0, 0.2, 0.2, 0.15, 0.15, 0.05, 0.05, 0.15, 0.15, 0.2, 0.2, 0},
		Y:      []float64{0, 0, 0.099, 0.099, 0.05, 0.05, 0.15, 0.15, 0.101, 0.101, 0.2, 0.2},
		Region: 1,
	}
	in, err := mesh.BuildInput([]mesh.Polygon{yoke, rect(0.055, 0.06, 0.075, 0.14, 2), rect(-0.025, 0.06, -0.005, 0.14, 3)},
		rect(-0.2, -0.2, 0.4, 0.4, 0), mesh.GraphOptions{})
	if err != nil {
		return nil, err
	}
	m, err := mesh.Triangulate(in, mesh.Options{Order: 2, Size: mesh.SizeField{
		Global: 0.02, Region: map[int32]float64{1: 0.008},
		Lines:   []mesh.SizeLine{{X0: 0.15, Y0: 0.1, X1: 0.2, Y1: 0.1, Size: 0.001}},
		Grading: 0.25,
	}})
	if err != nil {
		return nil, err
	}
	j := 1000 / (0.02 * 0.08)
	return solver.Solve(&solver.Problem{Mesh: m, Materials: []solver.Material{mu(1), mu(1e4), mu(1), mu(1)},
		CurrentDensity: []float64{0, 0, j, -j}}, solver.Options{})
}

// The gap of a C-core: the mean field over the pole face (exact from the
// potential difference), the uniformity along the mid-plane and the
// fringing across it.
func Example() {
	s, err := solveCCore()
	if err != nil {
		fmt.Println(err)
		return
	}
	// Mean field over the pole face, across the mid-plane y = 0.1 m.
	mean, _ := gap.MeanNormal(s, [2]float64{0.15, 0.1}, [2]float64{0.2, 0.1})
	_, _, b0, _ := s.At(0.175, 0.1)
	fmt.Printf("centre %.4f T, pole-face mean %.4f T\n", b0, mean)

	// Good field along the mid-plane, across the whole pole face.
	ss := gap.ProfileTo(nil, s, [2]float64{0.15, 0.1}, [2]float64{0.2, 0.1}, 501)
	gf, _ := gap.GoodFieldWidths(ss, 0.025, b0, gap.ComponentY, nil)
	for _, g := range gf {
		fmt.Printf("|dB/B0| <= %g within ±%.1f mm (bounded: %v)\n", g.Tol, 1e3*g.HalfWidth(), g.Bounded())
	}

	// Fringing: the mid-plane line from the window to 60 mm beyond the leg.
	fr, _ := gap.Fringing(s, [2]float64{0.12, 0.1}, [2]float64{0.26, 0.1}, b0,
		gap.FringeOptions{Gap: 0.002, PoleWidth: 0.05, AmpereTurns: 1000})
	fmt.Printf("fringing factor %.3f, k per edge %.2f, effective gap %.2f mm\n", fr.Factor, fr.KPerEdge, 1e3*fr.GapEff)
	// Output:
	// centre 0.6106 T, pole-face mean 0.6087 T
	// |dB/B0| <= 0.001 within ±23.2 mm (bounded: true)
	// |dB/B0| <= 0.0001 within ±13.0 mm (bounded: true)
	// fringing factor 1.116, k per edge 1.44, effective gap 2.06 mm
}

// A profile written as CSV; here of the uniform field B = (0, 0.8 T),
// whose potential is A = −0.8 x.
func ExampleWriteCSV() {
	f := uniformField(0.8)
	ss := gap.ProfileTo(nil, f, [2]float64{0, 0.01}, [2]float64{0.02, 0.01}, 3)
	if err := gap.WriteCSV(os.Stdout, ss); err != nil {
		fmt.Println(err)
	}
	phi, _ := gap.Flux(f, [2]float64{0, 0.01}, [2]float64{0.02, 0.01})
	fmt.Printf("flux %.4f Wb/m\n", phi)
	// Output:
	// x_m,y_m,bx_T,by_T,b_T
	// 0,0.01,0,0.8,0.8
	// 0.01,0.01,0,0.8,0.8
	// 0.02,0.01,0,0.8,0.8
	// flux 0.0160 Wb/m
}

// The same profile read as an axisymmetric model's (x, y are r, z): the
// header names r, z, Br and Bz.
func ExampleWriteCSVAxes() {
	ss := gap.ProfileTo(nil, uniformField(0.8), [2]float64{0, 0.01}, [2]float64{0.02, 0.01}, 2)
	if err := gap.WriteCSVAxes(os.Stdout, ss, true); err != nil {
		fmt.Println(err)
	}
	// Output:
	// r_m,z_m,br_T,bz_T,b_T
	// 0,0.01,0,0.8,0.8
	// 0.02,0.01,0,0.8,0.8
}

type uniformField float64

func (b uniformField) At(x, y float64) (a, bx, by float64, ok bool) {
	return -float64(b) * x, 0, float64(b), true
}
