package study

import (
	"cmp"
	"math"
	"slices"

	"polegap/mesh"
	"polegap/models"
)

// Features are the places of a model that decide how fine its mesh must
// be: air gaps and thin parts of the iron, iron corners, and the regions
// that carry sources (coil sides, magnets). Iron is every region that
// RegionKind calls KindIron (a B-H curve, or linear with μr > 1.5); all
// other regions count as air for the geometry. Lengths are metres.
type Features struct {
	Gaps    []Gap
	Thin    []ThinPart
	Corners []Corner
	Sources []SourceRegion
}

// Gap is a stretch of two iron faces facing each other across air at a
// distance no larger than the shorter of the two model edges they lie on.
// Faces[0] is the stretch on one face, Faces[1] the stretch of the other
// face opposite it, end k facing end k. A face on a symmetry side of the
// boundary (boundary.sides, or the axis of an axisymmetric model) faces
// its own mirror image: the gap is then twice its distance to the side,
// and Faces[1] lies beyond the side.
type Gap struct {
	Regions [2]int // model region indices of the two faces (equal for a mirror image)
	Faces   [2][2][2]float64
	Width   float64 // smallest distance between the two stretches
	Length  float64 // length of the stretch on Faces[0]
}

// ThinPart is a stretch of two iron faces back to back with only iron
// between them, at a distance (the thickness) no larger than the shorter
// of the two model edges they lie on. Faces as for Gap.
type ThinPart struct {
	Regions   [2]int
	Faces     [2][2][2]float64
	Thickness float64
	Length    float64
}

// CornerKind says whether the iron at a corner is convex or re-entrant.
type CornerKind int8

const (
	// Convex: the iron's angle is below 180 degrees (a pole edge); the
	// field is singular in the air outside it.
	Convex CornerKind = iota
	// Reentrant: the iron's angle is above 180 degrees (the root of a
	// pole on its arm); the field is singular in the iron.
	Reentrant
)

// String returns "convex" or "re-entrant".
func (k CornerKind) String() string {
	if k == Reentrant {
		return "re-entrant"
	}
	return "convex"
}

// Corner is a vertex of the iron's outline where the field is singular.
// Angle α is the angle the iron fills there (all iron regions meeting at
// the vertex together; doubled on a symmetry side). In the limit of high
// permeability the iron surface is an equipotential of the magnetic
// scalar potential seen from the air and a flux wall seen from the iron,
// and the field near the vertex goes as r^(λ-1) with λ = π/α in the iron
// and π/(2π-α) in the air; the smaller one governs, so
// Exponent = π/max(α, 2π-α) - 1, in (-1/2, 0). A right-angled corner,
// convex or re-entrant, has Exponent -1/3. Vertices whose Exponent is
// above -0.05 (within about 9.5 degrees of straight) are not corners.
type Corner struct {
	X, Y     float64
	Region   int // a model region index of the iron at the corner
	Angle    float64
	Kind     CornerKind
	Exponent float64
}

// SourceRegion is a coil side or magnet and its width: the width of the
// rectangle of the same area and perimeter (the side of the square of
// that area when no such rectangle exists).
type SourceRegion struct {
	Region int
	Width  float64
}

// minExponent is the largest corner exponent counted: a vertex within
// about 9.5 degrees of straight has λ above 0.95 and is left alone.
const minExponent = -0.05

// outline is one region's outline with arcs replaced by chords, as the
// mesher sees it.
type outline struct {
	x, y   []float64
	origin []int // for each chorded vertex, the model vertex it is, or -1
	edge   []int // for each chorded edge, the model edge it lies on
	box    [4]float64
}

// piece is a straight stretch of the iron's outline against non-iron,
// iron on its left.
type piece struct {
	x0, y0, x1, y1 float64
	region         int
	edgeLen        float64 // length of the model edge it lies on
	mirror         bool    // a mirror image across a symmetry side
	id             int     // index of the piece it is (or mirrors)
}

// featureFinder holds what FindFeatures derives from a model.
type featureFinder struct {
	m        *models.Model
	d        float64 // resolution
	iron     []bool
	outlines []outline
	pieces   []piece
	mirrors  []mirrorLine
}

// mirrorLine is a symmetry side: x = at (vertical) or y = at.
type mirrorLine struct {
	vertical bool
	at       float64
}

