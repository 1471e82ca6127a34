package solver

import (
	"fmt"
	"math"

	"polegap/internal/compsum"
	"polegap/solver/sparse"
)

// EnergyBounds brackets the co-energy W' of a problem between two
// computable numbers (J per metre of depth planar, J for the full
// revolution axisymmetric); with linear materials W' is the stored energy
// W.
//
// The vector-potential solution minimises Π(A) = ∫w(|∇×A|) − ∫J·A over a
// conforming space (w the energy density); the true minimum is −W', and
// any discrete A can only be higher, so ∫J·A_h − ∫w(|∇×A_h|) is a lower
// bound. The complementary (magnetic field) formulation minimises ∫w'(|H|)
// (w' the co-energy density) over every field H with ∇×H = J and the
// boundary conditions of the problem; its minimum is W', and any such
// field gives an upper bound. The field here is H = H_s − ∇φ: a source
// field H_s in the lowest-order edge elements whose circulation round
// every triangle is the current in it (so ∇×H_s = J exactly on straight
// triangles), corrected by the gradient of a scalar potential φ of the
// mesh's order that minimises the co-energy (Newton's method; the
// functional is convex). References: Hammond and Penman, "Calculation of
// inductance and capacitance by means of dual energy principles", Proc.
// IEE 123(10), 1976; Bossavit, "Computational Electromagnetism",
// Academic Press 1998, ch. 5 (edge elements, complementarity). Upper −
// Lower bounds the error of either figure in the meshed geometry.
type EnergyBounds struct {
	Lower, Upper float64
	// Guaranteed is true when the bracket is rigorous (in exact
	// arithmetic, for the meshed geometry): linear materials and no
	// curved current-carrying triangle. With a curved one the source
	// field's curl equals J only on average over it; with a nonlinear
	// material the energy densities are integrated by a degree-6 rule
	// rather than exactly. Reason says which.
	Guaranteed bool
	Reason     string
	// Unknowns is the size of the scalar-potential system, Steps the
	// Newton steps its solve took.
	Unknowns, Steps int
}

// BoundsError says why a problem has no energy bounds.
type BoundsError struct{ Reason string }

// Error implements error.
func (e *BoundsError) Error() string { return "solver: no energy bounds: " + e.Reason }

// EnergyBounds computes the bounds of the co-energy: the lower from the
// solution's potential, the upper from a complementary field solved here.
// It needs no magnets, no line currents and no fixed non-zero potentials;
// otherwise it returns a *BoundsError. Only opt.Workers, opt.Method and
// opt.Solver matter.
func (s *Solution) EnergyBounds(opt Options) (EnergyBounds, error) {
	p := s.Problem
	if err := boundsEligible(p); err != nil {
		return EnergyBounds{}, err
	}
	d, err := newDualProblem(s.as)
	if err != nil {
		return EnergyBounds{}, err
	}
	lo := s.coEnergyLower()
	d.a = s.A
	up, err := d.solve(opt.withDefaults(), lo)
	if err != nil {
		return EnergyBounds{}, err
	}
	b := EnergyBounds{Lower: lo, Upper: up, Guaranteed: d.exact && d.linear, Unknowns: d.n, Steps: d.steps}
	switch {
	case !d.exact:
		b.Reason = "curved current-carrying triangles: the source field matches J on average only"
	case !d.linear:
		b.Reason = "nonlinear materials: energy densities integrated by a degree-6 rule"
	}
	return b, nil
}

// boundRule is the quadrature rule of the bounds' energy integrals:
// exact for the polynomial densities of linear materials up to P2
// axisymmetric (degree 5), and close for nonlinear ones.
const boundRule = 6

