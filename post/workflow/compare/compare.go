package compare

import (
	"context"
	"fmt"
	"math"
	"sort"

	"polegap/models"
	"polegap/post/measure"
	"polegap/post/study"
	"polegap/post/workflow/sweep"
	"polegap/solver"
)

// Options control a comparison.
type Options struct {
	Coil, Probe string
	// TurnsArea (turns × m²) converts the probe's field to the flux
	// linkage of a search-coil curve; required for such curves.
	TurnsArea float64
	Solver    solver.Options
	// Progress, when set, is told of each solve.
	Progress func(stage string, done, total int)
}

// Residual is one measured point against the prediction, in the unit of
// its Result (T or Wb-turns).
type Residual struct {
	Current   float64 `json:"current_A"`
	Measured  float64 `json:"measured"`
	Sigma     float64 `json:"sigma"`
	Predicted float64 `json:"predicted"`
	Abs       float64 `json:"residual"` // measured − predicted
	// Rel is Abs / Predicted, nil where it is undefined: at zero current
	// (a remanent field over a prediction of nothing) or a zero
	// prediction. Such points count in the absolute figures only.
	Rel *float64 `json:"relative"`
	// Normalised is Abs / Sigma, nil where no uncertainty is stated: the
	// residual in standard uncertainties, what a residual panel plots to
	// show whether the points scatter as their uncertainties say.
	Normalised *float64 `json:"normalised"`
	Row        int      `json:"row,omitempty"` // line in the measured file
}

// Result is a comparison.
type Result struct {
	Kind      string     `json:"kind"` // "field" (T) or "flux-linkage" (Wb-turns)
	Unit      string     `json:"unit"`
	Residuals []Residual `json:"residuals"`
	RMS       float64    `json:"rms"`
	Max       float64    `json:"max_abs"`
	// RMSRel and MaxRel are over the RelPoints points whose relative
	// residual is defined.
	RMSRel    float64 `json:"rms_relative"`
	MaxRel    float64 `json:"max_abs_relative"`
	RelPoints int     `json:"relative_points"`
	// ChiSquare is Σ (residual/σ)² over the points with a stated σ, and
	// Weighted the number of such points (the degrees of freedom of a
	// comparison, which fits nothing).
	ChiSquare float64 `json:"chi_square,omitempty"`
	Weighted  int     `json:"weighted_points,omitempty"`
}

// Predict solves m at the given coil currents and returns the probe's
// field at each, in the order given.
func Predict(ctx context.Context, m *models.Model, currents []float64, opt Options) ([]float64, error) {
	s, err := study.Compile(m)
	if err != nil {
		return nil, err
	}
	return PredictAt(ctx, s, study.Params{}, currents, opt)
}

// PredictAt is Predict on a compiled study at the base parameter values
// p (the swept coil's current replaced by each of currents).
func PredictAt(ctx context.Context, s *study.Study, p study.Params, currents []float64, opt Options) ([]float64, error) {
	order := make([]int, len(currents))
	for i := range order {
		order[i] = i
	}
	sort.Slice(order, func(a, b int) bool { return currents[order[a]] < currents[order[b]] })
	sorted := make([]float64, len(currents))
	for k, i := range order {
		sorted[k] = currents[i]
	}
	so := sweep.Options{Currents: sorted, Coil: opt.Coil, Probe: opt.Probe, Solver: opt.Solver, Params: p}
	if opt.Progress != nil {
		so.Progress = func(done, total int, _ sweep.Point) { opt.Progress("solving", done, total) }
	}
	pts, err := sweep.RunOn(ctx, s, so)
	if err != nil {
		return nil, err
	}
	out := make([]float64, len(currents))
	for k, i := range order {
		out[i] = pts[k].Field
	}
	return out, nil
}

// Compare sets the measured curve against the model's prediction.
func Compare(ctx context.Context, m *models.Model, c *measure.Curve, opt Options) (*Result, error) {
	if err := c.Check(); err != nil {
		return nil, err
	}
	if c.Kind == measure.FluxLinkage && !(opt.TurnsArea > 0) {
		return nil, fmt.Errorf("%s holds search-coil flux linkages: give the coil's turns-area product (turns × m²) to compare them", c.Name)
	}
	pred, err := Predict(ctx, m, c.Currents(), opt)
	if err != nil {
		return nil, err
	}
	return residuals(c, pred, opt.TurnsArea), nil
}

func residuals(c *measure.Curve, field []float64, turnsArea float64) *Result {
	meas, sig := c.Values()
	r := &Result{Kind: c.Kind.String(), Unit: "T"}
	scale := 1.0
	if c.Kind == measure.FluxLinkage {
		r.Unit, scale = "Wb-turns", turnsArea
	}
	var ss, ssr float64
	for i, p := range c.Points {
		pr := field[i] * scale
		d := meas[i] - pr
		x := Residual{Current: p.Current, Measured: meas[i], Sigma: sig[i], Predicted: pr, Abs: d, Row: p.Row}
		if p.Current != 0 && pr != 0 {
			rel := d / pr
			x.Rel = &rel
			ssr += rel * rel
			r.MaxRel = math.Max(r.MaxRel, math.Abs(rel))
			r.RelPoints++
		}
		r.Residuals = append(r.Residuals, x)
		ss += d * d
		r.Max = math.Max(r.Max, math.Abs(d))
		if sig[i] > 0 {
			z := d / sig[i]
			r.Residuals[len(r.Residuals)-1].Normalised = &z
			r.ChiSquare += (d / sig[i]) * (d / sig[i])
			r.Weighted++
		}
	}
	r.RMS = math.Sqrt(ss / float64(len(c.Points)))
	if r.RelPoints > 0 {
		r.RMSRel = math.Sqrt(ssr / float64(r.RelPoints))
	}
	return r
}
