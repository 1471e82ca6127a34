package figure

import (
	"bytes"
	"fmt"
	"image/color"
	"io"
	"math"
	"strings"

	gplot "gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"polegap/models"
	"polegap/post/output/plot"
	"polegap/post/study"
	"polegap/post/workflow/design"
)

// FluxLines is the number of flux lines drawn on field maps, about: the
// step between them is rounded to 1, 2 or 5 × 10ⁿ.
const FluxLines = 30

// TopPercentile is the area fraction of the iron (of the whole drawing
// when there is no iron) below the default top of the colour scale: the
// top 1 % of the iron, the corners whose |B| grows with each refinement,
// is shown in plot.OverColour instead of squeezing the scale.
const TopPercentile = 0.99

// FieldOptions control the field map. The zero value is the default.
type FieldOptions struct {
	// Top (T) is the top of the colour scale; 0 takes the converged
	// saturation figure when Report is given (the largest peak disc mean
	// of the iron regions), else the TopPercentile area percentile of
	// |B| in the iron.
	Top float64
	// Report, if not nil, gives the saturation figure for Top.
	Report *design.Report
	// Whole draws the whole domain instead of the magnet and a margin.
	Whole bool
	// Lines is the number of flux lines, about (0: FluxLines).
	Lines int
}

func fieldOptions(opts []FieldOptions) FieldOptions {
	if len(opts) > 0 {
		return opts[0]
	}
	return FieldOptions{}
}

// FieldFigure returns the field map of a solved study and its colour bar:
// |B| recovered at the nodes of each region and interpolated inside each
// triangle, flux lines at equal flux steps (the step in the caption),
// region outlines, region and coil labels with the current's direction.
// The exterior disk of an open boundary is left out. Flux lines are
// isolines of A (planar) or of 2π·r·Aφ (axisymmetric, the flux through the
// circle of radius r, whose isolines are the field lines).
func FieldFigure(s *study.Result, opts ...FieldOptions) (*gplot.Plot, *gplot.Plot) {
	o := fieldOptions(opts)
	m := s.Disc.Mesh
	b := s.ElementB()
	skip := int32(-1)
	if s.Disc.Kelvin != nil {
		skip = study.KelvinTag(s.Model)
	}
	keep := func(t int) bool { return m.Region[t] != skip }
	nt := m.NumTriangles()
	bmag := make([]float64, nt)
	area := make([]float64, nt)
	ironArea := make([]float64, nt)
	rawMax := 0.0
	for t := 0; t < nt; t++ {
		bmag[t] = math.Hypot(b[t][0], b[t][1])
		if !keep(t) {
			continue
		}
		a, bb, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		area[t] = 0.5 * math.Abs((m.X[bb]-m.X[a])*(m.Y[c]-m.Y[a])-(m.X[c]-m.X[a])*(m.Y[bb]-m.Y[a]))
		if s.Disc.RegionKind(m.Region[t]) == study.KindIron {
			ironArea[t] = area[t]
		}
		rawMax = math.Max(rawMax, bmag[t])
	}
	corner := plot.CornerAverage(m.X, m.Y, m.Tri, m.Region, bmag, keep)
	top := o.Top
	if top <= 0 && o.Report != nil && o.Report.Design != nil {
		for _, sr := range o.Report.Saturation {
			top = math.Max(top, sr.Peak)
		}
	}
	if top <= 0 {
		top = plot.Percentile(bmag, ironArea, TopPercentile)
	}
	if top <= 0 {
		top = plot.Percentile(bmag, area, TopPercentile)
	}
	axi := s.Model.Geometry == models.Axisymmetric
	pot := append([]float64(nil), s.Solution.A...)
	if axi {
		for i := range pot {
			pot[i] *= 2 * math.Pi * m.X[i] // the flux through the circle of radius r
		}
	}
	var drawn []float64
	for t := 0; t < nt; t++ {
		if keep(t) {
			drawn = append(drawn, pot[m.Tri[3*t]], pot[m.Tri[3*t+1]], pot[m.Tri[3*t+2]])
		}
	}
	lines := o.Lines
	if lines <= 0 {
		lines = FluxLines
	}
	levels, step := plot.StepLevels(drawn, lines)
	in := plot.FieldMapInput{
		Title:     fieldTitle(s),
		X:         m.X,
		Y:         m.Y,
		Tri:       m.Tri,
		Corner:    corner,
		Potential: pot,
		Levels:    levels,
		Top:       top,
		Caption:   fieldCaption(s.Model, step, top, rawMax),
	}
	if axi {
		in.XLabel, in.YLabel = "r", "z"
	}
	p, bar := plot.FieldMap(in)
	p.Add(&plot.HaloSegments{Segs: plot.Outline(m.X, m.Y, m.Tri, m.EdgeMarker, m.Nbr, keep, 1e3)})
	p.Add(&plot.Labels{Items: regionLabels(s)})
	if o.Whole {
		x0, x1, y0, y1 := wholeWindow(s)
		p.X.Min, p.X.Max, p.Y.Min, p.Y.Max = x0, x1, y0, y1
	} else {
		p.X.Min, p.X.Max, p.Y.Min, p.Y.Max = Zoom(s)
	}
	return p, bar
}

