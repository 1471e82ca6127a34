package solver

import "sync/atomic"

// locate finds the triangle containing (x, y) and the reference
// coordinates of the point in it by a walk through the neighbour
// triangles from the last hit (C. L. Lawson, "Software for C1 surface
// interpolation", 1977; remembering walk). If the walk leaves a
// non-convex domain it falls back to a scan.
// TODO: use mesh.NewLocator once the mesh package offers it.
func (s *Solution) locate(x, y float64) (t int, xi, eta float64, ok bool) {
	m := s.as.m
	nt := m.NumTriangles()
	if nt == 0 {
		return 0, 0, 0, false
	}
	t = int(atomic.LoadInt32(&s.hint))
	if t < 0 || t >= nt {
		t = 0
	}
	const eps = 1e-12
	for steps := 0; steps < nt; steps++ {
		xi, eta = s.refCoords(t, x, y)
		l := [3]float64{1 - xi - eta, xi, eta}
		worst, wk := -eps, -1
		for k := 0; k < 3; k++ {
			if l[k] < worst {
				worst, wk = l[k], k
			}
		}
		if wk < 0 {
			atomic.StoreInt32(&s.hint, int32(t))
			return t, xi, eta, true
		}
		nb := m.Nbr[3*t+wk]
		if nb < 0 {
			break
		}
		t = int(nb)
	}
	for t = 0; t < nt; t++ {
		xi, eta = s.refCoords(t, x, y)
		if xi >= -eps && eta >= -eps && 1-xi-eta >= -eps {
			atomic.StoreInt32(&s.hint, int32(t))
			return t, xi, eta, true
		}
	}
	return 0, 0, 0, false
}

// refCoords maps (x, y) to the reference coordinates of triangle t.
func (s *Solution) refCoords(t int, x, y float64) (xi, eta float64) {
	x0, y0, a, b, c, d, det := s.as.affine(t)
	dx, dy := x-x0, y-y0
	xi = (d*dx - b*dy) / det
	eta = (-c*dx + a*dy) / det
	return
}
