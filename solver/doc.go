// Package solver assembles and solves the 2D magnetostatic finite-element
// problem for the magnetic vector potential.
package solver