// fieldTitle says what the map shows and at what excitation.
func fieldTitle(s *study.Result) string {
	var parts []string
	for ci, c := range s.Model.Coils {
		i := s.Params.Current(s.Model, ci)
		n := c.Turns
		if ci < len(s.Params.Turns) {
			n = s.Params.Turns[ci]
		}
		parts = append(parts, fmt.Sprintf("%s %s A × %s turns = %s kA-turns", c.Name, num(i), num(n), num(i*n/1e3)))
	}
	t := s.Model.Name + ": |B| and flux lines"
	if len(parts) > 0 {
		t += "\n" + strings.Join(parts, "; ")
	}
	return t
}

// fieldCaption states the flux between two lines and the colour range.
func fieldCaption(m *models.Model, step, top, rawMax float64) string {
	var c string
	switch {
	case step == 0:
	case m.Geometry == models.Axisymmetric:
		c = fmt.Sprintf("flux lines every %s mWb (of the flux 2π·r·Aφ through a circle about the axis)", num(step*1e3))
	case m.Depth > 0:
		c = fmt.Sprintf("flux lines every ΔA = %s mWb/m, %s mWb over the %s mm depth", num(step*1e3), num(step*m.Depth*1e3), num(m.Depth*1e3))
	default:
		c = fmt.Sprintf("flux lines every ΔA = %s mWb/m", num(step*1e3))
	}
	if rawMax > top*(1+1e-9) {
		c += fmt.Sprintf("\nmagenta: |B| above %.2f T (largest element value %.2f T, mesh-dependent at corners)", top, rawMax)
	}
	return c
}

// num formats a value with at most four significant digits and no
// exponent for the magnitudes figures show.
func num(v float64) string {
	if v == math.Trunc(v) && math.Abs(v) < 1e6 {
		return fmt.Sprintf("%.0f", v)
	}
	return strings.TrimRight(strings.TrimRight(fmt.Sprintf("%.4g", v), "0"), ".")
}

