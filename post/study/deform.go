package study

import (
	"fmt"

	"polegap/mesh"
)

// Deformed returns the study of s's model on s's own mesh with each
// corner node v moved by w[v]·(dx, dy) metres, and each midside node by
// the mean of its edge's two corner displacements (a straight edge stays
// straight; an edge whose two corners move alike moves rigidly, curved or
// not). w has one weight per corner node (len(w) >= Disc.Mesh.NumVertices;
// 1 moves a node by the whole displacement, 0 keeps it). Topology,
// numbering, boundary markers and sources are s's; the coil current
// densities follow the deformed areas, so every coil's ampere-turns stay
// exact; the solves reuse s's sparsity pattern, ordering and symbolic
// factorization once s has been solved (solver.PrepareLike). Virtual
// work moves a part this way: w = 1 on the part, falling to 0 through
// the air around it, so that the discrete co-energy is a smooth function
// of the displacement and its central difference
// converges at O(δ²) (a fresh mesh at each position adds the noise of the
// mesher's changed decisions; see post/quantity/force).
//
// It returns an error, and no study, when a moved node lies on the outer
// boundary and the boundary there does not run along (dx, dy) (the part
// would move the boundary; a node sliding along the axis of an
// axisymmetric model or along a symmetry plane is fine), or when a
// triangle folds over (the displacement is too large for the elements it
// stretches). Disc.Input and Disc.Boundary describe the undeformed
// geometry. It panics if w is too short.
func (s *Study) Deformed(w []float64, dx, dy float64) (*Study, error) {
	d := s.Disc
	m := d.Mesh
	if len(w) < m.NumVertices {
		panic(errShortWeights)
	}
	sm := *m
	sm.X = append([]float64(nil), m.X...)
	sm.Y = append([]float64(nil), m.Y...)
	for v := 0; v < m.NumVertices; v++ {
		if w[v] != 0 {
			sm.X[v] += w[v] * dx
			sm.Y[v] += w[v] * dy
		}
	}
	nt := m.NumTriangles()
	for t := 0; t < nt; t++ {
		for k := 0; k < 3; k++ {
			a, b := m.Tri[3*t+(k+1)%3], m.Tri[3*t+(k+2)%3]
			if w[a] == 0 && w[b] == 0 {
				continue
			}
			if m.Nbr[3*t+k] < 0 {
				if mesh.Orient2D(m.X[a], m.Y[a], m.X[b], m.Y[b], m.X[a]+dx, m.Y[a]+dy) != mesh.Collinear {
					v := a
					if w[a] == 0 {
						v = b
					}
					return nil, fmt.Errorf("%s: moving the part would move the outer boundary at (%g, %g) m", s.Model.File, m.X[v], m.Y[v])
				}
			}
			if m.Mid != nil {
				c, f := m.Mid[3*t+k], 0.5*(w[a]+w[b])
				sm.X[c], sm.Y[c] = m.X[c]+f*dx, m.Y[c]+f*dy
			}
		}
	}
	for t := 0; t < nt; t++ {
		a, b, c := sm.Tri[3*t], sm.Tri[3*t+1], sm.Tri[3*t+2]
		if w[a] == 0 && w[b] == 0 && w[c] == 0 {
			continue
		}
		if mesh.Orient2D(sm.X[a], sm.Y[a], sm.X[b], sm.Y[b], sm.X[c], sm.Y[c]) != mesh.CCW {
			return nil, &FoldError{X: m.X[a], Y: m.Y[a], DX: dx, DY: dy}
		}
	}
	sd := *d
	sd.Mesh = &sm
	ds := &Study{Model: s.Model, Disc: &sd, src: s.src, areas: sm.RegionAreas(), like: s}
	if err := checkAreas(s.Model, s.src, ds.areas); err != nil {
		return nil, err
	}
	var err error
	if ds.prob, err = newProblem(&sd, s.src); err != nil {
		return nil, err
	}
	return ds, nil
}
