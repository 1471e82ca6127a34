package compare

import (
	"context"
	"errors"
	"fmt"
	"math"
	"strings"

	"polegap/models"
	"polegap/post/measure"
	"polegap/post/study"
)

// Parameter names a model parameter that Calibrate can fit.
type Parameter string

const (
	// Gap is the gap length (m), varied about the gap centre's mid-plane
	// (models.Model.WithGap). Plausible within ±5 % or ±0.5 mm, whichever
	// is larger: machining, shims and pole deflection (common practice).
	Gap Parameter = "gap"
	// Iron scales the permeability of every nonlinear iron region
	// (reluctivity divided by the scale). Plausible between 0.7 and 1.4:
	// the spread of magnetic properties between steel heats and after
	// machining stresses (common practice, from memory).
	Iron Parameter = "iron"
	// Turns is the swept coil's number of turns. Plausible within ±2 %:
	// a miscounted or shorted layer shows up as more (common practice).
	Turns Parameter = "turns"
	// Offset is a constant added to every prediction, in the curve's unit
	// (T, or Wb-turns for flux linkages): the remanent field the yoke
	// keeps at zero current, plus any zero offset of the probe. A constant
	// is a first-order model of remanence (it ignores that hysteresis
	// shrinks it as the iron is driven). It needs no solve. Plausible up
	// to 20 mT in the gap of an iron-dominated magnet (common practice,
	// from memory; rising above that points to a probe offset).
	Offset Parameter = "offset"
)

// Parameters lists the parameters Calibrate knows, in the order a fit
// reports them.
var Parameters = []Parameter{Gap, Iron, Turns, Offset}

// ParseParameters reads a comma-separated list such as "gap,iron,offset";
// each parameter at most once.
func ParseParameters(s string) ([]Parameter, error) {
	if s == "" {
		return nil, nil
	}
	var out []Parameter
	for _, f := range strings.Split(s, ",") {
		p := Parameter(strings.TrimSpace(f))
		known := false
		for _, q := range Parameters {
			known = known || p == q
		}
		if !known {
			return nil, fmt.Errorf("unknown parameter %q: use gap, iron, turns or offset, or several separated by commas", p)
		}
		for _, q := range out {
			if q == p {
				return nil, fmt.Errorf("parameter %q given twice", p)
			}
		}
		out = append(out, p)
	}
	return out, nil
}

// Estimate is one calibrated parameter.
type Estimate struct {
	Parameter Parameter `json:"parameter"`
	// Unit of Nominal, Value and Sigma: "m" (gap), "" (iron scale),
	// "turns", or the curve's unit "T" or "Wb-turns" (offset).
	Unit    string  `json:"unit"`
	Nominal float64 `json:"nominal"`
	Value   float64 `json:"fitted"`
	// Sigma is the standard uncertainty, Birge-scaled when the fit says
	// so (Fit.BirgeScaled).
	Sigma     float64 `json:"standard_uncertainty"`
	Plausible bool    `json:"plausible"`
	Verdict   string  `json:"verdict"`
}

// Shown returns the estimate in the unit it is printed in: millimetres
// for the gap, millitesla for a field offset, else as stored.
func (e Estimate) Shown() (nominal, value, sigma float64, unit string) {
	switch e.Unit {
	case "m":
		return e.Nominal * 1e3, e.Value * 1e3, e.Sigma * 1e3, "mm"
	case "T":
		return e.Nominal * 1e3, e.Value * 1e3, e.Sigma * 1e3, "mT"
	}
	return e.Nominal, e.Value, e.Sigma, e.Unit
}

// Fit is a calibration of one or more parameters at once.
//
// ChiSquare is Σ((measured − fitted)/σ)² over the points (σ the stated
// standard uncertainties; all 1 when Uncertainty is "scatter"), Dof the
// degrees of freedom ν = points − parameters, BirgeRatio sqrt(χ²/ν) (R. T.
// Birge, Phys. Rev. 40, 207, 1932; 0 when ν = 0). When the uncertainties
// are stated and the Birge ratio exceeds 1 the residuals scatter more
// than they allow, and every Sigma and the covariance are multiplied by
// it (BirgeScaled), so the result claims no more than the data show; a
// ratio below 1 leaves them as stated (GUM, JCGM 100:2008). Correlation
// holds the correlation coefficients of the parameters, in the order of
// Parameters: a gap and an iron scale fitted together are strongly
// correlated when the data stay below saturation, where both act as one
// reluctance.
type Fit struct {
	Parameters  []Estimate  `json:"parameters"`
	Correlation [][]float64 `json:"correlation"`
	ChiSquare   float64     `json:"chi_square"`
	Dof         int         `json:"degrees_of_freedom"`
	BirgeRatio  float64     `json:"birge_ratio"`
	BirgeScaled bool        `json:"birge_scaled"`
	// Uncertainty is "stated" (weighted by the points' uncertainties) or
	// "scatter" (some point has none: unweighted, the uncertainty from the
	// residual scatter χ²/ν).
	Uncertainty string  `json:"uncertainty_basis"`
	Iterations  int     `json:"iterations"`
	Converged   bool    `json:"converged"`
	Solves      int     `json:"solve_rounds"`
	Before      *Result `json:"before"`
	After       *Result `json:"after"`
}

