package mesh

import "math"

// Delaunay refinement: J. Ruppert, "A Delaunay refinement algorithm for
// quality 2-dimensional mesh generation", J. Algorithms 18 (1995) 548-585,
// as analysed and extended by J. R. Shewchuk, "Delaunay refinement algorithms
// for triangular mesh generation", Computational Geometry 22 (2002) 21-74.
//
//   - A subsegment whose diametral circle holds a vertex (it is encroached),
//     or that is longer than the size field, is split: at its midpoint, or,
//     when exactly one end is an input vertex, at the power-of-two distance
//     from that end nearest to half its length ("concentric shells",
//     Ruppert 1995 section 4 / Shewchuk 2002 section 4.1), so that splits
//     on two segments meeting at a small angle stay at equal distances.
//   - A triangle whose smallest angle is below the bound, or whose longest
//     edge exceeds the size field, gets a vertex at its circumcentre, unless
//     the circumcentre encroaches a subsegment or lies behind one; then those
//     subsegments are split instead.
//   - Small input angles: a skinny triangle whose shortest edge joins two
//     vertices lying on two different segments that share an input vertex,
//     at equal distances from it (to 0.1%), is left alone (Shewchuk 2002,
//     section 4.1, "skinny triangles that cannot be improved"). Its small
//     angle is a consequence of the input angle; splitting it would only
//     cascade toward the apex forever. CheckOptions.Input lets Check accept
//     exactly these triangles.
//   - Frozen segments are never split; a circumcentre behind one is not
//     inserted and the triangle is left as it is.
//   - A segment that is the chord of an arc (Input.SegmentArc) is split at
//     a point of the arc, so that every vertex refinement puts on an arc
//     lies on it, and the two halves are chords of the same arc: at the
//     middle of the arc, or, for a shell split, at the point of the arc
//     whose straight distance from the input end is the shell's power of
//     two (so that the small-angle exemption still sees equal distances).
//     A piece with an end off the arc (a vertex where another edge
//     crossed the chord, computed on the chord) is split on the chord. The point lies off the
//     chord by the chord's sagitta, a small fraction of the triangles there
//     (GraphOptions); when the triangles around it would not all stay
//     counter-clockwise, the split falls back to the point on the chord.
//
// Termination: encroached subsegments always go first; every insertion is
// bounded below in distance by the local feature size for angle bounds up to
// about 20.7 degrees (Shewchuk 2002, Theorem 7) and works in practice up to
// about 33.8 degrees. The MaxTriangles cap guarantees termination on any
// input.

type triItem struct{ t, a, b, c int32 }

type segItem struct{ u, v int32 }

type refiner struct {
	d       *cdt
	sin2    float64 // sin^2 of the minimum angle; 0 disables quality tests
	size    *SizeField
	maxTri  int
	nIn     int32
	frozen  []int32
	vseg    []int32    // per vertex: segment piece a split put it on, or -1
	segEnds [][2]int32 // segment pieces' end points (see cdt.segEnds)
	segOf   map[edgeKey]int32
	// pieceSeg, segArc and arcs find the arc a piece lies on: the input
	// segment of the piece, its index in arcs (or -1), the arcs.
	pieceSeg []int32
	segArc   []int32
	arcs     []Arc
	steps    int
	offK     float64 // off-centre distance factor, 0 to use circumcentres

	triQ    []triItem
	triHead int
	segQ    []segItem
	segHead int
}

