package efflen

import (
	"fmt"
	"math"
	"testing"

	"polegap/internal/reference"
	"polegap/models"
)

// The conformal map of an ideal square pole edge is internal/reference's
// (Schwarz-Christoffel; Binns, Lawrenson and Trowbridge 1992, ch. 3, from
// memory): on the plane x(v) = (2δ/π)(v − artanh(1/v)), B/B0 = 1/v, and
// the field integral beyond the ideal step, from deep under the pole to
// X past the edge, is Δ(X) = (δ/π)(ln(v_X² − 1) + 2 − 2 ln 2).

// TestSideViewIdealEdge checks the side-view solve against the conformal
// map: a long magnet (L = 20 g) with tall iron (H = 40 g) is, near each
// end, an ideal square pole edge, so ∫B dz/B0 within ±(L/2 + X) exceeds L
// by 2Δ(X), and B/B0 at X past the end is 1/v(X).
//
// Tolerance 1 % of Δ: the iron's finite height and length perturb the
// edge's field by a relative amount of order (X/H)² and e^(−π L/g) (the
// map's corrections), the rest is discretisation (measured: 7e-4).
func TestSideViewIdealEdge(t *testing.T) {
	const g = 0.04
	geo := Geometry{Gap: g, Length: 20 * g, Height: 40 * g}
	res, err := Side(geo, Options{})
	if err != nil {
		t.Fatal(err)
	}
	delta := g / 2
	for _, xe := range []float64{1, 2, 5} {
		name := fmt.Sprintf("X=%gδ", xe)
		w, ok := res.Within(geo.Length/2 + xe*delta)
		if !ok {
			t.Fatalf("%s: outside", name)
		}
		got := (w - geo.Length) / 2 / delta
		want := reference.SquareEdgeDelta(xe)
		rel := (got - want) / want
		t.Logf("%s: Δ/δ = %.5f, conformal map %.5f, relative %.2g (%d nodes)", name, got, want, rel, res.Nodes)
		if math.Abs(rel) > 0.01 {
			t.Errorf("%s: Δ/δ = %.5f, conformal map %.5f: relative %.3g > 1 %%", name, got, want, rel)
		}
	}
	t.Logf("L_eff = L + %.3f g (estimate %.2g m)", res.K, res.Estimate)
}

// TestLongYoke: as the yoke grows long against the gap the two ends stop
// seeing each other and L_eff − L tends to a constant k·g: k at L = 20 g
// and 40 g agree to 2e-3 (measured: 8e-4, the boundary's radius grows
// with L). For the bench dipole's
// proportions (iron 6.5 g above the face) k lies in 0.8 … 1.6, around the
// common rule L + (1.0 … 1.2)·g (common practice; the view integrates two
// gaps beyond each end, see Options.Reach); the estimate stays below 1e-3
// of L.
func TestLongYoke(t *testing.T) {
	var ks []float64
	for _, l := range []float64{20, 40} {
		geo := Geometry{Gap: 0.04, Length: l * 0.04, Height: 6.5 * 0.04}
		res, err := Side(geo, Options{})
		if err != nil {
			t.Fatal(err)
		}
		t.Logf("L = %g g: L_eff = L + %.4f g (whole mid-plane: L + %.3f g), estimate %.2g m", l, res.K, (res.Whole-geo.Length)/geo.Gap, res.Estimate)
		if res.Estimate > 1e-3*geo.Length {
			t.Errorf("L = %g g: estimate %.3g m", l, res.Estimate)
		}
		ks = append(ks, res.K)
	}
	if math.Abs(ks[0]-ks[1]) > 2e-3 {
		t.Errorf("k = %.5f at 20 g, %.5f at 40 g", ks[0], ks[1])
	}
	if ks[1] < 0.8 || ks[1] > 1.6 {
		t.Errorf("k = %.3f outside 0.8 … 1.6", ks[1])
	}
}

// TestBenchDipoleSideView: the side view read off the bench dipole (40 mm
// gap, 300 mm of iron, 80 mm pole and 180 mm arm above the face), with
// and without pole-edge shims.
func TestBenchDipoleSideView(t *testing.T) {
	m, err := models.LoadExample("bench-dipole")
	if err != nil {
		t.Fatal(err)
	}
	geo, err := FromModel(m)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(geo.Height-0.26) > 1e-9 || geo.Length != 0.3 || geo.Gap != 0.04 {
		t.Fatalf("side view %+v, want gap 0.04, length 0.3, height 0.26 m", geo)
	}
	// Shims at the face edges leave the view through the centre alone.
	data, _ := models.Example("bench-dipole")
	ms, err := models.ParseWith("x.yaml", data, []models.Setting{{Path: "dimensions.shim-height", Value: "1"}, {Path: "dimensions.shim-width", Value: "10"}})
	if err != nil {
		t.Fatal(err)
	}
	if gs, err := FromModel(ms); err != nil || gs != geo {
		t.Errorf("shimmed: %+v, %v; want %+v", gs, err, geo)
	}
}
