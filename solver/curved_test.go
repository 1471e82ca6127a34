package solver

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"polegap/mesh"
)

// curvedDisk is a P2 disk mesh of the given rings (nth nodes each, see
// diskMesh) with every ring curved (its edges on its circle), translated
// by dx along x; region 1 inside radius a, 0 outside.
func curvedDisk(t *testing.T, radii []float64, nth int, a, dx float64) *mesh.Mesh {
	t.Helper()
	m := diskMesh(radii, nth, 1, func(r float64) int32 {
		if r < a {
			return 1
		}
		return 0
	})
	curveRings(m, radii...)
	for i := range m.X {
		m.X[i] += dx
	}
	for i := range m.Arcs {
		m.Arcs[i].X += dx
	}
	mesh.Elevate(m)
	if m.Curved == nil {
		t.Fatal("no curved triangle")
	}
	return m
}

// Patch test on curved triangles (B. M. Irons, A. Razzaque, 1972; the
// isoparametric form in O. C. Zienkiewicz, R. L. Taylor, "The Finite
// Element Method", vol. 1, ch. 9-10): an isoparametric element contains
// every linear function of x and y, since x and y themselves are in the
// span of its basis, and with the degree-2 rule the residual of a linear
// potential, ∫ ∇N_i det J over the reference triangle, has the polynomial
// integrand adj(J)ᵀ∇N̂_i of degree 2 and vanishes exactly at interior
// nodes. So the solution reproduces a linear potential held on the
// boundary to rounding (1e-10), and B = (∂A/∂y, −∂A/∂x) is that of the
// linear potential at every point, including points in the bulge of a
// curved side and outside the straight corner triangles.
func TestPatchCurved(t *testing.T) {
	radii := []float64{0.2, 0.35, 0.5, 0.65, 0.8, 1}
	m := curvedDisk(t, radii, 12, 0.5, 0)
	fn := func(x, y float64) float64 { return 1 + 2*x - 3*y }
	var fixed []NodeValue
	for _, v := range boundaryNodes(m) {
		fixed = append(fixed, NodeValue{Node: v, A: fn(m.X[v], m.Y[v])})
	}
	p := &Problem{Mesh: m, Materials: []Material{linear{7}, linear{7}}, Fixed: fixed}
	s, err := Solve(p, Options{})
	checkSolution(t, s, err)
	if err != nil {
		t.Fatal(err)
	}
	var worst float64
	for i := range m.X {
		worst = math.Max(worst, math.Abs(s.A[i]-fn(m.X[i], m.Y[i])))
	}
	if worst > 1e-10 {
		t.Errorf("largest nodal error %g > 1e-10", worst)
	}
	rng := rand.New(rand.NewPCG(1, 1))
	for k := 0; k < 2000; k++ {
		// Within the mesh: its parabolic sides stay within φ⁴/512 =
		// 1.5e-4 of the unit circle for φ = 30° (mesh/curved.go).
		r, th := math.Sqrt(rng.Float64())*(1-2e-4), 2*math.Pi*rng.Float64()
		x, y := r*math.Cos(th), r*math.Sin(th)
		a, bx, by, ok := s.At(x, y)
		if !ok {
			t.Fatalf("(%g, %g) not found", x, y)
		}
		if math.Abs(a-fn(x, y)) > 1e-10 || math.Abs(bx+3) > 1e-9 || math.Abs(by+2) > 1e-9 {
			t.Errorf("(%g, %g): A = %.15g, B = (%.15g, %.15g), want %.15g, (-3, -2)", x, y, a, bx, by, fn(x, y))
		}
	}
	for e, b := range s.BTo(nil) {
		if math.Abs(b[0]+3) > 1e-9 || math.Abs(b[1]+2) > 1e-9 {
			t.Errorf("triangle %d: B = %v, want (-3, -2)", e, b)
		}
	}
	for v, b := range s.NodalBTo(nil) {
		if math.Abs(b[0]+3) > 1e-9 || math.Abs(b[1]+2) > 1e-9 {
			t.Errorf("node %d: smoothed B = %v, want (-3, -2)", v, b)
		}
	}
	// The recovered field equals the exact one: the error estimate is
	// rounding, relative to the field's energy norm √(2W).
	if _, est := s.ErrorIndicatorTo(nil); est > 1e-9*math.Sqrt(2*s.Energy()) {
		t.Errorf("error estimate %g, energy norm %g", est, math.Sqrt(2*s.Energy()))
	}
	// The field's energy is that of the uniform field over the disk's
	// curved area: ½ ν |B|² A, A = Σ TriangleArea.
	var area float64
	for e := 0; e < m.NumTriangles(); e++ {
		area += m.TriangleArea(e)
	}
	if w, want := s.Energy(), 0.5/(mu0*7)*13*area; math.Abs(w-want) > 1e-12*want {
		t.Errorf("energy %.15g, ½ν|B|²A = %.15g", w, want)
	}
}

