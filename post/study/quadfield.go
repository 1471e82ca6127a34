package study

import (
	"polegap/mesh"
	"polegap/solver"
)

// QuadField evaluates a solution element by element at the points of a
// quadrature rule: the potential, the flux density and the integration
// weight. It is the kernel shared by the integrals of post/quantity
// (circuit, force); it holds the tabulated shape functions and never
// allocates after NewQuadField. On a curved triangle (mesh.Mesh.Curved) the
// point, the weight and B come from the quadratic map of its six nodes,
// its Jacobian evaluated at each quadrature point, as the solver does.
type QuadField struct {
	Mesh *mesh.Mesh
	A    []float64
	Axi  bool
	Rule *solver.Rule

	el  solver.Element
	nn  int
	val [][solver.MaxNodes]float64
	rg  [][solver.MaxNodes][2]float64
}

// QuadPoint is the field at one quadrature point of one element.
type QuadPoint struct {
	W      float64 // integration weight: area share, times 2π r when axisymmetric (m² or m³)
	X, Y   float64 // position (m); r, z when axisymmetric
	A      float64 // potential (Wb/m)
	Bx, By float64 // flux density (T); Br, Bz when axisymmetric
}

// NewQuadField prepares the evaluation of sol with the Dunavant rule of degree
// deg (solver.RuleOfDegree). It panics if sol is nil.
func NewQuadField(sol *solver.Solution, deg int) *QuadField {
	if sol == nil || sol.Problem == nil || sol.Problem.Mesh == nil {
		panic(errNilSolution)
	}
	m := sol.Problem.Mesh
	f := &QuadField{Mesh: m, A: sol.A, Axi: sol.Problem.Formulation == solver.Axisymmetric, Rule: solver.RuleOfDegree(deg)}
	if m.Order() == 2 {
		f.el = solver.P2{}
	} else {
		f.el = solver.P1{}
	}
	f.nn = f.el.NumNodes()
	nq := f.Rule.NumPoints()
	f.val = make([][solver.MaxNodes]float64, nq)
	f.rg = make([][solver.MaxNodes][2]float64, nq)
	for q := 0; q < nq; q++ {
		xi, eta := f.Rule.Point(q)
		f.el.EvalTo(f.val[q][:], f.rg[q][:], xi, eta)
	}
	return f
}

// Order returns the polynomial degree of the mesh's elements (1 or 2).
func (f *QuadField) Order() int { return f.el.Degree() }

// NumPoints returns the number of quadrature points per element.
func (f *QuadField) NumPoints() int { return f.Rule.NumPoints() }

// At returns the field at quadrature point q of triangle t.
func (f *QuadField) At(t, q int) QuadPoint {
	m := f.Mesh
	i0, i1, i2 := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
	x0, y0 := m.X[i0], m.Y[i0]
	ja, jb := m.X[i1]-x0, m.X[i2]-x0
	jc, jd := m.Y[i1]-y0, m.Y[i2]-y0
	det := ja*jd - jb*jc
	inv := 1 / det
	xi, eta := f.Rule.Point(q)
	p := QuadPoint{X: x0 + ja*xi + jb*eta, Y: y0 + jc*xi + jd*eta, W: f.Rule.W[q] * 0.5 * det}
	var nodes [solver.MaxNodes]int32
	nodes[0], nodes[1], nodes[2] = i0, i1, i2
	if f.nn == 6 {
		nodes[3], nodes[4], nodes[5] = m.Mid[3*t], m.Mid[3*t+1], m.Mid[3*t+2]
	}
	val, rg := &f.val[q], &f.rg[q]
	if m.IsCurved(t) {
		var x, y float64
		ja, jb, jc, jd = 0, 0, 0, 0
		for i := 0; i < 6; i++ {
			px, py := m.X[nodes[i]], m.Y[nodes[i]]
			x += val[i] * px
			y += val[i] * py
			ja += rg[i][0] * px
			jb += rg[i][1] * px
			jc += rg[i][0] * py
			jd += rg[i][1] * py
		}
		det = ja*jd - jb*jc
		inv = 1 / det
		p.X, p.Y, p.W = x, y, f.Rule.W[q]*0.5*det
	}
	var gx, gy float64
	for i := 0; i < f.nn; i++ {
		ai := f.A[nodes[i]]
		p.A += ai * val[i]
		gx += ai * (jd*rg[i][0] - jc*rg[i][1]) * inv
		gy += ai * (-jb*rg[i][0] + ja*rg[i][1]) * inv
	}
	if !f.Axi {
		p.Bx, p.By = gy, -gx
		return p
	}
	// Quadrature points are interior, so r > 0 on every element that
	// has positive area.
	p.W *= twoPi * p.X
	p.Bx, p.By = -gy, gx+p.A/p.X
	return p
}

// LinearGrad returns, at quadrature point q of triangle t, the gradient of
// the function that is linear in the reference coordinates with values g0,
// g1, g2 at the corners: the triangle's P1 function, isoparametric on a
// curved triangle (whose map's Jacobian at the point it uses), so that it
// stays continuous across curved sides as the P2 field does.
func (f *QuadField) LinearGrad(t, q int, g0, g1, g2 float64) (gx, gy float64) {
	m := f.Mesh
	i0, i1, i2 := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
	x0, y0 := m.X[i0], m.Y[i0]
	ja, jb := m.X[i1]-x0, m.X[i2]-x0
	jc, jd := m.Y[i1]-y0, m.Y[i2]-y0
	if m.IsCurved(t) {
		nodes := [6]int32{i0, i1, i2, m.Mid[3*t], m.Mid[3*t+1], m.Mid[3*t+2]}
		rg := &f.rg[q]
		ja, jb, jc, jd = 0, 0, 0, 0
		for i, v := range nodes {
			ja += rg[i][0] * m.X[v]
			jb += rg[i][1] * m.X[v]
			jc += rg[i][0] * m.Y[v]
			jd += rg[i][1] * m.Y[v]
		}
	}
	det := ja*jd - jb*jc
	d1, d2 := g1-g0, g2-g0
	return (jd*d1 - jc*d2) / det, (-jb*d1 + ja*d2) / det
}
