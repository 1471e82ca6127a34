package mesh

import (
	"fmt"
	"math"
	"sort"
)

// KelvinExterior is the result of AddKelvinDisk or AddKelvinHalfDisk: the
// combined mesh and the couplings the solver needs.
type KelvinExterior struct {
	// Mesh holds the original triangles followed by those of the disk.
	Mesh *Mesh
	// Pairs join each node on the original circular boundary to the node
	// at the same angle on the disk's rim (and, after ElevateKelvin, the
	// matching midside nodes); the two share one unknown.
	Pairs [][2]int32
	// Infinity is the disk-centre node, the image of the point at infinity.
	Infinity int32
	// Centre and Radius describe the disk (metres).
	CX, CY, Radius float64
	// Half marks the half disc of an axisymmetric model
	// (AddKelvinHalfDisk): its rim is an arc from the axis to the axis,
	// not a closed circle.
	Half bool
}

// AddKelvinDisk appends the exterior disk of the Kelvin transformation to a
// first-order mesh whose outer boundary (edges with the given marker) is a
// polygon inscribed in the circle of radius r about (cx, cy).
//
// The region outside a circle of radius R maps onto a disk of the same
// radius by inversion, x' = R² x/|x|², which keeps angles; in two
// dimensions the Laplace equation for the vector potential is unchanged
// by the map, so the exterior air becomes an ordinary air disk whose rim
// is joined node for node to the original boundary and whose centre is
// the point at infinity (E. M. Freeman and D. A. Lowther, "A novel
// mapping technique for open boundary finite element solutions to Poisson's
// equation", IEEE Trans. Magn. 24(6), 1988, and "An open boundary technique
// for axisymmetric and three dimensional magnetic and electric field
// problems", IEEE Trans. Magn. 25(5), 1989).
//
// The disk is meshed beside the model (its centre 2.5 r to the right of
// (cx, cy)) with the same rim vertices (the rim is frozen) and quality
// refinement; its triangles carry region tag region and its rim edges the
// same marker, which the solver must treat as a natural (flux-normal)
// edge since the pair coupling replaces it. The original mesh is not
// modified.
func AddKelvinDisk(m *Mesh, marker int32, cx, cy, r float64, region int32) (*KelvinExterior, error) {
	rim, err := kelvinRim(m, marker, cx, cy, r, false)
	if err != nil {
		return nil, err
	}
	// The disk's input: rim vertices at the same angles, plus its centre.
	dx := 2.5 * r
	n := len(rim)
	in := &Input{DefaultRegion: region}
	for _, v := range rim {
		in.X = append(in.X, m.X[v]+dx)
		in.Y = append(in.Y, m.Y[v])
	}
	in.X = append(in.X, cx+dx)
	in.Y = append(in.Y, cy)
	for i := 0; i < n; i++ {
		in.Segments = append(in.Segments, int32(i), int32((i+1)%n))
		in.Markers = append(in.Markers, marker)
	}
	if m.EdgeArc != nil {
		// The model's circle is curved: so is the disk's rim, so that
		// paired midside nodes sit at the same angle on both.
		in.Arcs = []Arc{{X: cx + dx, Y: cy, R: r}}
		in.SegmentArc = make([]int32, n)
	}
	out := &KelvinExterior{CX: cx + dx, CY: cy, Radius: r}
	return out, out.join(m, rim, in, marker)
}

