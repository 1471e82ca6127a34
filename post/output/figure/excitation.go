package figure

import (
	"fmt"
	"image/color"
	"math"
	"sort"

	gplot "gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"polegap/materials"
	"polegap/models"
	"polegap/post/output/plot"
	"polegap/post/workflow/sweep"
)

// ExcitationOptions add marks to the excitation curve. The zero value adds
// none.
type ExcitationOptions struct {
	// Operating is the ampere-turns of the design's own excitation, marked
	// on the computed curve (0: no mark).
	Operating float64
	// Target is the field the design must reach (T), drawn as a line (0:
	// none).
	Target float64
	// Measured are measured points overlaid as markers, with error bars
	// where their YErr is set.
	Measured []plot.Series
}

// Excitation returns the excitation-curve plots: the field against
// ampere-turns with the ideal line μ0 NI/g (infinitely permeable iron, no
// fringing) when the gap length g is known, and the magnet efficiency
// B g/(μ0 NI) against ampere-turns (nil without g). Measured points, if
// any, are overlaid as markers.
func Excitation(title string, pts []sweep.Point, gap float64, measured ...plot.Series) (*gplot.Plot, *gplot.Plot, error) {
	return ExcitationWith(title, pts, gap, ExcitationOptions{Measured: measured})
}

// ExcitationWith is Excitation with the operating point and the target
// marked.
func ExcitationWith(title string, pts []sweep.Point, gap float64, o ExcitationOptions) (*gplot.Plot, *gplot.Plot, error) {
	pts = append([]sweep.Point(nil), pts...)
	sort.SliceStable(pts, func(a, b int) bool { return math.Abs(pts[a].AmpereTurns) < math.Abs(pts[b].AmpereTurns) })
	ni := make([]float64, len(pts))
	b := make([]float64, len(pts))
	hi := 0.0
	for i, p := range pts {
		ni[i], b[i] = math.Abs(p.AmpereTurns)/1e3, p.Field
		hi = math.Max(hi, ni[i])
	}
	series := []plot.Series{{Name: "computed", X: ni, Y: b}}
	if gap > 0 && len(pts) > 0 {
		series = append(series, plot.Series{Name: fmt.Sprintf("ideal μ0 NI/g, g = %s mm", num(gap*1e3)), X: []float64{0, hi}, Y: []float64{0, materials.Mu0 * hi * 1e3 / gap}, Dashed: true})
	}
	if o.Target > 0 && hi > 0 {
		series = append(series, plot.Series{Name: fmt.Sprintf("target %s T", num(o.Target)), X: []float64{0, hi}, Y: []float64{o.Target, o.Target}, Dashed: true, Colour: color.RGBA{R: 170, G: 30, B: 30, A: 255}})
	}
	series = append(series, o.Measured...)
	if op := math.Abs(o.Operating) / 1e3; op > 0 && len(ni) > 1 && op >= ni[0] && op <= ni[len(ni)-1] {
		bop := interpolate(ni, b, op)
		series = append(series, plot.Series{Name: fmt.Sprintf("operating point %s kA-turns, %.3f T", num(op), bop),
			X: []float64{op}, Y: []float64{bop}, Points: true, Glyph: draw.PyramidGlyph{}, Size: vg.Points(5), Colour: color.Black})
	}
	// The ideal line leaves the drawing above the computed curve; keep
	// the field axis to what the curve, the target and the points need.
	top := 0.0
	for _, s := range series {
		if len(s.Name) > 5 && s.Name[:5] == "ideal" {
			continue
		}
		for k, y := range s.Y {
			e := 0.0
			if s.YErr != nil {
				e = s.YErr[k]
			}
			top = math.Max(top, y+e)
		}
	}
	bp, err := plot.LineFigure(title+": excitation curve", "ampere-turns (kA-turns)", "field |B| (T)", series...)
	if err != nil {
		return nil, nil, err
	}
	if top > 0 {
		bp.Y.Min, bp.Y.Max = 0, 1.08*top
		bp.X.Min = 0
		plot.PlaceLegend(bp, series...)
	}
	if gap <= 0 {
		return bp, nil, nil
	}
	eff := make([]float64, len(pts))
	for i, p := range pts {
		eff[i] = 100 * p.Efficiency
	}
	ep, err := plot.LineFigure(title+": magnet efficiency B g/(μ0 NI)", "ampere-turns (kA-turns)", "efficiency (%)", plot.Series{Name: "computed", X: ni, Y: eff})
	if ep != nil {
		ep.X.Min = 0
	}
	return bp, ep, err
}

// interpolate returns y at x on the polyline (xs, ys), xs increasing.
func interpolate(xs, ys []float64, x float64) float64 {
	i := sort.SearchFloat64s(xs, x)
	switch {
	case i == 0:
		return ys[0]
	case i >= len(xs):
		return ys[len(ys)-1]
	case xs[i] == xs[i-1]:
		return ys[i]
	}
	f := (x - xs[i-1]) / (xs[i] - xs[i-1])
	return ys[i-1] + f*(ys[i]-ys[i-1])
}

// DrawExcitation saves the excitation curve and, when the gap is known, the
// efficiency beside it to path.
func DrawExcitation(path, title string, pts []sweep.Point, gap float64, o ExcitationOptions, out plot.Options) error {
	bp, ep, err := ExcitationWith(title, pts, gap, o)
	if err != nil {
		return err
	}
	row := []*gplot.Plot{bp}
	width := CM(16)
	if ep != nil {
		row = append(row, ep)
		width = CM(30)
	}
	return plot.SaveGrid([][]*gplot.Plot{row}, width, CM(11), path, out)
}

// ModelMarks returns the marks of a model's own design on its excitation
// curve: the ampere-turns of the swept coil (coil, or the first coil when
// empty) at its own current, and the model's target field when the curve
// reads the target's probe (probe, or the model's main probe when empty).
func ModelMarks(m *models.Model, coil, probe string) ExcitationOptions {
	var o ExcitationOptions
	for _, c := range m.Coils {
		if coil == "" || c.Name == coil {
			o.Operating = c.Current * c.Turns
			break
		}
	}
	if probe == "" {
		probe = m.MainProbe()
	}
	if m.Target != nil && m.Target.Probe == probe {
		o.Target = m.Target.Field
	}
	return o
}
