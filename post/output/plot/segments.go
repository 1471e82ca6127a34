package plot

import (
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Segments is a plotter that draws separate line segments (x0, y0, x1, y1),
// such as the outlines of a model's regions.
type Segments struct {
	Segs [][4]float64
	Line draw.LineStyle
}

// Plot implements plot.Plotter.
func (s *Segments) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	for _, g := range s.Segs {
		pts := []vg.Point{{X: trX(g[0]), Y: trY(g[1])}, {X: trX(g[2]), Y: trY(g[3])}}
		c.StrokeLines(s.Line, c.ClipLinesXY(pts)...)
	}
}

// DataRange implements plot.DataRanger.
func (s *Segments) DataRange() (xmin, xmax, ymin, ymax float64) {
	xmin, ymin = math.Inf(1), math.Inf(1)
	xmax, ymax = math.Inf(-1), math.Inf(-1)
	for _, g := range s.Segs {
		xmin = math.Min(xmin, math.Min(g[0], g[2]))
		xmax = math.Max(xmax, math.Max(g[0], g[2]))
		ymin = math.Min(ymin, math.Min(g[1], g[3]))
		ymax = math.Max(ymax, math.Max(g[1], g[3]))
	}
	return
}

// Outline returns the segments of triangle edges that carry a marker
// (region interfaces and boundaries), each once, scaled by f.
func Outline(x, y []float64, tri, edgeMarker, nbr []int32, keep func(t int) bool, f float64) [][4]float64 {
	var out [][4]float64
	for t := 0; t < len(tri)/3; t++ {
		if !keep(t) {
			continue
		}
		for k := 0; k < 3; k++ {
			if edgeMarker[3*t+k] == 0 {
				continue
			}
			// Interior edges appear in both triangles: keep one.
			if n := nbr[3*t+k]; n >= 0 && int(n) < t && keep(int(n)) {
				continue
			}
			a, b := tri[3*t+(k+1)%3], tri[3*t+(k+2)%3]
			out = append(out, [4]float64{x[a] * f, y[a] * f, x[b] * f, y[b] * f})
		}
	}
	return out
}
