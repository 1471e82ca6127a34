package solver

import (
	"fmt"
	"math"
	"testing"
)

// The Zienkiewicz-Zhu estimate on the manufactured planar solution of
// TestManufacturedConvergence converges at the order of the true energy
// error (fitted slope within 0.2 of k) and its effectivity index
// estimate/true stays within [0.5, 2] (common practice for a usable
// estimator; ZZ with averaging is asymptotically exact for P1 on
// structured meshes: Zienkiewicz and Zhu, IJNME 33, 1992).
func TestErrorEstimateManufactured(t *testing.T) {
	pi := math.Pi
	exact := func(x, y float64) (float64, float64, float64) {
		return math.Sin(pi*x) * math.Sin(pi*y), pi * math.Sin(pi*x) * math.Cos(pi*y), -pi * math.Cos(pi*x) * math.Sin(pi*y)
	}
	src := func(x, y float64) float64 { return 2 * pi * pi * math.Sin(pi*x) * math.Sin(pi*y) }
	for order := 1; order <= 2; order++ {
		name := fmt.Sprintf("P%d", order)
		var hs, est, tru []float64
		for _, n := range []int{8, 16, 32} {
			m := rectMesh(n, n, 0, 1, 0, 1, order, nil)
			p := &Problem{Mesh: m, Materials: []Material{unitNu{}}}
			s := solveWithSource(t, p, src)
			_, e := s.ErrorIndicatorTo(nil)
			_, en := fieldErrors(s, exact) // ν = 1: the same norm
			hs = append(hs, 1/float64(n))
			est = append(est, e)
			tru = append(tru, en)
		}
		pe := slope(hs, est)
		eff := est[2] / tru[2]
		t.Logf("%s: estimates %.3g (slope %.3f), true %.3g, effectivity %.3f", name, est, pe, tru, eff)
		if math.Abs(pe-float64(order)) > 0.2 {
			t.Errorf("%s: estimate order %.3f, want %d ± 0.2", name, pe, order)
		}
		if eff < 0.5 || eff > 2 {
			t.Errorf("%s: effectivity %.3f outside [0.5, 2]", name, eff)
		}
	}
}

// On the C-core the largest indicator sits at an iron corner, where the
// field is singular (B ~ r^(−1/3) at a re-entrant corner of ideal iron:
// J. Meixner, "The behavior of electromagnetic fields at edges", IEEE
// Trans. Antennas Propag. 20, 1972), not in the uniform gap or the air.
func TestErrorIndicatorAtCorners(t *testing.T) {
	m, _, NI := cCore(1, 1)
	J := NI / (0.02 * 0.08)
	p := &Problem{Mesh: m, Materials: []Material{linear{1}, linear{1e6}, linear{1}, linear{1}},
		CurrentDensity: []float64{0, 0, J, -J}}
	s, err := Solve(p, Options{})
	checkSolution(t, s, err)
	if err != nil {
		t.Fatal(err)
	}
	eta, total := s.ErrorIndicatorTo(nil)
	best := 0
	for e := range eta {
		if eta[e] > eta[best] {
			best = e
		}
	}
	xc := (m.X[m.Tri[3*best]] + m.X[m.Tri[3*best+1]] + m.X[m.Tri[3*best+2]]) / 3
	yc := (m.Y[m.Tri[3*best]] + m.Y[m.Tri[3*best+1]] + m.Y[m.Tri[3*best+2]]) / 3
	corners := [][2]float64{{0, 0}, {0.2, 0}, {0.2, 0.099}, {0.15, 0.099}, {0.15, 0.05}, {0.05, 0.05},
		{0.05, 0.15}, {0.15, 0.15}, {0.15, 0.101}, {0.2, 0.101}, {0.2, 0.2}, {0, 0.2}}
	dmin := math.Inf(1)
	for _, c := range corners {
		dmin = math.Min(dmin, math.Hypot(xc-c[0], yc-c[1]))
	}
	t.Logf("largest indicator %.3g (of total %.3g) at (%.4f, %.4f), %.2g m from an iron corner", eta[best], total, xc, yc, dmin)
	if dmin > 0.005 { // a few cells (5 mm cells here)
		t.Errorf("largest indicator at (%.4f, %.4f), %.3g m from the nearest iron corner", xc, yc, dmin)
	}
}
