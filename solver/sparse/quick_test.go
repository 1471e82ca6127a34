package sparse_test

import (
	"math"
	"testing"

	"polegap/solver/sparse"
)

func TestQuickGrid(t *testing.T) {
	for _, o := range []sparse.Ordering{sparse.Natural, sparse.NestedDissection} {
		a := gridSystem(60, 0.3)
		ch := &sparse.Cholesky{Options: sparse.CholeskyOptions{Ordering: o}}
		if err := ch.Analyze(a); err != nil {
			t.Fatal(err)
		}
		if err := ch.Factor(a); err != nil {
			t.Fatal(err)
		}
		b := make([]float64, a.N)
		for i := range b {
			b[i] = math.Sin(float64(i))
		}
		x := make([]float64, a.N)
		res, err := ch.SolveTo(x, b)
		t.Log(o, a.N, ch.NNZL(), ch.Flops(), res.Residual, err)
	}
}

func TestQuickPCG(t *testing.T) {
	for _, pc := range []sparse.Preconditioner{sparse.Jacobi, sparse.IC0} {
		a := gridSystem(100, 0.3)
		s := &sparse.PCG{Options: sparse.PCGOptions{Preconditioner: pc}}
		s.Analyze(a)
		if err := s.Factor(a); err != nil {
			t.Fatal(err)
		}
		b := make([]float64, a.N)
		for i := range b {
			b[i] = math.Sin(float64(i))
		}
		x := make([]float64, a.N)
		res, err := s.SolveTo(x, b)
		t.Log(pc, a.N, res.Iterations, res.Residual, res.Status, err)
	}
}
