// Package check judges a solved design against its requirements: the
// target field, the field uniformity over a half-width, and a saturation
// limit on each iron region's peak flux density (the largest mean |B|
// over a disc of stated radius, post/quantity/saturation: a figure that
// converges as the mesh is refined, never the raw corner maximum), by
// default where the region's curve falls to a least relative
// permeability. Each requirement becomes a CheckItem with its
// value, its limit and PASS or FAIL; post/output/report prints the table
// and the command exits 1 when one fails.
package check
