package searchcoil

import (
	"errors"
	"math"
	"strings"
	"testing"

	"polegap/mesh"
	"polegap/solver"
)

const mu0 = 4e-7 * math.Pi

type fieldFunc func(x, y float64) (a, bx, by float64, ok bool)

func (f fieldFunc) At(x, y float64) (float64, float64, float64, bool) { return f(x, y) }

// uniformY is B = (0, b0) with A = −b0 x (B = (∂A/∂y, −∂A/∂x)).
func uniformY(b0 float64) Field {
	return fieldFunc(func(x, y float64) (float64, float64, float64, bool) { return -b0 * x, 0, b0, true })
}

// lineCurrent is the field of a line current i along +z at the origin:
// A = −(μ0 i / 2π) ln r, B = (μ0 i / 2π r) φ̂ (Ampère's law; e.g.
// J. D. Jackson, "Classical Electrodynamics", 3rd ed. 1998, section 5.3).
func lineCurrent(i float64) Field {
	return fieldFunc(func(x, y float64) (float64, float64, float64, bool) {
		r2 := x*x + y*y
		if r2 == 0 {
			return 0, 0, 0, false
		}
		k := mu0 * i / (2 * math.Pi)
		return -0.5 * k * math.Log(r2), -k * y / r2, k * x / r2, true
	})
}

// A uniform field: every linkage is the exact flux through the coil.
func TestUniformExact(t *testing.T) {
	const b0 = 0.7
	f := uniformY(b0)
	long := Long{P: [2]float64{0.01, 0}, Q: [2]float64{0.03, 0}, Turns: 20, Length: 0.5}
	// 1e-13: a few roundings (the tilted axis's √3 and hypot among them).
	check := func(name string, got, want float64) {
		t.Helper()
		if math.Abs(got-want) > 1e-13*math.Abs(want) {
			t.Errorf("%s: %.17g, want %.17g", name, got, want)
		}
	}
	l, err := long.Linkage(f)
	if err != nil {
		t.Fatal(err)
	}
	check("long coil", l, 20*0.5*0.02*b0)
	for _, w := range []float64{0, 0.004} {
		s := Small{Centre: [2]float64{0.3, -0.2}, Axis: [2]float64{0, 2}, Turns: 100, Area: 1e-4, Width: w}
		l, _ = s.Linkage(f)
		check("small coil", l, 100*1e-4*b0)
		// Axis at 60° to the field reads cos 60°.
		s.Axis = [2]float64{math.Sqrt(3), 1}
		l, _ = s.Linkage(f)
		check("tilted small coil", l, 100*1e-4*b0*0.5)
	}
	// Moving in a uniform field changes nothing; flipping doubles.
	a := Small{Axis: [2]float64{0, 1}, Turns: 10, Area: 2e-4}
	b := a
	b.Centre = [2]float64{0.1, 0.1}
	if d, _ := Move(f, a, b); math.Abs(d) > 1e-18 {
		t.Errorf("move in a uniform field: %g, want 0", d)
	}
	b.Axis = [2]float64{0, -1}
	d, _ := Move(f, a, b)
	check("flip", d, -2*10*2e-4*b0)
	// Switching the field off: the change is minus the linkage.
	d, _ = Change(f, a, uniformY(0), a)
	check("switch off", d, -10*2e-4*b0)

	// Axisymmetric uniform Bz = b0: Aφ = b0 r / 2.
	ax := fieldFunc(func(r, z float64) (float64, float64, float64, bool) { return b0 * r / 2, 0, b0, true })
	l, _ = Loop{R: 0.02, Z: 0.1, Turns: 5}.Linkage(ax)
	check("loop", l, 5*math.Pi*0.02*0.02*b0)
	// Winding: mean of π r² b0 over r in [R0, R1] is π b0 (R1³ − R0³)/(3 (R1 − R0)).
	wd := Winding{R0: 0.01, R1: 0.03, Z0: -0.01, Z1: 0.01, Turns: 50}
	l, _ = wd.Linkage(ax)
	check("winding", l, 50*math.Pi*b0*(0.03*0.03*0.03-0.01*0.01*0.01)/(3*0.02))
}

