package mesh

// findCavity collects the constrained Delaunay cavity of the point (px, py)
// located at (t, k, loc): every triangle whose circumcircle strictly contains
// the point and that is reachable from t without crossing a segment. When the
// point lies on edge k of t, the triangle across that edge joins the cavity
// even if the edge is a segment: the point splits it, and su, sv, sm return
// that edge's end points and marker (su = -1 otherwise).
//
// The cavity of an exact constrained Delaunay triangulation is star-shaped
// from the point (every boundary edge sees it strictly on its inner side), so
// its fan retriangulation has positive areas.
func (d *cdt) findCavity(px, py float64, t int32, k, loc int) (su, sv, sm int32) {
	d.epoch++
	if d.epoch == 0 { // wrapped: clear stale stamps
		for i := range d.stamp {
			d.stamp[i] = 0
		}
		d.epoch = 1
	}
	ep := d.epoch
	d.cavity = append(d.cavity[:0], t)
	d.bnd = d.bnd[:0]
	d.stamp[t] = ep
	su, sv = -1, -1
	if loc == locEdge {
		su, sv = d.tri[3*t+int32(next3[k])], d.tri[3*t+int32(next3[k+1])]
		sm = d.mark[3*t+int32(k)]
		if n := d.nbr[3*t+int32(k)]; n >= 0 {
			d.stamp[n] = ep
			d.cavity = append(d.cavity, n)
		}
	}
	for i := 0; i < len(d.cavity); i++ {
		c := d.cavity[i]
		for e := int32(0); e < 3; e++ {
			n := d.nbr[3*c+e]
			if n >= 0 && d.stamp[n] == ep {
				continue
			}
			m := d.mark[3*c+e]
			if n >= 0 && m == 0 && d.inCircleP(n, px, py) > 0 {
				d.stamp[n] = ep
				d.cavity = append(d.cavity, n)
				continue
			}
			a, b := d.tri[3*c+int32(next3[e])], d.tri[3*c+int32(next3[e+1])]
			if n < 0 && su >= 0 && ((a == su && b == sv) || (a == sv && b == su)) {
				continue // the boundary segment being split
			}
			d.bnd = append(d.bnd, bndEdge{a: a, b: b, out: n, mark: m, region: d.reg[c]})
		}
	}
	return su, sv, sm
}

// commit replaces the cavity found by findCavity with the fan of triangles
// joining vertex p to the cavity boundary. The new triangles are listed in
// d.created.
func (d *cdt) commit(p int32, su, sv, sm int32) {
	for _, c := range d.cavity {
		d.killTri(c)
	}
	d.created = d.created[:0]
	for _, e := range d.bnd {
		nt := d.newTri(e.a, e.b, p)
		d.nbr[3*nt], d.nbr[3*nt+1], d.nbr[3*nt+2] = -1, -1, e.out
		d.mark[3*nt], d.mark[3*nt+1], d.mark[3*nt+2] = 0, 0, e.mark
		d.reg[nt] = e.region
		if o := e.out; o >= 0 {
			// The outside triangle's edge starting at b is (b, a).
			switch e.b {
			case d.tri[3*o+1]:
				d.nbr[3*o] = nt
			case d.tri[3*o+2]:
				d.nbr[3*o+1] = nt
			default:
				d.nbr[3*o+2] = nt
			}
		}
		d.link[e.a] = nt
		d.created = append(d.created, nt)
	}
	for _, nt := range d.created {
		b := d.tri[3*nt+1]
		if n2 := d.link[b]; n2 >= 0 {
			d.nbr[3*nt] = n2
			d.nbr[3*n2+1] = nt
		}
	}
	for _, nt := range d.created {
		a, b := d.tri[3*nt], d.tri[3*nt+1]
		d.link[a] = -1
		if su >= 0 {
			if a == su || a == sv {
				d.mark[3*nt+1] = sm
			}
			if b == su || b == sv {
				d.mark[3*nt] = sm
			}
		}
	}
}

// insertVertex inserts the existing vertex p, located at (t, k, loc) with
// loc locInside or locEdge.
func (d *cdt) insertVertex(p int32, t int32, k, loc int) {
	su, sv, sm := d.findCavity(d.x[p], d.y[p], t, k, loc)
	d.commit(p, su, sv, sm)
}
