// Package caution builds the safety cautions polegap prints with its
// results, quantified from the design where the numbers are known: the
// energy stored in the field, the voltage at switch-off, the attraction
// between the poles, the coil's temperature, the cooling water's
// interlocks, a coil driven past its rated current, and the pointer to
// local codes and licensed practice.
//
// The list is data (List returns []Caution, each with its hazard, its
// sentence and its figure) so that the terminal text and the HTML report
// render the same cautions from one place. A Caution encodes to JSON as
// its sentence alone.
//
// # Units
//
// SI in Facts (J, V, A, N, W, kg, Pa, °C); the sentences use engineering
// prefixes.
//
// # Invariants
//
// List always returns at least the general hazard, the switch-off, the
// pole-force, the coil-heat and the codes cautions, in that order, with
// the water and overdrive cautions inserted when they apply; zero facts
// leave the sentence general. Nothing panics.
package caution
