// Package report turns a solved study into what polegap prints: a plain
// data structure with JSON tags (the --json output, stable keys in SI
// units) and a terminal summary written from it.
//
// JSON keys: "mesh" {nodes, triangles, order}, "newton" {iterations,
// residual, converged}, "probes" keyed by probe name (point probes give
// a, bx, by, b; line, box and circle probes give samples and the mean,
// min and max of |B| and the mean By), "energy_j" (per the model's depth
// for planar models, whole revolution for axisymmetric ones).
package report