// The flux per metre between radii r1 and r2 of a line current is
// μ0 I/(2π) ln(r2/r1) (Ampère's law, Jackson 1998, section 5.3).
func TestLineCurrentExact(t *testing.T) {
	const i = 150.0
	f := lineCurrent(i)
	for _, c := range []struct{ r1, r2 float64 }{{0.01, 0.02}, {0.005, 0.5}} {
		want := mu0 * i / (2 * math.Pi) * math.Log(c.r2/c.r1)
		// Sides on different rays: the linkage depends only on the radii.
		coil := Long{P: [2]float64{c.r1, 0}, Q: [2]float64{0, c.r2}, Turns: 3, Length: 2}
		l, err := coil.Linkage(f)
		if err != nil || math.Abs(l-3*2*want) > 1e-14*want*6 {
			t.Errorf("r %g..%g: linkage %g (%v), want %g", c.r1, c.r2, l, err, 6*want)
		}
	}
	// Moving the outer side from 0.02 to 0.08 m adds μ0 I/(2π) ln 4 per turn and metre.
	a := Long{P: [2]float64{0.01, 0}, Q: [2]float64{0.02, 0}, Turns: 1, Length: 1}
	b := a
	b.Q = [2]float64{0.08, 0}
	d, _ := Move(f, a, b)
	if want := mu0 * i / (2 * math.Pi) * math.Log(4); math.Abs(d-want) > 1e-15 {
		t.Errorf("move: %g, want %g", d, want)
	}
	// A small coil averaged over its width reads the mean of Bn over the
	// width, which for the tangential field of the line current along a
	// radial segment from r1 to r2 is μ0 I ln(r2/r1) / (2π (r2 − r1)).
	s := Small{Centre: [2]float64{0.015, 0}, Axis: [2]float64{0, 1}, Turns: 1, Area: 1, Width: 0.01}
	l, _ := s.Linkage(f)
	if want := mu0 * i * math.Log(2) / (2 * math.Pi * 0.01); math.Abs(l-want) > 1e-15 {
		t.Errorf("averaged small coil: %g, want %g", l, want)
	}
}

// A round conductor (radius 5 mm, 150 A) at the centre of a circular
// domain held at A = 0 (radius 0.1 m), solved with second-order elements:
// outside the conductor the field is the line current's, and a long coil
// with sides at r1 and r2 links μ0 I/(2π) ln(r2/r1) per turn and metre
// (Ampère's law). The current density is I over the meshed area, so the
// total current is exact; the polygonal outer circle changes A by a
// constant (cancelling in the difference) plus harmonics of order
// (r/R)^n with n ≥ 72 chords, negligible. The potential varies on the
// length scale r, so the mesh is graded with h ≈ 0.06 r; the nodal error
// of the P2 potential is then of order (h/r)³/10 ≈ 2e-5 relative
// (measured: below 6e-6).
// Tolerance 5e-5.
func TestLineCurrentMeshed(t *testing.T) {
	const i, a, r = 150.0, 0.005, 0.1
	circle := func(rad float64, reg int32) mesh.Polygon {
		return mesh.Polygon{X: []float64{rad, -rad}, Y: []float64{0, 0}, Sweep: []float64{math.Pi, math.Pi}, Region: reg}
	}
	in, err := mesh.BuildInput([]mesh.Polygon{circle(a, 1)}, circle(r, 0), mesh.GraphOptions{MaxArcAngle: math.Pi / 36})
	if err != nil {
		t.Fatal(err)
	}
	m, err := mesh.Triangulate(in, mesh.Options{Order: 2, Size: mesh.SizeField{
		Global: 0.01, Points: []mesh.SizePoint{{Size: 0.0003}}, Grading: 0.06}})
	if err != nil {
		t.Fatal(err)
	}
	j := i / m.RegionAreas()[1]
	s, err := solver.Solve(&solver.Problem{Mesh: m, Materials: []solver.Material{air{}, air{}}, CurrentDensity: []float64{0, j}}, solver.Options{})
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct{ r1, r2 float64 }{{0.01, 0.02}, {0.007, 0.09}, {0.02, 0.05}} {
		want := mu0 * i / (2 * math.Pi) * math.Log(c.r2/c.r1)
		l, err := Long{P: [2]float64{c.r1 * math.Cos(0.3), c.r1 * math.Sin(0.3)}, Q: [2]float64{-c.r2, 0}, Turns: 1, Length: 1}.Linkage(s)
		if err != nil {
			t.Fatal(err)
		}
		rel := (l - want) / want
		t.Logf("r %g..%g m: %.6g Wb/m, Ampère %.6g, relative %.2g", c.r1, c.r2, l, want, rel)
		if math.Abs(rel) > 5e-5 {
			t.Errorf("r %g..%g m: %g Wb/m, want %g (relative %g > 5e-5)", c.r1, c.r2, l, want, rel)
		}
	}
}

