package mesh

import "math"

// Curved second-order triangles.
//
// A model's arcs reach the mesh as chords (BuildInput), but the chords
// remember their circle: refinement splits them at points on the arc
// (refine.go), and Elevate puts the midside node of every edge that is the
// chord of an arc on the arc, at the point halfway round it. A triangle
// with such a node is curved: it is the image of the reference triangle
// (0,0), (1,0), (0,1) under the quadratic map of its six nodes,
//
//	x(ξ, η) = Σ N_i(ξ, η) x_i,   N_k = L_k (2 L_k − 1),  N_{3+k} = 4 L_{k+1} L_{k+2},
//
// with L0 = 1 − ξ − η, L1 = ξ, L2 = η: the same quadratic functions that
// carry the field, so the element is isoparametric (O. C. Zienkiewicz and
// R. L. Taylor, "The Finite Element Method", vol. 1, 5th ed., 2000,
// ch. 9; M. Zlámal, "Curved elements in the finite element method. I",
// SIAM J. Numer. Anal. 10, 1973, 229-240; both from memory). Its side on
// the arc is the parabola through the arc's two end points and its middle
// point, within R φ⁴/512 of the circle for a chord spanning φ radians. The
// parabolic segment over the chord has (2/3) c s for chord c and sagitta s
// (Archimedes' quadrature of the parabola), short of the circular segment
// R² (φ − sin φ)/2 by R² φ⁵/960 + O(φ⁷): a disc of curved triangles misses
// a fraction φ⁴/480 of its area where straight chords miss φ²/6 (see
// curved_test.go).
//
// Every other triangle stays the affine image of its corners, and code that
// integrates over triangles keeps its affine path for them: most triangles
// of a mesh are straight, and a mesh without arcs is exactly what it was
// before curved elements existed.
//
// Only an edge whose two ends lie on the arc is curved (or split on the
// arc by refinement): where another edge crossed a chord of the arc, the
// crossing vertex lies on the chord, and the pieces next to it stay
// straight. Elevate also keeps an arc edge straight when curving it would
// make the
// Jacobian of a neighbouring triangle smaller than a quarter of the
// straight triangle's anywhere at the corners, edge midpoints and centroid
// (a chord spanning a large angle next to a thin triangle); the model's
// chords, at most 30 degrees and a small fraction of the element size
// from their arcs, never come near that.

// Arc is a circle that curved edges lie on: centre (X, Y) and radius R,
// metres.
type Arc struct{ X, Y, R float64 }

// project returns the point of the circle nearest (x, y), or ok = false
// when (x, y) is its centre.
func (a Arc) project(x, y float64) (px, py float64, ok bool) {
	dx, dy := x-a.X, y-a.Y
	d := math.Hypot(dx, dy)
	if !(d > 0) || !(a.R > 0) {
		return x, y, false
	}
	s := a.R / d
	return a.X + s*dx, a.Y + s*dy, true
}

// holds reports whether (x, y) lies on the circle, to 1e-9 of its radius
// and position (rounding of points placed on it is far smaller; a vertex
// where an edge crossed a chord of the arc, computed on the chord, is
// usually much farther).
func (a Arc) holds(x, y float64) bool {
	return math.Abs(math.Hypot(x-a.X, y-a.Y)-a.R) <= 1e-9*(a.R+math.Abs(a.X)+math.Abs(a.Y))
}

// pointAt returns the point of the circle at straight distance d from
// its point (ax, ay), on the side of the shorter arc towards (bx, by): at
// the angle 2 asin(d/2R) from a about the centre.
func (a Arc) pointAt(ax, ay, bx, by, d float64) (px, py float64, ok bool) {
	if !(a.R > 0) || !(d > 0) || d >= 2*a.R {
		return ax, ay, false
	}
	ux, uy := ax-a.X, ay-a.Y
	vx, vy := bx-a.X, by-a.Y
	psi := 2 * math.Asin(d/(2*a.R))
	if ux*vy-uy*vx < 0 {
		psi = -psi
	}
	a0 := math.Atan2(uy, ux)
	return a.X + a.R*math.Cos(a0+psi), a.Y + a.R*math.Sin(a0+psi), true
}

