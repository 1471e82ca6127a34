package solver

import (
	"slices"

	"polegap/mesh"
)

// SideTol is the distance from a point to an element edge, relative to
// the largest coordinate magnitude of the mesh, within which SidesTo
// counts the point as lying on the edge: 1e-9, the rule by which a model
// decides that two features touch (models.Model.Resolution), so that a
// point the model file puts on a region's edge is on it after the
// conversion to metres and the mesher's splitting of the edge.
const SideTol = 1e-9

// Side is the field at a point as one region's elements see it. Where
// regions of different permeability meet, B jumps: its normal component
// is continuous and its tangential component scales with μ.
type Side struct {
	Region    int32   // region tag
	Triangle  int32   // the region's first triangle touching the point
	Triangles int     // how many of the region's triangles touch it
	A, Bx, By float64 // potential (Wb/m) and flux density (T) there
	Nu        float64 // reluctivity ν(|B|²) of the region's material (m/H)
}

// SidesTo appends to dst the field at (x, y) seen from each region whose
// elements touch the point within SideTol of the mesh's extent
// (mesh.Locator.TouchingTo): one Side per region, in increasing tag
// order, with B averaged over that region's touching elements (B is
// discontinuous between elements; A is continuous). A point inside one
// region's element gets one Side; a point on an edge or a corner
// between regions one per region. Nothing is appended outside the mesh.
func (s *Solution) SidesTo(dst []Side, x, y float64) []Side {
	loc := s.as.loc.get(s.as.m)
	tris := loc.TouchingTo(nil, x, y, 10*s.as.rtol) // rtol is 1e-10 of the extent
	if len(tris) == 0 {
		return dst
	}
	slices.Sort(tris)
	m := s.as.m
	n0 := len(dst)
	for _, t := range tris {
		reg := m.Region[t]
		xi, eta := reference(m, t, x, y)
		a, bx, by := s.evalElement(int(t), xi, eta)
		i := slices.IndexFunc(dst[n0:], func(sd Side) bool { return sd.Region == reg })
		if i < 0 {
			dst = append(dst, Side{Region: reg, Triangle: t})
			i = len(dst) - n0 - 1
		}
		sd := &dst[n0+i]
		sd.Triangles++
		sd.A += a
		sd.Bx += bx
		sd.By += by
	}
	for i := n0; i < len(dst); i++ {
		sd := &dst[i]
		n := float64(sd.Triangles)
		sd.A, sd.Bx, sd.By = sd.A/n, sd.Bx/n, sd.By/n
		if mat := s.Problem.Materials[sd.Region]; mat != nil {
			sd.Nu, _ = mat.Nu(sd.Bx*sd.Bx + sd.By*sd.By)
		}
	}
	slices.SortStableFunc(dst[n0:], func(p, q Side) int { return int(p.Region) - int(q.Region) })
	return dst
}

// reference returns the reference coordinates (ξ, η) of (x, y) in
// triangle t's affine map (the barycentric weights of corners 1 and 2).
func reference(m *mesh.Mesh, t int32, x, y float64) (xi, eta float64) {
	i0, i1, i2 := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
	x0, y0 := m.X[i0], m.Y[i0]
	a, b := m.X[i1]-x0, m.X[i2]-x0
	c, d := m.Y[i1]-y0, m.Y[i2]-y0
	det := a*d - b*c
	dx, dy := x-x0, y-y0
	return (d*dx - b*dy) / det, (-c*dx + a*dy) / det
}
