package mesh

import (
	"fmt"
	"math"
	"sort"

	"polegap/internal/compsum"
	"polegap/internal/num"
)

// The planar straight-line graph of a model.
//
// BuildInput turns region polygons (with arcs) and a boundary polygon into an
// Input for Triangulate:
//
//  1. arcs become chords (DiscretizePolygon) that remember their circle
//     (Input.Arcs, Input.SegmentArc), vertices within MergeTol of
//     their predecessor are dropped, and each polygon is checked for fewer
//     than 3 distinct vertices, zero area (ZeroArea) and self-intersection
//     (SelfIntersection), all at resolution MergeTol (see polygon.go);
//  2. all edges go into one list, boundary first, then the regions in order;
//  3. vertices within MergeTol merge (grid hashing, NearPoint);
//  4. edges are split where they cross (decided by SegmentsCross, then the
//     crossing point computed) and where a vertex lies within MergeTol of
//     their interior (T-junctions, overlapping collinear edges; NearSegment),
//     until nothing changes;
//  5. duplicate edges collapse to the first one, so a shared edge appears
//     once with the marker of the first polygon, boundary markers first;
//  6. the faces of the graph are traced (half-edges sorted by angle around
//     each vertex) and every bounded face gets a seed point strictly inside
//     it: from the middle of its longest edge a ray goes into the face, and
//     the seed sits half way to the first edge the ray meets. The face takes
//     the Region of the polygon that contains its seed, the boundary's
//     Region (Input.DefaultRegion) when none does.
//
// Seeding faces rather than polygons keeps the tagging right when edges of
// other polygons cut a polygon into pieces or when polygons nest.

// Polygon is a closed outline: a region of the model, or the boundary.
type Polygon struct {
	// X, Y are the vertices in order (either orientation), metres, with
	// the first vertex not repeated at the end.
	X, Y []float64
	// Sweep optionally makes edges circular arcs: Sweep[i] is the signed
	// angle in radians that the arc from vertex i to vertex i+1 (mod n)
	// turns through about its centre; positive when it runs
	// counter-clockwise about the centre, which on a counter-clockwise
	// polygon bulges outwards. 0 is a straight edge; |Sweep[i]| < 2π.
	Sweep []float64
	// Region is the region tag of the interior (for the boundary, of the
	// area no region polygon covers). A negative tag makes a hole.
	Region int32
	// Marker (>= 1) is given to every edge unless EdgeMarkers is set;
	// 0 means 1.
	Marker int32
	// EdgeMarkers optionally gives each edge i (vertex i to i+1) its own
	// marker (>= 1, 0 means Marker).
	EdgeMarkers []int32
}

// Overlap says what BuildInput does where region polygons overlap.
type Overlap int

const (
	// OverlapError makes overlapping region polygons an error (the
	// default: a model's regions are meant to be disjoint).
	OverlapError Overlap = iota
	// OverlapLaterWins gives overlapping area to the polygon that comes
	// later in the list, so a small region can be drawn over a larger one.
	OverlapLaterWins
)

// GraphOptions control BuildInput and DiscretizePolygon. The zero value
// uses the defaults; see WithDefaults.
//
// Arcs are cut into chords whose sagitta (the largest distance between the
// arc and the chord) stays within a tolerance: ChordTol when it is set,
// otherwise ChordRatio times the element size that Size asks for at the
// arc, so that arcs are cut finer where the mesh is finer. No chord spans
// more than MaxArcAngle. The chords are where meshing starts: refinement
// splits them further at points on the arc, and second-order meshes curve
// them (see curved.go), so the tolerance bounds how far the mesher moves a
// split point off the chord (a small fraction of the triangles there) and
// the straight-sided geometry of first-order meshes.
type GraphOptions struct {
	// ChordTol is the largest sagitta, metres; 0 means ChordRatio times
	// the size at the arc when Size is set, and 1e-3 of the model extent
	// otherwise.
	ChordTol float64
	// ChordRatio is the largest sagitta as a fraction of the local element
	// size (Size at the arc), used when ChordTol is 0 and Size is set;
	// 0 means DefaultChordRatio.
	ChordRatio float64
	// Size is the size field the graph will be meshed with (Options.Size);
	// it sets the sagitta when ChordTol is 0. The field is read at points
	// of the arc without a region (SizeField.Region does not apply: an
	// arc between two regions must be cut the same way for both).
	Size *SizeField
	// MaxArcAngle is the largest angle one chord may span, radians;
	// 0 means DefaultMaxArcAngle.
	MaxArcAngle float64
	// MergeTol is the resolution of the graph, metres: vertices at most
	// this far apart merge, a vertex this close to a segment splits it,
	// and polygons are checked at this resolution (ZeroArea,
	// SelfIntersection). 0 means 1e-9 of the model extent.
	MergeTol float64
	// Overlap selects the rule for overlapping region polygons.
	Overlap Overlap
}

