package solver

import (
	"context"
	"errors"
	"math"
	"strings"
	"sync/atomic"
	"testing"
)

// Solver faults (issue 7, item 2): every fault ends with a typed error and
// no Solution; a Newton run that stops short carries its residual history.

// faultRing is the iron ring around a line current of
// TestNewtonNonlinearRing (H = I/(2πr) for any B-H curve; Ampère's law), on
// a small mesh: node 0 carries the current, tag 1 is the ring.
func faultRing(mat Material, current float64) *Problem {
	const r1, r2, R = 0.2, 0.3, 0.5
	const nth = 16
	radii := geometricRadii(0.1, r1, nth)
	radii = append(radii, geometricRadii(r1, r2, nth)[1:]...)
	radii = append(radii, geometricRadii(r2, R, nth)[1:]...)
	m := diskMesh(radii, nth, 1, func(r float64) int32 {
		if r > r1 && r < r2 {
			return 1
		}
		return 0
	})
	return &Problem{Mesh: m, Materials: []Material{linear{1}, mat}, PointCurrents: []PointCurrent{{Node: 0, Current: current}}}
}

// nanAbove returns the saturating curve below |B| = Bmax and NaN above: a
// broken table or extrapolation met in the middle of a Newton run.
type nanAbove struct {
	saturating
	Bmax float64
}

func (n nanAbove) Nu(b2 float64) (float64, float64) {
	if b2 > n.Bmax*n.Bmax {
		return math.NaN(), math.NaN()
	}
	return n.saturating.Nu(b2)
}

// constNu returns a fixed reluctivity (which may be negative, zero, NaN or
// infinite) at every |B|.
type constNu struct{ nu, d float64 }

func (c constNu) Nu(float64) (float64, float64) { return c.nu, c.d }

// TestFaultSingular: with no boundary condition holding the potential
// anywhere, the system is singular (A + constant solves it too); so is a
// part of the mesh that floats free of the rest. Both are a *SingularError
// naming the floating nodes, before any factorization.
func TestFaultSingular(t *testing.T) {
	// All four sides of the rectangle flux-normal: the whole mesh floats.
	m := rectMesh(8, 6, 0, 0.8, 0, 0.6, 1, nil)
	all := &Problem{Mesh: m, Materials: []Material{linear{1}}, CurrentDensity: []float64{1e6},
		Boundary: map[int32]Condition{1: FluxNormal, 2: FluxNormal, 3: FluxNormal, 4: FluxNormal}}

	// Two squares that share no node: the left one held at zero on its
	// outer edges, the right one flux-normal all round.
	var x, y []float64
	var tri, reg []int32
	for part, x0 := range []float64{0, 2} {
		base := int32(len(x))
		for j := 0; j <= 4; j++ {
			for i := 0; i <= 4; i++ {
				x, y = append(x, x0+0.25*float64(i)), append(y, 0.25*float64(j))
			}
		}
		for j := 0; j < 4; j++ {
			for i := 0; i < 4; i++ {
				a := base + int32(j*5+i)
				tri = append(tri, a, a+1, a+6, a, a+6, a+5)
				reg = append(reg, int32(part), int32(part))
			}
		}
	}
	two := finishMesh(x, y, tri, reg, func(x, _ float64) int32 {
		if x > 1.5 {
			return 7
		}
		return 1
	}, 1)
	floating := &Problem{Mesh: two, Materials: []Material{linear{1}, linear{1000}}, CurrentDensity: []float64{1e6, 0},
		Boundary: map[int32]Condition{7: FluxNormal}}

	for _, c := range []struct {
		name  string
		p     *Problem
		nodes int // floating nodes expected
	}{
		{"all flux-normal", all, 9 * 7},
		{"floating part", floating, 25},
	} {
		s, err := Solve(c.p, Options{})
		var se *SingularError
		if !errors.As(err, &se) || s != nil {
			t.Errorf("%s: solution %v, error %v (%T); want a *SingularError and no solution", c.name, s != nil, err, err)
			continue
		}
		if se.Nodes != c.nodes {
			t.Errorf("%s: %d floating nodes reported, want %d", c.name, se.Nodes, c.nodes)
		}
	}
}

// TestFaultMaterial: a reluctivity that is NaN, infinite, zero or negative
// is a *MaterialError naming the region and |B|², never a Solution with NaN
// in it, whether it appears at the first assembly or midway through Newton.
func TestFaultMaterial(t *testing.T) {
	const I = 6000 // A: the largest |B| in the ring is 0.83 T on this mesh
	for _, c := range []struct {
		name string
		mat  Material
	}{
		{"NaN", constNu{math.NaN(), 0}},
		{"+Inf", constNu{math.Inf(1), 0}},
		{"negative", constNu{-1 / mu0, 0}},
		{"zero", constNu{0, 0}},
		{"NaN derivative", constNu{1 / (1000 * mu0), math.NaN()}},
		{"NaN above 0.5 T", nanAbove{saturating{1000, 1.5}, 0.5}}, // the solution reaches 0.83 T
	} {
		s, err := Solve(faultRing(c.mat, I), Options{})
		var me *MaterialError
		var nc *NotConvergedError
		switch {
		case s != nil:
			t.Errorf("%s: returned a solution (converged %v) with error %v", c.name, s.Converged, err)
		case errors.As(err, &me):
			if me.Region != 1 {
				t.Errorf("%s: error names region %d, want 1: %v", c.name, me.Region, err)
			}
		case errors.As(err, &nc):
			// A NaN met only in line-search trials ends Newton instead.
			checkHistory(t, c.name, nc)
		default:
			t.Errorf("%s: error %v (%T), want a *MaterialError", c.name, err, err)
		}
	}
}

