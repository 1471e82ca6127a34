package report

import (
	"bytes"
	"strings"
	"testing"

	"polegap/models"
	"polegap/post/study"
	"polegap/post/workflow/design"
)

// TestSummaryFlagsLimit: the terminal summary of the default example with
// a 1.6 T saturation limit marks the saturating back leg and arms (the
// design test shows the limit is exceeded there) and prints no non-finite
// number.
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
	for _, bad := range []string{"NaN", "Inf"} {
		if strings.Contains(out, bad) {
			t.Errorf("summary holds %s:\n%s", bad, out)
		}
	}
}
