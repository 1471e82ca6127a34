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

// TestSizeFieldFunc refines a square by a size function that asks for 0.02
// m in the left half only (as an adaptive error estimate would), and checks
// it is met there while the right half stays coarse.
func TestSizeFieldFunc(t *testing.T) {
	f := SizeField{Func: func(x, y float64, _ int32) float64 {
		if x < 0.5 {
			return 0.02
		}
		return math.Inf(1)
	}}
	in := polyInput(boxPoly(0, 0, 1, 1))
	m := mustMesh(t, "func", in, Options{Size: f}, CheckOptions{MinAngle: 28, RegionAreas: map[int32]float64{0: 1}})
	sizeHonoured(t, "func", m, &f)
	left, right := 0, 0
	for tr := 0; tr < m.NumTriangles(); tr++ {
		if m.X[m.Tri[3*tr]] < 0.4 {
			left++
		} else if m.X[m.Tri[3*tr]] > 0.6 {
			right++
		}
	}
	if left < 10*right {
		t.Errorf("func: %d triangles left of x=0.4, %d right of 0.6; want the left much finer", left, right)
	}
}
