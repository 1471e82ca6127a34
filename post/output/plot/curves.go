package plot

import (
	"fmt"
	"image/color"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Series is one curve of a line plot.
type Series struct {
	Name   string
	X, Y   []float64
	Dashed bool
	Points bool // draw markers instead of a line
	// YErr, if not nil, holds a standard uncertainty per point, drawn as
	// an error bar of ±YErr.
	YErr []float64
	// Colour overrides the series' colour from the cycle when not nil.
	Colour color.Color
	// Glyph is the marker shape of a Points series; nil is a circle.
	Glyph draw.GlyphDrawer
	// Size is the marker radius; 0 means 2.5 points.
	Size vg.Length
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
// labels (units belong in the labels): nice ticks on both axes (NiceTicks),
// and the legend in the corner where it covers the fewest points. It
// returns an error, not a panic, for a non-finite value.
func LineFigure(title, xlabel, ylabel string, series ...Series) (*plot.Plot, error) {
	p := plot.New()
	p.Title.Text = title
	p.X.Label.Text = xlabel
	p.Y.Label.Text = ylabel
	p.X.Tick.Marker = NiceTicks{N: 6}
	p.Y.Tick.Marker = NiceTicks{N: 6}
	p.Add(plotter.NewGrid())
	if err := AddSeries(p, series...); err != nil {
		return nil, err
	}
	PlaceLegend(p, series...)
	return p, nil
}

// AddSeries adds the series to p, colours continuing the cycle after the
// series p holds already.
func AddSeries(p *plot.Plot, series ...Series) error {
	for i, s := range series {
		if len(s.X) != len(s.Y) || (s.YErr != nil && len(s.YErr) != len(s.X)) {
			panic("plot: series with unequal X, Y and YErr")
		}
		xy := make(plotter.XYs, len(s.X))
		for k := range s.X {
			if math.IsNaN(s.X[k]) || math.IsInf(s.X[k], 0) || math.IsNaN(s.Y[k]) || math.IsInf(s.Y[k], 0) {
				return fmt.Errorf("plot %q: series %q has a non-finite point at index %d", p.Title.Text, s.Name, k)
			}
			xy[k].X, xy[k].Y = s.X[k], s.Y[k]
		}
		col := s.Colour
		if col == nil {
			col = lineColours[i%len(lineColours)]
		}
		if s.YErr != nil {
			errs := make(plotter.YErrors, len(s.YErr))
			for k, e := range s.YErr {
				errs[k].Low, errs[k].High = e, e
			}
			eb, err := plotter.NewYErrorBars(struct {
				plotter.XYer
				plotter.YErrorer
			}{xy, errs})
			if err != nil {
				return err
			}
			eb.LineStyle.Color = col
			eb.LineStyle.Width = vg.Points(0.8)
			eb.CapWidth = vg.Points(4)
			p.Add(eb)
		}
		var thumb plot.Thumbnailer
		if s.Points {
			sc, err := plotter.NewScatter(xy)
			if err != nil {
				return err
			}
			sc.GlyphStyle.Color = col
			sc.GlyphStyle.Radius = vg.Points(2.5)
			if s.Size > 0 {
				sc.GlyphStyle.Radius = s.Size
			}
			if s.Glyph != nil {
				sc.GlyphStyle.Shape = s.Glyph
			}
			p.Add(sc)
			thumb = sc
		} else {
			l, err := plotter.NewLine(xy)
			if err != nil {
				return err
			}
			l.LineStyle.Color = col
			l.LineStyle.Width = vg.Points(1.5)
			if s.Dashed {
				l.LineStyle.Dashes = []vg.Length{vg.Points(5), vg.Points(3)}
			}
			p.Add(l)
			thumb = l
		}
		if s.Name != "" {
			p.Legend.Add(s.Name, thumb)
		}
	}
	return nil
}

// PlaceLegend puts p's legend in the corner of the plotting area where it
// covers the fewest points of the series (and of the lines between them):
// each corner's box, a legend-sized share of the axes' ranges, is tested
// against points sampled along every series.
func PlaceLegend(p *plot.Plot, series ...Series) {
	xmin, xmax, ymin, ymax := p.X.Min, p.X.Max, p.Y.Min, p.Y.Max
	if !(xmax > xmin) || !(ymax > ymin) {
		return
	}
	entries := 0
	for _, s := range series {
		if s.Name != "" {
			entries++
		}
	}
	w, h := 0.45, math.Min(0.9, 0.07*float64(entries)+0.04)
	type corner struct{ left, top bool }
	best, bestN := corner{false, false}, math.MaxInt
	for _, c := range []corner{{false, false}, {true, true}, {false, true}, {true, false}} {
		x0, y0 := 1-w, 0.0
		if c.left {
			x0 = 0
		}
		if c.top {
			y0 = 1 - h
		}
		n := 0
		for _, s := range series {
			for k := range s.X {
				// the point and, for lines, 8 points on the way to the next
				steps := 1
				if !s.Points && k+1 < len(s.X) {
					steps = 8
				}
				for q := 0; q < steps; q++ {
					f := float64(q) / float64(steps)
					x, y := s.X[k], s.Y[k]
					if q > 0 {
						x += f * (s.X[k+1] - s.X[k])
						y += f * (s.Y[k+1] - s.Y[k])
					}
					u, v := (x-xmin)/(xmax-xmin), (y-ymin)/(ymax-ymin)
					if u >= x0 && u <= x0+w && v >= y0 && v <= y0+h {
						n++
					}
				}
			}
		}
		if n < bestN {
			best, bestN = c, n
		}
	}
	p.Legend.Left, p.Legend.Top = best.left, best.top
	p.Legend.XOffs, p.Legend.YOffs = vg.Points(-4), vg.Points(4)
	if best.left {
		p.Legend.XOffs = vg.Points(4)
	}
	if best.top {
		p.Legend.YOffs = vg.Points(-4)
	}
}

// ResidualFigure returns a residual panel: residuals r (same unit as
// ylabel) with their error bars sigma (nil for none) against x, and a line
// at zero. It is meant to sit under the curve it belongs to (RenderStack).
func ResidualFigure(xlabel, ylabel string, series ...Series) (*plot.Plot, error) {
	p, err := LineFigure("", xlabel, ylabel, series...)
	if err != nil {
		return nil, err
	}
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, s := range series {
		for _, x := range s.X {
			lo, hi = math.Min(lo, x), math.Max(hi, x)
		}
	}
	if hi > lo {
		zero, _ := plotter.NewLine(plotter.XYs{{X: lo, Y: 0}, {X: hi, Y: 0}})
		zero.LineStyle.Color = color.Gray{Y: 60}
		zero.LineStyle.Width = vg.Points(0.8)
		p.Add(zero)
	}
	// Symmetric about zero, so the eye sees a bias at once.
	m := math.Max(math.Abs(p.Y.Min), math.Abs(p.Y.Max))
	if m > 0 {
		p.Y.Min, p.Y.Max = -1.1*m, 1.1*m
	}
	p.Y.Tick.Marker = NiceTicks{N: 4}
	PlaceLegend(p, series...)
	return p, nil
}
