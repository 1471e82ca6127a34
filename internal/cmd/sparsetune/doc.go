// Sparsetune prints the tuning tables behind the figures and defaults of
// polegap/solver/sparse: factor size, multiply-adds and timings of the
// orderings, of whole linear solves, and of settings of the tuning
// options (NDOptions, SupernodeOptions). It uses only the package's
// exported API and builds its matrices itself; nothing here runs in
// go test ./..., so timings never decide a test.
//
// Usage:
//
//	go run ./internal/cmd/sparsetune <command> [flags]
//
// Commands:
//
//	order   nnz(L), multiply-adds and ordering wall and CPU seconds of
//	        nested dissection and AMD (and, on grids, George's geometric
//	        dissection): solver/sparse doc.go, Orderings
//	solve   Analyze, Factor and SolveTo seconds of Cholesky (nested
//	        dissection and AMD) and IC(0)-PCG to 1e-10: doc.go, Figures
//	nd      nested dissection under settings of NDOptions, e.g.
//	        -set 'base;trials=2,passes=2;leaf=600' (serial ordering,
//	        best of three)
//	relax   one-worker Factor under settings of SupernodeOptions, e.g.
//	        -set 'base;always=16,zeros16=0.7'
//
// Matrices, for every command:
//
//	-grid 101,317   P1 Laplace matrices on jittered unit-square grids of
//	                that many cells per side, the package's benchmark
//	                matrices (10k and 100k unknowns; 1001 gives 1M)
//	-ccore 10k,1M   P1 matrices of the solver package's benchmark C-core
//	                (graded tensor grid, fine in the air gap) with just
//	                under that many nodes
//	-mtx a.mtx      Matrix Market files (the C-core rows of doc.go's
//	                ordering table were measured on the mesher's C-core
//	                meshes, read this way)
//
// The machine is shared: run one table at a time, read the CPU columns
// (steadier than wall time under load), and repeat a measurement before
// trusting a difference of a few percent. Exit status: 0, 1 when a
// factorization or file fails, 2 for a wrong command line.
package main
