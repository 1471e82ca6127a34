package sweep

import (
	"bytes"
	"context"
	"errors"
	"math"
	"reflect"
	"strings"
	"testing"

	"polegap/models"
	"polegap/post/internal/fixture"
	"polegap/post/study"
	"polegap/solver"
)

func smallCore(t *testing.T, steel string) *models.Model {
	return fixture.SmallCore(t, steel, 15, 1)
}

func TestSelect(t *testing.T) {
	if got := Select(7, 2, 3); !reflect.DeepEqual(got, []int{1, 4}) {
		t.Errorf("Select(7, 2, 3) = %v, want [1 4]", got)
	}
	// The shards of a sweep cover every point exactly once.
	seen := map[int]int{}
	for k := 1; k <= 4; k++ {
		for _, i := range Select(10, k, 4) {
			seen[i]++
		}
	}
	for i := 0; i < 10; i++ {
		if seen[i] != 1 {
			t.Errorf("point %d covered %d times by 4 shards", i, seen[i])
		}
	}
}

// TestLinearIronScales: with linear materials the field is proportional to
// the current (superposition, an exact property of the linear problem),
// so field/NI is the same at every point to solver accuracy.
func TestLinearIronScales(t *testing.T) {
	m := smallCore(t, "{mu-r: 1000}")
	before := m.Clone()
	pts, err := Run(context.Background(), m, Options{Currents: []float64{10, 20, 35, -5}})
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(m, before) {
		t.Error("the sweep changed the loaded model")
	}
	ref := pts[0].Field / pts[0].AmpereTurns
	for _, p := range pts {
		if math.Abs(p.Field/math.Abs(p.AmpereTurns)-ref) > 1e-7*ref {
			t.Errorf("I = %g A: B/NI = %.10g, want %.10g", p.Current, p.Field/math.Abs(p.AmpereTurns), ref)
		}
		// Linear: λ = L I with one L, so apparent = incremental.
		if math.Abs(p.Incremental-pts[0].Apparent) > 1e-6*pts[0].Apparent || math.Abs(p.Apparent-pts[0].Apparent) > 1e-6*pts[0].Apparent {
			t.Errorf("I = %g A: L apparent %g, incremental %g, want both %g", p.Current, p.Apparent, p.Incremental, pts[0].Apparent)
		}
	}
}

// TestSaturatingCurve: with a nonlinear steel the field still rises with
// NI but the efficiency B g/(μ0 NI) falls as the iron saturates, and at
// low excitation it is close to the ideal magnetic circuit's 1 (Ampère's
// law with infinitely permeable iron) less fringing and iron drop.
func TestSaturatingCurve(t *testing.T) {
	m := smallCore(t, "{curve: low-carbon-steel}")
	var prog []int
	pts, err := Run(context.Background(), m, Options{
		Currents:  Range(20, 400, 5),
		GapLength: 0.040,
		Progress:  func(done, total int, p Point) { prog = append(prog, done) },
	})
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(prog, []int{1, 2, 3, 4, 5}) {
		t.Errorf("progress calls %v", prog)
	}
	for i := 1; i < len(pts); i++ {
		if !(pts[i].Field > pts[i-1].Field) {
			t.Errorf("field not rising: %g T at %g A-t after %g T", pts[i].Field, pts[i].AmpereTurns, pts[i-1].Field)
		}
		if !(pts[i].Efficiency < pts[i-1].Efficiency) {
			t.Errorf("efficiency not falling: %g at %g A-t after %g", pts[i].Efficiency, pts[i].AmpereTurns, pts[i-1].Efficiency)
		}
	}
	// Common practice: a C-core with a gap a third of its pole width runs
	// at 80-100 % efficiency below saturation.
	if e := pts[0].Efficiency; e < 0.8 || e > 1.0 {
		t.Errorf("low-field efficiency %g outside 0.8-1.0", e)
	}
}

// TestEnergyIdentity: the stored energy of every sweep point, with the
// co-energy of the same solve, adds up to λI for a single coil with
// saturating steel (W + W' = ∫ B·H dV = λI; H. H. Woodson and J. R.
// Melcher, Electromechanical Dynamics, Part I, 1968, ch. 3). 1e-6: the
// Newton tolerance (relative residual 1e-8) bounds it with room; a
// second rule for the stored energy would miss by 1e-4 or more past the
// knee.
func TestEnergyIdentity(t *testing.T) {
	m := smallCore(t, "{curve: low-carbon-steel}")
	r, err := NewRunner(context.Background(), m, "", "", solver.Options{})
	if err != nil {
		t.Fatal(err)
	}
	for _, i := range []float64{5, 100, 400} {
		p, err := r.Solve(i, solver.Options{})
		if err != nil {
			t.Fatal(err)
		}
		_, wco, err := study.Energies(r.Last.Solution)
		if err != nil {
			t.Fatal(err)
		}
		if lhs, rhs := p.Linkage*p.Current, p.Energy+wco; math.Abs(lhs-rhs) > 1e-6*lhs {
			t.Errorf("I = %g A: λI = %.9g J, W + W' = %.9g J", i, lhs, rhs)
		}
	}
}

