package solver

import (
	"fmt"

	"polegap/solver/sparse"
)

// Panic messages for programmer misuse.
const (
	errNilMesh      = "solver: nil problem or mesh"
	errInitialLen   = "solver: Options.Initial length differs from the number of nodes"
	errDstLen       = "solver: destination length differs from the required length"
	errNoMaterial   = "solver: region without a material"
	errBadWorkers   = "solver: negative worker count"
	errFixedChanged = "solver: the set of Fixed nodes changed after Prepare"
)

// ProblemError reports inconsistent problem data.
type ProblemError struct {
	Field  string // the Problem field at fault
	Reason string
}

// Error implements error.
func (e *ProblemError) Error() string { return "solver: problem." + e.Field + ": " + e.Reason }

// SingularError reports a system without a unique solution: a part of the
// mesh whose potential is fixed nowhere (no zero-potential edge, fixed node
// or axis in its connected part), so that adding a constant to A there
// changes nothing.
type SingularError struct {
	Nodes   int   // number of nodes in the floating part
	Example int32 // one node of it
}

// Error implements error.
func (e *SingularError) Error() string {
	return fmt.Sprintf("solver: singular system: %d nodes (node %d among them) form a part whose potential is fixed nowhere; give it a zero-potential boundary edge or a fixed node", e.Nodes, e.Example)
}

// MaterialError reports a reluctivity that is not finite and positive.
// Met after Newton-Raphson has started, it is wrapped in a
// *NotConvergedError carrying the residual history (errors.As finds both).
type MaterialError struct {
	Region int32
	B2     float64 // |B|² (T²) at which the material was asked
	Nu     float64
	DNu    float64
}

// Error implements error.
func (e *MaterialError) Error() string { return "solver: " + e.detail() }

func (e *MaterialError) detail() string {
	return fmt.Sprintf("material of region %d returned ν = %g, dν/db² = %g at |B|² = %g T²; ν must be finite and positive", e.Region, e.Nu, e.DNu, e.B2)
}

// LinearSolveError reports a failure of the linear solver.
type LinearSolveError struct {
	Stage  string // "analyze", "factor" or "solve"
	Result sparse.Result
	Err    error
}

// Error implements error.
func (e *LinearSolveError) Error() string {
	if e.Err != nil {
		return fmt.Sprintf("solver: linear %s failed: %v", e.Stage, e.Err)
	}
	return fmt.Sprintf("solver: linear %s failed: status %d after %d iterations, residual %g", e.Stage, e.Result.Status, e.Result.Iterations, e.Result.Residual)
}

// Unwrap returns the linear solver's error.
func (e *LinearSolveError) Unwrap() error { return e.Err }

// NotConvergedError reports a Newton-Raphson run that did not meet its
// tolerances. No Solution is returned with it.
type NotConvergedError struct {
	Iterations int       // iterations run (the last may have taken no step)
	History    []float64 // relative residual at the start and after each step taken
	Residual   float64   // last relative residual
	// HasUpdate reports whether a next update was estimated (that
	// happens only once the residual meets Options.Tol); Update is the
	// last estimate relative to max |A|, and 0 when HasUpdate is false.
	HasUpdate bool
	Update    float64
	Reason    string
	// Err is the error that ended the run, when one did (a
	// *MaterialError met between steps), or nil.
	Err error
}

// Error implements error.
func (e *NotConvergedError) Error() string {
	if !e.HasUpdate {
		return fmt.Sprintf("solver: Newton-Raphson did not converge after %d iterations (relative residual %.3g): %s", e.Iterations, e.Residual, e.Reason)
	}
	return fmt.Sprintf("solver: Newton-Raphson did not converge after %d iterations (relative residual %.3g, update %.3g): %s", e.Iterations, e.Residual, e.Update, e.Reason)
}

// Unwrap returns the error that ended the run, or nil.
func (e *NotConvergedError) Unwrap() error { return e.Err }
