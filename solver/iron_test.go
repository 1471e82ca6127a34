package solver

import (
	"fmt"
	"math"
	"testing"

	"polegap/mesh"
)

// Iron cylinder (radius a, relative permeability μr) in a uniform
// transverse field B0: the field inside is uniform,
// B = 2μr/(μr+1) B0 (W. R. Smythe, "Static and Dynamic Electricity",
// 1950, sec. 4.10; J. D. Jackson, "Classical Electrodynamics", 3rd ed.,
// 1999, problem 5.18 in its 2D form). The exact outside potential
// A = B0 (r + K a²/r) sin θ, K = (μr−1)/(μr+1), is imposed on the outer
// circle r = R, so a finite domain adds no error; what remains is the
// discretisation and the polygonal (nth-sided) shape of the circle.
func TestIronCylinderUniformField(t *testing.T) {
	const B0, a, R = 1.0, 0.1, 0.5
	for _, c := range []struct {
		order int
		mur   float64
		nth   int
		tol   float64 // DESIGN.md: 0.5 % P1, 0.1 % P2
	}{
		{1, 10, 128, 5e-3}, {1, 1000, 128, 5e-3},
		{2, 10, 96, 1e-3}, {2, 1000, 96, 1e-3},
	} {
		name := fmt.Sprintf("P%d μr=%g", c.order, c.mur)
		// Rings: uniform inside the cylinder, geometric outside.
		var radii []float64
		nIn := 16
		for k := 1; k <= nIn; k++ {
			radii = append(radii, a*float64(k)/float64(nIn))
		}
		out := geometricRadii(a, R, c.nth)
		radii = append(radii, out[1:]...)
		m := diskMesh(radii, c.nth, c.order, func(r float64) int32 {
			if r < a {
				return 1
			}
			return 0
		})
		K := (c.mur - 1) / (c.mur + 1)
		var fixed []NodeValue
		for _, i := range boundaryNodes(m) {
			r := math.Hypot(m.X[i], m.Y[i])
			fixed = append(fixed, NodeValue{Node: i, A: B0 * (1 + K*a*a/(r*r)) * m.Y[i]})
		}
		p := &Problem{Mesh: m, Materials: []Material{linear{1}, linear{c.mur}}, Fixed: fixed}
		s, err := Solve(p, Options{})
		checkSolution(t, s, err)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		want := 2 * c.mur / (c.mur + 1) * B0
		var worst float64
		for _, pt := range [][2]float64{{0, 0.001}, {0.05, 0.02}, {-0.03, -0.06}, {0.07, -0.05}} {
			_, bx, by, ok := s.At(pt[0], pt[1])
			if !ok {
				t.Fatalf("%s: %v not found", name, pt)
			}
			worst = math.Max(worst, math.Hypot(bx-want, by)/want)
		}
		t.Logf("%s: %d nodes, worst relative error inside %.3g", name, m.NumNodes(), worst)
		if worst > c.tol {
			t.Errorf("%s: relative error %.3g > %g", name, worst, c.tol)
		}
	}
}

// TestIronCylinderCurved solves the iron cylinder of
// TestIronCylinderUniformField (same reference: B = 2μr/(μr+1) B0 inside)
// on coarse rings of nth nodes with P2 elements twice on the same corners:
// with straight sides (the cylinder and the outer circle are nth-sided
// polygons) and with the sides on the two circles curved (mesh.Elevate on
// arcs, isoparametric elements). The curved mesh must be at least ten times
// more accurate at the sample points (measured: 35× at nth = 24, 28× at
// 48) and within the 0.1 % that DESIGN.md asks of P2 already at nth = 24.
func TestIronCylinderCurved(t *testing.T) {
	const B0, a, R, mur = 1.0, 0.1, 0.5, 1000.0
	for _, nth := range []int{24, 48} {
		var worst [2]float64 // straight, curved
		for i, curved := range []bool{false, true} {
			var radii []float64
			nIn := nth / 6
			for k := 1; k <= nIn; k++ {
				radii = append(radii, a*float64(k)/float64(nIn))
			}
			out := geometricRadii(a, R, nth)
			radii = append(radii, out[1:]...)
			m := diskMesh(radii, nth, 1, func(r float64) int32 {
				if r < a {
					return 1
				}
				return 0
			})
			if curved {
				curveRings(m, a, R)
			}
			mesh.Elevate(m)
			if curved != (m.Curved != nil) {
				t.Fatalf("nth = %d: curved %v, Mesh.Curved %v", nth, curved, m.Curved != nil)
			}
			K := (mur - 1) / (mur + 1)
			var fixed []NodeValue
			for _, v := range boundaryNodes(m) {
				r := math.Hypot(m.X[v], m.Y[v])
				fixed = append(fixed, NodeValue{Node: v, A: B0 * (1 + K*a*a/(r*r)) * m.Y[v]})
			}
			p := &Problem{Mesh: m, Materials: []Material{linear{1}, linear{mur}}, Fixed: fixed}
			s, err := Solve(p, Options{})
			checkSolution(t, s, err)
			if err != nil {
				t.Fatalf("nth = %d: %v", nth, err)
			}
			want := 2 * mur / (mur + 1) * B0
			for _, pt := range [][2]float64{{0, 0.001}, {0.05, 0.02}, {-0.03, -0.06}, {0.07, -0.05}} {
				_, bx, by, ok := s.At(pt[0], pt[1])
				if !ok {
					t.Fatalf("nth = %d: %v not found", nth, pt)
				}
				worst[i] = math.Max(worst[i], math.Hypot(bx-want, by)/want)
			}
		}
		t.Logf("nth = %d: worst relative error inside, straight %.3g, curved %.3g", nth, worst[0], worst[1])
		if worst[1] > worst[0]/10 {
			t.Errorf("nth = %d: curved error %.3g, not ten times below straight %.3g", nth, worst[1], worst[0])
		}
		if worst[1] > 1e-3 {
			t.Errorf("nth = %d: curved error %.3g > 1e-3", nth, worst[1])
		}
	}
}

