// Package compare sets a measured excitation curve against the model's
// prediction and calibrates one model parameter to it.
//
// Compare solves the model at each measured coil current (on one mesh,
// warm-started in order of current) and reports residuals, measured minus
// predicted, absolute and relative, with their RMS and maximum. A curve of
// search-coil flux-linkage readings is compared through the coil's
// turns-area product (flux linkage = N·A·B).
//
// Calibrate fits one parameter — the gap length, a scale on the iron's
// permeability, or the coil's turns — by Gauss–Newton on the weighted
// residuals (each residual over its stated standard uncertainty, or
// unweighted when none is given), the derivative by finite differences
// and then secants, and reports the fitted value with its standard
// uncertainty from the linearised least-squares covariance (W. H. Press et
// al., Numerical Recipes, 3rd ed., 2007, §15.5; with unknown uncertainties
// scaled by the residual variance, §15.1) and whether the change is
// plausible for a built magnet (common-practice bounds stated with each
// parameter).
package compare
