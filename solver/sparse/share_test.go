package sparse_test

import (
	"sync"
	"testing"

	"polegap/solver/sparse"
)

// A Cholesky that shares another's analysis (the stiffness matrix of a
// mesh whose nodes moved: same pattern, other values) solves as one with
// an analysis of its own, to rounding, and the two factor and solve
// concurrently without touching each other's factor.
func TestShareAnalysis(t *testing.T) {
	a1 := gridSystem(80, 0.1)
	a2 := gridSystem(80, 0.4) // the same grid with its nodes moved further
	if !equalPattern(a1, a2) {
		t.Fatal("the two systems do not share a pattern")
	}
	b := make([]float64, a1.N)
	for i := range b {
		b[i] = float64(i%7) - 3
	}
	fresh := func(a *sparse.CSR) []float64 {
		var ch sparse.Cholesky
		if err := ch.Analyze(a); err != nil {
			t.Fatal(err)
		}
		if err := ch.Factor(a); err != nil {
			t.Fatal(err)
		}
		x := make([]float64, a.N)
		if _, err := ch.SolveTo(x, b); err != nil {
			t.Fatal(err)
		}
		return x
	}
	want1, want2 := fresh(a1), fresh(a2)

	var src, shared sparse.Cholesky
	if err := src.Analyze(a1); err != nil {
		t.Fatal(err)
	}
	shared.ShareAnalysis(&src)
	x1, x2 := make([]float64, a1.N), make([]float64, a2.N)
	var wg sync.WaitGroup
	errs := make([]error, 2)
	for k, job := range []struct {
		ch *sparse.Cholesky
		a  *sparse.CSR
		x  []float64
	}{{&src, a1, x1}, {&shared, a2, x2}} {
		wg.Add(1)
		go func() {
			defer wg.Done()
			if err := job.ch.Factor(job.a); err != nil {
				errs[k] = err
				return
			}
			_, errs[k] = job.ch.SolveTo(job.x, b)
		}()
	}
	wg.Wait()
	for _, err := range errs {
		if err != nil {
			t.Fatal(err)
		}
	}
	// 1e-12: both are the same factorization up to rounding (the
	// ordering depends on the pattern only, so in fact bit for bit).
	if e := relErr(x2, want2); e > 1e-12 {
		t.Errorf("shared analysis: relative difference %.3g from a fresh one", e)
	}
	if e := relErr(x1, want1); e > 1e-12 {
		t.Errorf("source after a concurrent shared factor: relative difference %.3g", e)
	}
	if shared.NNZL() != src.NNZL() {
		t.Errorf("NNZL %d, source %d", shared.NNZL(), src.NNZL())
	}
}
