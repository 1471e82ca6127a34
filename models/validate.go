package models

import (
	"math"
)

// Defaults filled in on load.
const (
	DefaultMargin       = 1.0  // boundary margin, multiples of the model's largest dimension
	DefaultSizeDivisor  = 30   // mesh size = largest model dimension / 30
	DefaultOrder        = 1    // first-order triangles
	DefaultMinAngleDeg  = 28.0 // degrees
	DefaultGrading      = 0.3
	DefaultChordDivisor = 20 // chord = mesh size / 20
)

// relTol is the relative tolerance of validation geometry: lengths below
// relTol times the model's largest dimension count as zero.
const relTol = 1e-9

// validate checks cross-references and geometry once everything is decoded.
func (d *decoder) validate(m *Model) {
	if len(m.Regions) == 0 && len(d.errs) == 0 {
		d.fail(nil, "regions", "the model has no regions; add at least one")
	}
	// Materials referenced by regions.
	for i := range m.Regions {
		r := &m.Regions[i]
		if r.Material == "" {
			continue
		}
		if _, ok := m.Material(r.Material); !ok {
			var names []string
			for _, mat := range m.Materials {
				names = append(names, mat.Name)
			}
			msg := "material %q is not defined; define it under materials (air and copper are built in)"
			if c := closest(r.Material, names); c != "" {
				msg += "; did you mean \"" + c + "\"?"
			}
			p := r.materialPos
			if p.Path == "" {
				p = Pos{r.Pos.Line, r.Pos.Column, join(r.Pos.Path, "material")}
			}
			d.failAt(p, msg, r.Material)
		}
	}

	// Polygons one by one, at a tolerance relative to the whole model.
	size := 0.0
	for i := range m.Regions {
		r := &m.Regions[i]
		for k := range r.X {
			size = math.Max(size, math.Max(math.Abs(r.X[k]), math.Abs(r.Y[k])))
		}
	}
	tol := relTol * size
	valid := make([]bool, len(m.Regions))
	for i := range m.Regions {
		valid[i] = d.checkPolygon(m, &m.Regions[i], tol)
	}
	// Pairs: interiors must not overlap.
	for i := range m.Regions {
		for j := i + 1; j < len(m.Regions) && valid[i]; j++ {
			if !valid[j] {
				continue
			}
			a, b := &m.Regions[i], &m.Regions[j]
			if x, y, ok := overlap(a, b, tol); ok {
				d.failAt(b.Pos, "region %q overlaps region %q near %s; regions may touch or share edges but not overlap (one inside another is an overlap too: cut a hole by splitting the outer region)",
					b.Name, a.Name, d.fmtPoint(x, y))
			}
		}
	}

	// Coils.
	used := map[string]Pos{}
	for i := range m.Coils {
		c := &m.Coils[i]
		for j, s := range c.Sides {
			if s.Region == "" {
				continue
			}
			p := s.regionPos
			if p.Path == "" { // made by a template
				p = Pos{s.Pos.Line, s.Pos.Column, join(index(join(c.Pos.Path, "sides"), j), "region")}
			}
			if _, ok := m.Region(s.Region); !ok {
				msg := "coil side names region %q, which does not exist; add it under regions"
				if cl := closest(s.Region, regionNames(m)); cl != "" {
					msg += "; did you mean \"" + cl + "\"?"
				}
				d.failAt(p, msg, s.Region)
				continue
			}
			if first, dup := used[s.Region]; dup {
				d.failAt(p, "region %q is already a coil side (%s, line %d); each region carries one coil side", s.Region, first.Path, first.Line)
				continue
			}
			used[s.Region] = p
		}
	}

	// Refinement near a region or probe.
	for _, r := range m.Mesh.Refine {
		if r.Near == "" {
			continue
		}
		_, isRegion := m.Region(r.Near)
		_, isProbe := m.Probe(r.Near)
		if !isRegion && !isProbe {
			names := append(regionNames(m), probeNames(m)...)
			msg := "refine near %q names no region or probe"
			if cl := closest(r.Near, names); cl != "" {
				msg += "; did you mean \"" + cl + "\"?"
			}
			p := r.nearPos
			if p.Path == "" {
				p = Pos{r.Pos.Line, r.Pos.Column, join(r.Pos.Path, "near")}
			}
			d.failAt(p, msg, r.Near)
		}
	}

	// Target.
	if t := m.Target; t != nil {
		if _, ok := m.Probe(t.Probe); !ok {
			p := d.targetProbe
			if p.Path == "" {
				p = Pos{t.Pos.Line, t.Pos.Column, "target.probe"}
			}
			msg := "target probe %q is not defined; add it under probes"
			if cl := closest(t.Probe, probeNames(m)); cl != "" {
				msg += "; did you mean \"" + cl + "\"?"
			}
			d.failAt(p, msg, t.Probe)
		}
	}
}

