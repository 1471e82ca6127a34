package sparse

import (
	"math"
)

// Preconditioner selects the preconditioner of PCG.
type Preconditioner int

const (
	// DefaultPreconditioner is IC0.
	DefaultPreconditioner Preconditioner = iota
	// Jacobi divides by the diagonal.
	Jacobi
	// IC0 is incomplete Cholesky with the pattern of A's lower triangle.
	IC0
	// NoPreconditioner runs plain conjugate gradients.
	NoPreconditioner
)

func (p Preconditioner) String() string {
	switch p {
	case DefaultPreconditioner:
		return "default"
	case Jacobi:
		return "jacobi"
	case IC0:
		return "ic0"
	case NoPreconditioner:
		return "none"
	}
	return "Preconditioner(?)"
}

// PCGOptions configure a PCG solver. The zero value is ready to use.
type PCGOptions struct {
	// Tol is the relative residual ||b-Ax||/||b|| to reach; 0 means 1e-10.
	Tol float64
	// MaxIter bounds the iterations; 0 means max(100, N).
	MaxIter int
	// Preconditioner is IC0 by default.
	Preconditioner Preconditioner
	// WarmStart uses the incoming x of SolveTo as the initial guess
	// (useful across Newton steps); otherwise the guess is zero.
	WarmStart bool
}

// PCG is the preconditioned conjugate gradient method for SPD matrices.
// Analyze records the pattern, Factor builds the preconditioner for the
// current values, SolveTo iterates. Convergence is declared only after the
// true residual b - A x, recomputed from scratch, meets Tol.
//
// M. Hestenes and E. Stiefel, "Methods of conjugate gradients for solving
// linear systems", J. Res. NBS 49 (1952); preconditioned form as in Y.
// Saad, "Iterative Methods for Sparse Linear Systems", 2nd ed. 2003,
// Algorithm 9.1. IC(0): J. Meijerink and H. van der Vorst, Math. Comp. 31
// (1977); diagonal shift on breakdown: T. Manteuffel, "An incomplete
// factorization technique for positive definite linear systems", Math.
// Comp. 34 (1980).
type PCG struct {
	Options PCGOptions

	n        int
	nnzA     int
	a        *CSR
	analyzed bool
	factored bool

	// IC0 factor: lower triangle by rows, diagonal last in each row.
	lPtr []int
	lCol []int32
	lVal []float64
	lSrc []int // A index of each L entry
	pos  []int32
	// Shift is the relative diagonal shift the last IC0 factorization
	// needed (0 when none).
	shift float64

	dinv          []float64
	r, z, p, q, t []float64
}

// Analyze records the pattern of a and sizes the work vectors.
func (s *PCG) Analyze(a *CSR) error {
	if len(a.RowPtr) != a.N+1 {
		panic(errBadCSR)
	}
	if !a.IsStructurallySymmetric() {
		panic(errUnsymmetric)
	}
	n := a.N
	s.n, s.nnzA = n, a.NNZ()
	s.lPtr = make([]int, n+1)
	cnt := 0
	for i := 0; i < n; i++ {
		for k := a.RowPtr[i]; k < a.RowPtr[i+1] && int(a.Col[k]) <= i; k++ {
			cnt++
		}
		if a.Index(i, i) < 0 {
			cnt++ // missing diagonal: keep a slot, value 0 (breaks down)
		}
		s.lPtr[i+1] = cnt
	}
	s.lCol = make([]int32, cnt)
	s.lVal = make([]float64, cnt)
	s.lSrc = make([]int, cnt)
	p := 0
	for i := 0; i < n; i++ {
		hasDiag := false
		for k := a.RowPtr[i]; k < a.RowPtr[i+1] && int(a.Col[k]) <= i; k++ {
			s.lCol[p], s.lSrc[p] = a.Col[k], k
			hasDiag = hasDiag || int(a.Col[k]) == i
			p++
		}
		if !hasDiag {
			s.lCol[p], s.lSrc[p] = int32(i), -1
			p++
		}
	}
	s.pos = make([]int32, n)
	for i := range s.pos {
		s.pos[i] = -1
	}
	s.dinv = make([]float64, n)
	s.r = make([]float64, n)
	s.z = make([]float64, n)
	s.p = make([]float64, n)
	s.q = make([]float64, n)
	s.t = make([]float64, n)
	s.analyzed, s.factored = true, false
	return nil
}

