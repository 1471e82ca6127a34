package solver

import (
	"math"
	"testing"

	"polegap/mesh"
	"polegap/solver/sparse"
)

// Test meshes built by hand (structured grids), with neighbours, boundary
// markers and, for order 2, midside nodes from mesh.Elevate.

// linear is a linear material of relative permeability MuR.
type linear struct{ MuR float64 }

const mu0 = 4e-7 * math.Pi // H/m, the SI value before 2019 (within 1e-9 of today's)

func (l linear) Nu(b2 float64) (float64, float64) { return 1 / (mu0 * l.MuR), 0 }

// finishMesh fills Nbr by matching edges and EdgeMarker on boundary edges
// from marker(xm, ym) at the edge midpoint, then elevates to order 2 if asked.
func finishMesh(x, y []float64, tri []int32, region []int32, marker func(x, y float64) int32, order int) *mesh.Mesh {
	m := &mesh.Mesh{X: x, Y: y, NumVertices: len(x), Tri: tri, Region: region}
	nt := len(tri) / 3
	m.Nbr = make([]int32, 3*nt)
	m.EdgeMarker = make([]int32, 3*nt)
	type key struct{ a, b int32 }
	seen := make(map[key]int32, 3*nt)
	for t := 0; t < nt; t++ {
		for k := 0; k < 3; k++ {
			a, b := tri[3*t+(k+1)%3], tri[3*t+(k+2)%3]
			if a > b {
				a, b = b, a
			}
			if o, ok := seen[key{a, b}]; ok {
				m.Nbr[3*t+k] = o / 3
				m.Nbr[o] = int32(t)
				delete(seen, key{a, b})
			} else {
				seen[key{a, b}] = int32(3*t + k)
				m.Nbr[3*t+k] = -1
			}
		}
	}
	for t := 0; t < nt; t++ {
		for k := 0; k < 3; k++ {
			if m.Nbr[3*t+k] == -1 && marker != nil {
				a, b := tri[3*t+(k+1)%3], tri[3*t+(k+2)%3]
				m.EdgeMarker[3*t+k] = marker((x[a]+x[b])/2, (y[a]+y[b])/2)
			}
		}
	}
	if order == 2 {
		mesh.Elevate(m)
	}
	return m
}

// rectMesh triangulates [x0,x1]×[y0,y1] with nx×ny squares, each cut along
// alternating diagonals. Boundary markers: 1 bottom, 2 right, 3 top, 4 left.
func rectMesh(nx, ny int, x0, x1, y0, y1 float64, order int, region func(x, y float64) int32) *mesh.Mesh {
	var x, y []float64
	for j := 0; j <= ny; j++ {
		for i := 0; i <= nx; i++ {
			x = append(x, x0+(x1-x0)*float64(i)/float64(nx))
			y = append(y, y0+(y1-y0)*float64(j)/float64(ny))
		}
	}
	id := func(i, j int) int32 { return int32(j*(nx+1) + i) }
	var tri, reg []int32
	add := func(a, b, c int32) {
		tri = append(tri, a, b, c)
		r := int32(0)
		if region != nil {
			r = region((x[a]+x[b]+x[c])/3, (y[a]+y[b]+y[c])/3)
		}
		reg = append(reg, r)
	}
	for j := 0; j < ny; j++ {
		for i := 0; i < nx; i++ {
			a, b, c, d := id(i, j), id(i+1, j), id(i+1, j+1), id(i, j+1)
			if (i+j)%2 == 0 {
				add(a, b, c)
				add(a, c, d)
			} else {
				add(a, b, d)
				add(b, c, d)
			}
		}
	}
	hx, hy := (x1-x0)/float64(nx), (y1-y0)/float64(ny)
	marker := func(xm, ym float64) int32 {
		switch {
		case math.Abs(ym-y0) < hy/4:
			return 1
		case math.Abs(xm-x1) < hx/4:
			return 2
		case math.Abs(ym-y1) < hy/4:
			return 3
		default:
			return 4
		}
	}
	return finishMesh(x, y, tri, reg, marker, order)
}

