package mesh

import (
	"fmt"
	"math"
	"testing"
)

// BenchmarkTriangulate meshes the unit square with a global size chosen for
// about 10k, 100k and 1M quality (28 degree) triangles, and the C-core test
// yoke (cCore) at about 100k triangles. Figures to reach (DESIGN.md):
// 100,000 triangles in 0.25 s and 1,000,000 in 2 s on the 2-core machine.
func BenchmarkTriangulate(b *testing.B) {
	for _, n := range []int{10_000, 100_000, 1_000_000} {
		h := 0.05 * math.Sqrt(2008/float64(n))
		in := polyInput(boxPoly(0, 0, 1, 1))
		b.Run(fmt.Sprintf("square-%dk", n/1000), func(b *testing.B) {
			benchTriangulate(b, in, Options{Size: SizeField{Global: h}})
		})
	}
	yoke, box, wire, seeds, _ := cCore(1, 0.002)
	in := polyInput(box, yoke, wire)
	in.Seeds = seeds
	b.Run("c-core-100k", func(b *testing.B) {
		benchTriangulate(b, in, Options{Size: SizeField{Global: 0.0027, Lines: []SizeLine{{0.16, 0.08, 0.2, 0.08, 0.0005}}}})
	})
}

func benchTriangulate(b *testing.B, in *Input, opt Options) {
	b.ReportAllocs()
	nt := 0
	cpu0 := cpuSeconds()
	for i := 0; i < b.N; i++ {
		m, err := Triangulate(in, opt)
		if err != nil {
			b.Fatal(err)
		}
		nt = m.NumTriangles()
	}
	b.ReportMetric(float64(nt), "triangles")
	b.ReportMetric(float64(nt)*float64(b.N)/b.Elapsed().Seconds(), "triangles/s")
	// CPU seconds per run (all threads, GC included): on a loaded shared
	// machine this is the steadier figure.
	b.ReportMetric((cpuSeconds()-cpu0)/float64(b.N), "cpu-s/op")
}

// BenchmarkCDT measures the constrained Delaunay triangulation of 100k
// random points, and of 1,600 circles of 64 segments each (102,400
// segments), without refinement.
func BenchmarkCDT(b *testing.B) {
	var polys [][]float64
	polys = append(polys, boxPoly(-1, -1, 41, 41))
	for i := 0; i < 40; i++ {
		for j := 0; j < 40; j++ {
			polys = append(polys, circlePoly(float64(i)+0.5, float64(j)+0.5, 0.4, 64))
		}
	}
	b.Run("segments-102k", func(b *testing.B) { benchTriangulate(b, polyInput(polys...), Options{MinAngle: -1}) })
	b.Run("points-100k", func(b *testing.B) { benchCDTPoints(b) })
}

func benchCDTPoints(b *testing.B) {
	in := &Input{}
	s := uint64(1)
	for i := 0; i < 100_000; i++ {
		s = s*6364136223846793005 + 1442695040888963407
		in.X = append(in.X, float64(s>>11)/(1<<53))
		s = s*6364136223846793005 + 1442695040888963407
		in.Y = append(in.Y, float64(s>>11)/(1<<53))
	}
	benchTriangulate(b, in, Options{MinAngle: -1})
}
