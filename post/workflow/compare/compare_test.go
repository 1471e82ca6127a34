package compare

import (
	"bytes"
	"context"
	"math"
	"reflect"
	"strings"
	"testing"

	"polegap/models"
	"polegap/post/internal/fixture"
	"polegap/post/measure"
	"polegap/post/study"
)

func smallCore(t *testing.T) *models.Model {
	return fixture.SmallCore(t, "{curve: low-carbon-steel}", 15, 1)
}

// synthetic makes a "measured" curve from a model (no noise): the field
// at each current with a stated σ.
func synthetic(t *testing.T, m *models.Model, currents []float64, sigma float64) *measure.Curve {
	t.Helper()
	b, err := Predict(context.Background(), m, currents, Options{})
	if err != nil {
		t.Fatal(err)
	}
	c := &measure.Curve{Name: "synthetic", Kind: measure.Field}
	for i, I := range currents {
		c.Points = append(c.Points, measure.Point{Current: I, Field: b[i], FieldSigma: sigma})
	}
	return c
}

// TestSelfComparison: the model compared with its own prediction has zero
// residuals (to the solver's tolerance), whatever the order of currents.
func TestSelfComparison(t *testing.T) {
	m := smallCore(t)
	c := synthetic(t, m, []float64{150, 30, 90}, 0)
	r, err := Compare(context.Background(), m, c, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if r.MaxRel > 1e-7 {
		t.Errorf("self-comparison residual %g relative, want < 1e-7 (Newton tolerance 1e-8)", r.MaxRel)
	}
}

// TestRecoverGap is the round trip the issue asks for: "measurements" made
// with a 41.5 mm gap, the model drawn with 40 mm; calibrating the gap must
// recover 41.5 mm. The tolerance, 0.2 mm on a coarse first-order mesh, allows the meshes of different
// gaps to differ (the answer is not computed on the mesh the data came
// from) and is far below the 1.5 mm change.
func TestRecoverGap(t *testing.T) {
	m := smallCore(t)
	truth, err := m.WithGap(0, 0.0015)
	if err != nil {
		t.Fatal(err)
	}
	c := synthetic(t, truth, []float64{60, 120, 180}, 1e-3)
	before := m.Clone()
	f, err := Calibrate(context.Background(), m, c, []Parameter{Gap}, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(m, before) {
		t.Error("calibration changed the loaded model")
	}
	e := f.Parameters[0]
	if math.Abs(e.Value-0.0415) > 2e-4 {
		t.Errorf("fitted gap %.5f m, want 0.04150 (from %.5f), %d iterations", e.Value, e.Nominal, f.Iterations)
	}
	if !(f.After.RMS < f.Before.RMS/10) {
		t.Errorf("RMS residual %g T after the fit, %g T before", f.After.RMS, f.Before.RMS)
	}
	if !(e.Sigma > 0 && e.Sigma < 1e-3) {
		t.Errorf("uncertainty %g m", e.Sigma)
	}
	if !e.Plausible {
		t.Errorf("a 1.5 mm change of a 40 mm gap is within 5 %%: %s", e.Verdict)
	}
}

// TestRecoverTurns: with every field produced by N·I alone, data made with
// 190 turns fit 190 turns (to the solver's tolerance); 5 % off is flagged
// implausible by the ±2 % rule.
func TestRecoverTurns(t *testing.T) {
	m := smallCore(t)
	truth := m.Clone()
	truth.Coils[0].Turns = 190
	c := synthetic(t, truth, []float64{50, 100, 150}, 0)
	before := m.Clone()
	f, err := Calibrate(context.Background(), m, c, []Parameter{Turns}, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(m, before) {
		t.Error("calibration changed the loaded model")
	}
	e := f.Parameters[0]
	if math.Abs(e.Value-190) > 0.05 {
		t.Errorf("fitted %g turns, want 190", e.Value)
	}
	if e.Plausible {
		t.Errorf("5 %% fewer turns should not pass as plausible: %s", e.Verdict)
	}
}

// TestRecoverGapAndIron: "measurements" from a magnet built with a
// 41.5 mm gap (drawn 40 mm) and steel 15 % less permeable than its curve
// (iron scale 0.85), taken up into saturation where the two act
// differently; fitting both at once must recover both. Tolerances: 0.2 mm
// as in TestRecoverGap (the meshes of different gaps differ), and 0.05 on
// the iron scale (measured: see the log; the field depends on the scale
// only through the iron's small share of the reluctance, so remeshing
// noise is amplified several times).
func TestRecoverGapAndIron(t *testing.T) {
	m := smallCore(t)
	truth, err := m.WithGap(0, 0.0015)
	if err != nil {
		t.Fatal(err)
	}
	s, err := study.Compile(truth)
	if err != nil {
		t.Fatal(err)
	}
	currents := []float64{50, 150, 300, 500, 800, 1200}
	b, err := PredictAt(context.Background(), s, study.Params{IronScale: 0.85}, currents, Options{})
	if err != nil {
		t.Fatal(err)
	}
	c := &measure.Curve{Name: "synthetic", Kind: measure.Field}
	for i, I := range currents {
		c.Points = append(c.Points, measure.Point{Current: I, Field: b[i], FieldSigma: 2e-3})
	}
	f, err := Calibrate(context.Background(), m, c, []Parameter{Gap, Iron}, Options{})
	if err != nil {
		t.Fatal(err)
	}
	g, k := f.Parameters[0], f.Parameters[1]
	t.Logf("gap %.5f ± %.5f m, iron %.4f ± %.4f, ρ = %.3f, χ² = %.3g, ν = %d, %d iterations, %d solve rounds",
		g.Value, g.Sigma, k.Value, k.Sigma, f.Correlation[0][1], f.ChiSquare, f.Dof, f.Iterations, f.Solves)
	if math.Abs(g.Value-0.0415) > 2e-4 {
		t.Errorf("fitted gap %.5f m, want 0.04150", g.Value)
	}
	if math.Abs(k.Value-0.85) > 0.05 {
		t.Errorf("fitted iron scale %.4f, want 0.85", k.Value)
	}
	if f.Dof != len(currents)-2 || len(f.Correlation) != 2 || math.Abs(f.Correlation[0][1]) >= 1 {
		t.Errorf("ν = %d, correlation %v", f.Dof, f.Correlation)
	}
}

// TestOffsetAndZeroCurrent: a remanent 8 mT added to every point, one of
// them at 0 A. The comparison reports the relative residual at 0 A as
// undefined (nil, "undefined" in the text, never "+0.00 %"), and fitting
// the offset alone recovers 8 mT with no further solve.
func TestOffsetAndZeroCurrent(t *testing.T) {
	m := smallCore(t)
	c := synthetic(t, m, []float64{0, 40, 80, 120}, 1e-3)
	for i := range c.Points {
		c.Points[i].Field += 8e-3
	}
	r, err := Compare(context.Background(), m, c, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if r.Residuals[0].Rel != nil || r.RelPoints != 3 {
		t.Errorf("relative residual at 0 A %v, %d relative points; want nil and 3", r.Residuals[0].Rel, r.RelPoints)
	}
	// 8 mT over σ = 1 mT, to the solver's tolerance (1e-7 relative).
	for _, x := range r.Residuals {
		if x.Normalised == nil || math.Abs(*x.Normalised-8) > 1e-4 {
			t.Errorf("normalised residual at %g A: %v, want 8", x.Current, x.Normalised)
		}
	}
	var buf bytes.Buffer
	f, err := Calibrate(context.Background(), m, c, []Parameter{Offset}, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if err := WriteText(&buf, "small-core", "synthetic", r, f); err != nil {
		t.Fatal(err)
	}
	if out := buf.String(); !strings.Contains(out, "undefined") || strings.Contains(out, "+0.00%") {
		t.Errorf("text:\n%s", out)
	}
	// 1e-9 T: the offset enters linearly, so one Gauss–Newton step is
	// exact to rounding.
	if e := f.Parameters[0]; math.Abs(e.Value-8e-3) > 1e-9 || f.Solves != 1 {
		t.Errorf("offset %g T (want 0.008) after %d solve rounds (want 1)", e.Value, f.Solves)
	}
	if f.ChiSquare > 1e-6 || f.BirgeScaled {
		t.Errorf("χ² %g, scaled %v: the data are exact", f.ChiSquare, f.BirgeScaled)
	}
}

// TestBirgeScaledOutput: residuals ten times the stated uncertainty give
// χ²/ν ≫ 1, a Birge-scaled uncertainty, and the text says so with χ², ν
// and the citation.
func TestBirgeScaledOutput(t *testing.T) {
	m := smallCore(t)
	c := synthetic(t, m, []float64{30, 60, 90, 120, 150}, 1e-4)
	for i := range c.Points {
		c.Points[i].Field += 1e-3 * float64(1-2*(i%2)) // ±1 mT, alternating
	}
	f, err := Calibrate(context.Background(), m, c, []Parameter{Iron}, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if !f.BirgeScaled || f.BirgeRatio < 5 || f.Dof != 4 {
		t.Errorf("Birge ratio %g scaled %v ν %d; want ≳ 10, scaled, 4", f.BirgeRatio, f.BirgeScaled, f.Dof)
	}
	var buf bytes.Buffer
	WriteText(&buf, "small-core", "synthetic", f.After, f)
	out := buf.String()
	for _, want := range []string{"χ² =", "ν = 4", "Birge ratio", "Phys. Rev. 40, 207", "JCGM 100:2008"} {
		if !strings.Contains(out, want) {
			t.Errorf("text lacks %q:\n%s", want, out)
		}
	}
}