// FindFeatures returns the features of m (see Features). Geometric
// decisions (on an edge, inside, crossing, coincident) are made by
// package mesh's exact predicates at the model's resolution; widths,
// angles and lengths are computed in floating point.
func FindFeatures(m *models.Model) Features {
	f := newFeatureFinder(m)
	var ft Features
	ft.Corners = f.corners()
	ft.Gaps, ft.Thin = f.pairs()
	disc := &Discretization{Model: m}
	for i := range m.Regions {
		if k := disc.RegionKind(Tag(i)); k == KindCoil || k == KindMagnet {
			ft.Sources = append(ft.Sources, SourceRegion{Region: i, Width: f.width(i)})
		}
	}
	return ft
}

func newFeatureFinder(m *models.Model) *featureFinder {
	f := &featureFinder{m: m, d: m.Resolution()}
	disc := &Discretization{Model: m}
	gopt := mesh.GraphOptions{ChordTol: m.Mesh.Chord, MergeTol: f.d}
	f.iron = make([]bool, len(m.Regions))
	f.outlines = make([]outline, len(m.Regions))
	for i := range m.Regions {
		r := &m.Regions[i]
		f.iron[i] = disc.RegionKind(Tag(i)) == KindIron
		x, y := mesh.DiscretizePolygon(mesh.Polygon{X: r.X, Y: r.Y, Sweep: r.Sweep}, gopt)
		o := outline{x: x, y: y, origin: make([]int, len(x)), edge: make([]int, len(x))}
		v := 0
		for k := range x {
			o.origin[k] = -1
			if v < len(r.X) && x[k] == r.X[v] && y[k] == r.Y[v] {
				o.origin[k] = v
				v++
			}
			o.edge[k] = v - 1
		}
		o.box = [4]float64{slices.Min(x) - f.d, slices.Min(y) - f.d, slices.Max(x) + f.d, slices.Max(y) + f.d}
		f.outlines[i] = o
	}
	for name := range m.Boundary.Sides {
		if m.Boundary.Shape != "box" {
			break
		}
		xmin, ymin, xmax, ymax := m.Extent()
		switch name {
		case "left":
			f.mirrors = append(f.mirrors, mirrorLine{true, xmin})
		case "right":
			f.mirrors = append(f.mirrors, mirrorLine{true, xmax})
		case "bottom":
			f.mirrors = append(f.mirrors, mirrorLine{false, ymin})
		case "top":
			f.mirrors = append(f.mirrors, mirrorLine{false, ymax})
		}
	}
	if m.Geometry == models.Axisymmetric {
		f.mirrors = append(f.mirrors, mirrorLine{true, 0})
	}
	// Map iteration order must not reach the result.
	slices.SortFunc(f.mirrors, func(a, b mirrorLine) int {
		if a.vertical != b.vertical {
			if a.vertical {
				return -1
			}
			return 1
		}
		return cmp.Compare(a.at, b.at)
	})
	f.pieces = f.ironPieces()
	return f
}

// edgeLength returns the length of model edge k of region i (the arc's
// length for an arc).
func (f *featureFinder) edgeLength(i, k int) float64 {
	r := &f.m.Regions[i]
	j := (k + 1) % len(r.X)
	c := math.Hypot(r.X[j]-r.X[k], r.Y[j]-r.Y[k])
	if r.Sweep == nil || r.Sweep[k] == 0 {
		return c
	}
	t := math.Abs(r.Sweep[k])
	return c / (2 * math.Sin(t/2)) * t
}

// ironPieces returns the iron's outline against non-iron: every chorded
// edge of an iron region, split where a vertex of another iron region
// lies on it, without the stretches shared with another iron region.
func (f *featureFinder) ironPieces() []piece {
	var ps []piece
	for i, o := range f.outlines {
		if !f.iron[i] {
			continue
		}
		n := len(o.x)
		for k := 0; k < n; k++ {
			l := (k + 1) % n
			ax, ay, bx, by := o.x[k], o.y[k], o.x[l], o.y[l]
			// Vertices of other iron regions on the edge, by distance from a.
			type cut struct{ t, x, y float64 }
			cuts := []cut{{0, ax, ay}, {1, bx, by}}
			for j, p := range f.outlines {
				if j == i || !f.iron[j] || !boxesMeet(p.box, ax, ay, bx, by) {
					continue
				}
				for v := range p.x {
					px, py := p.x[v], p.y[v]
					if mesh.NearSegment(px, py, ax, ay, bx, by, f.d) &&
						!mesh.NearPoint(px, py, ax, ay, f.d) && !mesh.NearPoint(px, py, bx, by, f.d) {
						t := ((px-ax)*(bx-ax) + (py-ay)*(by-ay)) / ((bx-ax)*(bx-ax) + (by-ay)*(by-ay))
						cuts = append(cuts, cut{t, px, py})
					}
				}
			}
			slices.SortFunc(cuts, func(a, b cut) int { return cmp.Compare(a.t, b.t) })
			elen := f.edgeLength(i, o.edge[k])
			for c := 0; c+1 < len(cuts); c++ {
				p := piece{x0: cuts[c].x, y0: cuts[c].y, x1: cuts[c+1].x, y1: cuts[c+1].y, region: i, edgeLen: elen}
				if mesh.NearPoint(p.x0, p.y0, p.x1, p.y1, f.d) || f.shared(i, p) {
					continue
				}
				p.id = len(ps)
				ps = append(ps, p)
			}
		}
	}
	return ps
}

