// Package design gathers what a designer reads off one solved model into
// one plain structure with JSON tags: mesh and Newton figures, probes,
// and the design quantities of post/quantity — gap field and pole-face
// mean, uniformity and good-field half-widths, fringing, coil flux
// linkage and inductances (incremental by two extra solves), energy and
// co-energy, saturation per iron region, and forces (Maxwell stress, and
// virtual work by re-meshed solves on request). post/output/report
// writes it as text and JSON. Units are SI (lengths m, fields T).
package design
