package models

import (
	"math"
	"sort"

	"polegap/mesh"
)

// Region outlines and the geometric checks of validation. Every decision
// (touching, crossing, inside, zero area) is made by package mesh's exact
// predicates at the resolution tol of the model (see validate.go), under the
// same rules mesh.BuildInput applies at its MergeTol; this file only builds
// outlines, picks sample points and computes where to report a problem.

// arcStep is the largest angle one chord of an arc spans in outlines used for
// validation (5°).
const arcStep = 5 * math.Pi / 180

// arcCentre returns the centre, radius and start angle of the circular arc
// from (x0, y0) to (x1, y1) with signed sweep s (rad, counter-clockwise
// positive, 0 < |s| < 2π).
func arcCentre(x0, y0, x1, y1, s float64) (cx, cy, r, th0 float64) {
	dx, dy := x1-x0, y1-y0
	c := math.Hypot(dx, dy)
	// The centre lies on the chord's perpendicular bisector, at signed
	// distance (c/2)·cot(s/2) to the left of the direction of travel.
	d := c / 2 / math.Tan(s/2)
	nx, ny := -dy/c, dx/c
	cx = (x0+x1)/2 + d*nx
	cy = (y0+y1)/2 + d*ny
	r = c / (2 * math.Abs(math.Sin(s/2)))
	th0 = math.Atan2(y0-cy, x0-cx)
	return
}

// outline returns the region's boundary as a closed polyline (the first point
// is not repeated) with arcs split into chords spanning at most step radians
// (arcStep when step <= 0), and for each point the index of the edge it starts.
func (r *Region) outline(step float64) (px, py []float64) {
	px, py, _ = r.outlineEdges(step)
	return
}

func (r *Region) outlineEdges(step float64) (px, py []float64, edge []int) {
	if step <= 0 {
		step = arcStep
	}
	n := len(r.X)
	for i := 0; i < n; i++ {
		px, py, edge = append(px, r.X[i]), append(py, r.Y[i]), append(edge, i)
		if r.Sweep == nil || r.Sweep[i] == 0 {
			continue
		}
		j := (i + 1) % n
		s := r.Sweep[i]
		cx, cy, rad, th0 := arcCentre(r.X[i], r.Y[i], r.X[j], r.Y[j], s)
		k := int(math.Ceil(math.Abs(s) / step))
		if k < 2 {
			k = 2
		}
		if k > 720 {
			k = 720
		}
		for m := 1; m < k; m++ {
			t := th0 + s*float64(m)/float64(k)
			px, py, edge = append(px, cx+rad*math.Cos(t)), append(py, cy+rad*math.Sin(t)), append(edge, i)
		}
	}
	return
}

// edgeBounds returns the exact bounding box of edge i, arc included.
func (r *Region) edgeBounds(i int) (xmin, ymin, xmax, ymax float64) {
	n := len(r.X)
	j := (i + 1) % n
	xmin, xmax = math.Min(r.X[i], r.X[j]), math.Max(r.X[i], r.X[j])
	ymin, ymax = math.Min(r.Y[i], r.Y[j]), math.Max(r.Y[i], r.Y[j])
	if r.Sweep == nil || r.Sweep[i] == 0 {
		return
	}
	s := r.Sweep[i]
	cx, cy, rad, th0 := arcCentre(r.X[i], r.Y[i], r.X[j], r.Y[j], s)
	// Add each axis-extreme point (angle kπ/2) that the arc passes.
	lo, hi := th0, th0+s
	if s < 0 {
		lo, hi = hi, lo
	}
	for k := math.Ceil(lo / (math.Pi / 2)); k*math.Pi/2 <= hi; k++ {
		t := k * math.Pi / 2
		x, y := cx+rad*math.Cos(t), cy+rad*math.Sin(t)
		xmin, xmax = math.Min(xmin, x), math.Max(xmax, x)
		ymin, ymax = math.Min(ymin, y), math.Max(ymax, y)
	}
	return
}

