package solver

import (
	"context"
	"runtime"

	"polegap/solver/sparse"
)

// LinearMethod chooses the linear solver used inside Solve.
type LinearMethod int

const (
	// Auto lets the sparse package pick by size (sparse.Auto: Cholesky
	// for 2D systems up to a few million unknowns).
	Auto LinearMethod = iota
	// Direct: fill-reducing ordering and sparse Cholesky; the symbolic
	// analysis is reused across Newton steps.
	Direct
	// Iterative: conjugate gradients with an incomplete Cholesky
	// preconditioner, to Options.LinearTol.
	Iterative
)

// Steps chooses how often Newton's tangent is factored.
type Steps int

const (
	// FullNewton factors the tangent at every step.
	FullNewton Steps = iota
	// Chord factors the tangent at the first step and keeps that
	// factorization for the following steps while each cuts the residual
	// by at least ChordRate, factoring afresh after a step that does not
	// (or whose direction does not descend): the chord method, or with
	// the refresh, Shamanskii's (C. T. Kelley, "Iterative Methods for
	// Linear and Nonlinear Equations", SIAM 1995, sec. 5.4). A chord step
	// costs a triangular solve and a residual assembly, a Newton step also
	// the tangent's assembly and factorization; from a good warm start
	// (a sweep's next point, a small perturbation) the chord steps
	// converge about as fast and cost a fraction. The solution meets the
	// same tolerances (Tol, UpdateTol); it differs from a FullNewton one
	// within them.
	Chord
)

// ChordRate is the residual reduction per step below which Chord keeps
// its factorization.
const ChordRate = 0.1

// Options control Solve. The zero value works: Auto linear solver,
// relative residual 1e-8, update 1e-6, 30 Newton steps, all cores.
type Options struct {
	Method LinearMethod
	// Solver, when not nil, is used instead of the one Method names.
	Solver sparse.Solver
	// Tol is the relative residual ‖R(A)‖/‖R(A₀)‖ to reach, where A₀ has
	// every unknown at zero; default 1e-8.
	Tol float64
	// UpdateTol bounds the estimated next Newton update relative to the
	// largest |A| (max norms); default 1e-6.
	UpdateTol float64
	// MaxIter is the limit on Newton steps; default 30.
	MaxIter int
	// Steps chooses when the tangent is factored; the zero value is
	// FullNewton.
	Steps Steps
	// LinearTol is the relative residual of an iterative linear solve;
	// default 1e-10.
	LinearTol float64
	// Initial is a warm start: A per node (len Mesh.NumNodes()), or nil
	// for zero. Fixed nodes take their prescribed values regardless.
	Initial []float64
	// Workers is the number of goroutines used for assembly and for the
	// Cholesky factorization; 0 means GOMAXPROCS.
	Workers int
	// Context, when not nil, is checked before each Newton step: once it
	// is done the solve stops with a *NotConvergedError that wraps the
	// context's error (errors.Is(err, context.Canceled) holds) and
	// carries the residual history so far. A Ctrl-C thus ends a long
	// nonlinear solve within one step.
	Context context.Context
	// Progress, when not nil, is called after each Newton step with the
	// step number (from 1) and the relative residual reached; it must not
	// modify the problem.
	Progress func(iteration int, residual float64)
}

func (o Options) withDefaults() Options {
	if o.Tol <= 0 {
		o.Tol = 1e-8
	}
	if o.UpdateTol <= 0 {
		o.UpdateTol = 1e-6
	}
	if o.MaxIter <= 0 {
		o.MaxIter = 30
	}
	if o.LinearTol <= 0 {
		o.LinearTol = 1e-10
	}
	if o.Workers < 0 {
		panic(errBadWorkers)
	}
	if o.Workers == 0 {
		o.Workers = runtime.GOMAXPROCS(0)
	}
	return o
}

// linearSolver returns the solver that opt asks for, for n unknowns.
func (o Options) linearSolver(n int) sparse.Solver {
	switch {
	case o.Solver != nil:
		return o.Solver
	case o.Method == Direct:
		return &sparse.Cholesky{Options: sparse.CholeskyOptions{Workers: o.Workers}}
	case o.Method == Iterative:
		return &sparse.PCG{Options: sparse.PCGOptions{Tol: o.LinearTol}}
	}
	s := sparse.Auto(n)
	switch s := s.(type) {
	case *sparse.Cholesky:
		s.Options.Workers = o.Workers
	case *sparse.PCG:
		s.Options.Tol = o.LinearTol
	}
	return s
}
