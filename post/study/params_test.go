package study_test

import (
	"math"
	"reflect"
	"testing"

	"polegap/materials"
	"polegap/models"
	"polegap/post/study"
	"polegap/solver"
)

// linearDipole is the bench dipole with its steel replaced by a linear
// material (μr = 1000), so that the field is linear in the sources.
func linearDipole(t *testing.T) *models.Model {
	t.Helper()
	m, err := models.LoadExample("bench-dipole")
	if err != nil {
		t.Fatal(err)
	}
	m.Mesh.Size *= 2 // coarse: only linearity is asked
	for i := range m.Materials {
		m.Materials[i].Curve = ""
		m.Materials[i].MuR = 1000
	}
	return m
}

// TestSolveAtSuperposition: with linear materials the magnetostatic
// equations are linear in the current density (superposition; e.g. J. D.
// Jackson, Classical Electrodynamics, 3rd ed., 1999, §5.8 with a
// constant permeability), so doubling the current or the turns doubles
// the gap field. Both reuse the compiled study (no remeshing) and leave
// the model as it was loaded.
func TestSolveAtSuperposition(t *testing.T) {
	m := linearDipole(t)
	before := m.Clone()
	s, err := study.Compile(m)
	if err != nil {
		t.Fatal(err)
	}
	base, err := s.SolveAt(study.Params{}, solver.Options{})
	if err != nil {
		t.Fatal(err)
	}
	i0, n0 := m.Coils[0].Current, m.Coils[0].Turns
	double, err := s.SolveAt(study.Params{Currents: []float64{2 * i0}}, solver.Options{})
	if err != nil {
		t.Fatal(err)
	}
	turns, err := s.SolveAt(study.Params{Turns: []float64{2 * n0}}, solver.Options{})
	if err != nil {
		t.Fatal(err)
	}
	probe := m.MainProbe()
	b0 := fieldAt(t, base, probe)
	for _, c := range []struct {
		name string
		r    *study.Result
	}{{"twice the current", double}, {"twice the turns", turns}} {
		b := fieldAt(t, c.r, probe)
		// The solve's residual is 1e-8 relative at most (solver's
		// default tolerance); a linear problem converges in one step to
		// the Cholesky factor's rounding, far below 1e-9.
		if math.Abs(b-2*b0) > 1e-9*b0 {
			t.Errorf("%s: gap field %.12g T, want twice %.12g T", c.name, b, b0)
		}
		if c.r.Study != s || c.r.Remeshed || c.r.Disc != base.Disc {
			t.Errorf("%s: solved on another study or mesh (remeshed %v)", c.name, c.r.Remeshed)
		}
	}
	// Results are snapshots: the later solves did not change the first.
	if b := fieldAt(t, base, probe); b != b0 {
		t.Errorf("the first result changed from %g to %g T after later solves", b0, b)
	}
	if !reflect.DeepEqual(m, before) {
		t.Error("solving at other parameters changed the loaded model")
	}
}

