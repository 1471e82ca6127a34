package mesh

import (
	"math"
	"slices"
)

// Point location.
//
// A Locator answers "which triangle holds (x, y)?" in about constant time.
// It lays a uniform grid over the bounding box of the mesh, with about as
// many cells as triangles, and lists in each cell every triangle whose
// bounding box overlaps it (a bucket grid; the total list length stays
// O(triangles) for graded meshes because a large triangle covers many cells
// only where cells are few per triangle). A query looks at the cell of the
// point:
//
//   - a short list (at most walkMin triangles) is tested directly;
//   - a long list, found where small triangles cluster (the gap of a
//     magnet, a pole corner), starts a walk at the triangle stored for the
//     cell and steps through Nbr towards the point, with the remembering
//     stochastic walk of O. Devillers, S. Pion, M. Teillaud, "Walking in a
//     triangulation", Int. J. Found. Comput. Sci. 13, 2002: it never crosses
//     back the edge it came through and tries the other two edges in a
//     pseudo-random order, which ends on any triangulation, Delaunay or
//     not. A walk that meets the boundary of the mesh (a hole, a notch of a
//     non-convex domain) or runs too long gives up and the cell's list is
//     tested in full.
//
// Because the lists are complete, a point outside every triangle is
// reported as such (ok = false) and never costs a scan of the mesh. All
// inside/outside decisions use the exact Orient2D, so a point on a shared
// edge is inside both triangles and Find returns one of them.
//
// Curved triangles (Mesh.Curved) are listed under the bounding box of their
// curved sides. A point whose corner triangle is curved, or that lies in no
// corner triangle, is located by inverting the quadratic maps (Reference)
// of that triangle, of its curved neighbours and of the curved triangles of
// its cell: a curved side bulges into the triangle on its concave side and
// out of the mesh on a convex outer boundary. Meshes without curved
// triangles take none of these steps.

// walkMin is the list length above which Find walks instead of scanning.
const walkMin = 12

// Locator finds the triangle of a mesh that contains a point. It holds a
// pointer to the mesh, which must not change while the Locator is in use.
// Find may be called from many goroutines at once.
type Locator struct {
	m              *Mesh
	x0, y0, x1, y1 float64 // bounding box of the corner nodes
	invH           float64 // 1 / cell size
	nx, ny         int
	start          []int32 // cell c lists items[start[c]:start[c+1]]
	items          []int32
	first          []int32 // per cell: triangle whose centroid is nearest the cell centre, or -1
}

// NewLocator builds the bucket grid for m in O(triangles) time and memory.
// m must be a valid mesh (counter-clockwise triangles; Nbr may be nil, in
// which case Find never walks).
func NewLocator(m *Mesh) *Locator {
	l := &Locator{m: m}
	nt := m.NumTriangles()
	if nt == 0 {
		return l
	}
	l.x0, l.y0 = math.Inf(1), math.Inf(1)
	l.x1, l.y1 = math.Inf(-1), math.Inf(-1)
	for _, v := range m.Tri {
		l.x0, l.x1 = math.Min(l.x0, m.X[v]), math.Max(l.x1, m.X[v])
		l.y0, l.y1 = math.Min(l.y0, m.Y[v]), math.Max(l.y1, m.Y[v])
	}
	for t := range m.Curved {
		if m.Curved[t] {
			bx0, by0, bx1, by1 := m.curvedBox(t)
			l.x0, l.x1 = math.Min(l.x0, bx0), math.Max(l.x1, bx1)
			l.y0, l.y1 = math.Min(l.y0, by0), math.Max(l.y1, by1)
		}
	}
	w, h := l.x1-l.x0, l.y1-l.y0
	size := math.Max(w, h)
	if w > 0 && h > 0 {
		size = math.Sqrt(w * h / float64(nt))
	} else if size > 0 {
		size /= float64(nt)
	}
	if !(size > 0) {
		size = 1 // all corners coincide: one cell
	}
	l.invH = 1 / size
	l.nx = min(int(w*l.invH)+1, 1<<15)
	l.ny = min(int(h*l.invH)+1, 1<<15)
	nc := l.nx * l.ny

	l.start = make([]int32, nc+1)
	box := func(t int) (i0, j0, i1, j1 int) {
		if m.IsCurved(t) {
			bx0, by0, bx1, by1 := m.curvedBox(t)
			return l.cellX(bx0), l.cellY(by0), l.cellX(bx1), l.cellY(by1)
		}
		a, b, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		i0, i1 = l.cellX(min(m.X[a], m.X[b], m.X[c])), l.cellX(max(m.X[a], m.X[b], m.X[c]))
		j0, j1 = l.cellY(min(m.Y[a], m.Y[b], m.Y[c])), l.cellY(max(m.Y[a], m.Y[b], m.Y[c]))
		return
	}
	for t := 0; t < nt; t++ {
		i0, j0, i1, j1 := box(t)
		for j := j0; j <= j1; j++ {
			for i := i0; i <= i1; i++ {
				l.start[j*l.nx+i+1]++
			}
		}
	}
	for c := 0; c < nc; c++ {
		l.start[c+1] += l.start[c]
	}
	l.items = make([]int32, l.start[nc])
	fill := make([]int32, nc)
	copy(fill, l.start[:nc])
	for t := 0; t < nt; t++ {
		i0, j0, i1, j1 := box(t)
		for j := j0; j <= j1; j++ {
			for i := i0; i <= i1; i++ {
				c := j*l.nx + i
				l.items[fill[c]] = int32(t)
				fill[c]++
			}
		}
	}
	// Walk starts, only for cells that will walk.
	l.first = make([]int32, nc)
	for c := 0; c < nc; c++ {
		l.first[c] = -1
		list := l.items[l.start[c]:l.start[c+1]]
		if len(list) <= walkMin {
			continue
		}
		cx := l.x0 + (float64(c%l.nx)+0.5)*size
		cy := l.y0 + (float64(c/l.nx)+0.5)*size
		best := math.Inf(1)
		for _, t := range list {
			a, b, v := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
			dx := (m.X[a]+m.X[b]+m.X[v])/3 - cx
			dy := (m.Y[a]+m.Y[b]+m.Y[v])/3 - cy
			if d := dx*dx + dy*dy; d < best {
				best, l.first[c] = d, t
			}
		}
	}
	return l
}

