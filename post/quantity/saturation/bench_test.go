package saturation

import (
	"math/rand/v2"
	"testing"

	"polegap/mesh"
)

// BenchmarkAnalyse reports on one region of about 100,000 triangles with
// random flux densities, four corners and two extra levels.
func BenchmarkAnalyse(b *testing.B) {
	sq := mesh.Polygon{X: []float64{0, 1, 1, 0}, Y: []float64{0, 0, 1, 1}, Region: 1}
	in, err := mesh.BuildInput(nil, sq, mesh.GraphOptions{})
	if err != nil {
		b.Fatal(err)
	}
	in.DefaultRegion = 1
	m, err := mesh.Triangulate(in, mesh.Options{Size: mesh.SizeField{Global: 0.0071}})
	if err != nil {
		b.Fatal(err)
	}
	rng := rand.New(rand.NewPCG(1, 1))
	bf := make([][2]float64, m.NumTriangles())
	for i := range bf {
		bf[i] = [2]float64{rng.Float64(), 2 * rng.Float64()}
	}
	regs := []Region{{Tag: 1, Knee: 1.5, Corners: [][2]float64{{0, 0}, {1, 0}, {1, 1}, {0, 1}}, Limit: 2}}
	opt := Options{Levels: []float64{1.6, 1.8}}
	b.Logf("%d triangles", m.NumTriangles())
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Analyse(m, bf, regs, opt); err != nil {
			b.Fatal(err)
		}
	}
}
