package shim

import (
	"context"
	"strings"
	"testing"

	"polegap/models"
)

// benchWithMin is the bench dipole with a shim-min of min (mm).
func benchWithMin(t *testing.T, min string) []byte {
	t.Helper()
	data, err := models.Example("bench-dipole")
	if err != nil {
		t.Fatal(err)
	}
	s := strings.Replace(string(data), "  chamfer: 5", "  shim-min: "+min+"\n  chamfer: 5", 1)
	if s == string(data) {
		t.Fatal("bench-dipole has no chamfer line")
	}
	return []byte(s)
}

// TestOptimiseBenchDipole: on the bench dipole (quick solves, a few
// evaluations in -short) the optimised shim widens the 1e-4 good-field
// region, and no solved or returned shim is below shim-min (1 mm here,
// above Rose's 0.8 mm height for the 40 mm gap, so the limit binds).
func TestOptimiseBenchDipole(t *testing.T) {
	n := 16
	if testing.Short() {
		n = 5
	}
	res, err := Optimise(context.Background(), "bench.yaml", benchWithMin(t, "1"), Options{MaxEvaluations: n})
	if err != nil {
		t.Fatal(err)
	}
	const min = 1e-3
	if res.Min != min || res.Rose.Height != min {
		t.Errorf("shim-min %g m, Rose height %g m: want the limit, %g m, on both", res.Min, res.Rose.Height, min)
	}
	for _, e := range res.Evals {
		if e.Err == "" && (e.Shape.Height != 0 || e.Shape.Width != 0) && (e.Shape.Height < min || e.Shape.Width < min) {
			t.Errorf("a shim below shim-min was solved: %+v", e.Shape)
		}
	}
	b := res.Best.Shape
	if b.Height < min || b.Width < min {
		t.Errorf("best shim %+v below shim-min", b)
	}
	t.Logf("unshimmed ±%.2f mm, best ±%.2f mm (gain %.2f mm) with a shim %.3f × %.2f mm after %d evaluations (%s)",
		1e3*res.Unshimmed.HalfWidth, 1e3*res.Best.HalfWidth, 1e3*res.Gain(), 1e3*b.Height, 1e3*b.Width, len(res.Evals), res.Status)
	// Measured on the quick mesh: ±25.0 mm unshimmed; ±32.2 mm (+7.2 mm)
	// after five shapes (-short), ±40.3 mm (+15.3 mm, a shim 1.58 × 7.6
	// mm) after sixteen. Assert at least 5 mm (a fifth) wider.
	if res.Gain() < 5e-3 {
		t.Errorf("gain %.2f mm, want at least 5 mm", 1e3*res.Gain())
	}
	if len(res.Before.X) == 0 || len(res.After.X) != len(res.After.Dev) {
		t.Errorf("profiles: before %d points, after %d/%d", len(res.Before.X), len(res.After.X), len(res.After.Dev))
	}
}