func TestCSVRoundTripAndMerge(t *testing.T) {
	pts := []Point{
		{Index: 0, Current: 1, AmpereTurns: 100, Field: 0.1, Efficiency: 0.99, MaxIronB: 0.3, Energy: 1.5, Iterations: 3, Residual: 1e-10},
		{Index: 2, Current: 3, AmpereTurns: 300, Field: 0.3, Efficiency: 0.98, MaxIronB: 0.9, Energy: 13.5, Iterations: 4, Residual: 2e-10},
	}
	other := []Point{{Index: 1, Current: 2, AmpereTurns: 200, Field: 0.2, Efficiency: 0.985, MaxIronB: 0.6, Energy: 6, Iterations: 3, Residual: 3e-10}}
	var a, b bytes.Buffer
	if err := WriteCSV(&a, Meta{Model: "m", Probe: "p", Shard: "1/2"}, pts); err != nil {
		t.Fatal(err)
	}
	if err := WriteCSV(&b, Meta{Model: "m", Probe: "p", Shard: "2/2"}, other); err != nil {
		t.Fatal(err)
	}
	ma, pa, err := ReadCSV(&a, "a.csv")
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(pa, pts) || ma.Shard != "1/2" {
		t.Fatalf("round trip: %+v %+v", ma, pa)
	}
	mb, pb, _ := ReadCSV(&b, "b.csv")
	meta, all, missing, err := Merge([]Meta{ma, mb}, [][]Point{pa, pb})
	if err != nil || len(missing) != 0 || meta.Partial != "" {
		t.Fatalf("merge: %v missing %v partial %q", err, missing, meta.Partial)
	}
	for i, p := range all {
		if p.Index != i {
			t.Errorf("merged point %d has index %d", i, p.Index)
		}
	}
	if _, _, _, err := Merge([]Meta{ma, ma}, [][]Point{pa, pa}); err == nil {
		t.Error("merging a table with itself should report duplicate points")
	}
	_, _, missing, _ = Merge([]Meta{ma}, [][]Point{pa})
	if !reflect.DeepEqual(missing, []int{1}) {
		t.Errorf("missing = %v, want [1]", missing)
	}
}

func TestInterrupted(t *testing.T) {
	m := smallCore(t, "{mu-r: 1000}")
	ctx, cancel := context.WithCancel(context.Background())
	pts, err := Run(ctx, m, Options{Currents: []float64{1, 2, 3}, Progress: func(done, _ int, _ Point) {
		if done == 1 {
			cancel()
		}
	}})
	var ie *InterruptedError
	if !errors.As(err, &ie) || len(pts) != 1 || ie.Done != 1 || ie.Total != 3 {
		t.Fatalf("err %v, %d points", err, len(pts))
	}
}

// TestPredict: the predictor reproduces a potential that depends on the
// current as a polynomial of degree 2 exactly from three points, a
// straight line from two, and scales the last solution when the sweep
// turns back (a linear magnet's A ∝ I).
func TestPredict(t *testing.T) {
	path := func(i float64) []float64 { return []float64{1 + 2*i + 3*i*i, -i * i, 5} }
	line := func(i float64) []float64 { return []float64{2 * i, -i, 0.5 * i} }
	check := func(name string, got, want []float64) {
		t.Helper()
		for k := range want {
			if math.Abs(got[k]-want[k]) > 1e-12*(1+math.Abs(want[k])) {
				t.Errorf("%s: entry %d = %g, want %g", name, k, got[k], want[k])
			}
		}
	}
	r := &Runner{recent: []solved{{3, path(3)}, {2, path(2)}, {1, path(1)}}}
	check("quadratic", r.predict(4), path(4))
	r = &Runner{recent: []solved{{3, line(3)}, {2, line(2)}}}
	check("secant", r.predict(4.5), line(4.5))
	// Turning back: no extrapolation, the last solution scaled.
	r = &Runner{recent: []solved{{3, line(3)}, {2, line(2)}}}
	check("scaled", r.predict(1), line(1))
	// A step more than twice the last: scaled, not extrapolated.
	r = &Runner{recent: []solved{{3, path(3)}, {2.9, path(2.9)}}}
	check("long step", r.predict(4), []float64{path(3)[0] * 4 / 3, path(3)[1] * 4 / 3, path(3)[2] * 4 / 3})
}

