package gap

import (
	"fmt"
	"math"
	"testing"

	"polegap/internal/num"
	"polegap/mesh"
	"polegap/solver"
)

// carterCoefficient is Carter's coefficient of a gap g between a smooth
// iron face and a face with slots of width s at pitch t:
//
//	kC = t / (t − γ g),  γ = (4/π) [ (s/2g) atan(s/2g) − ln √(1 + (s/2g)²) ]
//
// F. W. Carter, "Note on air-gap and interpolar induction", Journal of the
// Institution of Electrical Engineers 29 (1900), pp. 925-933, from the
// Schwarz-Christoffel map of an infinitely deep slot between wide teeth
// opposite a smooth face (the form quoted in machine-design texts, e.g.
// J. Pyrhönen, T. Jokinen, V. Hrabovcová, "Design of Rotating Electrical
// Machines", 2008, section 3.2; cited from memory).
func carterCoefficient(g, s, t float64) float64 {
	u := s / (2 * g)
	gamma := 4 / math.Pi * (u*math.Atan(u) - math.Log(math.Sqrt(1+u*u)))
	return t / (t - gamma*g)
}

// slotted solves a periodic-like strip: a smooth iron plate above a gap g
// and a slotted iron plate below it, with n slots of width s and depth d
// at pitch t. The strip's sides run along tooth centre lines, where by
// symmetry B is parallel to them (A constant); the left side is held at
// A = phi and the right at 0, so the flux per metre crossing the gap is
// phi. Top and bottom are flux-normal (flux enters and leaves the iron
// there at right angles). Iron μr = 1e5 (Carter's ideal iron is infinitely
// permeable). It returns the solution.
func slotted(tb testing.TB, g, s, t, d float64, n int, phi float64) *solver.Solution {
	tb.Helper()
	const back = 0.004
	l := float64(n) * t
	bx := []float64{0, l, l}
	by := []float64{-d - back, -d - back, 0}
	for k := n - 1; k >= 0; k-- {
		c := (float64(k) + 0.5) * t
		bx = append(bx, c+s/2, c+s/2, c-s/2, c-s/2)
		by = append(by, 0, -d, -d, 0)
	}
	bx, by = append(bx, 0), append(by, 0)
	lower := mesh.Polygon{X: bx, Y: by, Region: 1}
	upper := rect(0, g, l, g+back, 2)
	box := rect(0, -d-back, l, g+back, 0)
	box.EdgeMarkers = []int32{2, 3, 2, 4} // bottom, right, top, left
	in, err := mesh.BuildInput([]mesh.Polygon{lower, upper}, box, mesh.GraphOptions{})
	if err != nil {
		tb.Fatal(err)
	}
	h := g / 6
	m, err := mesh.Triangulate(in, mesh.Options{Order: 2, Size: mesh.SizeField{
		Global:  2 * g,
		Lines:   []mesh.SizeLine{{X0: 0, Y0: 0, X1: l, Y1: 0, Size: h}, {X0: 0, Y0: g, X1: l, Y1: g, Size: h}},
		Grading: 0.3,
	}})
	if err != nil {
		tb.Fatal(err)
	}
	p := &solver.Problem{Mesh: m, Materials: []solver.Material{linear(1), linear(1e5), linear(1e5)},
		Boundary: map[int32]solver.Condition{2: solver.FluxNormal}}
	tol := 1e-9 * l
	for i := range m.X {
		if math.Abs(m.X[i]) < tol {
			p.Fixed = append(p.Fixed, solver.NodeValue{Node: int32(i), A: phi})
		}
	}
	sol, err := solver.Solve(p, solver.Options{})
	if err != nil {
		tb.Fatal(err)
	}
	return sol
}

// Carter's coefficient from the finite-element field: with the flux fixed,
// the mean gap field B_avg is the mid-plane flux over the strip width
// (MeanNormal, exact from A), and the magnetomotive force F across the gap
// is ∫ By/μ0 dy along a tooth centre line (the iron is an equipotential).
// An unslotted gap would carry μ0 F / g, so kC = μ0 F / (g B_avg).
//
// Tolerance 0.5 % (measured: 4e-4): Carter's formula is exact for infinitely deep slots,
// teeth much wider than g and infinitely permeable iron. Here the slot
// depth d = 2s leaves a field of order exp(−π d/s) ≈ 2e-3 at the slot
// bottom (its effect on the flux is smaller still), the teeth (t − s ≥ 6g wide) separate neighbouring slots' edge
// fields by factors exp(−π (t − s)/(2g)) < 1e-4, and μr = 1e5 adds a
// relative iron drop below 1e-4: each below 2e-3. The remainder is
// discretisation error of the second-order field (mesh g/6 at the faces)
// and of the sampled F integral.
func TestCarterCoefficient(t *testing.T) {
	const g = 0.001
	for _, c := range []struct{ s, t float64 }{{0.004, 0.012}, {0.002, 0.008}} {
		name := fmt.Sprintf("s/g=%g t/g=%g", c.s/g, c.t/g)
		const n, phi = 3, 1e-3
		sol := slotted(t, g, c.s, c.t, 2*c.s, n, phi)
		l := n * c.t
		bAvg, err := MeanNormal(sol, [2]float64{0, g / 2}, [2]float64{l, g / 2})
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		// F along the middle tooth's centre line, x = t.
		ss := ProfileTo(nil, sol, [2]float64{c.t, 0}, [2]float64{c.t, g}, 401)
		var f float64
		for k := 1; k < len(ss); k++ {
			f += 0.5 * (ss[k].S - ss[k-1].S) * (ss[k].By + ss[k-1].By) / num.Mu0
		}
		got := num.Mu0 * f / (g * bAvg)
		want := carterCoefficient(g, c.s, c.t)
		rel := (got - want) / want
		t.Logf("%s: %d nodes, B_avg %.5g T, kC %.5f, Carter %.5f, relative %.2g", name, sol.Problem.Mesh.NumNodes(), bAvg, got, want, rel)
		if math.Abs(rel) > 0.005 {
			t.Errorf("%s: kC = %.5f, Carter's %.5f, relative %.3g > 0.5 %%", name, got, want, rel)
		}
	}
}
