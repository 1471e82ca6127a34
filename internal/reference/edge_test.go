package reference

import (
	"math"
	"testing"
)

// SquareEdgeV inverts SquareEdgeX, and the field 1/v falls from 1 under
// the pole towards 0 far beyond the edge.
func TestSquareEdge(t *testing.T) {
	for _, v := range []float64{1.001, 1.1, 2, 10, 1000} {
		if got := SquareEdgeV(SquareEdgeX(v)); math.Abs(got-v) > 1e-9*v {
			t.Errorf("v %g: round trip %g", v, got)
		}
	}
	if b := 1 / SquareEdgeV(-20); math.Abs(b-1) > 1e-6 {
		t.Errorf("deep under the pole B/B0 = %g, want 1", b)
	}
	if b := 1 / SquareEdgeV(200); b > 0.01 {
		t.Errorf("far beyond the edge B/B0 = %g", b)
	}
}
