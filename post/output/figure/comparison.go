package figure

import (
	"fmt"
	"sort"

	gplot "gonum.org/v1/plot"

	"polegap/post/output/plot"
	"polegap/post/workflow/compare"
)

// Comparison returns the plot of a comparison: measured points with their
// standard-uncertainty error bars, the predicted curve, and (when fit is
// not nil) the curve of the calibrated model.
func Comparison(title string, r *compare.Result, fit *compare.Fit) (*gplot.Plot, error) {
	p, _, err := ComparisonPanels(title, r, fit)
	return p, err
}

// ComparisonPanels returns the comparison plot and its residual panel:
// measured − predicted (in thousandths of the unit, mT for a field) with
// the measurement's error bars, for the prediction and, with a fit, for
// the calibrated model. The residuals are the comparison's own
// (compare.Result.Residuals); nothing is recomputed here.
func ComparisonPanels(title string, r *compare.Result, fit *compare.Fit) (*gplot.Plot, *gplot.Plot, error) {
	type pt struct{ i, m, s, p, f, ra, rf float64 }
	pts := make([]pt, len(r.Residuals))
	for k, res := range r.Residuals {
		pts[k] = pt{i: res.Current, m: res.Measured, s: res.Sigma, p: res.Predicted, ra: res.Abs}
		if fit != nil {
			pts[k].f = fit.After.Residuals[k].Predicted
			pts[k].rf = fit.After.Residuals[k].Abs
		}
	}
	sort.Slice(pts, func(a, b int) bool { return pts[a].i < pts[b].i })
	var x, meas, sig, pred, fitted, res, resFit, resSig []float64
	anySigma := false
	for _, p := range pts {
		x = append(x, p.i)
		meas = append(meas, p.m)
		sig = append(sig, p.s)
		pred = append(pred, p.p)
		fitted = append(fitted, p.f)
		res = append(res, 1e3*p.ra)
		resFit = append(resFit, 1e3*p.rf)
		resSig = append(resSig, 1e3*p.s)
		anySigma = anySigma || p.s > 0
	}
	if !anySigma {
		sig, resSig = nil, nil
	}
	series := []plot.Series{{Name: "predicted", X: x, Y: pred}}
	if fit != nil {
		series = append(series, plot.Series{Name: "calibrated (" + fit.Names() + ")", X: x, Y: fitted, Dashed: true})
	}
	measName := "measured"
	if anySigma {
		measName = "measured ± 1σ"
	}
	series = append(series, plot.Series{Name: measName, X: x, Y: meas, YErr: sig, Points: true})
	ylabel, rlabel := "field |B| (T)", "residual (mT)"
	if r.Unit != "T" {
		ylabel, rlabel = "flux linkage (Wb-turns)", "residual (mWb-turns)"
	}
	p, err := plot.LineFigure(title, "coil current (A)", ylabel, series...)
	if err != nil {
		return nil, nil, err
	}
	rs := []plot.Series{{Name: fmt.Sprintf("measured − predicted, rms %.3g %s", 1e3*r.RMS, milli(r.Unit)), X: x, Y: res, YErr: resSig, Points: true}}
	if fit != nil {
		rs = append(rs, plot.Series{Name: fmt.Sprintf("measured − calibrated, rms %.3g %s", 1e3*fit.After.RMS, milli(r.Unit)), X: x, Y: resFit, Points: true})
	}
	rp, err := plot.ResidualFigure("coil current (A)", rlabel, rs...)
	if err != nil {
		return nil, nil, err
	}
	rp.X.Min, rp.X.Max = p.X.Min, p.X.Max
	return p, rp, nil
}

// DrawComparison saves the comparison and its residual panel, one above
// the other with their current axes aligned, to path.
func DrawComparison(path, title string, r *compare.Result, fit *compare.Fit, out plot.Options) error {
	p, rp, err := ComparisonPanels(title, r, fit)
	if err != nil {
		return err
	}
	return plot.SaveStack([]*gplot.Plot{p, rp}, []float64{2.2, 1}, CM(16), CM(15), path, out)
}

// milli returns the unit a thousand times smaller.
func milli(unit string) string {
	if unit == "T" {
		return "mT"
	}
	return "m" + unit
}
