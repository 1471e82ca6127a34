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
// 50k unknowns, multilevel nested dissection above, see Ordering and
// Orderings below), elimination tree,
// Gilbert-Ng-Peyton column counts, relaxed supernodes and static
// left-looking update lists. Its numeric phase works on dense column-major
// supernode blocks with 2x4 register-blocked kernels (AVX2/FMA assembly on
// amd64 CPUs that have it, pure Go elsewhere or with the purego tag).
//
// Auto(n) and New pick a solver; on the 2D benchmarks in bench_test.go
// Cholesky with the default ordering wins at every measured size, 10k to 1M
// unknowns (IC(0)-PCG to 1e-10 needs 117, 331 and 1044 iterations there and
// 2.1x, 2.3x and 4.6x the CPU time of the whole Cholesky solve), so Auto
// returns Cholesky up to 4M unknowns and PCG only beyond, where the
// factor's memory (about 0.5 GB at 1M unknowns) becomes the limit.
//
// # Orderings
//
// AMD is approximate minimum degree (Amestoy, Davis and Duff 1996).
// NestedDissection bisects the graph recursively by the multilevel scheme
// of Karypis and Kumar (1998): heavy-edge matching down to about 120
// vertices, greedy graph growing from 4 starts, boundary
// Fiduccia-Mattheyses refinement of the edge cut on every level (no part
// above 55 % of the vertices), then a minimum vertex cover of the cut
// edges (Hopcroft-Karp matching, Konig's theorem) refined by
// Fiduccia-Mattheyses moves of separator vertices. Each separator is
// numbered after its two parts; pieces of at most 400 vertices, or of
// 1/256 of the graph on large graphs (which bounds the depth of the
// dissection: 1M C-core ordering 5.1 -> 3.9 s for 5 % more madds), are
// ordered by AMD, and disconnected pieces split into components. The two halves of
// a large dissection are ordered concurrently; random choices are seeded
// from the piece's position, so the permutation is the same on every run
// and for every GOMAXPROCS.
//
// The figures above are the defaults of NDOptions, which tune the
// dissection (CholeskyOptions.ND, OrderND); SupernodeOptions tune the
// relaxed supernodes and CholeskyOptions.SplitWork the column split of
// large supernodes. Every options struct's zero value is the tuned
// default; the package keeps no mutable settings.
//
// Factor size and operations (Cholesky.NNZL, Cholesky.Flops) and ordering
// time (wall and CPU seconds on the shared 2-core machine, load 1-3), as
// go run ./internal/cmd/sparsetune order prints them; the C-core
// matrices are P1 on the mesher's graded benchmark C-core mesh (fine in
// the gap), read by that command from Matrix Market files (-mtx) that the
// repository does not keep, the grids those of the figures below. The level-structure nested
// dissection this package used before is given for comparison (madds);
// the rows were measured with leaves of 400 vertices at every size:
//
//	matrix   unknowns  ND nnz(L)  ND madds  ND wall/CPU-s  AMD nnz(L)  AMD madds  AMD s   old ND madds
//	c-core   10.6k     0.38M      1.9e7     0.05/0.05      0.38M       2.3e7      0.01    6.3e7
//	c-core   100k      4.5M       4.2e8     0.37/0.64      5.0M        7.9e8      0.23    3.4e9
//	c-core   1M        53M        1.1e10    5.3/9.3        64M         2.3e10     3.6     2.9e11
//	grid     10k       0.38M      1.9e7     0.04/0.04      0.35M       1.5e7      0.005   1.9e7
//	grid     100k      5.1M       5.8e8     0.28/0.48      5.3M        6.7e8      0.06    5.3e8
//	grid     1M        65M        1.9e10    4.1/7.3        73M         2.2e10     0.64    1.6e10
//
// On graded meshes nested dissection needs about half of AMD's operations
// from 10k unknowns on; on the uniform grid it stays within 25 % of AMD
// (ahead at 100k and 1M, behind at 10k and 300k: the structured
// triangulation has straight and diagonal separators of equal size, and
// the diagonal ones leave worse pieces). The ordering costs 2-7 times
// AMD's time (15 times on the grid, where AMD is fast). DefaultOrdering switches to nested dissection at
// 50k unknowns: on the C-core matrices that is where its saving over about
// ten factorizations (a Newton solve reusing the analysis, at 5-6 Gmadd
// per CPU-second) passes its extra ordering time (interpolating between
// 10k, saving 0.2 of the cost, and 100k, saving 1.6 times it). For a
// single factorization at 1M unknowns the two are about even (5.3 s of
// ordering and 1.1e10 madds against 3.6 s and 2.3e10).
//
// # Figures
//
// Whole linear solve (Analyze + Factor + SolveTo) of the P1 Laplace matrix
// on a jittered structured triangulation of the unit square, default
// options, this project's 2-core machine while it was shared (load 2-5,
// so CPU seconds are the steadier figure; go run
// ./internal/cmd/sparsetune solve -grid 101,317,1001 prints the table):
//
//	unknowns  ordering  nnz(L)  madds    Cholesky CPU-s (AMD)  IC(0)-PCG CPU-s (iterations)
//	10k       AMD       0.35M   1.5e7    0.025                 0.053 (117)
//	100k      ND        5.1M    5.8e8    0.80  (0.37)          1.85  (331)
//	1M        ND        65M     1.9e10   12.7  (6.7)           58.6  (1044)
//
// On this uniform grid one solve is faster with AMD, whose ordering is much cheaper here (see Orderings); the default
// favours the graded meshes and the repeated factorizations of Newton
// solves. The Cholesky CPU time grows like N^1.35 (10k to 1M). Factor
// runs the supernode updates at 5-6 Gmadd per CPU-second with the AVX2
// kernel.
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
