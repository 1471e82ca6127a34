package mesh

import (
	"cmp"
	"math"
	"slices"
)

// Segment and polygon tests at a resolution d.
//
// These are the geometric decisions about input polygons, shared by
// BuildInput and by the model validation in package models, so that a
// polygon one accepts the other accepts too. Every decision is made by the
// exact predicates of predicates.go (Orient2D, NearPoint, NearSegment and
// an exact polygon area); d states the user's intent, "closer than d counts
// as touching", and is an explicit input, never a guard against rounding.
// With d = 0 the tests are the exact ones of computational geometry.
//
// The rules, for a closed polygon whose consecutive vertices are more than d
// apart (BuildInput drops the others first, models reports them):
//
//   - two segments meet when their distance is at most d (SegmentsNear);
//   - a polygon intersects itself when two non-adjacent edges meet, or when
//     two adjacent edges p->q, q->r fold back: r within d of pq, or p
//     within d of qr (SelfIntersection);
//   - a polygon has zero area when twice its area is at most 2d times its
//     perimeter, the area exact and the perimeter summed in floating point
//     (ZeroArea);
//   - a point is on a polygon's boundary when it lies within d of an edge,
//     otherwise inside or outside by the crossing number (PointInPolygon).
//
// PolygonsOverlap applies BuildInput's overlap rule to two polygons.
// CrossingPoint computes where two edges meet, for messages and for
// splitting; it decides nothing.

// Side is where a point lies relative to a closed polygon.
type Side int8

const (
	// Outside: outside the polygon and farther than the resolution from it.
	Outside Side = -1
	// OnBoundary: within the resolution of an edge.
	OnBoundary Side = 0
	// Inside: inside the polygon and farther than the resolution from it.
	Inside Side = 1
)

// String returns "Outside", "OnBoundary" or "Inside".
func (s Side) String() string {
	switch s {
	case Outside:
		return "Outside"
	case Inside:
		return "Inside"
	}
	return "OnBoundary"
}

// SegmentsNear reports whether the closed segments ab and cd come within
// distance d of each other (d >= 0; d = 0 tests whether they share a
// point). Two segments that do not intersect are closest at an end of one
// of them, so the test is an exact intersection test followed by NearSegment
// for the four ends.
func SegmentsNear(ax, ay, bx, by, cx, cy, dx, dy, d float64) bool {
	if segmentsMeet(ax, ay, bx, by, cx, cy, dx, dy) {
		return true
	}
	if d == 0 {
		return false
	}
	return NearSegment(cx, cy, ax, ay, bx, by, d) || NearSegment(dx, dy, ax, ay, bx, by, d) ||
		NearSegment(ax, ay, cx, cy, dx, dy, d) || NearSegment(bx, by, cx, cy, dx, dy, d)
}

// SegmentsCross reports whether the segments ab and cd cross at a single
// point interior to both (a proper crossing: each segment has one end
// strictly on either side of the other's line), exactly.
func SegmentsCross(ax, ay, bx, by, cx, cy, dx, dy float64) bool {
	o1 := Orient2D(ax, ay, bx, by, cx, cy)
	o2 := Orient2D(ax, ay, bx, by, dx, dy)
	if o1*o2 >= 0 {
		return false
	}
	o3 := Orient2D(cx, cy, dx, dy, ax, ay)
	o4 := Orient2D(cx, cy, dx, dy, bx, by)
	return o3*o4 < 0
}

// segmentsMeet reports whether the closed segments ab and cd share a point.
func segmentsMeet(ax, ay, bx, by, cx, cy, dx, dy float64) bool {
	o1 := Orient2D(ax, ay, bx, by, cx, cy)
	o2 := Orient2D(ax, ay, bx, by, dx, dy)
	o3 := Orient2D(cx, cy, dx, dy, ax, ay)
	o4 := Orient2D(cx, cy, dx, dy, bx, by)
	if o1*o2 < 0 && o3*o4 < 0 {
		return true
	}
	return (o1 == Collinear && between(ax, ay, bx, by, cx, cy)) ||
		(o2 == Collinear && between(ax, ay, bx, by, dx, dy)) ||
		(o3 == Collinear && between(cx, cy, dx, dy, ax, ay)) ||
		(o4 == Collinear && between(cx, cy, dx, dy, bx, by))
}

// between reports whether p, known to be collinear with ab, lies on the
// closed segment ab.
func between(ax, ay, bx, by, px, py float64) bool {
	return px >= math.Min(ax, bx) && px <= math.Max(ax, bx) && py >= math.Min(ay, by) && py <= math.Max(ay, by)
}