// shared reports whether the piece p of region i lies on the outline of
// another iron region (its midpoint does: the pieces are split at every
// iron vertex, so a piece lies on another outline entirely or touches it
// at most at its ends).
func (f *featureFinder) shared(i int, p piece) bool {
	mx, my := 0.5*(p.x0+p.x1), 0.5*(p.y0+p.y1)
	for j, o := range f.outlines {
		if j != i && f.iron[j] && inBox(o.box, mx, my) && mesh.PointInPolygon(o.x, o.y, mx, my, f.d) == mesh.OnBoundary {
			return true
		}
	}
	return false
}

// ironAt returns where (x, y) lies relative to the iron: Inside an iron
// region, OnBoundary of one (and inside none) or Outside all.
func (f *featureFinder) ironAt(x, y float64) mesh.Side {
	side := mesh.Outside
	for j, o := range f.outlines {
		if !f.iron[j] || !inBox(o.box, x, y) {
			continue
		}
		switch mesh.PointInPolygon(o.x, o.y, x, y, f.d) {
		case mesh.Inside:
			return mesh.Inside
		case mesh.OnBoundary:
			side = mesh.OnBoundary
		}
	}
	return side
}

// corners returns the corners of the iron's outline: every model vertex
// of an iron region, once, with the iron angle summed over the iron
// regions that meet there.
func (f *featureFinder) corners() []Corner {
	var cs []Corner
	var seen [][2]float64
	for i, o := range f.outlines {
		if !f.iron[i] {
			continue
		}
	vertices:
		for k := range o.x {
			if o.origin[k] < 0 {
				continue
			}
			px, py := o.x[k], o.y[k]
			for _, q := range seen {
				if mesh.NearPoint(px, py, q[0], q[1], f.d) {
					continue vertices
				}
			}
			seen = append(seen, [2]float64{px, py})
			alpha := 0.0
			for j, p := range f.outlines {
				if f.iron[j] && inBox(p.box, px, py) {
					alpha += f.ironAngle(j, px, py)
				}
			}
			for _, ml := range f.mirrors {
				if ml.on(px, py, f.d) {
					alpha *= 2
				}
			}
			if alpha >= 2*math.Pi-1e-9 {
				continue // inside the iron
			}
			e := math.Pi/math.Max(alpha, 2*math.Pi-alpha) - 1
			if e > minExponent {
				continue
			}
			kind := Convex
			if alpha > math.Pi {
				kind = Reentrant
			}
			cs = append(cs, Corner{X: px, Y: py, Region: i, Angle: alpha, Kind: kind, Exponent: e})
		}
	}
	return cs
}

// ironAngle returns the angle region j fills at (px, py): its interior
// angle there if (px, py) is one of its model vertices, π on an edge, 2π
// inside and 0 outside.
func (f *featureFinder) ironAngle(j int, px, py float64) float64 {
	o := &f.outlines[j]
	for k := range o.x {
		if o.origin[k] >= 0 && mesh.NearPoint(px, py, o.x[k], o.y[k], f.d) {
			return interiorAngle(&f.m.Regions[j], o.origin[k])
		}
	}
	switch mesh.PointInPolygon(o.x, o.y, px, py, f.d) {
	case mesh.OnBoundary:
		return math.Pi
	case mesh.Inside:
		return 2 * math.Pi
	}
	return 0
}

