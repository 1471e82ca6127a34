package solver

import (
	"fmt"
	"math"
	"syscall"
	"testing"

	"polegap/mesh"
)

// Benchmarks on the C-core of TestIdealCCore, refined to about 10k, 100k
// and 1M nodes. DESIGN.md's figures: a linear planar solve (assembly +
// solve) of 100,000 nodes in 0.5 s and 1,000,000 in 8 s on the 2-core
// machine.

var benchSizes = []struct {
	name  string
	nodes int
}{{"10k", 1e4}, {"100k", 1e5}, {"1M", 1e6}}

var benchMeshes = map[string]*mesh.Mesh{}

// benchCCore returns a C-core mesh with about the given number of nodes.
func benchCCore(order, nodes int) *mesh.Mesh {
	key := fmt.Sprint(order, nodes)
	if m, ok := benchMeshes[key]; ok {
		return m
	}
	count := func(scale float64) int {
		xs, ys := cCoreAxes(scale)
		return (order*(len(xs)-1) + 1) * (order*(len(ys)-1) + 1)
	}
	lo, hi := 0.1, 100.0
	for hi/lo > 1.001 {
		mid := math.Sqrt(lo * hi)
		if count(mid) < nodes {
			lo = mid
		} else {
			hi = mid
		}
	}
	m, _, _ := cCore(order, lo)
	benchMeshes[key] = m
	return m
}

// cpuTime returns the user and system CPU time of the process (s): on a
// shared machine the wall time of a benchmark varies with the load, its
// CPU time much less.
func cpuTime() float64 {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return math.NaN()
	}
	return float64(ru.Utime.Nano()+ru.Stime.Nano()) * 1e-9
}

func benchProblem(m *mesh.Mesh) *Problem {
	J := 1000 / (0.02 * 0.08)
	return &Problem{Mesh: m, Materials: []Material{linear{1}, linear{1000}, linear{1}, linear{1}},
		CurrentDensity: []float64{0, 0, J, -J}}
}

func BenchmarkAssemble(b *testing.B) {
	for _, order := range []int{1, 2} {
		for _, sz := range benchSizes {
			b.Run(fmt.Sprintf("P%d/%s", order, sz.name), func(b *testing.B) {
				m := benchCCore(order, sz.nodes)
				p := benchProblem(m)
				d, err := buildDofMap(p)
				if err != nil {
					b.Fatal(err)
				}
				as := newAssembler(p, d, 0, nil)
				A := make([]float64, m.NumNodes())
				r := make([]float64, d.n)
				b.ReportAllocs()
				b.ResetTimer()
				c0 := cpuTime()
				for i := 0; i < b.N; i++ {
					if err := as.assemble(A, r, true); err != nil {
						b.Fatal(err)
					}
				}
				b.ReportMetric((cpuTime()-c0)/float64(b.N), "cpu-s/op")
				b.ReportMetric(float64(m.NumNodes()), "nodes")
				b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(m.NumNodes()), "ns/node")
			})
		}
	}
}

// BenchmarkAssembleWorkers compares one and two assembly workers (row
// partition) on the 100k-node meshes.
func BenchmarkAssembleWorkers(b *testing.B) {
	for _, order := range []int{1, 2} {
		for _, workers := range []int{1, 2} {
			b.Run(fmt.Sprintf("P%d/100k/workers=%d", order, workers), func(b *testing.B) {
				m := benchCCore(order, 1e5)
				p := benchProblem(m)
				d, err := buildDofMap(p)
				if err != nil {
					b.Fatal(err)
				}
				as := newAssembler(p, d, workers, nil)
				A := make([]float64, m.NumNodes())
				r := make([]float64, d.n)
				b.ReportAllocs()
				b.ResetTimer()
				c0 := cpuTime()
				for i := 0; i < b.N; i++ {
					if err := as.assemble(A, r, true); err != nil {
						b.Fatal(err)
					}
				}
				b.ReportMetric((cpuTime()-c0)/float64(b.N), "cpu-s/op")
			})
		}
	}
}

func BenchmarkSolveLinear(b *testing.B) {
	for _, order := range []int{1, 2} {
		for _, sz := range benchSizes {
			b.Run(fmt.Sprintf("P%d/%s", order, sz.name), func(b *testing.B) {
				m := benchCCore(order, sz.nodes)
				p := benchProblem(m)
				b.ReportAllocs()
				b.ResetTimer()
				var tm Timings
				c0 := cpuTime()
				for i := 0; i < b.N; i++ {
					s, err := Solve(p, Options{})
					if err != nil {
						b.Fatal(err)
					}
					tm = s.Time
				}
				b.ReportMetric((cpuTime()-c0)/float64(b.N), "cpu-s/op")
				b.ReportMetric(float64(m.NumNodes()), "nodes")
				b.ReportMetric(tm.Assemble.Seconds(), "s-assemble")
				b.ReportMetric(tm.Analyze.Seconds(), "s-analyze")
				b.ReportMetric(tm.Factor.Seconds(), "s-factor")
				b.ReportMetric(tm.Solve.Seconds(), "s-solve")
			})
		}
	}
}

// BenchmarkSolveNonlinear: the C-core with saturating iron (the test
// curve of newton_test.go, knee near 0.8 T) at 5000 ampere-turns, Newton to
// relative residual 1e-8. DESIGN.md: 100,000 nodes in 2 s.
func BenchmarkSolveNonlinear(b *testing.B) {
	for _, sz := range benchSizes[:2] {
		b.Run("P1/"+sz.name, func(b *testing.B) {
			m := benchCCore(1, sz.nodes)
			J := 5000 / (0.02 * 0.08)
			p := &Problem{Mesh: m, Materials: []Material{linear{1}, saturating{1000, 1.5}, linear{1}, linear{1}},
				CurrentDensity: []float64{0, 0, J, -J}}
			b.ReportAllocs()
			b.ResetTimer()
			c0 := cpuTime()
			var s *Solution
			for i := 0; i < b.N; i++ {
				var err error
				if s, err = Solve(p, Options{}); err != nil {
					b.Fatal(err)
				}
			}
			b.ReportMetric((cpuTime()-c0)/float64(b.N), "cpu-s/op")
			b.ReportMetric(float64(s.Iterations), "newton-steps")
			b.ReportMetric(float64(m.NumNodes()), "nodes")
		})
	}
}

// BenchmarkPrepare: validation, unknown numbering, sparsity pattern and
// element map (the once-per-mesh setup of Prepare, without the linear
// solver's analysis, which Solve does on first use).
func BenchmarkPrepare(b *testing.B) {
	for _, order := range []int{1, 2} {
		for _, sz := range benchSizes {
			b.Run(fmt.Sprintf("P%d/%s", order, sz.name), func(b *testing.B) {
				m := benchCCore(order, sz.nodes)
				p := benchProblem(m)
				b.ReportAllocs()
				b.ResetTimer()
				c0 := cpuTime()
				for i := 0; i < b.N; i++ {
					if _, err := Prepare(p, Options{}); err != nil {
						b.Fatal(err)
					}
				}
				b.ReportMetric((cpuTime()-c0)/float64(b.N), "cpu-s/op")
				b.ReportMetric(float64(m.NumNodes()), "nodes")
			})
		}
	}
}