// CrossingPoint returns the point where the line through c and d meets the
// segment ab (the parameter along ab clamped to [0, 1]), or the midpoint of
// b and c when the rounded lines are parallel. It is a construction for
// messages and for splitting edges: decide first with SegmentsCross or
// SegmentsNear.
func CrossingPoint(ax, ay, bx, by, cx, cy, dx, dy float64) (x, y float64) {
	den := (bx-ax)*(dy-cy) - (by-ay)*(dx-cx)
	if den == 0 {
		return (bx + cx) / 2, (by + cy) / 2
	}
	t := ((cx-ax)*(dy-cy) - (cy-ay)*(dx-cx)) / den
	t = math.Min(math.Max(t, 0), 1)
	return ax + t*(bx-ax), ay + t*(by-ay)
}

// PointInPolygon classifies (px, py) against the closed polygon (x, y) of
// either orientation (first vertex not repeated): OnBoundary when it lies
// within d of an edge (d >= 0; d = 0: exactly on one), else Inside or
// Outside by the crossing-number test with the side of each edge decided by
// Orient2D. It panics if len(x) != len(y).
func PointInPolygon(x, y []float64, px, py, d float64) Side {
	if len(x) != len(y) {
		panic("mesh: PointInPolygon: len(x) != len(y)")
	}
	in := false
	n := len(x)
	for i := 0; i < n; i++ {
		j := (i + 1) % n
		ax, ay, bx, by := x[i], y[i], x[j], y[j]
		o := Orient2D(ax, ay, bx, by, px, py)
		if d == 0 {
			if o == Collinear && between(ax, ay, bx, by, px, py) {
				return OnBoundary
			}
		} else if NearSegment(px, py, ax, ay, bx, by, d) {
			return OnBoundary
		}
		// Upward edge with p strictly left, or downward with p right:
		// the half-open rule counts each crossing once.
		if ay <= py && by > py && o == CCW {
			in = !in
		} else if ay > py && by <= py && o == CW {
			in = !in
		}
	}
	if in {
		return Inside
	}
	return Outside
}

// ZeroArea reports whether the closed polygon (x, y) is too thin to have an
// area at resolution d: |2A| <= 2 d P, with the area A evaluated exactly
// (the shoelace sum as an expansion) and the perimeter P summed in floating
// point. A sliver of width w has A/P about w/2, so slivers narrower than
// about 2d have zero area. It panics if len(x) != len(y).
func ZeroArea(x, y []float64, d float64) bool {
	if len(x) != len(y) {
		panic("mesh: ZeroArea: len(x) != len(y)")
	}
	n := len(x)
	var per float64
	for i := 0; i < n; i++ {
		j := (i + 1) % n
		per += math.Hypot(x[j]-x[i], y[j]-y[i])
	}
	// Twice the area: the sum of x_i y_j - x_j y_i, each term exact as a
	// four-term expansion. A nonoverlapping expansion of doubles has at
	// most about 80 terms, so the running sum stays short.
	acc := make([]float64, 1, 16)
	tmp := make([]float64, 0, 16)
	var term [4]float64
	for i := 0; i < n; i++ {
		j := (i + 1) % n
		t := crossTo(term[:0], x[i], y[j], x[j], y[i])
		tmp = slices.Grow(tmp[:0], len(acc)+len(t))
		tmp = sumTo(tmp, acc, t)
		acc, tmp = tmp, acc
	}
	if acc[len(acc)-1] < 0 {
		negate(acc)
	}
	// Compare with 2 d P = hi + lo exactly.
	hi, lo := twoProduct(2*d, per)
	bound := []float64{-lo, -hi}
	if lo == 0 {
		bound = bound[1:]
	}
	s := sumTo(make([]float64, 0, len(acc)+2), acc, bound)
	return s[len(s)-1] <= 0
}