// breakable is the saturating curve until broken is set, then NaN: a
// material that fails at a point it passed before (a table or an outside
// model that breaks mid-run). The solver's own materials are functions of
// |B|² alone, for which the line search meets any failure first.
type breakable struct {
	saturating
	broken *atomic.Bool
}

func (b breakable) Nu(b2 float64) (float64, float64) {
	if b.broken.Load() {
		return math.NaN(), math.NaN()
	}
	return b.saturating.Nu(b2)
}

// TestFaultMaterialHistory: a material failure met after Newton has taken
// steps ends in a *NotConvergedError carrying the history so far (one
// entry per step taken plus the start), whether the line search backs off
// from a NaN until no step lowers the residual, or the material breaks
// between two steps (after step 2, from Progress); in the second case
// errors.As also finds the *MaterialError, naming the region.
func TestFaultMaterialHistory(t *testing.T) {
	var broken atomic.Bool
	for _, c := range []struct {
		name    string
		mat     Material
		breakAt int // Newton step after which the material breaks (0: never)
	}{
		{"NaN above 0.5 T", nanAbove{saturating{1000, 1.5}, 0.5}, 0},
		{"broken after step 2", breakable{saturating{1000, 1.5}, &broken}, 2},
	} {
		broken.Store(false)
		opt := Options{Progress: func(it int, _ float64) {
			if it == c.breakAt {
				broken.Store(true)
			}
		}}
		s, err := Solve(faultRing(c.mat, 6000), opt)
		var nc *NotConvergedError
		if !errors.As(err, &nc) || s != nil {
			t.Errorf("%s: solution %v, error %v (%T); want a *NotConvergedError with the history", c.name, s != nil, err, err)
			continue
		}
		checkHistory(t, c.name, nc)
		if c.breakAt == 0 {
			continue
		}
		if nc.Iterations != c.breakAt || len(nc.History) != c.breakAt+1 {
			t.Errorf("%s: %d iterations and %d history entries, want %d and %d", c.name, nc.Iterations, len(nc.History), c.breakAt, c.breakAt+1)
		}
		if nc.Residual != nc.History[len(nc.History)-1] {
			t.Errorf("%s: Residual %g is not the last history entry %g", c.name, nc.Residual, nc.History[len(nc.History)-1])
		}
		var me *MaterialError
		if !errors.As(err, &me) || me.Region != 1 {
			t.Errorf("%s: error %v: want it to wrap a *MaterialError of region 1", c.name, err)
		}
	}
}

// TestFaultNotConverged: Newton cut short by MaxIter, or asked for a
// tolerance below rounding, returns a *NotConvergedError with the residual
// history (finite, one entry per step plus the start) and no Solution.
func TestFaultNotConverged(t *testing.T) {
	p := faultRing(saturating{1000, 1.5}, 6000)
	for _, c := range []struct {
		name string
		opt  Options
	}{
		{"one step", Options{MaxIter: 1, Tol: 1e-14}},
		{"three steps", Options{MaxIter: 3}},
		{"tolerance below rounding", Options{MaxIter: 8, Tol: 1e-300, UpdateTol: 1e-300}},
	} {
		s, err := Solve(p, c.opt)
		var nc *NotConvergedError
		if !errors.As(err, &nc) || s != nil {
			t.Errorf("%s: solution %v, error %v (%T); want a *NotConvergedError and no solution", c.name, s != nil, err, err)
			continue
		}
		checkHistory(t, c.name, nc)
		if nc.Iterations > c.opt.MaxIter {
			t.Errorf("%s: %d iterations, over MaxIter %d", c.name, nc.Iterations, c.opt.MaxIter)
		}
		if len(nc.History) != nc.Iterations+1 {
			t.Errorf("%s: %d history entries for %d iterations, want iterations+1", c.name, len(nc.History), nc.Iterations)
		}
		if nc.Residual != nc.History[len(nc.History)-1] {
			t.Errorf("%s: Residual %g is not the last history entry %g", c.name, nc.Residual, nc.History[len(nc.History)-1])
		}
	}
}

