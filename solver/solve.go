package solver

import (
	"fmt"
	"time"

	"polegap/internal/num"
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
	// ResidualEvaluations counts the residual-only assemblies of the line
	// searches (one per Newton step when no damping was needed).
	ResidualEvaluations int
	// FixedPointSteps counts the damped fixed-point steps taken where
	// Newton stalled (0 normally).
	FixedPointSteps int
	// ChordSteps counts the steps that reused an earlier factorization
	// (Options.Steps Chord); Iterations includes them.
	ChordSteps int
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

	as *assembler
}

// Solve assembles and solves p. It does not modify p. Linear materials
// converge in one Newton step; nonlinear ones iterate (see Options). On
// failure it returns a typed error (*ProblemError, *SingularError,
// *MaterialError, *LinearSolveError or *NotConvergedError) and no Solution.
// It panics if p or p.Mesh is nil or opt.Initial has the wrong length.
func Solve(p *Problem, opt Options) (*Solution, error) {
	pr, err := Prepare(p, opt)
	if err != nil {
		return nil, err
	}
	return pr.Solve(opt)
}

// Prepared is a problem ready to be solved repeatedly: the unknown
// numbering, the sparsity pattern with its element map and the linear
// solver's symbolic analysis are computed once and reused by every Solve
// (excitation sweeps, target searches). Between solves the caller may
// change the values in the Problem's CurrentDensity, Magnetization,
// PointCurrents currents, Fixed potentials and Materials, but not the
// mesh, the boundary conditions, Identify, or which nodes are Fixed.
// A Prepared is not safe for concurrent use.
type Prepared struct {
	p        *Problem
	as       *assembler
	lin      sparse.Solver
	analyzed bool
	fixed    []int32 // the Fixed nodes at Prepare time
	setup    time.Duration
}

// Prepare validates p and builds what Solve reuses; see Prepared. Only
// opt.Workers, opt.Method, opt.Solver and opt.LinearTol matter here.
func Prepare(p *Problem, opt Options) (*Prepared, error) {
	if err := p.validate(); err != nil {
		return nil, err
	}
	opt = opt.withDefaults()
	start := time.Now()
	d, err := buildDofMap(p)
	if err != nil {
		return nil, err
	}
	pr := &Prepared{p: p, as: newAssembler(p, d, opt.Workers, nil)}
	pr.lin = opt.linearSolver(d.n)
	for _, f := range p.Fixed {
		pr.fixed = append(pr.fixed, f.Node)
	}
	pr.setup = time.Since(start)
	return pr, nil
}

// Solve solves the prepared problem with the current values of its
// Problem. The first call includes the setup time of Prepare in
// Solution.Time.Assemble. It panics if opt.Initial has the wrong length
// or the set of Fixed nodes changed since Prepare.
func (pr *Prepared) Solve(opt Options) (*Solution, error) {
	p := pr.p
	opt = opt.withDefaults()
	if opt.Initial != nil && len(opt.Initial) != p.Mesh.NumNodes() {
		panic(errInitialLen)
	}
	for i, a := range opt.Initial {
		if !num.Finite(a) {
			return nil, &ProblemError{Field: "Options.Initial", Reason: fmt.Sprintf("node %d: %g", i, a)}
		}
	}
	if len(p.Fixed) != len(pr.fixed) {
		panic(errFixedChanged)
	}
	for i, f := range p.Fixed {
		if f.Node != pr.fixed[i] {
			panic(errFixedChanged)
		}
		if !num.Finite(f.A) {
			return nil, &ProblemError{Field: "Fixed", Reason: fmt.Sprintf("entry %d: value %g", i, f.A)}
		}
		if err := pr.as.d.setFixed(f.Node, f.A); err != nil {
			return nil, err
		}
	}
	// A snapshot of the problem's slices, so that later edits by the
	// caller do not change this solution's fields.
	snap := *p
	snap.Materials = append([]Material(nil), p.Materials...)
	snap.CurrentDensity = append([]float64(nil), p.CurrentDensity...)
	snap.Magnetization = append([][2]float64(nil), p.Magnetization...)
	s := &Solution{Problem: &snap, NumUnknowns: pr.as.d.n, as: pr.as}
	s.Time.Assemble = pr.setup
	pr.setup = 0
	if err := newton(pr.as, opt, s, pr.lin, pr.analyzed); err != nil {
		return nil, err
	}
	pr.analyzed = true
	// Fields evaluate materials through the solution's own snapshot.
	s.as = pr.as.withProblem(&snap)
	return s, nil
}