// Mesh returns the mesh the locator was built on.
func (l *Locator) Mesh() *Mesh { return l.m }

func (l *Locator) cellX(x float64) int {
	return min(max(int((x-l.x0)*l.invH), 0), l.nx-1)
}

func (l *Locator) cellY(y float64) int {
	return min(max(int((y-l.y0)*l.invH), 0), l.ny-1)
}

// Find returns the triangle t that contains (x, y) and the barycentric
// coordinates of the point in it (b0 + b1 + b2 = 1, bk >= 0 up to
// rounding, bk the weight of corner k). For a curved triangle they are the
// barycentric coordinates of the point's preimage in the reference
// triangle: b1 = ξ, b2 = η of Reference. A point on an edge or corner
// shared by several triangles gets any one of them. For a point outside
// the mesh (or NaN), Find returns t = -1 and ok = false.
func (l *Locator) Find(x, y float64) (t int32, b0, b1, b2 float64, ok bool) {
	if !(x >= l.x0 && x <= l.x1 && y >= l.y0 && y <= l.y1) || len(l.items) == 0 {
		return -1, 0, 0, 0, false
	}
	c := l.cellY(y)*l.nx + l.cellX(x)
	list := l.items[l.start[c]:l.start[c+1]]
	t = -1
	if s := l.first[c]; s >= 0 && l.m.Nbr != nil {
		if w, ok := l.walk(s, x, y, 2*len(list)+32); ok {
			t = w
		}
	}
	if t < 0 {
		for _, u := range list {
			if l.inside(u, x, y) {
				t = u
				break
			}
		}
	}
	if l.m.Curved != nil {
		return l.findCurved(t, list, x, y)
	}
	if t < 0 {
		return -1, 0, 0, 0, false
	}
	b0, b1, b2 = l.bary(t, x, y)
	return t, b0, b1, b2, true
}

// refTol is how far outside the reference triangle (in reference
// coordinates) a point may be found and still count as inside a curved
// triangle: rounding of Newton's inversion, for points on a curved side.
const refTol = 1e-12

// findCurved finishes Find on a mesh with curved triangles, given the
// corner triangle t that holds (x, y) (-1 for none) and the cell's list.
func (l *Locator) findCurved(t int32, list []int32, x, y float64) (int32, float64, float64, float64, bool) {
	m := l.m
	try := func(u int32) (float64, float64, bool) {
		if u < 0 || !m.Curved[u] {
			return 0, 0, false
		}
		xi, eta, ok := m.Reference(int(u), x, y)
		return xi, eta, ok && xi >= -refTol && eta >= -refTol && 1-xi-eta >= -refTol
	}
	if t >= 0 && !m.Curved[t] {
		b0, b1, b2 := l.bary(t, x, y)
		return t, b0, b1, b2, true
	}
	if t >= 0 {
		if xi, eta, ok := try(t); ok {
			return t, 1 - xi - eta, xi, eta, true
		}
		// The point is in the bulge of a neighbour's curved side.
		for k := 0; k < 3 && m.Nbr != nil; k++ {
			if u := m.Nbr[3*t+int32(k)]; u >= 0 {
				if xi, eta, ok := try(u); ok {
					return u, 1 - xi - eta, xi, eta, true
				}
			}
		}
	}
	for _, u := range list {
		if u == t {
			continue
		}
		if xi, eta, ok := try(u); ok {
			return u, 1 - xi - eta, xi, eta, true
		}
	}
	if t >= 0 {
		// Only rounding can get here (a point on a curved side that
		// both inversions place a hair outside): keep the corner
		// triangle.
		xi, eta, _ := m.Reference(int(t), x, y)
		return t, 1 - xi - eta, xi, eta, true
	}
	return -1, 0, 0, 0, false
}

