package mesh

// Segment recovery by edge flips: S. W. Sloan, "A fast algorithm for
// generating constrained Delaunay triangulations", Computers & Structures
// 47(3), 1993, 441-450. The edges crossing a missing segment are flipped
// until none crosses it; the new edges are then flipped back to the
// constrained Delaunay property (Lawson's flip algorithm).

// findEdge returns the triangle t and local edge k whose edge runs from u to
// v (counter-clockwise in t), or t = -1. It rotates around u, then around v;
// a vertex where the domain pinches (two fans meeting at one vertex) can hide
// the edge from both rotations, and a scan of all triangles settles it.
func (d *cdt) findEdge(u, v int32) (int32, int) {
	if t, k := d.rotateFind(u, v, false); t >= 0 {
		return t, k
	}
	if t, k := d.rotateFind(v, u, true); t >= 0 {
		return t, k
	}
	if d.vtri[u] < 0 || d.vtri[v] < 0 || (!d.pinch[u] && !d.pinch[v]) {
		return -1, 0
	}
	for t := int32(0); t < int32(len(d.tri)/3); t++ {
		if !d.alive(t) {
			continue
		}
		for k := 0; k < 3; k++ {
			if d.tri[3*t+int32(next3[k])] == u && d.tri[3*t+int32(next3[k+1])] == v {
				return t, k
			}
		}
	}
	return -1, 0
}

// rotateFind rotates around c from vtri[c] looking for the edge c->o
// (reverse false) or o->c (reverse true).
func (d *cdt) rotateFind(c, o int32, reverse bool) (int32, int) {
	t0 := d.vtri[c]
	if t0 < 0 || !d.alive(t0) {
		return -1, 0
	}
	t := t0
	for dir := 0; dir < 2; dir++ {
		for steps := 0; steps < 1<<20; steps++ {
			i := d.cornerOf(t, c)
			if !reverse && d.tri[3*t+int32(next3[i])] == o {
				return t, next3[i+1]
			}
			if reverse && d.tri[3*t+int32(next3[i+1])] == o {
				return t, next3[i]
			}
			var n int32
			if dir == 0 {
				n = d.nbr[3*t+int32(next3[i])] // across (w, c): counter-clockwise
			} else {
				n = d.nbr[3*t+int32(next3[i+1])] // across (c, next): clockwise
			}
			if n < 0 {
				break
			}
			t = n
			if t == t0 {
				return -1, 0
			}
		}
		t = t0
	}
	return -1, 0
}

// cornerOf returns the local index of vertex v in triangle t.
func (d *cdt) cornerOf(t, v int32) int {
	switch v {
	case d.tri[3*t]:
		return 0
	case d.tri[3*t+1]:
		return 1
	}
	return 2
}

// flip replaces the edge k of t and its twin by the other diagonal of their
// quadrilateral. The caller guarantees the quadrilateral is strictly convex
// and the edge is not a segment. It returns the two triangles, the first now
// holding the new diagonal as its edge 1, the second as its edge 1 too.
func (d *cdt) flip(t1 int32, k1 int) (int32, int32) {
	t2 := d.nbr[3*t1+int32(k1)]
	k2 := d.edgeIndex(t2, t1)
	c1 := d.tri[3*t1+int32(k1)]
	a := d.tri[3*t1+int32(next3[k1])]
	b := d.tri[3*t1+int32(next3[k1+1])]
	c2 := d.tri[3*t2+int32(k2)]
	// Old outer edges and their data.
	nBC1, mBC1 := d.nbr[3*t1+int32(next3[k1])], d.mark[3*t1+int32(next3[k1])]     // (b, c1), opposite a
	nC1A, mC1A := d.nbr[3*t1+int32(next3[k1+1])], d.mark[3*t1+int32(next3[k1+1])] // (c1, a), opposite b
	nAC2, mAC2 := d.nbr[3*t2+int32(next3[k2])], d.mark[3*t2+int32(next3[k2])]     // (a, c2), opposite b
	nC2B, mC2B := d.nbr[3*t2+int32(next3[k2+1])], d.mark[3*t2+int32(next3[k2+1])] // (c2, b), opposite a
	// t1 = (c1, a, c2), t2 = (c2, b, c1).
	d.tri[3*t1], d.tri[3*t1+1], d.tri[3*t1+2] = c1, a, c2
	d.tri[3*t2], d.tri[3*t2+1], d.tri[3*t2+2] = c2, b, c1
	d.nbr[3*t1], d.nbr[3*t1+1], d.nbr[3*t1+2] = nAC2, t2, nC1A
	d.nbr[3*t2], d.nbr[3*t2+1], d.nbr[3*t2+2] = nBC1, t1, nC2B
	d.mark[3*t1], d.mark[3*t1+1], d.mark[3*t1+2] = mAC2, 0, mC1A
	d.mark[3*t2], d.mark[3*t2+1], d.mark[3*t2+2] = mBC1, 0, mC2B
	if nAC2 >= 0 {
		d.nbr[3*nAC2+int32(d.edgeIndex(nAC2, t2))] = t1
	}
	if nBC1 >= 0 {
		d.nbr[3*nBC1+int32(d.edgeIndex(nBC1, t1))] = t2
	}
	d.vtri[c1], d.vtri[a], d.vtri[c2], d.vtri[b] = t1, t1, t2, t2
	return t1, t2
}

