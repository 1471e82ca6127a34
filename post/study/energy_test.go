package study_test

import (
	"math"
	"testing"

	"polegap/materials"
	"polegap/post/study"
)

func relErr(got, want float64) float64 { return math.Abs(got-want) / math.Abs(want) }

// TestEnergyDensity checks w = ∫₀^B H dB of a built-in B-H curve against
// a composite trapezoid rule with 200 000 steps (error O(h²) ≈ 1e-10
// relative), and w + w' = B·H (Legendre transform: w' = ∫₀^H B dH = BH − w
// for a monotone curve). Linear material: w = B²/(2μ0μr) exactly.
func TestEnergyDensity(t *testing.T) {
	steel, _, ok := materials.Lookup("low-carbon-steel")
	if !ok {
		t.Fatal("no low-carbon-steel in the library")
	}
	for _, b := range []float64{0.3, 1.2, 1.8, 2.4, 3} {
		w, wco := study.EnergyDensity(steel, b*b)
		const n = 200000
		var ref float64
		for k := 0; k < n; k++ {
			b0, b1 := b*float64(k)/n, b*float64(k+1)/n
			n0, _ := steel.Nu(b0 * b0)
			n1, _ := steel.Nu(b1 * b1)
			ref += 0.5 * (n0*b0 + n1*b1) * (b1 - b0)
		}
		// 1e-7: 3-point Gauss–Legendre on 0.02 T panels of a piecewise
		// cubic curve whose breaks fall inside panels.
		if e := relErr(w, ref); e > 1e-7 {
			t.Errorf("B = %g T: w = %.10g, reference %.10g (rel %.2g)", b, w, ref, e)
		}
		nu, _ := steel.Nu(b * b)
		if e := relErr(w+wco, nu*b*b); e > 1e-14 {
			t.Errorf("B = %g T: w + w' = %g, B·H = %g", b, w+wco, nu*b*b)
		}
	}
	lin := materials.Linear{MuR: 1000}
	w, wco := study.EnergyDensity(lin, 4)
	if want := 4 / (2 * materials.Mu0 * 1000); relErr(w, want) > 1e-15 || wco != w {
		t.Errorf("linear: w = %g, w' = %g, want %g", w, wco, want)
	}
}

// Memo computes a value once per result and key, and is safe for
// concurrent use.
func TestResultMemo(t *testing.T) {
	var r study.Result
	calls := 0
	f := func() any { calls++; return calls }
	if v := r.Memo("a", f).(int); v != 1 {
		t.Errorf("first value %d", v)
	}
	if v := r.Memo("a", f).(int); v != 1 || calls != 1 {
		t.Errorf("second call: value %d after %d computations", v, calls)
	}
	if v := r.Memo("b", f).(int); v != 2 {
		t.Errorf("another key: %d", v)
	}
	done := make(chan int)
	for k := 0; k < 4; k++ {
		go func() { done <- r.Memo(k%2, func() any { return k % 2 }).(int) }()
	}
	for k := 0; k < 4; k++ {
		<-done
	}
	if r.Memo(0, f).(int) != 0 || r.Memo(1, f).(int) != 1 {
		t.Error("concurrent first calls stored another key's value")
	}
}
