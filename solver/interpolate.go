package solver

import "polegap/mesh"

// InterpolateTo writes into dst the potential of s at every node of m
// (corners and midside nodes, len m.NumNodes()) and returns it; a nil or
// short dst is allocated. Each node takes s's finite-element potential at
// its position (Solution.At: exact for any field s's elements represent,
// so linear fields on first-order and quadratic ones on second-order
// meshes carry over exactly). A node of m that lies outside s's mesh (a
// curved side that bulges past the old one) takes the mean of the values
// found at the other nodes of its triangles, repeated outwards, or 0 if
// none is found. This is the starting point of nested iteration: Newton
// on a refined mesh started from the solution on the mesh before it
// (W. Hackbusch, "Multi-Grid Methods and Applications", Springer 1985,
// ch. 5, nested iteration) needs a few steps instead of a solve from
// zero. It does not modify s or m.
func (s *Solution) InterpolateTo(dst []float64, m *mesh.Mesh) []float64 {
	nn := m.NumNodes()
	if cap(dst) < nn {
		dst = make([]float64, nn)
	}
	dst = dst[:nn]
	found := make([]bool, nn)
	missing := 0
	miss := make([]int, s.as.workers())
	parallelRange(nn, len(miss), func(w, i0, i1 int) {
		for i := i0; i < i1; i++ {
			a, _, _, ok := s.At(m.X[i], m.Y[i])
			dst[i], found[i] = a, ok
			if !ok {
				miss[w]++
			}
		}
	})
	for _, k := range miss {
		missing += k
	}
	if missing == 0 {
		return dst
	}
	// Fill the missing nodes from their found triangle neighbours, one
	// ring at a time; the values of one sweep use only nodes found before
	// it, so the result does not depend on the order of the triangles.
	var nodes [MaxNodes]int32
	sum := make([]float64, nn)
	cnt := make([]int, nn)
	for missing > 0 {
		clear(sum)
		clear(cnt)
		for t := 0; t < m.NumTriangles(); t++ {
			k := elementNodes(m, t, &nodes)
			var ts float64
			var tc int
			for _, v := range nodes[:k] {
				if found[v] {
					ts += dst[v]
					tc++
				}
			}
			if tc == 0 || tc == k {
				continue
			}
			for _, v := range nodes[:k] {
				if !found[v] {
					sum[v] += ts
					cnt[v] += tc
				}
			}
		}
		filled := 0
		for i := range cnt {
			if cnt[i] > 0 {
				dst[i], found[i] = sum[i]/float64(cnt[i]), true
				filled++
			}
		}
		if filled == 0 {
			break
		}
		missing -= filled
	}
	for i := range found {
		if !found[i] {
			dst[i] = 0
		}
	}
	return dst
}