func newRefiner(d *cdt, in *Input, vmap []int32, opt *Options, maxTri int) *refiner {
	r := &refiner{d: d, maxTri: maxTri, nIn: int32(len(in.X)), frozen: opt.Frozen}
	ang := opt.MinAngle
	if ang == 0 {
		ang = DefaultMinAngle
	}
	if ang > maxMinAngle {
		ang = maxMinAngle
	}
	if ang > 0 {
		s := math.Sin(ang * math.Pi / 180)
		r.sin2 = s * s
		c := math.Cos(ang * math.Pi / 180)
		r.offK = 0.475 * math.Sqrt((1+c)/(1-c))
	}
	if !opt.Size.isZero() {
		r.size = &opt.Size
	}
	if g := opt.Size.Global; g > 0 {
		// About 5 triangles per h^2 of area at 28 degrees (measured on the
		// unit square benchmark); reserve for that many.
		area := 0.0
		for t := 0; t < len(d.tri)/3; t++ {
			if a, b, c := d.tri[3*t], d.tri[3*t+1], d.tri[3*t+2]; a >= 0 {
				area += 0.5 * Orient2DDet(d.x[a], d.y[a], d.x[b], d.y[b], d.x[c], d.y[c])
			}
		}
		est := 5.5 * area / (g * g)
		if est > float64(maxTri) {
			est = float64(maxTri)
		}
		if est > float64(d.numTri()) {
			d.reserve(int(est), int(est/2)+len(d.x))
		}
	}
	r.vseg = make([]int32, len(d.x), cap(d.x))
	for i := range r.vseg {
		r.vseg[i] = -1
	}
	r.segEnds, r.segOf = d.segEnds, d.segOf
	if in.SegmentArc != nil {
		r.pieceSeg, r.segArc, r.arcs = d.pieceSeg, in.SegmentArc, in.Arcs
	}
	return r
}

// arcOf returns the arc that segment piece p lies on, if any.
func (r *refiner) arcOf(p int32) (Arc, bool) {
	if r.segArc == nil || p < 0 || int(p) >= len(r.pieceSeg) {
		return Arc{}, false
	}
	s := r.pieceSeg[p]
	if s < 0 {
		return Arc{}, false
	}
	a := r.segArc[s]
	if a < 0 {
		return Arc{}, false
	}
	return r.arcs[a], true
}

// pieceOf returns the segment piece that the marked edge (a, b) lies on,
// or -1: the piece a split put a or b on, or the piece (a, b) itself.
func (r *refiner) pieceOf(a, b int32) int32 {
	if p := r.vseg[a]; p >= 0 {
		return p
	}
	if p := r.vseg[b]; p >= 0 {
		return p
	}
	if p, ok := r.segOf[ekey(a, b)]; ok {
		return p
	}
	return -1
}

// edgeArcs returns, per triangle slot of the triangulation, the index in
// Input.Arcs of the arc each edge lies on, or -1 (nil when the input has
// no arcs).
func (r *refiner) edgeArcs() []int32 {
	if r.segArc == nil {
		return nil
	}
	d := r.d
	out := make([]int32, len(d.tri))
	for i := range out {
		out[i] = -1
	}
	any := false
	for t := int32(0); t < int32(len(d.tri)/3); t++ {
		if !d.alive(t) {
			continue
		}
		for k := int32(0); k < 3; k++ {
			if d.mark[3*t+k] == 0 {
				continue
			}
			a, b := d.tri[3*t+int32(next3[k])], d.tri[3*t+int32(next3[k+1])]
			p := r.pieceOf(a, b)
			if p < 0 || int(p) >= len(r.pieceSeg) || r.pieceSeg[p] < 0 {
				continue
			}
			if ai := r.segArc[r.pieceSeg[p]]; ai >= 0 {
				out[3*t+k] = ai
				any = true
			}
		}
	}
	if !any {
		return nil
	}
	return out
}

func ekey(a, b int32) edgeKey {
	if a > b {
		a, b = b, a
	}
	return edgeKey{a, b}
}

func (r *refiner) isFrozen(m int32) bool {
	for _, f := range r.frozen {
		if f == m {
			return true
		}
	}
	return false
}

