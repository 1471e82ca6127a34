package plot

import (
	"fmt"
	"image/color"
	"math"

	"gonum.org/v1/plot"
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
	sortBy(levels, func(a, b float64) bool { return a < b })
	for t := 0; t < len(l.Tri)/3; t++ {
		n := [3]int32{l.Tri[3*t], l.Tri[3*t+1], l.Tri[3*t+2]}
		v := [3]float64{l.Value[n[0]], l.Value[n[1]], l.Value[n[2]]}
		lo := math.Min(v[0], math.Min(v[1], v[2]))
		hi := math.Max(v[0], math.Max(v[1], v[2]))
		i := 0
		for i < len(levels) && levels[i] < lo {
			i++
		}
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
	lo, hi := valueRange(v)
	if !(hi > lo) || n < 1 {
		return nil
	}
	out := make([]float64, n)
	for i := range out {
		out[i] = lo + (hi-lo)*(float64(i)+0.5)/float64(n)
	}
	return out
}

// StepLevels returns the levels at the multiples of a nice step (1, 2 or
// 5 × 10ⁿ, NiceStep) that give about n levels strictly inside the range of
// v, and the step: flux lines at equal flux steps of a round size, so that
// the caption can state the flux between two lines.
func StepLevels(v []float64, n int) ([]float64, float64) {
	lo, hi := valueRange(v)
	if !(hi > lo) || n < 1 {
		return nil, 0
	}
	step := NiceStep(hi-lo, n)
	var out []float64
	for k := math.Floor(lo/step) + 1; k*step < hi; k++ {
		if k*step > lo {
			out = append(out, k*step)
		}
	}
	return out, step
}

func valueRange(v []float64) (lo, hi float64) {
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, x := range v {
		if !math.IsNaN(x) {
			lo, hi = math.Min(lo, x), math.Max(hi, x)
		}
	}
	return lo, hi
}

// FieldMapInput is what FieldMap draws. Lengths are in metres and drawn in
// millimetres; fields in tesla.
type FieldMapInput struct {
	Title          string
	XLabel, YLabel string // axis names without unit ("x", "r"); "x" and "y" when empty
	Caption        string // printed under the title, lines separated by "\n"
	X, Y           []float64
	Tri            []int32
	// Corner holds |B| at the three corners of each triangle
	// (CornerAverage); NaN leaves a triangle out.
	Corner []float64
	// Potential (per node) and Levels give the flux lines; nil draws none.
	Potential []float64
	Levels    []float64
	// Top is the top of the colour scale (T); values above it are drawn
	// in OverColour and a box of that colour sits above the bar. 0 takes
	// the largest corner value.
	Top float64
}

// FieldMap returns the field map (the |B| raster with flux lines) and its
// colour bar, to be placed beside the map with RenderRow.
func FieldMap(in FieldMapInput) (*plot.Plot, *plot.Plot) {
	xs, ys := scaled(in.X, 1e3), scaled(in.Y, 1e3)
	_, bmax := valueRange(in.Corner)
	top := in.Top
	if !(top > 0) {
		top = bmax
	}
	if !(top > 0) || math.IsInf(top, 0) {
		top = 1
	}
	cm := NewFieldScale(0, top)
	p := plot.New()
	p.Title.Text = in.Title
	if in.Caption != "" {
		// In the title, not under the x axis: gonum narrows the plot to
		// fit a wide axis label.
		p.Title.Text += "\n" + in.Caption
	}
	xl, yl := in.XLabel, in.YLabel
	if xl == "" {
		xl, yl = "x", "y"
	}
	p.X.Label.Text = xl + " (mm)"
	p.Y.Label.Text = yl + " (mm)"
	p.X.Tick.Marker = NiceTicks{N: 6}
	p.Y.Tick.Marker = NiceTicks{N: 6}
	p.Add(&FieldRaster{X: xs, Y: ys, Tri: in.Tri, Corner: in.Corner, Scale: cm})
	if len(in.Levels) > 0 && in.Potential != nil {
		p.Add(&Isolines{X: xs, Y: ys, Tri: in.Tri, Value: in.Potential, Levels: in.Levels,
			Line: draw.LineStyle{Color: color.Gray{Y: 25}, Width: vg.Points(0.45)}})
	}
	bar := plot.New()
	bar.Title.Text = "|B| (T)"
	sb := &ScaleBar{Scale: cm}
	if bmax > top*(1+1e-9) {
		sb.Over = OverColour
		bar.Title.Text = fmt.Sprintf("|B| (T)\nabove %.2f:\nmagenta", top)
	}
	bar.Add(sb)
	bar.HideX()
	bar.X.Min, bar.X.Max = -0.15, 1.6 // the bar takes 60 % of its panel
	bar.Y.Tick.Marker = barTicks{NiceTicks{N: 8}, top}
	return p, bar
}

// barTicks are a colour bar's ticks: none above the top of the scale,
// where the over box sits.
type barTicks struct {
	NiceTicks
	top float64
}

func (b barTicks) Ticks(min, max float64) []plot.Tick {
	var out []plot.Tick
	for _, t := range b.NiceTicks.Ticks(min, b.top) {
		if t.Value <= b.top*(1+1e-9) {
			out = append(out, t)
		}
	}
	return out
}
