package compsum

import "testing"

// TestCancellation: 1 + 1e100 + 1 − 1e100 is 2 in exact arithmetic; a
// plain float64 sum and Kahan's gives 0, Neumaier's 2 (the standard
// illustration of Neumaier 1974, quoted from memory).
func TestCancellation(t *testing.T) {
	var k Sum
	for _, x := range []float64{1, 1e100, 1, -1e100} {
		k.Add(x)
	}
	if k.Value() != 2 {
		t.Errorf("sum = %g, want 2", k.Value())
	}
}
