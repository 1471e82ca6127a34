package design

import (
	"strings"
	"testing"

	"polegap/models"
	"polegap/post/study"
)

// Every iron region of a result names its B-H curve and where the data
// come from (issue 18): the bench dipole's yoke uses a library curve of
// typical values from memory, which the report must say, and the area
// fraction beyond the curve's last table point is reported (0 here: its
// table runs to 2.5 T, far above the yoke's field).
func TestSaturationCurveSource(t *testing.T) {
	m, err := models.LoadExample("bench-dipole")
	if err != nil {
		t.Fatal(err)
	}
	res, err := study.Run(m, study.Options{})
	if err != nil {
		t.Fatal(err)
	}
	d := NewDesign(res, DesignOptions{StressOnly: true})
	if len(d.Saturation) == 0 {
		t.Fatal("no saturation report")
	}
	for _, s := range d.Saturation {
		if s.Curve == "" || !s.FromMemory || !strings.HasPrefix(s.Source, "from memory") {
			t.Errorf("%s: curve %q, source %q, from memory %v", s.Region, s.Curve, s.Source, s.FromMemory)
		}
		if s.TableEnd < 2 || s.BeyondTable != 0 {
			t.Errorf("%s: table end %.3f T, beyond %.3g", s.Region, s.TableEnd, s.BeyondTable)
		}
	}
}
