package sparse

// Status says how a linear solve ended.
type Status int

const (
	// Converged: the relative residual met the tolerance (iterative) or a
	// direct solve finished.
	Converged Status = iota
	// IterationLimit: an iterative solver ran out of iterations.
	IterationLimit
	// Breakdown: a pivot or search direction became non-positive or not finite.
	Breakdown
)

// Result describes a finished solve.
type Result struct {
	Status     Status
	Iterations int       // 0 for a direct solve
	Residual   float64   // final relative residual ||b-Ax||/||b||
	History    []float64 // relative residual per iteration (iterative solvers)
}

// Solver solves A x = b for a symmetric positive definite CSR matrix.
//
// Analyze does the work that depends only on the sparsity pattern (ordering,
// symbolic factorization); Factor does the numeric work for the current
// values and may be called again after values change while the pattern
// stays the same; SolveTo solves for one right-hand side into x.
type Solver interface {
	Analyze(a *CSR) error
	Factor(a *CSR) error
	SolveTo(x, b []float64) (Result, error)
}
