package figure

import (
	"bytes"
	"image/color"
	"io"
	"math"

	gplot "gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"polegap/post/output/plot"
	"polegap/post/study"
)

// FluxLines is the number of flux lines drawn on field maps.
const FluxLines = 30

// FieldFigure returns the field map of a solved study (|B| per triangle with
// flux lines) and its colour bar. The exterior disk of an open boundary is
// left out. Flux lines are isolines of A (planar) or of r·Aφ (axisymmetric,
// the flux function, whose isolines are the field lines).
func FieldFigure(s *study.Result) (*gplot.Plot, *gplot.Plot) {
	m := s.Disc.Mesh
	b := s.ElementB()
	skip := int32(-1)
	if s.Disc.Kelvin != nil {
		skip = study.KelvinTag(s.Model)
	}
	var tri []int32
	var bmag []float64
	for t := 0; t < m.NumTriangles(); t++ {
		if m.Region[t] == skip {
			continue
		}
		tri = append(tri, m.Tri[3*t:3*t+3]...)
		bmag = append(bmag, math.Hypot(b[t][0], b[t][1]))
	}
	pot := append([]float64(nil), s.Solution.A...)
	if s.Model.Geometry.String() == "axisymmetric" {
		for i := range pot {
			pot[i] *= m.X[i]
		}
	}
	p, bar := plot.FieldMap(s.Model.Name+": |B| and flux lines", m.X, m.Y, tri, bmag, pot, FluxLines)
	keep := func(t int) bool { return m.Region[t] != skip }
	p.Add(&plot.Segments{Segs: plot.Outline(m.X, m.Y, m.Tri, m.EdgeMarker, m.Nbr, keep, 1e3),
		Line: draw.LineStyle{Color: color.Gray{Y: 60}, Width: vg.Points(0.8), Dashes: []vg.Length{vg.Points(2), vg.Points(1.5)}}})
	return p, bar
}

// DrawField saves the field map of a study to path (.png, .svg, .pdf).
func DrawField(s *study.Result, path string) error {
	p, bar, h := fieldLayout(s)
	return plot.SaveGridWidths([]*gplot.Plot{p, bar}, []float64{fieldWidth, 2.5}, h, path)
}

// FieldImage renders the field map in a format (png, svg).
func FieldImage(s *study.Result, format string) ([]byte, error) {
	p, bar, h := fieldLayout(s)
	c, err := plot.RenderRow([]*gplot.Plot{p, bar}, []float64{fieldWidth, 2.5}, h, format)
	if err != nil {
		return nil, err
	}
	return Bytes(c)
}

const fieldWidth = 18.0 // cm, the map; the bar takes 2.5 more

func fieldLayout(s *study.Result) (*gplot.Plot, *gplot.Plot, vg.Length) {
	p, bar := FieldFigure(s)
	p.X.Min, p.X.Max, p.Y.Min, p.Y.Max = Zoom(s)
	return p, bar, plot.EqualAspectHeight(p, CM(fieldWidth))
}

// Bytes renders a canvas (plot.RenderGrid, plot.RenderRow) into memory.
func Bytes(c io.WriterTo) ([]byte, error) {
	var buf bytes.Buffer
	if _, err := c.WriteTo(&buf); err != nil {
		return nil, err
	}
	return buf.Bytes(), nil
}

// Zoom returns the drawing window in millimetres: the model's extent with a
// fifth of its size around it, where the field is worth seeing.
func Zoom(s *study.Result) (x0, x1, y0, y1 float64) {
	xmin, ymin, xmax, ymax := s.Model.Extent()
	d := 0.2 * math.Max(xmax-xmin, ymax-ymin)
	return (xmin - d) * 1e3, (xmax + d) * 1e3, (ymin - d) * 1e3, (ymax + d) * 1e3
}

// CM returns v centimetres.
func CM(v float64) vg.Length { return vg.Length(v) * vg.Centimeter }
