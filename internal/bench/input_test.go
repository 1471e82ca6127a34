package bench

import (
	"testing"

	"polegap/mesh"
	"polegap/models"
	"polegap/post/study"
)

// TestLargeInputsSmall meshes small versions of the large inputs (2,000
// vertices, 400 regions): the generators give valid models whose mesh
// passes its checks, with every region present. Not timed.
func TestLargeInputsSmall(t *testing.T) {
	c, err := CircleOutline(2000)
	if err != nil {
		t.Fatal(err)
	}
	r, err := ManyRegions(20)
	if err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		name string
		m    *models.Model
	}{{"circle-2000", c}, {"regions-400", r}} {
		d, err := study.Discretize(tc.m)
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		if err := d.Mesh.Check(mesh.CheckOptions{}); err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		seen := map[int32]bool{}
		for _, g := range d.Mesh.Region {
			seen[g] = true
		}
		for i := range tc.m.Regions {
			if !seen[study.Tag(i)] {
				t.Errorf("%s: region %d has no triangles", tc.name, i)
			}
		}
	}
}
