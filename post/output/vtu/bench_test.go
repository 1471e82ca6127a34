package vtu

import (
	"io"
	"testing"

	"polegap/mesh"
	"polegap/solver"
)

// BenchmarkWriteVTU writes a first-order solution of about 100,000 nodes
// (air square, iron insert, uniform boundary field) to io.Discard.
func BenchmarkWriteVTU(b *testing.B) {
	sq := func(h float64, reg int32) mesh.Polygon {
		return mesh.Polygon{X: []float64{-h, h, h, -h}, Y: []float64{-h, -h, h, h}, Region: reg}
	}
	in, err := mesh.BuildInput([]mesh.Polygon{sq(0.02, 1)}, sq(0.1, 0), mesh.GraphOptions{})
	if err != nil {
		b.Fatal(err)
	}
	m, err := mesh.Triangulate(in, mesh.Options{Size: mesh.SizeField{Global: 0.00105}})
	if err != nil {
		b.Fatal(err)
	}
	p := &solver.Problem{Mesh: m, Materials: []solver.Material{vacuum{}, soft{}}}
	for i := range m.X {
		if max(m.X[i], -m.X[i], m.Y[i], -m.Y[i]) > 0.1-1e-12 {
			p.Fixed = append(p.Fixed, solver.NodeValue{Node: int32(i), A: 0.5 * m.Y[i]})
		}
	}
	s, err := solver.Solve(p, solver.Options{})
	if err != nil {
		b.Fatal(err)
	}
	b.Logf("%d nodes, %d triangles", m.NumNodes(), m.NumTriangles())
	b.ReportAllocs()
	for b.Loop() {
		if err := WriteVTU(io.Discard, s, Options{}); err != nil {
			b.Fatal(err)
		}
	}
}
