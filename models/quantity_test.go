package models

import (
	"math"
	"testing"
)

func TestParseQuantity(t *testing.T) {
	for _, c := range []struct {
		in, kind string
		want     float64
	}{
		{"1.2T", "field", 1.2},
		{"850 mT", "field", 0.85},
		{"12kG", "field", 1.2}, // 1 G = 1e-4 T (CGS gauss, exact by definition)
		{"40mm", "length", 0.04},
		{"1in", "length", 0.0254}, // international inch, 1959
		{"2.5e-3", "length", 2.5e-3},
		{"32000At", "ampere-turns", 32000},
		{"3.2kAt", "ampere-turns", 3200},
		{"25A", "current", 25},
		{"48V", "voltage", 48},
		{"100mm2", "area", 1e-4},
		{"2.5 cm2", "area", 2.5e-4},
	} {
		got, err := ParseQuantity(c.in, c.kind)
		if err != nil || math.Abs(got-c.want) > 1e-15*math.Abs(c.want) {
			t.Errorf("ParseQuantity(%q, %q) = %g, %v; want %g", c.in, c.kind, got, err, c.want)
		}
	}
	for _, bad := range []struct{ in, kind string }{{"1.2X", "field"}, {"T", "field"}, {"", "length"}, {"1.2MT", "field"}, {"nan", "field"}} {
		if _, err := ParseQuantity(bad.in, bad.kind); err == nil {
			t.Errorf("ParseQuantity(%q, %q) should fail", bad.in, bad.kind)
		}
	}
}
