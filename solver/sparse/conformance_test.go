package sparse_test

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/mat"

	"polegap/solver/sparse"
)

// solverCase names a solver constructor for the conformance suite.
type solverCase struct {
	name   string
	new    func() sparse.Solver
	direct bool
}

func solverCases() []solverCase {
	var cs []solverCase
	for _, o := range []sparse.Ordering{sparse.DefaultOrdering, sparse.Natural, sparse.NestedDissection, sparse.AMD} {
		for _, w := range []int{1, 2} {
			o, w := o, w
			cs = append(cs, solverCase{
				name: "cholesky/" + o.String() + map[int]string{1: "/serial", 2: "/parallel"}[w],
				new: func() sparse.Solver {
					return &sparse.Cholesky{Options: sparse.CholeskyOptions{Ordering: o, Workers: w}}
				},
				direct: true,
			})
		}
	}
	for _, p := range []sparse.Preconditioner{sparse.Jacobi, sparse.IC0, sparse.NoPreconditioner} {
		p := p
		cs = append(cs, solverCase{
			name: "pcg/" + p.String(),
			new:  func() sparse.Solver { return &sparse.PCG{Options: sparse.PCGOptions{Preconditioner: p, MaxIter: 5000}} },
		})
	}
	return cs
}

func TestSolvers(t *testing.T) {
	for _, sc := range solverCases() {
		t.Run(sc.name, func(t *testing.T) { testSolver(t, sc) })
	}
}

// relErr returns ||x-y||/||y||.
func relErr(x, y []float64) float64 {
	var d, n float64
	for i := range x {
		d += (x[i] - y[i]) * (x[i] - y[i])
		n += y[i] * y[i]
	}
	if n == 0 {
		return math.Sqrt(d)
	}
	return math.Sqrt(d / n)
}

// solve runs Analyze, Factor and SolveTo and fails the test on error.
func solve(t *testing.T, name string, s sparse.Solver, a *sparse.CSR, b []float64) ([]float64, sparse.Result) {
	t.Helper()
	if err := s.Analyze(a); err != nil {
		t.Fatalf("%s: Analyze: %v", name, err)
	}
	if err := s.Factor(a); err != nil {
		t.Fatalf("%s: Factor: %v", name, err)
	}
	x := make([]float64, a.N)
	res, err := s.SolveTo(x, b)
	if err != nil {
		t.Fatalf("%s: SolveTo: %v", name, err)
	}
	if ch, ok := s.(*sparse.Cholesky); ok {
		if err := ch.Check(); err != nil {
			t.Fatalf("%s: %v", name, err)
		}
	}
	if res.Status != sparse.Converged {
		t.Fatalf("%s: status %v", name, res.Status)
	}
	return x, res
}

// residualTol is the relative residual a solver case must reach: 1e-12
// for the direct solver (Cholesky is backward stable: N. Higham, "Accuracy
// and Stability of Numerical Algorithms", 2002, Thm 10.3, number from
// memory; the growth with n is far below this at these sizes), the PCG
// default tolerance 1e-10 otherwise.
func residualTol(sc solverCase) float64 {
	if sc.direct {
		return 1e-12
	}
	return 1e-10
}

