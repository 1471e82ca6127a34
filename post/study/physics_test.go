package study_test

import (
	"fmt"
	"math"
	"testing"

	"polegap/materials"
	"polegap/models"
	"polegap/post/study"
)

// ring is an iron ring (radii 90 and 110 mm) cut by a 0.02 mm radial gap,
// magnetised by a straight conductor on its axis: a magnetic circuit whose
// flux tubes are circles (at each radius r, NI = B g/μ0 + H(B)·2πr holds
// by itself, so the gap centre at r = 100 mm sees the circuit with
// l_iron = 2π·100 mm − g, no corners) with little leakage and fringing:
// the fringe permeance of two pole edges is about (2/π) ln(π w/g) μ0
// against the gap's w/g μ0 (the conformal-map estimate for a slot edge,
// e.g. H. C. Roters, Electromagnetic Devices, 1941, ch. 5, from memory),
// here 0.5 % of the gap's for w/g = 1000.
func ring(t *testing.T, current float64) *models.Model {
	t.Helper()
	src := fmt.Sprintf(`name: ring
geometry: planar
units: mm
depth: 100
gap: 0.02
materials:
  steel: {curve: low-carbon-steel}
regions:
  - name: ring
    material: steel
    polygon: [%s]
  - {name: wire, material: copper, polygon: [{at: [3, 0], arc: 90}, {at: [0, 3], arc: 90}, {at: [-3, 0], arc: 90}, {at: [0, -3], arc: 90}]}
coils:
  - {name: c, turns: 1, current: %g, sides: [{region: wire, sense: 1}]}
boundary: {shape: circle, margin: 0.3, condition: zero-potential}
mesh: {size: 4, order: 2, refine: [{point: [100, 0], size: 0.008}]}
probes:
  gap-centre: {point: [100, 0]}
`, ringPolygon(), current)
	m, err := models.Parse("ring.yaml", []byte(src))
	if err != nil {
		t.Fatal(err)
	}
	return m
}

// ringPolygon draws the cut ring as two outer and two inner arcs (each
// just under 180°) joined across the gap by straight radial edges.
func ringPolygon() string {
	const h = 0.01 // half gap, mm
	a, b := math.Asin(h/110), math.Asin(h/90)
	deg := func(r float64) float64 { return r * 180 / math.Pi }
	return fmt.Sprintf("{at: [%.17g, %g], arc: %.17g}, {at: [-110, 0], arc: %.17g}, [%.17g, %g], "+
		"{at: [%.17g, %g], arc: %.17g}, {at: [-90, 0], arc: %.17g}, [%.17g, %g]",
		110*math.Cos(a), h, deg(math.Pi-a), deg(math.Pi-a), 110*math.Cos(a), -h,
		90*math.Cos(b), -h, -deg(math.Pi-b), -deg(math.Pi-b), 90*math.Cos(b), h)
}

// TestMagneticCircuit: with little leakage and fringing the gap field
// obeys the ideal magnetic circuit NI = B g/μ0 + H(B) l_iron (Ampère's
// circuital law around the mean flux path; e.g. D. Jiles, Introduction to
// Magnetism and Magnetic Materials, 2nd ed., 1998, §5.3), solved here by
// bisection on the same B-H curve, within 1 % (the tolerance;
// budget: fringing about 0.5 %, see ring). The currents span the knee of
// the steel.
func TestMagneticCircuit(t *testing.T) {
	mat, _, _ := materials.Lookup("low-carbon-steel")
	curve := mat.(*materials.Curve)
	const mu0 = 4e-7 * math.Pi
	g := 0.02e-3
	l := 2*math.Pi*0.100 - g
	for _, ni := range []float64{150, 400, 1500} {
		lo, hi := 0.0, mu0*ni/g
		for i := 0; i < 100; i++ {
			b := 0.5 * (lo + hi)
			if b*g/mu0+curve.H(b)*l > ni {
				hi = b
			} else {
				lo = b
			}
		}
		want := 0.5 * (lo + hi)
		s, err := study.Run(ring(t, ni), study.Options{})
		if err != nil {
			t.Fatal(err)
		}
		got := s.Probes[0].Point.B()
		t.Logf("NI = %g A: gap field %.5f T, magnetic circuit %.5f T (iron drop %.0f %%)", ni, got, want, 100*curve.H(want)*l/ni)
		if math.Abs(got-want) > 0.01*want {
			t.Errorf("NI = %g A: gap field %.5f T, magnetic circuit %.5f T", ni, got, want)
		}
	}
}

// TestNewtonOnSaturatedCore: from zero, Newton reaches the 1e-8 residual
// in fewer than 15 steps on the bench dipole driven to twice the current
// at which its poles pass the knee of their curve, and converges
// quadratically at the end: once the residual is below 1e-3 each step
// squares it up to a bounded constant (r_{k+1} ≤ C r_k², C = 1e3 here;
// the standard Newton–Kantorovich behaviour, e.g. C. T. Kelley, Iterative
// Methods for Linear and Nonlinear Equations, SIAM 1995, Theorem 5.1.2).
func TestNewtonOnSaturatedCore(t *testing.T) {
	m, err := models.LoadExample("bench-dipole")
	if err != nil {
		t.Fatal(err)
	}
	m.Coils[0].Current *= 2 // 64 000 ampere-turns: the poles and the back leg saturate
	s, err := study.Run(m, study.Options{})
	if err != nil {
		t.Fatal(err)
	}
	h := s.Solution.History
	t.Logf("Newton residual history: %.3g", h)
	if s.Solution.Iterations >= 15 {
		t.Errorf("%d Newton steps from zero, want fewer than 15", s.Solution.Iterations)
	}
	for k := 1; k < len(h); k++ {
		if h[k-1] < 1e-3 && h[k] > 1e-13 && h[k] > 1e3*h[k-1]*h[k-1] {
			t.Errorf("step %d: residual %.3g after %.3g is not quadratic (%.3g > 1e3 r²)", k, h[k], h[k-1], h[k])
		}
	}
}