// TestInterruptedMidSolve: a cancel during the Newton steps of the
// second point (saturating steel) stops that solve within a step and
// the sweep returns the first point with an *InterruptedError, not a
// failed point.
func TestInterruptedMidSolve(t *testing.T) {
	m := smallCore(t, "{curve: low-carbon-steel}")
	ctx, cancel := context.WithCancel(context.Background())
	done := 0
	opt := Options{Currents: []float64{100, 400, 800},
		Progress: func(d, _ int, _ Point) { done = d }}
	opt.Solver.Progress = func(it int, _ float64) {
		if done == 1 && it == 1 {
			cancel()
		}
	}
	pts, err := Run(ctx, m, opt)
	var ie *InterruptedError
	if !errors.As(err, &ie) || len(pts) != 1 || ie.Done != 1 || !errors.Is(err, context.Canceled) {
		t.Fatalf("err %v (%T), %d points; want an *InterruptedError after 1 point", err, err, len(pts))
	}
}

// Both, which sweeps the coarse mesh beside the fine one, gives the
// points and estimates of a sweep followed by EstimateOn, bit for bit
// (each sweep is the same sequence of solves on its own study), and
// tells Progress of the fine sweep's points only.
func TestBoth(t *testing.T) {
	results := func() (fine, coarse *study.Result) {
		t.Helper()
		var err error
		if coarse, err = study.Run(fixture.SmallCore(t, "{curve: low-carbon-steel}", 30, 1), study.Options{}); err != nil {
			t.Fatal(err)
		}
		if fine, err = study.Run(smallCore(t, "{curve: low-carbon-steel}"), study.Options{}); err != nil {
			t.Fatal(err)
		}
		return fine, coarse
	}
	opt := Options{Currents: Range(50, 400, 4), GapLength: 0.040}
	fine, coarse := results()
	r, err := NewRunnerFrom(fine, "", "")
	if err != nil {
		t.Fatal(err)
	}
	want, err := r.Sweep(context.Background(), opt)
	if err != nil {
		t.Fatal(err)
	}
	if err := EstimateOn(context.Background(), coarse, opt, want); err != nil {
		t.Fatal(err)
	}
	fine, coarse = results()
	calls := 0
	opt.Progress = func(done, total int, p Point) { calls++ }
	got, err := Both(context.Background(), fine, coarse, opt)
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(got, want) {
		t.Errorf("Both:\n%+v\nsweep and EstimateOn:\n%+v", got, want)
	}
	if calls != len(opt.Currents) {
		t.Errorf("%d progress calls for %d points", calls, len(opt.Currents))
	}
	if got[1].FieldEstimate == 0 {
		t.Error("no estimate set")
	}
}

// TestMergeSeesTheEnd: with the sweep's number of points recorded, the
// points missing after the last one present are found too; tables that
// disagree on it, or hold a point beyond it, are refused.
func TestMergeSeesTheEnd(t *testing.T) {
	pts := []Point{{Index: 0, Current: 1}, {Index: 2, Current: 3}}
	var a bytes.Buffer
	if err := WriteCSV(&a, Meta{Model: "m", Probe: "p", Shard: "1/3", Points: 6}, pts); err != nil {
		t.Fatal(err)
	}
	ma, pa, err := ReadCSV(&a, "a.csv")
	if err != nil || ma.Points != 6 {
		t.Fatalf("read: %v, points %d", err, ma.Points)
	}
	meta, _, missing, err := Merge([]Meta{ma}, [][]Point{pa})
	if err != nil || !reflect.DeepEqual(missing, []int{1, 3, 4, 5}) || meta.Points != 6 || !strings.Contains(meta.Partial, "4 point(s) missing") {
		t.Errorf("missing %v (meta %+v, %v), want [1 3 4 5]", missing, meta, err)
	}
	mb := ma
	mb.Points = 8
	if _, _, _, err := Merge([]Meta{ma, mb}, [][]Point{pa, nil}); err == nil {
		t.Error("tables of 6 and 8 points merged")
	}
	if _, _, _, err := Merge([]Meta{ma}, [][]Point{{{Index: 6}}}); err == nil {
		t.Error("a point of index 6 in a sweep of 6 merged")
	}
}
