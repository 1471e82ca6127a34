// Package figure draws the pictures of a design: the field map with flux
// lines, labels and a gap detail (FieldFigure, DrawField), the mesh
// (Mesh), the excitation curve with the operating point, the target, the
// ideal line and the efficiency (ExcitationWith), a line profile, and
// measured against predicted with a residual panel (ComparisonPanels). It
// composes post/output/plot's plotters; it computes nothing but what it
// draws (a colour range, flux levels, a label's place). Lengths are drawn
// in millimetres, fields in tesla; an axisymmetric model's axes are r and
// z and its components Br and Bz.
//
// Options structs have meaningful zero values: FieldOptions{} is the
// cropped map with the colour range set by the 99th percentile of |B| in
// the iron, ExcitationOptions{} marks nothing. Golden images of the
// examples' field maps are in testdata (go test -update rewrites them).
package figure
