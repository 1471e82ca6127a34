package mesh

import (
	"math"
	"testing"
)

func TestSizeFieldAt(t *testing.T) {
	f := &SizeField{
		Global: 1,
		Region: map[int32]float64{2: 0.5},
		Points: []SizePoint{{X: 10, Y: 0, Size: 0.1}},
		Lines:  []SizeLine{{X0: 0, Y0: 5, X1: 4, Y1: 5, Size: 0.2}},
	}
	for _, c := range []struct {
		name   string
		x, y   float64
		region int32
		want   float64
	}{
		{"global", -50, -50, 0, 1},
		{"region", -50, -50, 2, 0.5},
		{"at point", 10, 0, 0, 0.1},
		{"near point, default grading 0.3", 11, 0, 0, 0.1 + 0.3},
		{"on line", 2, 5, 0, 0.2},
		{"beside line", 2, 6, 0, 0.2 + 0.3},
		{"past line end", 5, 5, 0, 0.2 + 0.3},
		{"far from line, capped by global", 7, 5, 0, 1},
	} {
		if got := f.At(c.x, c.y, c.region); math.Abs(got-c.want) > 1e-15 {
			t.Errorf("%s: At = %g, want %g", c.name, got, c.want)
		}
	}
	var none *SizeField
	if !math.IsInf(none.At(0, 0, 0), 1) || !math.IsInf((&SizeField{}).At(0, 0, 0), 1) {
		t.Error("empty field: want +Inf")
	}
	if !(&SizeField{}).isZero() || f.isZero() {
		t.Error("isZero wrong")
	}
}
