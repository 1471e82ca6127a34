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

// loopModel is a single-turn circular loop of radius 50 mm with a 1 mm
// square section, carrying I = 1000 A, alone in air, in an axisymmetric
// model whose circle (or box) boundary lies the given distance R from the
// loop's centre (as a margin of the section's size, the model's largest
// dimension), meshed with P2 elements: 5 mm in the air, 0.25 mm at the
// loop. Probes sit on the axis at z = 0, 25, −50 and 70 mm, those inside R.
func loopModel(t *testing.T, boundary string, R float64) *models.Model {
	t.Helper()
	const a, s = 0.05, 0.001
	margin := (R - math.Hypot(a+s/2, s/2)) / s // study: circle radius = farthest corner + margin × s
	src := fmt.Sprintf(`name: loop
geometry: axisymmetric
units: mm
regions:
  - {name: loop, material: copper, polygon: [[49.5, -0.5], [50.5, -0.5], [50.5, 0.5], [49.5, 0.5]]}
coils:
  - {name: c, turns: 1, current: 1000, sides: [{region: loop, sense: 1}]}
boundary: {%s, margin: %.17g}
mesh: {size: 5, order: 2, refine: [{near: loop, size: 0.25}]}
probes:
`, boundary, margin)
	for i, z := range []float64{0, 25, -50, 70} {
		if math.Abs(z) < 1000*R {
			src += fmt.Sprintf("  z%d: {point: [0, %g]}\n", i, z)
		}
	}
	m, err := models.Parse("loop.yaml", []byte(src))
	if err != nil {
		t.Fatal(err)
	}
	return m
}

// TestOpenBoundaryLoop checks the axisymmetric open boundary (the Kelvin
// image of the space outside a sphere, a half disc on the axis) on a
// single-turn loop: on the axis B = μ0 I a²/(2(a²+z²)^{3/2}) (J. D.
// Jackson, Classical Electrodynamics, 3rd ed., 1999, §5.5, eq. 5.40 on the
// axis). The 1 mm square section changes that by under 2e-5 of the centre
// field (the loop field integrated over the section in closed form, as
// for a thick winding: D. B. Montgomery, Solenoid Magnet Design, 1969,
// ch. 1; computed below). The boundary lies only 2.5 loop radii from the
// centre: open, the probes are within 0.1 % of the centre field (P2,
// DESIGN.md; measured 4.5e-4, the mesh's error); a box with the same
// margin (A = 0 on it, 1.5 loop radii above and below) is 15 % off
// (checked > 5 %), and so is a zero-potential circle there (6 %).
func TestOpenBoundaryLoop(t *testing.T) {
	const a, s, I = 0.05, 0.001, 1000.0
	b0 := mu0 * I / (2 * a)
	loop := func(z float64) float64 { return mu0 * I * a * a / (2 * math.Pow(a*a+z*z, 1.5)) }
	thick := func(z float64) float64 {
		f := func(u float64) float64 {
			b, c := a+s/2, a-s/2
			return u * math.Log((b+math.Hypot(b, u))/(c+math.Hypot(c, u)))
		}
		return mu0 * I / (s * s) / 2 * (f(s/2-z) - f(-s/2-z))
	}
	for _, tc := range []struct {
		boundary string
		open     bool
	}{
		{"shape: circle, condition: open", true},
		{"shape: box", false},
		{"shape: circle", false},
	} {
		m := loopModel(t, tc.boundary, 2.5*a)
		r, err := study.Run(m, study.Options{})
		if err != nil {
			t.Fatalf("%s: %v", tc.boundary, err)
		}
		if (r.Disc.Kelvin != nil) != tc.open || tc.open && !r.Disc.Kelvin.Half {
			t.Fatalf("%s: Kelvin half disc %v", tc.boundary, r.Disc.Kelvin != nil)
		}
		var worst float64
		for _, p := range r.Probes {
			z := p.Point.Y
			if d := math.Abs(thick(z)-loop(z)) / b0; d > 2e-5 {
				t.Fatalf("z = %g: the section changes the loop field by %.2g of B0", z, d)
			}
			worst = math.Max(worst, math.Abs(p.Point.By-loop(z))/b0)
		}
		t.Logf("%s: %d nodes, worst on-axis error %.3g of the centre field", tc.boundary, r.Disc.Mesh.NumNodes(), worst)
		if tc.open && worst > 1e-3 {
			t.Errorf("%s: on-axis error %.3g of the centre field > 1e-3", tc.boundary, worst)
		}
		if !tc.open && worst < 0.05 {
			t.Errorf("%s: a closed boundary this near should be visibly wrong, error %.3g", tc.boundary, worst)
		}
	}
}

