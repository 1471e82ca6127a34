package probes

import (
	"polegap/mesh"
	"polegap/solver"
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
	base Field
	p    *Patches
	b    [][2]float64 // per triangle
	loc  *mesh.Locator
}

// Patches lists the triangles around each vertex of a mesh with their
// areas: what recovery needs of the mesh, built once per mesh and shared
// by the recovered fields of all its solutions.
type Patches struct {
	m      *mesh.Mesh
	start  []int32 // vertex v's triangles are around[start[v]:start[v+1]]
	around []int32
	area   []float64
}

// NewPatches builds the vertex patches of m.
func NewPatches(m *mesh.Mesh) *Patches {
	nt := m.NumTriangles()
	nv := m.NumVertices
	p := &Patches{m: m, start: make([]int32, nv+1), around: make([]int32, len(m.Tri)), area: make([]float64, nt)}
	for _, v := range m.Tri {
		p.start[v+1]++
	}
	for i := 0; i < nv; i++ {
		p.start[i+1] += p.start[i]
	}
	fill := append([]int32(nil), p.start[:nv]...)
	for t := 0; t < nt; t++ {
		for k := 0; k < 3; k++ {
			v := m.Tri[3*t+k]
			p.around[fill[v]] = int32(t)
			fill[v]++
		}
	}
	for t := range p.area {
		a, bb, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		p.area[t] = 0.5 * ((m.X[bb]-m.X[a])*(m.Y[c]-m.Y[a]) - (m.X[c]-m.X[a])*(m.Y[bb]-m.Y[a]))
	}
	return p
}

// NewRecovered makes the recovered field of a first-order solution from
// the mesh's patches, the flux density of each triangle and the field
// that supplies A; loc locates points in the mesh. Corner values are
// averaged when a point asks for them, so making the field costs nothing
// and a sweep that reads one probe per solution pays for one triangle.
func NewRecovered(base Field, p *Patches, b [][2]float64, loc *mesh.Locator) *Recovered {
	if len(b) != p.m.NumTriangles() {
		panic("probes: one flux density per triangle needed")
	}
	if loc.Mesh() != p.m {
		panic("probes: locator and patches of different meshes")
	}
	return &Recovered{base: base, p: p, b: b, loc: loc}
}

// corner returns the area-weighted mean flux density of the triangles of
// region reg around vertex v.
func (r *Recovered) corner(v, reg int32) (bx, by float64) {
	p, m := r.p, r.p.m
	var w float64
	for _, u := range p.around[p.start[v]:p.start[v+1]] {
		if m.Region[u] != reg {
			continue
		}
		bx += p.area[u] * r.b[u][0]
		by += p.area[u] * r.b[u][1]
		w += p.area[u]
	}
	return bx / w, by / w
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
	m := r.p.m
	reg := m.Region[t]
	for k, bk := range [3]float64{b0, b1, b2} {
		cx, cy := r.corner(m.Tri[3*int(t)+k], reg)
		bx += bk * cx
		by += bk * cy
	}
	return a, bx, by, true
}

// SidesTo implements Sided when the base field does: the regions and
// potentials of the base field's sides, with each side's flux density
// recovered from the corner averages of its own region (continuous
// within a region, so any of its triangles touching the point gives the
// same value). Nu stays the base field's: it only ranks the sides.
func (r *Recovered) SidesTo(dst []solver.Side, x, y float64) []solver.Side {
	sb, ok := r.base.(Sided)
	if !ok {
		return dst
	}
	n0 := len(dst)
	dst = sb.SidesTo(dst, x, y)
	m := r.p.m
	for i := n0; i < len(dst); i++ {
		sd := &dst[i]
		t := sd.Triangle
		i0, i1, i2 := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		area := r.p.area[t]
		b0 := 0.5 * ((m.X[i1]-x)*(m.Y[i2]-y) - (m.X[i2]-x)*(m.Y[i1]-y)) / area
		b1 := 0.5 * ((m.X[i2]-x)*(m.Y[i0]-y) - (m.X[i0]-x)*(m.Y[i2]-y)) / area
		b2 := 1 - b0 - b1
		var bx, by float64
		for k, bk := range [3]float64{b0, b1, b2} {
			cx, cy := r.corner(m.Tri[3*int(t)+k], sd.Region)
			bx += bk * cx
			by += bk * cy
		}
		sd.Bx, sd.By = bx, by
	}
	return dst
}
