package bench

import (
	"context"
	"flag"
	"testing"

	"polegap/models"
	"polegap/post/study"
)

var bench1M = flag.Bool("bench.1m", false, "also run the 1M-node design benchmark (minutes, a few GB)")

// BenchmarkDesign runs the whole measurement of Run on one case per
// sub-benchmark and reports its figures with b.ReportMetric: the same
// numbers `polegap bench` prints (DESIGN.md, "Figures it must reach").
// The 1M-node case runs only with -bench.1m.
func BenchmarkDesign(b *testing.B) {
	cases := Cases([]int{10_000, 100_000, 1_000_000}, 100_000, false, false)
	for _, c := range cases {
		b.Run(c.Name, func(b *testing.B) {
			if c.Nodes >= 1_000_000 && !*bench1M {
				b.Skip("1M nodes: run with -bench.1m")
			}
			var sum Result
			for i := 0; i < b.N; i++ {
				t, err := Run(context.Background(), []Case{c}, Options{})
				if err != nil {
					b.Fatal(err)
				}
				r := t.Results[0]
				sum.Mesh += r.Mesh
				sum.Assemble += r.Assemble
				sum.Analyze += r.Analyze
				sum.Factor += r.Factor
				sum.Solve += r.Solve
				sum.Linear += r.Linear
				sum.PCG += r.PCG
				sum.Nonlinear += r.Nonlinear
				sum.Curve += r.Curve
				sum.BytesPerNode += r.BytesPerNode
				sum.Nodes, sum.Triangles = r.Nodes, r.Triangles
				sum.NewtonIterations, sum.PCGIterations = r.NewtonIterations, r.PCGIterations
				sum.PeakHeap = max(sum.PeakHeap, r.PeakHeap)
			}
			n := float64(b.N)
			b.ReportMetric(float64(sum.Nodes), "nodes")
			b.ReportMetric(float64(sum.Triangles)/(sum.Mesh/n), "triangles/s")
			b.ReportMetric(sum.Mesh/n, "s-mesh")
			b.ReportMetric(sum.Assemble/n, "s-assemble")
			b.ReportMetric(sum.Analyze/n, "s-analyze")
			b.ReportMetric(sum.Factor/n, "s-factor")
			b.ReportMetric(sum.Solve/n, "s-trisolve")
			b.ReportMetric(sum.Linear/n, "s-linear")
			b.ReportMetric(sum.PCG/n, "s-pcg")
			b.ReportMetric(float64(sum.PCGIterations), "pcg-iter")
			b.ReportMetric(sum.Nonlinear/n, "s-nonlinear")
			b.ReportMetric(float64(sum.NewtonIterations), "newton-iter")
			if c.Curve {
				b.ReportMetric(sum.Curve/n, "s-curve20")
			}
			b.ReportMetric(float64(sum.PeakHeap)/(1<<20), "MiB-peak-heap")
			b.ReportMetric(sum.BytesPerNode/n, "B/node-w/o-factor")
		})
	}
}

// BenchmarkLargeInput meshes the large inputs of issue 20: an outline of
// 100,000 vertices (CircleOutline) and 10,000 small regions
// (ManyRegions), from the parsed model to the finished mesh (the model's
// checks, the size estimate, the geometry graph and the mesher).
func BenchmarkLargeInput(b *testing.B) {
	for _, c := range []struct {
		name string
		make func() (*models.Model, error)
	}{
		{"circle-100k", func() (*models.Model, error) { return CircleOutline(100_000) }},
		{"regions-10k", func() (*models.Model, error) { return ManyRegions(100) }},
	} {
		b.Run(c.name, func(b *testing.B) {
			var tri int
			for i := 0; i < b.N; i++ {
				m, err := c.make()
				if err != nil {
					b.Fatal(err)
				}
				d, err := study.Discretize(m)
				if err != nil {
					b.Fatal(err)
				}
				tri = d.Mesh.NumTriangles()
			}
			b.ReportMetric(float64(tri), "triangles")
		})
	}
}
