// Package bench measures polegap's performance figures on generated C-core
// models: the time of each stage (mesh, assembly, ordering and symbolic
// analysis, numeric factorization, triangular solve, the same linear system
// by preconditioned conjugate gradients, the nonlinear Newton solve, a
// 20-point excitation curve), peak memory, and the fitted growth exponent
// of each cost with the number of nodes N, each beside the goal DESIGN.md
// sets and a verdict.
//
// Contract:
//
//   - Cases are generated, not read from files: CCore builds a c-core
//     template model in low-carbon steel whose mesh size is chosen (by a
//     calibration on two small meshes) to give about Case.Nodes nodes at
//     Case.Order.
//   - Run measures every case in one run, in the order given, and returns a
//     Table; it mutates nothing outside itself. Times are wall-clock
//     seconds, medians over Options.Repeat runs (the excitation curve runs
//     once). They depend on the machine and on its load, which the Table
//     records (/proc/loadavg where available).
//   - Memory: PeakHeap is the largest Go heap in use ("/memory/classes/heap/
//     objects:bytes" of runtime/metrics, sampled every 2 ms, live objects
//     plus not-yet-swept garbage, so an upper bound on the live peak) while
//     a case runs; PeakRSS is the kernel's VmHWM of the process, reset
//     before each case where /proc/self/clear_refs allows it. LiveHeap is
//     the heap after a collection with everything the nonlinear solve holds
//     at its end (mesh, problem, pattern, symbolic analysis, factor,
//     solution): the working set, which the peak exceeds by the garbage
//     the collector lets accumulate between collections (with GOGC=100 up
//     to as much again). The per-node figures subtract the Cholesky factor
//     (8 bytes per stored entry of L).
//   - Growth exponents are least-squares slopes of log(cost) against
//     log(N) over the first-order cases (Fit), with at least two sizes.
//   - Failures of a stage are *StageError values naming the case and stage;
//     a cancelled context stops the run with the context's error. Bad size
//     lists are *SizeError values. Nothing panics on user input.
//
// The tests check the machinery on a tiny case and the fit on synthetic
// data; they assert no timings. The figures themselves come from
// `polegap bench` and `go test -bench . ./internal/bench/`.
package bench
