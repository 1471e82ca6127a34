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
//     modified. The Cholesky solver allows x and b to be the same slice and
//     allocates nothing; PCG allocates only the residual history it
//     returns (and, for large matrices, the goroutines of MulVecTo).
//
// Factor and SolveTo read the entries of both triangles as the permuted
// factorization needs them, so the values must be symmetric; Analyze
// panics when the pattern is not structurally symmetric.
//
// Cholesky's symbolic phase: ordering (approximate minimum degree below
// 30k unknowns, nested dissection above, see Ordering), elimination tree,
// Gilbert-Ng-Peyton column counts, relaxed supernodes and static
// left-looking update lists. Its numeric phase works on dense column-major
// supernode blocks with 2x4 register-blocked kernels (AVX2/FMA assembly on
// amd64 CPUs that have it, pure Go elsewhere or with the purego tag).
//
// Auto(n) and New pick a solver; on the 2D benchmarks in bench_test.go
// Cholesky with the default ordering wins at every measured size, 10k to 1M
// unknowns (IC(0)-PCG to 1e-10 needs 117, 331 and 1044 iterations there and
// 2.4x, 4.4x and 8.6x the CPU time of the whole Cholesky solve), so Auto
// returns Cholesky up to 4M unknowns and PCG only beyond, where the
// factor's memory (about 0.5 GB at 1M unknowns) becomes the limit.
//
// # Figures
//
// Whole linear solve (Analyze + Factor + SolveTo) of the P1 Laplace matrix
// on a jittered structured triangulation of the unit square, default
// options, this project's 2-core machine while it was shared (load 12-16,
// so CPU seconds are the steadier figure; go test -run TimingTable
// -timing -v ./solver/sparse prints the table):
//
//	unknowns  nnz(L)  madds     Cholesky CPU-s  IC(0)-PCG CPU-s (iterations)
//	10k       0.35M   1.5e7     0.026           0.054 (117)
//	100k      5.1M    5.3e8     0.42            1.75  (331)
//	1M        64.7M   1.6e10    6.5             57    (1044)
//
// The Cholesky CPU time grows like N^1.2 (10k to 1M). Factor runs the
// supernode updates at 5-6 Gmadd per CPU-second with the AVX2 kernel.
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
// independent subtrees of the elimination tree and splits the columns of
// large supernodes at the top of the tree between two goroutines. The
// goroutines belong to a pool made by Analyze, so a repeated Factor
// allocates nothing; the pool ends when the solver becomes unreachable.
// MulVecTo splits rows of large matrices over new goroutines. A solver
// value is not safe for concurrent use; separate values may run
// concurrently, and SolveTo calls on one value must be serialized (they
// share work vectors).
package sparse
