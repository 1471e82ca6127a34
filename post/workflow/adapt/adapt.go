package adapt

import (
	"context"
	"fmt"
	"math"
	"sort"

	"polegap/mesh"
	"polegap/models"
	"polegap/post/study"
	"polegap/solver"
)

// Options control the adaptive loop.
type Options struct {
	// Accuracy is the relative change of the quantity between two rounds
	// at which the loop stops; default 1e-3.
	Accuracy float64
	// MaxRounds bounds the rounds; default 10.
	MaxRounds int
	// MaxNodes stops refining before a mesh would exceed it; default 2e6.
	MaxNodes int
	// Stop, when set, is asked after each round's solve; a non-empty
	// answer ends the refinement there (Result.Stopped says why).
	Stop func(s *study.Result) string
	// Fraction is the share of the estimated error (Σ η²) whose triangles
	// are refined each round; default 0.5.
	Fraction float64
	// Quantity is what must converge; nil means the field at the model's
	// target probe (or the gap-centre probe, or its first point probe).
	// Quantities, when set, replaces it: every named quantity must change
	// by at most Accuracy (relative to its own magnitude) between two
	// rounds. Each must be a magnitude whose relative change means
	// something (a field, a flux, an energy), not a component near zero.
	// They are evaluated beside the round's error indicator, on another
	// goroutine: they must only read the result.
	Quantity   func(*study.Result) (float64, error)
	Quantities func(*study.Result) (map[string]float64, error)
	// Progress, when set, is told of each round.
	Progress func(Round)
	Study    study.Options
	// Marking chooses what drives refinement; the zero value is
	// GoalOriented.
	Marking Marking
}

// Marking is what drives refinement.
type Marking int

const (
	// GoalOriented weights each triangle's error by its influence on the
	// field at the probe: the product of the Zienkiewicz–Zhu indicators of
	// the solution and of a dual solution (the field of a unit flux
	// "probe" across a short segment through the probe point,
	// perpendicular to B there), the dual-weighted residual idea of R.
	// Becker and R. Rannacher ("An optimal control approach to a
	// posteriori error estimation in finite element methods", Acta
	// Numerica 10, 2001) in the simple product form of S. Prudhomme and
	// J. T. Oden ("On goal-oriented error estimation for elliptic
	// problems", CMAME 176, 1999): |J(e)| ≤ Σ ‖e‖_T ‖e_z‖_T.
	GoalOriented Marking = iota
	// Energy refines where the energy-norm indicator is largest: the
	// whole field, corners first.
	Energy
)

// Round is one mesh of the sequence.
type Round struct {
	Nodes, Triangles int
	Value            float64 // the quantity (with Quantities: the one that changed most)
	Change           float64 // |value − previous| / |value|, the largest over the quantities; +Inf in the first round
	Worst            string  // with Quantities: the name of the quantity that changed most
	Estimate         float64 // global error estimate (ZZ, energy norm, J^½ per m^½)
	// Iterations is the number of Newton steps of the round's solve: from
	// zero on the first mesh, from the last round's solution on the others
	// (nested iteration).
	Iterations int
}

// Result is the adaptive sequence; Study is the last solved mesh and
// Previous the one before it (nil after a single round): the difference
// of a quantity between the two estimates its error on Study's mesh.
type Result struct {
	Rounds    []Round
	Study     *study.Result
	Previous  *study.Result
	Converged bool
	// Stopped is why Options.Stop ended the refinement, "" otherwise;
	// Limit names the budget that ended it ("levels" or "nodes"), ""
	// when it converged or Stop ended it.
	Stopped string
	Limit   string
}

