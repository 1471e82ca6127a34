package solver

import "sync"

// evalElement returns A and B at reference point (xi, eta) of triangle t.
func (s *Solution) evalElement(t int, xi, eta float64) (a, bx, by float64) {
	var val [MaxNodes]float64
	var rg [MaxNodes][2]float64
	s.as.el.EvalTo(val[:], rg[:], xi, eta)
	return s.evalWith(t, xi, eta, &val, &rg)
}

// evalWith is evalElement with the basis values and reference gradients at
// (xi, eta) given.
func (s *Solution) evalWith(t int, xi, eta float64, val *[MaxNodes]float64, rg *[MaxNodes][2]float64) (a, bx, by float64) {
	as := s.as
	var nodes [MaxNodes]int32
	k := elementNodes(as.m, t, &nodes)
	x0, _, ja, jb, jc, jd, det := as.affine(t)
	curved := as.m.IsCurved(t)
	var xc float64
	if curved {
		xc, _, ja, jb, jc, jd, det = isoAt(as.m, &nodes, val, rg)
	}
	inv := 1 / det
	var gx, gy float64
	for i := 0; i < k; i++ {
		ai := s.A[nodes[i]]
		a += ai * val[i]
		gx += ai * (jd*rg[i][0] - jc*rg[i][1]) * inv
		gy += ai * (-jb*rg[i][0] + ja*rg[i][1]) * inv
	}
	if !as.axi {
		return a, gy, -gx
	}
	r := x0 + ja*xi + jb*eta
	if curved {
		r = xc
	}
	if r <= as.rtol {
		// On the axis A = 0 and A/r tends to ∂A/∂r.
		return a, -gy, 2 * gx
	}
	return a, -gy, gx + a/r
}

// BTo writes the flux density B (T) at the centroid of each triangle into
// dst (planar: Bx, By; axisymmetric: Br, Bz) and returns it. A nil dst is
// allocated; otherwise it must have one entry per triangle.
func (s *Solution) BTo(dst [][2]float64) [][2]float64 {
	nt := s.as.m.NumTriangles()
	if dst == nil {
		dst = make([][2]float64, nt)
	}
	if len(dst) != nt {
		panic(errDstLen)
	}
	const c = 1.0 / 3
	var val [MaxNodes]float64
	var rg [MaxNodes][2]float64
	s.as.el.EvalTo(val[:], rg[:], c, c)
	parallelRange(nt, s.as.workers(), func(_, t0, t1 int) {
		for t := t0; t < t1; t++ {
			_, bx, by := s.evalWith(t, c, c, &val, &rg)
			dst[t] = [2]float64{bx, by}
		}
	})
	return dst
}

// parallelRange splits [0, n) into contiguous ranges run concurrently by
// workers goroutines, f(w, i0, i1) for worker w (one call, w = 0, below
// 20k items).
func parallelRange(n, workers int, f func(w, i0, i1 int)) {
	if workers <= 1 || n < 20000 {
		f(0, 0, n)
		return
	}
	var wg sync.WaitGroup
	for w := 0; w < workers; w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			f(w, n*w/workers, n*(w+1)/workers)
		}()
	}
	wg.Wait()
}

// HTo writes the field strength H = ν(|B|²) B − M (A/m) at the centroid of
// each triangle into dst and returns it (nil dst is allocated).
func (s *Solution) HTo(dst [][2]float64) [][2]float64 {
	dst = s.BTo(dst)
	p := s.Problem
	for t := range dst {
		reg := s.as.m.Region[t]
		b := dst[t]
		nu, _ := p.Materials[reg].Nu(b[0]*b[0] + b[1]*b[1])
		var mg [2]float64
		if int(reg) < len(p.Magnetization) {
			mg = p.Magnetization[reg]
		}
		dst[t] = [2]float64{nu*b[0] - mg[0], nu*b[1] - mg[1]}
	}
	return dst
}

// NodalBTo writes a smoothed nodal flux density into dst (one entry per
// node) and returns it: the average of the element values at the node,
// weighted by element area (for plots; the element values are the
// solution's own). A nil dst is allocated.
func (s *Solution) NodalBTo(dst [][2]float64) [][2]float64 {
	m := s.as.m
	nn := m.NumNodes()
	if dst == nil {
		dst = make([][2]float64, nn)
	}
	if len(dst) != nn {
		panic(errDstLen)
	}
	wsum := make([]float64, nn)
	for i := range dst {
		dst[i] = [2]float64{}
	}
	var nodes [MaxNodes]int32
	for t := 0; t < m.NumTriangles(); t++ {
		k := elementNodes(m, t, &nodes)
		_, _, _, _, _, _, det := s.as.affine(t)
		w := 0.5 * det
		if m.IsCurved(t) {
			w = m.TriangleArea(t)
		}
		for i := 0; i < k; i++ {
			xi, eta := s.as.el.RefNode(i)
			_, bx, by := s.evalElement(t, xi, eta)
			v := nodes[i]
			dst[v][0] += w * bx
			dst[v][1] += w * by
			wsum[v] += w
		}
	}
	for i := range dst {
		if wsum[i] > 0 {
			dst[i][0] /= wsum[i]
			dst[i][1] /= wsum[i]
		}
	}
	return dst
}

// At returns the potential and flux density at (x, y), or ok = false if the
// point lies outside the mesh.
func (s *Solution) At(x, y float64) (a, bx, by float64, ok bool) {
	t, xi, eta, found := s.locate(x, y)
	if !found {
		return 0, 0, 0, false
	}
	a, bx, by = s.evalElement(t, xi, eta)
	return a, bx, by, true
}
