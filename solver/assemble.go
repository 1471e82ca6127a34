package solver

import (
	"math"
	"sync"

	"polegap/internal/num"
	"polegap/mesh"
)

// assembler evaluates the Galerkin forms of one problem. With the curl
// vector c_i of basis function N_i (planar: (∂N/∂y, −∂N/∂x); axisymmetric:
// (−∂N/∂z, ∂N/∂r + N/r)) and B = Σ a_i c_i, it computes per element
//
//	residual  r_i  = ∫ (ν(|B|²) B − M)·c_i − J N_i  dΩ
//	tangent   k_ij = ∫ ν c_i·c_j + 2 ν'(|B|²) (B·c_i)(B·c_j)  dΩ
//
// with dΩ = dx dy (planar) or r dr dz (axisymmetric, per radian). The
// tangent is the exact Jacobian of the residual; for a linear material it is
// the stiffness matrix and r = K a − f.
type assembler struct {
	p     *Problem
	m     *mesh.Mesh
	el    Element
	nn    int
	axi   bool
	rule  *Rule
	val   [][MaxNodes]float64    // basis values at the quadrature points
	rgrad [][MaxNodes][2]float64 // reference gradients at the quadrature points
	d     dofMap
	pat   *pattern
	rtol  float64            // nodes with |r| <= rtol lie on the axis
	ext   map[int32]Exterior // Kelvin image regions (axisymmetric)
	errs  []error            // per worker

	// generic, when set (tests only), disables the closed-form P1 kernel.
	generic bool
	// secant makes the matrix K(ν) without the 2ν'(B·c_i)(B·c_j) term
	// (fixed-point steps).
	secant bool

	// source, when set (tests only), adds a space-dependent current
	// density J(x, y) to the region's.
	source func(x, y float64) float64

	// loc is the point locator of the mesh, shared by the copies
	// withProblem makes (all solutions of one Prepared).
	loc *lazyLocator
}

// lazyLocator builds a mesh's point locator on first use.
type lazyLocator struct {
	once sync.Once
	loc  *mesh.Locator
}

func (l *lazyLocator) get(m *mesh.Mesh) *mesh.Locator {
	l.once.Do(func() {
		if l.loc == nil {
			l.loc = mesh.NewLocator(m)
		}
	})
	return l.loc
}

// quadratureDegree picks the rule: exact for the linear stiffness and a
// region-constant source in the planar case; for the axisymmetric case the
// integrand carries r and 1/r, and a rule two degrees higher is used.
func quadratureDegree(order int, f Formulation) int {
	switch {
	case order == 1 && f == Planar:
		return 1
	case order == 2 && f == Planar:
		return 2
	case order == 1:
		return 3
	default:
		return 4
	}
}

// newAssembler sets up the assembly of p with the numbering d for the
// given number of workers. pat, when not nil, is the pattern to use (the numbering d on a mesh of
// the same topology); nil builds one.
func newAssembler(p *Problem, d dofMap, workers int, pat *pattern) *assembler {
	m := p.Mesh
	as := &assembler{p: p, m: m, el: elementFor(m.Order()), axi: p.Formulation == Axisymmetric, d: d,
		loc: &lazyLocator{loc: p.Locator}}
	as.nn = as.el.NumNodes()
	as.rtol = axisTol(m)
	if len(p.Exterior) > 0 {
		as.ext = make(map[int32]Exterior, len(p.Exterior))
		for _, e := range p.Exterior {
			as.ext[e.Region] = e
		}
	}
	deg := quadratureDegree(m.Order(), p.Formulation)
	if as.axi && deg == 3 {
		deg = 4 // Dunavant's degree-3 rule has a negative weight; avoid it in a nonlinear tangent
	}
	as.rule = RuleOfDegree(deg)
	nq := as.rule.NumPoints()
	as.val = make([][MaxNodes]float64, nq)
	as.rgrad = make([][MaxNodes][2]float64, nq)
	for q := 0; q < nq; q++ {
		xi, eta := as.rule.Point(q)
		as.el.EvalTo(as.val[q][:], as.rgrad[q][:], xi, eta)
	}
	if pat == nil {
		pat = buildPattern(m, &as.d, workers)
	}
	as.pat = pat
	return as
}

