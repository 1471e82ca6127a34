package target

import (
	"context"
	"math"
	"testing"

	"polegap/models"
	"polegap/post/internal/fixture"
	"polegap/post/sweep"
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
	ideal := bt * m.Gap / mu0
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