// GraphError reports a polygon that cannot be meshed.
type GraphError struct {
	Polygon int    // index in the regions slice, or -1 for the boundary
	Other   int    // second polygon involved (overlaps), or -2 when none
	Reason  string // what is wrong
	X, Y    float64
	HasAt   bool // X, Y locate the problem
}

func (e *GraphError) Error() string {
	s := "mesh: " + polyName(e.Polygon) + ": " + e.Reason
	if e.Other != -2 {
		s = "mesh: " + polyName(e.Polygon) + " and " + polyName(e.Other) + ": " + e.Reason
	}
	if e.HasAt {
		s += fmt.Sprintf(" near (%g, %g)", e.X, e.Y)
	}
	return s
}

func polyName(i int) string {
	if i < 0 {
		return "boundary polygon"
	}
	return fmt.Sprintf("region polygon %d", i)
}

func graphErr(p int, reason string) *GraphError {
	return &GraphError{Polygon: p, Other: -2, Reason: reason}
}

func graphErrAt(p int, reason string, x, y float64) *GraphError {
	return &GraphError{Polygon: p, Other: -2, Reason: reason, X: x, Y: y, HasAt: true}
}

// Defaults of the arc discretisation (see GraphOptions).
const (
	// DefaultChordRatio is the sagitta of a chord as a fraction of the
	// local element size when GraphOptions.ChordTol is 0: 1/20.
	DefaultChordRatio = 1.0 / 20
	// DefaultMaxArcAngle is the largest angle one chord spans, radians
	// (30 degrees); the parabola of a curved element then stays within
	// 1.5e-4 of the radius from the arc.
	DefaultMaxArcAngle = 30 * math.Pi / 180
)

// WithDefaults returns o with every zero field replaced by its default for
// the model made of regions and boundary (the extent is the larger side of
// the bounding box of all their vertices). DiscretizePolygon with these
// options gives exactly the outline that BuildInput meshes.
func (o GraphOptions) WithDefaults(regions []Polygon, boundary Polygon) GraphOptions {
	checkPolygonShape(boundary)
	for i := range regions {
		checkPolygonShape(regions[i])
	}
	x0, y0 := math.Inf(1), math.Inf(1)
	x1, y1 := math.Inf(-1), math.Inf(-1)
	for i := -1; i < len(regions); i++ {
		p := &boundary
		if i >= 0 {
			p = &regions[i]
		}
		for j := range p.X {
			if num.Finite(p.X[j]) && num.Finite(p.Y[j]) {
				x0, x1 = math.Min(x0, p.X[j]), math.Max(x1, p.X[j])
				y0, y1 = math.Min(y0, p.Y[j]), math.Max(y1, p.Y[j])
			}
		}
	}
	ext := math.Max(x1-x0, y1-y0)
	if !(ext > 0) || math.IsInf(ext, 0) {
		ext = 1
	}
	if o.ChordTol <= 0 && o.Size == nil {
		o.ChordTol = 1e-3 * ext
	}
	if o.ChordRatio <= 0 {
		o.ChordRatio = DefaultChordRatio
	}
	if o.MaxArcAngle <= 0 {
		o.MaxArcAngle = DefaultMaxArcAngle
	}
	if o.MergeTol <= 0 {
		o.MergeTol = 1e-9 * ext
	}
	return o
}

// PolygonArea returns the signed area of the polygon (x, y), positive when
// counter-clockwise, by the shoelace formula taken relative to the first
// vertex and summed with compensation.
func PolygonArea(x, y []float64) float64 {
	if len(x) != len(y) {
		panic("mesh: PolygonArea: len(x) != len(y)")
	}
	var s compsum.Sum
	for i := 1; i+1 < len(x); i++ {
		s.Add(triArea(x[0], y[0], x[i], y[i], x[i+1], y[i+1]))
	}
	return s.Value()
}

// DiscretizePolygon returns the vertices of p with every arc replaced by
// chords. With ChordTol set, an arc of radius R and sweep θ gets
// n = ceil(|θ| / φ) equal chords with φ = min(MaxArcAngle,
// 2 acos(1 - ChordTol/R)), so the sagitta R (1 - cos(θ/2n)) stays within
// ChordTol. Otherwise the allowed angle φ(α) = min(MaxArcAngle,
// 2 acos(1 - ChordRatio h(α)/R)) follows the size h(α) that Size gives at
// each point of the arc, and the arc gets n = ceil(∫ dα/φ(α)) chords
// placed at equal steps of that integral, so each chord spans about the
// angle allowed where it lies. An arc is cut the same way whichever way a
// polygon runs along it. The original vertices are kept, in the original
// order, with the new ones between them. Zero options are resolved from p
// alone; pass opt.WithDefaults(...) to match BuildInput.
func DiscretizePolygon(p Polygon, opt GraphOptions) (x, y []float64) {
	checkPolygonShape(p)
	opt = opt.WithDefaults(nil, p)
	x, y, _, _ = discretize(p, opt)
	return x, y
}