// TestFaultUpdateFinite: a run cut short before its residual met Tol has
// estimated no update, and says so (HasUpdate false, Update 0, nothing
// about an update in the message); one cut short after (Tol met, UpdateTol
// out of reach) reports its finite estimate and prints it.
func TestFaultUpdateFinite(t *testing.T) {
	p := faultRing(saturating{1000, 1.5}, 6000)
	for _, c := range []struct {
		name      string
		opt       Options
		hasUpdate bool
	}{
		{"residual above Tol", Options{MaxIter: 1, Tol: 1e-14}, false},
		{"update above UpdateTol", Options{MaxIter: 3, Tol: 0.5, UpdateTol: 1e-300}, true},
	} {
		_, err := Solve(p, c.opt)
		var nc *NotConvergedError
		if !errors.As(err, &nc) {
			t.Errorf("%s: error %v, want *NotConvergedError", c.name, err)
			continue
		}
		msg := err.Error()
		if strings.Contains(msg, "Inf") || strings.Contains(msg, "NaN") {
			t.Errorf("%s: message %q prints a non-finite value", c.name, msg)
		}
		if nc.HasUpdate != c.hasUpdate || strings.Contains(msg, "update") != c.hasUpdate {
			t.Errorf("%s: HasUpdate %v, message %q; want an update: %v", c.name, nc.HasUpdate, msg, c.hasUpdate)
		}
		switch {
		case !nc.HasUpdate && nc.Update != 0:
			t.Errorf("%s: no update estimated, but Update = %g (want 0)", c.name, nc.Update)
		case nc.HasUpdate && !(nc.Update > 0 && !math.IsInf(nc.Update, 0)):
			t.Errorf("%s: Update = %g, want finite and positive", c.name, nc.Update)
		}
	}
}

// TestFaultNonFiniteSource: a NaN or infinite current density, point
// current or fixed potential is refused before assembly.
func TestFaultNonFiniteSource(t *testing.T) {
	m := rectMesh(4, 4, 0, 1, 0, 1, 1, nil)
	for _, c := range []struct {
		name string
		p    *Problem
	}{
		{"J NaN", &Problem{Mesh: m, Materials: []Material{linear{1}}, CurrentDensity: []float64{math.NaN()}}},
		{"J Inf", &Problem{Mesh: m, Materials: []Material{linear{1}}, CurrentDensity: []float64{math.Inf(-1)}}},
		{"point current NaN", &Problem{Mesh: m, Materials: []Material{linear{1}}, PointCurrents: []PointCurrent{{Node: 12, Current: math.NaN()}}}},
		{"fixed A Inf", &Problem{Mesh: m, Materials: []Material{linear{1}}, Fixed: []NodeValue{{Node: 0, A: math.Inf(1)}}}},
		{"magnetization NaN", &Problem{Mesh: m, Materials: []Material{linear{1}}, Magnetization: [][2]float64{{math.NaN(), 0}}}},
	} {
		s, err := Solve(c.p, Options{})
		var pe *ProblemError
		if !errors.As(err, &pe) || s != nil {
			t.Errorf("%s: solution %v, error %v (%T); want a *ProblemError and no solution", c.name, s != nil, err, err)
		}
	}
}

// checkHistory: a history starts at the first residual and holds finite,
// non-negative values.
func checkHistory(t *testing.T, name string, nc *NotConvergedError) {
	t.Helper()
	if len(nc.History) < 1 {
		t.Errorf("%s: empty residual history", name)
		return
	}
	for i, r := range nc.History {
		if !(r >= 0) || math.IsInf(r, 0) {
			if i == len(nc.History)-1 && nc.Reason == "the residual is not finite" {
				continue
			}
			t.Errorf("%s: history[%d] = %g", name, i, r)
		}
	}
}

// TestFaultCancelled: a context cancelled after the second Newton step
// stops the solve before the third, with a *NotConvergedError that wraps
// context.Canceled, carries the history of the two steps and returns no
// solution; a context cancelled before the start stops it with no step.
func TestFaultCancelled(t *testing.T) {
	p := faultRing(saturating{1000, 1.5}, 6000)
	ctx, cancel := context.WithCancel(context.Background())
	opt := Options{Context: ctx, Progress: func(it int, _ float64) {
		if it == 2 {
			cancel()
		}
	}}
	s, err := Solve(p, opt)
	var nc *NotConvergedError
	if !errors.As(err, &nc) || s != nil || !errors.Is(err, context.Canceled) {
		t.Fatalf("solution %v, error %v (%T); want a *NotConvergedError wrapping context.Canceled", s != nil, err, err)
	}
	checkHistory(t, "cancelled", nc)
	if nc.Iterations != 2 || len(nc.History) != 3 {
		t.Errorf("stopped after %d steps with %d history entries, want 2 and 3", nc.Iterations, len(nc.History))
	}
	s, err = Solve(p, Options{Context: ctx})
	if !errors.As(err, &nc) || s != nil || nc.Iterations != 0 || !errors.Is(err, context.Canceled) {
		t.Errorf("a cancelled context: solution %v, error %v", s != nil, err)
	}
}
