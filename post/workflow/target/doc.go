// Package target finds the ampere-turns a magnet needs for a target field:
// a root search on full nonlinear solves of the model, each warm-started
// from the solution nearest to it, to a relative field tolerance.
//
// The field rises monotonically with the coil current, so the search
// brackets the target and closes in on it with the Illinois variant of
// regula falsi (M. Dowell and P. Jarratt, "A modified regula falsi method
// for computing the root of an equation", BIT 11, 1971), whose
// superlinear convergence needs few solves. A target that the magnet
// cannot reach within the ampere-turn limit (by default five times the
// ideal magnetic circuit's μ0-only value, where the magnet's efficiency
// has fallen below 20 %: the iron is deep in saturation) is reported as
// such, with the highest field reached.
package target
