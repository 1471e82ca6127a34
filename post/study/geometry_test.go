package study_test

import (
	"strings"
	"testing"

	"polegap/models"
	"polegap/post/study"
)

// boxModel is a 100 mm × 50 mm planar model (a steel bar and a coil) with
// the given boundary mapping and a probe at (50, 60) mm.
func boxModel(t *testing.T, boundary string) (*models.Model, error) {
	t.Helper()
	src := `units: mm
depth: 100
regions:
  - {name: core, material: steel, polygon: [[0, 0], [100, 0], [100, 20], [0, 20]]}
  - {name: coil, material: copper, polygon: [[0, 30], [40, 30], [40, 50], [0, 50]]}
materials:
  steel: {mu-r: 1000}
coils:
  - {name: main, turns: 100, current: 2, sides: [{region: coil, sense: 1}]}
probes:
  p: {point: [50, 60]}
boundary: ` + boundary + "\n"
	return models.Parse("box.yaml", []byte(src))
}

// TestBoundaryBox checks the outer box of boundary.margins (each side its
// own multiple of the model's largest dimension, 100 mm; unlisted sides
// keep margin), of boundary.box (the corners as given) and of sides beside
// margins, corner by corner (to 1e-15 m: the rounding of mm to m).
func TestBoundaryBox(t *testing.T) {
	for _, c := range []struct {
		boundary       string
		x0, x1, y0, y1 float64 // mm
	}{
		{"{shape: box, margin: 1}", -100, 200, -100, 150},
		{"{margins: {left: 0.5, top: 2}}", -50, 200, -100, 250},
		{"{margin: 0.25, margins: {right: 3}}", -25, 400, -25, 75},
		{"{margins: {top: 0.5}, sides: {bottom: flux-normal}}", -100, 200, 0, 100},
		{"{box: [[-30, -20], [130, 70]]}", -30, 130, -20, 70},
		{"{box: [[0, 0], [130, 70]], sides: {left: flux-normal, bottom: flux-normal}}", 0, 130, 0, 70},
	} {
		m, err := boxModel(t, c.boundary)
		if err != nil {
			t.Fatalf("%s: %v", c.boundary, err)
		}
		b, err := study.Boundary(m)
		if err != nil {
			t.Fatalf("%s: %v", c.boundary, err)
		}
		want := []float64{c.x0 / 1000, c.x1 / 1000, c.x1 / 1000, c.x0 / 1000, c.y0 / 1000, c.y0 / 1000, c.y1 / 1000, c.y1 / 1000}
		got := append(append([]float64(nil), b.X...), b.Y...)
		for i := range want {
			if d := got[i] - want[i]; d > 1e-15 || d < -1e-15 {
				t.Errorf("%s: corners x %v y %v, want x0 %g x1 %g y0 %g y1 %g mm", c.boundary, b.X, b.Y, c.x0, c.x1, c.y0, c.y1)
				break
			}
		}
		// The box meshes and solves (sides keep their markers).
		if _, err := study.Run(m, study.Options{}); err != nil {
			t.Errorf("%s: %v", c.boundary, err)
		}
	}
	// A probe beyond an explicit box is refused at the probe.
	m, err := boxModel(t, "{box: [[-30, -20], [130, 55]]}")
	if err != nil {
		t.Fatal(err)
	}
	_, err = study.Run(m, study.Options{})
	if err == nil || !strings.HasPrefix(err.Error(), `box.yaml:11:3: probes.p: probe "p" reaches (0.05, 0.06) m, outside the model's outer boundary`) {
		t.Errorf("probe outside the box: %v", err)
	}
}

// TestBoundaryBoxAxisymmetric: in an axisymmetric model the box starts on
// the axis whatever the margins, and boundary.box keeps x0 = 0.
func TestBoundaryBoxAxisymmetric(t *testing.T) {
	src := `units: mm
geometry: axisymmetric
regions:
  - {name: coil, material: copper, polygon: [[40, -50], [90, -50], [90, 50], [40, 50]]}
coils:
  - {name: main, turns: 100, current: 2, sides: [{region: coil, sense: 1}]}
boundary: `
	for _, c := range []struct {
		boundary   string
		x1, y0, y1 float64 // mm
	}{
		{"{margins: {right: 2, bottom: 0.5}}", 90 + 200, -50 - 50, 50 + 100},
		{"{box: [[0, -120], [200, 150]]}", 200, -120, 150},
	} {
		m, err := models.Parse("a.yaml", []byte(src+c.boundary+"\n"))
		if err != nil {
			t.Fatalf("%s: %v", c.boundary, err)
		}
		b, err := study.Boundary(m)
		if err != nil {
			t.Fatal(err)
		}
		near := func(a, b float64) bool { return a-b <= 1e-15 && b-a <= 1e-15 } // rounding of mm to m
		if b.X[0] != 0 || b.X[3] != 0 || !near(b.X[1], c.x1/1000) || !near(b.Y[0], c.y0/1000) || !near(b.Y[2], c.y1/1000) {
			t.Errorf("%s: corners x %v y %v, want x 0..%g y %g..%g mm", c.boundary, b.X, b.Y, c.x1, c.y0, c.y1)
		}
	}
}