// checkPolygonShape panics on length mismatches (programming errors).
func checkPolygonShape(p Polygon) {
	n := len(p.X)
	if len(p.Y) != n || (p.Sweep != nil && len(p.Sweep) != n) || (p.EdgeMarkers != nil && len(p.EdgeMarkers) != n) {
		panic("mesh: Polygon: X, Y, Sweep and EdgeMarkers must have equal lengths (Sweep, EdgeMarkers may be nil)")
	}
	if p.Marker < 0 {
		panic("mesh: Polygon: negative Marker")
	}
	for _, m := range p.EdgeMarkers {
		if m < 0 {
			panic("mesh: Polygon: negative edge marker")
		}
	}
}

// discretize returns the chorded outline of p, the marker of each of its
// edges (edge i runs from vertex i to i+1 mod n) and the circle each edge is
// a chord of (R = 0 for a straight edge).
func discretize(p Polygon, opt GraphOptions) (x, y []float64, mk []int32, arc []Arc) {
	n := len(p.X)
	for i := 0; i < n; i++ {
		marker := p.Marker
		if p.EdgeMarkers != nil && p.EdgeMarkers[i] != 0 {
			marker = p.EdgeMarkers[i]
		}
		if marker == 0 {
			marker = 1
		}
		x = append(x, p.X[i])
		y = append(y, p.Y[i])
		mk = append(mk, marker)
		arc = append(arc, Arc{})
		if p.Sweep == nil || p.Sweep[i] == 0 {
			continue
		}
		j := (i + 1) % n
		x0, y0, x1, y1, th := p.X[i], p.Y[i], p.X[j], p.Y[j], p.Sweep[i]
		if (x0 == x1 && y0 == y1) || !(math.Abs(th) < 2*math.Pi) {
			continue // reported by validate
		}
		// Cut the arc from its lexicographically first end, so that two
		// polygons running along it in opposite directions get the same
		// points.
		rev := x1 < x0 || (x1 == x0 && y1 < y0)
		if rev {
			x0, y0, x1, y1, th = x1, y1, x0, y0, -th
		}
		c := math.Hypot(x1-x0, y1-y0)
		r := c / (2 * math.Abs(math.Sin(th/2)))
		// The centre lies on the chord's perpendicular bisector, at
		// signed distance (c/2)/tan(θ/2) to the left of the chord.
		h := (c / 2) / math.Tan(th/2)
		cx := (x0+x1)/2 - (y1-y0)/c*h
		cy := (y0+y1)/2 + (x1-x0)/c*h
		arc[len(arc)-1] = Arc{X: cx, Y: cy, R: r}
		a0 := math.Atan2(y0-cy, x0-cx)
		fr := chordSteps(cx, cy, r, a0, th, opt)
		for s := range fr {
			f := fr[s]
			if rev {
				f = fr[len(fr)-1-s]
			}
			a := a0 + th*f
			x = append(x, cx+r*math.Cos(a))
			y = append(y, cy+r*math.Sin(a))
			mk = append(mk, marker)
			arc = append(arc, Arc{X: cx, Y: cy, R: r})
		}
	}
	return x, y, mk, arc
}

// anyRegion is the region passed to SizeField.At for points on arcs: no
// region's size applies.
const anyRegion int32 = math.MinInt32

// maxArcChords bounds the chords of one arc (a size field far below the
// arc's radius would otherwise ask for any number).
const maxArcChords = 1 << 20

// chordSteps returns the interior chord points of the arc about (cx, cy) of
// radius r from angle a0 through the signed sweep th, as increasing
// fractions of th in (0, 1) (see DiscretizePolygon for the rule).
func chordSteps(cx, cy, r, a0, th float64, opt GraphOptions) []float64 {
	abs := math.Abs(th)
	allowed := func(tol float64) float64 {
		phi := opt.MaxArcAngle
		if q := 1 - tol/r; q > -1 {
			phi = math.Min(phi, 2*math.Acos(q))
		}
		return math.Max(phi, abs/maxArcChords)
	}
	var fr []float64
	if opt.ChordTol > 0 || opt.Size == nil {
		k := int(math.Ceil(abs/allowed(opt.ChordTol) - 1e-12))
		for s := 1; s < k; s++ {
			fr = append(fr, float64(s)/float64(k))
		}
		return fr
	}
	// Sample the density 1/φ(α) at steps of a quarter of the allowed
	// angle, integrate it by the trapezoidal rule and cut the integral
	// into n equal parts.
	at := func(al float64) float64 {
		a := a0 + math.Copysign(al, th)
		return 1 / allowed(opt.ChordRatio*opt.Size.At(cx+r*math.Cos(a), cy+r*math.Sin(a), anyRegion))
	}
	als, cum := []float64{0}, []float64{0}
	prev := at(0)
	for al := 0.0; al < abs; {
		next := math.Min(al+0.25/prev, abs)
		d := at(next)
		cum = append(cum, cum[len(cum)-1]+0.5*(prev+d)*(next-al))
		als = append(als, next)
		al, prev = next, d
	}
	total := cum[len(cum)-1]
	n := int(math.Ceil(total - 1e-9))
	i := 1
	for s := 1; s < n; s++ {
		target := total * float64(s) / float64(n)
		for cum[i] < target {
			i++
		}
		al := als[i-1] + (als[i]-als[i-1])*(target-cum[i-1])/(cum[i]-cum[i-1])
		fr = append(fr, al/abs)
	}
	return fr
}