// elemWork is one worker's element buffers.
type elemWork struct {
	nodes [MaxNodes]int32
	a     [MaxNodes]float64
	ke    [MaxNodes][MaxNodes]float64
	re    [MaxNodes]float64
	c     [MaxNodes][2]float64
	err   error
}

// gather loads the potentials of triangle t's nodes.
func (as *assembler) gather(t int, A []float64, w *elemWork) {
	elementNodes(as.m, t, &w.nodes)
	for i := 0; i < as.nn; i++ {
		w.a[i] = A[w.nodes[i]]
	}
}

// affine returns the corner coordinates and the Jacobian entries
// (x1−x0, x2−x0, y1−y0, y2−y0) and its determinant (twice the area).
func (as *assembler) affine(t int) (x0, y0, a, b, c, d, det float64) {
	m := as.m
	i0, i1, i2 := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
	x0, y0 = m.X[i0], m.Y[i0]
	a, b = m.X[i1]-x0, m.X[i2]-x0
	c, d = m.Y[i1]-y0, m.Y[i2]-y0
	det = a*d - b*c
	return
}

// curlAt fills w.c with the curl vectors at quadrature point q of the
// straight triangle t with the affine map (x0, y0, a, b, c, d, det) and
// returns the integration weight (including r for axisymmetry) and the
// physical point.
func (as *assembler) curlAt(t, q int, w *elemWork, x0, y0, a, b, c, d, det float64) (wt, x, y float64) {
	xi, eta := as.rule.Point(q)
	x = x0 + a*xi + b*eta
	y = y0 + c*xi + d*eta
	wt = as.curlWith(q, w, x, a, b, c, d, det)
	return
}

// curlCurved is curlAt for a curved triangle whose nodes are in w.nodes:
// the Jacobian of its quadratic map is evaluated at the quadrature point.
func (as *assembler) curlCurved(q int, w *elemWork) (wt, x, y float64) {
	x, y, a, b, c, d, det := isoAt(as.m, &w.nodes, &as.val[q], &as.rgrad[q])
	return as.curlWith(q, w, x, a, b, c, d, det), x, y
}

// isoAt returns the point and the Jacobian (a, b, c, d) = (∂x/∂ξ, ∂x/∂η,
// ∂y/∂ξ, ∂y/∂η) with its determinant of the quadratic (isoparametric) map
// of a curved triangle with the given six nodes, at the reference point
// where the P2 basis has values val and reference gradients rg.
func isoAt(m *mesh.Mesh, nodes *[MaxNodes]int32, val *[MaxNodes]float64, rg *[MaxNodes][2]float64) (x, y, a, b, c, d, det float64) {
	for i := 0; i < 6; i++ {
		px, py := m.X[nodes[i]], m.Y[nodes[i]]
		x += val[i] * px
		y += val[i] * py
		a += rg[i][0] * px
		b += rg[i][1] * px
		c += rg[i][0] * py
		d += rg[i][1] * py
	}
	det = a*d - b*c
	return
}

// curlWith fills w.c with the curl vectors at quadrature point q for the
// Jacobian (a, b, c, d, det) there, x being the radius when axisymmetric,
// and returns the integration weight.
func (as *assembler) curlWith(q int, w *elemWork, x, a, b, c, d, det float64) (wt float64) {
	wt = as.rule.W[q] * 0.5 * det
	inv := 1 / det
	rg := &as.rgrad[q]
	if !as.axi {
		for i := 0; i < as.nn; i++ {
			gx := (d*rg[i][0] - c*rg[i][1]) * inv
			gy := (-b*rg[i][0] + a*rg[i][1]) * inv
			w.c[i] = [2]float64{gy, -gx}
		}
		return
	}
	wt *= x
	v := &as.val[q]
	for i := 0; i < as.nn; i++ {
		gr := (d*rg[i][0] - c*rg[i][1]) * inv
		gz := (-b*rg[i][0] + a*rg[i][1]) * inv
		w.c[i] = [2]float64{-gz, gr + v[i]/x}
	}
	return
}

