// Package report writes what polegap prints and files: the terminal
// summary of a solved model (WriteText, from a design.Report), the check
// table (WriteCheck), the coil sizing (WriteSizing, WriteSizingSummary),
// the self-contained HTML report (WriteHTML) and the folder of a design
// run (WriteFolder: HTML, JSON, PNG, CSV and VTU files, written
// atomically). It formats; the numbers come from post/workflow. No
// non-finite number reaches a summary: the writers return an error
// instead.
//
// JSON keys (the structs' tags in post/workflow/design): "mesh" {nodes,
// triangles, order}, "newton" {iterations, residual, converged}, "probes"
// keyed by probe name (point probes give a, bx, by, b; line, box and
// circle probes give samples and the mean, min and max of |B| and the
// mean By), "energy_j" (per the model's depth for planar models, whole
// revolution for axisymmetric ones).
package report
