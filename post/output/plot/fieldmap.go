package plot

import (
	"image/color"
	"math"
	"sort"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/palette"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Isolines is a plotter that draws contour lines of a potential that is
// linear on each triangle (values at the corners): for a planar vector
// potential these are the flux lines, equally spaced in flux.
type Isolines struct {
	X, Y   []float64
	Tri    []int32
	Value  []float64 // per node
	Levels []float64
	Line   draw.LineStyle
}

// Plot implements plot.Plotter.
func (l *Isolines) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	for _, seg := range l.Segments() {
		pts := []vg.Point{{X: trX(seg[0]), Y: trY(seg[1])}, {X: trX(seg[2]), Y: trY(seg[3])}}
		c.StrokeLines(l.Line, c.ClipLinesXY(pts)...)
	}
}

// Segments returns the contour segments as (x0, y0, x1, y1), level by
// level, so that tests can check them without drawing.
func (l *Isolines) Segments() [][4]float64 {
	var out [][4]float64
	levels := append([]float64(nil), l.Levels...)
	sort.Float64s(levels)
	for t := 0; t < len(l.Tri)/3; t++ {
		n := [3]int32{l.Tri[3*t], l.Tri[3*t+1], l.Tri[3*t+2]}
		v := [3]float64{l.Value[n[0]], l.Value[n[1]], l.Value[n[2]]}
		lo := math.Min(v[0], math.Min(v[1], v[2]))
		hi := math.Max(v[0], math.Max(v[1], v[2]))
		i := sort.SearchFloat64s(levels, lo)
		for ; i < len(levels) && levels[i] <= hi; i++ {
			lev := levels[i]
			var pts [][2]float64
			for k := 0; k < 3; k++ {
				a, b := k, (k+1)%3
				va, vb := v[a], v[b]
				if (va < lev) == (vb < lev) || va == vb {
					continue
				}
				s := (lev - va) / (vb - va)
				pts = append(pts, [2]float64{
					l.X[n[a]] + s*(l.X[n[b]]-l.X[n[a]]),
					l.Y[n[a]] + s*(l.Y[n[b]]-l.Y[n[a]]),
				})
			}
			if len(pts) == 2 {
				out = append(out, [4]float64{pts[0][0], pts[0][1], pts[1][0], pts[1][1]})
			}
		}
	}
	return out
}

// DataRange implements plot.DataRanger.
func (l *Isolines) DataRange() (xmin, xmax, ymin, ymax float64) {
	t := Triangles{X: l.X, Y: l.Y, Tri: l.Tri}
	return t.DataRange()
}

// EvenLevels returns n levels evenly spaced strictly inside the range of
// v (flux lines at equal flux steps).
func EvenLevels(v []float64, n int) []float64 {
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, x := range v {
		lo, hi = math.Min(lo, x), math.Max(hi, x)
	}
	if !(hi > lo) || n < 1 {
		return nil
	}
	out := make([]float64, n)
	for i := range out {
		out[i] = lo + (hi-lo)*(float64(i)+0.5)/float64(n)
	}
	return out
}

// FieldMap returns a plot of the flux density magnitude (one value per
// triangle, tesla) as filled triangles over a colour scale from 0 to bmax,
// with flux lines drawn as isolines of potential (one value per corner
// node). Lengths are drawn in millimetres. The colour bar is returned as a
// second plot, to be placed beside the map with SaveGrid.
func FieldMap(title string, x, y []float64, tri []int32, bmag []float64, potential []float64, lines int) (*plot.Plot, *plot.Plot) {
	xs, ys := scaled(x, 1e3), scaled(y, 1e3)
	bmax := 0.0
	for _, b := range bmag {
		if !math.IsNaN(b) && !math.IsInf(b, 0) {
			bmax = math.Max(bmax, b)
		}
	}
	if bmax == 0 {
		bmax = 1
	}
	cm := NewFieldScale(0, bmax)
	t := NewTriangles(xs, ys, tri)
	t.Edge.Width = 0
	t.Fill = make([]color.Color, len(bmag))
	for i, b := range bmag {
		t.Fill[i] = colourAt(cm, b)
	}
	p := plot.New()
	p.Title.Text = title
	p.X.Label.Text = "x (mm)"
	p.Y.Label.Text = "y (mm)"
	p.Add(t)
	if lines > 0 && potential != nil {
		p.Add(&Isolines{X: xs, Y: ys, Tri: tri, Value: potential, Levels: EvenLevels(potential, lines),
			Line: draw.LineStyle{Color: color.Gray{Y: 20}, Width: vg.Points(0.5)}})
	}
	bar := plot.New()
	bar.Title.Text = "|B| (T)"
	cb := &plotter.ColorBar{ColorMap: cm, Vertical: true}
	bar.Add(cb)
	bar.HideX()
	return p, bar
}

func colourAt(cm palette.ColorMap, v float64) color.Color {
	if math.IsNaN(v) {
		return color.Black
	}
	v = math.Max(cm.Min(), math.Min(cm.Max(), v))
	c, err := cm.At(v)
	if err != nil {
		return color.Black
	}
	return c
}
