// Package scan explores a design: it solves a model at many variants —
// values of named parameters taken as a full grid, a Latin hypercube or a
// given list — and tabulates the design quantities of each, with their
// error estimates, in one table.
//
// # Parameters
//
// A parameter is named as the model file names it:
//
//	pole-width, gap, turns, ...    a template dimension (dimensions.KEY),
//	                               in the model's units
//	depth                          the planar depth, in the model's units
//	materials.yoke-steel.curve     any key path of the file (keys joined
//	                               with dots): a material's curve or
//	                               permeability, the mesh size, ...
//	current:COIL, turns:COIL       a coil's current (A) or turns, without
//	                               re-reading the file (study.Params)
//	iron                           the iron permeability scale (study.Params)
//	gap (model without template)   the gap length in the model's units
//	                               (study.Params.Gap)
//
// File values are written into the model's text (models.ParseWith) and the
// model is decoded afresh for every variant: a template rebuilds its
// regions, coils and probes at the new dimensions.
//
// # Quantities
//
// Each variant is solved to the accuracy asked for by adaptive refinement
// (design.SolveAccurate) and reports, with the change from the mesh before
// the last as the error estimate: the gap-centre field B0 (T); the
// ampere-turns per winding at which the target probe reaches the target
// field (target.Search on both meshes); the good-field half-width (m) at
// the tolerance asked for; the largest converged iron |B| (the peak disc
// mean over the iron regions, T); the coil power (W) of the least-power
// winding of the coil window at those ampere-turns (post/workflow/coil,
// all windings in series); the iron and copper mass (kg) for the stated
// depth (planar) or of the solid of revolution (axisymmetric). Masses are
// geometry, not solved: their estimate is 0.
//
// # Determinism and shards
//
// Every variant is solved from its own model text, independent of the
// others, so its row is the same whether it runs alone, in a full scan or
// in a shard (sweep.Select picks shard k of n, sweep.Join merges); the
// table prints every number in Go's shortest exact form, so reading and
// writing a table changes no bit.
//
// Interrupting a scan (a cancelled context) returns the rows finished so
// far with an *InterruptedError. A variant that cannot be built or solved
// (dimensions that do not fit, a solve that does not converge) keeps its
// row with the error text and NaN quantities; the scan goes on.
package scan
