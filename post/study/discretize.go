package study

import (
	"errors"
	"fmt"
	"math"

	"polegap/mesh"
	"polegap/models"
)

// Discretization is a model with its mesh.
type Discretization struct {
	Model    *models.Model
	Boundary mesh.Polygon
	Input    *mesh.Input
	Options  mesh.Options
	Mesh     *mesh.Mesh
	// Kelvin is the exterior disk of an open boundary (a half disc on the
	// axis in an axisymmetric model), nil otherwise. Its triangles in Mesh
	// carry KelvinTag(model); fields there are those of the image problem,
	// so Result.Field reports nothing outside the real boundary.
	Kelvin *mesh.KelvinExterior

	// outer is the model whose extent places the outer boundary: Model
	// itself, or the unmoved model when parts are moved (Study.Moved).
	outer *models.Model
}

// KelvinTag returns the region tag of the exterior disk of an open boundary.
func KelvinTag(m *models.Model) int32 { return int32(len(m.Regions) + 1) }

// Open reports whether the model asks for an open (far-field) boundary.
func Open(m *models.Model) bool { return m.Boundary.Condition == "open" }

// RegionName returns the model name of a region tag ("air" for AirTag).
func (d *Discretization) RegionName(tag int32) string {
	if tag == AirTag {
		return "air"
	}
	if int(tag) > len(d.Model.Regions) {
		return "air (exterior, Kelvin)"
	}
	return d.Model.Regions[tag-1].Name
}

// FarSizeDivisor sets the element size far out in the air: the model's
// largest dimension divided by this.
const FarSizeDivisor = 6

// SizeField returns the mesher's size field for the model: the global size,
// each region's mesh-size and the refine entries (near a region's edges, a
// probe, a point or a line); when the file states no size
// (m.Mesh.Auto), the automatic field AutoSizeField derives from the
// geometry.
func SizeField(m *models.Model) mesh.SizeField {
	if m.Mesh.Auto {
		return AutoSizeField(m)
	}
	xmin, ymin, xmax, ymax := m.Extent()
	far := math.Max(xmax-xmin, ymax-ymin) / FarSizeDivisor
	f := mesh.SizeField{Global: math.Max(far, m.Mesh.Size), Grading: m.Mesh.Grading, Region: map[int32]float64{}}
	addPolygon := func(x, y []float64, size float64) {
		lines := make([]mesh.SizeLine, len(x))
		for i := range x {
			j := (i + 1) % len(x)
			lines[i] = mesh.SizeLine{X0: x[i], Y0: y[i], X1: x[j], Y1: y[j], Size: size}
		}
		g := f.Grading
		if g <= 0 {
			g = mesh.DefaultGrading
		}
		f.Lines = append(f.Lines, simplifyLines(lines, g, 0.1)...)
	}
	// A region's edges, its arcs followed by chords of at most 5° (the
	// size there then exceeds the asked size by at most the grading times
	// a sagitta of 1e-3 of the radius).
	addRegion := func(r *models.Region, size float64) {
		if r.Sweep == nil {
			addPolygon(r.X, r.Y, size)
			return
		}
		x, y := mesh.DiscretizePolygon(mesh.Polygon{X: r.X, Y: r.Y, Sweep: r.Sweep},
			mesh.GraphOptions{ChordTol: math.Inf(1), MaxArcAngle: 5 * math.Pi / 180})
		addPolygon(x, y, size)
	}
	addProbe := func(p *models.Probe, size float64) {
		switch p.Kind {
		case models.ProbePoint:
			f.Points = append(f.Points, mesh.SizePoint{X: p.Point[0], Y: p.Point[1], Size: size})
		case models.ProbeLine:
			f.Lines = append(f.Lines, mesh.SizeLine{X0: p.Line[0][0], Y0: p.Line[0][1], X1: p.Line[1][0], Y1: p.Line[1][1], Size: size})
		case models.ProbeBox:
			b := p.Box
			addPolygon([]float64{b[0][0], b[1][0], b[1][0], b[0][0]}, []float64{b[0][1], b[0][1], b[1][1], b[1][1]}, size)
			// and its two centre lines, so the inside is covered too
			xm, ym := 0.5*(b[0][0]+b[1][0]), 0.5*(b[0][1]+b[1][1])
			f.Lines = append(f.Lines, mesh.SizeLine{X0: b[0][0], Y0: ym, X1: b[1][0], Y1: ym, Size: size},
				mesh.SizeLine{X0: xm, Y0: b[0][1], X1: xm, Y1: b[1][1], Size: size})
		case models.ProbeCircle:
			const n = 16
			x, y := make([]float64, n), make([]float64, n)
			for k := range x {
				a := 2 * math.Pi * float64(k) / n
				x[k], y[k] = p.Centre[0]+p.Radius*math.Cos(a), p.Centre[1]+p.Radius*math.Sin(a)
			}
			addPolygon(x, y, size)
		}
	}
	// The global size holds in every region and along every region edge;
	// the air grows from there towards the far-field size.
	for i, r := range m.Regions {
		s := m.Mesh.Size
		if r.MeshSize > 0 && (s <= 0 || r.MeshSize < s) {
			s = r.MeshSize
		}
		if s > 0 {
			f.Region[Tag(i)] = s
			addRegion(&m.Regions[i], s)
		}
	}
	// Probes get the global size too: they are where the answers are read.
	if m.Mesh.Size > 0 {
		for i := range m.Probes {
			addProbe(&m.Probes[i], m.Mesh.Size)
		}
	}
	for _, rf := range m.Mesh.Refine {
		switch {
		case rf.Point != nil:
			f.Points = append(f.Points, mesh.SizePoint{X: rf.Point[0], Y: rf.Point[1], Size: rf.Size})
		case rf.Line != nil:
			f.Lines = append(f.Lines, mesh.SizeLine{X0: rf.Line[0][0], Y0: rf.Line[0][1], X1: rf.Line[1][0], Y1: rf.Line[1][1], Size: rf.Size})
		case rf.Near != "":
			if r, ok := m.Region(rf.Near); ok {
				addRegion(r, rf.Size)
				continue
			}
			if p, ok := m.Probe(rf.Near); ok {
				addProbe(p, rf.Size)
			}
		}
	}
	return f
}

