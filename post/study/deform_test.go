package study_test

import (
	"errors"
	"math"
	"testing"

	"polegap/post/internal/fixture"
	"polegap/post/study"
	"polegap/solver"
)

// TestDeformed: a zero weight gives the same co-energy to rounding (the
// same mesh); moving the coil of fixture.Block rigidly with its own nodes
// keeps its area (to rounding, so its current density stays) and the
// mesh's topology; a step larger than the air elements around the coil
// folds one over (*study.FoldError); moving the nodes of the outer
// boundary across it is an error. The deformed study's solves reuse the
// undeformed one's ordering and symbolic analysis.
func TestDeformed(t *testing.T) {
	m := fixture.Block(t, 1000, 5, 2)
	s, err := study.Compile(m)
	if err != nil {
		t.Fatal(err)
	}
	r, err := s.SolveAt(study.Params{}, solver.Options{})
	if err != nil {
		t.Fatal(err)
	}
	_, w0, _ := study.Energies(r.Solution)
	mm := s.Disc.Mesh
	coil := study.Tag(1)
	w := make([]float64, mm.NumVertices)
	same, err := s.Deformed(w, 0, 1e-3)
	if err != nil {
		t.Fatal(err)
	}
	rs, err := same.SolveAt(study.Params{}, solver.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if _, w1, _ := study.Energies(rs.Solution); math.Abs(w1-w0) > 1e-12*w0 {
		t.Errorf("zero weight: W' %.15g J, undeformed %.15g J", w1, w0)
	}
	// The deformed study reuses the solved one's analysis.
	if rs.Solution.Time.Analyze != 0 {
		t.Errorf("deformed study analysed its pattern again (%v)", rs.Solution.Time.Analyze)
	}
	for tr := 0; tr < mm.NumTriangles(); tr++ {
		if mm.Region[tr] == coil {
			for k := 0; k < 3; k++ {
				w[mm.Tri[3*tr+k]] = 1
			}
		}
	}
	moved, err := s.Deformed(w, 0, -1e-3)
	if err != nil {
		t.Fatal(err)
	}
	a0, a1 := mm.RegionAreas()[coil], moved.Disc.Mesh.RegionAreas()[coil]
	if math.Abs(a1-a0) > 1e-12*a0 || moved.Disc.Mesh.NumTriangles() != mm.NumTriangles() {
		t.Errorf("rigid move: coil area %g m² (was %g), %d triangles (was %d)", a1, a0, moved.Disc.Mesh.NumTriangles(), mm.NumTriangles())
	}
	// The coil is 20 mm above the block: moving it 30 mm down folds the
	// air elements between them.
	if _, err := s.Deformed(w, 0, -0.030); !errors.As(err, new(*study.FoldError)) {
		t.Errorf("30 mm down: got %v, want a *study.FoldError", err)
	}
	for v := range w {
		w[v] = 1
	}
	if _, err := s.Deformed(w, 1e-3, 0); err == nil {
		t.Error("moving every node, the boundary with them: no error")
	}
}
