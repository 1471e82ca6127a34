package mesh

// The working triangulation: struct-of-arrays triangles with neighbour links
// and per-edge segment markers, and incremental vertex insertion by cavity
// retriangulation (A. Bowyer, "Computing Dirichlet tessellations", and
// D. F. Watson, "Computing the n-dimensional Delaunay tessellation...", both
// The Computer Journal 24(2), 1981), restricted to constrained Delaunay
// cavities: the cavity never crosses a segment, except the one a new vertex
// splits.
//
// Local numbering (as Mesh): edge k of triangle t joins corners k+1 and k+2
// and faces corner k; nbr[3t+k] is the triangle across edge k.

// Point-location outcomes.
const (
	locInside  = iota // strictly inside triangle t
	locEdge           // on edge k of t (between its end points)
	locVertex         // equal to corner k of t
	locOutside        // outside the triangulated domain (t, k is the boundary edge)
	locBlocked        // a segment lies between start and target (t, k is that edge)
)

var next3 = [5]int{1, 2, 0, 1, 2}

type cdt struct {
	x, y []float64
	tri  []int32 // 3 corners per triangle; tri[3t] == -1 marks a free slot
	nbr  []int32 // 3 neighbours per triangle
	mark []int32 // 3 edge markers per triangle (0: not on a segment)
	reg  []int32 // region per triangle
	vtri []int32 // one triangle incident to each vertex
	free []int32 // free triangle slots

	// insertion scratch
	stamp   []uint32 // per triangle: == epoch when in the current cavity
	epoch   uint32
	cavity  []int32
	bnd     []bndEdge
	link    []int32 // per vertex: new triangle whose edge 2 starts there, or -1
	created []int32 // triangles made by the last insertion
	seed    uint32  // walk randomisation

	// Recovered segment pieces (an input segment split at the input
	// vertices lying on it gives one piece per part): end points, and the
	// piece of each piece's edge.
	segEnds  [][2]int32
	segOf    map[edgeKey]int32
	pieceSeg []int32 // input segment of each piece (-1 for hull edges)
	// perm[p] is the input vertex stored as internal vertex p (p < number
	// of input vertices, Hilbert order); inv is its inverse.
	perm, inv []int32
	// pinch holds the vertices where the domain touches itself (more than
	// one fan of triangles), found after the exterior is removed.
	pinch map[int32]bool
}

// bndEdge is an edge (a, b) of the cavity boundary, seen CCW from the new
// vertex, with the triangle outside it and the data to carry over.
type bndEdge struct {
	a, b   int32
	out    int32 // triangle outside, or -1
	mark   int32
	region int32
}

// reserve grows the capacities for about nt triangles and nv vertices so
// that insertion does not copy the arrays repeatedly.
func (d *cdt) reserve(nt, nv int) {
	if extra := 3*nt - cap(d.tri); extra > 0 {
		d.tri = append(make([]int32, 0, 3*nt), d.tri...)
		d.nbr = append(make([]int32, 0, 3*nt), d.nbr...)
		d.mark = append(make([]int32, 0, 3*nt), d.mark...)
		d.reg = append(make([]int32, 0, nt), d.reg...)
		d.stamp = append(make([]uint32, 0, nt), d.stamp...)
	}
	if nv > cap(d.x) {
		d.x = append(make([]float64, 0, nv), d.x...)
		d.y = append(make([]float64, 0, nv), d.y...)
		d.vtri = append(make([]int32, 0, nv), d.vtri...)
		d.link = append(make([]int32, 0, nv), d.link...)
	}
}

func (d *cdt) numTri() int { return len(d.tri)/3 - len(d.free) }

func (d *cdt) addVertex(x, y float64) int32 {
	d.x = append(d.x, x)
	d.y = append(d.y, y)
	d.vtri = append(d.vtri, -1)
	d.link = append(d.link, -1)
	return int32(len(d.x) - 1)
}

func (d *cdt) newTri(a, b, c int32) int32 {
	var t int32
	if n := len(d.free); n > 0 {
		t = d.free[n-1]
		d.free = d.free[:n-1]
		d.tri[3*t], d.tri[3*t+1], d.tri[3*t+2] = a, b, c
	} else {
		t = int32(len(d.tri) / 3)
		d.tri = append(d.tri, a, b, c)
		d.nbr = append(d.nbr, -1, -1, -1)
		d.mark = append(d.mark, 0, 0, 0)
		d.reg = append(d.reg, 0)
		d.stamp = append(d.stamp, 0)
	}
	d.vtri[a], d.vtri[b], d.vtri[c] = t, t, t
	return t
}

func (d *cdt) killTri(t int32) {
	d.tri[3*t] = -1
	d.free = append(d.free, t)
}

func (d *cdt) alive(t int32) bool { return d.tri[3*t] >= 0 }

// orient returns the orientation of vertices (a, b, c).
func (d *cdt) orient(a, b, c int32) Orientation {
	return Orient2D(d.x[a], d.y[a], d.x[b], d.y[b], d.x[c], d.y[c])
}

