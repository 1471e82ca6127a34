package models

import (
	"math"
	"sort"

	"polegap/mesh"
)

// Defaults filled in on load.
const (
	DefaultMargin      = 1.0  // boundary margin, multiples of the model's largest dimension
	DefaultSizeDivisor = 30   // mesh size = largest model dimension / 30
	DefaultOrder       = 1    // first-order triangles, when the file sets element sizes
	AutoOrder          = 2    // second-order triangles, when the size field is automatic (MeshControls.Auto)
	DefaultMinAngleDeg = 28.0 // degrees
	DefaultGrading     = 0.3
)

// relTol is the relative resolution of validation geometry: lengths up to
// relTol times the model's largest coordinate count as zero (see
// resolution).
const relTol = 1e-9

// resolution returns the length, in metres, below which validation treats
// two features as touching: relTol times the largest coordinate magnitude
// of the regions. It is a statement of intent, not a rounding guard; the
// decisions themselves are exact (package mesh's predicates):
//
//   - consecutive vertices at most this far apart repeat each other
//     (mesh.NearPoint);
//   - a region whose area is at most this times its perimeter has zero area
//     (mesh.ZeroArea);
//   - edges of one region this close meet: a self-intersection
//     (mesh.SelfIntersection);
//   - an edge crossing another region's edge with an end this close to it
//     touches rather than overlaps, and a point this close to an edge is on
//     it (mesh.NearSegment, mesh.PointInPolygon).
//
// mesh.BuildInput applies the same rules at GraphOptions.MergeTol, so with
// MergeTol = resolution the two accept the same straight-edged regions
// (arcs are checked here on 5° chords and meshed on the mesher's chords).
func resolution(m *Model) float64 { return m.Resolution() }

// Resolution returns the length (m) below which the model's geometry
// treats two features as touching: 1e-9 times the largest coordinate
// magnitude of its regions (see resolution for the rules). The mesher
// is given the same value as its merge tolerance, so that the model
// file's checks and the mesher accept the same regions.
func (m *Model) Resolution() float64 {
	size := 0.0
	for i := range m.Regions {
		r := &m.Regions[i]
		for k := range r.X {
			size = math.Max(size, math.Max(math.Abs(r.X[k]), math.Abs(r.Y[k])))
		}
	}
	return relTol * size
}

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

	// Polygons one by one, at a resolution relative to the whole model.
	tol := resolution(m)
	valid := make([]bool, len(m.Regions))
	for i := range m.Regions {
		valid[i] = d.checkPolygon(m, &m.Regions[i], tol)
	}
	// Pairs: interiors must not overlap. Only pairs whose boxes meet can
	// (overlap checks that first), so a sweep over the boxes sorted by x
	// finds them in O(n log n + pairs): 10,000 small regions are checked
	// in milliseconds. The pairs are checked in (i, j) order, as a double
	// loop would.
	for _, p := range boxPairs(m.Regions, valid) {
		a, b := &m.Regions[p[0]], &m.Regions[p[1]]
		if x, y, ok := overlap(a, b, tol); ok {
			d.failAt(b.Pos, "region %q overlaps region %q near %s; regions may touch or share edges but not overlap (one inside another is an overlap too: cut a hole by splitting the outer region)",
				b.Name, a.Name, d.fmtPoint(x, y))
		}
	}

	// An explicit boundary box must hold every region.
	if bx := m.Boundary.Box; bx != nil {
		for i := range m.Regions {
			r := &m.Regions[i]
			if !valid[i] {
				continue
			}
			x0, y0, x1, y1 := r.exactBounds()
			if x0 < bx[0][0]-tol || y0 < bx[0][1]-tol || x1 > bx[1][0]+tol || y1 > bx[1][1]+tol {
				d.failAt(m.Boundary.boxPos, "region %q reaches from %s to %s, outside the boundary box %s to %s; enlarge the box (or use margin)",
					r.Name, d.fmtPoint(x0, y0), d.fmtPoint(x1, y1), d.fmtPoint(bx[0][0], bx[0][1]), d.fmtPoint(bx[1][0], bx[1][1]))
				break
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
		if mesh.NearPoint(r.X[i], r.Y[i], r.X[j], r.Y[j], tol) {
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
	px, py := r.outline(0)
	flat := mesh.ZeroArea(px, py, tol)
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
	if r.Area() < 0 { // not flat, so the sign is clear
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

// collinear reports whether a straight-edged region's vertices all lie
// within tol of one segment: the one from the vertex farthest from vertex 0
// to the vertex farthest from that (the ends of the line when the vertices
// are on one). It only chooses the wording of a zero-area message.
func collinear(r *Region, tol float64) bool {
	for _, s := range r.Sweep {
		if s != 0 {
			return false
		}
	}
	farthest := func(k int) int {
		far, fd := k, 0.0
		for i := range r.X {
			if d := math.Hypot(r.X[i]-r.X[k], r.Y[i]-r.Y[k]); d > fd {
				far, fd = i, d
			}
		}
		return far
	}
	a := farthest(0)
	b := farthest(a)
	for i := range r.X {
		if !mesh.NearSegment(r.X[i], r.Y[i], r.X[a], r.Y[a], r.X[b], r.Y[b], tol) {
			return false
		}
	}
	return true
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
		mc.Auto = !d.refineKey
		for i := range m.Regions {
			mc.Auto = mc.Auto && m.Regions[i].MeshSize == 0
		}
		x0, y0, x1, y1 := m.Extent()
		mc.Size = math.Max(x1-x0, y1-y0) / DefaultSizeDivisor
	}
	if mc.Order == 0 {
		mc.Order = DefaultOrder
		if mc.Auto {
			mc.Order = AutoOrder
		}
	}
	if mc.MinAngle == 0 {
		mc.MinAngle = DefaultMinAngleDeg * math.Pi / 180
	}
	if mc.Grading == 0 {
		mc.Grading = DefaultGrading
	}
}

// boxPairs returns the pairs i < j of valid regions whose bounding boxes
// (arcs exact) meet, sorted by i then j.
func boxPairs(rs []Region, valid []bool) [][2]int {
	type box struct {
		x0, y0, x1, y1 float64
		i              int
	}
	bs := make([]box, 0, len(rs))
	for i := range rs {
		if valid[i] {
			x0, y0, x1, y1 := rs[i].exactBounds()
			bs = append(bs, box{x0, y0, x1, y1, i})
		}
	}
	sort.Slice(bs, func(a, b int) bool { return bs[a].x0 < bs[b].x0 || bs[a].x0 == bs[b].x0 && bs[a].i < bs[b].i })
	var pairs [][2]int
	for a := range bs {
		for b := a + 1; b < len(bs) && bs[b].x0 <= bs[a].x1; b++ {
			if bs[b].y0 > bs[a].y1 || bs[a].y0 > bs[b].y1 {
				continue
			}
			i, j := bs[a].i, bs[b].i
			pairs = append(pairs, [2]int{min(i, j), max(i, j)})
		}
	}
	sort.Slice(pairs, func(a, b int) bool {
		return pairs[a][0] < pairs[b][0] || pairs[a][0] == pairs[b][0] && pairs[a][1] < pairs[b][1]
	})
	return pairs
}
