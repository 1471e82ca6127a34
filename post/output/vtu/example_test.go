package vtu_test

import (
	"bytes"
	"fmt"
	"math"
	"strings"

	"polegap/materials"
	"polegap/mesh"
	"polegap/post/output/vtu"
	"polegap/solver"
)

type linear float64

func (l linear) Nu(float64) (float64, float64) { return 1 / (materials.Mu0 * float64(l)), 0 }

// A square of air with an iron insert (μr 1000) in a field held by
// A = 0.5 y on the boundary, written as .vtu.
func ExampleWriteVTU() {
	sq := func(h float64, reg int32) mesh.Polygon {
		return mesh.Polygon{X: []float64{-h, h, h, -h}, Y: []float64{-h, -h, h, h}, Region: reg}
	}
	in, _ := mesh.BuildInput([]mesh.Polygon{sq(0.02, 1)}, sq(0.1, 0), mesh.GraphOptions{})
	m, _ := mesh.Triangulate(in, mesh.Options{Size: mesh.SizeField{Global: 0.02}})
	p := &solver.Problem{Mesh: m, Materials: []solver.Material{linear(1), linear(1000)}}
	for i := range m.X {
		if math.Max(math.Abs(m.X[i]), math.Abs(m.Y[i])) > 0.1-1e-12 {
			p.Fixed = append(p.Fixed, solver.NodeValue{Node: int32(i), A: 0.5 * m.Y[i]})
		}
	}
	s, err := solver.Solve(p, solver.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	var buf bytes.Buffer // a file in real use, written to a temporary name and renamed
	if err := vtu.WriteVTU(&buf, s, vtu.Options{}); err != nil {
		fmt.Println(err)
		return
	}
	for _, line := range strings.Split(buf.String(), "\n") {
		if i := strings.Index(line, `Name="`); i >= 0 && strings.Contains(line, "Data") {
			name := line[i+6:]
			fmt.Print(name[:strings.IndexByte(name, '"')], " ")
		}
	}
	fmt.Println()
	// Output:
	// A region B B_abs H mu_r J connectivity offsets types
}