// interiorAngle returns the interior angle of the counter-clockwise
// region r at its vertex k, from the tangents of the edges (arcs
// included) that meet there, in (0, 2π).
func interiorAngle(r *models.Region, k int) float64 {
	n := len(r.X)
	p := (k + n - 1) % n
	ix, iy := tangent(r, p, true)
	ox, oy := tangent(r, k, false)
	turn := math.Atan2(ix*oy-iy*ox, ix*ox+iy*oy)
	return math.Pi - turn
}

// tangent returns the direction of edge k of r at its end (end true) or
// start: the chord turned by half the arc's sweep, back at the start and
// on at the end.
func tangent(r *models.Region, k int, end bool) (x, y float64) {
	j := (k + 1) % len(r.X)
	x, y = r.X[j]-r.X[k], r.Y[j]-r.Y[k]
	if r.Sweep == nil || r.Sweep[k] == 0 {
		return x, y
	}
	a := r.Sweep[k] / 2
	if !end {
		a = -a
	}
	s, c := math.Sincos(a)
	return c*x - s*y, s*x + c*y
}

// on reports whether (x, y) lies on the mirror line, within d.
func (ml mirrorLine) on(x, y, d float64) bool {
	if ml.vertical {
		return math.Abs(x-ml.at) <= d
	}
	return math.Abs(y-ml.at) <= d
}

// reflect returns the mirror image of p across the line, reversed so
// that the iron stays on its left.
func (ml mirrorLine) reflect(p piece) piece {
	q := p
	if ml.vertical {
		q.x0, q.x1 = 2*ml.at-p.x1, 2*ml.at-p.x0
		q.y0, q.y1 = p.y1, p.y0
	} else {
		q.x0, q.x1 = p.x1, p.x0
		q.y0, q.y1 = 2*ml.at-p.y1, 2*ml.at-p.y0
	}
	q.mirror = true
	return q
}

// pairs returns the gaps and thin parts: pairs of iron pieces facing each
// other across air (gaps) or back to back across iron (thin parts).
func (f *featureFinder) pairs() (gaps []Gap, thin []ThinPart) {
	all := append([]piece(nil), f.pieces...)
	for _, ml := range f.mirrors {
		for _, p := range f.pieces {
			all = append(all, ml.reflect(p))
		}
	}
	for a := range f.pieces {
		pa := &f.pieces[a]
		for b := a + 1; b < len(all); b++ {
			pb := &all[b]
			if pb.mirror && pb.id < a {
				continue // the mirror image of this pair was seen from pb's piece
			}
			if !near(pa, pb) {
				continue
			}
			faces, w, length, across, ok := facing(pa, pb, f.d)
			if !ok || w > math.Min(pa.edgeLen, pb.edgeLen) {
				continue
			}
			if !f.clear(faces, across, a, b, all) {
				continue
			}
			regions := [2]int{pa.region, pb.region}
			if across == mesh.Outside {
				gaps = append(gaps, Gap{Regions: regions, Faces: faces, Width: w, Length: length})
			} else {
				thin = append(thin, ThinPart{Regions: regions, Faces: faces, Thickness: w, Length: length})
			}
		}
	}
	return gaps, thin
}

// near is a cheap test that pieces a and b may form a gap or thin part:
// their bounding boxes are within the shorter edge length of each other.
func near(a, b *piece) bool {
	l := math.Min(a.edgeLen, b.edgeLen)
	return math.Min(b.x0, b.x1) <= math.Max(a.x0, a.x1)+l && math.Min(a.x0, a.x1) <= math.Max(b.x0, b.x1)+l &&
		math.Min(b.y0, b.y1) <= math.Max(a.y0, a.y1)+l && math.Min(a.y0, a.y1) <= math.Max(b.y0, b.y1)+l
}