// coEnergyLower returns ∫J·A − ∫w(|B|) of the solution's potential.
func (s *Solution) coEnergyLower() float64 {
	as := s.as
	m := as.m
	r := RuleOfDegree(boundRule)
	val, rg := basisOn(as.el, r)
	mats := as.p.Materials
	tabs := make([]energyTable, len(mats))
	for k, mat := range mats {
		if mat != nil {
			tabs[k] = newEnergyTable(mat, breaks(mat))
		}
	}
	var sum compsum.Sum
	var nodes [MaxNodes]int32
	var grad [MaxNodes][2]float64
	for t := 0; t < m.NumTriangles(); t++ {
		elementNodes(m, t, &nodes)
		reg := m.Region[t]
		var jz float64
		if int(reg) < len(as.p.CurrentDensity) {
			jz = as.p.CurrentDensity[reg]
		}
		var e float64
		for q := range r.W {
			x, y, wt := geometryAt(as, t, r, q, &val[q], &rg[q], &nodes, &grad)
			var a, ax, ay float64
			for i := 0; i < as.nn; i++ {
				ai := s.A[nodes[i]]
				a += ai * val[q][i]
				ax += ai * grad[i][0]
				ay += ai * grad[i][1]
			}
			bx, by := ay, -ax // planar B = (∂A/∂y, −∂A/∂x)
			if as.axi {
				bx, by = -ay, ax+a/x // B = (−∂A/∂z, ∂A/∂r + A/r)
			}
			w, _ := tabs[reg].density(mats[reg], bx*bx+by*by)
			if ext, ok := as.ext[reg]; ok {
				w *= ((x-ext.CX)*(x-ext.CX) + (y-ext.CY)*(y-ext.CY)) / (ext.Radius * ext.Radius)
			}
			e += wt * (jz*a - w)
		}
		sum.Add(e)
	}
	v := sum.Value()
	if as.axi {
		v *= 2 * math.Pi
	}
	return v
}

// boundsEligible refuses what the complementary formulation here does not
// cover.
func boundsEligible(p *Problem) error {
	if len(p.PointCurrents) > 0 {
		return &BoundsError{Reason: "line currents have unbounded energy"}
	}
	// A node held at zero (the Kelvin disk's point at infinity) only
	// sets the potential's constant; other fixed values impose a field.
	for _, f := range p.Fixed {
		if f.A != 0 {
			return &BoundsError{Reason: "fixed non-zero potentials (applied fields) are not covered"}
		}
	}
	for r, m := range p.Magnetization {
		if m != [2]float64{} {
			return &BoundsError{Reason: fmt.Sprintf("region %d is magnetised (permanent magnets are not covered)", r)}
		}
	}
	return nil
}

// dualProblem is the scalar-potential problem for H = H_s − ∇φ.
type dualProblem struct {
	as    *assembler
	circ  [][3]float64 // per triangle: H_s circulation along edge k, from corner k+1 to k+2
	dof   []int32      // per node: unknown of φ, or -1 for the pinned class
	n     int
	exact bool
	// a is the vector potential whose field warm-starts solve (nil: none).
	a []float64
	// orient is −1 on triangles drawn mirrored against the model (a
	// planar Kelvin disk), where the potential's field B = (∂A/∂y,
	// −∂A/∂x) points against the pulled-back H, and +1 elsewhere.
	orient []float64
	// linear, steps and guess (|B| per assembly point, the last value)
	// are solve's.
	linear bool
	steps  int
	guess  []float64
}

// edgeKey orders an edge by the identification classes of its ends.
func edgeKey(a, b int32) (uint64, float64) {
	if a < b {
		return uint64(a)<<32 | uint64(b), 1
	}
	return uint64(b)<<32 | uint64(a), -1
}

