package sparse_test

import (
	"math/rand/v2"
	"slices"
	"testing"

	"polegap/solver/sparse"
)

// TestNDOptions: the zero NDOptions is the documented default (the same
// permutation as the defaults spelled out, and as Order), every setting
// gives a permutation, Parallel does not change it (the random choices are
// seeded by position), and the other settings are not ignored. The grid
// has 20.7k unknowns, above the default Parallel of 20000.
func TestNDOptions(t *testing.T) {
	a := gridSystem(145, 0.3)
	def := sparse.Order(a, sparse.NestedDissection)
	explicit := sparse.NDOptions{Leaf: 400, LeafShare: 1.0 / 256, CoarsenTo: 120, Balance: 0.55,
		Trials: 4, InitPasses: 2, Passes: 4, Parallel: 20000, Visit: sparse.MatchSwapped}
	for _, c := range []struct {
		name string
		opt  sparse.NDOptions
		same bool // the permutation must equal the default one
	}{
		{"zero", sparse.NDOptions{}, true},
		{"explicit defaults", explicit, true},
		{"serial", sparse.NDOptions{Parallel: -1}, true},
		{"parallel from 1", sparse.NDOptions{Parallel: 1}, true},
		{"leaf 50", sparse.NDOptions{Leaf: 50}, false},
		{"no leaf share", sparse.NDOptions{LeafShare: -1}, true}, // 20.7k/256 < 400
		{"leaf share 1/10", sparse.NDOptions{LeafShare: 0.1}, false},
		{"coarsen to 30", sparse.NDOptions{CoarsenTo: 30}, false},
		{"balance 0.7", sparse.NDOptions{Balance: 0.7}, false},
		{"one trial", sparse.NDOptions{Trials: 1}, false},
		{"no initial passes", sparse.NDOptions{InitPasses: -1}, false},
		{"no passes", sparse.NDOptions{Passes: -1}, false},
		{"natural visit", sparse.NDOptions{Visit: sparse.MatchNatural}, false},
		{"shuffled visit", sparse.NDOptions{Visit: sparse.MatchShuffled}, false},
	} {
		p := sparse.OrderND(a, c.opt)
		if !sparse.IsPermutation(p) || len(p) != a.N {
			t.Errorf("%s: not a permutation of 0..%d", c.name, a.N-1)
			continue
		}
		if eq := slices.Equal(p, def); eq != c.same {
			t.Errorf("%s: permutation equal to the default: %v, want %v", c.name, eq, c.same)
		}
	}
	// CholeskyOptions.ND reaches the ordering.
	opt := sparse.NDOptions{Leaf: 50}
	viaOpt := &sparse.Cholesky{Options: sparse.CholeskyOptions{Ordering: sparse.NestedDissection, ND: opt}}
	viaPerm := &sparse.Cholesky{Options: sparse.CholeskyOptions{Perm: sparse.OrderND(a, opt)}}
	viaOpt.Analyze(a)
	viaPerm.Analyze(a)
	if viaOpt.NNZL() != viaPerm.NNZL() || viaOpt.Flops() != viaPerm.Flops() {
		t.Errorf("CholeskyOptions.ND: nnz(L) %d flops %g, want those of OrderND: %d %g",
			viaOpt.NNZL(), viaOpt.Flops(), viaPerm.NNZL(), viaPerm.Flops())
	}
}

// TestSupernodeOptions: with every amalgamation rule off the supernodes
// are fundamental, whose dense blocks hold exactly the entries of L, so
// NNZL equals nnz(L) counted by plain symbolic elimination (the filled
// graph: eliminating vertex k joins its later neighbours; George and Liu,
// "Computer Solution of Large Sparse Positive Definite Systems", 1981,
// ch. 5). Relaxed settings store at least that many (explicit zeros) and the
// zero SupernodeOptions is the documented default. Every setting factors
// to a relative residual of 1e-12 (Cholesky is backward stable; the bound
// of residualTol, conformance_test.go).
func TestSupernodeOptions(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for _, c := range []struct {
		name string
		a    *sparse.CSR
	}{
		{"grid", gridSystem(24, 0.3)},
		{"random", randomSPD(400, 2, rng)},
	} {
		nnz := func(opt sparse.SupernodeOptions) (int, []int32) {
			ch := &sparse.Cholesky{Options: sparse.CholeskyOptions{Ordering: sparse.AMD, Supernodes: opt}}
			ch.Analyze(c.a)
			if err := ch.Factor(c.a); err != nil {
				t.Fatalf("%s: %v", c.name, err)
			}
			b := make([]float64, c.a.N)
			for i := range b {
				b[i] = float64(i%7) - 3
			}
			x := make([]float64, c.a.N)
			if res, err := ch.SolveTo(x, b); err != nil || res.Residual > 1e-12 {
				t.Errorf("%s %+v: residual %g, error %v", c.name, opt, res.Residual, err)
			}
			return ch.NNZL(), slices.Clone(ch.Perm())
		}
		def, _ := nnz(sparse.SupernodeOptions{})
		explicit, _ := nnz(sparse.SupernodeOptions{Always: 8, Zeros16: 0.5, Zeros48: 0.1, ZerosWide: 0.02})
		off, perm := nnz(sparse.SupernodeOptions{Always: -1, Zeros16: -1, Zeros48: -1, ZerosWide: -1})
		wide, _ := nnz(sparse.SupernodeOptions{Always: 32, Zeros16: 0.9, Zeros48: 0.9, ZerosWide: 0.9})
		exact := eliminationNNZ(c.a, perm)
		if off != exact {
			t.Errorf("%s: no amalgamation: NNZL %d, want nnz(L) = %d", c.name, off, exact)
		}
		if explicit != def {
			t.Errorf("%s: explicit defaults give NNZL %d, the zero options %d", c.name, explicit, def)
		}
		if def < exact || wide < exact {
			t.Errorf("%s: NNZL default %d, wide relaxation %d: below nnz(L) = %d", c.name, def, wide, exact)
		}
	}
}

// eliminationNNZ counts the entries of the Cholesky factor of the pattern
// of a under perm (diagonal included) by eliminating vertices one by one
// on a dense boolean matrix (small matrices only).
func eliminationNNZ(a *sparse.CSR, perm []int32) int {
	n := a.N
	inv := make([]int, n)
	for k, v := range perm {
		inv[v] = k
	}
	adj := make([][]bool, n)
	for i := range adj {
		adj[i] = make([]bool, n)
	}
	for i := 0; i < n; i++ {
		for k := a.RowPtr[i]; k < a.RowPtr[i+1]; k++ {
			r, c := inv[i], inv[a.Col[k]]
			adj[r][c], adj[c][r] = true, true
		}
	}
	count := 0
	later := make([]int, 0, n)
	for k := 0; k < n; k++ {
		later = later[:0]
		for j := k + 1; j < n; j++ {
			if adj[k][j] {
				later = append(later, j)
			}
		}
		count += 1 + len(later)
		for _, i := range later {
			for _, j := range later {
				adj[i][j] = true
			}
		}
	}
	return count
}