func testSolver(t *testing.T, sc solverCase) {
	rng := rand.New(rand.NewPCG(1, 1))
	tol := residualTol(sc)

	// Random sparse SPD matrices against gonum's dense Cholesky.
	for _, n := range []int{2, 5, 17, 60, 200} {
		a := randomSPD(n, 3, rng)
		b := make([]float64, n)
		for i := range b {
			b[i] = rng.NormFloat64()
		}
		x, res := solve(t, sc.name, sc.new(), a, b)
		if res.Residual > tol {
			t.Errorf("%s random n=%d: residual %.3g > %.3g", sc.name, n, res.Residual, tol)
		}
		d := mat.NewSymDense(n, nil)
		for i := 0; i < n; i++ {
			for j := 0; j < n; j++ {
				d.SetSym(i, j, a.At(i, j))
			}
		}
		var c mat.Cholesky
		if !c.Factorize(d) {
			t.Fatalf("%s random n=%d: dense oracle says not SPD", sc.name, n)
		}
		var want mat.VecDense
		if err := c.SolveVecTo(&want, mat.NewVecDense(n, b)); err != nil {
			t.Fatal(err)
		}
		// Forward error bound ||e||/||x|| <= cond(A) * ||r||/||b||
		// (Golub and Van Loan, Matrix Computations, 4th ed. 2013, §2.6;
		// section number from memory),
		// plus the oracle's own rounding error.
		cond := c.Cond()
		if e := relErr(x, want.RawVector().Data); e > cond*(res.Residual+1e-15) {
			t.Errorf("%s random n=%d: error vs dense %.3g > cond %.3g * residual %.3g", sc.name, n, e, cond, res.Residual)
		}
	}

	// Discrete eigenvector of the 5-point Laplacian. P1 elements on a
	// right-triangle grid give exactly the 5-point stencil (explicit zeros
	// on the diagonal edges), whose eigenvectors are sin(pπx)sin(qπy) with
	// eigenvalues 4 - 2cos(pπh) - 2cos(qπh): R. LeVeque, "Finite Difference
	// Methods for Ordinary and Partial Differential Equations", SIAM 2007,
	// §3.4 (section number from memory; a wrong eigenpair would fail the
	// comparison below).
	for _, nx := range []int{3, 24, 61} {
		a := gridSystem(nx, 0)
		if a.Index(0, nx) < 0 {
			t.Fatalf("%s grid %d: diagonal-edge entry missing from the pattern", sc.name, nx)
		}
		h := 1 / float64(nx)
		p, q := 1.0, 2.0 // modes below the grid's Nyquist limit for every nx here
		lambda := 4 - 2*math.Cos(p*math.Pi*h) - 2*math.Cos(q*math.Pi*h)
		lmin := 4 - 4*math.Cos(math.Pi*h)
		lmax := 4 + 4*math.Cos(math.Pi*h)
		v := make([]float64, a.N)
		b := make([]float64, a.N)
		for j := 1; j < nx; j++ {
			for i := 1; i < nx; i++ {
				k := (j-1)*(nx-1) + (i - 1)
				v[k] = math.Sin(p*math.Pi*float64(i)*h) * math.Sin(q*math.Pi*float64(j)*h)
				b[k] = lambda * v[k]
			}
		}
		x, res := solve(t, sc.name, sc.new(), a, b)
		if res.Residual > tol {
			t.Errorf("%s grid %d: residual %.3g > %.3g", sc.name, nx, res.Residual, tol)
		}
		if e := relErr(x, v); e > lmax/lmin*res.Residual+1e-14 {
			t.Errorf("%s grid %d: eigenvector error %.3g > cond*residual %.3g", sc.name, nx, e, lmax/lmin*res.Residual)
		}
	}

	// Jittered FE matrix, then refactor with new values on the same
	// pattern (A + 2 diag(A)), checked by residual and by a manufactured
	// solution.
	{
		a := gridSystem(40, 0.4)
		s := sc.new()
		xs := make([]float64, a.N)
		for i := range xs {
			xs[i] = rng.NormFloat64()
		}
		b := make([]float64, a.N)
		a.MulVecTo(b, xs)
		_, res := solve(t, sc.name, s, a, b)
		if res.Residual > tol {
			t.Errorf("%s jittered: residual %.3g", sc.name, res.Residual)
		}
		a2 := a.Clone()
		for i := 0; i < a2.N; i++ {
			a2.Val[a2.Index(i, i)] *= 3
		}
		if err := s.Factor(a2); err != nil {
			t.Fatalf("%s refactor: %v", sc.name, err)
		}
		a2.MulVecTo(b, xs)
		x := make([]float64, a.N)
		res, err := s.SolveTo(x, b)
		if err != nil || res.Residual > tol {
			t.Errorf("%s refactor: residual %.3g, err %v", sc.name, res.Residual, err)
		}
	}

	// A disconnected matrix (three blocks, one a single node): a forest
	// of elimination trees.
	{
		a := blockDiag(gridSystem(9, 0.2), randomSPD(1, 0, rng), randomSPD(70, 2, rng))
		b := make([]float64, a.N)
		for i := range b {
			b[i] = rng.NormFloat64()
		}
		_, res := solve(t, sc.name, sc.new(), a, b)
		if res.Residual > tol {
			t.Errorf("%s disconnected: residual %.3g > %.3g", sc.name, res.Residual, tol)
		}
	}

	// Explicit zeros in the pattern (kept by Triplet.ToCSR).
	{
		a0 := randomSPD(30, 2, rng)
		tr := sparse.NewTriplet(30, a0.NNZ()+4)
		for i := 0; i < 30; i++ {
			for k := a0.RowPtr[i]; k < a0.RowPtr[i+1]; k++ {
				tr.Add(i, int(a0.Col[k]), a0.Val[k])
			}
		}
		tr.Add(0, 29, 0)
		tr.Add(29, 0, 0)
		tr.Add(3, 17, 0)
		tr.Add(17, 3, 0)
		a := tr.ToCSR()
		b := make([]float64, 30)
		for i := range b {
			b[i] = float64(i%7) - 3
		}
		_, res := solve(t, sc.name, sc.new(), a, b)
		if res.Residual > tol {
			t.Errorf("%s explicit zeros: residual %.3g", sc.name, res.Residual)
		}
	}

	// Not positive definite: a negative diagonal entry in an otherwise
	// diagonally dominant matrix. The typed error names that column.
	{
		a := randomSPD(40, 2, rng)
		a.Val[a.Index(25, 25)] = -1
		s := sc.new()
		if err := s.Analyze(a); err != nil {
			t.Fatal(err)
		}
		err := s.Factor(a)
		var npd *sparse.NotPositiveDefiniteError
		if !errors.As(err, &npd) {
			t.Errorf("%s indefinite: got %v, want *NotPositiveDefiniteError", sc.name, err)
		} else if sc.direct && npd.Column != 25 {
			t.Errorf("%s indefinite: column %d, want 25", sc.name, npd.Column)
		}
	}

	// A NaN in the right-hand side is reported, never returned as a
	// converged solution.
	{
		a := gridSystem(6, 0)
		b := make([]float64, a.N)
		b[3] = math.NaN()
		s := sc.new()
		s.Analyze(a)
		s.Factor(a)
		res, err := s.SolveTo(make([]float64, a.N), b)
		var nf *sparse.NonFiniteError
		if !errors.As(err, &nf) || res.Status == sparse.Converged {
			t.Errorf("%s NaN rhs: status %v err %v, want *NonFiniteError", sc.name, res.Status, err)
		} else if nf.Index != 3 {
			t.Errorf("%s NaN rhs: index %d, want 3", sc.name, nf.Index)
		}
	}

	// A NaN inside the matrix: Factor or SolveTo fails, never a converged
	// solve.
	{
		a := gridSystem(8, 0.2)
		a.Val[a.Index(10, 11)] = math.NaN()
		a.Val[a.Index(11, 10)] = math.NaN()
		s := sc.new()
		s.Analyze(a)
		if err := s.Factor(a); err == nil {
			b := make([]float64, a.N)
			b[0] = 1
			res, err := s.SolveTo(make([]float64, a.N), b)
			if err == nil || res.Status == sparse.Converged {
				t.Errorf("%s NaN matrix: status %v err %v, want a failure", sc.name, res.Status, err)
			}
		}
	}

	// 1x1 and empty systems.
	{
		a := &sparse.CSR{N: 1, RowPtr: []int{0, 1}, Col: []int32{0}, Val: []float64{4}}
		x, _ := solve(t, sc.name, sc.new(), a, []float64{2})
		if math.Abs(x[0]-0.5) > 1e-15 {
			t.Errorf("%s 1x1: x=%v, want 0.5", sc.name, x[0])
		}
		e := &sparse.CSR{N: 0, RowPtr: []int{0}}
		if x, _ := solve(t, sc.name, sc.new(), e, nil); len(x) != 0 {
			t.Errorf("%s empty: len(x)=%d", sc.name, len(x))
		}
	}
}