func newDualProblem(as *assembler) (*dualProblem, error) {
	m, p := as.m, as.p
	nt, nn := m.NumTriangles(), m.NumNodes()
	root := func(v int32) int32 {
		if as.d.root != nil {
			return as.d.root[v]
		}
		return v
	}
	// Global edges by the classes of their ends: an edge met twice is
	// inside the domain (or glued by an identification), once on its
	// boundary.
	type edge struct{ t [2]int32 }
	index := make(map[uint64]int32, 2*nt)
	var edges []edge
	tEdge := make([][3]int32, nt)
	tSign := make([][3]float64, nt)
	for t := 0; t < nt; t++ {
		for k := 0; k < 3; k++ {
			a, b := root(m.Tri[3*t+(k+1)%3]), root(m.Tri[3*t+(k+2)%3])
			key, sg := edgeKey(a, b)
			e, ok := index[key]
			if !ok {
				e = int32(len(edges))
				index[key] = e
				edges = append(edges, edge{t: [2]int32{int32(t), -1}})
			} else if edges[e].t[1] < 0 {
				edges[e].t[1] = int32(t)
			} else {
				return nil, &BoundsError{Reason: fmt.Sprintf("edge of triangle %d is shared by more than two triangles", t)}
			}
			tEdge[t][k], tSign[t][k] = e, sg
		}
	}
	// Boundary edges: on a zero-potential edge (B·n = 0) and on the axis
	// the tangential field is free, so the source field's circulation may
	// leave the domain there; on a flux-normal edge (H×n = 0) it may not,
	// and φ is constant along each connected stretch of such edges.
	tol := as.rtol
	onAxis := func(v int32) bool { return as.axi && math.Abs(m.X[v]) <= tol }
	exit := make([]bool, len(edges))
	parent := make([]int32, nn)
	for i := range parent {
		parent[i] = int32(i)
	}
	if as.d.root != nil {
		for i := range parent {
			union(parent, int32(i), as.d.root[i])
		}
	}
	for t := 0; t < nt; t++ {
		for k := 0; k < 3; k++ {
			e := tEdge[t][k]
			if edges[e].t[1] >= 0 {
				continue
			}
			a, b := m.Tri[3*t+(k+1)%3], m.Tri[3*t+(k+2)%3]
			c, marked := p.Boundary[m.EdgeMarker[3*t+k]]
			if (onAxis(a) && onAxis(b)) || !marked || c != FluxNormal {
				exit[e] = true
				continue
			}
			union(parent, a, b)
			if m.Mid != nil {
				union(parent, a, m.Mid[3*t+k])
			}
		}
	}
	// Sources: the current through each triangle.
	src := make([]float64, nt)
	exact := true
	var total float64
	var nodes [MaxNodes]int32
	for t := 0; t < nt; t++ {
		reg := m.Region[t]
		if int(reg) >= len(p.CurrentDensity) || p.CurrentDensity[reg] == 0 {
			continue
		}
		area := 0.0
		if m.IsCurved(t) {
			exact = false
			elementNodes(m, t, &nodes)
			for q := range as.rule.W {
				_, _, _, _, _, _, det := isoAt(m, &nodes, &as.val[q], &as.rgrad[q])
				area += as.rule.W[q] * 0.5 * det
			}
		} else {
			_, _, _, _, _, _, det := as.affine(t)
			area = 0.5 * det
		}
		src[t] = p.CurrentDensity[reg] * area
		if as.axi {
			// (∇×H)_φ = ∂H_r/∂z − ∂H_z/∂r is minus the plane's curl
			// in (x, y) = (r, z).
			src[t] = -src[t]
		}
		total += math.Abs(src[t])
	}
	// A spanning tree of the dual graph grown from the exits (or from
	// triangle 0 in a closed domain); each triangle's current is routed
	// to its parent edge, leaves first.
	parentEdge := make([]int32, nt)
	seen := make([]bool, nt)
	orient := make([]float64, nt)
	for t := range orient {
		orient[t] = 1
	}
	order := make([]int32, 0, nt)
	for e, ex := range exit {
		if t := edges[e].t[0]; ex && !seen[t] {
			seen[t] = true
			parentEdge[t] = int32(e)
			order = append(order, t)
		}
	}
	if len(order) == 0 {
		seen[0] = true
		parentEdge[0] = -1
		order = append(order, 0)
	}
	for i := 0; i < len(order); i++ {
		t := order[i]
		for k := 0; k < 3; k++ {
			e := tEdge[t][k]
			u := edges[e].t[0]
			if u == t {
				u = edges[e].t[1]
			}
			if u < 0 || seen[u] {
				continue
			}
			seen[u] = true
			parentEdge[u] = e
			order = append(order, u)
			// Neighbours run along a shared edge in opposite senses;
			// across an orientation-reversing identification (the
			// planar Kelvin disk is a mirror image) in the same sense.
			for l := 0; l < 3; l++ {
				if tEdge[u][l] == e {
					orient[u] = -orient[t] * tSign[t][k] * tSign[u][l]
				}
			}
		}
	}
	if len(order) != nt {
		return nil, &BoundsError{Reason: "the mesh is not connected"}
	}
	circ := make([]float64, len(edges))
	for i := len(order) - 1; i >= 0; i-- {
		t := order[i]
		rest := src[t]
		pk := -1
		for k := 0; k < 3; k++ {
			if tEdge[t][k] == parentEdge[t] {
				pk = k
				continue
			}
			rest -= tSign[t][k] * circ[tEdge[t][k]]
		}
		if pk < 0 {
			if math.Abs(rest) > 1e-9*total {
				return nil, &BoundsError{Reason: fmt.Sprintf("the net current %g A does not vanish in a domain without a zero-potential boundary", rest)}
			}
			continue
		}
		circ[parentEdge[t]] = rest / tSign[t][pk]
	}
	d := &dualProblem{as: as, circ: make([][3]float64, nt), dof: make([]int32, nn), exact: exact, orient: orient}
	for t := 0; t < nt; t++ {
		for k := 0; k < 3; k++ {
			d.circ[t][k] = tSign[t][k] * circ[tEdge[t][k]]
		}
	}
	// Unknowns of φ: one per class; the class of the first used node is
	// pinned at zero (φ is defined up to a constant).
	used := make([]bool, nn)
	for t := 0; t < nt; t++ {
		k := elementNodes(m, t, &nodes)
		for _, v := range nodes[:k] {
			used[v] = true
		}
	}
	classDof := make(map[int32]int32)
	pinned := int32(-1)
	for i := 0; i < nn; i++ {
		d.dof[i] = -1
		if !used[i] {
			continue
		}
		r := find(parent, int32(i))
		if pinned < 0 {
			pinned = r
		}
		if r == pinned {
			continue
		}
		k, ok := classDof[r]
		if !ok {
			k = int32(d.n)
			classDof[r] = k
			d.n++
		}
		d.dof[i] = k
	}
	return d, nil
}

