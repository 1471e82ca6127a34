package library

import (
	"bytes"
	"strings"
	"testing"

	"polegap/materials"
)

func TestCurvesMonotoneAndListed(t *testing.T) {
	var buf bytes.Buffer
	if err := WriteList(&buf); err != nil {
		t.Fatal(err)
	}
	for _, e := range materials.Library() {
		if !strings.Contains(buf.String(), e.Name) || e.Source == "" {
			t.Errorf("%s: missing from the listing or without a source", e.Name)
		}
		mat, _, _ := materials.Lookup(e.Name)
		c, ok := mat.(*materials.Curve)
		if !ok {
			continue
		}
		h, b, mur := Curves(c, 100)
		for i := 1; i < len(h); i++ {
			if !(h[i] > h[i-1] && b[i] > b[i-1] && mur[i] > 0) {
				t.Fatalf("%s: sampled curve not increasing at %d: H %g→%g, B %g→%g, μr %g", e.Name, i, h[i-1], h[i], b[i-1], b[i], mur[i])
			}
		}
	}
	if _, _, err := Figures("air"); err == nil {
		t.Error("Figures(air) should refuse a linear material")
	}
}
