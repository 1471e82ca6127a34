package solver

import (
	"math"
	"testing"
)

// Chord steps (Options.Steps = Chord) from a sweep's warm start — the
// saturating ring solved at 6 kA, then at 6.3 kA starting from that
// solution — reach the same tolerances with fewer factorizations than
// full Newton, and the same potential within them; from zero, deep in
// saturation, the refresh rule still converges.
func TestChordSteps(t *testing.T) {
	const I, r1, r2, R = 6000.0, 0.2, 0.3, 0.5
	radii := []float64{0.05}
	radii = append(radii, geometricRadii(0.1, r1, 48)...)
	radii = append(radii, geometricRadii(r1, r2, 48)[1:]...)
	radii = append(radii, geometricRadii(r2, R, 48)[1:]...)
	m := diskMesh(radii, 48, 2, func(r float64) int32 {
		switch {
		case r > r1 && r < r2:
			return 1
		case r < 0.1:
			return 2
		}
		return 0
	})
	jd := []float64{0, 0, I / (math.Pi * 0.1 * 0.1)}
	p := &Problem{Mesh: m, Materials: []Material{linear{1}, saturating{1000, 1.5}, linear{1}}, CurrentDensity: jd}
	pr, err := Prepare(p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	base, err := pr.Solve(Options{})
	if err != nil {
		t.Fatal(err)
	}
	jd[2] *= 1.05
	full, err := pr.Solve(Options{Initial: base.A})
	if err != nil {
		t.Fatal(err)
	}
	chord, err := pr.Solve(Options{Initial: base.A, Steps: Chord})
	checkSolution(t, chord, err)
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("full Newton: %d steps %.2g; chord: %d steps of which %d chord %.2g",
		full.Iterations, full.History, chord.Iterations, chord.ChordSteps, chord.History)
	if chord.ChordSteps == 0 || chord.Iterations-chord.ChordSteps >= full.Iterations {
		t.Errorf("chord: %d factorizations (%d steps, %d chord), full Newton %d", chord.Iterations-chord.ChordSteps, chord.Iterations, chord.ChordSteps, full.Iterations)
	}
	if chord.Residual > 1e-8 || chord.Update > 1e-6 {
		t.Errorf("chord stopped at residual %.3g, update %.3g", chord.Residual, chord.Update)
	}
	// Both met relative residual 1e-8 and update 1e-6: agreement to 1e-6
	// of max |A|.
	var worst, amax float64
	for i := range full.A {
		worst = math.Max(worst, math.Abs(chord.A[i]-full.A[i]))
		amax = math.Max(amax, math.Abs(full.A[i]))
	}
	t.Logf("largest difference %.2g of max |A|", worst/amax)
	if worst > 1e-6*amax {
		t.Errorf("chord and full Newton differ by %.3g of max |A|", worst/amax)
	}
	// From zero at 3× the current (deep saturation): the refresh rule
	// keeps it converging.
	jd[2] = 3 * I / (math.Pi * 0.1 * 0.1)
	cold, err := pr.Solve(Options{Steps: Chord})
	checkSolution(t, cold, err)
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("from zero at 18 kA: %d steps, %d chord, history %.2g", cold.Iterations, cold.ChordSteps, cold.History)
}