// IsCurved reports whether triangle t is curved (see Mesh.Curved).
func (m *Mesh) IsCurved(t int) bool { return m.Curved != nil && m.Curved[t] }

// p2Basis returns the six quadratic shape functions at (xi, eta) and their
// derivatives along ξ and η, in the node order of Mesh (corners, then the
// node of edge k opposite corner k).
func p2Basis(xi, eta float64) (n, dxi, deta [6]float64) {
	l := [3]float64{1 - xi - eta, xi, eta}
	dl := [3][2]float64{{-1, -1}, {1, 0}, {0, 1}}
	for k := 0; k < 3; k++ {
		n[k] = l[k] * (2*l[k] - 1)
		s := 4*l[k] - 1
		dxi[k], deta[k] = s*dl[k][0], s*dl[k][1]
		a, b := (k+1)%3, (k+2)%3
		n[3+k] = 4 * l[a] * l[b]
		dxi[3+k] = 4 * (dl[a][0]*l[b] + l[a]*dl[b][0])
		deta[3+k] = 4 * (dl[a][1]*l[b] + l[a]*dl[b][1])
	}
	return
}

// nodes6 returns the six node indices of triangle t of a second-order mesh.
func (m *Mesh) nodes6(t int) [6]int32 {
	return [6]int32{m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2], m.Mid[3*t], m.Mid[3*t+1], m.Mid[3*t+2]}
}

// MapAt returns the point of triangle t at reference coordinates (xi, eta)
// and the Jacobian of the map there, jac = [[∂x/∂ξ, ∂x/∂η], [∂y/∂ξ, ∂y/∂η]]:
// the quadratic map of the six nodes for a curved triangle, the affine map
// of the corners otherwise.
func (m *Mesh) MapAt(t int, xi, eta float64) (x, y float64, jac [2][2]float64) {
	if !m.IsCurved(t) {
		i0, i1, i2 := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		x0, y0 := m.X[i0], m.Y[i0]
		a, b := m.X[i1]-x0, m.X[i2]-x0
		c, d := m.Y[i1]-y0, m.Y[i2]-y0
		return x0 + a*xi + b*eta, y0 + c*xi + d*eta, [2][2]float64{{a, b}, {c, d}}
	}
	n, dxi, deta := p2Basis(xi, eta)
	for i, v := range m.nodes6(t) {
		px, py := m.X[v], m.Y[v]
		x += n[i] * px
		y += n[i] * py
		jac[0][0] += dxi[i] * px
		jac[0][1] += deta[i] * px
		jac[1][0] += dxi[i] * py
		jac[1][1] += deta[i] * py
	}
	return x, y, jac
}

// detAt returns the Jacobian determinant of triangle t at (xi, eta).
func (m *Mesh) detAt(t int, xi, eta float64) float64 {
	_, _, j := m.MapAt(t, xi, eta)
	return j[0][0]*j[1][1] - j[0][1]*j[1][0]
}

// TriangleArea returns the area of triangle t in m²: the area of the
// corner triangle, or for a curved triangle the integral of its Jacobian
// determinant (a quadratic, integrated exactly by the edge-midpoint rule).
func (m *Mesh) TriangleArea(t int) float64 {
	if !m.IsCurved(t) {
		a, b, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		return triArea(m.X[a], m.Y[a], m.X[b], m.Y[b], m.X[c], m.Y[c])
	}
	return (m.detAt(t, 0.5, 0.5) + m.detAt(t, 0, 0.5) + m.detAt(t, 0.5, 0)) / 6
}

// jacobianSamples are the reference points where curved triangles must
// keep a positive Jacobian: corners, edge midpoints, centroid.
var jacobianSamples = [7][2]float64{{0, 0}, {1, 0}, {0, 1}, {0.5, 0.5}, {0, 0.5}, {0.5, 0}, {1.0 / 3, 1.0 / 3}}

// minCurvedJacobian is the smallest Jacobian a curved triangle may have at
// the sample points, as a fraction of its corner triangle's.
const minCurvedJacobian = 0.25

