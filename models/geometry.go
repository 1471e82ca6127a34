package models

import (
	"math"
	"sort"
)

// Plain floating-point geometry with a relative tolerance: enough to reject
// bad input. The mesher repeats the decisions that matter with robust
// predicates (Shewchuk 1997).

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

// orient returns the cross product (b-a)×(c-a).
func orient(ax, ay, bx, by, cx, cy float64) float64 {
	return (bx-ax)*(cy-ay) - (by-ay)*(cx-ax)
}

// segDist returns the distance from (px, py) to segment a-b.
func segDist(px, py, ax, ay, bx, by float64) float64 {
	dx, dy := bx-ax, by-ay
	l2 := dx*dx + dy*dy
	t := 0.0
	if l2 > 0 {
		t = ((px-ax)*dx + (py-ay)*dy) / l2
		t = math.Max(0, math.Min(1, t))
	}
	return math.Hypot(px-ax-t*dx, py-ay-t*dy)
}

// properCross reports whether segments a-b and c-d cross at a single point
// interior to both, each endpoint clearly (more than tol) off the other line.
func properCross(ax, ay, bx, by, cx, cy, dx, dy, tol float64) bool {
	lab := math.Hypot(bx-ax, by-ay)
	lcd := math.Hypot(dx-cx, dy-cy)
	o1 := orient(ax, ay, bx, by, cx, cy)
	o2 := orient(ax, ay, bx, by, dx, dy)
	o3 := orient(cx, cy, dx, dy, ax, ay)
	o4 := orient(cx, cy, dx, dy, bx, by)
	if math.Abs(o1) <= tol*lab || math.Abs(o2) <= tol*lab || math.Abs(o3) <= tol*lcd || math.Abs(o4) <= tol*lcd {
		return false
	}
	return (o1 > 0) != (o2 > 0) && (o3 > 0) != (o4 > 0)
}

// segsTouch reports whether segments a-b and c-d share any point (within tol).
func segsTouch(ax, ay, bx, by, cx, cy, dx, dy, tol float64) bool {
	if properCross(ax, ay, bx, by, cx, cy, dx, dy, tol) {
		return true
	}
	return segDist(cx, cy, ax, ay, bx, by) <= tol || segDist(dx, dy, ax, ay, bx, by) <= tol ||
		segDist(ax, ay, cx, cy, dx, dy) <= tol || segDist(bx, by, cx, cy, dx, dy) <= tol
}

// inside classifies a point against a closed polyline: +1 strictly inside,
// 0 on the boundary (within tol), -1 outside.
func inside(x, y float64, px, py []float64, tol float64) int {
	n := len(px)
	in := false
	for i := 0; i < n; i++ {
		j := (i + 1) % n
		if x >= math.Min(px[i], px[j])-tol && x <= math.Max(px[i], px[j])+tol &&
			y >= math.Min(py[i], py[j])-tol && y <= math.Max(py[i], py[j])+tol &&
			segDist(x, y, px[i], py[i], px[j], py[j]) <= tol {
			return 0
		}
		if (py[i] > y) != (py[j] > y) {
			xc := px[i] + (y-py[i])/(py[j]-py[i])*(px[j]-px[i])
			if x < xc {
				in = !in
			}
		}
	}
	if in {
		return 1
	}
	return -1
}

// selfIntersection looks for two edges of the region that touch other than
// where consecutive edges meet. It returns the two edge indices (the pair
// with the smallest indices when there are several), the approximate
// meeting point and ok = true when it finds one. Candidate pairs come from a
// sweep over the segments' x-extents, so typical polygons cost O(n log n).
func (r *Region) selfIntersection(tol float64) (e1, e2 int, x, y float64, ok bool) {
	px, py, edge := r.outlineEdges(0)
	n := len(px)
	for i := 0; i < n && n > 2; i++ {
		// Consecutive segments must not fold back onto each other.
		i1, i2 := (i+1)%n, (i+2)%n
		ax, ay := px[i1]-px[i], py[i1]-py[i]
		bx, by := px[i2]-px[i1], py[i2]-py[i1]
		cr := ax*by - ay*bx
		if ax*bx+ay*by < 0 && math.Abs(cr) <= 1e-9*math.Hypot(ax, ay)*math.Hypot(bx, by) {
			return edge[i], edge[i1], px[i1], py[i1], true
		}
	}
	best := [2]int{-1, -1}
	segmentPairs(px, py, nil, tol, func(i, j int) {
		if j == i+1 || (i == 0 && j == n-1) {
			return // adjacent segments share a vertex
		}
		if best[0] >= 0 && (i > best[0] || (i == best[0] && j > best[1])) {
			return
		}
		i1, j1 := (i+1)%n, (j+1)%n
		if segsTouch(px[i], py[i], px[i1], py[i1], px[j], py[j], px[j1], py[j1], tol) {
			best = [2]int{i, j}
		}
	})
	if best[0] < 0 {
		return 0, 0, 0, 0, false
	}
	i, j := best[0], best[1]
	mx, my := crossPoint(px[i], py[i], px[(i+1)%n], py[(i+1)%n], px[j], py[j], px[(j+1)%n], py[(j+1)%n])
	return edge[i], edge[j], mx, my, true
}

