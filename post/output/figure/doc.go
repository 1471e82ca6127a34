// Package figure draws the pictures of a design: the field map with flux
// lines, the excitation curve with the ideal line and the efficiency, a
// line profile, and measured against predicted. It composes
// post/output/plot's plotters; it computes nothing but what it draws.
// Lengths are drawn in millimetres, fields in tesla.
package figure
