package gap

import (
	"math"
	"testing"

	"polegap/internal/num"
	"polegap/mesh"
	"polegap/solver"
)

// linear is a material of constant relative permeability.
type linear float64

func (l linear) Nu(float64) (float64, float64) { return 1 / (num.Mu0 * float64(l)), 0 }

func rect(x0, y0, x1, y1 float64, reg int32) mesh.Polygon {
	return mesh.Polygon{X: []float64{x0, x1, x1, x0}, Y: []float64{y0, y0, y1, y1}, Region: reg}
}

// cCore solves a C-shaped yoke (μr 1e4) with a 2 mm gap across its right
// leg at y = 0.1 m, x in [0.15, 0.2] m, and 1000 ampere-turns.
func cCore(t testing.TB, order int) *solver.Solution {
	t.Helper()
	yoke := mesh.Polygon{
		X:      []float64{0, 0.2, 0.2, 0.15, 0.15, 0.05, 0.05, 0.15, 0.15, 0.2, 0.2, 0},
		Y:      []float64{0, 0, 0.099, 0.099, 0.05, 0.05, 0.15, 0.15, 0.101, 0.101, 0.2, 0.2},
		Region: 1,
	}
	in, err := mesh.BuildInput([]mesh.Polygon{yoke, rect(0.055, 0.06, 0.075, 0.14, 2), rect(-0.025, 0.06, -0.005, 0.14, 3)},
		rect(-0.2, -0.2, 0.4, 0.4, 0), mesh.GraphOptions{})
	if err != nil {
		t.Fatal(err)
	}
	m, err := mesh.Triangulate(in, mesh.Options{Order: order, Size: mesh.SizeField{
		Global: 0.02, Region: map[int32]float64{1: 0.008},
		Lines:   []mesh.SizeLine{{X0: 0.15, Y0: 0.1, X1: 0.2, Y1: 0.1, Size: 0.001}},
		Grading: 0.25,
	}})
	if err != nil {
		t.Fatal(err)
	}
	j := 1000 / (0.02 * 0.08)
	s, err := solver.Solve(&solver.Problem{Mesh: m, Materials: []solver.Material{linear(1), linear(1e4), linear(1), linear(1)},
		CurrentDensity: []float64{0, 0, j, -j}}, solver.Options{})
	if err != nil {
		t.Fatal(err)
	}
	return s
}

// The flux across the gap mid-plane from the potential difference (exact
// by Stokes' theorem for the discrete field too) against the trapezoid
// integral of the sampled normal field. The trapezoid rule on a function
// that is linear per element with jumps at element edges errs by about
// h_s |jump| / 2 per edge crossed (h_s the sample spacing), a few 1e-5
// relative here (measured: 1.5e-7 with 14001 samples); 1e-5 is asserted.
func TestFluxIdentityCCore(t *testing.T) {
	s := cCore(t, 2)
	p, q := [2]float64{0.12, 0.1}, [2]float64{0.26, 0.1}
	phi, err := Flux(s, p, q)
	if err != nil {
		t.Fatal(err)
	}
	ss := ProfileTo(nil, s, p, q, 14001)
	tr, err := TrapezoidFlux(ss)
	if err != nil {
		t.Fatal(err)
	}
	rel := (tr - phi) / phi
	t.Logf("flux %.6g Wb/m from A, %.6g Wb/m by trapezoid: relative difference %.2g", phi, tr, rel)
	if math.Abs(rel) > 1e-5 {
		t.Errorf("flux identity: A difference %g vs trapezoid %g, relative %g > 1e-5", phi, tr, rel)
	}
	// Fringing: with a 2 mm gap and 50 mm poles the effective width
	// exceeds w (Factor > 1) and the effective gap exceeds g by the iron's
	// small share of NI (μr 1e4 over about 0.6 m of iron: ~3 %).
	_, _, b0, _ := s.At(0.175, 0.1)
	fr, err := Fringing(s, p, q, b0, FringeOptions{Gap: 0.002, PoleWidth: 0.05, AmpereTurns: 1000})
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("B0 %.4f T, fringe %+v", b0, fr)
	if !(fr.Factor > 1 && fr.KPerEdge > 0.2 && fr.KPerEdge < 3) || !(fr.GapEff > 0.002 && fr.GapEff < 0.0022) {
		t.Errorf("fringing out of range: %+v", fr)
	}
}