// AddKelvinHalfDisk is AddKelvinDisk for an axisymmetric model, meshed in
// the half-plane r = x >= 0 with z = y: the first-order mesh m fills a half
// disc of radius r about the point (0, cz) of the axis, whose arc carries
// marker and whose straight side lies on the axis x = 0.
//
// Inversion in the sphere of radius r about (0, cz) maps the space outside
// it onto the inside, and the meridian half-plane onto itself (the axis
// stays the axis). The image is an air half disc of the same radius meshed
// on the axis 2.5 r above (its centre, the point at infinity, at
// (0, cz + 2.5 r)), with the same rim vertices (frozen) and quality
// refinement; its arc carries marker and its straight side axisMarker.
// Unlike the planar disk the axisymmetric energy is not invariant under
// the map: the solver must scale the image's reluctivity by ρ'²/r²
// (solver.Problem.Exterior; Freeman and Lowther 1989, cited at
// AddKelvinDisk, treat the axisymmetric case). Pairs join the nodes of the
// two arcs from the bottom of the axis (angle −π/2) to its top (+π/2);
// both ends lie on the axis. The original mesh is not modified.
func AddKelvinHalfDisk(m *Mesh, marker, axisMarker int32, cz, r float64, region int32) (*KelvinExterior, error) {
	rim, err := kelvinRim(m, marker, 0, cz, r, true)
	if err != nil {
		return nil, err
	}
	dz := 2.5 * r
	n := len(rim)
	in := &Input{DefaultRegion: region}
	for _, v := range rim {
		in.X = append(in.X, m.X[v])
		in.Y = append(in.Y, m.Y[v]+dz)
	}
	in.X = append(in.X, 0)
	in.Y = append(in.Y, cz+dz)
	for i := 0; i+1 < n; i++ {
		in.Segments = append(in.Segments, int32(i), int32(i+1))
		in.Markers = append(in.Markers, marker)
	}
	// The straight side: top of the arc, centre, bottom of the arc.
	in.Segments = append(in.Segments, int32(n-1), int32(n), int32(n), 0)
	in.Markers = append(in.Markers, axisMarker, axisMarker)
	if m.EdgeArc != nil {
		// The model's half circle is curved: so is the image's arc, so
		// that paired midside nodes sit at the same angle on both; the
		// straight side on the axis stays straight.
		in.Arcs = []Arc{{X: 0, Y: cz + dz, R: r}}
		in.SegmentArc = make([]int32, n+1)
		in.SegmentArc[n-1], in.SegmentArc[n] = -1, -1
	}
	out := &KelvinExterior{CX: 0, CY: cz + dz, Radius: r, Half: true}
	return out, out.join(m, rim, in, marker)
}

// kelvinRim returns the nodes of m on the boundary edges with the given
// marker, sorted by angle about (cx, cy), and checks that they lie on the
// circle of radius r (half: on the half circle x >= 0 whose ends lie on the
// axis x = 0).
func kelvinRim(m *Mesh, marker int32, cx, cy, r float64, half bool) ([]int32, error) {
	if m.Mid != nil {
		panic("mesh: AddKelvinDisk needs a first-order mesh; elevate afterwards with ElevateKelvin")
	}
	onRim := map[int32]bool{}
	for t := 0; t < m.NumTriangles(); t++ {
		for k := 0; k < 3; k++ {
			if m.Nbr[3*t+k] == -1 && m.EdgeMarker[3*t+k] == marker {
				onRim[m.Tri[3*t+(k+1)%3]] = true
				onRim[m.Tri[3*t+(k+2)%3]] = true
			}
		}
	}
	shape := "a closed circle"
	if half {
		shape = "a half circle on the axis"
	}
	if len(onRim) < 3 {
		return nil, fmt.Errorf("mesh: Kelvin disk: the boundary with marker %d has %d nodes, need %s", marker, len(onRim), shape)
	}
	rim := make([]int32, 0, len(onRim))
	for v := range onRim {
		rim = append(rim, v)
	}
	ang := func(v int32) float64 { return math.Atan2(m.Y[v]-cy, m.X[v]-cx) }
	sort.Slice(rim, func(i, j int) bool { return ang(rim[i]) < ang(rim[j]) })
	for _, v := range rim {
		// Refinement splits rim chords at their midpoints, so nodes lie on
		// the circle or on its chords: allow the sagitta of a 30° chord.
		if d := math.Hypot(m.X[v]-cx, m.Y[v]-cy); math.Abs(d-r) > 0.035*r {
			return nil, fmt.Errorf("mesh: Kelvin disk: boundary node %d lies %g m from the centre, not on the circle of radius %g m", v, d, r)
		}
		if half && m.X[v] < 0 {
			return nil, fmt.Errorf("mesh: Kelvin disk: boundary node %d lies at x = %g m < 0, off the half plane of an axisymmetric model", v, m.X[v])
		}
	}
	if half {
		lo, hi := rim[0], rim[len(rim)-1]
		if m.X[lo] != 0 || m.X[hi] != 0 || !(m.Y[lo] < cy) || !(m.Y[hi] > cy) {
			return nil, fmt.Errorf("mesh: Kelvin disk: the boundary with marker %d does not end on the axis x = 0 below and above the centre; need %s", marker, shape)
		}
	}
	return rim, nil
}

