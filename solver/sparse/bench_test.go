package sparse_test

import (
	"fmt"
	"math"
	"sync"
	"syscall"
	"testing"

	"polegap/solver/sparse"
)

// benchSizes are grid cell counts per side giving about 10k, 100k and 1M
// unknowns after removing the boundary (P1 on a jittered structured
// triangulation of the unit square, see grid_test.go).
var benchSizes = []int{101, 317, 1001}

var (
	benchMu   sync.Mutex
	benchMats = map[int]*sparse.CSR{}
)

func benchMatrix(nx int) *sparse.CSR {
	benchMu.Lock()
	defer benchMu.Unlock()
	if a, ok := benchMats[nx]; ok {
		return a
	}
	a := gridSystem(nx, 0.3)
	benchMats[nx] = a
	return a
}

func benchRHS(n int) []float64 {
	b := make([]float64, n)
	for i := range b {
		b[i] = math.Sin(float64(i)) + 0.5
	}
	return b
}

// cpuSeconds returns the process's user+system CPU time.
func cpuSeconds() float64 {
	var ru syscall.Rusage
	syscall.Getrusage(syscall.RUSAGE_SELF, &ru)
	return float64(ru.Utime.Sec+ru.Stime.Sec) + float64(ru.Utime.Usec+ru.Stime.Usec)*1e-6
}

func forSizes(b *testing.B, fn func(b *testing.B, a *sparse.CSR)) {
	for _, nx := range benchSizes {
		a := benchMatrix(nx)
		b.Run(fmt.Sprintf("n=%d", a.N), func(b *testing.B) { fn(b, a) })
	}
}

func BenchmarkOrder(b *testing.B) {
	for _, o := range []sparse.Ordering{sparse.NestedDissection, sparse.AMD} {
		b.Run(o.String(), func(b *testing.B) {
			forSizes(b, func(b *testing.B, a *sparse.CSR) {
				b.ReportAllocs()
				for i := 0; i < b.N; i++ {
					sparse.Order(a, o)
				}
			})
		})
	}
}

// BenchmarkAnalyze is ordering plus symbolic factorization.
func BenchmarkAnalyze(b *testing.B) {
	for _, o := range []sparse.Ordering{sparse.NestedDissection, sparse.AMD} {
		b.Run(o.String(), func(b *testing.B) {
			forSizes(b, func(b *testing.B, a *sparse.CSR) {
				b.ReportAllocs()
				ch := &sparse.Cholesky{Options: sparse.CholeskyOptions{Ordering: o}}
				for i := 0; i < b.N; i++ {
					ch.Analyze(a)
				}
				b.ReportMetric(float64(ch.NNZL()), "nnzL")
			})
		})
	}
}

// BenchmarkSymbolic is Analyze with a precomputed nested-dissection
// permutation: elimination tree, column counts, supernodes, structure.
func BenchmarkSymbolic(b *testing.B) {
	forSizes(b, func(b *testing.B, a *sparse.CSR) {
		perm := sparse.Order(a, sparse.NestedDissection)
		ch := &sparse.Cholesky{Options: sparse.CholeskyOptions{Perm: perm}}
		b.ReportAllocs()
		b.ResetTimer()
		for i := 0; i < b.N; i++ {
			ch.Analyze(a)
		}
		b.ReportMetric(float64(ch.NNZL()), "nnzL")
	})
}

func BenchmarkFactor(b *testing.B) {
	for _, o := range []sparse.Ordering{sparse.NestedDissection, sparse.AMD} {
		b.Run(o.String(), func(b *testing.B) {
			forSizes(b, func(b *testing.B, a *sparse.CSR) {
				ch := &sparse.Cholesky{Options: sparse.CholeskyOptions{Ordering: o}}
				ch.Analyze(a)
				b.ReportAllocs()
				b.ResetTimer()
				c0 := cpuSeconds()
				for i := 0; i < b.N; i++ {
					if err := ch.Factor(a); err != nil {
						b.Fatal(err)
					}
				}
				b.ReportMetric(float64(ch.NNZL()), "nnzL")
				b.ReportMetric(ch.Flops(), "madds")
				b.ReportMetric(ch.Flops()*float64(b.N)/b.Elapsed().Seconds()/1e9, "Gmadd/s")
				b.ReportMetric((cpuSeconds()-c0)/float64(b.N), "cpu-s/op")
			})
		})
	}
}

func BenchmarkSolve(b *testing.B) {
	forSizes(b, func(b *testing.B, a *sparse.CSR) {
		ch := &sparse.Cholesky{}
		ch.Analyze(a)
		ch.Factor(a)
		rhs := benchRHS(a.N)
		x := make([]float64, a.N)
		b.ReportAllocs()
		b.ResetTimer()
		for i := 0; i < b.N; i++ {
			ch.SolveTo(x, rhs)
		}
	})
}

// BenchmarkLinearSolve is the whole linear solve for one matrix: Analyze,
// Factor and SolveTo for Cholesky; Analyze, Factor (the preconditioner)
// and SolveTo to 1e-10 for PCG.
func BenchmarkLinearSolve(b *testing.B) {
	kinds := []struct {
		name string
		new  func() sparse.Solver
	}{
		{"cholesky", func() sparse.Solver { return &sparse.Cholesky{} }},
		{"pcg-ic0", func() sparse.Solver { return &sparse.PCG{} }},
	}
	for _, k := range kinds {
		b.Run(k.name, func(b *testing.B) {
			forSizes(b, func(b *testing.B, a *sparse.CSR) {
				rhs := benchRHS(a.N)
				x := make([]float64, a.N)
				b.ReportAllocs()
				b.ResetTimer()
				c0 := cpuSeconds()
				var res sparse.Result
				for i := 0; i < b.N; i++ {
					s := k.new()
					s.Analyze(a)
					if err := s.Factor(a); err != nil {
						b.Fatal(err)
					}
					var err error
					if res, err = s.SolveTo(x, rhs); err != nil {
						b.Fatal(err)
					}
				}
				b.ReportMetric(float64(res.Iterations), "iters")
				b.ReportMetric(res.Residual, "relres")
				b.ReportMetric((cpuSeconds()-c0)/float64(b.N), "cpu-s/op")
			})
		})
	}
}

// BenchmarkOrderGraded orders the P1 patterns of strongly graded meshes
// (gradedPattern: 25.6k and about 100k nodes), the shape of the magnet
// meshes, where nested dissection and AMD differ most.
func BenchmarkOrderGraded(b *testing.B) {
	for _, scale := range []float64{1, 2} {
		a := gradedPattern(b, scale)
		for _, o := range []sparse.Ordering{sparse.NestedDissection, sparse.AMD} {
			b.Run(fmt.Sprintf("%v/n=%d", o, a.N), func(b *testing.B) {
				b.ReportAllocs()
				var p []int32
				for i := 0; i < b.N; i++ {
					p = sparse.Order(a, o)
				}
				ch := &sparse.Cholesky{Options: sparse.CholeskyOptions{Perm: p}}
				ch.Analyze(a)
				b.ReportMetric(ch.Flops(), "madds")
			})
		}
	}
}
