package mesh

import (
	"errors"
	"testing"
)

// twoTri is the unit square split along (0,0)-(1,1): a valid mesh whose
// diagonal is constrained-Delaunay (the four corners are cocircular, so
// InCircle is exactly 0 across it).
func twoTri() *Mesh {
	return &Mesh{
		X: []float64{0, 1, 1, 0}, Y: []float64{0, 0, 1, 1}, NumVertices: 4,
		Tri:        []int32{0, 1, 2, 0, 2, 3},
		Nbr:        []int32{-1, 1, -1, -1, -1, 0},
		EdgeMarker: []int32{1, 0, 1, 1, 1, 0},
		Region:     []int32{0, 0},
	}
}

// TestCheckDetects breaks one invariant at a time and expects Check to name
// it, so that the Check run at the end of every test can actually fail.
func TestCheckDetects(t *testing.T) {
	if err := twoTri().Check(CheckOptions{MinAngle: 28, RegionAreas: map[int32]float64{0: 1}}); err != nil {
		t.Fatalf("valid mesh: %v", err)
	}
	for _, c := range []struct {
		name    string
		breakIt func(m *Mesh)
		opt     CheckOptions
		want    string
	}{
		{"index", func(m *Mesh) { m.Tri[0] = 7 }, CheckOptions{}, "index"},
		{"lengths", func(m *Mesh) { m.Region = m.Region[:1] }, CheckOptions{}, "index"},
		{"clockwise", func(m *Mesh) { m.Tri[1], m.Tri[2] = m.Tri[2], m.Tri[1] }, CheckOptions{}, "area"},
		{"twin", func(m *Mesh) { m.Nbr[5] = -1; m.EdgeMarker[5] = 3 }, CheckOptions{}, "twin"},
		{"marker", func(m *Mesh) { m.EdgeMarker[1] = 4 }, CheckOptions{}, "marker"},
		{"boundary marker", func(m *Mesh) { m.EdgeMarker[0] = 0 }, CheckOptions{}, "marker"},
		{"delaunay", func(m *Mesh) { m.X[3], m.Y[3] = 0.2, 0.8 }, CheckOptions{}, "delaunay"},
		{"angle", func(m *Mesh) {}, CheckOptions{MinAngle: 46}, "angle"},
		{"region area", func(m *Mesh) {}, CheckOptions{RegionAreas: map[int32]float64{0: 1 + 1e-8}}, "region-area"},
		{"missing region", func(m *Mesh) { m.Region[1] = 5 }, CheckOptions{RegionAreas: map[int32]float64{0: 1}}, "region-area"},
	} {
		m := twoTri()
		c.breakIt(m)
		err := m.Check(c.opt)
		var ce *CheckError
		if !errors.As(err, &ce) || ce.Invariant != c.want {
			t.Errorf("%s: got %v, want a %q CheckError", c.name, err, c.want)
		}
	}
}

// TestCheckInputAngle: a triangle whose small angle (5.7 degrees) sits
// between two segment edges is an input angle and passes the 28 degree test.
func TestCheckInputAngle(t *testing.T) {
	m := &Mesh{
		X: []float64{0, 1, 1}, Y: []float64{0, 0, 0.1}, NumVertices: 3,
		Tri: []int32{0, 1, 2}, Nbr: []int32{-1, -1, -1}, EdgeMarker: []int32{1, 1, 1}, Region: []int32{0},
	}
	if err := m.Check(CheckOptions{MinAngle: 28}); err != nil {
		t.Errorf("input angle: %v", err)
	}
}
