package plot

import (
	"image/color"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Current directions of a coil side across the drawing plane.
const (
	NoCurrent  = 0
	CurrentOut = 1  // towards the viewer, drawn ⊙
	CurrentIn  = -1 // away from the viewer, drawn ⊗
)

// Label is a text placed at a point of a drawing, with an optional coil
// current mark (CurrentOut, CurrentIn) to its left.
type Label struct {
	X, Y    float64 // data units
	Text    string
	Current int
}

// Labels is a plotter that writes labels centred on their points, each on a
// pale, slightly transparent box so that it reads over any colour, and
// draws the current marks as shapes (a circle with a dot, or with a cross),
// not as font glyphs, so that they look the same in every format.
type Labels struct {
	Items []Label
	Size  vg.Length // font size; 0 means 7 points
}

// Plot implements plot.Plotter.
func (l *Labels) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	sty := p.Legend.TextStyle
	sty.Font.Size = l.Size
	if sty.Font.Size == 0 {
		sty.Font.Size = vg.Points(7)
	}
	sty.XAlign, sty.YAlign = text.XCenter, text.YCenter
	sty.Color = color.Black
	pad := vg.Points(1.5)
	for _, it := range l.Items {
		pt := vg.Point{X: trX(it.X), Y: trY(it.Y)}
		if !c.Contains(pt) {
			continue
		}
		w, h := sty.Width(it.Text), sty.Height(it.Text)
		mark := vg.Length(0)
		if it.Current != NoCurrent {
			mark = h + pad
		}
		x0 := pt.X - (w+mark)/2 - pad
		box := []vg.Point{{X: x0, Y: pt.Y - h/2 - pad}, {X: x0 + w + mark + 2*pad, Y: pt.Y - h/2 - pad},
			{X: x0 + w + mark + 2*pad, Y: pt.Y + h/2 + pad}, {X: x0, Y: pt.Y + h/2 + pad}}
		c.FillPolygon(color.NRGBA{R: 255, G: 255, B: 255, A: 200}, box)
		if it.Current != NoCurrent {
			drawCurrentMark(c, vg.Point{X: x0 + pad + h/2, Y: pt.Y}, h/2*0.9, it.Current)
		}
		c.FillText(sty, vg.Point{X: pt.X + mark/2, Y: pt.Y}, it.Text)
	}
}

// drawCurrentMark draws ⊙ (out) or ⊗ (in) of radius r at pt.
func drawCurrentMark(c draw.Canvas, pt vg.Point, r vg.Length, dir int) {
	line := draw.LineStyle{Color: color.Black, Width: vg.Points(0.7)}
	var circle []vg.Point
	for k := 0; k <= 32; k++ {
		a := 2 * math.Pi * float64(k) / 32
		circle = append(circle, vg.Point{X: pt.X + r*vg.Length(math.Cos(a)), Y: pt.Y + r*vg.Length(math.Sin(a))})
	}
	c.FillPolygon(color.White, circle)
	c.StrokeLines(line, circle)
	if dir == CurrentOut {
		var dot []vg.Point
		for k := 0; k < 16; k++ {
			a := 2 * math.Pi * float64(k) / 16
			dot = append(dot, vg.Point{X: pt.X + r/3*vg.Length(math.Cos(a)), Y: pt.Y + r/3*vg.Length(math.Sin(a))})
		}
		c.FillPolygon(color.Black, dot)
		return
	}
	d := r * vg.Length(math.Sqrt(0.5))
	c.StrokeLines(line, []vg.Point{{X: pt.X - d, Y: pt.Y - d}, {X: pt.X + d, Y: pt.Y + d}})
	c.StrokeLines(line, []vg.Point{{X: pt.X - d, Y: pt.Y + d}, {X: pt.X + d, Y: pt.Y - d}})
}

// Frame is a plotter that strokes a rectangle in data units, such as the
// window of a detail panel drawn on the overview.
type Frame struct {
	X0, X1, Y0, Y1 float64
	Line           draw.LineStyle
}

// Plot implements plot.Plotter.
func (f *Frame) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	pts := []vg.Point{{X: trX(f.X0), Y: trY(f.Y0)}, {X: trX(f.X1), Y: trY(f.Y0)}, {X: trX(f.X1), Y: trY(f.Y1)}, {X: trX(f.X0), Y: trY(f.Y1)}, {X: trX(f.X0), Y: trY(f.Y0)}}
	c.StrokeLines(f.Line, c.ClipLinesXY(pts)...)
}

// HaloSegments is a plotter that draws segments twice, a wide dark stroke
// under a narrow light one, so that they stand out on every colour of a
// scale: region outlines on a field map. Against every colour of the
// field scale and OverColour, one of the two has a contrast ratio of at
// least 3, WCAG 2.1's level for graphics (4.39 at worst; TestHaloContrast).
type HaloSegments struct {
	Segs [][4]float64
}

// The halo's colours: the dark edges and the light core.
var (
	haloDark  = color.Gray{Y: 15}
	haloLight = color.White
)

// Plot implements plot.Plotter.
func (s *HaloSegments) Plot(c draw.Canvas, p *plot.Plot) {
	dark := &Segments{Segs: s.Segs, Line: draw.LineStyle{Color: haloDark, Width: vg.Points(1.6)}}
	light := &Segments{Segs: s.Segs, Line: draw.LineStyle{Color: haloLight, Width: vg.Points(0.6)}}
	dark.Plot(c, p)
	light.Plot(c, p)
}
