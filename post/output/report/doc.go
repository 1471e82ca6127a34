// Package report writes what polegap prints and files: the terminal
// summary of a solved model (WriteText, from a design.Report), the check
// table (WriteCheck), the coil sizing (WriteSizing, WriteSizingSummary),
// the self-contained HTML report and the folder of a design run
// (WriteFolder: HTML, JSON, PNG, CSV and VTU files, written atomically).
//
// The HTML report is one mechanism for every command: a Document that a
// command fills (NewInputs for the inputs with the model's SHA-256;
// AddReport, AddCheck, AddSweep, AddSizing, AddComparison, AddMesh,
// AddField for the results and pictures; AddCaution for quantified
// cautions) and WriteDocument writes as one self-contained page: the
// cautions at the top, the inputs, the sections, and a revision and
// sign-off block, with print rules for A4 or Letter (a page break before
// each section). The demo's Bundle becomes such a Document (WriteHTML). It formats; the numbers come from post/workflow. No
// non-finite number reaches a summary: the writers return an error
// instead.
//
// JSON (WriteJSON) follows one contract, the JSON Schema (draft 2020-12)
// in schema/output.schema.json at the repository's root: every document
// starts with "schema_version" (SchemaVersion) and "output" (the
// command), keys are snake_case with the unit in the key or stated in the
// schema, enums are words. cmd/polegap's TestJSONSchema validates every
// command's output against it; a new key needs its entry there.
//
// JSON keys of the solve report (the structs' tags in post/workflow/design): "mesh" {nodes,
// triangles, order}, "newton" {iterations, residual, converged}, "probes"
// keyed by probe name (point probes give a, bx, by, b; line, box and
// circle probes give samples and the mean, min and max of |B| and the
// mean By), "energy_j" (per the model's depth for planar models, whole
// revolution for axisymmetric ones).
package report
