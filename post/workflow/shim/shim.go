package shim

import (
	"context"
	"fmt"
	"math"
	"strconv"

	"gonum.org/v1/gonum/optimize"

	"polegap/models"
	"polegap/post/quantity/gap"
	"polegap/post/study"
	"polegap/post/workflow/adapt"
	"polegap/post/workflow/design"
	"polegap/solver"
)

// Options control an optimisation. The zero value optimises for 1e-4 at
// the model's own current with quick solves and 40 evaluations.
type Options struct {
	// Tol is the relative field tolerance |ΔB/B0| of the good-field
	// region; 0 means 1e-4.
	Tol float64
	// Currents of the first coil (A) at which the half-width is measured;
	// the objective is the narrowest of them. nil: the model's own.
	Currents []float64
	// Accuracy is the relative accuracy of each solve (adaptive
	// refinement, design.SolveAccurate); 0 solves once on the model's own
	// mesh (quick).
	Accuracy float64
	// MaxEvaluations bounds the shapes solved (each at every current);
	// 0 means 40.
	MaxEvaluations int
	// Initial is the first shape; zero means Rose's (Rose).
	Initial models.Shim
	// Bevel optimises a ramp (shim-shape: bevel) instead of a step.
	Bevel bool
	// Samples along the mid-plane line probe; 0 means 801.
	Samples int
	Solver  solver.Options
	// Progress, when set, is called after each evaluation.
	Progress func(Eval)
}

// Eval is one shape solved.
type Eval struct {
	Shape models.Shim
	// HalfWidth (m) is the narrowest good-field half-width over the
	// currents; NaN when the shape could not be built or solved.
	HalfWidth float64
	// Err says why the shape was not solved (below shim-min, does not
	// fit), or "".
	Err string
}

// Profile is ΔB/B0 = (By − B0)/B0 along the mid-plane, X measured from
// the gap centre (m), at the first current.
type Profile struct {
	X, Dev []float64
}

// Result is the outcome of an optimisation.
type Result struct {
	Tol      float64
	Gap      float64     // m
	Min      float64     // m, the template's shim-min
	Rose     models.Shim // the initial guess
	Currents []float64
	// Unshimmed is the pole without shims, Best the widest shape found
	// (Unshimmed itself when no shim beats it).
	Unshimmed, Best Eval
	// Before and After are the mid-plane profiles of Unshimmed and Best.
	Before, After Profile
	Evals         []Eval
	Status        string // the optimiser's status
}

// Gain returns how much wider the best shape's good-field region is than
// the unshimmed pole's (m).
func (r *Result) Gain() float64 { return r.Best.HalfWidth - r.Unshimmed.HalfWidth }

// Rose returns the initial shim for a pole pair of gap g: Rose's
// proportions for a step at the edge of a flat pole, height 0.02 g and
// width 0.35 g (M. E. Rose, Phys. Rev. 53, 715, 1938; the proportions
// are from memory of his optimum and serve only as a starting point),
// raised to min where smaller.
func Rose(g, min float64) models.Shim {
	return models.Shim{Height: math.Max(0.02*g, min), Width: math.Max(0.35*g, min), Min: min}
}

// Optimise finds the shim of the model file (a c-core or h-core template)
// that maximises the good-field half-width. Shapes that cannot be built
// (below shim-min, too large) score worse than no shim; a failed solve of
// a built shape is an error, as is a cancelled context.
func Optimise(ctx context.Context, file string, data []byte, opt Options) (*Result, error) {
	m, err := models.Parse(file, data)
	if err != nil {
		return nil, err
	}
	if m.Template != "c-core" && m.Template != "h-core" {
		return nil, fmt.Errorf("%s: shims are optimised on a c-core or h-core template; this model has %s", file, describeTemplate(m.Template))
	}
	if opt.Tol == 0 {
		opt.Tol = 1e-4
	}
	if opt.MaxEvaluations == 0 {
		opt.MaxEvaluations = 40
	}
	if opt.Samples == 0 {
		opt.Samples = 801
	}
	res := &Result{Tol: opt.Tol, Gap: m.Gap, Min: m.Shim.Min, Currents: opt.Currents}
	if res.Currents == nil && len(m.Coils) > 0 {
		res.Currents = []float64{m.Coils[0].Current}
	}
	ev := &evaluator{ctx: ctx, file: file, data: data, scale: m.Scale, opt: opt, seen: map[[2]float64]Eval{}}
	var before Profile
	if res.Unshimmed, before, err = ev.eval(models.Shim{}); err != nil {
		return nil, err
	}
	if math.IsNaN(res.Unshimmed.HalfWidth) {
		return nil, fmt.Errorf("%s: the unshimmed pole cannot be solved: %s", file, res.Unshimmed.Err)
	}
	res.Before = before
	res.Rose = opt.Initial
	if res.Rose.Height == 0 || res.Rose.Width == 0 {
		res.Rose = Rose(m.Gap, m.Shim.Min)
		if opt.Bevel {
			// A ramp adds half a step's iron: start twice as high.
			res.Rose.Height *= 2
		}
	}
	// The variables: height and width in units of the initial ones.
	h0, w0 := res.Rose.Height, res.Rose.Width
	shape := func(x []float64) models.Shim {
		return models.Shim{Height: x[0] * h0, Width: x[1] * w0, Min: m.Shim.Min, Bevel: opt.Bevel}
	}
	best := res.Unshimmed
	var bestProfile Profile
	var evalErr error
	prob := optimize.Problem{Func: func(x []float64) float64 {
		if evalErr != nil {
			return math.Inf(1)
		}
		e, p, err := ev.eval(shape(x))
		if err != nil {
			evalErr = err
			return math.Inf(1)
		}
		if math.IsNaN(e.HalfWidth) {
			// Worse than no shim by how far the shape strays.
			return -res.Unshimmed.HalfWidth/m.Gap + 1 + math.Abs(x[0]-1) + math.Abs(x[1]-1)
		}
		if e.HalfWidth > best.HalfWidth {
			best, bestProfile = e, p
		}
		return -e.HalfWidth / m.Gap
	}}
	settings := &optimize.Settings{
		FuncEvaluations: opt.MaxEvaluations,
		// Stop when the best width has not grown by 1e-4 gap in 8 steps.
		Converger: &optimize.FunctionConverge{Absolute: 1e-4, Iterations: 8},
	}
	r, err := optimize.Minimize(prob, []float64{1, 1}, settings, &optimize.NelderMead{SimplexSize: 0.5})
	if evalErr != nil {
		return nil, evalErr
	}
	if r != nil {
		res.Status = r.Status.String()
	}
	if err != nil && r == nil {
		return nil, err
	}
	res.Evals = ev.order
	res.Best, res.After = res.Unshimmed, res.Before
	if best.HalfWidth > res.Unshimmed.HalfWidth {
		res.Best, res.After = best, bestProfile
	}
	return res, nil
}