// exactBounds returns the region's bounding box with arcs treated exactly.
func (r *Region) exactBounds() (xmin, ymin, xmax, ymax float64) {
	xmin, ymin = math.Inf(1), math.Inf(1)
	xmax, ymax = math.Inf(-1), math.Inf(-1)
	for i := range r.X {
		a, b, c, d := r.edgeBounds(i)
		xmin, ymin = math.Min(xmin, a), math.Min(ymin, b)
		xmax, ymax = math.Max(xmax, c), math.Max(ymax, d)
	}
	return
}

// reverse turns the region's orientation around, keeping each arc's shape.
func (r *Region) reverse() {
	n := len(r.X)
	for i, j := 0, n-1; i < j; i, j = i+1, j-1 {
		r.X[i], r.X[j] = r.X[j], r.X[i]
		r.Y[i], r.Y[j] = r.Y[j], r.Y[i]
		r.vertexPos[i], r.vertexPos[j] = r.vertexPos[j], r.vertexPos[i]
	}
	if r.Sweep != nil {
		// Old edge i ran v_i -> v_{i+1}. After reversal vertex k is old
		// n-1-k, and new edge k runs old v_{n-1-k} -> old v_{n-2-k}, which is
		// old edge n-2-k traversed backwards.
		old := append([]float64(nil), r.Sweep...)
		for k := 0; k < n; k++ {
			e := ((n-2-k)%n + n) % n
			r.Sweep[k] = -old[e]
		}
	}
}

// clearCross reports whether segments a-b and c-d cross at a single point
// interior to both with every end farther than tol from the other segment:
// a crossing that is not a touch at resolution tol.
func clearCross(ax, ay, bx, by, cx, cy, dx, dy, tol float64) bool {
	return mesh.SegmentsCross(ax, ay, bx, by, cx, cy, dx, dy) &&
		!mesh.NearSegment(cx, cy, ax, ay, bx, by, tol) && !mesh.NearSegment(dx, dy, ax, ay, bx, by, tol) &&
		!mesh.NearSegment(ax, ay, cx, cy, dx, dy, tol) && !mesh.NearSegment(bx, by, cx, cy, dx, dy, tol)
}

// selfIntersection looks for two edges of the region's outline that come
// within tol of each other other than where consecutive edges meet
// (mesh.SelfIntersection, the rule BuildInput applies). It returns the two
// region edges they belong to (the outline pair with the smallest indices
// when there are several), the approximate meeting point and ok = true when
// it finds one.
func (r *Region) selfIntersection(tol float64) (e1, e2 int, x, y float64, ok bool) {
	px, py, edge := r.outlineEdges(0)
	i, j, ok := mesh.SelfIntersection(px, py, tol)
	if !ok {
		return 0, 0, 0, 0, false
	}
	n := len(px)
	x, y = mesh.CrossingPoint(px[i], py[i], px[(i+1)%n], py[(i+1)%n], px[j], py[j], px[(j+1)%n], py[(j+1)%n])
	return edge[i], edge[j], x, y, true
}

// segmentPairs calls fn(i, j), i < j, for every pair of segments of the
// closed polylines whose bounding boxes overlap or touch. Segment k
// runs from point k to point k+1 of its polyline; owner, when not nil, gives
// each point's polyline (a point and its successor share an owner) and the
// closing segment of polyline o runs from its last point back to its first.
// Pairs are found by sorting on x and sweeping (sweep and prune).
func segmentPairs(px, py []float64, owner []int, fn func(i, j int)) {
	n := len(px)
	next := make([]int, n)
	for k := range next {
		next[k] = k + 1
		if k == n-1 || (owner != nil && owner[k+1] != owner[k]) {
			// close the polyline: back to its first point
			f := k
			for f > 0 && (owner == nil || owner[f-1] == owner[k]) {
				f--
			}
			next[k] = f
		}
	}
	type box struct {
		x0, x1, y0, y1 float64
		k              int
	}
	boxes := make([]box, n)
	for k := 0; k < n; k++ {
		q := next[k]
		boxes[k] = box{math.Min(px[k], px[q]), math.Max(px[k], px[q]),
			math.Min(py[k], py[q]), math.Max(py[k], py[q]), k}
	}
	sort.Slice(boxes, func(a, b int) bool { return boxes[a].x0 < boxes[b].x0 })
	var active []box
	for _, b := range boxes {
		keep := active[:0]
		for _, a := range active {
			if a.x1 >= b.x0 {
				keep = append(keep, a)
			}
		}
		active = keep
		for _, a := range active {
			if a.y0 <= b.y1 && b.y0 <= a.y1 {
				fn(min(a.k, b.k), max(a.k, b.k))
			}
		}
		active = append(active, b)
	}
}