// regionLabels returns a label inside each region of the model (deep
// inside it, near its area centroid), with the current's direction for
// coil sides: ⊙ out of the drawing, ⊗ into it. The current density of a
// planar coil runs along z, out of the page when positive; in an
// axisymmetric one Jφ > 0 runs into the (r, z) page, (r, φ, z) being
// right-handed.
func regionLabels(s *study.Result) []plot.Label {
	m := s.Disc.Mesh
	nr := len(s.Model.Regions)
	type acc struct{ a, x, y float64 }
	sums := make([]acc, nr+1)
	cent := make([][2]float64, m.NumTriangles())
	for t := 0; t < m.NumTriangles(); t++ {
		r := int(m.Region[t])
		a, b, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		cx, cy := (m.X[a]+m.X[b]+m.X[c])/3, (m.Y[a]+m.Y[b]+m.Y[c])/3
		cent[t] = [2]float64{cx, cy}
		if r < 1 || r > nr {
			continue
		}
		ar := 0.5 * math.Abs((m.X[b]-m.X[a])*(m.Y[c]-m.Y[a])-(m.X[c]-m.X[a])*(m.Y[b]-m.Y[a]))
		sums[r].a += ar
		sums[r].x += ar * cx
		sums[r].y += ar * cy
	}
	// Each region's boundary edges (to a triangle of another region, or
	// the domain's edge).
	edges := make([][][4]float64, nr+1)
	for t := 0; t < m.NumTriangles(); t++ {
		r := int(m.Region[t])
		if r < 1 || r > nr {
			continue
		}
		for k := 0; k < 3; k++ {
			if n := m.Nbr[3*t+k]; n >= 0 && m.Region[n] == m.Region[t] {
				continue
			}
			a, b := m.Tri[3*t+(k+1)%3], m.Tri[3*t+(k+2)%3]
			edges[r] = append(edges[r], [4]float64{m.X[a], m.Y[a], m.X[b], m.Y[b]})
		}
	}
	// The label goes to the triangle deepest inside its region, near the
	// area centroid: the largest distance to the region's boundary less a
	// quarter of the distance to the centroid. The plain centroid falls
	// outside a C-shaped region, and its nearest triangle on the edge.
	best := make([]int, nr+1)
	bestScore := make([]float64, nr+1)
	for i := range best {
		best[i], bestScore[i] = -1, math.Inf(-1)
	}
	for t := 0; t < m.NumTriangles(); t++ {
		r := int(m.Region[t])
		if r < 1 || r > nr || sums[r].a == 0 {
			continue
		}
		px, py := cent[t][0], cent[t][1]
		inset := math.Inf(1)
		for _, e := range edges[r] {
			inset = math.Min(inset, segmentDistance(px, py, e))
		}
		score := inset - 0.25*math.Hypot(px-sums[r].x/sums[r].a, py-sums[r].y/sums[r].a)
		if score > bestScore[r] {
			best[r], bestScore[r] = t, score
		}
	}
	sense := map[string]float64{}
	for ci, c := range s.Model.Coils {
		i := s.Params.Current(s.Model, ci)
		for _, side := range c.Sides {
			sense[side.Region] += side.Sense * i
		}
	}
	var out []plot.Label
	for r := 1; r <= nr; r++ {
		if best[r] < 0 {
			continue
		}
		name := s.Model.Regions[r-1].Name
		if name == "gap" {
			continue // the gap is the field's own place; the probe tells it
		}
		l := plot.Label{X: cent[best[r]][0] * 1e3, Y: cent[best[r]][1] * 1e3, Text: name}
		if j, ok := sense[name]; ok && j != 0 {
			out := j > 0
			if s.Model.Geometry == models.Axisymmetric {
				out = !out
			}
			l.Current = plot.CurrentIn
			if out {
				l.Current = plot.CurrentOut
			}
		}
		out = append(out, l)
	}
	return out
}

// DrawField saves the field map of a study to path (.png, .svg, .pdf):
// the map, a detail of the gap when the gap is small against the magnet,
// and the colour bar.
func DrawField(s *study.Result, path string, opts ...FieldOptions) error {
	return DrawFieldWith(s, path, plot.Options{}, opts...)
}

// DrawFieldWith is DrawField with output options (raster resolution).
func DrawFieldWith(s *study.Result, path string, out plot.Options, opts ...FieldOptions) error {
	plots, widths, h := fieldLayout(s, opts...)
	return plot.SaveGridWidths(plots, widths, h, path, out)
}

// FieldImage renders the field map in a format (png, svg).
func FieldImage(s *study.Result, format string, opts ...FieldOptions) ([]byte, error) {
	plots, widths, h := fieldLayout(s, opts...)
	c, err := plot.RenderRow(plots, widths, h, format)
	if err != nil {
		return nil, err
	}
	return Bytes(c)
}

const (
	fieldWidth  = 18.0 // cm, the map
	detailWidth = 9.0  // cm, the gap detail
	barWidth    = 3.2  // cm, the colour bar
)

// DetailRatio: the gap gets a detail panel when it is smaller than this
// fraction of the magnet's larger side (our choice: below it a gap is a
// few pixels wide on the overview).
const DetailRatio = 1.0 / 15

// detailAspect is the height of the gap detail's window over its width,
// about that of its panel beside a square overview.
const detailAspect = 1.6

