package solver

import (
	"math"
	"testing"
)

// A problem on a mesh whose nodes moved, prepared like the undeformed
// one (PrepareLike), skips the ordering and symbolic analysis and solves
// to the same potential as a fresh Prepare, to 1e-12 (the ordering
// depends on the pattern only, so the factorizations are the same); the
// original's later solves are unchanged by it. The saturating ring of
// TestNewtonNonlinearRing with its iron moved 1 mm along x, the air
// between the iron and the outer boundary stretched.
func TestPrepareLike(t *testing.T) {
	const I, r1, r2, R = 6000.0, 0.2, 0.3, 0.5
	radii := []float64{0.05}
	radii = append(radii, geometricRadii(0.1, r1, 40)...)
	radii = append(radii, geometricRadii(r1, r2, 40)[1:]...)
	radii = append(radii, geometricRadii(r2, R, 40)[1:]...)
	region := func(r float64) int32 {
		switch {
		case r > r1 && r < r2:
			return 1
		case r < 0.1:
			return 2
		}
		return 0
	}
	m := diskMesh(radii, 40, 2, region)
	mats := []Material{linear{1}, saturating{1000, 1.5}, linear{1}}
	jd := []float64{0, 0, I / (math.Pi * 0.1 * 0.1)}
	p := &Problem{Mesh: m, Materials: mats, CurrentDensity: jd}
	base, err := Prepare(p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	s0, err := base.Solve(Options{})
	if err != nil {
		t.Fatal(err)
	}

	// Move the nodes with r >= 0.1 by up to 1 mm: fully inside r2, fading
	// to zero at the outer boundary.
	dm := *m
	dm.X = append([]float64(nil), m.X...)
	for i := range dm.X {
		r := math.Hypot(m.X[i], m.Y[i])
		switch {
		case r < 0.1-1e-9:
		case r <= r2:
			dm.X[i] += 1e-3
		default:
			dm.X[i] += 1e-3 * (R - r) / (R - r2)
		}
	}
	q := &Problem{Mesh: &dm, Materials: mats, CurrentDensity: jd}
	like, err := PrepareLike(q, base, Options{})
	if err != nil {
		t.Fatal(err)
	}
	got, err := like.Solve(Options{Initial: s0.A})
	checkSolution(t, got, err)
	if err != nil {
		t.Fatal(err)
	}
	if got.Time.Analyze != 0 {
		t.Errorf("the like problem analysed its pattern again (%v)", got.Time.Analyze)
	}
	want, err := Solve(q, Options{Initial: s0.A})
	if err != nil {
		t.Fatal(err)
	}
	var worst, amax float64
	for i := range want.A {
		worst = math.Max(worst, math.Abs(got.A[i]-want.A[i]))
		amax = math.Max(amax, math.Abs(want.A[i]))
	}
	t.Logf("%d Newton steps; largest difference %.2g of max |A|", got.Iterations, worst/amax)
	// 1e-12: the same factorizations; only rounding may differ.
	if worst > 1e-12*amax {
		t.Errorf("shared analysis: potential differs by %.3g of max |A| from a fresh preparation", worst/amax)
	}
	// The moved iron changes the field: the test compares two solves of
	// the deformed problem, not the undeformed one twice.
	if d := math.Abs(got.A[0] - s0.A[0]); !(d > 1e-9*amax) {
		t.Errorf("the deformation changed nothing (%.3g)", d)
	}
	again, err := base.Solve(Options{})
	if err != nil {
		t.Fatal(err)
	}
	for i := range again.A {
		if again.A[i] != s0.A[i] {
			t.Fatalf("the original's solve changed at node %d: %g, was %g", i, again.A[i], s0.A[i])
		}
	}

	// Another topology: prepared afresh, still right.
	other := diskMesh(radii[:len(radii)-1], 40, 2, region)
	o, err := PrepareLike(&Problem{Mesh: other, Materials: mats, CurrentDensity: jd}, base, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if os, err := o.Solve(Options{}); err != nil || os.Time.Analyze == 0 {
		t.Errorf("another mesh: %v, analysis %v", err, os.Time.Analyze)
	}
}
