package sparse_test

import (
	"math/rand/v2"
	"testing"

	"polegap/solver/sparse"
)

var orderings = []sparse.Ordering{sparse.DefaultOrdering, sparse.Natural, sparse.NestedDissection, sparse.AMD}

// blockDiag joins matrices into one block-diagonal matrix (a disconnected
// graph).
func blockDiag(ms ...*sparse.CSR) *sparse.CSR {
	n := 0
	for _, m := range ms {
		n += m.N
	}
	t := sparse.NewTriplet(n, 0)
	off := 0
	for _, m := range ms {
		for i := 0; i < m.N; i++ {
			for k := m.RowPtr[i]; k < m.RowPtr[i+1]; k++ {
				t.Add(off+i, off+int(m.Col[k]), m.Val[k])
			}
		}
		off += m.N
	}
	return t.ToCSR()
}

func TestOrderIsPermutation(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	mats := map[string]*sparse.CSR{
		"empty":    {N: 0, RowPtr: []int{0}},
		"grid30":   gridSystem(30, 0.3),
		"random":   randomSPD(500, 3, rng),
		"disjoint": blockDiag(gridSystem(12, 0), randomSPD(40, 1, rng), gridSystem(20, 0.2)),
		"diagonal": blockDiag(randomSPD(1, 0, rng), randomSPD(1, 0, rng), randomSPD(1, 0, rng)),
	}
	for name, a := range mats {
		for _, o := range orderings {
			p := sparse.Order(a, o)
			if len(p) != a.N || !sparse.IsPermutation(p) {
				t.Errorf("%s/%v: not a permutation of 0..%d", name, o, a.N-1)
			}
		}
	}
}

// TestOrderingFill checks that the fill-reducing orderings beat the natural
// (row-by-row, banded) numbering on a 2D grid by a wide margin. Theory
// (A. George, "Nested dissection of a regular finite element mesh", SIAM J.
// Numer. Anal. 1973): banded fill grows like n^1.5 and flops like n^2,
// nested dissection like n log n and n^1.5, so at n = 99^2 the ratios are
// already several-fold; we assert at least 2.5x fewer entries and 3x
// fewer flops (bounds set below the values measured at this size, which
// grow with n).
func TestOrderingFill(t *testing.T) {
	a := gridSystem(100, 0.3)
	nat := &sparse.Cholesky{Options: sparse.CholeskyOptions{Ordering: sparse.Natural}}
	nat.Analyze(a)
	for _, o := range []sparse.Ordering{sparse.DefaultOrdering, sparse.NestedDissection, sparse.AMD} {
		ch := &sparse.Cholesky{Options: sparse.CholeskyOptions{Ordering: o}}
		ch.Analyze(a)
		if 2.5*float64(ch.NNZL()) > float64(nat.NNZL()) {
			t.Errorf("%v: nnz(L)=%d, natural %d: want at least 2.5x fewer", o, ch.NNZL(), nat.NNZL())
		}
		if 3*ch.Flops() > nat.Flops() {
			t.Errorf("%v: flops %.3g, natural %.3g: want at least 3x fewer", o, ch.Flops(), nat.Flops())
		}
		t.Logf("%v: nnz(L)=%d (natural %d) flops %.3g (natural %.3g)", o, ch.NNZL(), nat.NNZL(), ch.Flops(), nat.Flops())
	}
}
