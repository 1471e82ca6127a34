package mesh

// Mesh is a triangulation in struct-of-arrays form. All lengths are metres.
//
// Local numbering of triangle t (corners counter-clockwise):
//
//	      v2
//	      /\
//	e1   /  \   e0        edge k is opposite corner k:
//	    /    \            e0 = (v1,v2), e1 = (v2,v0), e2 = (v0,v1)
//	  v0------v1          Nbr[3t+k] is the triangle across edge k, -1 on the boundary
//	      e2              Mid[3t+k] is the midside node of edge k (second order)
type Mesh struct {
	// X, Y are node coordinates. Nodes [0, NumVertices) are triangle corners;
	// second-order midside nodes, when present, follow them.
	X, Y        []float64
	NumVertices int

	// Tri holds 3 corner indices per triangle, counter-clockwise.
	Tri []int32
	// Nbr holds 3 neighbour triangles per triangle: Nbr[3t+k] is across edge k, or -1.
	Nbr []int32
	// Region is the region tag of each triangle (the Region of the seed or
	// polygon that claimed it; see Input).
	Region []int32
	// EdgeMarker holds 3 markers per triangle: EdgeMarker[3t+k] is the marker of
	// the input segment that edge k lies on, or 0 if edge k is not on a segment.
	EdgeMarker []int32
	// Mid holds 3 midside node indices per triangle for second-order meshes
	// (Mid[3t+k] is the node of edge k: at its midpoint, or on its arc when
	// the edge is the chord of an arc); nil for first order.
	Mid []int32

	// Arcs are the circles that curved input segments lie on (Input.Arcs).
	Arcs []Arc
	// EdgeArc holds 3 entries per triangle: EdgeArc[3t+k] is the index in
	// Arcs of the arc whose chord edge k is, or -1 for a straight edge.
	// nil when no edge lies on an arc.
	EdgeArc []int32
	// Curved, on a second-order mesh, marks the triangles that Elevate gave
	// a midside node on an arc (off the chord's midpoint). Such a triangle
	// is the image of the reference triangle under the quadratic map of its
	// six nodes (an isoparametric element, see curved.go); every other
	// triangle is the affine image of its corners. nil when no triangle is
	// curved.
	Curved []bool
}

// NumTriangles returns the number of triangles.
func (m *Mesh) NumTriangles() int { return len(m.Tri) / 3 }

// NumNodes returns the number of nodes, corners and midside nodes together.
func (m *Mesh) NumNodes() int { return len(m.X) }

// Order returns 2 when the mesh carries midside nodes and 1 otherwise.
func (m *Mesh) Order() int {
	if m.Mid != nil {
		return 2
	}
	return 1
}
