package plot

import (
	"image/color"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Triangles is a plotter that draws a triangle mesh: each triangle filled
// with its own colour and, optionally, its edges stroked.
type Triangles struct {
	X, Y []float64 // node coordinates (data units)
	Tri  []int32   // 3 node indices per triangle
	// Fill holds one colour per triangle; nil leaves triangles unfilled.
	Fill []color.Color
	// Edge is the style of the triangle edges; a zero Width draws none.
	Edge draw.LineStyle
}

// NewTriangles returns a Triangles plotter with thin grey edges.
// It panics if Tri refers to nodes outside X and Y.
func NewTriangles(x, y []float64, tri []int32) *Triangles {
	if len(x) != len(y) || len(tri)%3 != 0 {
		panic("plot: mismatched triangle mesh arrays")
	}
	for _, v := range tri {
		if v < 0 || int(v) >= len(x) {
			panic("plot: triangle refers to a missing node")
		}
	}
	return &Triangles{
		X: x, Y: y, Tri: tri,
		Edge: draw.LineStyle{Color: color.Gray{Y: 90}, Width: vg.Points(0.2)},
	}
}

// Plot implements plot.Plotter.
func (t *Triangles) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	nt := len(t.Tri) / 3
	pts := make([]vg.Point, 4)
	for i := 0; i < nt; i++ {
		for k := 0; k < 3; k++ {
			n := t.Tri[3*i+k]
			pts[k] = vg.Point{X: trX(t.X[n]), Y: trY(t.Y[n])}
		}
		pts[3] = pts[0]
		if t.Fill != nil && t.Fill[i] != nil {
			poly := c.ClipPolygonXY(pts[:3])
			c.FillPolygon(t.Fill[i], poly)
			if t.Edge.Width == 0 && len(poly) > 0 {
				// Stroke with the fill colour so that anti-aliasing leaves
				// no hairline gaps between neighbours.
				c.StrokeLines(draw.LineStyle{Color: t.Fill[i], Width: vg.Points(0.25)}, c.ClipLinesXY(pts)...)
			}
		}
	}
	if t.Edge.Width > 0 {
		for i := 0; i < nt; i++ {
			for k := 0; k < 3; k++ {
				n := t.Tri[3*i+k]
				pts[k] = vg.Point{X: trX(t.X[n]), Y: trY(t.Y[n])}
			}
			pts[3] = pts[0]
			c.StrokeLines(t.Edge, c.ClipLinesXY(pts)...)
		}
	}
}

// DataRange implements plot.DataRanger.
func (t *Triangles) DataRange() (xmin, xmax, ymin, ymax float64) {
	xmin, ymin = math.Inf(1), math.Inf(1)
	xmax, ymax = math.Inf(-1), math.Inf(-1)
	for _, v := range t.Tri {
		xmin = math.Min(xmin, t.X[v])
		xmax = math.Max(xmax, t.X[v])
		ymin = math.Min(ymin, t.Y[v])
		ymax = math.Max(ymax, t.Y[v])
	}
	return xmin, xmax, ymin, ymax
}
