package design

import (
	"encoding/json"
	"strings"
	"testing"

	"polegap/models"
	"polegap/post/study"
)

// TestProbeJSONAxes: an axisymmetric model's probes are written with r, z,
// br, bz (its x and y are r and z), a planar model's with x, y, bx, by; the
// values are the same numbers either way.
func TestProbeJSONAxes(t *testing.T) {
	for _, c := range []struct {
		example    string
		want, none []string
	}{
		{"calibration-solenoid", []string{`"r":`, `"z":`, `"br":`, `"bz":`, `"bz_mean":`}, []string{`"x":`, `"bx":`, `"by":`, `"by_mean":`}},
		{"bench-dipole", []string{`"x":`, `"y":`, `"bx":`, `"by":`, `"by_mean":`}, []string{`"r":`, `"br":`, `"bz":`}},
	} {
		m, err := models.LoadExample(c.example)
		if err != nil {
			t.Fatal(err)
		}
		s, err := study.Run(m, study.Options{})
		if err != nil {
			t.Fatalf("%s: %v", c.example, err)
		}
		r := New(s, DesignOptions{StressOnly: true})
		data, err := json.Marshal(r.Probes)
		if err != nil {
			t.Fatal(err)
		}
		js := string(data)
		for _, w := range c.want {
			if !strings.Contains(js, w) {
				t.Errorf("%s: probes JSON lacks %s: %s", c.example, w, js)
			}
		}
		for _, w := range c.none {
			if strings.Contains(js, w) {
				t.Errorf("%s: probes JSON has %s: %s", c.example, w, js)
			}
		}
		// The point probe's values survive the renaming.
		var back map[string]map[string]any
		if err := json.Unmarshal(data, &back); err != nil {
			t.Fatal(err)
		}
		for name, p := range r.Probes {
			if p.Kind != "point" || p.By == nil {
				continue
			}
			key := "by"
			if p.Axisymmetric() {
				key = "bz"
			}
			if got := back[name][key]; got != *p.By {
				t.Errorf("%s %s: %s = %v, want %v", c.example, name, key, got, *p.By)
			}
		}
	}
}
