package solver

import (
	"sync"
	"time"

	"polegap/mesh"

	"polegap/solver/sparse"
)

// Timings splits the wall time of a solve.
type Timings struct {
	Assemble time.Duration // numbering, pattern, element loops (all Newton steps)
	Analyze  time.Duration // ordering and symbolic factorization
	Factor   time.Duration // numeric factorizations
	Solve    time.Duration // triangular solves or iterations
}

// Total returns the sum of the parts.
func (t Timings) Total() time.Duration { return t.Assemble + t.Analyze + t.Factor + t.Solve }

// Solution is a solved problem: the potential at every node and how the
// solve went. A Solution is only returned when the solve converged.
type Solution struct {
	Problem *Problem
	// A is the vector potential per node (Wb/m): Az planar, Aφ
	// axisymmetric; fixed and identified nodes included.
	A []float64
	// Converged is true (a failed run returns an error instead).
	Converged bool
	// Iterations is the number of Newton steps (1 for a linear problem).
	Iterations int
	// FixedPointSteps counts the damped fixed-point steps taken where
	// Newton stalled (0 normally).
	FixedPointSteps int
	// Residual is the final relative residual ‖R(A)‖/‖R(A₀)‖.
	Residual float64
	// History is the relative residual before the first and after each step.
	History []float64
	// Update is the estimated relative size of a further Newton step.
	Update float64
	// Linear is the result of the last linear solve.
	Linear sparse.Result
	// NumUnknowns is the size of the reduced linear system.
	NumUnknowns int
	Time        Timings

	as      *assembler
	locOnce sync.Once
	loc     *mesh.Locator
}

// Solve assembles and solves p. It does not modify p. Linear materials
// converge in one Newton step; nonlinear ones iterate (see Options). On
// failure it returns a typed error (*ProblemError, *SingularError,
// *MaterialError, *LinearSolveError or *NotConvergedError) and no Solution.
// It panics if p or p.Mesh is nil or opt.Initial has the wrong length.
func Solve(p *Problem, opt Options) (*Solution, error) {
	if err := p.validate(); err != nil {
		return nil, err
	}
	opt = opt.withDefaults()
	if opt.Initial != nil && len(opt.Initial) != p.Mesh.NumNodes() {
		panic(errInitialLen)
	}
	start := time.Now()
	d, err := buildDofMap(p)
	if err != nil {
		return nil, err
	}
	as := newAssembler(p, d, opt.Workers)
	s := &Solution{Problem: p, NumUnknowns: d.n, as: as}
	s.Time.Assemble = time.Since(start)
	if err := newton(as, opt, s); err != nil {
		return nil, err
	}
	return s, nil
}
