package sparse

import "fmt"

// Panic messages for programmer misuse.
const (
	errShape       = "sparse: dimension mismatch"
	errIndex       = "sparse: index out of range"
	errNotAnalyzed = "sparse: Factor called before Analyze"
	errNotFactored = "sparse: SolveTo called before Factor"
	errPattern     = "sparse: matrix pattern differs from the analyzed pattern"
	errBadCSR      = "sparse: malformed CSR"
	errNodes       = "sparse: element connectivity length is not a multiple of nodesPerElem"
	errKind        = "sparse: unknown solver kind"
	errUnsymmetric = "sparse: matrix pattern is not structurally symmetric (store both triangles)"
)

// NotPositiveDefiniteError reports a pivot that is not positive (or not
// finite) during a Cholesky or incomplete Cholesky factorization. Column is
// the row/column index in the caller's (unpermuted) numbering.
type NotPositiveDefiniteError struct {
	Column int
	Pivot  float64
}

func (e *NotPositiveDefiniteError) Error() string {
	return fmt.Sprintf("sparse: matrix is not positive definite: pivot %g at column %d", e.Pivot, e.Column)
}

// NotConvergedError reports an iterative solve that stopped without meeting
// its tolerance. Result carries the iteration count and residual history.
type NotConvergedError struct {
	Result Result
	Tol    float64
}

func (e *NotConvergedError) Error() string {
	return fmt.Sprintf("sparse: no convergence after %d iterations: relative residual %.3g > tolerance %.3g (%s)",
		e.Result.Iterations, e.Result.Residual, e.Tol, e.Result.Status)
}

// NonFiniteError reports a NaN or infinite value met during a solve, for
// example in the right-hand side. Index is the first offending entry of
// the vector named by Vector, or -1 when only a norm was not finite.
type NonFiniteError struct {
	Vector string
	Index  int
}

func (e *NonFiniteError) Error() string {
	return fmt.Sprintf("sparse: %s is not finite (entry %d)", e.Vector, e.Index)
}

// FormatError reports malformed Matrix Market input.
type FormatError struct {
	Line int
	Msg  string
}

func (e *FormatError) Error() string {
	return fmt.Sprintf("sparse: matrix market line %d: %s", e.Line, e.Msg)
}

// String returns the status name.
func (s Status) String() string {
	switch s {
	case Converged:
		return "converged"
	case IterationLimit:
		return "iteration limit"
	case Breakdown:
		return "breakdown"
	}
	return fmt.Sprintf("Status(%d)", int(s))
}
