package solver

import (
	"math"
	"testing"
)

// A prepared problem solved at several excitations (an excitation sweep
// with warm starts, from zero current, whose field needs no factorization
// but whose analysis the later solves reuse) gives the same fields as
// independent solves, analyses the pattern once, and earlier solutions
// keep their own values.
func TestPreparedSweep(t *testing.T) {
	const r1, r2, R = 0.2, 0.3, 0.5
	const nth = 32
	radii := geometricRadii(0.1, r1, nth)
	radii = append(radii, geometricRadii(r1, r2, nth)[1:]...)
	radii = append(radii, geometricRadii(r2, R, nth)[1:]...)
	m := diskMesh(radii, nth, 2, func(r float64) int32 {
		if r > r1 && r < r2 {
			return 1
		}
		return 0
	})
	p := &Problem{Mesh: m, Materials: []Material{linear{1}, saturating{1000, 1.5}},
		PointCurrents: []PointCurrent{{Node: 0, Current: 0}}}
	pr, err := Prepare(p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	var prev *Solution
	var sols []*Solution
	for k, I := range []float64{0, 500, 2000, 6000} {
		p.PointCurrents[0].Current = I
		opt := Options{}
		if prev != nil {
			opt.Initial = prev.A
		}
		s, err := pr.Solve(opt)
		checkSolution(t, s, err)
		if err != nil {
			t.Fatal(err)
		}
		if k > 0 && s.Time.Analyze != 0 {
			t.Errorf("I=%g: analysed again (%v)", I, s.Time.Analyze)
		}
		fresh, err := Solve(&Problem{Mesh: m, Materials: p.Materials,
			PointCurrents: []PointCurrent{{Node: 0, Current: I}}}, Options{})
		if err != nil {
			t.Fatal(err)
		}
		// Both converged to relative residual 1e-8 with updates below
		// 1e-6: agreement to 1e-6 of max |A|.
		var worst, amax float64
		for i := range s.A {
			worst = math.Max(worst, math.Abs(s.A[i]-fresh.A[i]))
			amax = math.Max(amax, math.Abs(fresh.A[i]))
		}
		t.Logf("I = %g A: %d Newton steps warm, %d cold; difference %.2g of max |A|", I, s.Iterations, fresh.Iterations, worst/amax)
		if worst > 1e-6*amax {
			t.Errorf("I=%g: prepared and fresh solutions differ by %.3g of max |A|", I, worst/amax)
		}
		prev = s
		sols = append(sols, s)
	}
	// The first solution with a field is unchanged by the later ones.
	_, bx, by, _ := sols[1].At(0.25, 0)
	want := saturating{1000, 1.5}.bOfH(500 / (2 * math.Pi * 0.25))
	// 2 %: the discretisation error of this coarse (nth = 32) mesh.
	if got := math.Hypot(bx, by); math.Abs(got-want) > 2e-2*want {
		t.Errorf("first solution: |B| = %g at r = 0.25, want %g", got, want)
	}
	if err := sols[1].Check(); err != nil {
		t.Error(err)
	}
}