// outline is one discretised polygon, counter-clockwise.
type outline struct {
	x, y []float64
	mk   []int32
	arc  []Arc // per edge: the circle it is a chord of, R = 0 if straight
	ccw  bool  // the input order was counter-clockwise
	area float64
	box  [4]float64 // x0, y0, x1, y1
}

// contains reports whether (x, y) lies strictly inside o.
func (o *outline) contains(x, y float64) bool {
	if x < o.box[0] || y < o.box[1] || x > o.box[2] || y > o.box[3] {
		return false
	}
	return PointInPolygon(o.x, o.y, x, y, 0) == Inside
}

// validate discretises p, drops repeated consecutive vertices and checks it.
func validate(idx int, p Polygon, opt GraphOptions) (outline, error) {
	checkPolygonShape(p)
	for i := range p.X {
		if !num.Finite(p.X[i]) || !num.Finite(p.Y[i]) {
			return outline{}, graphErr(idx, fmt.Sprintf("vertex %d has a non-finite coordinate", i))
		}
		if p.Sweep != nil && !(math.Abs(p.Sweep[i]) < 2*math.Pi) {
			return outline{}, graphErrAt(idx, fmt.Sprintf("edge %d has arc sweep %g, want |sweep| < 2π", i, p.Sweep[i]), p.X[i], p.Y[i])
		}
	}
	x, y, mk, arc := discretize(p, opt)
	// Drop vertices that repeat their predecessor within MergeTol.
	var o outline
	tol := opt.MergeTol
	for i := range x {
		k := len(o.x)
		if k > 0 && NearPoint(x[i], y[i], o.x[k-1], o.y[k-1], tol) {
			continue
		}
		o.x, o.y, o.mk, o.arc = append(o.x, x[i]), append(o.y, y[i]), append(o.mk, mk[i]), append(o.arc, arc[i])
	}
	for len(o.x) > 1 && NearPoint(o.x[0], o.y[0], o.x[len(o.x)-1], o.y[len(o.y)-1], tol) {
		o.x, o.y, o.mk, o.arc = o.x[:len(o.x)-1], o.y[:len(o.y)-1], o.mk[:len(o.mk)-1], o.arc[:len(o.arc)-1]
	}
	if len(o.x) < 3 {
		return o, graphErr(idx, fmt.Sprintf("has %d distinct vertices, need at least 3", len(o.x)))
	}
	o.area = PolygonArea(o.x, o.y)
	if ZeroArea(o.x, o.y, tol) {
		return o, graphErr(idx, fmt.Sprintf("has zero area (%g m²)", o.area))
	}
	if i, j, ok := SelfIntersection(o.x, o.y, tol); ok {
		return o, graphErrAt(idx, fmt.Sprintf("intersects itself: edge %d meets edge %d", i, j), o.x[i], o.y[i])
	}
	o.ccw = o.area > 0
	o.box = [4]float64{math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)}
	for i := range o.x {
		o.box = [4]float64{math.Min(o.box[0], o.x[i]), math.Min(o.box[1], o.y[i]), math.Max(o.box[2], o.x[i]), math.Max(o.box[3], o.y[i])}
	}
	if !o.ccw {
		// Reverse to counter-clockwise; edge i (i -> i+1) becomes edge
		// n-2-i of the reversed list, so rotate markers with it.
		n := len(o.x)
		rx, ry, rm, ra := make([]float64, n), make([]float64, n), make([]int32, n), make([]Arc, n)
		for i := 0; i < n; i++ {
			rx[i], ry[i] = o.x[n-1-i], o.y[n-1-i]
			rm[i] = o.mk[(2*n-2-i)%n]
			ra[i] = o.arc[(2*n-2-i)%n]
		}
		o.x, o.y, o.mk, o.arc, o.area = rx, ry, rm, ra, -o.area
	}
	return o, nil
}