// GraphOptions returns the options that build the model's straight-line
// graph for the mesher's size field size: arcs are cut into chords whose
// sagitta is the model's chord length (mesh.chord) when it sets one, and
// otherwise mesh.DefaultChordRatio (1/20) of the element size at the arc.
// Its resolution is the model's (models.Model.Resolution), or
// mesh.min-feature when that is larger: vertices closer than it merge and
// gaps narrower than it close.
func GraphOptions(m *models.Model, size *mesh.SizeField) mesh.GraphOptions {
	return mesh.GraphOptions{ChordTol: m.Mesh.Chord, Size: size, MergeTol: math.Max(m.Resolution(), m.Mesh.MinFeature)}
}

// MeshOptions returns the mesher options of the model.
func MeshOptions(m *models.Model) mesh.Options {
	return mesh.Options{
		MinAngle: m.Mesh.MinAngleDegrees(),
		Size:     SizeField(m),
		Order:    m.Mesh.Order,
	}
}

// Discretize builds the model's straight-line graph and meshes it.
func Discretize(m *models.Model) (*Discretization, error) {
	return DiscretizeSized(m, nil)
}

// DiscretizeSized is Discretize with one more size limit (metres, at a
// point of a region; see mesh.SizeField.Func), as adaptive refinement
// derives from an error estimate on a previous mesh. nil adds none.
func DiscretizeSized(m *models.Model, size func(x, y float64, region int32) float64) (*Discretization, error) {
	return discretize(m, m, size)
}

// discretize meshes m inside the outer boundary that outer's extent
// places (outer is m itself except for moved parts, whose boundary must
// not move with them).
func discretize(m, outer *models.Model, size func(x, y float64, region int32) float64) (*Discretization, error) {
	d := &Discretization{Model: m, Options: MeshOptions(m), outer: outer}
	d.Options.Size.Func = size
	fp, err := CheckFootprint(m, d.Options, Limits{})
	if err != nil {
		return nil, err
	}
	d.Options.MaxTriangles = meshBudget(fp, d.Options.MaxTriangles, d.Options.Order, size != nil)
	if d.Boundary, err = Boundary(outer); err != nil {
		return nil, err
	}
	if err := checkProbes(m, outer, d.Boundary); err != nil {
		return nil, err
	}
	gopt := GraphOptions(m, &d.Options.Size)
	d.Input, err = mesh.BuildInput(Polygons(m), d.Boundary, gopt)
	if err != nil {
		return nil, d.locate(err)
	}
	if Open(m) {
		return d, d.openBoundary()
	}
	d.Mesh, err = mesh.Triangulate(d.Input, d.Options)
	if err != nil {
		return nil, d.meshErr(err)
	}
	return d, nil
}

// Mesh budget: the mesher stops with a *LimitError once it passes
// budgetFactor times the estimated triangles plus budgetSlack, or the
// triangles whose memory (the estimate's model) fills the memory
// available, so that no geometry the estimate misjudges can drive the
// process past the memory CheckFootprint let through. The estimate lies
// within 5 % of the real count on the examples (estimate_test.go); the
// factor leaves room for geometries it judges worse.
const (
	budgetFactor = 4
	budgetSlack  = 200_000
)