// curvedValid reports whether the quadratic map of triangle t (a
// second-order mesh, curved or not) keeps its Jacobian above
// minCurvedJacobian times the corner triangle's at the sample points.
func (m *Mesh) curvedValid(t int) bool {
	a, b, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
	det0 := 2 * triArea(m.X[a], m.Y[a], m.X[b], m.Y[b], m.X[c], m.Y[c])
	for _, p := range jacobianSamples {
		_, dxi, deta := p2Basis(p[0], p[1])
		var j00, j01, j10, j11 float64
		for i, v := range m.nodes6(t) {
			j00 += dxi[i] * m.X[v]
			j01 += deta[i] * m.X[v]
			j10 += dxi[i] * m.Y[v]
			j11 += deta[i] * m.Y[v]
		}
		if !(j00*j11-j01*j10 >= minCurvedJacobian*det0) {
			return false
		}
	}
	return true
}

// Reference returns the reference coordinates (ξ, η) of the point (x, y)
// of triangle t, inverting its map (see MapAt): in closed form for a
// straight triangle, by Newton's method for a curved one (ok = false if
// Newton does not converge, which for a valid curved triangle happens only
// far outside it). The point lies in the triangle when ξ, η and 1 − ξ − η
// are all >= 0.
func (m *Mesh) Reference(t int, x, y float64) (xi, eta float64, ok bool) {
	a, b, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
	ax, ay, bx, by, cx, cy := m.X[a], m.Y[a], m.X[b], m.Y[b], m.X[c], m.Y[c]
	area := triArea(ax, ay, bx, by, cx, cy)
	xi = triArea(ax, ay, x, y, cx, cy) / area
	eta = triArea(ax, ay, bx, by, x, y) / area
	if !m.IsCurved(t) {
		return xi, eta, true
	}
	// The straight triangle's coordinates are the starting guess; the
	// curved map differs from it by a small fraction of the element, so
	// Newton's quadratic convergence reaches rounding in a few steps.
	// Reference coordinates are of order 1: a step below 1e-12 is
	// rounding whatever the element's size and position.
	step := math.Inf(1)
	for it := 0; it < 20; it++ {
		px, py, j := m.MapAt(t, xi, eta)
		rx, ry := x-px, y-py
		det := j[0][0]*j[1][1] - j[0][1]*j[1][0]
		if !(det != 0) {
			return xi, eta, false
		}
		dxi := (j[1][1]*rx - j[0][1]*ry) / det
		deta := (-j[1][0]*rx + j[0][0]*ry) / det
		xi += dxi
		eta += deta
		step = math.Abs(dxi) + math.Abs(deta)
		if step <= 1e-12 {
			return xi, eta, true
		}
		if math.Abs(xi) > 1e3 || math.Abs(eta) > 1e3 || math.IsNaN(xi+eta) {
			return xi, eta, false
		}
	}
	return xi, eta, step <= 1e-9
}

// curvedBox returns the bounding box of curved triangle t: its curved sides
// are quadratic Bézier curves whose control points are the end nodes and
// 2 m − (a + b)/2 for midside node m, and a Bézier curve lies in the hull
// of its control points.
func (m *Mesh) curvedBox(t int) (x0, y0, x1, y1 float64) {
	x0, y0 = math.Inf(1), math.Inf(1)
	x1, y1 = math.Inf(-1), math.Inf(-1)
	add := func(x, y float64) {
		x0, x1 = math.Min(x0, x), math.Max(x1, x)
		y0, y1 = math.Min(y0, y), math.Max(y1, y)
	}
	for k := 0; k < 3; k++ {
		v := m.Tri[3*t+k]
		add(m.X[v], m.Y[v])
		a, b, c := m.Tri[3*t+(k+1)%3], m.Tri[3*t+(k+2)%3], m.Mid[3*t+k]
		add(2*m.X[c]-0.5*(m.X[a]+m.X[b]), 2*m.Y[c]-0.5*(m.Y[a]+m.Y[b]))
	}
	return
}