// BuildInput builds the straight-line graph of a model whose region
// polygons lie inside boundary (see the steps above). The boundary's Region
// becomes Input.DefaultRegion. It returns a *GraphError for a degenerate or
// self-intersecting polygon, a region reaching outside the boundary,
// overlapping regions (unless opt.Overlap allows it) and edges that cannot
// be separated; it panics on length mismatches inside a Polygon.
func BuildInput(regions []Polygon, boundary Polygon, opt GraphOptions) (*Input, error) {
	checkPolygonShape(boundary)
	for i := range regions {
		checkPolygonShape(regions[i])
	}
	opt = opt.WithDefaults(regions, boundary)
	bo, err := validate(-1, boundary, opt)
	if err != nil {
		return nil, err
	}
	outs := make([]outline, len(regions))
	for i := range regions {
		if outs[i], err = validate(i, regions[i], opt); err != nil {
			return nil, err
		}
	}
	g := newGraph(opt.MergeTol)
	g.addOutline(bo)
	for i := range outs {
		g.addOutline(outs[i])
	}
	if err := g.split(); err != nil {
		return nil, err
	}
	g.dedupe()
	in := &Input{X: g.x, Y: g.y, Segments: g.seg, Markers: g.mk, DefaultRegion: boundary.Region}
	if len(g.arcs) > 0 {
		in.Arcs, in.SegmentArc = g.arcs, g.arc
	}
	sg := newSegGrid(g)
	for _, f := range g.faces() {
		sx, sy, ok := g.seed(sg, f)
		if !ok {
			h := f[0]
			return nil, graphErrAt(-1, "a face of the graph has no interior point clear of its edges", g.x[g.from(h)], g.y[g.from(h)])
		}
		if !bo.contains(sx, sy) {
			for i := range outs {
				if outs[i].contains(sx, sy) {
					return nil, graphErrAt(i, "reaches outside the boundary", sx, sy)
				}
			}
			continue
		}
		owner := -1
		for i := range outs {
			if !outs[i].contains(sx, sy) {
				continue
			}
			if owner >= 0 && opt.Overlap == OverlapError {
				return nil, &GraphError{Polygon: owner, Other: i, Reason: "overlap", X: sx, Y: sy, HasAt: true}
			}
			owner = i
		}
		if owner >= 0 {
			in.Seeds = append(in.Seeds, Seed{X: sx, Y: sy, Region: regions[owner].Region})
		}
	}
	return in, nil
}

// graph is the edge soup being cleaned up: vertices with a hash for
// merging, segments (vertex pairs) with markers and arcs.
type graph struct {
	x, y  []float64
	seg   []int32
	mk    []int32
	arc   []int32 // per segment: index in arcs, or -1
	arcs  []Arc
	arcID map[Arc]int32
	tol   float64
	hash  map[[2]int64][]int32
}

func newGraph(tol float64) *graph {
	return &graph{tol: tol, hash: make(map[[2]int64][]int32), arcID: make(map[Arc]int32)}
}

func (g *graph) cell(x, y float64) [2]int64 {
	return [2]int64{int64(math.Floor(x / g.tol)), int64(math.Floor(y / g.tol))}
}

// vertex returns the vertex within tol of (x, y), adding one if none is.
func (g *graph) vertex(x, y float64) int32 {
	c := g.cell(x, y)
	for di := int64(-1); di <= 1; di++ {
		for dj := int64(-1); dj <= 1; dj++ {
			for _, v := range g.hash[[2]int64{c[0] + di, c[1] + dj}] {
				if NearPoint(g.x[v], g.y[v], x, y, g.tol) {
					return v
				}
			}
		}
	}
	v := int32(len(g.x))
	g.x, g.y = append(g.x, x), append(g.y, y)
	g.hash[c] = append(g.hash[c], v)
	return v
}

func (g *graph) addOutline(o outline) {
	n := len(o.x)
	first := g.vertex(o.x[0], o.y[0])
	prev := first
	for i := 0; i < n; i++ {
		v := first
		if i+1 < n {
			v = g.vertex(o.x[i+1], o.y[i+1])
		}
		if v != prev {
			g.seg, g.mk = append(g.seg, prev, v), append(g.mk, o.mk[i])
			a := int32(-1)
			if o.arc[i].R > 0 {
				id, ok := g.arcID[o.arc[i]]
				if !ok {
					id = int32(len(g.arcs))
					g.arcs = append(g.arcs, o.arc[i])
					g.arcID[o.arc[i]] = id
				}
				a = id
			}
			g.arc = append(g.arc, a)
		}
		prev = v
	}
}

// maxSplitRounds bounds the split passes; each pass resolves every crossing
// and T-junction it sees, so more than two or three mean a numerical loop.
const maxSplitRounds = 16

