// Package compare sets a measured excitation curve against the model's
// prediction and calibrates model parameters to it.
//
// Compare solves the model at each measured coil current (on one mesh,
// warm-started in order of current) and reports residuals, measured minus
// predicted, absolute and relative, with their RMS and maximum. The
// relative residual is undefined at zero current and at a zero
// prediction (a remanent field over a prediction of nothing): it is nil
// there and such points count in the absolute figures only. A curve of
// search-coil flux-linkage readings is compared through the coil's
// turns-area product (flux linkage = N·A·B).
//
// Calibrate fits one or more parameters together — the gap length, a
// scale on the iron's permeability, the coil's turns, and a constant
// offset (remanence or a probe's zero) — by weighted least squares
// (measure.FitLeastSquares: Gauss–Newton on the residuals over their
// stated standard uncertainties, unweighted when a point has none), and
// reports each fitted value with its standard uncertainty from the
// linearised covariance (W. H. Press et al., Numerical Recipes, 3rd ed.,
// 2007, §15.5), the parameters' correlation, χ² and the degrees of
// freedom ν. When χ²/ν > 1 the uncertainties are scaled by the Birge
// ratio sqrt(χ²/ν) (R. T. Birge, Phys. Rev. 40, 207, 1932; GUM, JCGM
// 100:2008) and the result says so; with no stated uncertainties they
// come from the residual scatter (§15.1). Each change is judged against
// common-practice bounds for a built magnet (stated with each parameter).
package compare