// convexQuad reports whether the quadrilateral formed by edge k of t and its
// twin is strictly convex, so that the edge can be flipped.
func (d *cdt) convexQuad(t int32, k int) bool {
	n := d.nbr[3*t+int32(k)]
	c1 := d.tri[3*t+int32(k)]
	a := d.tri[3*t+int32(next3[k])]
	b := d.tri[3*t+int32(next3[k+1])]
	c2 := d.tri[3*n+int32(d.edgeIndex(n, t))]
	return d.orient(c1, a, c2) == CCW && d.orient(c2, b, c1) == CCW
}

// edgeKey is an undirected vertex pair.
type edgeKey struct{ u, v int32 }

// insertSegment makes (a, b) an edge of the triangulation marked m. Vertices
// lying exactly on the segment split it. It returns a *SegmentsCrossError
// (with Segment set to seg) when a marked edge crosses it.
func (d *cdt) insertSegment(a, b, m int32, seg int) error {
	for a != b {
		if t, k := d.findEdge(a, b); t >= 0 {
			d.markPiece(t, k, m, seg)
			return nil
		}
		if t, k := d.findEdge(b, a); t >= 0 {
			d.markPiece(t, k, m, seg)
			return nil
		}
		crossed, stop, err := d.crossings(a, b, seg)
		if err != nil {
			return err
		}
		if stop != b {
			// A vertex lies on the segment: recover (a, stop) then go on.
			if err := d.insertSegment(a, stop, m, seg); err != nil {
				return err
			}
			a = stop
			continue
		}
		d.flipOut(a, b, crossed)
		t, k := d.findEdge(a, b)
		if t < 0 {
			panic("mesh: internal error: segment not recovered")
		}
		d.markPiece(t, k, m, seg)
		return nil
	}
	return nil
}

// markPiece marks a recovered segment edge and records it as a piece.
func (d *cdt) markPiece(t int32, k int, m int32, seg int) {
	a, b := d.tri[3*t+int32(next3[k])], d.tri[3*t+int32(next3[k+1])]
	if d.segOf == nil {
		d.segOf = make(map[edgeKey]int32)
	}
	if _, ok := d.segOf[ekey(a, b)]; !ok {
		d.segOf[ekey(a, b)] = int32(len(d.segEnds))
		d.segEnds = append(d.segEnds, [2]int32{a, b})
		d.pieceSeg = append(d.pieceSeg, int32(seg))
	}
	d.markEdge(t, k, m)
}

func (d *cdt) markEdge(t int32, k int, m int32) {
	if old := d.mark[3*t+int32(k)]; old != 0 {
		return // a repeated segment keeps its first marker
	}
	d.mark[3*t+int32(k)] = m
	if n := d.nbr[3*t+int32(k)]; n >= 0 {
		d.mark[3*n+int32(d.edgeIndex(n, t))] = m
	}
}