// split cuts segments at crossings and at vertices lying on them until
// no segment crosses another or passes through a vertex.
func (g *graph) split() error {
	for round := 0; round < maxSplitRounds; round++ {
		splits := make(map[int][]int32)
		ns := len(g.seg) / 2
		// Crossings, from a sweep over x.
		order, lo, hi := g.sweepOrder()
		for a, i := range order {
			for _, j := range order[a+1:] {
				if lo[j] > hi[i] {
					break
				}
				p, q, r, s := g.seg[2*i], g.seg[2*i+1], g.seg[2*j], g.seg[2*j+1]
				ax, ay, bx, by := g.x[p], g.y[p], g.x[q], g.y[q]
				cx, cy, dx, dy := g.x[r], g.y[r], g.x[s], g.y[s]
				if !SegmentsCross(ax, ay, bx, by, cx, cy, dx, dy) {
					continue
				}
				v := g.vertex(CrossingPoint(ax, ay, bx, by, cx, cy, dx, dy))
				if v != p && v != q {
					splits[i] = append(splits[i], v)
				}
				if v != r && v != s {
					splits[j] = append(splits[j], v)
				}
			}
		}
		// T-junctions: vertices within tol of a segment's interior.
		vo := make([]int32, len(g.x))
		for i := range vo {
			vo[i] = int32(i)
		}
		sort.Slice(vo, func(a, b int) bool { return g.x[vo[a]] < g.x[vo[b]] })
		for i := 0; i < ns; i++ {
			p, q := g.seg[2*i], g.seg[2*i+1]
			ax, ay, bx, by := g.x[p], g.y[p], g.x[q], g.y[q]
			// Candidates from the box grown by 2 tol (rounding the grown
			// edge moves it by less than tol); NearSegment decides.
			x0, x1 := math.Min(ax, bx)-2*g.tol, math.Max(ax, bx)+2*g.tol
			y0, y1 := math.Min(ay, by)-2*g.tol, math.Max(ay, by)+2*g.tol
			k := sort.Search(len(vo), func(k int) bool { return g.x[vo[k]] >= x0 })
			for ; k < len(vo) && g.x[vo[k]] <= x1; k++ {
				v := vo[k]
				if v == p || v == q || g.y[v] < y0 || g.y[v] > y1 {
					continue
				}
				// The foot of the perpendicular must lie strictly inside
				// the segment (exact signs of (v-a)·(b-a) and (v-b)·(a-b)).
				px, py := g.x[v], g.y[v]
				if dotSign(ax, ay, px, py, bx, by) != CCW || dotSign(bx, by, px, py, ax, ay) != CCW {
					continue
				}
				if NearSegment(px, py, ax, ay, bx, by, g.tol) {
					splits[i] = append(splits[i], v)
				}
			}
		}
		if len(splits) == 0 {
			return nil
		}
		seg := make([]int32, 0, len(g.seg)+4*len(splits))
		mk := make([]int32, 0, len(g.mk)+2*len(splits))
		arc := make([]int32, 0, len(g.mk)+2*len(splits))
		for i := 0; i < ns; i++ {
			p, q := g.seg[2*i], g.seg[2*i+1]
			vs := splits[i]
			ax, ay, bx, by := g.x[p], g.y[p], g.x[q], g.y[q]
			param := func(v int32) float64 { return (g.x[v]-ax)*(bx-ax) + (g.y[v]-ay)*(by-ay) }
			sort.Slice(vs, func(a, b int) bool { return param(vs[a]) < param(vs[b]) })
			prev := p
			for _, v := range append(vs, q) {
				if v != prev {
					seg, mk, arc = append(seg, prev, v), append(mk, g.mk[i]), append(arc, g.arc[i])
				}
				prev = v
			}
		}
		g.seg, g.mk, g.arc = seg, mk, arc
	}
	i, _ := g.firstCrossing()
	p := g.seg[2*i]
	return graphErrAt(-1, fmt.Sprintf("edges still cross after %d splitting passes (nearly parallel edges closer than MergeTol?)", maxSplitRounds), g.x[p], g.y[p])
}

// sweepOrder returns the segments sorted by their smallest x, with the x
// range of each.
func (g *graph) sweepOrder() (order []int, lo, hi []float64) {
	ns := len(g.seg) / 2
	order, lo, hi = make([]int, ns), make([]float64, ns), make([]float64, ns)
	for i := 0; i < ns; i++ {
		a, b := g.seg[2*i], g.seg[2*i+1]
		order[i], lo[i], hi[i] = i, math.Min(g.x[a], g.x[b]), math.Max(g.x[a], g.x[b])
	}
	sort.Slice(order, func(a, b int) bool { return lo[order[a]] < lo[order[b]] })
	return order, lo, hi
}

// firstCrossing returns a segment that properly crosses another, or -1.
func (g *graph) firstCrossing() (int, int) {
	order, lo, hi := g.sweepOrder()
	for a, i := range order {
		for _, j := range order[a+1:] {
			if lo[j] > hi[i] {
				break
			}
			p, q, r, s := g.seg[2*i], g.seg[2*i+1], g.seg[2*j], g.seg[2*j+1]
			if p == r || p == s || q == r || q == s {
				continue
			}
			if SegmentsNear(g.x[p], g.y[p], g.x[q], g.y[q], g.x[r], g.y[r], g.x[s], g.y[s], 0) {
				return i, j
			}
		}
	}
	return -1, -1
}

// dedupe removes repeated segments (either direction), keeping the first,
// so the earliest polygon's marker stays; the kept segment is a chord of an
// arc if any of the repeats is.
func (g *graph) dedupe() {
	seen := make(map[[2]int32]int, len(g.mk))
	k := 0
	for i := 0; i < len(g.mk); i++ {
		a, b := g.seg[2*i], g.seg[2*i+1]
		key := [2]int32{min(a, b), max(a, b)}
		if a == b {
			continue
		}
		if j, ok := seen[key]; ok {
			if g.arc[j] < 0 {
				g.arc[j] = g.arc[i]
			}
			continue
		}
		seen[key] = k
		g.seg[2*k], g.seg[2*k+1], g.mk[k], g.arc[k] = a, b, g.mk[i], g.arc[i]
		k++
	}
	g.seg, g.mk, g.arc = g.seg[:2*k], g.mk[:k], g.arc[:k]
}