// join meshes the image input in (rim vertices first, in the order of rim,
// then the image centre; rim segments carry marker, which stays frozen) and
// appends it to m, pairing the rims.
func (k *KelvinExterior) join(m *Mesh, rim []int32, in *Input, marker int32) error {
	disk, err := Triangulate(in, Options{Frozen: []int32{marker}})
	if err != nil {
		return fmt.Errorf("mesh: Kelvin disk: %w", err)
	}
	// Find the disk's rim and centre nodes by their exact coordinates.
	type key struct{ x, y float64 }
	where := make(map[key]int32, disk.NumNodes())
	for i := range disk.X {
		where[key{disk.X[i], disk.Y[i]}] = int32(i)
	}
	off := int32(m.NumNodes())
	n := len(rim)
	for i, v := range rim {
		d, ok := where[key{in.X[i], in.Y[i]}]
		if !ok {
			return fmt.Errorf("mesh: Kelvin disk: rim vertex %d lost in meshing", i)
		}
		k.Pairs = append(k.Pairs, [2]int32{v, d + off})
	}
	c, ok := where[key{in.X[n], in.Y[n]}]
	if !ok {
		return fmt.Errorf("mesh: Kelvin disk: centre vertex lost in meshing")
	}
	k.Infinity = c + off
	k.Mesh = appendMesh(m, disk)
	return nil
}

// appendMesh returns a new first-order mesh with b's nodes and triangles
// after a's (no nodes are merged; neighbours stay within each part), and
// both meshes' arcs.
func appendMesh(a, b *Mesh) *Mesh {
	off := int32(a.NumNodes())
	toff := int32(a.NumTriangles())
	out := &Mesh{
		X:           append(append([]float64(nil), a.X...), b.X...),
		Y:           append(append([]float64(nil), a.Y...), b.Y...),
		Tri:         append([]int32(nil), a.Tri...),
		Nbr:         append([]int32(nil), a.Nbr...),
		Region:      append(append([]int32(nil), a.Region...), b.Region...),
		EdgeMarker:  append(append([]int32(nil), a.EdgeMarker...), b.EdgeMarker...),
		NumVertices: a.NumNodes() + b.NumNodes(),
	}
	for _, v := range b.Tri {
		out.Tri = append(out.Tri, v+off)
	}
	for _, t := range b.Nbr {
		if t >= 0 {
			t += toff
		}
		out.Nbr = append(out.Nbr, t)
	}
	if a.EdgeArc != nil || b.EdgeArc != nil {
		out.Arcs = append(append([]Arc(nil), a.Arcs...), b.Arcs...)
		out.EdgeArc = make([]int32, 0, len(out.Tri))
		for _, part := range []struct {
			m   *Mesh
			off int32
		}{{a, 0}, {b, int32(len(a.Arcs))}} {
			if part.m.EdgeArc == nil {
				for range part.m.Tri {
					out.EdgeArc = append(out.EdgeArc, -1)
				}
				continue
			}
			for _, e := range part.m.EdgeArc {
				if e >= 0 {
					e += part.off
				}
				out.EdgeArc = append(out.EdgeArc, e)
			}
		}
	}
	return out
}

// ElevateKelvin makes the combined mesh second order and adds the pairs of
// matching midside nodes on the two rims.
func (k *KelvinExterior) ElevateKelvin() {
	m := k.Mesh
	Elevate(m)
	partner := make(map[int32]int32, len(k.Pairs))
	for _, p := range k.Pairs {
		partner[p[0]] = p[1]
	}
	// Midside node of each boundary edge, keyed by its sorted end nodes.
	type edge struct{ a, b int32 }
	mid := map[edge]int32{}
	for t := 0; t < m.NumTriangles(); t++ {
		for e := 0; e < 3; e++ {
			if m.Nbr[3*t+e] != -1 {
				continue
			}
			a, b := m.Tri[3*t+(e+1)%3], m.Tri[3*t+(e+2)%3]
			if a > b {
				a, b = b, a
			}
			mid[edge{a, b}] = m.Mid[3*t+e]
		}
	}
	n := len(k.Pairs)
	last := n // a closed rim: the last node joins the first
	if k.Half {
		last = n - 1
	}
	for i := 0; i < last; i++ {
		p, q := k.Pairs[i], k.Pairs[(i+1)%n]
		a, b := p[0], q[0]
		c, d := partner[a], partner[b]
		if a > b {
			a, b = b, a
		}
		if c > d {
			c, d = d, c
		}
		m1, ok1 := mid[edge{a, b}]
		m2, ok2 := mid[edge{c, d}]
		if ok1 && ok2 {
			k.Pairs = append(k.Pairs, [2]int32{m1, m2})
		}
	}
}
