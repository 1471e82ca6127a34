package models

import (
	"strings"
	"testing"
)

// TestParseWith checks that a setting gives the same model as the file
// edited by hand, for a template dimension, a new dimension key and a
// material's curve, and that a path through a list is refused.
func TestParseWith(t *testing.T) {
	data, err := Example("bench-dipole")
	if err != nil {
		t.Fatal(err)
	}
	src := string(data)
	edit := func(old, new string) []byte {
		if !strings.Contains(src, old) {
			t.Fatalf("bench-dipole has no %q", old)
		}
		return []byte(strings.Replace(src, old, new, 1))
	}
	for _, c := range []struct {
		name string
		set  []Setting
		want []byte
	}{
		{"dimension", []Setting{{"dimensions.pole-face-width", "170"}}, edit("pole-face-width: 180", "pole-face-width: 170")},
		{"two", []Setting{{"dimensions.gap", "36"}, {"depth", "250"}}, edit("depth: 300", "depth: 250")},
		{"curve", []Setting{{"materials.yoke-steel.curve", "low-carbon-steel"}}, data},
	} {
		got, err := ParseWith("x.yaml", data, c.set)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		want := c.want
		if c.name == "two" {
			want = []byte(strings.Replace(string(want), "  gap: 40", "  gap: 36", 1))
		}
		ref, err := Parse("x.yaml", want)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		if got.Gap != ref.Gap || got.Depth != ref.Depth || len(got.Regions) != len(ref.Regions) {
			t.Fatalf("%s: gap %g depth %g, want %g %g", c.name, got.Gap, got.Depth, ref.Gap, ref.Depth)
		}
		for i := range ref.Regions {
			a, b := got.Regions[i], ref.Regions[i]
			for k := range b.X {
				if a.X[k] != b.X[k] || a.Y[k] != b.Y[k] {
					t.Fatalf("%s: region %s vertex %d differs", c.name, b.Name, k)
				}
			}
		}
	}
	if _, err := ParseWith("x.yaml", data, []Setting{{"mesh.size.x", "1"}}); err == nil || !strings.Contains(err.Error(), "not a mapping") {
		t.Errorf("a path through a number: %v, want a \"not a mapping\" error", err)
	}
	if _, err := ParseWith("x.yaml", data, []Setting{{"dimensions.pole-width", "-5"}}); err == nil || !strings.Contains(err.Error(), "pole-width") {
		t.Errorf("a negative pole width: %v, want the template's error", err)
	}
}
