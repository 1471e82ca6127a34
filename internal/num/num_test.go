package num

import (
	"math"
	"testing"
)

// TestMu0 compares Mu0 with the measured magnetic constant: CODATA 2018,
// μ0 = 1.25663706212(19)e-6 N/A² (E. Tiesinga, P. J. Mohr, D. B. Newell and
// B. N. Taylor, "CODATA recommended values of the fundamental physical
// constants: 2018", Rev. Mod. Phys. 93, 025010, 2021; from memory).
func TestMu0(t *testing.T) {
	const codata2018 = 1.25663706212e-6
	// 1e-9: the bound Mu0's doc promises; the difference is about 5.4e-10.
	if d := math.Abs(Mu0/codata2018 - 1); d > 1e-9 {
		t.Errorf("Mu0 = %.12g differs from CODATA 2018 by %.3g relative", Mu0, d)
	}
}

func TestFinite(t *testing.T) {
	for _, tc := range []struct {
		v    float64
		want bool
	}{
		{0, true}, {math.Copysign(0, -1), true}, {1, true}, {-math.MaxFloat64, true},
		{math.SmallestNonzeroFloat64, true},
		{math.Inf(1), false}, {math.Inf(-1), false}, {math.NaN(), false},
	} {
		if got := Finite(tc.v); got != tc.want {
			t.Errorf("Finite(%g) = %v, want %v", tc.v, got, tc.want)
		}
	}
}