// TestSolveAtGap: a gap other than the model's remeshes; the result is
// the one a model drawn with that gap gives (bit for bit: the same mesh
// input), a longer gap gives a lower field (the ideal circuit
// B = μ0 NI / g), and the loaded model is not changed.
func TestSolveAtGap(t *testing.T) {
	m := linearDipole(t)
	before := m.Clone()
	s, err := study.Compile(m)
	if err != nil {
		t.Fatal(err)
	}
	g := 1.25 * m.Gap
	r, err := s.SolveAt(study.Params{Gap: g}, solver.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if !r.Remeshed || r.Model.Gap != g || r.Disc == s.Disc {
		t.Fatalf("gap %g m: remeshed %v, model gap %g m", g, r.Remeshed, r.Model.Gap)
	}
	cp, _ := m.CentreProbe()
	mg, err := m.WithGap(cp.Point[1], g-m.Gap)
	if err != nil {
		t.Fatal(err)
	}
	want, err := study.Run(mg, study.Options{})
	if err != nil {
		t.Fatal(err)
	}
	probe := m.MainProbe()
	if got, w := fieldAt(t, r, probe), fieldAt(t, want, probe); got != w {
		t.Errorf("gap %g m: field %.15g T, a model drawn with that gap gives %.15g T", g, got, w)
	}
	base, err := s.SolveAt(study.Params{}, solver.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if base.Remeshed || base.Disc != s.Disc {
		t.Error("the model's own gap was solved on another mesh")
	}
	if b, b0 := fieldAt(t, r, probe), fieldAt(t, base, probe); !(b < b0) {
		t.Errorf("a 25 %% longer gap gives %g T, not below the %g T of the model's gap", b, b0)
	}
	if !reflect.DeepEqual(m, before) {
		t.Error("solving at another gap changed the loaded model")
	}
	if _, err := s.SolveAt(study.Params{Gap: -1}, solver.Options{}); err == nil {
		t.Error("a negative gap was accepted")
	}
	if _, err := s.SolveAt(study.Params{Currents: []float64{math.NaN()}}, solver.Options{}); err == nil {
		t.Error("a NaN current was accepted")
	}
}

// TestIronScale: the cut ring of TestMagneticCircuit with its iron k
// times as permeable obeys NI = B g/μ0 + H(B)/k · l_iron (the ideal
// magnetic circuit with the scaled curve; D. Jiles, Introduction to
// Magnetism and Magnetic Materials, 2nd ed., 1998, §5.3), within the 1 %
// budget of TestMagneticCircuit, on one compiled study.
func TestIronScale(t *testing.T) {
	mat, _, _ := materials.Lookup("low-carbon-steel")
	curve := mat.(*materials.Curve)
	const mu0 = materials.Mu0
	g := 0.02e-3
	l := 2*math.Pi*0.100 - g
	const ni = 400.0
	s, err := study.Compile(ring(t, ni))
	if err != nil {
		t.Fatal(err)
	}
	for _, k := range []float64{0.7, 1, 1.4} {
		lo, hi := 0.0, mu0*ni/g
		for i := 0; i < 100; i++ {
			b := 0.5 * (lo + hi)
			if b*g/mu0+curve.H(b)/k*l > ni {
				hi = b
			} else {
				lo = b
			}
		}
		want := 0.5 * (lo + hi)
		r, err := s.SolveAt(study.Params{IronScale: k}, solver.Options{})
		if err != nil {
			t.Fatal(err)
		}
		got := r.Probes[0].Point.B()
		t.Logf("iron scale %g: gap field %.5f T, magnetic circuit %.5f T", k, got, want)
		if math.Abs(got-want) > 0.01*want {
			t.Errorf("iron scale %g: gap field %.5f T, magnetic circuit %.5f T", k, got, want)
		}
	}
}

// TestParams lists the parameters of an example with what they change.
func TestParams(t *testing.T) {
	m, err := models.LoadExample("bench-dipole")
	if err != nil {
		t.Fatal(err)
	}
	s, err := study.Compile(m)
	if err != nil {
		t.Fatal(err)
	}
	kinds := map[string]study.ParamKind{}
	for _, p := range s.Params() {
		kinds[p.Name] = p.Kind
	}
	want := map[string]study.ParamKind{
		"current:" + m.Coils[0].Name: study.SourceParam,
		"turns:" + m.Coils[0].Name:   study.SourceParam,
		"iron":                       study.MaterialParam,
		"gap":                        study.GeometryParam,
	}
	if !reflect.DeepEqual(kinds, want) {
		t.Errorf("parameters %v, want %v", kinds, want)
	}
}

func fieldAt(t *testing.T, r *study.Result, probe string) float64 {
	t.Helper()
	p, ok := r.Probe(probe)
	if !ok {
		t.Fatalf("no probe %q", probe)
	}
	if p.Kind == models.ProbePoint {
		return p.Point.B()
	}
	return p.Stats.Mean
}
