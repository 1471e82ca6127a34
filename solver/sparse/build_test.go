package sparse_test

import (
	"bytes"
	"math/rand/v2"
	"testing"

	"polegap/solver/sparse"
)

func TestTripletToCSR(t *testing.T) {
	tr := sparse.NewTriplet(3, 0)
	tr.Add(2, 0, 1)
	tr.Add(0, 0, 2)
	tr.Add(2, 0, 3) // duplicate: summed
	tr.Add(1, 2, 0) // explicit zero: kept
	tr.Add(0, 2, -1)
	a := tr.ToCSR()
	if err := a.Check(); err != nil {
		t.Fatal(err)
	}
	want := [][3]float64{{2, 0, -1}, {0, 0, 0}, {4, 0, 0}}
	for i := 0; i < 3; i++ {
		for j := 0; j < 3; j++ {
			if a.At(i, j) != want[i][j] {
				t.Errorf("At(%d,%d)=%v, want %v", i, j, a.At(i, j), want[i][j])
			}
		}
	}
	if a.NNZ() != 4 || a.Index(1, 2) < 0 || a.Index(1, 1) >= 0 {
		t.Errorf("pattern: nnz=%d Index(1,2)=%d Index(1,1)=%d", a.NNZ(), a.Index(1, 2), a.Index(1, 1))
	}
}

// TestPatternFromElements compares the two-pass builder with a brute-force
// triplet pattern for P1 (3 nodes) and P2-like (6 nodes) connectivities.
func TestPatternFromElements(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for _, npe := range []int{3, 6} {
		for _, n := range []int{1, 10, 300, 30000} {
			ne := n / 2
			el := make([]int32, ne*npe)
			for k := range el {
				el[k] = int32(rng.IntN(n))
			}
			got := sparse.PatternFromElements(n, el, npe)
			if err := got.Check(); err != nil {
				t.Fatalf("npe=%d n=%d: %v", npe, n, err)
			}
			tr := sparse.NewTriplet(n, len(el)*npe+n)
			for i := 0; i < n; i++ {
				tr.Add(i, i, 0)
			}
			for e := 0; e < ne; e++ {
				for _, u := range el[e*npe : (e+1)*npe] {
					for _, v := range el[e*npe : (e+1)*npe] {
						tr.Add(int(u), int(v), 0)
					}
				}
			}
			want := tr.ToCSR()
			if !equalPattern(got, want) {
				t.Errorf("npe=%d n=%d: pattern differs from brute force (nnz %d vs %d)", npe, n, got.NNZ(), want.NNZ())
			}
			if !got.IsSymmetric(0) || !got.IsStructurallySymmetric() {
				t.Errorf("npe=%d n=%d: pattern not symmetric", npe, n)
			}
		}
	}
}

func equalPattern(a, b *sparse.CSR) bool {
	if a.N != b.N || a.NNZ() != b.NNZ() {
		return false
	}
	for i := range a.RowPtr {
		if a.RowPtr[i] != b.RowPtr[i] {
			return false
		}
	}
	for k := range a.Col {
		if a.Col[k] != b.Col[k] {
			return false
		}
	}
	return true
}

func TestMulVecToDiagSubmatrix(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for _, n := range []int{1, 7, 50000} {
		a := randomSPD(n, 4, rng)
		x := make([]float64, n)
		for i := range x {
			x[i] = rng.NormFloat64()
		}
		y := make([]float64, n)
		a.MulVecTo(y, x)
		for i := 0; i < n; i += 1 + n/100 {
			s := 0.0
			for j := 0; j < n; j++ {
				if k := a.Index(i, j); k >= 0 {
					s += a.Val[k] * x[j]
				}
			}
			// Same products, possibly summed in the same order: equal up to
			// a few ulps of the row's absolute sum.
			if d := abs(s - y[i]); d > 1e-13*(1+abs(s)) {
				t.Errorf("n=%d row %d: MulVecTo %v, want %v", n, i, y[i], s)
			}
		}
		d := a.Diag()
		for i := 0; i < n; i++ {
			if d[i] != a.At(i, i) {
				t.Fatalf("n=%d: Diag[%d]=%v, want %v", n, i, d[i], a.At(i, i))
			}
		}
		if !a.IsSymmetric(0) {
			t.Errorf("n=%d: random SPD not symmetric", n)
		}
		c := a.Clone()
		c.Zero()
		if a.Val[0] == 0 || c.Val[0] != 0 {
			t.Errorf("n=%d: Clone shares values or Zero failed", n)
		}
	}
	// Submatrix keeps rows 0, 2 of a 3x3 matrix.
	tr := sparse.NewTriplet(3, 9)
	for i := 0; i < 3; i++ {
		for j := 0; j < 3; j++ {
			tr.Add(i, j, float64(10*i+j))
		}
	}
	s, old := tr.ToCSR().Submatrix([]bool{true, false, true})
	if s.N != 2 || old[0] != 0 || old[1] != 2 || s.At(0, 1) != 2 || s.At(1, 0) != 20 || s.At(1, 1) != 22 {
		t.Errorf("Submatrix: N=%d old=%v entries %v %v %v", s.N, old, s.At(0, 1), s.At(1, 0), s.At(1, 1))
	}
	if err := s.Check(); err != nil {
		t.Error(err)
	}
}