// element computes the residual (and, if wantK, the tangent) of triangle t
// for the potentials in w.a. It returns false after storing a
// *MaterialError in w.err when a material misbehaves.
func (as *assembler) element(t int, w *elemWork, wantK bool) bool {
	nn := as.nn
	reg := as.m.Region[t]
	mat := as.p.Materials[reg]
	var jz float64
	if int(reg) < len(as.p.CurrentDensity) {
		jz = as.p.CurrentDensity[reg]
	}
	var mg [2]float64
	if int(reg) < len(as.p.Magnetization) {
		mg = as.p.Magnetization[reg]
	}
	if as.nn == 3 && !as.axi && !as.generic && as.ext == nil {
		return as.elementP1(t, w, wantK, reg, mat, jz, mg)
	}
	w.re = [MaxNodes]float64{}
	if wantK {
		w.ke = [MaxNodes][MaxNodes]float64{}
	}
	ext, isExt := as.ext[reg]
	x0, y0, a, b, c, d, det := as.affine(t)
	curved := as.m.IsCurved(t)
	for q := range as.rule.W {
		var wt, x, y float64
		if curved {
			wt, x, y = as.curlCurved(q, w)
		} else {
			wt, x, y = as.curlAt(t, q, w, x0, y0, a, b, c, d, det)
		}
		var bx, by float64
		for i := 0; i < nn; i++ {
			bx += w.a[i] * w.c[i][0]
			by += w.a[i] * w.c[i][1]
		}
		b2 := bx*bx + by*by
		nu, dnu := mat.Nu(b2)
		if !(nu > 0) || math.IsInf(nu, 0) || !num.Finite(dnu) {
			w.err = &MaterialError{Region: reg, B2: b2, Nu: nu, DNu: dnu}
			return false
		}
		if isExt {
			f := ((x-ext.CX)*(x-ext.CX) + (y-ext.CY)*(y-ext.CY)) / (ext.Radius * ext.Radius)
			nu, dnu = nu*f, dnu*f
		}
		src := jz
		if as.source != nil {
			src += as.source(x, y)
		}
		hx, hy := nu*bx-mg[0], nu*by-mg[1]
		v := &as.val[q]
		for i := 0; i < nn; i++ {
			w.re[i] += wt * (hx*w.c[i][0] + hy*w.c[i][1] - src*v[i])
		}
		if !wantK {
			continue
		}
		two := 2 * dnu
		if as.secant {
			two = 0
		}
		for i := 0; i < nn; i++ {
			ci := w.c[i]
			bci := bx*ci[0] + by*ci[1]
			for j := i; j < nn; j++ {
				cj := w.c[j]
				k := nu*(ci[0]*cj[0]+ci[1]*cj[1]) + two*bci*(bx*cj[0]+by*cj[1])
				w.ke[i][j] += wt * k
			}
		}
	}
	if wantK {
		for i := 0; i < nn; i++ {
			for j := 0; j < i; j++ {
				w.ke[i][j] = w.ke[j][i]
			}
		}
	}
	return true
}

// assemble writes the residual over the unknowns into r (len d.n) and, if
// wantK, the tangent into the pattern's matrix values, for the nodal
// potentials A (fixed nodes at their values). Workers own disjoint
// slabs of rows, so no two of them write the same entry.
func (as *assembler) assemble(A, r []float64, wantK bool) error {
	for i := range r {
		r[i] = 0
	}
	if wantK {
		for i := range as.pat.k.Val {
			as.pat.k.Val[i] = 0
		}
	}
	parts := as.pat.parts
	if len(as.errs) != len(parts) {
		as.errs = make([]error, len(parts))
	}
	errs := as.errs
	if len(parts) == 1 {
		errs[0] = as.assemblePart(0, A, r, wantK)
	} else {
		var wg sync.WaitGroup
		for w := range parts {
			wg.Add(1)
			go func(w int) {
				defer wg.Done()
				errs[w] = as.assemblePart(w, A, r, wantK)
			}(w)
		}
		wg.Wait()
	}
	for _, err := range errs {
		if err != nil {
			return err
		}
	}
	for _, pc := range as.p.PointCurrents {
		if c := as.d.dof[pc.Node]; c >= 0 {
			r[c] -= pc.Current
		}
	}
	return nil
}

