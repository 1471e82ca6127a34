package plot

import (
	"fmt"
	"image/color"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
)

// Series is one curve of a line plot.
type Series struct {
	Name   string
	X, Y   []float64
	Dashed bool
	Points bool // draw markers instead of (or as well as) a line
}

// lineColours holds the line colours of curve plots, in order.
var lineColours = []color.Color{
	color.RGBA{R: 30, G: 90, B: 160, A: 255},
	color.RGBA{R: 200, G: 90, B: 30, A: 255},
	color.RGBA{R: 60, G: 140, B: 70, A: 255},
	color.RGBA{R: 140, G: 60, B: 140, A: 255},
	color.RGBA{R: 90, G: 90, B: 90, A: 255},
}

// LineFigure returns a plot of the series with the given title and axis
// labels. It returns an error, not a panic, for a non-finite value.
func LineFigure(title, xlabel, ylabel string, series ...Series) (*plot.Plot, error) {
	p := plot.New()
	p.Title.Text = title
	p.X.Label.Text = xlabel
	p.Y.Label.Text = ylabel
	p.Add(plotter.NewGrid())
	for i, s := range series {
		if len(s.X) != len(s.Y) {
			panic("plot: series with unequal X and Y")
		}
		xy := make(plotter.XYs, len(s.X))
		for k := range s.X {
			if math.IsNaN(s.X[k]) || math.IsInf(s.X[k], 0) || math.IsNaN(s.Y[k]) || math.IsInf(s.Y[k], 0) {
				return nil, fmt.Errorf("plot %q: series %q has a non-finite point at index %d", title, s.Name, k)
			}
			xy[k].X, xy[k].Y = s.X[k], s.Y[k]
		}
		col := lineColours[i%len(lineColours)]
		if s.Points {
			sc, err := plotter.NewScatter(xy)
			if err != nil {
				return nil, err
			}
			sc.GlyphStyle.Color = col
			sc.GlyphStyle.Radius = vg.Points(2.5)
			p.Add(sc)
			if s.Name != "" {
				p.Legend.Add(s.Name, sc)
			}
			continue
		}
		l, err := plotter.NewLine(xy)
		if err != nil {
			return nil, err
		}
		l.LineStyle.Color = col
		l.LineStyle.Width = vg.Points(1.5)
		if s.Dashed {
			l.LineStyle.Dashes = []vg.Length{vg.Points(5), vg.Points(3)}
		}
		p.Add(l)
		if s.Name != "" {
			p.Legend.Add(s.Name, l)
		}
	}
	p.Legend.Top = false
	p.Legend.Left = false
	return p, nil
}