// whitney writes the reference-coordinate source field at (ξ, η) of a
// triangle with edge circulations c (edge k from corner k+1 to k+2):
// Σ c_k (λ_i ∇λ_j − λ_j ∇λ_i) over the edges (i, j).
func whitney(c [3]float64, xi, eta float64) (hx, hy float64) {
	l := [3]float64{1 - xi - eta, xi, eta}
	g := [3][2]float64{{-1, -1}, {1, 0}, {0, 1}}
	for k := 0; k < 3; k++ {
		i, j := (k+1)%3, (k+2)%3
		hx += c[k] * (l[i]*g[j][0] - l[j]*g[i][0])
		hy += c[k] * (l[i]*g[j][1] - l[j]*g[i][1])
	}
	return
}

// basisOn tabulates an element's basis on rule r.
func basisOn(el Element, r *Rule) (val [][MaxNodes]float64, rg [][MaxNodes][2]float64) {
	val = make([][MaxNodes]float64, r.NumPoints())
	rg = make([][MaxNodes][2]float64, r.NumPoints())
	for q := range val {
		xi, eta := r.Point(q)
		el.EvalTo(val[q][:], rg[q][:], xi, eta)
	}
	return
}

// geometryAt returns, at point q of rule r in triangle t (nodes in
// nodes, basis values val and reference gradients rg there), the physical
// point and the integration weight (with r when axisymmetric, per
// radian), and writes the physical basis gradients into grad.
func geometryAt(as *assembler, t int, r *Rule, q int, val *[MaxNodes]float64, rg *[MaxNodes][2]float64, nodes *[MaxNodes]int32, grad *[MaxNodes][2]float64) (x, y, wt float64) {
	a, b, c, d, det := jacobianAt(as, t, r, q, val, rg, nodes, &x, &y)
	return x, y, gradientsTo(as, r, q, x, rg, a, b, c, d, det, grad)
}

// gradientsTo writes the physical basis gradients for the Jacobian
// (a, b, c, d, det) into grad and returns the integration weight at point
// q of rule r (x the radius when axisymmetric).
func gradientsTo(as *assembler, r *Rule, q int, x float64, rg *[MaxNodes][2]float64, a, b, c, d, det float64, grad *[MaxNodes][2]float64) (wt float64) {
	inv := 1 / det
	for i := 0; i < as.nn; i++ {
		grad[i] = [2]float64{(d*rg[i][0] - c*rg[i][1]) * inv, (-b*rg[i][0] + a*rg[i][1]) * inv}
	}
	wt = r.W[q] * 0.5 * det
	if as.axi {
		wt *= x
	}
	return wt
}

