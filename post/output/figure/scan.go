package figure

import (
	"fmt"
	"math"
	"slices"

	gplot "gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"

	"polegap/post/output/plot"
)

// ScanQuantity returns the plot of one quantity of a design scan against
// one parameter: a marker per variant, with its error estimate as a bar
// when est is given (nil: none). Variants with a NaN are left out.
func ScanQuantity(title, xlabel, ylabel string, x, y, est []float64) (*gplot.Plot, error) {
	var px, py, pe []float64
	for i := range x {
		if math.IsNaN(x[i]) || math.IsNaN(y[i]) {
			continue
		}
		px, py = append(px, x[i]), append(py, y[i])
		if est != nil && est[i] > 0 && !math.IsInf(est[i], 0) {
			pe = append(pe, est[i])
		} else if est != nil {
			pe = append(pe, 0)
		}
	}
	if slices.Max(append([]float64{0}, pe...)) == 0 {
		pe = nil // nothing estimated (quick mode): no bars
	}
	if len(px) == 0 {
		return nil, fmt.Errorf("plot %q: no variant has both %s and %s", title, xlabel, ylabel)
	}
	p, err := plot.LineFigure(title, xlabel, ylabel, plot.Series{Name: "variants", X: px, Y: py, Points: true})
	if err != nil || pe == nil {
		return p, err
	}
	return p, addErrorBars(p, px, py, pe)
}

// addErrorBars draws ±e around each point.
func addErrorBars(p *gplot.Plot, x, y, e []float64) error {
	pts := make(errXY, len(x))
	for i := range x {
		pts[i] = [3]float64{x[i], y[i], e[i]}
	}
	bars, err := plotter.NewYErrorBars(pts)
	if err != nil {
		return err
	}
	p.Add(bars)
	return nil
}

// errXY is points with a symmetric y error, for plotter.NewYErrorBars.
type errXY [][3]float64

func (e errXY) Len() int                        { return len(e) }
func (e errXY) XY(i int) (float64, float64)     { return e[i][0], e[i][1] }
func (e errXY) YError(i int) (float64, float64) { return e[i][2], e[i][2] }

// Pareto returns the plot of two objectives of a design scan: every
// variant as a marker and the Pareto front (indices into a and b, in
// order along it) as a line through its variants.
func Pareto(title, alabel, blabel string, a, b []float64, front []int) (*gplot.Plot, error) {
	var pa, pb, fa, fb []float64
	for i := range a {
		if !math.IsNaN(a[i]) && !math.IsNaN(b[i]) {
			pa, pb = append(pa, a[i]), append(pb, b[i])
		}
	}
	for _, i := range front {
		fa, fb = append(fa, a[i]), append(fb, b[i])
	}
	if len(pa) == 0 {
		return nil, fmt.Errorf("plot %q: no variant has both %s and %s", title, alabel, blabel)
	}
	return plot.LineFigure(title, alabel, blabel,
		plot.Series{Name: "variants", X: pa, Y: pb, Points: true},
		plot.Series{Name: "Pareto front", X: fa, Y: fb})
}