func regionNames(m *Model) []string {
	var s []string
	for _, r := range m.Regions {
		s = append(s, r.Name)
	}
	return s
}

func probeNames(m *Model) []string {
	var s []string
	for _, p := range m.Probes {
		s = append(s, p.Name)
	}
	return s
}

// checkPolygon validates one region and turns it counter-clockwise. It
// reports whether the region is sound enough for the overlap test.
func (d *decoder) checkPolygon(m *Model, r *Region, tol float64) bool {
	n := len(r.X)
	if n == 0 {
		return false // already reported
	}
	ppath := join(r.Pos.Path, "polygon")
	if n < 3 {
		d.failAt(Pos{r.Pos.Line, r.Pos.Column, ppath}, "open or degenerate polygon: region %q has %d vertices, needs at least 3", r.Name, n)
		return false
	}
	good := true
	for i := 0; i < n; i++ {
		j := (i + 1) % n
		if math.Hypot(r.X[j]-r.X[i], r.Y[j]-r.Y[i]) <= tol {
			if j == 0 {
				d.failAt(r.VertexPos(i), "the last vertex repeats the first; polygons close by themselves, remove it")
			} else {
				d.failAt(r.VertexPos(j), "vertex %d repeats vertex %d at %s; remove the duplicate", j, i, d.fmtPoint(r.X[j], r.Y[j]))
			}
			good = false
		}
	}
	if !good {
		return false
	}
	area := r.Area()
	flat := math.Abs(area) <= tol*math.Sqrt(size2(r))
	if flat && collinear(r, tol) {
		d.failAt(Pos{r.Pos.Line, r.Pos.Column, ppath}, "open or degenerate polygon: region %q has zero area (are all vertices on one line?)", r.Name)
		return false
	}
	if e1, e2, x, y, ok := r.selfIntersection(tol); ok {
		d.failAt(r.VertexPos(min(e1, e2)), "self-intersecting polygon: edges from vertex %d and vertex %d of region %q meet near %s; a region must be a simple polygon, split it into two regions",
			min(e1, e2), max(e1, e2), r.Name, d.fmtPoint(x, y))
		return false
	}
	if flat {
		d.failAt(Pos{r.Pos.Line, r.Pos.Column, ppath}, "open or degenerate polygon: region %q has zero area", r.Name)
		return false
	}
	if area < 0 {
		r.reverse()
	}
	if m.Geometry == Axisymmetric {
		for i := 0; i < n; i++ {
			if x0, _, _, _ := r.edgeBounds(i); x0 < -tol {
				d.failAt(r.VertexPos(i), "region %q reaches r = %s; an axisymmetric model lies in r = x >= 0 (the axis is x = 0)", r.Name, d.fmtLen(x0))
				return false
			}
		}
	}
	return true
}

// collinear reports whether a straight-edged region's vertices all lie on
// one line.
func collinear(r *Region, tol float64) bool {
	for _, s := range r.Sweep {
		if s != 0 {
			return false
		}
	}
	// The line through vertex 0 and the vertex farthest from it.
	far, fd := 0, 0.0
	for i := range r.X {
		if d := math.Hypot(r.X[i]-r.X[0], r.Y[i]-r.Y[0]); d > fd {
			far, fd = i, d
		}
	}
	for i := range r.X {
		if segDist(r.X[i], r.Y[i], r.X[0], r.Y[0], r.X[far], r.Y[far]) > tol &&
			math.Abs(orient(r.X[0], r.Y[0], r.X[far], r.Y[far], r.X[i], r.Y[i])) > tol*fd {
			return false
		}
	}
	return true
}

// size2 is the squared largest dimension of a region's bounding box.
func size2(r *Region) float64 {
	x0, y0, x1, y1 := r.exactBounds()
	s := math.Max(x1-x0, y1-y0)
	return s * s
}

// defaults fills the documented defaults into a decoded model.
func (d *decoder) defaults(m *Model) {
	b := &m.Boundary
	if b.Shape == "" {
		b.Shape = "box"
	}
	if b.Margin == 0 {
		b.Margin = DefaultMargin
	}
	if b.Condition == "" {
		b.Condition = "zero-potential"
	}
	mc := &m.Mesh
	if mc.Size == 0 {
		x0, y0, x1, y1 := m.Extent()
		mc.Size = math.Max(x1-x0, y1-y0) / DefaultSizeDivisor
	}
	if mc.Order == 0 {
		mc.Order = DefaultOrder
	}
	if mc.MinAngle == 0 {
		mc.MinAngle = DefaultMinAngleDeg * math.Pi / 180
	}
	if mc.Grading == 0 {
		mc.Grading = DefaultGrading
	}
	if mc.Chord == 0 {
		mc.Chord = mc.Size / DefaultChordDivisor
	}
}