// jacobianAt returns the Jacobian (∂x/∂ξ, ∂x/∂η, ∂y/∂ξ, ∂y/∂η) and its
// determinant at point q of rule r in triangle t, and sets the point.
func jacobianAt(as *assembler, t int, r *Rule, q int, val *[MaxNodes]float64, rg *[MaxNodes][2]float64, nodes *[MaxNodes]int32, px, py *float64) (a, b, c, d, det float64) {
	if as.m.IsCurved(t) {
		*px, *py, a, b, c, d, det = isoAt(as.m, nodes, val, rg)
		return
	}
	var x0, y0 float64
	x0, y0, a, b, c, d, det = as.affine(t)
	xi, eta := r.Point(q)
	*px, *py = x0+a*xi+b*eta, y0+c*xi+d*eta
	return
}

// field returns H = H_s − ∇φ, the weight and the basis gradients at point
// q of rule r in triangle t, and the permeability factor of a Kelvin
// exterior there (1 elsewhere).
func (d *dualProblem) field(t int, r *Rule, q int, val *[MaxNodes]float64, rg *[MaxNodes][2]float64, nodes *[MaxNodes]int32, grad *[MaxNodes][2]float64, phi []float64) (hx, hy, wt, scale float64) {
	as := d.as
	var x, y float64
	a, b, c, dd, det := jacobianAt(as, t, r, q, val, rg, nodes, &x, &y)
	wt = gradientsTo(as, r, q, x, rg, a, b, c, dd, det, grad)
	// The source field is a 1-form and maps covariantly, H = J⁻ᵀ Ĥ, as
	// the basis gradients do.
	xi, eta := r.Point(q)
	rx, ry := whitney(d.circ[t], xi, eta)
	hx, hy = (dd*rx-c*ry)/det, (-b*rx+a*ry)/det
	for i := 0; i < as.nn; i++ {
		if k := d.dof[nodes[i]]; k >= 0 {
			hx -= phi[k] * grad[i][0]
			hy -= phi[k] * grad[i][1]
		}
	}
	scale = 1
	if ext, ok := as.ext[as.m.Region[t]]; ok {
		// The image of the space outside a sphere: μ carries R²/ρ'²,
		// the reciprocal of the reluctivity's factor (see Exterior).
		scale = ext.Radius * ext.Radius / ((x-ext.CX)*(x-ext.CX) + (y-ext.CY)*(y-ext.CY))
	}
	return
}

// hLaw is a material seen from H: |B| = b(|H|), B = μ H with μ = b/h, and
// the differential permeability μd = db/dh.
type hLaw struct {
	mat    Material
	tab    energyTable
	linear bool
	mu     float64 // when linear
}

func newHLaw(mat Material) hLaw {
	nu0, _ := mat.Nu(0)
	return hLaw{mat: mat, tab: newEnergyTable(mat, breaks(mat)), linear: isLinear(mat), mu: 1 / nu0}
}

// at returns μ, μd and |B| at field strength h (A/m); guess, when
// positive, is a |B| (T) to start from (the last one at that point).
func (l *hLaw) at(h, guess float64) (mu, mud, b float64) {
	if l.linear || !(h > 0) {
		if !l.linear {
			nu, _ := l.mat.Nu(0)
			return 1 / nu, 1 / nu, 0
		}
		return l.mu, l.mu, l.mu * h
	}
	// ν(b²) b = h is increasing in b (dH/dB = ν + 2ν'b² > 0): Newton's
	// method, safeguarded by the bracket it narrows (doubling while the
	// bracket has no top).
	g := func(b float64) (float64, float64) {
		nu, dnu := l.mat.Nu(b * b)
		return nu*b - h, nu + 2*dnu*b*b
	}
	b = guess
	if !(b > 0) {
		b = l.mu * h // the initial permeability's value
	}
	lo, hi := 0.0, math.Inf(1)
	prev := math.Inf(1)
	for k := 0; k < 200; k++ {
		v, dv := g(b)
		if v > 0 {
			hi = b
		} else {
			lo = b
		}
		// Newton's step, unless it leaves the bracket or the last one
		// did not halve the residual (Newton cycles across a B-H
		// curve's knee): then bisect (or double, without a top).
		nb := b - v/dv
		slow := math.Abs(v) > 0.5*prev
		prev = math.Abs(v)
		if !(nb > lo && nb < hi) || slow {
			if math.IsInf(hi, 1) {
				nb = 2 * b
			} else {
				nb = 0.5 * (lo + hi)
			}
		}
		if math.Abs(nb-b) <= 1e-14*b {
			b = nb
			break
		}
		b = nb
	}
	_, dv := g(b)
	return b / h, 1 / dv, b
}

