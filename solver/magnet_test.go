package solver

import (
	"fmt"
	"math"
	"testing"
)

// A long cylinder (radius a) magnetised uniformly across its axis with M
// (recoil permeability μ0): the transverse demagnetising factor of a
// circular cylinder is 1/2, so inside B = μ0 M/2 and H = −M/2, uniform
// (Jackson, "Classical Electrodynamics", 3rd ed., 1999, sec. 5.10 for the
// sphere, the same method in 2D; J. A. Osborn, "Demagnetizing factors of
// the general ellipsoid", Phys. Rev. 67, 1945: N = 1/2 for the infinite
// cylinder). Outside, A = μ0 M a² sin θ/(2r), imposed on the outer circle.
func TestMagnetizedCylinder(t *testing.T) {
	const M, a, R = 1e6, 0.1, 0.4
	for _, c := range []struct {
		order int
		tol   float64 // DESIGN.md: 0.5 % P1, 0.1 % P2
	}{{1, 5e-3}, {2, 1e-3}} {
		name := fmt.Sprintf("P%d", c.order)
		const nth = 96
		var radii []float64
		for k := 1; k <= 12; k++ {
			radii = append(radii, a*float64(k)/12)
		}
		radii = append(radii, geometricRadii(a, R, nth)[1:]...)
		m := diskMesh(radii, nth, c.order, func(r float64) int32 {
			if r < a {
				return 1
			}
			return 0
		})
		var fixed []NodeValue
		for _, i := range boundaryNodes(m) {
			r := math.Hypot(m.X[i], m.Y[i])
			fixed = append(fixed, NodeValue{Node: i, A: mu0 * M * a * a / (2 * r * r) * m.Y[i]})
		}
		// M along +x; with ν = ν0 the magnet's H = ν0 B − M.
		p := &Problem{Mesh: m, Materials: []Material{linear{1}, linear{1}},
			Magnetization: [][2]float64{{}, {M, 0}}, Fixed: fixed}
		s, err := Solve(p, Options{})
		checkSolution(t, s, err)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		want := mu0 * M / 2
		var worst float64
		for _, pt := range [][2]float64{{0.001, 0.001}, {0.04, 0.03}, {-0.05, -0.06}, {0.07, -0.02}} {
			_, bx, by, ok := s.At(pt[0], pt[1])
			if !ok {
				t.Fatalf("%s: %v not found", name, pt)
			}
			worst = math.Max(worst, math.Hypot(bx-want, by)/want)
		}
		h := s.HTo(nil)
		for e := range h {
			if m.Region[e] == 1 {
				worst = math.Max(worst, math.Hypot(h[e][0]+M/2, h[e][1])/(M/2))
				break
			}
		}
		t.Logf("%s: B inside %.6g T expected, worst relative error %.3g", name, want, worst)
		if worst > c.tol {
			t.Errorf("%s: relative error %.3g > %g", name, worst, c.tol)
		}
	}
}

// Periodic identification: on the unit square with the left and right
// edges joined (Identify) and A = 0 on the top and bottom, a uniform J gives
// the one-dimensional profile A = μ0 J y(1−y)/2 (the field of an infinite
// current sheet between two zero-potential planes; direct integration of
// −ν A” = J). P2 reproduces the quadratic exactly: 1e-10 of the peak
// (rounding). P1 on this mesh (nodes meeting 4 or 8 triangles get
// different loads) is second order: capped at h² = 1e-2 of the peak.
func TestPeriodicIdentify(t *testing.T) {
	const J = 1e5
	for order := 1; order <= 2; order++ {
		name := fmt.Sprintf("P%d", order)
		m := rectMesh(8, 10, 0, 1, 0, 1, order, nil)
		var pairs [][2]int32
		left := map[float64]int32{}
		for i := range m.X {
			if m.X[i] == 0 {
				left[m.Y[i]] = int32(i)
			}
		}
		for i := range m.X {
			if m.X[i] == 1 {
				pairs = append(pairs, [2]int32{left[m.Y[i]], int32(i)})
			}
		}
		p := &Problem{Mesh: m, Materials: []Material{linear{1}}, CurrentDensity: []float64{J},
			Boundary: map[int32]Condition{2: FluxNormal, 4: FluxNormal}, Identify: pairs}
		s, err := Solve(p, Options{})
		checkSolution(t, s, err)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		peak := mu0 * J / 8
		var worst float64
		for i := range m.X {
			y := m.Y[i]
			worst = math.Max(worst, math.Abs(s.A[i]-mu0*J*y*(1-y)/2)/peak)
		}
		for _, pr := range pairs {
			if s.A[pr[0]] != s.A[pr[1]] {
				t.Errorf("%s: identified nodes %v differ: %g %g", name, pr, s.A[pr[0]], s.A[pr[1]])
			}
		}
		tol := 1e-10
		if order == 1 {
			tol = 1e-2
		}
		if worst > tol {
			t.Errorf("%s: largest nodal error %.3g of the peak > %g", name, worst, tol)
		}
	}
}