func describeTemplate(t string) string {
	if t == "" {
		return "no template"
	}
	return "template " + t
}

// evaluator solves shapes, each once.
type evaluator struct {
	ctx   context.Context
	file  string
	data  []byte
	scale float64 // metres per unit of the model file
	opt   Options
	seen  map[[2]float64]Eval
	order []Eval
}

// eval solves the model with shape s at every current and returns the
// narrowest half-width and the profile at the first current. A shape
// that cannot be built is an Eval with NaN and Err, and no error.
func (e *evaluator) eval(s models.Shim) (Eval, Profile, error) {
	key := [2]float64{s.Height, s.Width}
	if v, ok := e.seen[key]; ok {
		return v, Profile{}, nil
	}
	if err := e.ctx.Err(); err != nil {
		return Eval{}, Profile{}, err
	}
	out := Eval{Shape: s, HalfWidth: math.NaN()}
	var prof Profile
	m, err := e.model(s)
	if err != nil {
		out.Err = err.Error()
	} else {
		currents := e.opt.Currents
		if currents == nil {
			currents = []float64{m.Coils[0].Current}
		}
		for i, c := range currents {
			hw, p, err := e.halfWidth(m, c)
			if err != nil {
				return Eval{}, Profile{}, err
			}
			if i == 0 || hw < out.HalfWidth {
				out.HalfWidth = hw
			}
			if i == 0 {
				prof = p
			}
		}
	}
	e.seen[key] = out
	e.order = append(e.order, out)
	if e.opt.Progress != nil {
		e.opt.Progress(out)
	}
	return out, prof, nil
}

// model returns the model with shape s written into its template.
func (e *evaluator) model(s models.Shim) (*models.Model, error) {
	if s.Height == 0 && s.Width == 0 {
		return models.Parse(e.file, e.data)
	}
	set := []models.Setting{
		{Path: "dimensions.shim-height", Value: strconv.FormatFloat(s.Height/e.scale, 'g', -1, 64)},
		{Path: "dimensions.shim-width", Value: strconv.FormatFloat(s.Width/e.scale, 'g', -1, 64)},
	}
	if e.opt.Bevel {
		set = append(set, models.Setting{Path: "dimensions.shim-shape", Value: "bevel"})
	}
	return models.ParseWith(e.file, e.data, set)
}

// halfWidth solves m at current c of its first coil and measures the
// good-field half-width along its mid-plane line probe.
func (e *evaluator) halfWidth(m *models.Model, c float64) (float64, Profile, error) {
	so := e.opt.Solver
	if so.Context == nil {
		so.Context = e.ctx
	}
	params := study.Params{}.Scaled(m, 0, c)
	fine, _, _, err := design.SolveAccurate(e.ctx, m, design.SolveOptions{Quick: e.opt.Accuracy == 0, Accuracy: e.opt.Accuracy, Solver: so, Params: params, Marking: adapt.Energy})
	if err != nil {
		return 0, Profile{}, err
	}
	return MidPlane(fine, e.opt.Tol, e.opt.Samples)
}

// MidPlane returns the good-field half-width at tol along the model's
// mid-plane line probe ("midplane") of a solved dipole, and its ΔB/B0
// profile, from B0 = By at the gap-centre probe.
func MidPlane(res *study.Result, tol float64, n int) (float64, Profile, error) {
	m := res.Model
	cp, ok := m.CentreProbe()
	if !ok {
		return 0, Profile{}, fmt.Errorf("%s: no gap-centre probe", m.File)
	}
	line, ok := m.Probe("midplane")
	if !ok || line.Kind != models.ProbeLine {
		return 0, Profile{}, fmt.Errorf("%s: no line probe named midplane", m.File)
	}
	pr, ok := res.Probe(cp.Name)
	if !ok || !pr.Valid {
		return 0, Profile{}, fmt.Errorf("%s: the gap-centre probe lies outside the mesh", m.File)
	}
	b0 := pr.Point.By
	ss := gap.ProfileTo(nil, res.Field(), line.Line[0], line.Line[1], n)
	c := cp.Point
	centre := math.Hypot(c[0]-line.Line[0][0], c[1]-line.Line[0][1])
	gf, err := gap.GoodFieldWidths(ss, centre, b0, gap.ComponentY, []float64{tol})
	if err != nil {
		return 0, Profile{}, err
	}
	var p Profile
	for _, s := range ss {
		if s.Inside {
			p.X = append(p.X, s.X-c[0])
			p.Dev = append(p.Dev, (s.By-b0)/b0)
		}
	}
	return gf[0].HalfWidth(), p, nil
}
