package models

import (
	"math"
	"strings"
	"testing"
)

// TestShim checks the pole-edge shims of the c-core and h-core templates:
// each pole gains, and the gap loses, exactly the steps' area (two steps
// of h × w per pole), the model records the shim, and a shim below
// shim-min or one size without the other is refused.
func TestShim(t *testing.T) {
	data, err := Example("bench-dipole")
	if err != nil {
		t.Fatal(err)
	}
	plain, err := Parse("x.yaml", data)
	if err != nil {
		t.Fatal(err)
	}
	const h, w = 0.8e-3, 14e-3 // m: the settings below in mm
	set := []Setting{{"dimensions.shim-height", "0.8"}, {"dimensions.shim-width", "14"}, {"dimensions.shim-min", "0.5"}}
	m, err := ParseWith("x.yaml", data, set)
	if err != nil {
		t.Fatal(err)
	}
	if m.Shim != (Shim{Height: h, Width: w, Min: 0.5e-3}) {
		t.Errorf("shim %+v", m.Shim)
	}
	for _, c := range []struct {
		region string
		change float64
	}{{"upper-pole", 2 * h * w}, {"lower-pole", 2 * h * w}, {"gap", -4 * h * w}} {
		a, _ := plain.Region(c.region)
		b, _ := m.Region(c.region)
		// 1e-15 m²: rounding of areas near 0.03 m² (a few ulps).
		if d := b.Area() - a.Area() - c.change; math.Abs(d) > 1e-15 {
			t.Errorf("%s: area changed by %.6g m², want %.6g", c.region, b.Area()-a.Area(), c.change)
		}
	}
	for _, bad := range [][]Setting{
		{{"dimensions.shim-height", "0.3"}, {"dimensions.shim-width", "14"}, {"dimensions.shim-min", "0.5"}},
		{{"dimensions.shim-height", "0.8"}},
		{{"dimensions.shim-height", "12"}, {"dimensions.shim-width", "14"}},
	} {
		if _, err := ParseWith("x.yaml", data, bad); err == nil || !strings.Contains(err.Error(), "shim") {
			t.Errorf("%v: error %v, want one about the shim", bad, err)
		}
	}
}

// TestShimBevel: a bevel adds half a step's area to each pole edge.
func TestShimBevel(t *testing.T) {
	data, err := Example("bench-dipole")
	if err != nil {
		t.Fatal(err)
	}
	plain, _ := Parse("x.yaml", data)
	m, err := ParseWith("x.yaml", data, []Setting{{"dimensions.shim-height", "0.8"}, {"dimensions.shim-width", "14"}, {"dimensions.shim-shape", "bevel"}})
	if err != nil {
		t.Fatal(err)
	}
	a, _ := plain.Region("upper-pole")
	b, _ := m.Region("upper-pole")
	// Two ramps of 0.8 × 14 mm: 2 × ½ h w; 1e-15 m² as in TestShim.
	if d := b.Area() - a.Area() - 0.8e-3*14e-3; math.Abs(d) > 1e-15 || !m.Shim.Bevel {
		t.Errorf("area change %.6g m², bevel %v", b.Area()-a.Area(), m.Shim.Bevel)
	}
}
