package figure

import (
	"math"

	gplot "gonum.org/v1/plot"

	"polegap/post/output/plot"
)

// ShimProfiles returns the plot of ΔB/B0 along the mid-plane before and
// after shimming (x from the gap centre, m, drawn in mm), with the
// tolerance band ±tol dashed.
func ShimProfiles(title string, bx, bdev, ax, adev []float64, tol float64) (*gplot.Plot, error) {
	mm := func(v []float64) []float64 {
		out := make([]float64, len(v))
		for i, x := range v {
			out[i] = 1e3 * x
		}
		return out
	}
	lo, hi := 0.0, 0.0
	for _, v := range [][]float64{bx, ax} {
		if len(v) > 0 {
			lo, hi = min(lo, 1e3*v[0]), max(hi, 1e3*v[len(v)-1])
		}
	}
	p, err := plot.LineFigure(title, "x from the gap centre (mm)", "ΔB/B0",
		plot.Series{Name: "unshimmed", X: mm(bx), Y: bdev},
		plot.Series{Name: "shimmed", X: mm(ax), Y: adev},
		plot.Series{Name: "+ tolerance", X: []float64{lo, hi}, Y: []float64{tol, tol}, Dashed: true},
		plot.Series{Name: "− tolerance", X: []float64{lo, hi}, Y: []float64{-tol, -tol}, Dashed: true})
	if err != nil {
		return nil, err
	}
	// The interesting range: ten tolerances either side of zero, and the
	// stretch of the mid-plane where either profile is inside them (with
	// a fifth more on each side).
	p.Y.Min, p.Y.Max = -10*tol, 10*tol
	reach := 0.0
	for _, pr := range [][2][]float64{{bx, bdev}, {ax, adev}} {
		for i, x := range pr[0] {
			if math.Abs(pr[1][i]) <= 10*tol {
				reach = math.Max(reach, math.Abs(1e3*x))
			}
		}
	}
	if reach > 0 {
		p.X.Min, p.X.Max = max(lo, -1.2*reach), min(hi, 1.2*reach)
	}
	return p, nil
}
