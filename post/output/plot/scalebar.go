package plot

import (
	"image/color"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// ScaleBar is a plotter that draws a vertical colour bar of a FieldScale
// as Steps filled rectangles, vector shapes in every format (an embedded
// one-pixel-wide image, as gonum's ColorBar draws, is kept at its own
// aspect ratio by browsers and collapses to a hairline in SVG). With Over
// set, a box of that colour sits above the bar, a gap apart, for the
// values above the scale's top.
type ScaleBar struct {
	Scale *FieldScale
	Steps int         // rectangles; 0 means 256
	Over  color.Color // nil: no box above
}

// overShare is the height of the over box as a fraction of the bar's
// value range; the box starts overGap above the top.
const overShare, overGap = 0.06, 0.025

// Plot implements plot.Plotter.
func (b *ScaleBar) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	n := b.Steps
	if n <= 0 {
		n = 256
	}
	lo, hi := b.Scale.Min(), b.Scale.Max()
	x0, x1 := trX(0), trX(1)
	for i := 0; i < n; i++ {
		ya := trY(lo + (hi-lo)*float64(i)/float64(n))
		yb := trY(lo + (hi-lo)*float64(i+1)/float64(n))
		if i < n-1 {
			yb += (yb - ya) / 2 // overlap the next step: no hairline between them
		}
		col := scaleColour((float64(i)+0.5)/float64(n), 1)
		c.FillPolygon(col, []vg.Point{{X: x0, Y: ya}, {X: x1, Y: ya}, {X: x1, Y: yb}, {X: x0, Y: yb}})
	}
	frame := draw.LineStyle{Color: color.Gray{Y: 60}, Width: vg.Points(0.5)}
	c.StrokeLines(frame, []vg.Point{{X: x0, Y: trY(lo)}, {X: x1, Y: trY(lo)}, {X: x1, Y: trY(hi)}, {X: x0, Y: trY(hi)}, {X: x0, Y: trY(lo)}})
	if b.Over != nil {
		ya, yb := trY(hi+overGap*(hi-lo)), trY(hi+(overGap+overShare)*(hi-lo))
		box := []vg.Point{{X: x0, Y: ya}, {X: x1, Y: ya}, {X: x1, Y: yb}, {X: x0, Y: yb}}
		c.FillPolygon(b.Over, box)
		c.StrokeLines(frame, append(box, box[0]))
	}
}

// DataRange implements plot.DataRanger: x over [0, 1], y over the scale
// and the over box.
func (b *ScaleBar) DataRange() (xmin, xmax, ymin, ymax float64) {
	lo, hi := b.Scale.Min(), b.Scale.Max()
	if b.Over != nil {
		hi += (overGap + overShare) * (hi - lo)
	}
	return 0, 1, lo, hi
}