// Half-edge h runs along segment h/2, from its first vertex when h is even
// and from its second when h is odd; h^1 is its twin.
func (g *graph) from(h int32) int32 { return g.seg[h^(h&1)+(h&1)] }
func (g *graph) to(h int32) int32   { return g.seg[h^(h&1)+1-(h&1)] }

// faces traces the boundary cycles of the faces of the graph and returns
// those with positive area: the outer boundary of every bounded face, each
// a list of half-edges with the face on their left.
func (g *graph) faces() [][]int32 {
	nh := int32(len(g.seg))
	nv := len(g.x)
	start := make([]int32, nv+1)
	for h := int32(0); h < nh; h++ {
		start[g.from(h)+1]++
	}
	for v := 0; v < nv; v++ {
		start[v+1] += start[v]
	}
	out := make([]int32, nh)
	fill := append([]int32(nil), start[:nv]...)
	for h := int32(0); h < nh; h++ {
		v := g.from(h)
		out[fill[v]] = h
		fill[v]++
	}
	// Sort the half-edges leaving each vertex counter-clockwise by
	// direction, exactly: first by half-plane (upper, including the +x
	// axis, before lower), then by Orient2D within a half-plane.
	upper := func(h int32) bool {
		a, b := g.from(h), g.to(h)
		dy := g.y[b] - g.y[a] // the sign of a float difference is exact
		return dy > 0 || (dy == 0 && g.x[b] > g.x[a])
	}
	pos := make([]int32, nh)
	for v := 0; v < nv; v++ {
		list := out[start[v]:start[v+1]]
		sort.Slice(list, func(i, j int) bool {
			hi, hj := list[i], list[j]
			ui, uj := upper(hi), upper(hj)
			if ui != uj {
				return ui
			}
			a, b, c := g.from(hi), g.to(hi), g.to(hj)
			return Orient2D(g.x[a], g.y[a], g.x[b], g.y[b], g.x[c], g.y[c]) == CCW
		})
		for i, h := range list {
			pos[h] = int32(i)
		}
	}
	// next(h): at the head v of h, the half-edge leaving v just clockwise
	// of the twin of h keeps the face on the left.
	next := func(h int32) int32 {
		v := g.to(h)
		deg := start[v+1] - start[v]
		return out[start[v]+(pos[h^1]+deg-1)%deg]
	}
	seen := make([]bool, nh)
	var faces [][]int32
	for h0 := int32(0); h0 < nh; h0++ {
		if seen[h0] {
			continue
		}
		var cyc []int32
		var area compsum.Sum
		a := g.from(h0)
		for h := h0; !seen[h]; h = next(h) {
			seen[h] = true
			cyc = append(cyc, h)
			area.Add(triArea(g.x[a], g.y[a], g.x[g.from(h)], g.y[g.from(h)], g.x[g.to(h)], g.y[g.to(h)]))
		}
		if area.Value() > 0 {
			faces = append(faces, cyc)
		}
	}
	return faces
}

// seed returns a point strictly inside the face bounded on the left by the
// half-edges of cyc: for its edges, longest first, a ray from the middle of
// the edge into the face, stopped half way to the first segment it meets.
// It takes the first point farther than 4 MergeTol from every segment, or
// else the first point found.
func (g *graph) seed(sg *segGrid, cyc []int32) (x, y float64, ok bool) {
	hs := append([]int32(nil), cyc...)
	length := func(h int32) float64 {
		a, b := g.from(h), g.to(h)
		return math.Hypot(g.x[b]-g.x[a], g.y[b]-g.y[a])
	}
	sort.SliceStable(hs, func(i, j int) bool { return length(hs[i]) > length(hs[j]) })
	for _, h := range hs {
		a, b := g.from(h), g.to(h)
		l := length(h)
		mx, my := 0.5*(g.x[a]+g.x[b]), 0.5*(g.y[a]+g.y[b])
		nx, ny := -(g.y[b]-g.y[a])/l, (g.x[b]-g.x[a])/l
		tmin := sg.ray(g, mx, my, nx, ny, h/2)
		if math.IsInf(tmin, 1) {
			continue
		}
		sx, sy := mx+0.5*tmin*nx, my+0.5*tmin*ny
		if !ok {
			x, y, ok = sx, sy, true
		}
		if !sg.near(g, sx, sy, 4*g.tol) {
			return sx, sy, true
		}
	}
	return x, y, ok
}

// segGrid is a uniform bucket grid of segment bounding boxes, about one
// cell per segment, for ray casting and proximity queries.
type segGrid struct {
	x0, y0, invH float64
	nx, ny       int
	start, items []int32
	mark         []int32 // per segment: last query that tested it
	query        int32
}

