// Package post holds everything above one finite-element solve, grouped by
// role in sub-folders. Data flows one way, from the top of this list to
// the bottom; a package imports only packages of the layers above its own
// (and the core below post: models, mesh, materials, solver):
//
//	post/study       a model compiled once (mesh, numbering, materials,
//	                 prepared solver) and solved at any parameter values;
//	                 post/study/probes evaluates the field at the probes
//	post/quantity/*  what a designer reads off one solution: gap field,
//	                 uniformity and fringing (gap), flux linkage,
//	                 inductance and energy (circuit), forces (force),
//	                 saturation, search-coil linkage (searchcoil); no
//	                 quantity imports another
//	post/measure     measured-data formats and their reduction (imports
//	                 nothing of post); post/measure/samples embeds the
//	                 measured samples (imports nothing of polegap)
//	post/workflow/*  what asks for more solutions or combines quantities:
//	                 sweep, target, coil sizing, the supply that drives a
//	                 coil (supply), the quantified safety cautions
//	                 (caution), compare and calibrate, adaptive refinement,
//	                 the design summary, the check, the demo, design scans
//	                 (scan), pole-shim optimisation (shim), the effective
//	                 length (efflen); a workflow may use another
//	post/output/*    text, JSON, CSV, HTML, figures, VTU: formatting only
//
// internal/ holds helpers any layer may use (fileout, compsum, csvtab, num) and
// the tooling (internal/bench, internal/cmd/...), which sits above post beside
// cmd/polegap. layout_test.go checks the direction with `go list`.
package post