// coEnergyDensity returns w'(h) = h b − w(b).
func (l *hLaw) coEnergyDensity(h float64) float64 {
	if l.linear {
		return 0.5 * l.mu * h * h
	}
	_, _, b := l.at(h, 0)
	_, wco := l.tab.density(l.mat, b*b)
	return wco
}

// assemble writes f_i = ∫B(H)·∇N_i (the negative gradient of the
// co-energy in φ) for the field of phi and, when tr is not nil, the
// tangent ∫∇N_iᵀ (dB/dH) ∇N_j into tr. With warm set it assembles instead
// the projection onto the vector potential's field H_A in the metric of
// the potential's tangent T_A: f_i = ∫∇N_i·T_A(H − H_A) and ∫∇N_iᵀ T_A ∇N_j,
// whose solution starts Newton's method close to the minimum.
func (d *dualProblem) assemble(laws []hLaw, r *Rule, val [][MaxNodes]float64, rg [][MaxNodes][2]float64, phi, f []float64, tr *sparse.Triplet, warm bool) {
	as := d.as
	m := as.m
	nn := as.nn
	nq := r.NumPoints()
	for i := range f {
		f[i] = 0
	}
	var nodes [MaxNodes]int32
	var grad [MaxNodes][2]float64
	for t := 0; t < m.NumTriangles(); t++ {
		elementNodes(m, t, &nodes)
		reg := m.Region[t]
		law := &laws[reg]
		var ke [MaxNodes][MaxNodes]float64
		var fe [MaxNodes]float64
		for q := range r.W {
			hx, hy, wt, sc := d.field(t, r, q, &val[q], &rg[q], &nodes, &grad, phi)
			var mu, mud, ux, uy float64
			if warm {
				// The potential's field and tangent at this point.
				var a, ax, ay float64
				for i := 0; i < nn; i++ {
					ai := d.a[nodes[i]]
					a += ai * val[q][i]
					ax += ai * grad[i][0]
					ay += ai * grad[i][1]
				}
				bx, by := ay, -ax
				if as.axi {
					var x, y float64
					jacobianAt(as, t, r, q, &val[q], &rg[q], &nodes, &x, &y)
					bx, by = -ay, ax+a/x
				}
				b2 := bx*bx + by*by
				nu, dnu := as.p.Materials[reg].Nu(b2)
				mu, mud = sc/nu, sc/(nu+2*dnu*b2)
				hx -= d.orient[t] * nu / sc * bx
				hy -= d.orient[t] * nu / sc * by
				if b2 > 0 {
					b := math.Sqrt(b2)
					ux, uy = bx/b, by/b
				}
				for i := 0; i < nn; i++ {
					tx, ty := mu*hx+(mud-mu)*ux*(ux*hx+uy*hy), mu*hy+(mud-mu)*uy*(ux*hx+uy*hy)
					fe[i] += wt * (tx*grad[i][0] + ty*grad[i][1])
				}
			} else {
				h := math.Hypot(hx, hy)
				var b float64
				mu, mud, b = law.at(h, d.guess[t*nq+q])
				d.guess[t*nq+q] = b
				mu, mud = mu*sc, mud*sc
				for i := 0; i < nn; i++ {
					fe[i] += wt * mu * (hx*grad[i][0] + hy*grad[i][1])
				}
				if h > 0 {
					ux, uy = hx/h, hy/h
				}
			}
			if tr == nil {
				continue
			}
			// Tangent dB/dH = μ I + (μd − μ) ĥĥᵀ.
			txx, txy, tyy := mu+(mud-mu)*ux*ux, (mud-mu)*ux*uy, mu+(mud-mu)*uy*uy
			for i := 0; i < nn; i++ {
				gi := grad[i]
				tx, ty := txx*gi[0]+txy*gi[1], txy*gi[0]+tyy*gi[1]
				for j := 0; j < nn; j++ {
					ke[i][j] += wt * (tx*grad[j][0] + ty*grad[j][1])
				}
			}
		}
		for i := 0; i < nn; i++ {
			di := d.dof[nodes[i]]
			if di < 0 {
				continue
			}
			f[di] += fe[i]
			if tr == nil {
				continue
			}
			for j := 0; j < nn; j++ {
				if dj := d.dof[nodes[j]]; dj >= 0 {
					tr.Add(int(di), int(dj), ke[i][j])
				}
			}
		}
	}
}