func fieldLayout(s *study.Result, opts ...FieldOptions) ([]*gplot.Plot, []float64, vg.Length) {
	p, bar := FieldFigure(s, opts...)
	h := plot.EqualAspectHeight(p, CM(fieldWidth))
	plots, widths := []*gplot.Plot{p}, []float64{fieldWidth}
	if x0, x1, y0, y1, ok := GapWindow(s); ok {
		d, _ := FieldFigure(s, opts...)
		d.Title.Text = fmt.Sprintf("gap detail (%s mm gap)", num(s.Model.Gap*1e3))
		d.X.Min, d.X.Max, d.Y.Min, d.Y.Max = x0, x1, y0, y1
		d.X.Tick.Marker = plot.NiceTicks{N: 4}
		d.Y.Tick.Marker = plot.NiceTicks{N: 6}
		p.Add(&plot.Frame{X0: x0, X1: x1, Y0: y0, Y1: y1, Line: draw.LineStyle{Color: color.Black, Width: vg.Points(1)}})
		plots, widths = append(plots, d), append(widths, detailWidth)
	}
	plots, widths = append(plots, bar), append(widths, barWidth)
	return plots, widths, h
}

// GapWindow returns the detail window around the gap (mm): when the model
// states a gap smaller than DetailRatio of the magnet, a window 3 gaps
// wide and 6 tall (x, r across the gap) centred on the gap-centre probe,
// or on the middle of the region named "gap".
func GapWindow(s *study.Result) (x0, x1, y0, y1 float64, ok bool) {
	g := s.Model.Gap
	xmin, ymin, xmax, ymax := s.Model.Extent()
	if !(g > 0) || g > DetailRatio*math.Max(xmax-xmin, ymax-ymin) {
		return 0, 0, 0, 0, false
	}
	var cx, cy float64
	found := false
	if p, ok := s.Model.CentreProbe(); ok {
		cx, cy, found = p.Point[0], p.Point[1], true
	}
	for i := range s.Model.Regions {
		if !found && s.Model.Regions[i].Name == "gap" {
			a, b, c, d := s.Model.Regions[i].Bounds()
			cx, cy, found = (a+c)/2, (b+d)/2, true
		}
	}
	if !found {
		return 0, 0, 0, 0, false
	}
	hw, hh := 3*g, 3*g*detailAspect
	return (cx - hw) * 1e3, (cx + hw) * 1e3, (cy - hh) * 1e3, (cy + hh) * 1e3, true
}

// Bytes renders a canvas (plot.RenderGrid, plot.RenderRow) into memory.
func Bytes(c io.WriterTo) ([]byte, error) {
	var buf bytes.Buffer
	if _, err := c.WriteTo(&buf); err != nil {
		return nil, err
	}
	return buf.Bytes(), nil
}

// Zoom returns the field map's default window in millimetres
// (ModelWindow of the solved model).
func Zoom(s *study.Result) (x0, x1, y0, y1 float64) { return ModelWindow(s.Model) }

// wholeWindow is the whole meshed domain but the exterior disk (mm).
func wholeWindow(s *study.Result) (x0, x1, y0, y1 float64) {
	m := s.Disc.Mesh
	skip := int32(-1)
	if s.Disc.Kelvin != nil {
		skip = study.KelvinTag(s.Model)
	}
	x0, y0, x1, y1 = math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
	for t := 0; t < m.NumTriangles(); t++ {
		if m.Region[t] == skip {
			continue
		}
		for k := 0; k < 3; k++ {
			n := m.Tri[3*t+k]
			x0, x1 = math.Min(x0, m.X[n]), math.Max(x1, m.X[n])
			y0, y1 = math.Min(y0, m.Y[n]), math.Max(y1, m.Y[n])
		}
	}
	return x0 * 1e3, x1 * 1e3, y0 * 1e3, y1 * 1e3
}

// CM returns v centimetres.
func CM(v float64) vg.Length { return vg.Length(v) * vg.Centimeter }

// segmentDistance is the distance from (px, py) to the segment e.
func segmentDistance(px, py float64, e [4]float64) float64 {
	dx, dy := e[2]-e[0], e[3]-e[1]
	l2 := dx*dx + dy*dy
	t := 0.0
	if l2 > 0 {
		t = math.Max(0, math.Min(1, ((px-e[0])*dx+(py-e[1])*dy)/l2))
	}
	return math.Hypot(px-e[0]-t*dx, py-e[1]-t*dy)
}
