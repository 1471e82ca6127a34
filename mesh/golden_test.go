package mesh

import (
	"bytes"
	"fmt"
	"slices"
	"testing"
)

// TestCDTGolden pins the constrained Delaunay triangulation (no refinement)
// of a small graph with a hole, an inner region and a dangling segment. The
// vertices are in general position (no four cocircular), so the CDT is
// unique (Chew, "Constrained Delaunay triangulations", Algorithmica 4, 1989)
// and the golden file changes only if the result is wrong. Canonical form:
// each triangle rotated to start at its smallest vertex, list sorted.
// Run with -update to rewrite.
func TestCDTGolden(t *testing.T) {
	in := polyInput(
		[]float64{0, 0, 3.1, 0.2, 3.3, 2.9, 1.7, 3.4, -0.2, 2.6},
		[]float64{0.9, 0.7, 1.6, 0.8, 1.3, 1.9},
		[]float64{2.1, 1.1, 2.8, 1.4, 2.4, 2.2},
	)
	in.X = append(in.X, 0.4, 1.2, 0.7, 2.2)
	in.Y = append(in.Y, 2.2, 2.75, 0.3, 2.6)
	n := int32(len(in.X))
	in.Segments = append(in.Segments, n-4, n-3)
	in.Markers = append(in.Markers, 9)
	in.Seeds = []Seed{{1.2, 1.1, -1}, {2.4, 1.5, 3}}
	in.DefaultRegion = 1
	m := mustMesh(t, "golden", in, Options{MinAngle: -1}, CheckOptions{})
	type row struct {
		v   [3]int32
		reg int32
		mk  [3]int32
	}
	var rows []row
	for tr := 0; tr < m.NumTriangles(); tr++ {
		r := row{reg: m.Region[tr]}
		s := 0
		for k := 1; k < 3; k++ {
			if m.Tri[3*tr+k] < m.Tri[3*tr+s] {
				s = k
			}
		}
		for k := 0; k < 3; k++ {
			r.v[k] = m.Tri[3*tr+(s+k)%3]
			r.mk[k] = m.EdgeMarker[3*tr+(s+k)%3]
		}
		rows = append(rows, r)
	}
	slices.SortFunc(rows, func(a, b row) int {
		for k := 0; k < 3; k++ {
			if a.v[k] != b.v[k] {
				return int(a.v[k] - b.v[k])
			}
		}
		return 0
	})
	var buf bytes.Buffer
	fmt.Fprintf(&buf, "# CDT golden: vertices x y, then triangles v0 v1 v2 region marker0 marker1 marker2\n")
	fmt.Fprintf(&buf, "vertices %d\n", m.NumVertices)
	for i := 0; i < m.NumVertices; i++ {
		fmt.Fprintf(&buf, "%d %g %g\n", i, m.X[i], m.Y[i])
	}
	fmt.Fprintf(&buf, "triangles %d\n", len(rows))
	for _, r := range rows {
		fmt.Fprintf(&buf, "%d %d %d %d %d %d %d\n", r.v[0], r.v[1], r.v[2], r.reg, r.mk[0], r.mk[1], r.mk[2])
	}
	golden(t, "cdt_golden.txt", buf.Bytes())
}