func newSegGrid(g *graph) *segGrid {
	ns := len(g.mk)
	sg := &segGrid{mark: make([]int32, ns)}
	x0, y0, x1, y1 := math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
	for _, v := range g.seg {
		x0, x1 = math.Min(x0, g.x[v]), math.Max(x1, g.x[v])
		y0, y1 = math.Min(y0, g.y[v]), math.Max(y1, g.y[v])
	}
	w, h := x1-x0, y1-y0
	size := math.Sqrt(w * h / float64(max(ns, 1)))
	if !(size > 0) {
		size = math.Max(math.Max(w, h), 1)
	}
	sg.x0, sg.y0, sg.invH = x0, y0, 1/size
	sg.nx, sg.ny = min(int(w/size)+1, 1<<14), min(int(h/size)+1, 1<<14)
	nc := sg.nx * sg.ny
	sg.start = make([]int32, nc+1)
	each := func(s int, f func(c int)) {
		a, b := g.seg[2*s], g.seg[2*s+1]
		i0, i1 := sg.cx(math.Min(g.x[a], g.x[b])), sg.cx(math.Max(g.x[a], g.x[b]))
		j0, j1 := sg.cy(math.Min(g.y[a], g.y[b])), sg.cy(math.Max(g.y[a], g.y[b]))
		for j := j0; j <= j1; j++ {
			for i := i0; i <= i1; i++ {
				f(j*sg.nx + i)
			}
		}
	}
	for s := 0; s < ns; s++ {
		each(s, func(c int) { sg.start[c+1]++ })
	}
	for c := 0; c < nc; c++ {
		sg.start[c+1] += sg.start[c]
	}
	sg.items = make([]int32, sg.start[nc])
	fill := append([]int32(nil), sg.start[:nc]...)
	for s := 0; s < ns; s++ {
		each(s, func(c int) { sg.items[fill[c]] = int32(s); fill[c]++ })
	}
	return sg
}

func (sg *segGrid) cx(x float64) int { return min(max(int((x-sg.x0)*sg.invH), 0), sg.nx-1) }
func (sg *segGrid) cy(y float64) int { return min(max(int((y-sg.y0)*sg.invH), 0), sg.ny-1) }

// ray returns the smallest t > 0 at which (mx, my) + t (nx, ny), a unit
// direction, meets a segment other than skip, or +Inf. It visits the grid
// cells along the ray in order (J. Amanatides, A. Woo, "A fast voxel
// traversal algorithm for ray tracing", Eurographics 1987) and stops once
// the nearest hit lies before the exit from the current cell.
func (sg *segGrid) ray(g *graph, mx, my, nx, ny float64, skip int32) float64 {
	sg.query++
	h := 1 / sg.invH
	i, j := sg.cx(mx), sg.cy(my)
	stepI, stepJ := 1, 1
	tMaxX, tMaxY := math.Inf(1), math.Inf(1)
	tDX, tDY := math.Inf(1), math.Inf(1)
	if nx > 0 {
		tMaxX, tDX = (sg.x0+float64(i+1)*h-mx)/nx, h/nx
	} else if nx < 0 {
		stepI = -1
		tMaxX, tDX = (sg.x0+float64(i)*h-mx)/nx, -h/nx
	}
	if ny > 0 {
		tMaxY, tDY = (sg.y0+float64(j+1)*h-my)/ny, h/ny
	} else if ny < 0 {
		stepJ = -1
		tMaxY, tDY = (sg.y0+float64(j)*h-my)/ny, -h/ny
	}
	tmin := math.Inf(1)
	for {
		c := j*sg.nx + i
		for _, s := range sg.items[sg.start[c]:sg.start[c+1]] {
			if s == skip || sg.mark[s] == sg.query {
				continue
			}
			sg.mark[s] = sg.query
			p, q := g.seg[2*s], g.seg[2*s+1]
			// Solve m + t n = p + u (q - p) for t > 0, 0 <= u <= 1.
			ex, ey := g.x[q]-g.x[p], g.y[q]-g.y[p]
			den := nx*ey - ny*ex
			if den == 0 {
				continue
			}
			wx, wy := g.x[p]-mx, g.y[p]-my
			t := (wx*ey - wy*ex) / den
			u := (wx*ny - wy*nx) / den
			if t > 0 && u >= 0 && u <= 1 && t < tmin {
				tmin = t
			}
		}
		exit := math.Min(tMaxX, tMaxY)
		if tmin <= exit {
			return tmin
		}
		if tMaxX < tMaxY {
			i += stepI
			tMaxX += tDX
		} else {
			j += stepJ
			tMaxY += tDY
		}
		if i < 0 || i >= sg.nx || j < 0 || j >= sg.ny {
			return tmin
		}
	}
}

// near reports whether a segment passes within r of (x, y).
func (sg *segGrid) near(g *graph, x, y, r float64) bool {
	for j := sg.cy(y - r); j <= sg.cy(y+r); j++ {
		for i := sg.cx(x - r); i <= sg.cx(x+r); i++ {
			c := j*sg.nx + i
			for _, s := range sg.items[sg.start[c]:sg.start[c+1]] {
				p, q := g.seg[2*s], g.seg[2*s+1]
				if NearSegment(x, y, g.x[p], g.y[p], g.x[q], g.y[q], r) {
					return true
				}
			}
		}
	}
	return false
}