// TestOpenBoundaryAxiEnergy: with the axisymmetric open boundary the
// stored energy of Energies, which counts the exterior through its image
// weighted by ρ'²/R² (solver.Exterior), equals ½ ∫ A·J dV over the coil,
// the energy of a linear current distribution (J. D. Jackson, Classical
// Electrodynamics, 3rd ed., 1999, §5.16, eq. 5.144): to 1e-9, the
// identity holds for the discrete solution up to the solver's residual.
// The boundary is close (1.1 loop radii from the centre) so that the
// exterior holds a visible share of the energy (about 14 %, checked
// > 1 %). Points in the image half disc are outside the field:
// Result.Field reports them so.
func TestOpenBoundaryAxiEnergy(t *testing.T) {
	m := loopModel(t, "shape: circle, condition: open", 0.055)
	r, err := study.Run(m, study.Options{})
	if err != nil {
		t.Fatal(err)
	}
	w, wco, err := study.Energies(r.Solution)
	if err != nil {
		t.Fatal(err)
	}
	if ws := r.Solution.Energy(); math.Abs(w-ws) > 1e-10*ws || math.Abs(wco-ws) > 1e-10*ws {
		t.Errorf("Energies W %.12g W' %.12g, solver %.12g", w, wco, ws)
	}
	p := r.Problem
	if len(p.Exterior) != 1 || p.Exterior[0].Region != study.KelvinTag(m) {
		t.Fatalf("exterior %+v, want the Kelvin tag %d", p.Exterior, study.KelvinTag(m))
	}
	f := study.NewQuadField(r.Solution, study.QuadDegree(2, p.Formulation))
	var aj, image float64
	for e := 0; e < p.Mesh.NumTriangles(); e++ {
		reg := p.Mesh.Region[e]
		for q := 0; q < f.NumPoints(); q++ {
			pt := f.At(e, q)
			if int(reg) < len(p.CurrentDensity) {
				aj += pt.W * pt.A * p.CurrentDensity[reg]
			}
			if ex := p.Exterior[0]; reg == ex.Region {
				rho2 := (pt.X-ex.CX)*(pt.X-ex.CX) + (pt.Y-ex.CY)*(pt.Y-ex.CY)
				image += pt.W * rho2 / (ex.Radius * ex.Radius) * (pt.Bx*pt.Bx + pt.By*pt.By) / (2 * mu0)
			}
		}
	}
	t.Logf("W %.8g J, ½∫A·J %.8g J; the exterior holds %.3g of W", w, aj/2, image/w)
	if math.Abs(w-aj/2) > 1e-9*w {
		t.Errorf("W = %.12g J, ½∫A·J = %.12g J", w, aj/2)
	}
	if image < 0.01*w {
		t.Errorf("the exterior holds %.3g of the energy; the test needs a visible share", image/w)
	}
	k := r.Disc.Kelvin
	if _, _, _, ok := r.Field().At(0.5*k.Radius, k.CY); ok {
		t.Errorf("a point in the image half disc reads a field")
	}
	if _, _, _, ok := r.Solution.At(0.5*k.Radius, k.CY); !ok {
		t.Errorf("the image half disc is not in the mesh at (%g, %g)", 0.5*k.Radius, k.CY)
	}
}

// montgomeryCentre is the centre field of a thick solenoid of uniform
// current density J = NI/((b−a)L) filling a ≤ r ≤ b, |z| ≤ L/2:
// B0 = μ0 J a F(α, β), with α = b/a, β = L/(2a) and the field factor
// F(α, β) = β ln((α + √(α²+β²))/(1 + √(1+β²))) (D. B. Montgomery, Solenoid
// Magnet Design, 1969, ch. 1; quoted from memory, and it is the loop field
// of Jackson §5.5 integrated over the section in closed form).
func montgomeryCentre(NI, a, b, L float64) float64 {
	J := NI / ((b - a) * L)
	alpha, beta := b/a, L/(2*a)
	F := beta * math.Log((alpha+math.Hypot(alpha, beta))/(1+math.Hypot(1, beta)))
	return mu0 * J * a * F
}

