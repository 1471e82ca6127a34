package sparse

// Kind names a linear solver.
type Kind int

const (
	// AutoKind picks by size; see Auto.
	AutoKind Kind = iota
	// CholeskyKind is the supernodal sparse Cholesky solver.
	CholeskyKind
	// PCGKind is conjugate gradients with an IC(0) preconditioner.
	PCGKind
)

// New returns a solver of the given kind with default options for a
// system of n unknowns. It panics on an unknown kind.
func New(kind Kind, n int) Solver {
	switch kind {
	case AutoKind:
		return Auto(n)
	case CholeskyKind:
		return &Cholesky{}
	case PCGKind:
		return &PCG{}
	}
	panic(errKind)
}

// autoPCGAbove is the size above which Auto returns PCG. On the 2D P1
// benchmarks of this package (bench_test.go) the Cholesky solve is faster
// than IC(0)-PCG to 1e-10 at every size measured, 10k to 1M unknowns, so
// the crossover is set beyond the largest measured size; the direct factor
// is also reused across Newton steps and right-hand sides.
const autoPCGAbove = 4_000_000

// Auto returns the solver measured fastest for a 2D finite-element system
// of n unknowns: Cholesky up to autoPCGAbove unknowns, PCG above, where the
// factor's memory (growing like n log n) becomes the limit.
func Auto(n int) Solver {
	if n > autoPCGAbove {
		return &PCG{}
	}
	return &Cholesky{}
}