// Factor builds the preconditioner for the current values of a. A
// non-positive diagonal gives *NotPositiveDefiniteError; an IC0 breakdown
// is retried with growing diagonal shifts.
func (s *PCG) Factor(a *CSR) error {
	if !s.analyzed {
		panic(errNotAnalyzed)
	}
	if a.N != s.n || a.NNZ() != s.nnzA {
		panic(errPattern)
	}
	s.a = a
	s.factored = false
	for i := 0; i < s.n; i++ {
		d := 0.0
		if k := s.lPtr[i+1] - 1; s.lSrc[k] >= 0 {
			d = a.Val[s.lSrc[k]]
		}
		if !(d > 0) || d > maxFinite {
			return &NotPositiveDefiniteError{Column: i, Pivot: d}
		}
		s.dinv[i] = 1 / d
	}
	if s.prec() == IC0 {
		s.shift = 0
		for try := 0; ; try++ {
			row, piv := s.ic0(a, s.shift)
			if row < 0 {
				break
			}
			if try == 12 {
				return &NotPositiveDefiniteError{Column: row, Pivot: piv}
			}
			if s.shift == 0 {
				s.shift = 1e-3
			} else {
				s.shift *= 4
			}
		}
	}
	s.factored = true
	return nil
}

func (s *PCG) prec() Preconditioner {
	if s.Options.Preconditioner == DefaultPreconditioner {
		return IC0
	}
	return s.Options.Preconditioner
}

// Shift returns the relative diagonal shift used by the last IC0 Factor.
func (s *PCG) Shift() float64 { return s.shift }

// ic0 computes the incomplete factor of A + shift*diag(A) on A's lower
// pattern, row by row; it returns the row of the first non-positive pivot
// and that pivot, or -1.
func (s *PCG) ic0(a *CSR, shift float64) (int, float64) {
	lv, lc, pos := s.lVal, s.lCol, s.pos
	for k, src := range s.lSrc {
		if src >= 0 {
			lv[k] = a.Val[src]
		} else {
			lv[k] = 0
		}
	}
	for i := 0; i < s.n; i++ {
		lo, hi := s.lPtr[i], s.lPtr[i+1]-1 // hi: diagonal
		for k := lo; k < hi; k++ {
			pos[lc[k]] = int32(k)
		}
		d := lv[hi] * (1 + shift)
		for k := lo; k < hi; k++ {
			j := lc[k]
			v := lv[k]
			for m := s.lPtr[j]; m < s.lPtr[j+1]-1; m++ {
				if pp := pos[lc[m]]; pp >= 0 && int(pp) < k {
					v -= lv[pp] * lv[m]
				}
			}
			v /= lv[s.lPtr[j+1]-1]
			lv[k] = v
			d -= v * v
		}
		for k := lo; k < hi; k++ {
			pos[lc[k]] = -1
		}
		if !(d > 0) || d > maxFinite {
			return i, d
		}
		lv[hi] = math.Sqrt(d)
	}
	return -1, 0
}

// applyTo sets z = M^{-1} r.
func (s *PCG) applyTo(z, r []float64) {
	switch s.prec() {
	case Jacobi:
		for i, v := range r {
			z[i] = v * s.dinv[i]
		}
	case IC0:
		lv, lc := s.lVal, s.lCol
		for i := 0; i < s.n; i++ {
			v := r[i]
			hi := s.lPtr[i+1] - 1
			for k := s.lPtr[i]; k < hi; k++ {
				v -= lv[k] * z[lc[k]]
			}
			z[i] = v / lv[hi]
		}
		for i := s.n - 1; i >= 0; i-- {
			hi := s.lPtr[i+1] - 1
			v := z[i] / lv[hi]
			z[i] = v
			for k := s.lPtr[i]; k < hi; k++ {
				z[lc[k]] -= lv[k] * v
			}
		}
	default:
		copy(z, r)
	}
}

