package sparse_test

import (
	"errors"
	"fmt"
	"os"
	"slices"
	"strings"

	"polegap/solver/sparse"
)

// A 1D chain of three springs fixed at the left end: the stiffness matrix
// is tridiagonal [2 -1; -1 2 -1; -1 1] and a unit end load gives the
// displacements 1, 2, 3 (each spring carries the full load).
func ExampleCholesky() {
	t := sparse.NewTriplet(3, 7)
	t.Add(0, 0, 2)
	t.Add(1, 1, 2)
	t.Add(2, 2, 1)
	for i := 0; i < 2; i++ {
		t.Add(i, i+1, -1)
		t.Add(i+1, i, -1)
	}
	a := t.ToCSR()
	var ch sparse.Cholesky
	if err := ch.Analyze(a); err != nil {
		panic(err)
	}
	if err := ch.Factor(a); err != nil {
		panic(err)
	}
	x := make([]float64, 3)
	res, err := ch.SolveTo(x, []float64{0, 0, 1})
	fmt.Printf("x = %.6f %.6f %.6f, %v, residual below 1e-15: %v, err %v\n", x[0], x[1], x[2], res.Status, res.Residual < 1e-15, err)
	// Output: x = 1.000000 2.000000 3.000000, converged, residual below 1e-15: true, err <nil>
}

// Factor reports a matrix that is not positive definite with the column
// where the pivot failed.
func ExampleNotPositiveDefiniteError() {
	t := sparse.NewTriplet(2, 4)
	t.Add(0, 0, 1)
	t.Add(0, 1, 2)
	t.Add(1, 0, 2)
	t.Add(1, 1, 1) // eigenvalues 3 and -1
	a := t.ToCSR()
	ch := &sparse.Cholesky{Options: sparse.CholeskyOptions{Ordering: sparse.Natural}}
	ch.Analyze(a)
	err := ch.Factor(a)
	var npd *sparse.NotPositiveDefiniteError
	fmt.Println(errors.As(err, &npd), npd.Column, npd.Pivot)
	// Output: true 1 -3
}

func ExamplePCG() {
	// 1D Laplacian with both ends fixed, 50 unknowns, uniform load.
	n := 50
	t := sparse.NewTriplet(n, 3*n)
	for i := 0; i < n; i++ {
		t.Add(i, i, 2)
		if i > 0 {
			t.Add(i, i-1, -1)
			t.Add(i-1, i, -1)
		}
	}
	a := t.ToCSR()
	b := make([]float64, n)
	for i := range b {
		b[i] = 1
	}
	s := &sparse.PCG{Options: sparse.PCGOptions{Tol: 1e-12, Preconditioner: sparse.Jacobi}}
	s.Analyze(a)
	s.Factor(a)
	x := make([]float64, n)
	res, err := s.SolveTo(x, b)
	// Exact discrete solution x_i = (i+1)(n-i)/2, so the middle value is
	// 25*26/2 = 325.
	fmt.Printf("%v, err %v, x[24] = %.6f, residual <= 1e-12: %v\n", res.Status, err, x[24], res.Residual <= 1e-12)
	// Output: converged, err <nil>, x[24] = 325.000000, residual <= 1e-12: true
}

// Two P1 triangles sharing an edge couple all four nodes except 0 and 3.
func ExamplePatternFromElements() {
	a := sparse.PatternFromElements(4, []int32{0, 1, 2, 1, 3, 2}, 3)
	for i := 0; i < a.N; i++ {
		fmt.Println(i, a.Col[a.RowPtr[i]:a.RowPtr[i+1]])
	}
	// Output:
	// 0 [0 1 2]
	// 1 [0 1 2 3]
	// 2 [0 1 2 3]
	// 3 [1 2 3]
}

func ExampleWriteMatrixMarket() {
	t := sparse.NewTriplet(2, 4)
	t.Add(0, 0, 4)
	t.Add(0, 1, -1)
	t.Add(1, 0, -1)
	t.Add(1, 1, 0.5)
	sparse.WriteMatrixMarket(os.Stdout, t.ToCSR())
	// Output:
	// %%MatrixMarket matrix coordinate real symmetric
	// % written by polegap solver/sparse
	// 2 2 3
	// 1 1 4
	// 2 1 -1
	// 2 2 0.5
}

func ExampleAuto() {
	s := sparse.Auto(100000)
	_, isCholesky := s.(*sparse.Cholesky)
	fmt.Println(isCholesky)
	// Output: true
}

func ExampleTriplet_ToCSR() {
	t := sparse.NewTriplet(2, 3)
	t.Add(0, 0, 1)
	t.Add(0, 0, 2) // duplicates are summed
	t.Add(1, 0, 5)
	a := t.ToCSR()
	fmt.Println(a.NNZ(), a.At(0, 0), a.At(1, 0), a.At(0, 1), a.Index(0, 1))
	// Output: 2 3 5 0 -1
}

// Condensing a Dirichlet node: drop row and column 1.
func ExampleCSR_Submatrix() {
	a := sparse.PatternFromElements(3, []int32{0, 1, 2}, 3)
	for k := range a.Val {
		a.Val[k] = float64(k)
	}
	s, old := a.Submatrix([]bool{true, false, true})
	fmt.Println(s.N, old, s.At(0, 0), s.At(0, 1), s.At(1, 0), s.At(1, 1))
	// Output: 2 [0 2] 0 2 6 8
}

func ExampleOrder() {
	a := sparse.PatternFromElements(5, []int32{0, 1, 2, 2, 3, 4}, 3)
	p := sparse.Order(a, sparse.AMD)
	fmt.Println(len(p), sparse.IsPermutation(p))
	// Output: 5 true
}

func ExampleReadMatrixMarket() {
	in := "%%MatrixMarket matrix coordinate real symmetric\n2 2 2\n1 1 4\n2 1 -1\n"
	a, err := sparse.ReadMatrixMarket(strings.NewReader(in))
	fmt.Println(err, a.N, a.At(0, 1), a.At(1, 0), a.At(1, 1))
	// Output: <nil> 2 -1 -1 0
}

func ExampleNew() {
	s := sparse.New(sparse.PCGKind, 10)
	_, ok := s.(*sparse.PCG)
	fmt.Println(ok)
	// Output: true
}

// OrderND runs the nested dissection under tuning options; the zero
// NDOptions gives the same permutation as Order.
func ExampleOrderND() {
	a := sparse.PatternFromElements(5, []int32{0, 1, 2, 2, 3, 4}, 3)
	p := sparse.OrderND(a, sparse.NDOptions{Leaf: 2, Parallel: -1})
	def := sparse.OrderND(a, sparse.NDOptions{})
	fmt.Println(len(p), sparse.IsPermutation(p), slices.Equal(def, sparse.Order(a, sparse.NestedDissection)))
	// Output: 5 true true
}