// Names returns the fitted parameters' names joined by "+", e.g. "gap+iron".
func (f *Fit) Names() string {
	var s []string
	for _, e := range f.Parameters {
		s = append(s, string(e.Parameter))
	}
	return strings.Join(s, "+")
}

// Calibrate fits params together so that the prediction best matches the
// curve (measure.FitLeastSquares on the residuals weighted by the stated
// uncertainties). Each distinct set of solved parameters is solved once:
// the offset costs no solve.
func Calibrate(ctx context.Context, m *models.Model, c *measure.Curve, params []Parameter, opt Options) (*Fit, error) {
	if err := c.Check(); err != nil {
		return nil, err
	}
	if len(params) == 0 {
		panic("compare: Calibrate with no parameter")
	}
	if c.Kind == measure.FluxLinkage && !(opt.TurnsArea > 0) {
		return nil, fmt.Errorf("%s holds search-coil flux linkages: give the coil's turns-area product", c.Name)
	}
	if len(params) >= len(c.Points) {
		return nil, fmt.Errorf("%s has %d points: fitting %d parameters needs at least %d", c.Name, len(c.Points), len(params), len(params)+1)
	}
	s, err := study.Compile(m)
	if err != nil {
		return nil, err
	}
	scale, unit := 1.0, "T"
	if c.Kind == measure.FluxLinkage {
		scale, unit = opt.TurnsArea, "Wb-turns"
	}
	meas, sig := c.Values()
	var yMax float64
	for _, v := range meas {
		yMax = math.Max(yMax, math.Abs(v))
	}
	f := &Fit{}
	n := len(params)
	p0 := make([]float64, n)
	step := make([]float64, n)
	maxStep := make([]float64, n)
	positive := make([]bool, n)
	ci := 0
	for k, p := range params {
		e := Estimate{Parameter: p}
		switch p {
		case Gap:
			if !(m.Gap > 0) {
				return nil, fmt.Errorf("%s: the model states no gap length (gap key or template); it cannot be calibrated", m.File)
			}
			if _, ok := m.CentreProbe(); !ok {
				return nil, fmt.Errorf("%s: no point probe at the gap centre to find the gap's mid-plane", m.File)
			}
			e.Unit, e.Nominal = "m", m.Gap
			positive[k] = true
		case Iron:
			e.Unit, e.Nominal = "", 1
			positive[k] = true
		case Turns:
			if len(m.Coils) == 0 {
				return nil, fmt.Errorf("%s: no coil", m.File)
			}
			for i := range m.Coils {
				if opt.Coil != "" && m.Coils[i].Name == opt.Coil {
					ci = i
				}
			}
			e.Unit, e.Nominal = "turns", m.Coils[ci].Turns
			positive[k] = true
		case Offset:
			e.Unit, e.Nominal = unit, 0
			step[k] = 1e-3 * yMax
			if step[k] == 0 {
				step[k] = 1e-6
			}
			maxStep[k] = math.Inf(1)
		default:
			return nil, fmt.Errorf("unknown parameter %q: use gap, iron, turns or offset", p)
		}
		p0[k] = e.Nominal
		f.Parameters = append(f.Parameters, e)
	}
	// params → study parameters and offset; solved predictions are cached
	// by the study parameters.
	split := func(v []float64) (study.Params, float64) {
		var sp study.Params
		off := 0.0
		for k, p := range params {
			switch p {
			case Gap:
				sp.Gap = v[k]
			case Iron:
				sp.IronScale = v[k]
			case Turns:
				sp.Turns = make([]float64, len(m.Coils))
				for i := range m.Coils {
					sp.Turns[i] = m.Coils[i].Turns
				}
				sp.Turns[ci] = v[k]
			case Offset:
				off = v[k]
			}
		}
		return sp, off
	}
	type key struct{ gap, iron, turns float64 }
	cache := map[key][]float64{}
	currents := c.Currents()
	solved := func(sp study.Params) ([]float64, error) {
		k := key{sp.Gap, sp.IronScale, 0}
		if sp.Turns != nil {
			k.turns = sp.Turns[ci]
		}
		if v, ok := cache[k]; ok {
			return v, nil
		}
		f.Solves++
		if opt.Progress != nil {
			opt.Progress("calibrating "+f.Names(), f.Solves, 0)
		}
		pr, err := PredictAt(ctx, s, sp, currents, opt)
		if err != nil {
			return nil, err
		}
		for i := range pr {
			pr[i] *= scale
		}
		cache[k] = pr
		return pr, nil
	}
	predict := func(v []float64) ([]float64, error) {
		sp, off := split(v)
		pr, err := solved(sp)
		if err != nil {
			return nil, err
		}
		out := make([]float64, len(pr))
		for i := range pr {
			out[i] = pr[i] + off
		}
		return out, nil
	}
	base, err := predict(p0)
	if err != nil {
		return nil, err
	}
	f.Before = residuals(c, divide(base, scale), opt.TurnsArea)
	sigma := sig
	lsq, err := measure.FitLeastSquares(predict, meas, sigma, p0, measure.LSQOptions{Step: step, MaxStep: maxStep, Positive: positive})
	if errors.Is(err, measure.ErrNoDependence) {
		return nil, fmt.Errorf("the prediction does not depend on %s, or they act alike on these points: nothing to fit", f.Names())
	}
	if err != nil {
		return nil, err
	}
	after, err := predict(lsq.Params)
	if err != nil {
		return nil, err
	}
	f.After = residuals(c, divide(after, scale), opt.TurnsArea)
	f.Correlation = lsq.Corr
	f.ChiSquare, f.Dof, f.BirgeRatio, f.BirgeScaled = lsq.Chi2, lsq.Dof, lsq.Birge, lsq.Scaled
	f.Uncertainty = lsq.Basis.String()
	f.Iterations, f.Converged = lsq.Iterations, lsq.Converged
	for k := range f.Parameters {
		e := &f.Parameters[k]
		e.Value, e.Sigma = lsq.Params[k], lsq.Sigma[k]
		e.Plausible, e.Verdict = plausible(e.Parameter, e.Nominal, e.Value, e.Sigma, unit)
	}
	return f, nil
}