// TestEnergyIdentityCurved repeats TestEnergyIdentity (same reference)
// on a curved disk: a current in the inner disk, A = 0 on the curved outer
// circle. Energy and the stiffness use the same rule and the same
// Jacobian at each point, so ½∫ν|B|² dΩ = ½ aᵀK a = ½∫A J dΩ to rounding
// (1e-10). The axisymmetric case puts the disk at r = 2..4.
func TestEnergyIdentityCurved(t *testing.T) {
	radii := []float64{0.2, 0.35, 0.5, 0.65, 0.8, 1}
	for _, form := range []Formulation{Planar, Axisymmetric} {
		dx := 0.0
		if form == Axisymmetric {
			dx = 3
		}
		m := curvedDisk(t, radii, 16, 0.5, dx)
		p := &Problem{Mesh: m, Formulation: form, Materials: []Material{linear{1}, linear{1}},
			CurrentDensity: []float64{0, 1e6}}
		s, err := Solve(p, Options{})
		checkSolution(t, s, err)
		if err != nil {
			t.Fatalf("%v: %v", form, err)
		}
		w := s.Energy()
		as := s.as
		a := make([]float64, as.d.n)
		for i, c := range as.d.dof {
			if c >= 0 {
				a[c] = s.A[i]
			}
		}
		f := make([]float64, as.d.n)
		if err := as.assemble(make([]float64, m.NumNodes()), f, true); err != nil {
			t.Fatal(err)
		}
		ka := make([]float64, as.d.n)
		mulVecTo(ka, as.pat.k, a)
		var aka, af float64
		for i := range a {
			aka += a[i] * ka[i]
			af -= a[i] * f[i]
		}
		scale := 1.0
		if form == Axisymmetric {
			scale = 2 * math.Pi
		}
		w2, w3 := 0.5*aka*scale, 0.5*af*scale
		t.Logf("%v: W = %.12g, ½aᵀKa = %.12g, ½∫AJ = %.12g", form, w, w2, w3)
		if math.Abs(w-w2) > 1e-10*w || math.Abs(w-w3) > 1e-10*w {
			t.Errorf("%v: energies differ: %.15g %.15g %.15g", form, w, w2, w3)
		}
		if form != Planar {
			continue
		}
		// The load is the current: Σ f = −J × the area of the curved
		// disk (partition of unity; the degree-2 rule integrates the
		// quadratic det J exactly), to rounding; that area is πa² to
		// the fraction φ⁴/480 = 5e-5 of chords spanning φ = 2π/16
		// (mesh/curved.go).
		var sum float64
		for _, c := range as.d.dof {
			if c >= 0 {
				sum -= f[c]
			}
		}
		area := m.RegionAreas()[1]
		if math.Abs(sum-1e6*area) > 1e-12*sum {
			t.Errorf("total current %.15g A, J × curved area %.15g A", sum, 1e6*area)
		}
		if want := 1e6 * math.Pi * 0.25; math.Abs(sum-want) > 5e-5*want {
			t.Errorf("total current %.15g A, J π a² = %.15g A", sum, want)
		}
	}
}

// TestCurvedFieldDifferences checks B on curved triangles against central
// differences of the potential: B = (∂A/∂y, −∂A/∂x) planar, at points in
// curved triangles (the differences, 1e-7 of the element apart, stay in
// the element; their O(d²) error and rounding are below 1e-6 relative).
func TestCurvedFieldDifferences(t *testing.T) {
	radii := []float64{0.2, 0.35, 0.5, 0.65, 0.8, 1}
	m := curvedDisk(t, radii, 16, 0.5, 0)
	p := &Problem{Mesh: m, Materials: []Material{linear{1}, linear{1}}, CurrentDensity: []float64{0, 1e6}}
	s, err := Solve(p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	n := 0
	for e := 0; e < m.NumTriangles() && n < 40; e++ {
		if !m.IsCurved(e) {
			continue
		}
		n++
		x, y, _ := m.MapAt(e, 0.3, 0.25)
		_, bx, by, _ := s.At(x, y)
		const d = 1e-8
		a1, _, _, _ := s.At(x, y+d)
		a0, _, _, _ := s.At(x, y-d)
		a3, _, _, _ := s.At(x+d, y)
		a2, _, _, _ := s.At(x-d, y)
		fx, fy := (a1-a0)/(2*d), -(a3-a2)/(2*d)
		if b := math.Hypot(bx, by); math.Abs(fx-bx) > 1e-6*b || math.Abs(fy-by) > 1e-6*b {
			t.Errorf("%s: B = (%g, %g), differences (%g, %g)", fmt.Sprint("triangle ", e), bx, by, fx, fy)
		}
	}
}
