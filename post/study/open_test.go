package study_test

import (
	"fmt"
	"math"
	"testing"

	"polegap/models"
	"polegap/post/study"
)

const mu0 = 4e-7 * math.Pi

// wireModel is a round copper conductor of radius 5 mm (drawn as a circle
// of four 90° arcs) carrying current I, alone in air, with the given
// boundary condition on a circle and mesh order.
func wireModel(t *testing.T, current float64, condition string, margin float64, order int, size float64) *models.Model {
	t.Helper()
	src := fmt.Sprintf(`name: wire
geometry: planar
units: mm
depth: 1000
regions:
  - name: wire
    material: copper
    polygon: [{at: [5, 0], arc: 90}, {at: [0, 5], arc: 90}, {at: [-5, 0], arc: 90}, {at: [0, -5], arc: 90}]
coils:
  - {name: w, turns: 1, current: %g, sides: [{region: wire, sense: 1}]}
boundary: {shape: circle, margin: %g, condition: %s}
mesh: {size: %g, order: %d, chord: 0.002, grading: 0.05}
probes:
  r10: {point: [10, 0]}
  r15: {point: [0, 15]}
  r20: {point: [-14.142135623730951, -14.142135623730951]}
`, current, margin, condition, size, order)
	m, err := models.Parse("wire.yaml", []byte(src))
	if err != nil {
		t.Fatal(err)
	}
	return m
}

// TestOpenBoundaryLineCurrent checks the Kelvin-transformation open
// boundary on a straight round conductor: outside it, |B| = μ0 I/(2π r)
// (Ampère's circuital law; e.g. D. J. Griffiths, Introduction to
// Electrodynamics, 4th ed., 2013, eq. 5.38). The air circle ends only
// 1.5 diameters of the model beyond the wire, so a zero-potential
// boundary there would be right too (a coaxial circle is a field line);
// the test also runs the open boundary off-centre on a pair of wires
// below, where it is not.
func TestOpenBoundaryLineCurrent(t *testing.T) {
	const I = 100.0
	// Tolerances from the issue: 0.5 % for P1 and 0.1 % for P2 on the
	// default mesh.
	for _, tc := range []struct {
		order int
		size  float64 // mm
		tol   float64
	}{{1, 0.25, 5e-3}, {2, 0.6, 1e-3}} {
		m := wireModel(t, I, "open", 2, tc.order, tc.size)
		s, err := study.Run(m, study.Options{})
		if err != nil {
			t.Fatalf("P%d: %v", tc.order, err)
		}
		if s.Disc.Kelvin == nil {
			t.Fatalf("P%d: no Kelvin disk in the mesh", tc.order)
		}
		for _, p := range s.Probes {
			r := math.Hypot(p.Point.X, p.Point.Y)
			want := mu0 * I / (2 * math.Pi * r)
			if got := p.Point.B(); math.Abs(got-want) > tc.tol*want {
				t.Errorf("P%d %s: |B| = %.6g T, want %.6g T (rel. error %.2e > %.0e)", tc.order, p.Name, got, want, math.Abs(got-want)/want, tc.tol)
			}
		}
	}
}

// TestOpenBoundaryPair checks the open boundary where a closed boundary
// would be wrong: two antiparallel wires 20 mm apart, the air circle only
// 0.5 of the model's size beyond them. The exact field is the sum of two
// line-current fields (superposition; Griffiths eq. 5.38); a zero-potential
// circle this close would bend the far field visibly.
func TestOpenBoundaryPair(t *testing.T) {
	src := `name: pair
geometry: planar
units: mm
depth: 1000
regions:
  - {name: a, material: copper, polygon: [{at: [-7, 0], arc: 90}, {at: [-10, 3], arc: 90}, {at: [-13, 0], arc: 90}, {at: [-10, -3], arc: 90}]}
  - {name: b, material: copper, polygon: [{at: [13, 0], arc: 90}, {at: [10, 3], arc: 90}, {at: [7, 0], arc: 90}, {at: [10, -3], arc: 90}]}
coils:
  - {name: loop, turns: 1, current: 50, sides: [{region: a, sense: 1}, {region: b, sense: -1}]}
boundary: {shape: circle, margin: 0.5, condition: open}
mesh: {size: 1, order: 2, chord: 0.002}
probes:
  centre: {point: [0, 0]}
  above: {point: [0, 12]}
  outside: {point: [20, 8]}
`
	m, err := models.Parse("pair.yaml", []byte(src))
	if err != nil {
		t.Fatal(err)
	}
	s, err := study.Run(m, study.Options{})
	if err != nil {
		t.Fatal(err)
	}
	exact := func(x, y float64) (bx, by float64) {
		for _, w := range []struct{ x, i float64 }{{-0.010, 50}, {0.010, -50}} {
			dx, dy := x-w.x, y
			r2 := dx*dx + dy*dy
			k := mu0 * w.i / (2 * math.Pi * r2)
			bx += -k * dy
			by += k * dx
		}
		return bx, by
	}
	for _, p := range s.Probes {
		bx, by := exact(p.Point.X, p.Point.Y)
		want := math.Hypot(bx, by)
		// 0.3 %: P2 on a 1 mm mesh; the error budget is the polygonal
		// wires (chord 2 µm) and the mesh, not the boundary.
		if got := p.Point.B(); math.Abs(got-want) > 3e-3*want {
			t.Errorf("%s: |B| = %.6g T, want %.6g T", p.Name, got, want)
		}
	}
}