func divide(v []float64, s float64) []float64 {
	out := make([]float64, len(v))
	for i := range v {
		out[i] = v[i] / s
	}
	return out
}

// plausible judges a fitted change against the common-practice bounds of
// each parameter (see the constants).
func plausible(p Parameter, nominal, value, sigma float64, unit string) (bool, string) {
	d := value - nominal
	significant := math.Abs(d) > 2*sigma
	var ok bool
	var what string
	switch p {
	case Gap:
		lim := math.Max(0.05*nominal, 0.5e-3)
		ok = math.Abs(d) <= lim
		what = fmt.Sprintf("the gap is %+.2f mm from the drawing (plausible within ±%.2f mm: machining, shims, pole deflection)", d*1e3, lim*1e3)
	case Iron:
		ok = value >= 0.7 && value <= 1.4
		what = fmt.Sprintf("the iron is %.2f times as permeable as its curve (plausible 0.7-1.4: heat-to-heat spread and machining stress)", value)
	case Turns:
		ok = math.Abs(d) <= 0.02*nominal
		what = fmt.Sprintf("the coil acts as %.1f turns instead of %.0f (plausible within ±2 %%: check the winding record and look for a shorted layer)", value, nominal)
	case Offset:
		if unit == "T" {
			ok = math.Abs(value) <= 0.02
			what = fmt.Sprintf("a constant offset of %+.2f mT (remanence or probe zero; plausible up to ±20 mT)", value*1e3)
		} else {
			ok = true
			what = fmt.Sprintf("a constant offset of %+.4g %s (remanence or integrator zero)", value, unit)
		}
		if !significant {
			return true, what + "; within twice its uncertainty: no offset is needed"
		}
	}
	if !significant {
		return true, what + "; the change is within twice its uncertainty: the measurement agrees with the model"
	}
	if ok {
		return true, what + "; a plausible change"
	}
	return false, what + "; NOT plausible: look for another cause (probe position or calibration, a different steel, a wrong drawing)"
}
