package figure

import (
	"image/color"
	"sort"

	gplot "gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"

	"polegap/post/output/plot"
	"polegap/post/workflow/compare"
)

// Comparison returns the plot of a comparison: measured points with their
// standard-uncertainty error bars, the predicted curve, and (when fit is
// not nil) the curve of the calibrated model.
func Comparison(title string, r *compare.Result, fit *compare.Fit) (*gplot.Plot, error) {
	type pt struct{ i, m, s, p, f float64 }
	pts := make([]pt, len(r.Residuals))
	for k, res := range r.Residuals {
		pts[k] = pt{res.Current, res.Measured, res.Sigma, res.Predicted, 0}
		if fit != nil {
			pts[k].f = fit.After.Residuals[k].Predicted
		}
	}
	sort.Slice(pts, func(a, b int) bool { return pts[a].i < pts[b].i })
	var x, meas, pred, fitted []float64
	for _, p := range pts {
		x = append(x, p.i)
		meas = append(meas, p.m)
		pred = append(pred, p.p)
		fitted = append(fitted, p.f)
	}
	series := []plot.Series{{Name: "predicted", X: x, Y: pred}}
	if fit != nil {
		series = append(series, plot.Series{Name: "calibrated (" + fit.Names() + ")", X: x, Y: fitted, Dashed: true})
	}
	series = append(series, plot.Series{Name: "measured", X: x, Y: meas, Points: true})
	ylabel := "field (T)"
	if r.Unit != "T" {
		ylabel = "flux linkage (Wb-turns)"
	}
	p, err := plot.LineFigure(title, "coil current (A)", ylabel, series...)
	if err != nil {
		return nil, err
	}
	errs := make(plotter.YErrors, len(pts))
	xy := make(plotter.XYs, len(pts))
	any := false
	for k, q := range pts {
		errs[k].Low, errs[k].High = q.s, q.s
		xy[k].X, xy[k].Y = q.i, q.m
		any = any || q.s > 0
	}
	if any {
		eb, err := plotter.NewYErrorBars(struct {
			plotter.XYer
			plotter.YErrorer
		}{xy, errs})
		if err != nil {
			return nil, err
		}
		eb.LineStyle.Color = color.Gray{Y: 40}
		eb.LineStyle.Width = vg.Points(0.8)
		eb.CapWidth = vg.Points(4)
		p.Add(eb)
	}
	return p, nil
}
