package target

import (
	"context"
	"math"
	"testing"

	"polegap/internal/num"
	"polegap/models"
	"polegap/post/internal/fixture"
	"polegap/post/workflow/sweep"
	"polegap/solver"
)

func smallCore(t *testing.T, steel string) *models.Model {
	return fixture.SmallCore(t, steel, 15, 1)
}

func runner(t *testing.T, m *models.Model) *sweep.Runner {
	t.Helper()
	r, err := sweep.NewRunner(context.Background(), m, "", "", solver.Options{})
	if err != nil {
		t.Fatal(err)
	}
	return r
}

// TestLinearTarget: with linear iron B is proportional to I, so the search
// must land on I = I0 · Bt/B0 (superposition) within its tolerance.
func TestLinearTarget(t *testing.T) {
	m := smallCore(t, "{mu-r: 2000}")
	r := runner(t, m)
	want := r.BaseCurrent() * 0.8 / r.BaseField()
	res, err := Search(context.Background(), r, 0.8, Options{GapLength: m.Gap})
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(res.Current-want) > 1e-4*want || math.Abs(res.Point.Field-0.8) > 1e-4*0.8 {
		t.Errorf("current %g A (want %g), field %g T after %d solves", res.Current, want, res.Point.Field, len(res.Solves))
	}
}

// TestSaturatedTarget: in saturating steel the search still meets the
// tolerance, in few solves, and needs more ampere-turns than the ideal
// circuit (efficiency below 1).
func TestSaturatedTarget(t *testing.T) {
	m := smallCore(t, "{curve: low-carbon-steel}")
	r := runner(t, m)
	const bt = 1.05
	res, err := Search(context.Background(), r, bt, Options{GapLength: m.Gap})
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(res.Point.Field-bt) > 1e-4*bt {
		t.Errorf("field %g T, want %g within 1e-4", res.Point.Field, bt)
	}
	ideal := bt * m.Gap / num.Mu0
	if !(res.AmpereTurns > ideal) {
		t.Errorf("needs %g ampere-turns, no more than the ideal %g", res.AmpereTurns, ideal)
	}
	if len(res.Solves) > 12 {
		t.Errorf("%d solves: the search should close in faster", len(res.Solves))
	}
}

func TestUnreachable(t *testing.T) {
	m := smallCore(t, "{curve: low-carbon-steel}")
	r := runner(t, m)
	_, err := Search(context.Background(), r, 6, Options{GapLength: m.Gap})
	if !IsUnreachable(err) {
		t.Fatalf("6 T in a steel C-core: err = %v, want UnreachableError", err)
	}
}

// TestFromCurve: given an excitation curve solved with the same runner,
// the search starts inside the bracket the curve gives and lands on the
// same ampere-turns as a search from the ideal-circuit estimate (within
// the field tolerance, through the curve's slope), in fewer solves. A
// curve point within the tolerance is the answer without a solve.
func TestFromCurve(t *testing.T) {
	m := smallCore(t, "{curve: low-carbon-steel}")
	const bt = 1.05
	cold, err := Search(context.Background(), runner(t, m), bt, Options{GapLength: m.Gap})
	if err != nil {
		t.Fatal(err)
	}
	r := runner(t, m)
	i0 := r.BaseCurrent()
	pts, err := r.Sweep(context.Background(), sweep.Options{Currents: sweep.Range(i0, 16*i0, 16)})
	if err != nil {
		t.Fatal(err)
	}
	warm, err := Search(context.Background(), r, bt, Options{GapLength: m.Gap, Known: pts})
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("from the estimate: %d solves, %.6g A-t; from the curve: %d solves, %.6g A-t", len(cold.Solves), cold.AmpereTurns, len(warm.Solves), warm.AmpereTurns)
	if math.Abs(warm.Point.Field-bt) > 1e-4*bt {
		t.Errorf("field %g T, want %g within 1e-4", warm.Point.Field, bt)
	}
	// Both answers lie where the field is within 1e-4 of the target; on
	// this curve (dB/dNI well above 1e-6 T per A-t) that is a few A-t.
	if math.Abs(warm.AmpereTurns-cold.AmpereTurns) > 2e-3*cold.AmpereTurns {
		t.Errorf("from the curve %g A-t, from the estimate %g A-t", warm.AmpereTurns, cold.AmpereTurns)
	}
	if len(warm.Solves) >= len(cold.Solves) {
		t.Errorf("from the curve %d solves, from the estimate %d", len(warm.Solves), len(cold.Solves))
	}
	// A curve point as the target: no solve.
	p := pts[7]
	hit, err := Search(context.Background(), r, p.Field, Options{GapLength: m.Gap, Known: pts})
	if err != nil {
		t.Fatal(err)
	}
	if len(hit.Solves) != 0 || hit.Current != p.Current {
		t.Errorf("target on a curve point: %d solves, current %g (point %g)", len(hit.Solves), hit.Current, p.Current)
	}
	// Every point below the target: the search steps up from the highest.
	low, err := Search(context.Background(), r, bt, Options{GapLength: m.Gap, Known: pts[:3]})
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(low.Point.Field-bt) > 1e-4*bt {
		t.Errorf("from low points: field %g T, want %g", low.Point.Field, bt)
	}
}