// segmentPairs calls fn(i, j), i < j, for every pair of segments of the
// closed polylines whose bounding boxes, grown by tol, overlap. Segment k
// runs from point k to point k+1 of its polyline; owner, when not nil, gives
// each point's polyline (a point and its successor share an owner) and the
// closing segment of polyline o runs from its last point back to its first.
// Pairs are found by sorting on x and sweeping (sweep and prune).
func segmentPairs(px, py []float64, owner []int, tol float64, fn func(i, j int)) {
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
		boxes[k] = box{math.Min(px[k], px[q]) - tol, math.Max(px[k], px[q]) + tol,
			math.Min(py[k], py[q]) - tol, math.Max(py[k], py[q]) + tol, k}
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

// crossPoint returns the intersection of lines a-b and c-d, or the midpoint
// of the closest endpoints when they are parallel.
func crossPoint(ax, ay, bx, by, cx, cy, dx, dy float64) (x, y float64) {
	den := (bx-ax)*(dy-cy) - (by-ay)*(dx-cx)
	if den == 0 {
		return (bx + cx) / 2, (by + cy) / 2
	}
	t := ((cx-ax)*(dy-cy) - (cy-ay)*(dx-cx)) / den
	t = math.Max(0, math.Min(1, t))
	return ax + t*(bx-ax), ay + t*(by-ay)
}

// overlap reports whether the interiors of regions a and b share area, and a
// point in the shared part. Touching and shared edges are not an overlap.
func overlap(a, b *Region, tol float64) (x, y float64, ok bool) {
	ax0, ay0, ax1, ay1 := a.exactBounds()
	bx0, by0, bx1, by1 := b.exactBounds()
	if ax1 <= bx0+tol || bx1 <= ax0+tol || ay1 <= by0+tol || by1 <= ay0+tol {
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
	segmentPairs(px, py, owner, tol, func(i, j int) {
		if owner[i] == owner[j] {
			return // i < j, so i is on a and j on b below
		}
		if best[0] >= 0 && (i > best[0] || (i == best[0] && j > best[1])) {
			return
		}
		i1, j1 := nxt(i), nxt(j)
		if properCross(px[i], py[i], px[i1], py[i1], px[j], py[j], px[j1], py[j1], tol) {
			best = [2]int{i, j}
		}
	})
	if i, j := best[0], best[1]; i >= 0 {
		x, y = crossPoint(px[i], py[i], px[nxt(i)], py[nxt(i)], px[j], py[j], px[nxt(j)], py[nxt(j)])
		return x, y, true
	}
	if x, y, ok := interiorIn(apx, apy, bpx, bpy, tol); ok {
		return x, y, true
	}
	return interiorIn(bpx, bpy, apx, apy, tol)
}

// interiorIn tests sample points of polygon p's interior (its vertices, and
// points just inside the midpoint of each edge) against polygon q.
func interiorIn(px, py, qx, qy []float64, tol float64) (x, y float64, ok bool) {
	n := len(px)
	eps := 1e3 * tol
	for i := 0; i < n; i++ {
		if inside(px[i], py[i], qx, qy, tol) > 0 {
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
		if inside(mx, my, px, py, tol) > 0 && inside(mx, my, qx, qy, tol) > 0 {
			return mx, my, true
		}
	}
	return 0, 0, false
}