// meshBudget returns the triangle limit for meshing with footprint fp
// under the limit max (0: mesh.DefaultMaxTriangles). With an adaptive
// size function (sized) the estimate's quadrature cannot see the
// function's finest spots, and adaptive refinement has its own node
// budget (adapt.Options.MaxNodes): the mesher's limit stays max then.
func meshBudget(fp Footprint, max, order int, sized bool) int {
	if max <= 0 {
		max = mesh.DefaultMaxTriangles
	}
	if sized {
		return max
	}
	b := budgetFactor*fp.Triangles + budgetSlack
	// Memory grows faster than the triangles (the factor's log): find the
	// count whose estimated bytes fill the memory available.
	avail := AvailableMemory()
	for n := b; n > budgetSlack; n = n * 3 / 4 {
		if footprintBytes(float64(n), order) <= float64(avail) {
			b = n
			break
		}
	}
	return min(b, max)
}

// meshErr turns the mesher's triangle limit into a *LimitError in the
// model's words; other errors are returned with the file name.
func (d *Discretization) meshErr(err error) error {
	var tm *mesh.TooManyTrianglesError
	if errors.As(err, &tm) {
		return &LimitError{
			Limit:   fmt.Sprintf("the mesh budget of %d triangles", tm.Limit),
			Reached: fmt.Sprintf("%s: refinement passed %d triangles, %d times the estimate made before meshing (or the memory available), so the geometry forces far more elements than its mesh sizes ask for", d.Model.File, tm.Triangles, budgetFactor),
			Change:  "look for a tiny feature (a sliver, a hair-thin gap, vertices nearly on top of each other) and remove it or set mesh.min-feature, or enlarge the mesh sizes",
			Err:     err,
		}
	}
	return fmt.Errorf("%s: meshing: %w", d.Model.File, err)
}

// openBoundary meshes the model to first order, appends the Kelvin
// transformation's exterior disk (a half disc on the axis in an
// axisymmetric model) and elevates both together.
func (d *Discretization) openBoundary() error {
	m := d.Model
	if m.Boundary.Shape != "circle" {
		return m.Errorf(m.Boundary.Pos, "the open boundary needs shape: circle")
	}
	opt := d.Options
	opt.Order = 1
	inner, err := mesh.Triangulate(d.Input, opt)
	if err != nil {
		return d.meshErr(err)
	}
	cx, cy, r := circle(d.outer)
	var k *mesh.KelvinExterior
	if m.Geometry == models.Axisymmetric {
		k, err = mesh.AddKelvinHalfDisk(inner, MarkerCircle, MarkerLeft, cy, r, KelvinTag(m))
	} else {
		k, err = mesh.AddKelvinDisk(inner, MarkerCircle, cx, cy, r, KelvinTag(m))
	}
	if err != nil {
		return fmt.Errorf("%s: open boundary: %w", m.File, err)
	}
	if d.Options.Order == 2 {
		k.ElevateKelvin()
	}
	d.Kelvin, d.Mesh = k, k.Mesh
	return nil
}

// locate turns a mesher error that names a polygon into an error at that
// region's place in the model file.
func (d *Discretization) locate(err error) error {
	var ge *mesh.GraphError
	if errors.As(err, &ge) && ge.Polygon >= 0 && ge.Polygon < len(d.Model.Regions) {
		r := &d.Model.Regions[ge.Polygon]
		msg := ge.Reason
		if ge.Other >= 0 && ge.Other < len(d.Model.Regions) {
			msg += fmt.Sprintf(" (with region %q)", d.Model.Regions[ge.Other].Name)
		}
		if ge.HasAt {
			msg += fmt.Sprintf(" near (%g, %g) m", ge.X, ge.Y)
		}
		return d.Model.Errorf(r.Pos, "region %q: %s; check its polygon", r.Name, msg)
	}
	return fmt.Errorf("%s: building the geometry: %w", d.Model.File, err)
}

// RegionKind is what a region is made of, as figures colour it.
type RegionKind int

// Region kinds.
const (
	KindAir RegionKind = iota
	KindIron
	KindCoil
	KindMagnet
	KindOther // a linear non-magnetic part such as brass or a spacer
)

// RegionKind classifies a region tag for figures: air, iron, coil, magnet
// or other (a linear non-magnetic part such as brass or a spacer).
func (d *Discretization) RegionKind(tag int32) RegionKind {
	if tag == AirTag || int(tag) > len(d.Model.Regions) {
		return KindAir
	}
	r := &d.Model.Regions[tag-1]
	for _, c := range d.Model.Coils {
		for _, s := range c.Sides {
			if s.Region == r.Name {
				return KindCoil
			}
		}
	}
	switch r.Material {
	case "air", "vacuum":
		return KindAir
	case "copper", "aluminium", "aluminum":
		return KindCoil
	}
	mat, ok := d.Model.Material(r.Material)
	if !ok {
		return KindIron // a built-in curve named directly
	}
	switch {
	case mat.Magnet != nil:
		return KindMagnet
	case mat.Curve != "" || len(mat.Table) > 0 || mat.TableFile != "" || mat.MuR > 1.5:
		return KindIron
	}
	return KindOther
}