func (as *assembler) assemblePart(wk int, A, r []float64, wantK bool) error {
	var w elemWork
	pt := &as.pat.parts[wk]
	owner := as.pat.owner
	single := len(as.pat.parts) == 1
	nn := as.nn
	val := as.pat.k.Val
	pos := as.pat.pos
	dof := as.d.dof
	for _, t32 := range pt.elems {
		t := int(t32)
		as.gather(t, A, &w)
		if !as.element(t, &w, wantK) {
			return w.err
		}
		base := t * nn * nn
		for i := 0; i < nn; i++ {
			ri := dof[w.nodes[i]]
			if ri < 0 || !single && int(owner[ri]) != wk {
				continue
			}
			r[ri] += w.re[i]
			if !wantK {
				continue
			}
			pi := pos[base+i*nn : base+i*nn+nn]
			for j, p := range pi {
				if p >= 0 {
					val[p] += w.ke[i][j]
				}
			}
		}
	}
	return nil
}

// elementP1 is element for the planar P1 triangle in closed form: constant
// gradients, one quadrature point (exact for ν constant per element, which
// it is since B is).
func (as *assembler) elementP1(t int, w *elemWork, wantK bool, reg int32, mat Material, jz float64, mg [2]float64) bool {
	m := as.m
	i0, i1, i2 := w.nodes[0], w.nodes[1], w.nodes[2]
	x0, y0, x1, y1, x2, y2 := m.X[i0], m.Y[i0], m.X[i1], m.Y[i1], m.X[i2], m.Y[i2]
	det := (x1-x0)*(y2-y0) - (x2-x0)*(y1-y0)
	inv := 1 / det
	// Curl vectors (∂N/∂y, −∂N/∂x).
	c0x, c0y := (x2-x1)*inv, (y2-y1)*inv
	c1x, c1y := (x0-x2)*inv, (y0-y2)*inv
	c2x, c2y := (x1-x0)*inv, (y1-y0)*inv
	bx := w.a[0]*c0x + w.a[1]*c1x + w.a[2]*c2x
	by := w.a[0]*c0y + w.a[1]*c1y + w.a[2]*c2y
	b2 := bx*bx + by*by
	nu, dnu := mat.Nu(b2)
	if !(nu > 0) || math.IsInf(nu, 0) || !num.Finite(dnu) {
		w.err = &MaterialError{Region: reg, B2: b2, Nu: nu, DNu: dnu}
		return false
	}
	area := 0.5 * det
	if as.source != nil {
		jz += as.source((x0+x1+x2)/3, (y0+y1+y2)/3)
	}
	hx, hy := area*(nu*bx-mg[0]), area*(nu*by-mg[1])
	f := jz * area / 3
	w.re[0] = hx*c0x + hy*c0y - f
	w.re[1] = hx*c1x + hy*c1y - f
	w.re[2] = hx*c2x + hy*c2y - f
	if !wantK {
		return true
	}
	an := area * nu
	k00 := an * (c0x*c0x + c0y*c0y)
	k01 := an * (c0x*c1x + c0y*c1y)
	k02 := an * (c0x*c2x + c0y*c2y)
	k11 := an * (c1x*c1x + c1y*c1y)
	k12 := an * (c1x*c2x + c1y*c2y)
	k22 := an * (c2x*c2x + c2y*c2y)
	if dnu != 0 && !as.secant {
		g := 2 * dnu * area
		p0, p1, p2 := bx*c0x+by*c0y, bx*c1x+by*c1y, bx*c2x+by*c2y
		k00 += g * p0 * p0
		k01 += g * p0 * p1
		k02 += g * p0 * p2
		k11 += g * p1 * p1
		k12 += g * p1 * p2
		k22 += g * p2 * p2
	}
	w.ke[0][0], w.ke[0][1], w.ke[0][2] = k00, k01, k02
	w.ke[1][0], w.ke[1][1], w.ke[1][2] = k01, k11, k12
	w.ke[2][0], w.ke[2][1], w.ke[2][2] = k02, k12, k22
	return true
}

// withProblem returns a shallow copy of the assembler that reads materials
// and sources from p (same mesh, numbering and pattern).
func (as *assembler) withProblem(p *Problem) *assembler {
	c := *as
	c.p = p
	c.errs = nil
	c.d.value = append([]float64(nil), as.d.value...)
	return &c
}

// workers returns the number of goroutines the assembler was set up for.
func (as *assembler) workers() int { return len(as.pat.parts) }