// TestSolenoidTemplateDefaults: the solenoid template with only its
// required dimensions, no boundary and no mesh settings (so the open
// boundary, P1 and the default size), gives the centre field of the
// thick-winding formula above within 1e-3 (measured 4.3e-4, 5.2e-4,
// 1.6e-5 and 7.7e-4: the P1 mesh's error). A box held at A = 0 at the
// default margin was the old default and is checked to be worse (4.8 %,
// 0.4 %, 4.0 % and 13 % low).
func TestSolenoidTemplateDefaults(t *testing.T) {
	const turns, current = 1000, 14.0
	for _, g := range []struct{ ri, th, l float64 }{ // mm
		{40, 50, 100}, // the calibration solenoid's winding
		{20, 5, 200},  // long and thin
		{10, 60, 30},  // short and thick
		{100, 2, 100}, // a thin sheet as long as its radius
	} {
		name := fmt.Sprintf("ri %g th %g L %g mm", g.ri, g.th, g.l)
		want := montgomeryCentre(turns*current, g.ri/1000, (g.ri+g.th)/1000, g.l/1000)
		var errs [2]float64
		for k, boundary := range []string{"", "boundary: {shape: box}\n"} {
			src := fmt.Sprintf(`units: mm
template: solenoid
dimensions: {inner-radius: %g, thickness: %g, length: %g, turns: %d, current: %g}
`, g.ri, g.th, g.l, turns, current) + boundary
			m, err := models.Parse("solenoid.yaml", []byte(src))
			if err != nil {
				t.Fatal(err)
			}
			r, err := study.Run(m, study.Options{})
			if err != nil {
				t.Fatalf("%s: %v", name, err)
			}
			c, ok := r.Probe("centre")
			if !ok {
				t.Fatalf("%s: no centre probe", name)
			}
			errs[k] = math.Abs(c.Point.By-want) / want
			if k == 0 && (r.Disc.Kelvin == nil || r.Disc.Mesh.Order() != 2) {
				t.Fatalf("%s: the defaults are not the open boundary and automatic P2", name)
			}
		}
		t.Logf("%s: B0 %.6g T; open %.2g, box %.2g", name, want, errs[0], errs[1])
		if errs[0] > 1e-3 {
			t.Errorf("%s: centre field off by %.3g with the template defaults (> 1e-3)", name, errs[0])
		}
		if errs[1] < errs[0] {
			t.Errorf("%s: the box boundary (%.3g) beats the open one (%.3g)", name, errs[1], errs[0])
		}
	}
}

// TestOpenBoundaryCCore backs the open default of the planar templates: on
// the bench dipole's c-core driven into saturation (32 000 A-turns on a
// 40 mm gap), where the leakage flux around the yoke matters, the gap
// field with the open boundary does not depend on where the circle lies
// (margins 0.5 and 2: within 2e-4, measured 3e-5, the mesh's noise),
// while a box held at A = 0 moves it by 0.5 % between margins 1 and 4
// (checked > 2e-3): the box, not the magnet, was setting the last
// half per cent. No closed form exists; this is a consistency check.
func TestOpenBoundaryCCore(t *testing.T) {
	src := `units: mm
depth: 300
template: c-core
dimensions: {gap: 40, pole-width: 200, pole-face-width: 180, chamfer: 5, pole-height: 80, arm-thickness: 180,
  leg-width: 180, window-width: 120, coil: back-leg, coil-width: 100, coil-height: 160, clearance: 10,
  turns: 320, current: 100}
`
	gap := func(boundary string) float64 {
		m, err := models.Parse("c.yaml", []byte(src+boundary))
		if err != nil {
			t.Fatal(err)
		}
		r, err := study.Run(m, study.Options{})
		if err != nil {
			t.Fatalf("%s: %v", boundary, err)
		}
		return r.Probes[0].Point.B()
	}
	o1, o2 := gap("boundary: {shape: circle, margin: 0.5, condition: open}\n"), gap("boundary: {shape: circle, margin: 2, condition: open}\n")
	b1, b4 := gap("boundary: {shape: box, margin: 1}\n"), gap("boundary: {shape: box, margin: 4}\n")
	t.Logf("open: %.6g T (margin 0.5), %.6g T (2); box: %.6g T (1), %.6g T (4)", o1, o2, b1, b4)
	if d := math.Abs(o1-o2) / o2; d > 2e-4 {
		t.Errorf("open boundary: margins 0.5 and 2 differ by %.2g", d)
	}
	if d := math.Abs(b1-b4) / b4; d < 2e-3 {
		t.Errorf("box boundary: margins 1 and 4 differ by only %.2g; the check has lost its point", d)
	}
}
