package report

import (
	"bytes"
	"encoding/json"
	"math"
	"strings"
	"testing"

	"polegap/models"
	"polegap/post/internal/fixture"
	"polegap/post/study"
	"polegap/post/workflow/design"
)

// TestSummaryFlagsLimit: the terminal summary of the default example with
// a 1.6 T saturation limit marks the saturating back leg and arms (the
// design test shows the limit is exceeded there), reports the pole
// attraction and prints no non-finite number.
func TestSummaryFlagsLimit(t *testing.T) {
	m, err := models.LoadExample("bench-dipole")
	if err != nil {
		t.Fatal(err)
	}
	s, err := study.Run(m, study.Options{})
	if err != nil {
		t.Fatal(err)
	}
	var buf bytes.Buffer
	if err := WriteText(&buf, design.New(s, design.DesignOptions{SaturationLimit: 1.6})); err != nil {
		t.Fatal(err)
	}
	out := buf.String()
	if !strings.Contains(out, "OVER LIMIT") {
		t.Errorf("text summary does not flag the region over the limit:\n%s", out)
	}
	// The attraction between the poles, by both methods, with its error
	// estimate and the caution about pole forces.
	for _, want := range []string{"force on pole attraction (upper-arm, upper-pole) Maxwell stress", "; virtual work (", "; error estimate ±", "caution:   iron poles attract"} {
		if !strings.Contains(out, want) {
			t.Errorf("text summary lacks %q:\n%s", want, out)
		}
	}
	for _, bad := range []string{"NaN", "Inf"} {
		if strings.Contains(out, bad) {
			t.Errorf("summary holds %s:\n%s", bad, out)
		}
	}
}

// TestProbeOnInterfaceText: a point probe on an iron face (fixture.Block)
// lists both sides in the text summary, in the HTML report and in the
// JSON, marks the reported (air) side and carries the warning note.
func TestProbeOnInterfaceText(t *testing.T) {
	s, err := study.Run(fixture.Block(t, 1000, 5, 2), study.Options{})
	if err != nil {
		t.Fatal(err)
	}
	r := design.New(s, design.DesignOptions{})
	var buf bytes.Buffer
	if err := WriteText(&buf, r); err != nil {
		t.Fatal(err)
	}
	out := buf.String()
	for _, want := range []string{"  side air ", "  side block ", "reported)", "note: probe top lies on an interface", "note: probe side lies on an interface"} {
		if !strings.Contains(out, want) {
			t.Errorf("text summary lacks %q:\n%s", want, out)
		}
	}
	if strings.Contains(out, "probe air lies") {
		t.Errorf("the probe in air is flagged:\n%s", out)
	}
	var js bytes.Buffer
	if err := json.NewEncoder(&js).Encode(r); err != nil {
		t.Fatal(err)
	}
	var back struct {
		Probes map[string]struct {
			B     float64 `json:"b"`
			Sides []struct {
				Region   string  `json:"region"`
				MuR      float64 `json:"mu_r"`
				B        float64 `json:"b"`
				Reported bool    `json:"reported"`
			} `json:"interface_sides"`
		} `json:"probes"`
	}
	if err := json.Unmarshal(js.Bytes(), &back); err != nil {
		t.Fatal(err)
	}
	top := back.Probes["top"]
	if len(top.Sides) != 2 || top.Sides[0].Region != "air" || !top.Sides[0].Reported || top.Sides[1].Region != "block" ||
		top.Sides[0].B != top.B || math.Abs(top.Sides[1].MuR-1000) > 1e-9 {
		t.Errorf("JSON probe top: %+v", top)
	}
	if n := len(back.Probes["air"].Sides); n != 0 {
		t.Errorf("JSON probe air has %d sides", n)
	}
	var html bytes.Buffer
	if err := WriteHTML(&html, &Bundle{Report: r}); err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(html.String(), "side block") || !strings.Contains(html.String(), "side air (reported)") {
		t.Errorf("HTML lacks the sides of the interface probe")
	}
}

// TestHTMLEstimates: the HTML report carries the accuracy record and a
// row per converged quantity with its estimate, as the text does.
func TestHTMLEstimates(t *testing.T) {
	r := &design.Report{Model: "m", Design: &design.Design{Gap: &design.GapReport{Probe: "c", CentreB: 0.5}},
		Accuracy:  &design.Accuracy{Target: 1e-3, Reached: true, Rounds: 2},
		Estimates: map[string]float64{"gap.centre_B_T": 2e-5}}
	var buf bytes.Buffer
	if err := WriteHTML(&buf, &Bundle{Report: r, Estimates: estimateRows(r)}); err != nil {
		t.Fatal(err)
	}
	out := buf.String()
	for _, want := range []string{"How far to trust the numbers", "refined to 1e-03 relative: reached after 2 meshes", "<td>gap.centre_B_T</td><td>0.5</td><td>2e-05</td><td>4.0e-05</td>"} {
		if !strings.Contains(out, want) {
			t.Errorf("HTML lacks %q", want)
		}
	}
}