func (r *refiner) run() error {
	d := r.d
	if r.sin2 == 0 && r.size == nil {
		return nil
	}
	nt := len(d.tri) / 3
	for t := int32(0); t < int32(nt); t++ {
		if !d.alive(t) {
			continue
		}
		r.checkSegments(t)
		r.checkTri(t)
	}
	for {
		if d.numTri() > r.maxTri {
			return &TooManyTrianglesError{Limit: r.maxTri, Triangles: d.numTri()}
		}
		if r.steps++; r.steps > 8*r.maxTri+1_000_000 {
			return &StallError{Steps: r.steps, Triangles: d.numTri()}
		}
		if r.segHead < len(r.segQ) {
			s := r.segQ[r.segHead]
			r.segHead++
			if err := r.splitSegment(s.u, s.v); err != nil {
				return err
			}
			continue
		}
		r.segQ, r.segHead = r.segQ[:0], 0
		if r.triHead < len(r.triQ) {
			it := r.triQ[r.triHead]
			r.triHead++
			if r.triHead > 4096 && r.triHead*2 > len(r.triQ) {
				n := copy(r.triQ, r.triQ[r.triHead:])
				r.triQ, r.triHead = r.triQ[:n], 0
			}
			t := it.t
			if !d.alive(t) || d.tri[3*t] != it.a || d.tri[3*t+1] != it.b || d.tri[3*t+2] != it.c {
				continue
			}
			r.splitTriangle(t)
			continue
		}
		return nil
	}
}

// checkSegments queues the subsegments among t's edges that its opposite
// corner encroaches or that exceed the size field.
func (r *refiner) checkSegments(t int32) {
	d := r.d
	for k := int32(0); k < 3; k++ {
		m := d.mark[3*t+k]
		if m == 0 || r.isFrozen(m) {
			continue
		}
		p := d.tri[3*t+k]
		a, b := d.tri[3*t+int32(next3[k])], d.tri[3*t+int32(next3[k+1])]
		enc := InDiametralCircle(d.x[a], d.y[a], d.x[b], d.y[b], d.x[p], d.y[p])
		if !enc && r.size != nil {
			h := r.size.At((d.x[a]+d.x[b])/2, (d.y[a]+d.y[b])/2, d.reg[t])
			dx, dy := d.x[b]-d.x[a], d.y[b]-d.y[a]
			enc = dx*dx+dy*dy > h*h
		}
		if enc {
			r.segQ = append(r.segQ, segItem{a, b})
		}
	}
}

// checkTri queues t if it is skinny or too large.
func (r *refiner) checkTri(t int32) {
	if r.bad(t) {
		d := r.d
		r.triQ = append(r.triQ, triItem{t, d.tri[3*t], d.tri[3*t+1], d.tri[3*t+2]})
	}
}

func (r *refiner) bad(t int32) bool {
	d := r.d
	a, b, c := d.tri[3*t], d.tri[3*t+1], d.tri[3*t+2]
	ax, ay, bx, by, cx, cy := d.x[a], d.y[a], d.x[b], d.y[b], d.x[c], d.y[c]
	l0 := (bx-cx)*(bx-cx) + (by-cy)*(by-cy) // opposite a
	l1 := (cx-ax)*(cx-ax) + (cy-ay)*(cy-ay) // opposite b
	l2 := (ax-bx)*(ax-bx) + (ay-by)*(ay-by) // opposite c
	if r.size != nil {
		lmax := l0 // lengths are finite: plain comparisons, not math.Max
		if l1 > lmax {
			lmax = l1
		}
		if l2 > lmax {
			lmax = l2
		}
		h := r.size.At((ax+bx+cx)/3, (ay+by+cy)/3, d.reg[t])
		if lmax > h*h {
			return true
		}
	}
	if r.sin2 == 0 {
		return false
	}
	area2 := Orient2DDet(ax, ay, bx, by, cx, cy)
	// sin(smallest angle) = 2A / (product of the two longer edges).
	var p float64
	var u, v int32
	switch {
	case l0 <= l1 && l0 <= l2:
		p, u, v = l1*l2, b, c
	case l1 <= l2:
		p, u, v = l0*l2, c, a
	default:
		p, u, v = l0*l1, a, b
	}
	if area2*area2 >= r.sin2*p {
		return false
	}
	return !r.shellExempt(u, v)
}

