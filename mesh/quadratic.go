package mesh

// Second-order (six-node) triangles.
//
// Elevate turns a first-order mesh into a second-order one by adding one node
// at the midpoint of every edge. The node of an interior edge is shared by the
// two triangles on either side, so a P2 field assembled on it is continuous.
// Edges are straight: arcs of the model were already replaced by chords when
// the graph was built (see DiscretizePolygon), so the midpoint of the chord is
// the right place for the node.
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
// X and Y after the corner nodes and fills m.Mid. NumVertices, Tri, Nbr,
// Region and EdgeMarker are unchanged. A mesh that is already second order is
// left as it is.
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
