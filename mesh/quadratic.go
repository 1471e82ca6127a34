package mesh

// Second-order (six-node) triangles.
//
// Elevate turns a first-order mesh into a second-order one by adding one node
// on every edge. The node of an interior edge is shared by the two triangles
// on either side, so a P2 field assembled on it is continuous. A straight
// edge gets its node at its midpoint. An edge that is the chord of an arc
// (Mesh.EdgeArc) gets it on the arc, halfway round (the radial projection of
// the midpoint), which makes the triangles on both sides curved
// (Mesh.Curved; see curved.go), unless that would fold one of them (the
// Jacobian test in curved.go), in which case the edge stays straight.
//
// Numbering (see the diagram on Mesh): Mid[3t+k] is the node of edge k, the
// edge opposite corner k:
//
//	      v2
//	      /\
//	 m1  /  \  m0         m0 = mid(v1,v2) = Mid[3t+0]
//	    /    \            m1 = mid(v2,v0) = Mid[3t+1]
//	  v0------v1          m2 = mid(v0,v1) = Mid[3t+2]
//	      m2
//
// Midside nodes are numbered from NumVertices upwards in the order in which
// their edges are first met (triangle by triangle, edge 0 to 2), so the result
// is deterministic.

// Elevate adds midside nodes to m in place: it appends their coordinates to
// X and Y after the corner nodes and fills m.Mid, and m.Curved when an edge
// on an arc was curved. NumVertices, Tri, Nbr, Region, EdgeMarker, Arcs and
// EdgeArc are unchanged. A mesh that is already second order is left as it
// is.
//
// Interior edges are found through Nbr; when Nbr is nil they are matched by
// their corner pair. Elevate panics if len(X) != NumVertices on a first-order
// mesh, or if Nbr is present but not symmetric (a programming error that
// Check reports).
func Elevate(m *Mesh) {
	if m.Mid != nil {
		return
	}
	if len(m.X) != m.NumVertices || len(m.Y) != m.NumVertices {
		panic("mesh: Elevate: first-order mesh with len(X), len(Y) != NumVertices")
	}
	nt := m.NumTriangles()
	mid := make([]int32, 3*nt)
	for i := range mid {
		mid[i] = -1
	}
	// An edge count E = (3T + B)/2 for B boundary edges; reserve 2T, enough
	// for every mesh with at least as many interior as boundary edges.
	nv := m.NumVertices
	x := append(make([]float64, 0, nv+2*nt), m.X...)
	y := append(make([]float64, 0, nv+2*nt), m.Y...)

	var byPair map[[2]int32]int32
	if m.Nbr == nil {
		byPair = make(map[[2]int32]int32, 2*nt)
	}
	for t := 0; t < nt; t++ {
		for k := 0; k < 3; k++ {
			if mid[3*t+k] >= 0 {
				continue
			}
			a := m.Tri[3*t+(k+1)%3]
			b := m.Tri[3*t+(k+2)%3]
			if byPair != nil {
				key := [2]int32{min(a, b), max(a, b)}
				if n, ok := byPair[key]; ok {
					mid[3*t+k] = n
					continue
				}
			}
			n := int32(len(x))
			x = append(x, 0.5*(m.X[a]+m.X[b]))
			y = append(y, 0.5*(m.Y[a]+m.Y[b]))
			mid[3*t+k] = n
			if byPair != nil {
				byPair[[2]int32{min(a, b), max(a, b)}] = n
				continue
			}
			if u := m.Nbr[3*t+k]; u >= 0 {
				j := twinEdge(m, u, a, b)
				if j < 0 {
					panic("mesh: Elevate: neighbour does not share the edge (asymmetric Nbr)")
				}
				mid[3*int(u)+j] = n
			}
		}
	}
	m.X, m.Y, m.Mid = x, y, mid
	if m.EdgeArc != nil {
		m.curve()
	}
}

// curve moves the midside node of every edge on an arc onto the arc, then
// straightens again the arc edges of any triangle whose map the move folds
// (curvedValid), and fills m.Curved.
func (m *Mesh) curve() {
	nt := m.NumTriangles()
	nv := m.NumVertices
	onArc := make([]bool, len(m.X)-nv) // per midside node
	curved := make([]bool, nt)
	anyCurved := false
	for t := 0; t < nt; t++ {
		for k := 0; k < 3; k++ {
			ai := m.EdgeArc[3*t+k]
			if ai < 0 || int(ai) >= len(m.Arcs) {
				continue
			}
			n := m.Mid[3*t+k]
			if !onArc[int(n)-nv] {
				arc := m.Arcs[ai]
				a, b := m.Tri[3*t+(k+1)%3], m.Tri[3*t+(k+2)%3]
				if !arc.holds(m.X[a], m.Y[a]) || !arc.holds(m.X[b], m.Y[b]) {
					continue
				}
				px, py, ok := arc.project(m.X[n], m.Y[n])
				if !ok {
					continue
				}
				m.X[n], m.Y[n] = px, py
				onArc[int(n)-nv] = true
			}
			curved[t], anyCurved = true, true
		}
	}
	if !anyCurved {
		return
	}
	m.Curved = curved
	// Straighten folded triangles; straightening an edge changes the
	// triangle on its other side too, so repeat until nothing folds.
	for changed := true; changed; {
		changed = false
		for t := 0; t < nt; t++ {
			if !curved[t] || m.curvedValid(t) {
				continue
			}
			for k := 0; k < 3; k++ {
				n := m.Mid[3*t+k]
				if !onArc[int(n)-nv] {
					continue
				}
				a, b := m.Tri[3*t+(k+1)%3], m.Tri[3*t+(k+2)%3]
				m.X[n], m.Y[n] = 0.5*(m.X[a]+m.X[b]), 0.5*(m.Y[a]+m.Y[b])
				onArc[int(n)-nv] = false
				changed = true
			}
		}
		if changed {
			for t := 0; t < nt; t++ {
				curved[t] = false
				for k := 0; k < 3; k++ {
					if onArc[int(m.Mid[3*t+k])-nv] {
						curved[t] = true
					}
				}
			}
		}
	}
	for _, c := range curved {
		if c {
			return
		}
	}
	m.Curved = nil
}

// twinEdge returns the local index in triangle u of the edge with corners a
// and b (either direction), or -1.
func twinEdge(m *Mesh, u, a, b int32) int {
	for j := 0; j < 3; j++ {
		p := m.Tri[3*u+int32((j+1)%3)]
		q := m.Tri[3*u+int32((j+2)%3)]
		if (p == a && q == b) || (p == b && q == a) {
			return j
		}
	}
	return -1
}
