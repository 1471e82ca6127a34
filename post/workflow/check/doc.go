// Package check judges a solved design against its requirements: the
// target field, the field uniformity over a half-width, a saturation
// limit on the iron away from re-entrant corners, and the least relative
// permeability of the iron. Each requirement becomes a CheckItem with its
// value, its limit and PASS or FAIL; post/output/report prints the table
// and the command exits 1 when one fails.
package check
