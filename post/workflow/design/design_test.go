package design

import (
	"bytes"
	"encoding/json"
	"math"
	"strings"
	"testing"

	"polegap/models"
	"polegap/post/study"
)

// TestDesignReport runs the default example and checks the design
// quantities against identities that hold whatever the mesh:
//   - λ I = W + W' for a single coil (energy plus co-energy equals the
//     integral of B·H, which for one coil is the flux linkage times the
//     current; e.g. H. H. Woodson and J. R. Melcher, Electromechanical
//     Dynamics, Part I, 1968, ch. 3);
//     (to 1e-6, the Newton tolerance 1e-8 with room), for the stored
//     energy of the summary line and of the energy section alike (one
//     stored energy everywhere);
//   - in saturating iron the incremental inductance is below the apparent
//     one (the B-H curve is concave past its steepest point);
//   - the mean field across the pole face is below the centre field and
//     within a few per cent of it (fringing lowers the field near the
//     edges; common practice for a pole face 4 gaps wide).
func TestDesignReport(t *testing.T) {
	m, err := models.LoadExample("bench-dipole")
	if err != nil {
		t.Fatal(err)
	}
	s, err := study.Run(m, study.Options{})
	if err != nil {
		t.Fatal(err)
	}
	r := New(s, DesignOptions{Incremental: true, SaturationLimit: 1.6})
	d := r.Design
	if d.Gap == nil || d.Uniformity == nil || d.Fringing == nil || len(d.Coils) != 1 || len(d.Saturation) == 0 {
		t.Fatalf("missing sections: %+v", d)
	}
	c := d.Coils[0]
	if lhs, rhs := c.Linkage*c.Current, d.Energy.Energy+d.Energy.CoEnergy; math.Abs(lhs-rhs) > 1e-6*lhs {
		t.Errorf("λI = %.8g J but W + W' = %.8g J", lhs, rhs)
	}
	if lhs, rhs := c.Linkage*c.Current, r.Energy+d.Energy.CoEnergy; math.Abs(lhs-rhs) > 1e-6*lhs {
		t.Errorf("λI = %.8g J but the summary's W + W' = %.8g J", lhs, rhs)
	}
	if !(c.Incremental > 0 && c.Incremental < c.Apparent) {
		t.Errorf("incremental %g H, apparent %g H: want 0 < incremental < apparent", c.Incremental, c.Apparent)
	}
	if g := d.Gap; !(g.PoleFaceAvg < g.CentreB && g.PoleFaceAvg > 0.95*g.CentreB) {
		t.Errorf("pole-face mean %g T against centre %g T", g.PoleFaceAvg, g.CentreB)
	}
	if f := d.Fringing; !(f.Factor > 1 && f.KPerEdge > 0) {
		t.Errorf("fringing %+v: the flux must exceed the ideal B0 w", f)
	}
	over := 0
	for _, sr := range d.Saturation {
		if !sr.Pass {
			over++
		}
	}
	if over == 0 {
		t.Errorf("a 1.6 T limit should flag the saturating back leg and arms (peaks 1.62-1.65 T): %+v", d.Saturation)
	}
	// The attraction between the poles, added by default: the upper arm
	// and pole (wholly above the mid-plane; the back leg crosses it),
	// pulled down. The Maxwell pressure B²/(2μ0) of the gap field (e.g.
	// Griffiths, Introduction to Electrodynamics, 4th ed. 2013, §8.2.2)
	// over the pole face gives at least the pole-face mean squared over
	// the face, and at most B0² over the effective width w + 2kg of the
	// fringing (the field along the mid-plane stays below B0). The two
	// methods agree to their estimate, which is small here (measured
	// 2e-5 of the force).
	var pole *ForceReport
	for i := range d.Forces {
		if d.Forces[i].Automatic {
			pole = &d.Forces[i]
		}
	}
	if pole == nil || pole.Error != "" || pole.VirtualWork == nil || pole.ErrorEstimate == nil {
		t.Fatalf("no pole attraction: %+v", d.Forces)
	}
	if !sameSet(pole.Regions, []string{"upper-arm", "upper-pole"}) {
		t.Errorf("pole attraction on %v, want the upper arm and pole", pole.Regions)
	}
	const mu0 = 4e-7 * math.Pi
	lo := d.Gap.PoleFaceAvg * d.Gap.PoleFaceAvg / (2 * mu0) * d.Gap.PoleWidth * m.Depth
	hi := d.Gap.CentreB * d.Gap.CentreB / (2 * mu0) * d.Fringing.WidthEff * m.Depth
	fy := -pole.Stress[1]
	t.Logf("pole attraction %v N (virtual work %v N, estimate %.3g N); bounds %.4g to %.4g N", pole.Stress, *pole.VirtualWork, *pole.ErrorEstimate, lo, hi)
	if fy < lo || fy > hi {
		t.Errorf("pole attraction %g N outside %g to %g N", fy, lo, hi)
	}
	if e := math.Abs(pole.Stress[1] - pole.VirtualWork[1]); e > *pole.ErrorEstimate*(1+1e-12) || e > 1e-3*fy {
		t.Errorf("stress and virtual work differ by %g N, estimate %g N", e, *pole.ErrorEstimate)
	}
	var buf bytes.Buffer
	if err := json.NewEncoder(&buf).Encode(r); err != nil {
		t.Fatal(err)
	}
	for _, key := range []string{`"gap"`, `"uniformity"`, `"fringing"`, `"coils"`, `"saturation"`, `"energy"`, `"probes"`, `"newton"`, `"mesh"`} {
		if !strings.Contains(buf.String(), key) {
			t.Errorf("JSON lacks %s", key)
		}
	}
}