// SelfIntersection returns the first pair of edges i < j (smallest i, then
// smallest j) of the closed polygon (x, y) that meet other than at the
// vertex adjacent edges share, at resolution d (d >= 0): non-adjacent edges
// within d of each other (SegmentsNear), or adjacent edges p->q, q->r that
// fold back (r within d of pq, or p within d of qr). Edge i runs from vertex
// i to vertex i+1 mod n; i = j = -1 when no pair meets. Consecutive vertices
// closer than d count as a fold back; polygons of fewer than 3 vertices
// report nothing. Candidate pairs
// come from a sweep over the edges' x-extents grown by 2d, so typical
// polygons cost O(n log n). It panics if len(x) != len(y).
func SelfIntersection(x, y []float64, d float64) (i, j int, ok bool) {
	if len(x) != len(y) {
		panic("mesh: SelfIntersection: len(x) != len(y)")
	}
	n := len(x)
	if n < 3 {
		return -1, -1, false
	}
	type box struct {
		x0, y0, x1, y1 float64
		e              int
	}
	boxes := make([]box, n)
	for e := range boxes {
		f := (e + 1) % n
		boxes[e] = box{math.Min(x[e], x[f]) - 2*d, math.Min(y[e], y[f]) - 2*d,
			math.Max(x[e], x[f]) + 2*d, math.Max(y[e], y[f]) + 2*d, e}
	}
	slices.SortFunc(boxes, func(a, b box) int { return cmp.Compare(a.x0, b.x0) })
	bi, bj := -1, -1
	for a, ba := range boxes {
		for _, bb := range boxes[a+1:] {
			if bb.x0 > ba.x1 {
				break
			}
			if bb.y0 > ba.y1 || ba.y0 > bb.y1 {
				continue
			}
			p, q := min(ba.e, bb.e), max(ba.e, bb.e)
			if bi >= 0 && (p > bi || (p == bi && q >= bj)) {
				continue
			}
			if edgesMeet(x, y, p, q, d) {
				bi, bj = p, q
			}
		}
	}
	return bi, bj, bi >= 0
}

// edgesMeet applies SelfIntersection's rule to edges e < f of (x, y).
func edgesMeet(x, y []float64, e, f int, d float64) bool {
	n := len(x)
	e1, f1 := (e+1)%n, (f+1)%n
	switch {
	case f == e1: // edge e then edge f
		return foldsBack(x[e], y[e], x[e1], y[e1], x[f1], y[f1], d)
	case e == f1: // edge f then edge e
		return foldsBack(x[f], y[f], x[e], y[e], x[e1], y[e1], d)
	}
	return SegmentsNear(x[e], y[e], x[e1], y[e1], x[f], y[f], x[f1], y[f1], d)
}

// foldsBack reports whether the path p->q->r turns back on itself at
// resolution d: r within d of pq, or p within d of qr.
func foldsBack(px, py, qx, qy, rx, ry, d float64) bool {
	return NearSegment(rx, ry, px, py, qx, qy, d) || NearSegment(px, py, qx, qy, rx, ry, d)
}

// PolygonsOverlap reports whether the interiors of the polygons a and b
// share area at resolution d > 0, by the rule BuildInput applies with
// OverlapError at MergeTol = d: the two outlines become one graph (vertices
// within d merged, edges split where they cross and where a vertex lies
// within d of them), and a face of the graph whose seed point lies inside
// both is an overlap; (x, y) is that seed. Touching, shared edges and
// overlaps that the merging closes (thinner than about d) are not
// overlaps. Edges that keep crossing after the splitting passes count as an
// overlap at the crossing. Each polygon must be simple at resolution d (at
// least 3 vertices, consecutive ones more than d apart, not ZeroArea, no
// SelfIntersection); PolygonsOverlap panics otherwise, or if d <= 0 or
// len(ax) != len(ay) or len(bx) != len(by).
func PolygonsOverlap(ax, ay, bx, by []float64, d float64) (x, y float64, ok bool) {
	if !(d > 0) {
		panic("mesh: PolygonsOverlap: resolution d must be positive")
	}
	opt := GraphOptions{MergeTol: d, ChordTol: 1, MaxArcAngle: 1} // no arcs to chord
	oa, err := validate(0, Polygon{X: ax, Y: ay}, opt)
	if err != nil || len(oa.x) != len(ax) {
		panic("mesh: PolygonsOverlap: polygon a is not simple at resolution d")
	}
	ob, err := validate(1, Polygon{X: bx, Y: by}, opt)
	if err != nil || len(ob.x) != len(bx) {
		panic("mesh: PolygonsOverlap: polygon b is not simple at resolution d")
	}
	g := newGraph(d)
	g.addOutline(oa)
	g.addOutline(ob)
	if err := g.split(); err != nil {
		ge := err.(*GraphError)
		return ge.X, ge.Y, true
	}
	g.dedupe()
	sg := newSegGrid(g)
	for _, f := range g.faces() {
		sx, sy, found := g.seed(sg, f)
		if found && oa.contains(sx, sy) && ob.contains(sx, sy) {
			return sx, sy, true
		}
	}
	return 0, 0, false
}
