// Package sparse provides polegap's sparse matrices and linear solvers for
// symmetric positive definite finite-element systems.
//
// # Storage
//
// CSR holds a square matrix in compressed sparse row form with int32
// column indices: both triangles of a symmetric matrix are stored, columns
// within a row are strictly increasing, and explicit zeros may sit in the
// pattern (assembly keeps the pattern fixed while values change). Build a
// pattern with PatternFromElements (finite elements) or Triplet.ToCSR
// (entry by entry), add values through CSR.Index, and check invariants
// with CSR.Check. Submatrix drops rows and columns (Dirichlet
// condensation). WriteMatrixMarket and ReadMatrixMarket exchange matrices
// in the NIST Matrix Market coordinate format.
//
// # Solvers
//
// Cholesky (supernodal sparse Cholesky after a fill-reducing Ordering) and
// PCG (conjugate gradients with Jacobi or IC(0)) implement Solver:
//
//   - Analyze(a) uses only the pattern of a; it computes the ordering, the
//     symbolic factor and the work buffers, kept until the next Analyze.
//   - Factor(a) uses the values of a, which must have the analyzed pattern
//     (same N and NNZ; a different count panics). It overwrites the numeric
//     factor or preconditioner held by the solver and keeps a reference to
//     a for residuals, so a must not change until the solves are done.
//     Repeated Factor calls on the Cholesky solver allocate nothing.
//   - SolveTo(x, b) writes x and reads b; neither the matrix nor b is
//     modified. The Cholesky solver allows x and b to be the same slice.
//
// Auto(n) and New pick a solver; on the 2D benchmarks in bench_test.go
// Cholesky with the default ordering wins at every measured size.
//
// # Failures
//
// Misuse panics with a "sparse: ..." message: length or dimension
// mismatches, out-of-range indices, a malformed CSR, Factor before
// Analyze, SolveTo before Factor, a changed pattern. Numerical outcomes are
// typed errors carrying their data: *NotPositiveDefiniteError (column and
// pivot, caller's numbering) from Factor, *NotConvergedError (Result with
// residual history) from PCG.SolveTo. A solve never reports Converged
// unless the true residual ||b - A x|| / ||b|| was checked.
//
// # Concurrency
//
// Cholesky.Factor uses Options.Workers goroutines (default GOMAXPROCS) on
// independent subtrees of the elimination tree, and MulVecTo splits rows of
// large matrices over goroutines. A solver value is not safe for
// concurrent use; separate values may run concurrently. After Factor,
// SolveTo calls on one value must still be serialized (they share work
// vectors).
package sparse