func dot(x, y []float64) float64 {
	var s0, s1, s2, s3 float64
	n := len(x)
	y = y[:n]
	i := 0
	for ; i+3 < n; i += 4 {
		s0 += x[i] * y[i]
		s1 += x[i+1] * y[i+1]
		s2 += x[i+2] * y[i+2]
		s3 += x[i+3] * y[i+3]
	}
	for ; i < n; i++ {
		s0 += x[i] * y[i]
	}
	return (s0 + s1) + (s2 + s3)
}

// trueResidual sets r = b - A x and returns ||r||.
func (s *PCG) trueResidual(r, x, b []float64) float64 {
	s.a.MulVecTo(r, x)
	for i := range r {
		r[i] = b[i] - r[i]
	}
	return math.Sqrt(dot(r, r))
}

// SolveTo solves A x = b by PCG. x and b must have length N and must not
// be the same slice. On success the Result has Status Converged and the
// error is nil; otherwise x holds the last iterate, the Result says why,
// and the error is a *NotConvergedError.
func (s *PCG) SolveTo(x, b []float64) (Result, error) {
	if !s.factored {
		panic(errNotFactored)
	}
	if len(x) != s.n || len(b) != s.n {
		panic(errShape)
	}
	tol := s.Options.Tol
	if tol <= 0 {
		tol = 1e-10
	}
	maxIter := s.Options.MaxIter
	if maxIter <= 0 {
		maxIter = max(100, s.n)
	}
	var res Result
	bn := math.Sqrt(dot(b, b))
	if math.IsNaN(bn) || math.IsInf(bn, 0) {
		return Result{Status: Breakdown, Residual: math.NaN()}, nonFinite(b, nil)
	}
	if bn == 0 {
		clear(x)
		return Result{Status: Converged}, nil
	}
	if !s.Options.WarmStart {
		clear(x)
	}
	r, z, p, q := s.r, s.z, s.p, s.q
	rel := s.trueResidual(r, x, b) / bn
	hist := make([]float64, 0, 64)
	restart := true
	var rz float64
	for {
		if rel <= tol {
			res.Status = Converged
			break
		}
		if math.IsNaN(rel) || math.IsInf(rel, 0) {
			res.Status = Breakdown
			break
		}
		if res.Iterations >= maxIter {
			res.Status = IterationLimit
			break
		}
		if restart {
			s.applyTo(z, r)
			copy(p, z)
			rz = dot(r, z)
			restart = false
		}
		s.a.MulVecTo(q, p)
		pq := dot(p, q)
		if !(pq > 0) || pq > maxFinite {
			res.Status = Breakdown
			break
		}
		alpha := rz / pq
		for i := range x {
			x[i] += alpha * p[i]
			r[i] -= alpha * q[i]
		}
		res.Iterations++
		rel = math.Sqrt(dot(r, r)) / bn
		hist = append(hist, rel)
		if rel <= tol {
			// Recursive residuals drift: confirm with the true one and
			// restart from it if it disagrees.
			rel = s.trueResidual(r, x, b) / bn
			hist[len(hist)-1] = rel
			restart = true
			continue
		}
		s.applyTo(z, r)
		rzNew := dot(r, z)
		beta := rzNew / rz
		rz = rzNew
		for i := range p {
			p[i] = z[i] + beta*p[i]
		}
	}
	if res.Status != Converged || res.Iterations == 0 {
		rel = s.trueResidual(s.t, x, b) / bn
	}
	res.Residual = rel
	res.History = hist
	if res.Status == Converged && rel <= tol {
		return res, nil
	}
	if res.Status == Converged {
		res.Status = Breakdown
	}
	return res, &NotConvergedError{Result: res, Tol: tol}
}