// solve minimises the co-energy over φ by Newton's method, started from
// the projection of the vector potential's field (assemble's warm mode)
// and damped by halving until the co-energy still falls along the step
// (see the slope test below). It
// stops when the Newton decrement says the co-energy can fall by less
// than 1e-8 of scale, and returns the co-energy of the final field (the
// upper bound).
func (d *dualProblem) solve(opt Options, scale float64) (float64, error) {
	as := d.as
	m := as.m
	nt := m.NumTriangles()
	laws := make([]hLaw, len(as.p.Materials))
	d.linear = true
	for k, mat := range as.p.Materials {
		if mat != nil {
			laws[k] = newHLaw(mat)
			d.linear = d.linear && laws[k].linear
		}
	}
	r := RuleOfDegree(4)
	val, rg := basisOn(as.el, r)
	d.guess = make([]float64, nt*r.NumPoints())
	phi := make([]float64, d.n)
	if d.n > 0 {
		tr := sparse.NewTriplet(d.n, nt*as.nn*as.nn)
		f := make([]float64, d.n)
		ft := make([]float64, d.n)
		trial := make([]float64, d.n)
		delta := make([]float64, d.n)
		lin := opt.linearSolver(d.n)
		slope := func(alpha float64) float64 { // −d/dα co-energy(φ + αδ)
			for i := range phi {
				trial[i] = phi[i] + alpha*delta[i]
			}
			d.assemble(laws, r, val, rg, trial, ft, nil, false)
			s := 0.0
			for i := range ft {
				s += ft[i] * delta[i]
			}
			return s
		}
		// A linear problem needs one step from φ = 0; a nonlinear one
		// starts with the warm projection.
		warm := !d.linear && d.a != nil
		for step := 0; step < 50; step++ {
			tr.I, tr.J, tr.V = tr.I[:0], tr.J[:0], tr.V[:0]
			d.assemble(laws, r, val, rg, phi, f, tr, warm)
			k := tr.ToCSR()
			if step == 0 {
				if err := lin.Analyze(k); err != nil {
					return 0, &LinearSolveError{Stage: "analyze", Err: err}
				}
			}
			if err := lin.Factor(k); err != nil {
				return 0, &LinearSolveError{Stage: "factor", Err: err}
			}
			// Any φ gives an admissible field, so an inexact solve still
			// gives an upper bound, only a looser one.
			if res, err := lin.SolveTo(delta, f); err != nil {
				return 0, &LinearSolveError{Stage: "solve", Result: res, Err: err}
			}
			d.steps++
			if warm {
				for i := range phi {
					phi[i] += delta[i]
				}
				warm = false
				continue
			}
			// The Newton decrement f·δ is twice the co-energy the step
			// is expected to remove.
			dec := 0.0
			for i := range f {
				dec += f[i] * delta[i]
			}
			// Full step unless the slope at its end says it went far
			// past the minimum along δ: with the slope falling from
			// dec at α = 0 to above −dec/2 at α, the co-energy fell by
			// about α·dec/4 at least (trapezoid rule on the slope).
			alpha := 1.0
			for !d.linear && alpha > 1e-3 && slope(alpha) < -0.5*dec {
				alpha /= 2
			}
			for i := range phi {
				phi[i] += alpha * delta[i]
			}
			if d.linear || !(dec > 2e-8*math.Abs(scale)) {
				break
			}
		}
	}
	// The co-energy of the final field by the finer rule.
	r6 := RuleOfDegree(boundRule)
	val6, rg6 := basisOn(as.el, r6)
	var sum compsum.Sum
	var nodes [MaxNodes]int32
	var grad [MaxNodes][2]float64
	for t := 0; t < nt; t++ {
		elementNodes(m, t, &nodes)
		law := &laws[m.Region[t]]
		var e float64
		for q := range r6.W {
			hx, hy, wt, sc := d.field(t, r6, q, &val6[q], &rg6[q], &nodes, &grad, phi)
			// In a Kelvin exterior μ carries the factor sc: w'(h) of
			// the scaled material; exteriors are linear air.
			e += wt * sc * law.coEnergyDensity(math.Hypot(hx, hy))
		}
		sum.Add(e)
	}
	w := sum.Value()
	if as.axi {
		w *= 2 * math.Pi
	}
	return w, nil
}
