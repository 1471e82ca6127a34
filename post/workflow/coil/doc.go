// Package coil sizes the winding of an electromagnet: given the
// ampere-turns NI the magnet needs (found elsewhere by nonlinear solves)
// and the coil window, it proposes windings — wire, turns, current,
// current density, resistance at temperature, voltage, power, copper mass —
// and flags those that break the supply or cooling limits. It is pure
// arithmetic and does not depend on the solver.
//
// # Contents
//
//   - Copper per IEC 60028: CopperResistivity20 (1/58 Ω·mm²/m),
//     CopperAlpha20 (0.00393 /K), CopperDensity (8890 kg/m³),
//     CopperResistivity and CopperResistance at temperature.
//   - Wire tables (wire_data.go): AWG round wire by the ASTM B258
//     formula (AWGDiameter, AWGWires), enamelled round winding wire with
//     IEC 60317 nominal diameters of the R20/R40 series from 0.1 to 5 mm
//     and grade 1/2 enamel (IECWires), and typical square hollow
//     conductors for water-cooled coils (HollowWires). Every table names
//     its source; values from memory say so.
//     RoundWire, BarWire and HollowBar build conductors outside the tables.
//   - Window (one coil side's cross-section and mean turn), MeanTurnRect
//     and MeanTurnRound for the mean turn, Window.CoolingSurface.
//   - Spec (what the coil must deliver and its limits), Options (every
//     winding that fits), FitTurns, Best and Explain, and the text and
//     CSV writers WriteTable and WriteCSV.
//   - Review (review.go): Absurd and WriteReviewTable, the terminal
//     table of what a designer acts on with the far-from-buildable
//     windings left out and counted; LimitLines, the limits used and
//     their sources; the common-practice water limits CommonWaterPressure,
//     CommonWaterSpeed and CommonWaterCircuits.
//   - Cautions: the general safety notes (package caution builds the
//     quantified ones a Sizing carries).
//
// # Units
//
// SI throughout: m, m², A, A/m², Ω, V, W, kg, °C (temperatures), K
// (differences). Only the table writers print engineering units (mm,
// A/mm²), and the CSV header names each column's unit.
//
// # Method
//
// A winding of N turns of copper area A and mean turn l carrying the
// ampere-turns NI has I = NI/N, J = I/A, R = ρ(T) N l/A, V = I R and
// P = I² R = ρ(T) J² V_Cu with V_Cu = N A l: for a given copper fill the
// power depends on the window and NI only, and the wire size chooses the
// voltage-to-current ratio. The turns that fit are counted with a fill
// factor (default) or by the layer geometry (Packing). The limits on
// current density and heat are common practice and are stated beside
// their constants. For water cooling the flow follows from the power and
// the water's temperature rise; in a hollow conductor the bore speed,
// Reynolds number and the pressure drop of each parallel circuit follow
// by Darcy–Weisbach with the Blasius (1913) or laminar friction factor,
// and the hottest conductor (outlet water plus the wall film, Gnielinski
// 1976) is checked against the coil temperature. With
// Spec.MaxWaterCircuits the number of parallel circuits is chosen per
// winding: the fewest that meet the pressure, speed and temperature
// limits.
//
// # Failures and invariants
//
// A spec that cannot describe a coil is a *SpecError from Spec.Validate;
// a wire with unphysical dimensions is a *WireError from Wire.Check; no
// winding that meets every limit is explained by Explain as a *NoneError.
// Options panics ("coil: ...") on a spec or wire that fails those checks,
// and on unknown enum values (programmer misuse). For a valid spec every
// returned quantity is finite, Turns × Current equals AmpereTurns, and
// nothing mutates its inputs.
package coil