// shellExempt reports whether u and v lie on two different segments sharing
// an input vertex, at equal distances from it (Shewchuk 2002, section 4.1).
func (r *refiner) shellExempt(u, v int32) bool {
	su, sv := r.vseg[u], r.vseg[v]
	if su < 0 || sv < 0 || su == sv {
		return false
	}
	eu, ev := r.segEnds[su], r.segEnds[sv]
	var apex int32 = -1
	switch {
	case eu[0] == ev[0] || eu[0] == ev[1]:
		apex = eu[0]
	case eu[1] == ev[0] || eu[1] == ev[1]:
		apex = eu[1]
	default:
		return false
	}
	d := r.d
	du := math.Hypot(d.x[u]-d.x[apex], d.y[u]-d.y[apex])
	dv := math.Hypot(d.x[v]-d.x[apex], d.y[v]-d.y[apex])
	return du < 1.001*dv && dv < 1.001*du
}

func (r *refiner) newVertex(x, y float64, seg int32) int32 {
	p := r.d.addVertex(x, y)
	r.vseg = append(r.vseg, seg)
	return p
}

// afterInsert queues what the last insertion made bad.
func (r *refiner) afterInsert() {
	for _, t := range r.d.created {
		r.checkSegments(t)
		r.checkTri(t)
	}
}

// fanOK reports whether the pending cavity's fan around (px, py) has only
// counter-clockwise triangles; rounding of a new vertex's coordinates could
// otherwise fold a sliver.
func (r *refiner) fanOK(px, py float64) bool {
	d := r.d
	for _, e := range d.bnd {
		if d.orientP(e.a, e.b, px, py) != CCW {
			return false
		}
	}
	return true
}

func (r *refiner) splitSegment(u, v int32) error {
	d := r.d
	t, k := d.findEdge(u, v)
	if t < 0 {
		if t, k = d.findEdge(v, u); t < 0 {
			return nil // already split
		}
		u, v = v, u
	}
	m := d.mark[3*t+int32(k)]
	if m == 0 || r.isFrozen(m) {
		return nil
	}
	ux, uy, vx, vy := d.x[u], d.y[u], d.x[v], d.y[v]
	s := 0.5
	uIn, vIn := u < r.nIn, v < r.nIn
	if uIn != vIn {
		l := math.Hypot(vx-ux, vy-uy)
		p2 := math.Ldexp(1, math.Ilogb(l)) // power of two <= l
		for l > 3*p2 {
			p2 *= 2
		}
		for l < 1.5*p2 {
			p2 /= 2
		}
		s = p2 / l
		if vIn {
			s = 1 - s
		}
	}
	px, py := ux+s*(vx-ux), uy+s*(vy-uy)
	if (px == ux && py == uy) || (px == vx && py == vy) {
		return &ResolutionError{X: px, Y: py}
	}
	seg := r.vseg[u]
	if seg < 0 {
		seg = r.vseg[v]
	}
	if seg < 0 {
		if s, ok := r.segOf[ekey(u, v)]; ok {
			seg = s
		}
	}
	if a, ok := r.arcOf(seg); ok && a.holds(ux, uy) && a.holds(vx, vy) {
		qx, qy, ok := a.project(px, py)
		if uIn != vIn {
			// Keep the concentric shells: the point of the arc at the
			// same straight distance from the input end.
			if uIn {
				qx, qy, ok = a.pointAt(ux, uy, vx, vy, s*math.Hypot(vx-ux, vy-uy))
			} else {
				qx, qy, ok = a.pointAt(vx, vy, ux, uy, (1-s)*math.Hypot(vx-ux, vy-uy))
			}
		}
		if ok {
			su, sv, sm := d.findCavity(qx, qy, t, k, locEdge)
			if r.fanOK(qx, qy) {
				p := r.newVertex(qx, qy, seg)
				d.commit(p, su, sv, sm)
				r.afterInsert()
				return nil
			}
		}
	}
	su, sv, sm := d.findCavity(px, py, t, k, locEdge)
	if !r.fanOK(px, py) {
		return &ResolutionError{X: px, Y: py}
	}
	p := r.newVertex(px, py, seg)
	d.commit(p, su, sv, sm)
	r.afterInsert()
	return nil
}