// diskMesh meshes the disk of radius radii[len-1] centred at the origin:
// a centre node (index 0) and rings of nth nodes at the given radii
// (shifted by half a step on alternate rings). The outer circle has
// marker 1; region(r) tags each triangle by its centroid radius.
func diskMesh(radii []float64, nth int, order int, region func(r float64) int32) *mesh.Mesh {
	x, y := []float64{0}, []float64{0}
	for k, r := range radii {
		off := 0.5 * float64(k%2)
		for i := 0; i < nth; i++ {
			th := 2 * math.Pi * (float64(i) + off) / float64(nth)
			x = append(x, r*math.Cos(th))
			y = append(y, r*math.Sin(th))
		}
	}
	node := func(k, i int) int32 { return int32(1 + k*nth + (i+nth)%nth) }
	var tri, reg []int32
	add := func(a, b, c int32) {
		if (x[b]-x[a])*(y[c]-y[a])-(y[b]-y[a])*(x[c]-x[a]) < 0 {
			b, c = c, b
		}
		tri = append(tri, a, b, c)
		xc, yc := (x[a]+x[b]+x[c])/3, (y[a]+y[b]+y[c])/3
		r := int32(0)
		if region != nil {
			r = region(math.Hypot(xc, yc))
		}
		reg = append(reg, r)
	}
	for i := 0; i < nth; i++ {
		add(0, node(0, i), node(0, i+1))
	}
	for k := 0; k+1 < len(radii); k++ {
		for i := 0; i < nth; i++ {
			if k%2 == 0 { // outer ring shifted forward by half a step
				add(node(k, i), node(k+1, i), node(k+1, i-1))
				add(node(k, i), node(k, i+1), node(k+1, i))
			} else { // inner ring shifted
				add(node(k, i), node(k+1, i+1), node(k+1, i))
				add(node(k, i), node(k, i+1), node(k+1, i+1))
			}
		}
	}
	R := radii[len(radii)-1]
	marker := func(xm, ym float64) int32 {
		if math.Hypot(xm, ym) > 0.9*R {
			return 1
		}
		return 2
	}
	return finishMesh(x, y, tri, reg, marker, order)
}

// geometricRadii returns radii from r0 to R with ratio about 1 + 2π/nth
// (square-ish cells for nth nodes per ring).
func geometricRadii(r0, R float64, nth int) []float64 {
	q := 1 + 2*math.Pi/float64(nth)
	n := int(math.Ceil(math.Log(R/r0) / math.Log(q)))
	out := make([]float64, n+1)
	for k := 0; k <= n; k++ {
		out[k] = r0 * math.Pow(R/r0, float64(k)/float64(n))
	}
	return out
}

// gridMesh triangulates the tensor-product grid xs × ys (strictly
// increasing), cutting cells along alternating diagonals; region(x, y) tags
// each triangle by its centroid. Boundary markers: 1 bottom, 2 right,
// 3 top, 4 left.
func gridMesh(xs, ys []float64, order int, region func(x, y float64) int32) *mesh.Mesh {
	nx, ny := len(xs)-1, len(ys)-1
	var x, y []float64
	for j := 0; j <= ny; j++ {
		for i := 0; i <= nx; i++ {
			x = append(x, xs[i])
			y = append(y, ys[j])
		}
	}
	id := func(i, j int) int32 { return int32(j*(nx+1) + i) }
	tri := make([]int32, 0, 6*nx*ny)
	reg := make([]int32, 0, 2*nx*ny)
	add := func(a, b, c int32) {
		tri = append(tri, a, b, c)
		r := int32(0)
		if region != nil {
			r = region((x[a]+x[b]+x[c])/3, (y[a]+y[b]+y[c])/3)
		}
		reg = append(reg, r)
	}
	for j := 0; j < ny; j++ {
		for i := 0; i < nx; i++ {
			a, b, c, d := id(i, j), id(i+1, j), id(i+1, j+1), id(i, j+1)
			if (i+j)%2 == 0 {
				add(a, b, c)
				add(a, c, d)
			} else {
				add(a, b, d)
				add(b, c, d)
			}
		}
	}
	x1, y0, y1 := xs[nx], ys[0], ys[ny]
	marker := func(xm, ym float64) int32 {
		switch {
		case ym == y0:
			return 1
		case xm == x1:
			return 2
		case ym == y1:
			return 3
		default:
			return 4
		}
	}
	return finishMesh(x, y, tri, reg, marker, order)
}

