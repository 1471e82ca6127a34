package probes

import (
	"polegap/mesh"
)

// Recovered is a smoother field for first-order solutions, whose element
// flux density is constant and so only first-order accurate at a point.
// It averages the element values around each corner, weighted by area and
// only over triangles of the same region (B's tangential component jumps
// at an iron-air interface, so averaging across it would be wrong), and
// interpolates those corner values linearly inside each triangle. On
// smooth fields the averaged corner values converge at second order (the
// superconvergence of gradient averaging on regular meshes; O. C.
// Zienkiewicz and J. Z. Zhu, "The superconvergent patch recovery and a
// posteriori error estimates", IJNME 33, 1992).
type Recovered struct {
	base   Field
	m      *mesh.Mesh
	loc    *mesh.Locator
	corner [][2]float64 // 3 per triangle
}

// NewRecovered builds the recovered field from a first-order mesh, the
// flux density of each triangle and the field that supplies A. loc
// locates points in m; nil builds one (callers that recover several
// solutions on one mesh pass theirs).
func NewRecovered(base Field, m *mesh.Mesh, b [][2]float64, loc *mesh.Locator) *Recovered {
	nt := m.NumTriangles()
	if len(b) != nt {
		panic("probes: one flux density per triangle needed")
	}
	// Sum per (vertex, region) through a vertex -> triangles list.
	nv := m.NumVertices
	start := make([]int32, nv+1)
	for _, v := range m.Tri {
		start[v+1]++
	}
	for i := 0; i < nv; i++ {
		start[i+1] += start[i]
	}
	fill := append([]int32(nil), start[:nv]...)
	around := make([]int32, len(m.Tri))
	for t := 0; t < nt; t++ {
		for k := 0; k < 3; k++ {
			v := m.Tri[3*t+k]
			around[fill[v]] = int32(t)
			fill[v]++
		}
	}
	area := make([]float64, nt)
	for t := range area {
		a, bb, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		area[t] = 0.5 * ((m.X[bb]-m.X[a])*(m.Y[c]-m.Y[a]) - (m.X[c]-m.X[a])*(m.Y[bb]-m.Y[a]))
	}
	if loc == nil {
		loc = mesh.NewLocator(m)
	}
	r := &Recovered{base: base, m: m, loc: loc, corner: make([][2]float64, 3*nt)}
	for t := 0; t < nt; t++ {
		reg := m.Region[t]
		for k := 0; k < 3; k++ {
			v := m.Tri[3*t+k]
			var sx, sy, w float64
			for _, u := range around[start[v]:start[v+1]] {
				if m.Region[u] != reg {
					continue
				}
				sx += area[u] * b[u][0]
				sy += area[u] * b[u][1]
				w += area[u]
			}
			r.corner[3*t+k] = [2]float64{sx / w, sy / w}
		}
	}
	return r
}

// At implements Field.
func (r *Recovered) At(x, y float64) (a, bx, by float64, ok bool) {
	a, _, _, ok = r.base.At(x, y)
	if !ok {
		return 0, 0, 0, false
	}
	t, b0, b1, b2, found := r.loc.Find(x, y)
	if !found {
		return 0, 0, 0, false
	}
	c := r.corner[3*t : 3*t+3]
	bx = b0*c[0][0] + b1*c[1][0] + b2*c[2][0]
	by = b0*c[0][1] + b1*c[1][1] + b2*c[2][1]
	return a, bx, by, true
}