// offCentre moves the circumcentre (px, py) of triangle (a, b, c) toward the
// midpoint of the shortest edge, to the point where the new triangle on that
// edge just meets the angle bound: A. Üngör, "Off-centers: a new type of
// Steiner points for computing size-optimal quality-guaranteed Delaunay
// triangulations", LATIN 2004 (the distance factor 0.95 cot(theta/2)/2 from
// the midpoint keeps a margin over the bound). It leaves the circumcentre
// when that is closer.
func (r *refiner) offCentre(a, b, c int32, px, py float64) (float64, float64) {
	d := r.d
	p, q := a, b
	l2 := func(u, v int32) float64 {
		dx, dy := d.x[u]-d.x[v], d.y[u]-d.y[v]
		return dx*dx + dy*dy
	}
	best := l2(a, b)
	if l := l2(b, c); l < best {
		p, q, best = b, c, l
	}
	if l := l2(c, a); l < best {
		p, q, best = c, a, l
	}
	mx, my := (d.x[p]+d.x[q])/2, (d.y[p]+d.y[q])/2
	dx, dy := px-mx, py-my
	dc := math.Hypot(dx, dy)
	doff := r.offK * math.Sqrt(best)
	if doff >= dc || dc == 0 {
		return px, py
	}
	s := doff / dc
	return mx + s*dx, my + s*dy
}

func (r *refiner) splitTriangle(t int32) {
	d := r.d
	a, b, c := d.tri[3*t], d.tri[3*t+1], d.tri[3*t+2]
	ax, ay := d.x[a], d.y[a]
	bx, by := d.x[b]-ax, d.y[b]-ay
	cx, cy := d.x[c]-ax, d.y[c]-ay
	den := 2 * (bx*cy - by*cx)
	if den == 0 {
		return
	}
	b2, c2 := bx*bx+by*by, cx*cx+cy*cy
	px := ax + (cy*b2-by*c2)/den
	py := ay + (bx*c2-cx*b2)/den
	if math.IsNaN(px) || math.IsNaN(py) || math.IsInf(px, 0) || math.IsInf(py, 0) {
		return
	}
	if r.offK > 0 {
		px, py = r.offCentre(a, b, c, px, py)
	}
	tt, k, loc := d.walkTo(t, px, py)
	switch loc {
	case locOutside, locBlocked:
		m := d.mark[3*tt+int32(k)]
		if m == 0 || r.isFrozen(m) {
			return
		}
		u, v := d.tri[3*tt+int32(next3[k])], d.tri[3*tt+int32(next3[k+1])]
		r.segQ = append(r.segQ, segItem{u, v})
		r.triQ = append(r.triQ, triItem{t, a, b, c})
		return
	case locVertex:
		return
	case locEdge:
		if m := d.mark[3*tt+int32(k)]; m != 0 {
			if r.isFrozen(m) {
				return
			}
			u, v := d.tri[3*tt+int32(next3[k])], d.tri[3*tt+int32(next3[k+1])]
			r.segQ = append(r.segQ, segItem{u, v})
			r.triQ = append(r.triQ, triItem{t, a, b, c})
			return
		}
	}
	d.findCavity(px, py, tt, k, loc)
	enc := false
	for _, e := range d.bnd {
		if e.mark == 0 || r.isFrozen(e.mark) {
			continue
		}
		if InDiametralCircle(d.x[e.a], d.y[e.a], d.x[e.b], d.y[e.b], px, py) {
			r.segQ = append(r.segQ, segItem{e.a, e.b})
			enc = true
		}
	}
	if enc {
		r.triQ = append(r.triQ, triItem{t, a, b, c})
		return
	}
	if !r.fanOK(px, py) {
		return
	}
	p := r.newVertex(px, py, -1)
	d.commit(p, -1, -1, 0)
	r.afterInsert()
}
