// Package measure turns what a laboratory measures on a built magnet into a
// measured excitation curve, gap field against coil current with standard
// uncertainties, for comparison with a prediction.
//
// # Inputs
//
//   - A plain CSV (ReadCSV): magnet current and gap field (or search-coil
//     flux linkage) with units in the header, optional uncertainties.
//   - Our measured-data YAML file (Parse, Load; see FORMAT.md): a header
//     (magnet, date, operator, method, instrument constants with their
//     uncertainties) and raw readings per magnet current, reduced here by
//     one of three methods: direct (a field probe, Probe.Field),
//     current-balance (Balance.Reduce) or search-coil (SearchCoil.Calibrate
//     with a Solenoid or a given field per ampere, then SearchCoil.Field).
//
// A ring test of a steel sample (the d.c. ring method of IEC 60404-4) has
// its own YAML format (RingFormatTag; FORMAT.md, "Ring test"): LoadRing
// reads it and RingTest.Reduce (Ring.Reduce) turns it into B-H points with
// standard uncertainties, corrected for the air flux in the search winding
// and for the thick ring's uneven magnetisation (see Ring).
//
// Sample files drawn from a known curve with stated noise are in
// testdata/measured at the repository root (generator: gen_test.go).
//
// FitLeastSquares is the weighted nonlinear least-squares fit the
// calibration uses: several parameters at once, their covariance and
// correlation, χ², the degrees of freedom and the Birge ratio, with the
// uncertainties scaled by it when it exceeds 1.
//
// # Units and uncertainties
//
// SI throughout: A, T, Wb-turns, m, kg, s, V. Every uncertainty is a
// standard uncertainty (one standard deviation), combined by the law of
// propagation of uncertainty for uncorrelated inputs (JCGM 100:2008, the
// GUM, eq. 10). Type A components come from the scatter of repeated
// readings or of a fit's residuals, Type B components from stated
// instrument uncertainties.
//
// # Failures
//
// Bad user input is an *InputError (file, line, field path, what to do);
// a CSV with several bad rows gives an ErrorList of them all. Readings that
// cannot be reduced give a *ReadingsError; a straight-line fit whose
// residuals show the readings are not on a line gives a *NotLineError
// carrying the fit. No NaN or Inf is ever returned. A nil Curve passed to
// Check panics ("measure: ..."). Nothing passed in is mutated.
//
// # Invariants
//
// A Curve returned by ReadCSV, Parse or Load passes Curve.Check: at least
// two points, finite values, non-negative uncertainties, no repeated
// current, points in file order.
package measure
