// Package demo runs the whole design job on one model: the solve with
// its design quantities and check, an excitation curve from a tenth to
// twice the model's current (warm-started on the compiled study), the
// ampere-turns for the model's target (starting inside the bracket the
// curve gives) and the windings that deliver them. It computes only;
// post/output/report draws the pictures and writes the files.
package demo
