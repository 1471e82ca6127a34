package study_test

import (
	"math"
	"runtime"
	"testing"

	"polegap/models"
	"polegap/post/study"
	"polegap/solver"
	"polegap/solver/sparse"
)

// run solves an embedded example with the given GOMAXPROCS, assembly
// workers and Cholesky workers (0: GOMAXPROCS) and restores GOMAXPROCS.
func run(t *testing.T, name string, procs, workers, factorWorkers int) *study.Result {
	t.Helper()
	old := runtime.GOMAXPROCS(procs)
	defer runtime.GOMAXPROCS(old)
	m, err := models.LoadExample(name)
	if err != nil {
		t.Fatal(err)
	}
	opt := solver.Options{Workers: workers}
	if factorWorkers > 0 {
		opt.Solver = &sparse.Cholesky{Options: sparse.CholeskyOptions{Workers: factorWorkers}}
	}
	s, err := study.Run(m, study.Options{Solver: opt})
	if err != nil {
		t.Fatalf("%s: %v", name, err)
	}
	return s
}

// diff compares two runs: whether mesh, residual history and potential are
// bit-identical, and the largest difference of A relative to max |A|.
func diff(a, b *study.Result) (meshSame, histSame bool, rel float64) {
	ma, mb := a.Disc.Mesh, b.Disc.Mesh
	meshSame = len(ma.X) == len(mb.X) && len(ma.Tri) == len(mb.Tri)
	for i := 0; meshSame && i < len(ma.X); i++ {
		meshSame = math.Float64bits(ma.X[i]) == math.Float64bits(mb.X[i]) && math.Float64bits(ma.Y[i]) == math.Float64bits(mb.Y[i])
	}
	for i := 0; meshSame && i < len(ma.Tri); i++ {
		meshSame = ma.Tri[i] == mb.Tri[i]
	}
	ha, hb := a.Solution.History, b.Solution.History
	histSame = len(ha) == len(hb)
	for i := 0; histSame && i < len(ha); i++ {
		histSame = math.Float64bits(ha[i]) == math.Float64bits(hb[i])
	}
	if !meshSame {
		return meshSame, histSame, math.Inf(1)
	}
	var big, d float64
	for i := range a.Solution.A {
		big = math.Max(big, math.Abs(a.Solution.A[i]))
		d = math.Max(d, math.Abs(a.Solution.A[i]-b.Solution.A[i]))
	}
	if d == 0 {
		return meshSame, histSame, 0
	}
	return meshSame, histSame, d / big
}

// TestDeterminism (issue 7, item 5): the same model gives the same mesh
// and the same vector potential bit for bit run after run; with another
// number of assembly workers the sums at the boundaries of the assembly's
// slabs may be added in another order (within 1e-12 relative).
//
// GOMAXPROCS 1 against 2 is not bit-identical: the sparse Cholesky factor
// uses GOMAXPROCS workers by default and, with two, splits the updates of
// large supernodes between goroutines, which changes the order of
// floating-point sums (solver/sparse doc.go, Concurrency). Measured: A
// differs by 4e-16 to 9e-16 relative to max |A| (bench-dipole,
// calibration-solenoid; each GOMAXPROCS on its own is bit-stable across
// processes). The test holds that difference to the documented
// 1e-12 and shows that pinning the factor's workers to 2 makes GOMAXPROCS 1
// bit-identical to GOMAXPROCS 2 (BAD-INPUT.md, "Determinism").
func TestDeterminism(t *testing.T) {
	examples := []string{"bench-dipole", "calibration-solenoid"}
	if testing.Short() {
		examples = examples[:1]
	}
	for _, name := range examples {
		ref := run(t, name, 2, 0, 0)
		for _, c := range []struct {
			what                          string
			procs, workers, factorWorkers int
			tol                           float64 // max |ΔA|/max |A|; 0: bit-identical
		}{
			{"again, GOMAXPROCS 2", 2, 0, 0, 0},
			// The assembly's slab partition follows the worker count, and
			// the order of sums at slab boundaries with it: measured 4e-16
			// to 1.2e-15 relative (bit-identical on some runs, not all).
			{"GOMAXPROCS 2, 1 assembly worker", 2, 1, 0, 1e-12},
			{"GOMAXPROCS 2, 4 assembly workers", 2, 4, 0, 1e-12},
			{"GOMAXPROCS 1, factor on 2 workers", 1, 0, 2, 0},
			{"GOMAXPROCS 1", 1, 0, 0, 1e-12},
		} {
			s := run(t, name, c.procs, c.workers, c.factorWorkers)
			meshSame, histSame, rel := diff(ref, s)
			t.Logf("%s, %s: mesh identical %v, history identical %v, max |ΔA|/max |A| = %.3g", name, c.what, meshSame, histSame, rel)
			if !meshSame {
				t.Errorf("%s, %s: the mesh differs", name, c.what)
				continue
			}
			if rel > c.tol || (c.tol == 0 && !histSame) {
				t.Errorf("%s, %s: A differs by %.3g relative (history identical %v); allowed %g", name, c.what, rel, histSame, c.tol)
			}
		}
	}
}