// graded returns points from a to b (both included) whose spacing changes
// geometrically from about ha at a to about hb at b.
func graded(a, b, ha, hb float64) []float64 {
	L := b - a
	if math.Abs(ha-hb) < 1e-12*L {
		n := int(math.Ceil(L / ha))
		out := make([]float64, n+1)
		for i := range out {
			out[i] = a + L*float64(i)/float64(n)
		}
		return out
	}
	q := (L - ha) / (L - hb) // ratio of the series ha q^k summing to L
	n := int(math.Ceil(math.Log(hb/ha)/math.Log(q))) + 1
	if n < 1 {
		n = 1
	}
	q = math.Pow(hb/ha, 1/float64(n-1+boolInt(n == 1)))
	out := []float64{a}
	var s float64
	w := make([]float64, n)
	for k := 0; k < n; k++ {
		w[k] = math.Pow(q, float64(k))
		s += w[k]
	}
	pos := a
	for k := 0; k < n; k++ {
		pos += L * w[k] / s
		out = append(out, pos)
	}
	out[n] = b
	return out
}

func boolInt(b bool) int {
	if b {
		return 1
	}
	return 0
}

// joinAxes concatenates point lists that share their end points.
func joinAxes(parts ...[]float64) []float64 {
	out := append([]float64(nil), parts[0]...)
	for _, p := range parts[1:] {
		out = append(out, p[1:]...)
	}
	return out
}

// boundaryNodes returns the nodes on boundary edges (Nbr == -1), midside
// nodes included.
func boundaryNodes(m *mesh.Mesh) []int32 {
	seen := make(map[int32]bool)
	var out []int32
	addn := func(v int32) {
		if !seen[v] {
			seen[v] = true
			out = append(out, v)
		}
	}
	for t := 0; t < m.NumTriangles(); t++ {
		for k := 0; k < 3; k++ {
			if m.Nbr[3*t+k] != -1 {
				continue
			}
			addn(m.Tri[3*t+(k+1)%3])
			addn(m.Tri[3*t+(k+2)%3])
			if m.Mid != nil {
				addn(m.Mid[3*t+k])
			}
		}
	}
	return out
}

// checkSolution runs Solution.Check after a successful solve.
func checkSolution(t *testing.T, s *Solution, err error) {
	t.Helper()
	if err == nil && s != nil {
		if cerr := s.Check(); cerr != nil {
			t.Fatal(cerr)
		}
	}
}

// mulVecTo sets dst = a x.
func mulVecTo(dst []float64, a *sparse.CSR, x []float64) {
	for i := 0; i < a.N; i++ {
		var s float64
		for p := a.RowPtr[i]; p < a.RowPtr[i+1]; p++ {
			s += a.Val[p] * x[a.Col[p]]
		}
		dst[i] = s
	}
}

// curveRings makes the edges of the first-order mesh m whose two ends lie
// on one of the circles about the origin with the given radii chords of
// that circle (mesh.Mesh.EdgeArc), so that mesh.Elevate curves them.
func curveRings(m *mesh.Mesh, radii ...float64) {
	m.Arcs = m.Arcs[:0]
	for _, r := range radii {
		m.Arcs = append(m.Arcs, mesh.Arc{R: r})
	}
	nt := m.NumTriangles()
	m.EdgeArc = make([]int32, 3*nt)
	on := func(v int32, r float64) bool { return math.Abs(math.Hypot(m.X[v], m.Y[v])-r) <= 1e-12*r }
	for t := 0; t < nt; t++ {
		for k := 0; k < 3; k++ {
			m.EdgeArc[3*t+k] = -1
			a, b := m.Tri[3*t+(k+1)%3], m.Tri[3*t+(k+2)%3]
			for i, r := range radii {
				if on(a, r) && on(b, r) {
					m.EdgeArc[3*t+k] = int32(i)
				}
			}
		}
	}
}
