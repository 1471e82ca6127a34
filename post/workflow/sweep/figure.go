package sweep

import (
	"math"

	gplot "gonum.org/v1/plot"

	"polegap/internal/num"
	"polegap/post/output/plot"
)

// Figures returns the excitation-curve plots: the field against
// ampere-turns with the ideal line μ0 NI/g (infinitely permeable iron, no
// fringing) when the gap length g is known, and the magnet efficiency
// B g/(μ0 NI) against ampere-turns (nil without g). Measured points, if
// any, are overlaid as markers.
func Figures(title string, pts []Point, gap float64, measured ...plot.Series) (*gplot.Plot, *gplot.Plot, error) {
	ni := make([]float64, len(pts))
	b := make([]float64, len(pts))
	for i, p := range pts {
		ni[i], b[i] = math.Abs(p.AmpereTurns)/1e3, p.Field
	}
	series := []plot.Series{{Name: "computed", X: ni, Y: b}}
	if gap > 0 && len(pts) > 0 {
		hi := 0.0
		for _, v := range ni {
			hi = math.Max(hi, v)
		}
		series = append(series, plot.Series{Name: "ideal μ0 NI/g", X: []float64{0, hi}, Y: []float64{0, num.Mu0 * hi * 1e3 / gap}, Dashed: true})
	}
	series = append(series, measured...)
	bp, err := plot.LineFigure(title+": excitation curve", "ampere-turns (kA)", "field (T)", series...)
	if err != nil || gap <= 0 {
		return bp, nil, err
	}
	eff := make([]float64, len(pts))
	for i, p := range pts {
		eff[i] = 100 * p.Efficiency
	}
	ep, err := plot.LineFigure("magnet efficiency B g/(μ0 NI)", "ampere-turns (kA)", "efficiency (%)", plot.Series{Name: "computed", X: ni, Y: eff})
	return bp, ep, err
}