// facing measures two pieces that face each other: antiparallel within
// 20 degrees, overlapping when projected on a, and apart by more than d
// over the whole overlap, all in front of each other (across Outside: a
// gap through non-iron) or all behind (across Inside: back to back). It
// returns the overlapping stretches (on a, then their feet on b), the
// smallest distance and the stretch's length on a.
func facing(a, b *piece, d float64) (faces [2][2][2]float64, w, length float64, across mesh.Side, ok bool) {
	ux, uy := a.x1-a.x0, a.y1-a.y0
	la := math.Hypot(ux, uy)
	vx, vy := b.x1-b.x0, b.y1-b.y0
	lb := math.Hypot(vx, vy)
	ux, uy, vx, vy = ux/la, uy/la, vx/lb, vy/lb
	if ux*vx+uy*vy > -facingCos {
		return faces, 0, 0, 0, false
	}
	if mesh.NearPoint(a.x0, a.y0, b.x1, b.y1, d) || mesh.NearPoint(a.x1, a.y1, b.x0, b.y0, d) ||
		mesh.NearPoint(a.x0, a.y0, b.x0, b.y0, d) || mesh.NearPoint(a.x1, a.y1, b.x1, b.y1, d) {
		return faces, 0, 0, 0, false // adjacent: a wedge, which the corner handles
	}
	// Overlap of b's projection on a.
	t0 := (b.x0-a.x0)*ux + (b.y0-a.y0)*uy
	t1 := (b.x1-a.x0)*ux + (b.y1-a.y0)*uy
	s0, s1 := math.Max(0, math.Min(t0, t1)), math.Min(la, math.Max(t0, t1))
	if !(s1-s0 > d) {
		return faces, 0, 0, 0, false
	}
	// Outward normal of a (iron on the left): (uy, -ux).
	nx, ny := uy, -ux
	var dist [2]float64
	for e, s := range [2]float64{s0, s1} {
		px, py := a.x0+s*ux, a.y0+s*uy
		// Foot on b's line along a's normal.
		den := nx*vy - ny*vx
		if den == 0 {
			return faces, 0, 0, 0, false
		}
		h := ((b.x0-px)*vy - (b.y0-py)*vx) / den
		faces[0][e] = [2]float64{px, py}
		faces[1][e] = [2]float64{px + h*nx, py + h*ny}
		dist[e] = h
	}
	switch {
	case dist[0] > d && dist[1] > d:
		across = mesh.Outside
	case dist[0] < -d && dist[1] < -d:
		across = mesh.Inside
	default:
		return faces, 0, 0, 0, false
	}
	w = math.Min(math.Abs(dist[0]), math.Abs(dist[1]))
	return faces, w, s1 - s0, across, true
}

// clear reports whether the space between the two stretches is what
// across says (air for a gap, iron for a thin part): three points on the
// middle line are outside the iron (gap) or not outside it (thin part),
// and no other iron piece crosses the segment joining the stretches'
// midpoints.
func (f *featureFinder) clear(faces [2][2][2]float64, across mesh.Side, a, b int, all []piece) bool {
	for _, t := range [3]float64{0.25, 0.5, 0.75} {
		x := 0.5 * ((1-t)*(faces[0][0][0]+faces[1][0][0]) + t*(faces[0][1][0]+faces[1][1][0]))
		y := 0.5 * ((1-t)*(faces[0][0][1]+faces[1][0][1]) + t*(faces[0][1][1]+faces[1][1][1]))
		side := f.ironAt(x, y)
		if (across == mesh.Outside) != (side == mesh.Outside) {
			return false
		}
	}
	ax, ay := 0.5*(faces[0][0][0]+faces[0][1][0]), 0.5*(faces[0][0][1]+faces[0][1][1])
	bx, by := 0.5*(faces[1][0][0]+faces[1][1][0]), 0.5*(faces[1][0][1]+faces[1][1][1])
	for k := range all {
		p := &all[k]
		if k == a || k == b {
			continue
		}
		if mesh.SegmentsCross(ax, ay, bx, by, p.x0, p.y0, p.x1, p.y1) {
			return false
		}
	}
	return true
}

// width returns the width of region i's equivalent rectangle: the one of
// the same area A and perimeter P, P/4 - sqrt(P²/16 - A), or sqrt(A) when
// there is none (P² < 16 A cannot happen for a polygon but may after
// rounding).
func (f *featureFinder) width(i int) float64 {
	o := &f.outlines[i]
	per := 0.0
	for k := range o.x {
		l := (k + 1) % len(o.x)
		per += math.Hypot(o.x[l]-o.x[k], o.y[l]-o.y[k])
	}
	a := math.Abs(f.m.Regions[i].Area())
	q := per*per/16 - a
	if q <= 0 {
		return math.Sqrt(a)
	}
	return per/4 - math.Sqrt(q)
}

// boxesMeet reports whether the segment ab's bounding box meets box.
func boxesMeet(box [4]float64, ax, ay, bx, by float64) bool {
	return math.Max(ax, bx) >= box[0] && math.Min(ax, bx) <= box[2] && math.Max(ay, by) >= box[1] && math.Min(ay, by) <= box[3]
}

// inBox reports whether (x, y) lies in box.
func inBox(box [4]float64, x, y float64) bool {
	return x >= box[0] && x <= box[2] && y >= box[1] && y <= box[3]
}
