package library

import (
	gplot "gonum.org/v1/plot"

	"polegap/materials"
	"polegap/post/measure"
	"polegap/post/output/plot"
)

// RingFigure plots a reduced ring test: B against H with bars of ±2
// standard uncertainties in B (drawn as two dashed envelopes), and the
// built-in curve compare (a library name, "" for none) for reference.
func RingFigure(res *measure.RingResult, compare string) (*gplot.Plot, error) {
	n := len(res.Points)
	hk, b, lo, hi := make([]float64, n), make([]float64, n), make([]float64, n), make([]float64, n)
	for i, p := range res.Points {
		hk[i] = p.H / 1e3
		b[i] = p.B
		lo[i], hi[i] = p.B-2*p.BSigma, p.B+2*p.BSigma
	}
	series := []plot.Series{
		{Name: "ring test", X: hk, Y: b, Points: true},
		{Name: "±2 u(B)", X: hk, Y: hi, Dashed: true},
		{Name: "", X: hk, Y: lo, Dashed: true},
	}
	if compare != "" {
		m, _, ok := materials.Lookup(compare)
		if c, isCurve := m.(*materials.Curve); ok && isCurve {
			cb := make([]float64, n)
			for i, p := range res.Points {
				cb[i] = c.B(p.H)
			}
			series = append(series, plot.Series{Name: compare, X: hk, Y: cb})
		}
	}
	p, err := plot.LineFigure("ring test: B-H curve", "H (kA/m, log scale)", "B (T)", series...)
	if err != nil {
		return nil, err
	}
	p.X.Scale = gplot.LogScale{}
	p.X.Tick.Marker = gplot.LogTicks{Prec: -1}
	return p, nil
}
