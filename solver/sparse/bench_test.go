package sparse_test

import (
	"fmt"
	"math"
	"os"
	"sync"
	"syscall"
	"testing"
	"time"

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

// TestTimingTable prints the phase timings behind the doc.go figures
// (go test -run TimingTable -timing -v ./solver/sparse).
func TestTimingTable(t *testing.T) {
	if !*timing {
		t.Skip("timing table only with -timing")
	}
	fmt.Printf("%-9s %-17s %11s %9s %9s %9s %9s %9s %9s %8s\n", "n", "method", "nnz(L)", "madds", "analyze", "factor", "solve", "total", "cpu", "iters")
	for _, nx := range benchSizes {
		a := benchMatrix(nx)
		rhs := benchRHS(a.N)
		x := make([]float64, a.N)
		for _, o := range []sparse.Ordering{sparse.NestedDissection, sparse.AMD} {
			ch := &sparse.Cholesky{Options: sparse.CholeskyOptions{Ordering: o}}
			c0 := cpuSeconds()
			t0 := time.Now()
			ch.Analyze(a)
			t1 := time.Now()
			if err := ch.Factor(a); err != nil {
				t.Fatal(err)
			}
			t2 := time.Now()
			if _, err := ch.SolveTo(x, rhs); err != nil {
				t.Fatal(err)
			}
			t3 := time.Now()
			fmt.Printf("%-9d %-17s %11d %9.3g %9.3f %9.3f %9.3f %9.3f %9.3f %8s\n", a.N, "cholesky/"+o.String(), ch.NNZL(), ch.Flops(),
				t1.Sub(t0).Seconds(), t2.Sub(t1).Seconds(), t3.Sub(t2).Seconds(), t3.Sub(t0).Seconds(), cpuSeconds()-c0, "-")
		}
		p := &sparse.PCG{}
		c0 := cpuSeconds()
		t0 := time.Now()
		p.Analyze(a)
		t1 := time.Now()
		p.Factor(a)
		t2 := time.Now()
		res, err := p.SolveTo(x, rhs)
		if err != nil {
			t.Fatal(err)
		}
		t3 := time.Now()
		fmt.Printf("%-9d %-17s %11s %9s %9.3f %9.3f %9.3f %9.3f %9.3f %8d\n", a.N, "pcg/ic0", "-", "-",
			t1.Sub(t0).Seconds(), t2.Sub(t1).Seconds(), t3.Sub(t2).Seconds(), t3.Sub(t0).Seconds(), cpuSeconds()-c0, res.Iterations)
	}
}

// cCoreFiles are P1 matrices of the benchmark C-core (graded mesh,
// Dirichlet rows removed) at about 10k, 100k and 1M unknowns, written by
// the solver's benchmark; tests that use them skip when they are absent.
var cCoreFiles = []string{"/tmp/ccore10k.mtx", "/tmp/ccore100k.mtx", "/tmp/ccore1m.mtx"}

func readMTX(path string) (*sparse.CSR, error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	return sparse.ReadMatrixMarket(f)
}

// BenchmarkOrderCCore orders the C-core matrices.
func BenchmarkOrderCCore(b *testing.B) {
	for _, path := range cCoreFiles {
		a, err := readMTX(path)
		if err != nil {
			b.Skip(err)
		}
		for _, o := range []sparse.Ordering{sparse.NestedDissection, sparse.AMD} {
			b.Run(fmt.Sprintf("%v/n=%d", o, a.N), func(b *testing.B) {
				b.ReportAllocs()
				for i := 0; i < b.N; i++ {
					sparse.Order(a, o)
				}
			})
		}
	}
}

// TestOrderingTable prints the figures behind defaultAMDBelow and the
// doc.go ordering table: for each ordering, nnz(L), factor multiply-adds
// and the ordering's wall and CPU time, on the jittered grids and the
// C-core matrices (go test -run OrderingTable -timing -v ./solver/sparse).
func TestOrderingTable(t *testing.T) {
	if !*timing {
		t.Skip("timing table only with -timing")
	}
	type mat struct {
		name string
		a    *sparse.CSR
	}
	var ms []mat
	for _, nx := range []int{71, 101, 173, 317, 548, 1001} {
		ms = append(ms, mat{"grid", benchMatrix(nx)})
	}
	for _, path := range cCoreFiles {
		if a, err := readMTX(path); err == nil {
			ms = append(ms, mat{"c-core", a})
		}
	}
	fmt.Printf("%-7s %8s %-18s %11s %9s %8s %8s\n", "matrix", "n", "ordering", "nnz(L)", "madds", "wall-s", "cpu-s")
	for _, m := range ms {
		for _, o := range []sparse.Ordering{sparse.NestedDissection, sparse.AMD} {
			c0 := cpuSeconds()
			t0 := time.Now()
			p := sparse.Order(m.a, o)
			wall := time.Since(t0).Seconds()
			cpu := cpuSeconds() - c0
			ch := &sparse.Cholesky{Options: sparse.CholeskyOptions{Perm: p}}
			ch.Analyze(m.a)
			fmt.Printf("%-7s %8d %-18s %11d %9.3g %8.3f %8.3f\n", m.name, m.a.N, o, ch.NNZL(), ch.Flops(), wall, cpu)
		}
	}
}