// overlap reports whether the interiors of regions a and b share area at
// resolution tol, and a point in the shared part; a and b must have passed
// checkPolygon. Touching and shared edges are not an overlap, nor is a
// crossing with an end within tol of the other edge (the mesher snaps that
// end onto the edge). The point comes from the first of: a clear crossing
// of two edges, a sample point of one region's interior (see interiorIn)
// inside the other and farther than tol from its boundary, or else the
// mesher's rule (mesh.PolygonsOverlap), which decides the remaining cases
// exactly as BuildInput does; each of the first two implies the third.
func overlap(a, b *Region, tol float64) (x, y float64, ok bool) {
	ax0, ay0, ax1, ay1 := a.exactBounds()
	bx0, by0, bx1, by1 := b.exactBounds()
	if ax1 < bx0 || bx1 < ax0 || ay1 < by0 || by1 < ay0 {
		return 0, 0, false
	}
	apx, apy := a.outline(0)
	bpx, bpy := b.outline(0)
	na := len(apx)
	px := append(append([]float64(nil), apx...), bpx...)
	py := append(append([]float64(nil), apy...), bpy...)
	owner := make([]int, len(px))
	for k := na; k < len(px); k++ {
		owner[k] = 1
	}
	nxt := func(k int) int {
		if k < na {
			return (k + 1) % na
		}
		return na + (k-na+1)%(len(px)-na)
	}
	// Report the crossing with the smallest edge indices, for stable messages.
	best := [2]int{-1, -1}
	segmentPairs(px, py, owner, func(i, j int) {
		if owner[i] == owner[j] {
			return // i < j, so i is on a and j on b below
		}
		if best[0] >= 0 && (i > best[0] || (i == best[0] && j > best[1])) {
			return
		}
		i1, j1 := nxt(i), nxt(j)
		if clearCross(px[i], py[i], px[i1], py[i1], px[j], py[j], px[j1], py[j1], tol) {
			best = [2]int{i, j}
		}
	})
	if i, j := best[0], best[1]; i >= 0 {
		x, y = mesh.CrossingPoint(px[i], py[i], px[nxt(i)], py[nxt(i)], px[j], py[j], px[nxt(j)], py[nxt(j)])
		return x, y, true
	}
	if x, y, ok := interiorIn(apx, apy, bpx, bpy, tol); ok {
		return x, y, true
	}
	if x, y, ok := interiorIn(bpx, bpy, apx, apy, tol); ok {
		return x, y, true
	}
	// Overlaps the samples miss (thin ones along shared edges): the
	// mesher's own rule, on the same outlines at the same resolution.
	return mesh.PolygonsOverlap(apx, apy, bpx, bpy, tol)
}

// interiorIn tests sample points of polygon p's interior (its vertices, and
// points 1e3 tol inside the midpoint of each edge) against polygon q: a
// point that lies inside q farther than tol from its boundary (and, for the
// edge samples, inside p in the same sense) is in both interiors.
func interiorIn(px, py, qx, qy []float64, tol float64) (x, y float64, ok bool) {
	n := len(px)
	eps := 1e3 * tol
	for i := 0; i < n; i++ {
		if mesh.PointInPolygon(qx, qy, px[i], py[i], tol) == mesh.Inside {
			return px[i], py[i], true
		}
		j := (i + 1) % n
		dx, dy := px[j]-px[i], py[j]-py[i]
		l := math.Hypot(dx, dy)
		if l <= 2*eps {
			continue
		}
		// p is counter-clockwise, so its inside is to the left.
		mx, my := (px[i]+px[j])/2-eps*dy/l, (py[i]+py[j])/2+eps*dx/l
		if mesh.PointInPolygon(px, py, mx, my, tol) == mesh.Inside && mesh.PointInPolygon(qx, qy, mx, my, tol) == mesh.Inside {
			return mx, my, true
		}
	}
	return 0, 0, false
}
