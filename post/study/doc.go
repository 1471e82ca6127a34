// Package study runs a model once, end to end: mesh it, build the
// finite-element problem, solve it (Newton–Raphson when the iron is
// nonlinear) and evaluate its probes. It is the unit that the command line
// and the design workflows (sweeps, target search) repeat.
//
// A Study is only returned when the solve converged; a solve that did not
// converge returns the solver's typed error with its residual history.
package study