// Run refines until the quantity converges to the accuracy, or a limit
// is reached (Converged false, with the rounds so far).
func Run(ctx context.Context, m *models.Model, opt Options) (*Result, error) {
	if opt.Accuracy <= 0 {
		opt.Accuracy = 1e-3
	}
	if opt.MaxRounds <= 0 {
		opt.MaxRounds = 10
	}
	if opt.MaxNodes <= 0 {
		opt.MaxNodes = 2_000_000
	}
	if opt.Fraction <= 0 || opt.Fraction >= 1 {
		opt.Fraction = 0.5
	}
	if opt.Quantity == nil && opt.Quantities == nil {
		q, err := FieldAt(m)
		if err != nil {
			return nil, err
		}
		opt.Quantity = q
	}
	res := &Result{}
	var size func(x, y float64, region int32) float64
	var base *study.Study
	var prev map[string]float64
	for round := 0; round < opt.MaxRounds; round++ {
		if err := ctx.Err(); err != nil {
			return res, err
		}
		var cur *study.Study
		var err error
		if base == nil {
			cur, err = study.Compile(m)
			base = cur
		} else {
			cur, err = base.Refined(size)
		}
		if err != nil {
			return res, err
		}
		d := cur.Disc
		if len(res.Rounds) > 0 && d.Mesh.NumNodes() > opt.MaxNodes {
			res.Limit = "nodes"
			return res, nil
		}
		so := opt.Study.Solver
		if so.Context == nil {
			so.Context = ctx
		}
		if res.Study != nil && so.Initial == nil && !res.Study.Remeshed {
			// Nested iteration: start Newton from the last round's
			// solution interpolated to this mesh (solver.InterpolateTo).
			so.Initial = res.Study.Solution.InterpolateTo(nil, d.Mesh)
		}
		s, err := cur.SolveAt(opt.Study.Params, so)
		if err != nil {
			return res, err
		}
		// The quantities and the error indicator only read the solution:
		// they run side by side, on both cores.
		var qs map[string]float64
		done := make(chan struct{})
		go func() {
			defer close(done)
			qs, err = quantities(s, opt)
		}()
		eta, est := s.Solution.ErrorIndicatorTo(nil)
		<-done
		if err != nil {
			return res, err
		}
		r := Round{Nodes: d.Mesh.NumNodes(), Triangles: d.Mesh.NumTriangles(), Estimate: math.Sqrt(math.Max(est, 0)), Iterations: s.Solution.Iterations}
		r.Change, r.Worst, r.Value = change(qs, prev)
		res.Rounds = append(res.Rounds, r)
		res.Previous, res.Study = res.Study, s
		if opt.Progress != nil {
			opt.Progress(r)
		}
		if r.Change <= opt.Accuracy {
			res.Converged = true
			return res, nil
		}
		if opt.Stop != nil {
			if why := opt.Stop(s); why != "" {
				res.Stopped = why
				return res, nil
			}
		}
		prev = qs
		if opt.Marking == GoalOriented {
			z, err := dualIndicator(s, opt)
			if err != nil {
				return res, err
			}
			for t := range eta {
				eta[t] = math.Sqrt(eta[t] * z[t]) // NextSize marks by η²: the product
			}
		}
		size = NextSize(d.Mesh, eta, opt.Fraction)
	}
	res.Limit = "levels"
	return res, nil
}

// quantities evaluates what must converge on one round.
func quantities(s *study.Result, opt Options) (map[string]float64, error) {
	if opt.Quantities != nil {
		return opt.Quantities(s)
	}
	q, err := opt.Quantity(s)
	if err != nil {
		return nil, err
	}
	return map[string]float64{"": q}, nil
}

// change returns the largest relative change of the quantities since the
// previous round (+Inf without one, or when a quantity is new), the name
// of that quantity and its value. Quantities that are zero on both rounds
// have not changed.
func change(q, prev map[string]float64) (float64, string, float64) {
	names := make([]string, 0, len(q))
	for k := range q {
		names = append(names, k)
	}
	sort.Strings(names)
	worst, name, value := -1.0, "", math.NaN()
	for _, k := range names {
		v := q[k]
		c := math.Inf(1)
		if p, ok := prev[k]; ok {
			switch d := math.Abs(v - p); {
			case d == 0:
				c = 0
			case v != 0:
				c = d / math.Abs(v)
			}
		}
		if c > worst {
			worst, name, value = c, k, v
		}
	}
	if worst < 0 {
		return math.Inf(1), "", math.NaN()
	}
	return worst, name, value
}