// crossings lists the edges crossing the open segment (a, b), walking from a.
// If a vertex lies exactly on the segment, the walk stops there and stop is
// that vertex; otherwise stop == b.
func (d *cdt) crossings(a, b int32, seg int) (crossed []edgeKey, stop int32, err error) {
	// Find the triangle around a whose corner wedge contains the direction to b.
	t := d.vtri[a]
	var l, r int32 // crossed edge, l left of a->b, r right
	for steps := 0; ; steps++ {
		if steps > len(d.tri) {
			panic("mesh: internal error: no wedge around vertex")
		}
		i := d.cornerOf(t, a)
		u, w := d.tri[3*t+int32(next3[i])], d.tri[3*t+int32(next3[i+1])]
		ou := d.orient(a, u, b)
		ow := d.orient(a, w, b)
		if ou == Collinear && d.sameDir(a, u, b) {
			return nil, u, nil
		}
		if ow == Collinear && d.sameDir(a, w, b) {
			return nil, w, nil
		}
		if ou == CCW && ow == CW {
			// b strictly inside the wedge: edge (u, w) is crossed.
			l, r = w, u
			break
		}
		// Rotate counter-clockwise (across edge (a, w)... i.e. edge opposite u).
		n := d.nbr[3*t+int32(next3[i])]
		if n < 0 {
			n = d.nbr[3*t+int32(next3[i+1])]
		}
		t = n
	}
	for {
		if k := d.edgeBetween(t, l, r); d.mark[3*t+int32(k)] != 0 {
			return nil, -1, d.crossError(a, b, l, r, seg)
		} else {
			crossed = append(crossed, edgeKey{l, r})
			t = d.nbr[3*t+int32(k)]
		}
		// Third vertex of t.
		z := d.tri[3*t] + d.tri[3*t+1] + d.tri[3*t+2] - l - r
		if z == b {
			return crossed, b, nil
		}
		switch d.orient(a, b, z) {
		case Collinear:
			return nil, z, nil
		case CCW:
			l = z
		default:
			r = z
		}
	}
}

// sameDir reports whether c, collinear with a and b, lies on the same side of
// a as b. It compares coordinates only, so it is exact.
func (d *cdt) sameDir(a, c, b int32) bool {
	if d.x[b] != d.x[a] {
		return (d.x[c] > d.x[a]) == (d.x[b] > d.x[a])
	}
	return (d.y[c] > d.y[a]) == (d.y[b] > d.y[a])
}

// edgeBetween returns the local edge of t joining vertices p and q.
func (d *cdt) edgeBetween(t, p, q int32) int {
	for k := 0; k < 3; k++ {
		c := d.tri[3*t+int32(k)]
		if c != p && c != q {
			return k
		}
	}
	panic("mesh: internal error: edge not in triangle")
}

func (d *cdt) crossError(a, b, l, r int32, seg int) error {
	other := -1
	if p, ok := d.segOf[ekey(l, r)]; ok {
		other = int(d.pieceSeg[p])
	}
	return &SegmentsCrossError{
		Segment: seg, Other: other,
		A: [2]float64{d.x[a], d.y[a]}, B: [2]float64{d.x[b], d.y[b]},
		C: [2]float64{d.x[l], d.y[l]}, D: [2]float64{d.x[r], d.y[r]},
	}
}

// flipOut flips the crossed edges away (Sloan 1993, steps 1-3) and restores
// the constrained Delaunay property on the new edges (step 4).
func (d *cdt) flipOut(a, b int32, crossed []edgeKey) {
	queue := crossed
	var fresh []edgeKey
	for guard := 0; len(queue) > 0; guard++ {
		if guard > 1<<26 {
			panic("mesh: internal error: segment recovery does not terminate")
		}
		e := queue[0]
		queue = queue[1:]
		t, k := d.findEdge(e.u, e.v)
		if t < 0 {
			t, k = d.findEdge(e.v, e.u)
		}
		if !d.convexQuad(t, k) {
			queue = append(queue, e)
			continue
		}
		t1, _ := d.flip(t, k)
		c1, c2 := d.tri[3*t1], d.tri[3*t1+2]
		o1, o2 := d.orient(a, b, c1), d.orient(a, b, c2)
		if o1 != Collinear && o2 != Collinear && o1 != o2 {
			queue = append(queue, edgeKey{c1, c2})
		} else {
			fresh = append(fresh, edgeKey{c1, c2})
		}
	}
	for swapped := true; swapped; {
		swapped = false
		for i, e := range fresh {
			if (e.u == a && e.v == b) || (e.u == b && e.v == a) {
				continue
			}
			t, k := d.findEdge(e.u, e.v)
			if t < 0 {
				continue
			}
			n := d.nbr[3*t+int32(k)]
			if n < 0 || d.mark[3*t+int32(k)] != 0 {
				continue
			}
			opp := d.tri[3*n+int32(d.edgeIndex(n, t))]
			if d.inCircleP(t, d.x[opp], d.y[opp]) > 0 {
				t1, _ := d.flip(t, k)
				fresh[i] = edgeKey{d.tri[3*t1], d.tri[3*t1+2]}
				swapped = true
			}
		}
	}
}
