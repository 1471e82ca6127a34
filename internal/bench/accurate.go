package bench

import (
	"context"
	"fmt"
	"io"

	"polegap/models"
	"polegap/post/workflow/adapt"
	"polegap/post/workflow/design"
	"polegap/post/workflow/sweep"
)

// AccurateModel is the embedded example whose solve and excitation curve
// at the default accuracy the bench times.
const AccurateModel = "bench-dipole"

// Goals of the figures at the default accuracy (s, wall clock on the
// project's 2-core machine): the design solve of AccurateModel, and its
// 20-point excitation curve, each converged to design.DefaultAccuracy
// with error estimates.
const (
	GoalAccurateSolve = 0.5
	GoalAccurateCurve = 3
)

// Accurate holds the figures at the default accuracy: AccurateModel
// solved as `polegap solve` solves it (adaptive refinement until every
// reported quantity settles, then the report on the last two meshes with
// the incremental inductance and the virtual-work forces), and its
// CurvePoints-point excitation curve as `polegap sweep` draws it (the same
// refinement, then the curve on the last mesh and, for the estimates, on
// the one before it). Times are medians of Options.Repeat runs.
type Accurate struct {
	Model    string  `json:"model"`
	Solve    float64 `json:"solve_s"`
	SolveCPU float64 `json:"solve_cpu_s"`
	// Nodes and Newton are the node count and Newton steps of each
	// adaptive round; Change is the largest relative change of a driven
	// quantity on the last (the accuracy reached).
	Nodes    []int   `json:"round_nodes"`
	Newton   []int   `json:"round_newton_steps"`
	Change   float64 `json:"largest_change"`
	Curve    float64 `json:"curve_s"`
	CurveCPU float64 `json:"curve_cpu_s"`
	Points   int     `json:"curve_points"`
}

// runAccurate measures the figures at the default accuracy.
func runAccurate(ctx context.Context, opt Options) (*Accurate, error) {
	m, err := models.LoadExample(AccurateModel)
	if err != nil {
		return nil, err
	}
	a := &Accurate{Model: AccurateModel, Points: opt.CurvePoints}
	if a.Solve, a.SolveCPU, err = stage(opt.Repeat, func() error {
		a.Nodes, a.Newton = a.Nodes[:0], a.Newton[:0]
		fine, coarse, acc, err := design.SolveAccurate(ctx, m, design.SolveOptions{Marking: adapt.Energy, Progress: func(r adapt.Round) {
			a.Nodes = append(a.Nodes, r.Nodes)
			a.Newton = append(a.Newton, r.Iterations)
		}})
		if err != nil {
			return err
		}
		a.Change = acc.Change
		design.NewEstimated(fine, coarse, acc, design.DesignOptions{Incremental: true})
		return nil
	}); err != nil {
		return nil, &StageError{Case: AccurateModel, Stage: "solve at the default accuracy", Err: err}
	}
	if a.Curve, a.CurveCPU, err = stage(opt.Repeat, func() error {
		// As polegap sweep: the refinement, then the curve on both meshes
		// (the design report is not part of it).
		fine, coarse, _, err := design.SolveAccurate(ctx, m, design.SolveOptions{Marking: adapt.Energy})
		if err != nil {
			return err
		}
		hi := 2 * m.Coils[0].Current
		_, err = sweep.Both(ctx, fine, coarse, sweep.Options{Currents: sweep.Range(hi/float64(a.Points), hi, a.Points), GapLength: m.Gap})
		return err
	}); err != nil {
		return nil, &StageError{Case: AccurateModel, Stage: "excitation curve at the default accuracy", Err: err}
	}
	return a, nil
}

// accurateChecks are the figures at the default accuracy against their goals.
func (a *Accurate) checks() []Check {
	return []Check{
		{Case: a.Model, Figure: fmt.Sprintf("solve to %g with estimates", design.DefaultAccuracy), Unit: "s", Value: a.Solve, Goal: GoalAccurateSolve, Pass: a.Solve <= GoalAccurateSolve},
		{Case: a.Model, Figure: fmt.Sprintf("excitation curve (%d points) to %g", a.Points, design.DefaultAccuracy), Unit: "s", Value: a.Curve, Goal: GoalAccurateCurve, Pass: a.Curve <= GoalAccurateCurve},
	}
}

// writeText writes the rounds of the solve at the default accuracy.
func (a *Accurate) writeText(w io.Writer) {
	fmt.Fprintf(w, "\nAt the default accuracy (%s, as polegap solve and sweep run it): solve %.3g s wall, %.3g s CPU; %d-point curve %.3g s wall, %.3g s CPU\n",
		a.Model, a.Solve, a.SolveCPU, a.Points, a.Curve, a.CurveCPU)
	for i := range a.Nodes {
		fmt.Fprintf(w, "  round %d: %s nodes, %d Newton steps\n", i+1, group(a.Nodes[i]), a.Newton[i])
	}
	fmt.Fprintf(w, "  largest change on the last round %.2g (asked %g)\n", a.Change, design.DefaultAccuracy)
}
