// Package sweep computes excitation curves: the model solved at a list of
// coil currents on one mesh, each solve warm-started from the previous
// one, giving the gap field against ampere-turns as the iron saturates.
//
// The swept variable is the current of one coil (the first by default);
// every other coil keeps its ratio to it, as coils in series on one supply
// do. Points can be split into shards (every n-th point, starting at the
// k-th) so that a batch scheduler's job array runs a long sweep in
// parallel; Merge joins the shards' tables again.
//
// Units: amperes, ampere-turns, tesla, webers, henries. Interrupting a
// sweep (a cancelled context) returns the points finished so far with an
// *InterruptedError.
package sweep