type air struct{}

func (air) Nu(float64) (float64, float64) { return 1 / mu0, 0 }

// An axisymmetric uniform field Bz = B0, imposed as Aφ = B0 r/2 on the
// outer boundary of a first-order mesh: the exact solution is linear in r,
// so a loop anywhere links N π r² B0 (Stokes) up to the quadrature error
// of the A/r terms off the axis; 1e-6 relative is asserted.
func TestAxisymmetricUniformMeshed(t *testing.T) {
	const b0, rmax, h = 0.4, 0.1, 0.1
	box := mesh.Polygon{X: []float64{0, rmax, rmax, 0}, Y: []float64{-h, -h, h, h}}
	in, err := mesh.BuildInput(nil, box, mesh.GraphOptions{})
	if err != nil {
		t.Fatal(err)
	}
	m, err := mesh.Triangulate(in, mesh.Options{Size: mesh.SizeField{Global: 0.01}})
	if err != nil {
		t.Fatal(err)
	}
	p := &solver.Problem{Mesh: m, Formulation: solver.Axisymmetric, Materials: []solver.Material{air{}}}
	for k := range m.X {
		x, y := m.X[k], m.Y[k]
		if x > 1e-12 && (math.Abs(x-rmax) < 1e-12 || math.Abs(math.Abs(y)-h) < 1e-12) {
			p.Fixed = append(p.Fixed, solver.NodeValue{Node: int32(k), A: b0 * x / 2})
		}
	}
	s, err := solver.Solve(p, solver.Options{})
	if err != nil {
		t.Fatal(err)
	}
	for _, lp := range []Loop{{R: 0.013, Z: 0.021, Turns: 1}, {R: 0.07, Z: -0.05, Turns: 7}} {
		l, err := lp.Linkage(s)
		want := lp.Turns * math.Pi * lp.R * lp.R * b0
		if err != nil || math.Abs(l-want) > 1e-6*want {
			t.Errorf("%+v: %g (%v), want %g", lp, l, err, want)
		}
	}
}

func TestErrors(t *testing.T) {
	f := fieldFunc(func(x, y float64) (float64, float64, float64, bool) { return 0, 0, 0, x < 1 })
	var oe *OutsideError
	if _, err := (Long{P: [2]float64{0, 0}, Q: [2]float64{2, 0}, Turns: 1, Length: 1}).Linkage(f); !errors.As(err, &oe) || oe.What != "Q" {
		t.Errorf("long coil outside: %v", err)
	}
	if _, err := (Small{Centre: [2]float64{5, 0}, Axis: [2]float64{1, 0}, Turns: 1, Area: 1}).Linkage(f); !errors.As(err, &oe) {
		t.Errorf("small coil outside: %v", err)
	}
	if _, err := Move(f, Loop{R: 0.5, Turns: 1}, Loop{R: 2, Turns: 1}); !errors.As(err, &oe) {
		t.Errorf("move outside: %v", err)
	}
	nan := fieldFunc(func(x, y float64) (float64, float64, float64, bool) { return math.NaN(), 0, 0, true })
	if _, err := (Loop{R: 0.5, Turns: 1}).Linkage(nan); !errors.As(err, &oe) {
		t.Errorf("NaN field: %v", err)
	}
	for name, fn := range map[string]func(){
		"zero turns": func() { Loop{R: 1}.Linkage(f) },
		"zero axis":  func() { Small{Turns: 1, Area: 1}.Linkage(f) },
		"same sides": func() { Long{Turns: 1, Length: 1}.Linkage(f) },
		"bad radii":  func() { Winding{R0: 1, R1: 0, Z1: 1, Turns: 1}.Linkage(f) },
		"nil field":  func() { Loop{R: 1, Turns: 1}.Linkage(nil) },
	} {
		func() {
			defer func() {
				if r, ok := recover().(string); !ok || !strings.HasPrefix(r, "searchcoil: ") {
					t.Errorf("%s: recovered %v, want a searchcoil panic", name, r)
				}
			}()
			fn()
		}()
	}
}
