package compare

import (
	"context"
	"fmt"
	"math"

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
)

// Fit is a calibrated parameter.
type Fit struct {
	Parameter  Parameter `json:"parameter"`
	Unit       string    `json:"unit"`
	Nominal    float64   `json:"nominal"`
	Value      float64   `json:"fitted"`
	Sigma      float64   `json:"standard_uncertainty"`
	Iterations int       `json:"iterations"`
	Solves     int       `json:"solve_rounds"`
	Before     *Result   `json:"before"`
	After      *Result   `json:"after"`
	Plausible  bool      `json:"plausible"`
	Verdict    string    `json:"verdict"`
}

// Calibrate fits param so that the prediction best matches the curve.
func Calibrate(ctx context.Context, m *models.Model, c *measure.Curve, param Parameter, opt Options) (*Fit, error) {
	if err := c.Check(); err != nil {
		return nil, err
	}
	if c.Kind == measure.FluxLinkage && !(opt.TurnsArea > 0) {
		return nil, fmt.Errorf("%s holds search-coil flux linkages: give the coil's turns-area product", c.Name)
	}
	f := &Fit{Parameter: param}
	s, err := study.Compile(m)
	if err != nil {
		return nil, err
	}
	var at func(v float64) study.Params
	currents := c.Currents()
	switch param {
	case Gap:
		if !(m.Gap > 0) {
			return nil, fmt.Errorf("%s: the model states no gap length (gap key or template); it cannot be calibrated", m.File)
		}
		if _, ok := m.CentreProbe(); !ok {
			return nil, fmt.Errorf("%s: no point probe at the gap centre to find the gap's mid-plane", m.File)
		}
		f.Unit, f.Nominal = "m", m.Gap
		at = func(g float64) study.Params { return study.Params{Gap: g} }
	case Iron:
		f.Unit, f.Nominal = "", 1
		at = func(k float64) study.Params { return study.Params{IronScale: k} }
	case Turns:
		if len(m.Coils) == 0 {
			return nil, fmt.Errorf("%s: no coil", m.File)
		}
		ci := 0
		if opt.Coil != "" {
			for i := range m.Coils {
				if m.Coils[i].Name == opt.Coil {
					ci = i
				}
			}
		}
		f.Unit, f.Nominal = "turns", m.Coils[ci].Turns
		at = func(n float64) study.Params {
			turns := make([]float64, len(m.Coils))
			for i := range m.Coils {
				turns[i] = m.Coils[i].Turns
			}
			turns[ci] = n
			return study.Params{Turns: turns}
		}
	default:
		return nil, fmt.Errorf("unknown parameter %q: use gap, iron or turns", param)
	}
	predict := func(v float64) ([]float64, error) { return PredictAt(ctx, s, at(v), currents, opt) }
	scale := 1.0
	if c.Kind == measure.FluxLinkage {
		scale = opt.TurnsArea
	}
	meas, sig := c.Values()
	weight := make([]float64, len(meas))
	weighted := true
	for i := range sig {
		if sig[i] <= 0 {
			weighted = false
		}
	}
	for i := range weight {
		weight[i] = 1
		if weighted {
			weight[i] = 1 / sig[i]
		}
	}
	eval := func(p float64) ([]float64, error) {
		f.Solves++
		if opt.Progress != nil {
			opt.Progress(fmt.Sprintf("calibrating %s = %.6g", param, p), f.Solves, 0)
		}
		pr, err := predict(p)
		if err != nil {
			return nil, err
		}
		for i := range pr {
			pr[i] *= scale
		}
		return pr, nil
	}
	// Gauss–Newton on one parameter: p ← p + Σ w² J r / Σ w² J².
	p0 := f.Nominal
	base, err := eval(p0)
	if err != nil {
		return nil, err
	}
	f.Before = residuals(c, divide(base, scale), opt.TurnsArea)
	h := 0.01 * math.Abs(p0)
	pPrev, prev := p0+h, []float64(nil)
	if prev, err = eval(pPrev); err != nil {
		return nil, err
	}
	p, cur := p0, base
	var jtj float64
	for f.Iterations = 1; f.Iterations <= 8; f.Iterations++ {
		var jtr float64
		jtj = 0
		for i := range cur {
			j := (prev[i] - cur[i]) / (pPrev - p) * weight[i]
			r := (meas[i] - cur[i]) * weight[i]
			jtr += j * r
			jtj += j * j
		}
		if !(jtj > 0) {
			return nil, fmt.Errorf("the prediction does not depend on %s: nothing to fit", param)
		}
		step := jtr / jtj
		// Keep steps modest: at most 30 % of the nominal value at once.
		lim := 0.3 * math.Abs(p0)
		step = math.Max(-lim, math.Min(lim, step))
		next := p + step
		if param != Iron && next <= 0 {
			next = p / 2
		}
		pr, err := eval(next)
		if err != nil {
			return nil, err
		}
		pPrev, prev, p, cur = p, cur, next, pr
		if math.Abs(step) <= 1e-5*math.Abs(p0) {
			break
		}
	}
	f.Value = p
	f.After = residuals(c, divide(cur, scale), opt.TurnsArea)
	// Covariance of the linearised fit: 1/JᵀJ (weighted), or scaled by the
	// residual variance when no uncertainties are given.
	var rss float64
	for i := range cur {
		r := (meas[i] - cur[i]) * weight[i]
		rss += r * r
	}
	n := len(meas)
	varp := 1 / jtj
	if !weighted && n > 1 {
		varp *= rss / float64(n-1)
	}
	f.Sigma = math.Sqrt(varp)
	f.Plausible, f.Verdict = plausible(param, f.Nominal, f.Value, f.Sigma)
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
func plausible(p Parameter, nominal, value, sigma float64) (bool, string) {
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
	}
	if !significant {
		return true, what + "; the change is within twice its uncertainty: the measurement agrees with the model"
	}
	if ok {
		return true, what + "; a plausible change"
	}
	return false, what + "; NOT plausible: look for another cause (probe position or calibration, a different steel, a wrong drawing)"
}