// Bounds returns the bounding box of the mesh's corner nodes (m).
func (l *Locator) Bounds() (x0, y0, x1, y1 float64) { return l.x0, l.y0, l.x1, l.y1 }

// TouchingTo appends to dst the triangles whose closure lies within
// distance d (d >= 0) of (x, y): the triangle Find returns, then across
// every edge within d of the point (NearSegment, exact) its neighbour,
// and so on. A point inside a triangle gets that triangle; on an edge
// shared by two triangles, both; at a vertex, its whole fan. Nothing is
// appended for a point outside the mesh. The order is that of the
// search, from the triangle Find returns.
func (l *Locator) TouchingTo(dst []int32, x, y, d float64) []int32 {
	t, _, _, _, ok := l.Find(x, y)
	if !ok {
		return dst
	}
	m := l.m
	n0 := len(dst)
	dst = append(dst, t)
	for i := n0; i < len(dst); i++ {
		t := dst[i]
		for k := int32(0); k < 3; k++ {
			u := int32(-1)
			if m.Nbr != nil {
				u = m.Nbr[3*t+k]
			}
			if u < 0 || slices.Contains(dst[n0:], u) {
				continue
			}
			a, b := m.Tri[3*t+(k+1)%3], m.Tri[3*t+(k+2)%3]
			if NearSegment(x, y, m.X[a], m.Y[a], m.X[b], m.Y[b], d) {
				dst = append(dst, u)
			}
		}
	}
	return dst
}

// inside reports whether (x, y) lies in triangle t or on its boundary.
func (l *Locator) inside(t int32, x, y float64) bool {
	m := l.m
	a, b, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
	return Orient2D(m.X[b], m.Y[b], m.X[c], m.Y[c], x, y) != CW &&
		Orient2D(m.X[c], m.Y[c], m.X[a], m.Y[a], x, y) != CW &&
		Orient2D(m.X[a], m.Y[a], m.X[b], m.Y[b], x, y) != CW &&
		Orient2D(m.X[a], m.Y[a], m.X[b], m.Y[b], m.X[c], m.Y[c]) == CCW
}

// walk steps from triangle t towards (x, y) for at most maxSteps triangles.
// It reports false when it reaches the mesh boundary or the step limit.
func (l *Locator) walk(t int32, x, y float64, maxSteps int) (int32, bool) {
	m := l.m
	from := int32(-1)
	// A small xorshift generator seeded from the query, local to the
	// call, so concurrent Finds share no state.
	rnd := math.Float64bits(x)*0x9e3779b97f4a7c15 ^ math.Float64bits(y) | 1
	for step := 0; step < maxSteps; step++ {
		rnd ^= rnd << 13
		rnd ^= rnd >> 7
		rnd ^= rnd << 17
		k0 := int(rnd % 3)
		moved := false
		for i := 0; i < 3; i++ {
			k := (k0 + i) % 3
			u := m.Nbr[3*t+int32(k)]
			if u == from && u >= 0 {
				continue
			}
			a, b := m.Tri[3*t+int32((k+1)%3)], m.Tri[3*t+int32((k+2)%3)]
			if Orient2D(m.X[a], m.Y[a], m.X[b], m.Y[b], x, y) == CW {
				if u < 0 {
					return -1, false
				}
				from, t, moved = t, u, true
				break
			}
		}
		if !moved {
			// No edge separates the point from t, except possibly the
			// one we came through, which the point is inside of by
			// construction of the previous step.
			return t, true
		}
	}
	return -1, false
}

// bary returns the barycentric coordinates of (x, y) in triangle t.
func (l *Locator) bary(t int32, x, y float64) (b0, b1, b2 float64) {
	m := l.m
	a, b, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
	ax, ay, bx, by, cx, cy := m.X[a], m.Y[a], m.X[b], m.Y[b], m.X[c], m.Y[c]
	area := triArea(ax, ay, bx, by, cx, cy)
	b0 = triArea(x, y, bx, by, cx, cy) / area
	b1 = triArea(ax, ay, x, y, cx, cy) / area
	b2 = 1 - b0 - b1
	return b0, b1, b2
}