func TestCheckRejects(t *testing.T) {
	bad := []*sparse.CSR{
		{N: 2, RowPtr: []int{0, 1}, Col: []int32{0}, Val: []float64{1}},
		{N: 1, RowPtr: []int{0, 2}, Col: []int32{0, 0}, Val: []float64{1, 1}},
		{N: 1, RowPtr: []int{0, 1}, Col: []int32{3}, Val: []float64{1}},
		{N: 1, RowPtr: []int{0, 1}, Col: []int32{0}, Val: []float64{nan()}},
	}
	for k, a := range bad {
		if a.Check() == nil {
			t.Errorf("case %d: Check accepted a malformed CSR", k)
		}
	}
}

// TestMatrixMarketRoundTrip writes and reads back a matrix; values print
// with the shortest exact representation, so the round trip is exact.
func TestMatrixMarketRoundTrip(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for _, a := range []*sparse.CSR{randomSPD(40, 3, rng), gridSystem(9, 0.3), {N: 0, RowPtr: []int{0}}} {
		var buf bytes.Buffer
		if err := sparse.WriteMatrixMarket(&buf, a); err != nil {
			t.Fatal(err)
		}
		b, err := sparse.ReadMatrixMarket(&buf)
		if err != nil {
			t.Fatal(err)
		}
		if !equalPattern(a, b) {
			t.Fatalf("n=%d: pattern changed in round trip", a.N)
		}
		for k := range a.Val {
			if a.Val[k] != b.Val[k] {
				t.Fatalf("n=%d: value %d changed: %v -> %v", a.N, k, a.Val[k], b.Val[k])
			}
		}
	}
	for _, in := range []string{
		"",
		"%%MatrixMarket matrix array real general\n1 1\n1\n",
		"%%MatrixMarket matrix coordinate real symmetric\n2 2 1\n1 2 3\n",
		"%%MatrixMarket matrix coordinate real general\n2 2 2\n1 1 3\n",
		"%%MatrixMarket matrix coordinate real general\n2 3 0\n",
	} {
		if _, err := sparse.ReadMatrixMarket(bytes.NewBufferString(in)); err == nil {
			t.Errorf("ReadMatrixMarket accepted %q", in)
		}
	}
}

func TestIsStructurallySymmetric(t *testing.T) {
	cases := []struct {
		entries [][2]int
		want    bool
	}{
		{nil, true},
		{[][2]int{{0, 0}, {1, 1}, {2, 2}}, true},
		{[][2]int{{0, 2}, {2, 0}, {1, 2}, {2, 1}}, true},
		{[][2]int{{0, 2}}, false},
		{[][2]int{{2, 0}}, false},
		{[][2]int{{0, 1}, {1, 0}, {0, 2}, {2, 1}}, false},
		{[][2]int{{1, 0}, {1, 2}, {0, 1}}, false},
	}
	for k, c := range cases {
		tr := sparse.NewTriplet(3, len(c.entries))
		for _, e := range c.entries {
			tr.Add(e[0], e[1], 1)
		}
		a := tr.ToCSR()
		if got := a.IsStructurallySymmetric(); got != c.want {
			t.Errorf("case %d %v: got %v, want %v", k, c.entries, got, c.want)
		}
		if got := a.IsSymmetric(0); got != c.want {
			t.Errorf("case %d %v: IsSymmetric %v, want %v", k, c.entries, got, c.want)
		}
	}
}
