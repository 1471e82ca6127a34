package probes

import (
	"math"
	"testing"

	"polegap/mesh"
)

type zeroField struct{}

func (zeroField) At(x, y float64) (a, bx, by float64, ok bool) { return 0, 0, 0, true }

// twoRegions meshes the unit square split at x = 0.5 into regions 1 and 2.
func twoRegions(t *testing.T) *mesh.Mesh {
	t.Helper()
	in := &mesh.Input{
		X:        []float64{0, 0.5, 1, 1, 0.5, 0},
		Y:        []float64{0, 0, 0, 1, 1, 1},
		Segments: []int32{0, 1, 1, 2, 2, 3, 3, 4, 4, 5, 5, 0, 1, 4},
		Markers:  []int32{1, 1, 1, 1, 1, 1, 2},
		Seeds:    []mesh.Seed{{X: 0.25, Y: 0.5, Region: 1}, {X: 0.75, Y: 0.5, Region: 2}},
	}
	m, err := mesh.Triangulate(in, mesh.Options{Size: mesh.SizeField{Global: 0.1}})
	if err != nil {
		t.Fatal(err)
	}
	return m
}

// TestRecoveredAverages: the recovered field at a point is the linear
// interpolation of its triangle's corner values, each the area-weighted
// mean of the flux density over the same-region triangles around the
// corner (computed here by brute force over all triangles); a field that
// is constant in each region is reproduced exactly, up to the interface.
func TestRecoveredAverages(t *testing.T) {
	m := twoRegions(t)
	nt := m.NumTriangles()
	b := make([][2]float64, nt)
	area := func(u int) float64 {
		a, bb, c := m.Tri[3*u], m.Tri[3*u+1], m.Tri[3*u+2]
		return 0.5 * ((m.X[bb]-m.X[a])*(m.Y[c]-m.Y[a]) - (m.X[c]-m.X[a])*(m.Y[bb]-m.Y[a]))
	}
	for u := range b {
		b[u] = [2]float64{math.Sin(float64(u)), float64(m.Region[u])}
	}
	loc := mesh.NewLocator(m)
	r := NewRecovered(zeroField{}, NewPatches(m), b, loc)
	for _, p := range [][2]float64{{0.13, 0.27}, {0.71, 0.55}, {0.49, 0.9}, {0.95, 0.05}} {
		tri, b0, b1, b2, ok := loc.Find(p[0], p[1])
		if !ok {
			t.Fatalf("point %v not found", p)
		}
		var want [2]float64
		for k, w := range []float64{b0, b1, b2} {
			v := m.Tri[3*int(tri)+k]
			var sx, sy, sw float64
			for u := 0; u < nt; u++ {
				if m.Region[u] != m.Region[tri] {
					continue
				}
				if m.Tri[3*u] == v || m.Tri[3*u+1] == v || m.Tri[3*u+2] == v {
					sx += area(u) * b[u][0]
					sy += area(u) * b[u][1]
					sw += area(u)
				}
			}
			want[0] += w * sx / sw
			want[1] += w * sy / sw
		}
		_, bx, by, ok := r.At(p[0], p[1])
		if !ok || math.Abs(bx-want[0]) > 1e-12 || math.Abs(by-want[1]) > 1e-12 {
			t.Errorf("At%v = (%g, %g), want (%g, %g)", p, bx, by, want[0], want[1])
		}
		// By is the region tag in every triangle: constant per region, so
		// recovered exactly even beside the interface.
		if math.Abs(by-float64(m.Region[tri])) > 1e-12 {
			t.Errorf("At%v: By %g, want the region's %d", p, by, m.Region[tri])
		}
	}
}