// orientP returns the orientation of (a, b, p) for a point p.
func (d *cdt) orientP(a, b int32, px, py float64) Orientation {
	return Orient2D(d.x[a], d.y[a], d.x[b], d.y[b], px, py)
}

// inCircleP reports the InCircle sign of point p against triangle t.
func (d *cdt) inCircleP(t int32, px, py float64) int {
	a, b, c := d.tri[3*t], d.tri[3*t+1], d.tri[3*t+2]
	return InCircle(d.x[a], d.y[a], d.x[b], d.y[b], d.x[c], d.y[c], px, py)
}

// edgeIndex returns k such that nbr[3t+k] == n, or -1.
func (d *cdt) edgeIndex(t, n int32) int {
	switch n {
	case d.nbr[3*t]:
		return 0
	case d.nbr[3*t+1]:
		return 1
	case d.nbr[3*t+2]:
		return 2
	}
	return -1
}

// rnd is a tiny xorshift generator for walk randomisation.
func (d *cdt) rnd() uint32 {
	s := d.seed
	s ^= s << 13
	s ^= s >> 17
	s ^= s << 5
	d.seed = s
	return s
}

// locate finds the triangle containing (px, py) by a visibility walk from t
// (Devillers, Pion, Teillaud, "Walking in a triangulation", IJFCS 13, 2002),
// with a random first edge so it cannot cycle. Segments do not stop it.
func (d *cdt) locate(t int32, px, py float64) (int32, int, int) {
	prev := int32(-1)
	for {
		r := int(d.rnd() % 3)
		moved := false
		var zero [3]bool
		nz := 0
		for i := 0; i < 3; i++ {
			k := (r + i) % 3
			n := d.nbr[3*t+int32(k)]
			a, b := d.tri[3*t+int32(next3[k])], d.tri[3*t+int32(next3[k+1])]
			o := d.orientP(a, b, px, py)
			if o == CW {
				if n == prev && n >= 0 {
					continue // we came from there; another edge must work
				}
				if n < 0 {
					return t, k, locOutside
				}
				prev, t = t, n
				moved = true
				break
			}
			if o == Collinear {
				zero[k] = true
				nz++
			}
		}
		if moved {
			continue
		}
		if prev >= 0 {
			// The edge back to prev was skipped; confirm it.
			k := d.edgeIndex(t, prev)
			if k >= 0 {
				a, b := d.tri[3*t+int32(next3[k])], d.tri[3*t+int32(next3[k+1])]
				if d.orientP(a, b, px, py) == CW {
					prev, t = t, prev
					continue
				}
			}
		}
		switch nz {
		case 0:
			return t, 0, locInside
		case 1:
			for k := 0; k < 3; k++ {
				if zero[k] {
					return t, k, locEdge
				}
			}
		default:
			for k := 0; k < 3; k++ {
				if !zero[k] {
					return t, k, locVertex
				}
			}
		}
		return t, 0, locVertex
	}
}

// walkTo walks along the straight line from the centroid of t to (px, py),
// stopping at segments (locBlocked) and the domain boundary (locOutside).
func (d *cdt) walkTo(t int32, px, py float64) (int32, int, int) {
	a, b, c := d.tri[3*t], d.tri[3*t+1], d.tri[3*t+2]
	gx := (d.x[a] + d.x[b] + d.x[c]) / 3
	gy := (d.y[a] + d.y[b] + d.y[c]) / 3
	for steps := 0; steps < 1<<22; steps++ {
		var o [3]Orientation
		nOut := 0
		exit := -1
		for k := 0; k < 3; k++ {
			u, v := d.tri[3*t+int32(next3[k])], d.tri[3*t+int32(next3[k+1])]
			o[k] = d.orientP(u, v, px, py)
			if o[k] == CW {
				nOut++
				exit = k
			}
		}
		if nOut == 0 {
			nz := 0
			for k := 0; k < 3; k++ {
				if o[k] == Collinear {
					nz++
				}
			}
			switch nz {
			case 0:
				return t, 0, locInside
			case 1:
				for k := 0; k < 3; k++ {
					if o[k] == Collinear {
						return t, k, locEdge
					}
				}
			}
			for k := 0; k < 3; k++ {
				if o[k] != Collinear {
					return t, k, locVertex
				}
			}
		}
		if nOut == 2 {
			// Target beyond corner w shared by both outward edges: the
			// line g->p passes left or right of w.
			var w int
			for k := 0; k < 3; k++ {
				if o[k] != CW {
					w = k
				}
			}
			wv := d.tri[3*t+int32(w)]
			ow := Orient2D(gx, gy, px, py, d.x[wv], d.y[wv])
			// edge (w+1) joins corners w+2 and w; edge (w+2) joins w and w+1.
			// Ray crosses edge (u, v) iff u is right of the ray and v left.
			if ow == CCW {
				exit = next3[w]
			} else {
				exit = next3[w+1]
			}
		}
		n := d.nbr[3*t+int32(exit)]
		if n < 0 {
			return t, exit, locOutside
		}
		if d.mark[3*t+int32(exit)] != 0 {
			return t, exit, locBlocked
		}
		t = n
	}
	return t, 0, locOutside
}