// A line current I inside a closed iron ring (r1 < r < r2): by Ampère's
// law with cylindrical symmetry, H = I/(2π r) in the iron whatever μr
// (Griffiths, Introduction to Electrodynamics, 4th ed., 2013, eq. 6.20
// with example 6.2), so B = μ0 μr I/(2π r).
func TestLineCurrentInIronRing(t *testing.T) {
	const I, r1, r2, R = 10.0, 0.2, 0.3, 1.0
	const mur = 1000
	for _, c := range []struct {
		order int
		nth   int
		tol   float64 // DESIGN.md: 0.5 % P1 (smoothed), 0.1 % P2
	}{{1, 96, 5e-3}, {2, 96, 1e-3}} {
		name := fmt.Sprintf("P%d", c.order)
		radii := geometricRadii(0.02, r1, c.nth)
		radii = append(radii, geometricRadii(r1, r2, c.nth)[1:]...)
		radii = append(radii, geometricRadii(r2, R, c.nth)[1:]...)
		m := diskMesh(radii, c.nth, c.order, func(r float64) int32 {
			if r > r1 && r < r2 {
				return 1
			}
			return 0
		})
		p := &Problem{Mesh: m, Materials: []Material{linear{1}, linear{mur}},
			PointCurrents: []PointCurrent{{Node: 0, Current: I}}}
		s, err := Solve(p, Options{})
		checkSolution(t, s, err)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		var worst float64
		if c.order == 2 {
			h := s.HTo(nil)
			for e := 0; e < m.NumTriangles(); e++ {
				if m.Region[e] != 1 {
					continue
				}
				xc := (m.X[m.Tri[3*e]] + m.X[m.Tri[3*e+1]] + m.X[m.Tri[3*e+2]]) / 3
				yc := (m.Y[m.Tri[3*e]] + m.Y[m.Tri[3*e+1]] + m.Y[m.Tri[3*e+2]]) / 3
				rc := math.Hypot(xc, yc)
				// The elements near the polygonal (nth-sided) interfaces
				// carry the error of the polygon, not of the solver
				// (0.3 % in the first layer, 1e-5 in the bulk): its
				// perturbation has period 2πr/nth and decays like
				// exp(−nth·d/r) at depth d (Laplace equation), so the
				// outer 20 % on each side (exp(−9.6) at r1) are left out.
				if rc < r1+0.2*(r2-r1) || rc > r2-0.2*(r2-r1) {
					continue
				}
				want := I / (2 * math.Pi * rc)
				worst = math.Max(worst, math.Abs(math.Hypot(h[e][0], h[e][1])-want)/want)
			}
		} else {
			// P1: smoothed nodal B at nodes strictly inside the iron.
			nb := s.NodalBTo(nil)
			for i := range nb {
				r := math.Hypot(m.X[i], m.Y[i])
				if r <= r1*1.001 || r >= r2*0.999 {
					continue
				}
				want := I / (2 * math.Pi * r)
				worst = math.Max(worst, math.Abs(math.Hypot(nb[i][0], nb[i][1])/(mu0*mur)-want)/want)
			}
		}
		t.Logf("%s: worst relative |H| error in the iron %.3g", name, worst)
		if worst > c.tol {
			t.Errorf("%s: relative |H| error %.3g > %g", name, worst, c.tol)
		}
	}
}
