package solver

import (
	"fmt"
	"math"

	"polegap/solver/sparse"
)

// jacobiCG is a conjugate-gradient solver with diagonal preconditioning,
// used until the sparse package's factorizations are wired in
// (M. R. Hestenes, E. Stiefel, "Methods of conjugate gradients for solving
// linear systems", J. Res. NBS 49, 1952).
type jacobiCG struct {
	a       *sparse.CSR
	inv     []float64
	tol     float64
	maxIter int
	r, z, p []float64
	q       []float64
}

func (s *jacobiCG) Analyze(a *sparse.CSR) error { return nil }

func (s *jacobiCG) Factor(a *sparse.CSR) error {
	s.a = a
	s.inv = diagTo(s.inv, a)
	for i, d := range s.inv {
		if !(d > 0) || math.IsInf(d, 0) {
			return fmt.Errorf("solver: diagonal entry %d is %g, not positive", i, d)
		}
		s.inv[i] = 1 / d
	}
	return nil
}

// SolveTo reports a failure through Result.Status, not an error.
func (s *jacobiCG) SolveTo(x, b []float64) (sparse.Result, error) {
	n := s.a.N
	if s.r == nil || len(s.r) != n {
		s.r, s.z, s.p, s.q = make([]float64, n), make([]float64, n), make([]float64, n), make([]float64, n)
	}
	maxIter := s.maxIter
	if maxIter == 0 {
		maxIter = 10*n + 100
	}
	tol := s.tol
	if tol == 0 {
		tol = 1e-10
	}
	var bn float64
	for i := range x {
		x[i] = 0
		s.r[i] = b[i]
		bn += b[i] * b[i]
	}
	bn = math.Sqrt(bn)
	res := sparse.Result{Status: sparse.Converged}
	if bn == 0 {
		return res, nil
	}
	var rz float64
	for i := range s.r {
		s.z[i] = s.inv[i] * s.r[i]
		s.p[i] = s.z[i]
		rz += s.r[i] * s.z[i]
	}
	for it := 1; it <= maxIter; it++ {
		mulVecTo(s.q, s.a, s.p)
		var pq float64
		for i := range s.p {
			pq += s.p[i] * s.q[i]
		}
		if !(pq > 0) {
			res.Status = sparse.Breakdown
			res.Iterations = it
			return res, nil
		}
		alpha := rz / pq
		var rn float64
		for i := range x {
			x[i] += alpha * s.p[i]
			s.r[i] -= alpha * s.q[i]
			rn += s.r[i] * s.r[i]
		}
		res.Iterations = it
		res.Residual = math.Sqrt(rn) / bn
		if res.Residual <= tol {
			return res, nil
		}
		var rz2 float64
		for i := range s.r {
			s.z[i] = s.inv[i] * s.r[i]
			rz2 += s.r[i] * s.z[i]
		}
		beta := rz2 / rz
		rz = rz2
		for i := range s.p {
			s.p[i] = s.z[i] + beta*s.p[i]
		}
	}
	res.Status = sparse.IterationLimit
	return res, nil
}

func diagTo(dst []float64, a *sparse.CSR) []float64 {
	if len(dst) != a.N {
		dst = make([]float64, a.N)
	}
	for i := 0; i < a.N; i++ {
		dst[i] = 0
		for p := a.RowPtr[i]; p < a.RowPtr[i+1]; p++ {
			if int(a.Col[p]) == i {
				dst[i] = a.Val[p]
			}
		}
	}
	return dst
}

func mulVecTo(dst []float64, a *sparse.CSR, x []float64) {
	for i := 0; i < a.N; i++ {
		var s float64
		for p := a.RowPtr[i]; p < a.RowPtr[i+1]; p++ {
			s += a.Val[p] * x[a.Col[p]]
		}
		dst[i] = s
	}
}
