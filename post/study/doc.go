// Package study compiles a loaded model once into everything a solve
// needs and solves it at any values of its parameters.
//
// Compile meshes the model (the planar straight-line graph and size field
// for the mesher, the Kelvin disk of an open boundary), resolves its
// materials (B-H tables checked, CSV files read, stacking applied) and its
// coil sides, and builds the finite-element problem. Study.SolveAt solves
// it at Params — coil currents and turns, an iron permeability scale, the
// gap length — reusing the mesh, the numbering and the factorization's
// symbolic analysis for every parameter that changes only sources or
// materials; a geometric parameter (the gap) remeshes and says so
// (Result.Remeshed). Refined and Moved derive studies on another mesh or
// with parts moved, sharing the resolved materials. No function of this
// package writes to a models.Model.
//
// A Result is one converged solve: the solution, the probes read off it
// and the field they read (recovered corner-averaged B on first-order
// meshes). A solve that did not converge returns the solver's typed error
// with its residual history and no Result.
//
// The package is the base of post/: quantities read Results, workflows
// call SolveAt, outputs format both (see post's doc.go for the layers).
//
// Region tags: 0 is the air around the model (the default region); model
// region i (0-based, in file order) has tag i+1; the Kelvin disk of an open
// boundary (a half disc on the axis in an axisymmetric model, whose
// reluctivity the solver weights by ρ'²/R²) has KelvinTag. Result.Field
// and the probes read only the real region inside the outer boundary. Edge markers: 1 on region interfaces,
// MarkerLeft..MarkerTop on the sides of a box boundary, MarkerCircle on a
// circular boundary.
//
// A Study is not safe for concurrent use; a Result is read-only.
package study
