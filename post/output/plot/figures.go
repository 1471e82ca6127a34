package plot

import (
	"image/color"
	"math"
	"polegap/post/study"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// RegionColour is the fill colour of a region kind in mesh figures: air
// pale, iron steel-blue grey, coils copper, magnets a muted red.
func RegionColour(kind study.RegionKind) color.Color {
	switch kind {
	case study.KindAir:
		return color.RGBA{R: 246, G: 248, B: 250, A: 255}
	case study.KindIron:
		return color.RGBA{R: 150, G: 165, B: 185, A: 255}
	case study.KindCoil:
		return color.RGBA{R: 214, G: 140, B: 80, A: 255}
	case study.KindMagnet:
		return color.RGBA{R: 190, G: 90, B: 90, A: 255}
	}
	return color.RGBA{R: 200, G: 200, B: 160, A: 255}
}

// MeshFigure returns a plot of a triangle mesh, each triangle filled with
// the colour of its region's kind (kindOf maps a region tag to a kind).
// Lengths are drawn in millimetres.
func MeshFigure(title string, x, y []float64, tri, region []int32, kindOf func(int32) study.RegionKind) *plot.Plot {
	xs, ys := scaled(x, 1e3), scaled(y, 1e3)
	t := NewTriangles(xs, ys, tri)
	t.Fill = make([]color.Color, len(tri)/3)
	for i := range t.Fill {
		t.Fill[i] = RegionColour(kindOf(region[i]))
	}
	if len(tri)/3 > 200000 {
		t.Edge.Width = 0 // edges would only blacken the picture
	}
	p := plot.New()
	p.Title.Text = title
	p.X.Label.Text = "x (mm)"
	p.Y.Label.Text = "y (mm)"
	p.X.Tick.Marker = NiceTicks{N: 6}
	p.Y.Tick.Marker = NiceTicks{N: 6}
	p.Add(t)
	// A legend entry per kind present, in a fixed order.
	present := map[study.RegionKind]bool{}
	for i := range t.Fill {
		present[kindOf(region[i])] = true
	}
	for _, k := range []struct {
		kind study.RegionKind
		name string
	}{{study.KindIron, "iron"}, {study.KindCoil, "coil"}, {study.KindMagnet, "magnet"}, {study.KindAir, "air"}} {
		if present[k.kind] {
			p.Legend.Add(k.name, swatch{RegionColour(k.kind)})
		}
	}
	p.Legend.Top = true
	return p
}

// AxisNames renames a figure's axes r and z for an axisymmetric model.
func AxisNames(p *plot.Plot, axisymmetric bool) {
	if axisymmetric {
		p.X.Label.Text = "r (mm)"
		p.Y.Label.Text = "z (mm)"
	}
}

// swatch is a legend thumbnail: a square of one colour with a grey edge.
type swatch struct{ c color.Color }

func (s swatch) Thumbnail(c *draw.Canvas) {
	pts := []vg.Point{{X: c.Min.X, Y: c.Min.Y}, {X: c.Max.X, Y: c.Min.Y}, {X: c.Max.X, Y: c.Max.Y}, {X: c.Min.X, Y: c.Max.Y}}
	c.FillPolygon(s.c, pts)
	c.StrokeLines(draw.LineStyle{Color: color.Gray{Y: 90}, Width: vg.Points(0.5)}, append(pts, pts[0]))
}

// EqualAspectHeight returns the figure height that gives p's data equal
// scales on both axes for the given width, bounded to [width/4, 2 width].
func EqualAspectHeight(p *plot.Plot, width vg.Length) vg.Length {
	dx := p.X.Max - p.X.Min
	dy := p.Y.Max - p.Y.Min
	if !(dx > 0) || !(dy > 0) || math.IsInf(dx, 0) || math.IsInf(dy, 0) {
		return width
	}
	h := width * vg.Length(dy/dx)
	return max(width/4, min(2*width, h))
}

func scaled(v []float64, f float64) []float64 {
	out := make([]float64, len(v))
	for i, x := range v {
		out[i] = x * f
	}
	return out
}