// NextSize returns the size field of the next round: half the current
// size on the marked triangles (the fewest, largest-error triangles that
// hold the given fraction of Σ η²), the current size elsewhere, read off
// the old mesh by point location (+Inf outside it).
func NextSize(m *mesh.Mesh, eta []float64, fraction float64) func(x, y float64, region int32) float64 {
	nt := m.NumTriangles()
	h := make([]float64, nt)
	for t := 0; t < nt; t++ {
		a, b, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		area := 0.5 * math.Abs((m.X[b]-m.X[a])*(m.Y[c]-m.Y[a])-(m.X[c]-m.X[a])*(m.Y[b]-m.Y[a]))
		// The edge of an equilateral triangle of that area.
		h[t] = math.Sqrt(4 * area / math.Sqrt(3))
	}
	order := make([]int, nt)
	total := 0.0
	for t := range order {
		order[t] = t
		total += eta[t] * eta[t]
	}
	sort.Slice(order, func(i, j int) bool { return eta[order[i]] > eta[order[j]] })
	sum := 0.0
	for _, t := range order {
		if sum >= fraction*total {
			break
		}
		sum += eta[t] * eta[t]
		h[t] *= 0.5
	}
	loc := mesh.NewLocator(m)
	return func(x, y float64, region int32) float64 {
		t, _, _, _, ok := loc.Find(x, y)
		if !ok {
			return math.Inf(1)
		}
		return h[t]
	}
}

// FieldAt returns the default quantity: |B| at the target probe, the
// gap-centre probe or the first point probe.
func FieldAt(m *models.Model) (func(*study.Result) (float64, error), error) {
	p, ok := m.CentreProbe()
	if !ok {
		return nil, fmt.Errorf("%s: no point probe to converge the field at; add one under probes or give a quantity", m.File)
	}
	name, x, y := p.Name, p.Point[0], p.Point[1]
	return func(s *study.Result) (float64, error) {
		_, bx, by, ok := s.Field().At(x, y)
		if !ok {
			return 0, fmt.Errorf("probe %s lies outside the mesh", name)
		}
		return math.Hypot(bx, by), nil
	}, nil
}

// dualIndicator solves the dual problem of the flux across a short
// segment through the probe (two opposite unit line currents at its ends,
// no other source) and returns its error indicator per triangle.
func dualIndicator(s *study.Result, opt Options) ([]float64, error) {
	m := s.Model
	cp, ok := m.CentreProbe()
	if !ok {
		return nil, fmt.Errorf("%s: goal-oriented refinement needs a point probe", m.File)
	}
	x, y := cp.Point[0], cp.Point[1]
	_, bx, by, inside := s.Field().At(x, y)
	if !inside {
		return nil, fmt.Errorf("%s: the probe lies outside the mesh", m.File)
	}
	b := math.Hypot(bx, by)
	tx, ty := 1.0, 0.0
	if b > 0 {
		tx, ty = -by/b, bx/b
	}
	xmin, ymin, xmax, ymax := m.Extent()
	ell := math.Max(xmax-xmin, ymax-ymin) / 50
	if m.Gap > 0 {
		ell = m.Gap / 2
	}
	mm := s.Disc.Mesh
	nearest := func(px, py float64) int32 {
		best, bd := int32(-1), math.Inf(1)
		for i := 0; i < mm.NumVertices; i++ {
			if d := math.Hypot(mm.X[i]-px, mm.Y[i]-py); d < bd {
				best, bd = int32(i), d
			}
		}
		return best
	}
	p := *s.Problem
	p.CurrentDensity = nil
	p.Magnetization = nil
	a, c := nearest(x+ell/2*tx, y+ell/2*ty), nearest(x-ell/2*tx, y-ell/2*ty)
	if a == c {
		return nil, fmt.Errorf("%s: the mesh is too coarse at the probe for goal-oriented refinement", m.File)
	}
	p.PointCurrents = []solver.PointCurrent{{Node: a, Current: 1}, {Node: c, Current: -1}}
	z, err := solver.Solve(&p, opt.Study.Solver)
	if err != nil {
		return nil, fmt.Errorf("dual problem: %w", err)
	}
	eta, _ := z.ErrorIndicatorTo(nil)
	return eta, nil
}
