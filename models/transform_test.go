package models

import (
	"math"
	"strings"
	"testing"
)

func TestWithGap(t *testing.T) {
	m, err := LoadExample("bench-dipole")
	if err != nil {
		t.Fatal(err)
	}
	g, err := m.WithGap(0, 0.004)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(g.Gap-(m.Gap+0.004)) > 1e-15 {
		t.Errorf("gap %g, want %g", g.Gap, m.Gap+0.004)
	}
	// The original is untouched; the gap region grows by exactly delta
	// times its width (it spans the mid-plane: its area is width × gap).
	r0, _ := m.Region("gap")
	r1, _ := g.Region("gap")
	x0, _, x1, _ := r0.Bounds()
	if d := r1.Area() - r0.Area(); math.Abs(d-0.004*(x1-x0)) > 1e-12 {
		t.Errorf("gap region area grew by %g m², want %g", d, 0.004*(x1-x0))
	}
	if err := g.Check(); err != nil {
		t.Errorf("stretched model fails its check: %v", err)
	}
	if _, err := m.WithGap(0, -m.Gap); err == nil {
		t.Error("closing the gap should be an error")
	}
	m2, _ := LoadExample("bench-dipole")
	if r, _ := m2.Region("gap"); r.Area() != r0.Area() {
		t.Error("WithGap changed the original model")
	}
}

func TestForcesSection(t *testing.T) {
	src := `name: f
geometry: planar
units: mm
depth: 10
regions:
  - {name: a, material: {mu-r: 1000}, polygon: [[0,0],[10,0],[10,10],[0,10]]}
forces:
  pull: {regions: [a]}
`
	src = strings.Replace(src, "material: {mu-r: 1000}", "material: iron", 1)
	src = strings.Replace(src, "regions:\n", "materials:\n  iron: {mu-r: 1000}\nregions:\n", 1)
	m, err := Parse("f.yaml", []byte(src))
	if err != nil {
		t.Fatal(err)
	}
	if len(m.Forces) != 1 || m.Forces[0].Name != "pull" || m.Forces[0].Regions[0] != "a" {
		t.Errorf("forces = %+v", m.Forces)
	}
	_, err = Parse("f.yaml", []byte(strings.Replace(src, "[a]", "[b]", 1)))
	if err == nil || !strings.Contains(err.Error(), `f.yaml:10:`) || !strings.Contains(err.Error(), `no region named "b"`) {
		t.Errorf("unknown region in a force part: %v", err)
	}
}
