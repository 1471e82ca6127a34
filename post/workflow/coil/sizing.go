package coil

import (
	"polegap/post/workflow/target"
)

// Sizing is the answer to "what does it take to reach this field": the
// ampere-turns found by nonlinear solves and the windings that deliver
// them in the model's coil window.
type Sizing struct {
	Model       string       `json:"model"`
	Probe       string       `json:"probe"`
	Target      float64      `json:"target_T"`
	Reached     bool         `json:"reached"`
	Field       float64      `json:"field_T"`
	AmpereTurns float64      `json:"ampere_turns_per_winding"`
	Windings    int          `json:"windings_in_series"`
	Current     float64      `json:"model_turns_current_A"`
	Efficiency  float64      `json:"efficiency"`
	MaxIronB    float64      `json:"max_iron_B_T"`
	Solves      int          `json:"solves"`
	Limit       float64      `json:"ampere_turn_limit"`
	Window      WindowReport `json:"window"`
	Options     []Option     `json:"options"`
	Best        *Option      `json:"best,omitempty"`
	NoneReason  string       `json:"none_meets_limits,omitempty"`
	Cautions    []string     `json:"cautions"`
	// AmpereTurnsEstimate is the error estimate of AmpereTurns: the
	// change of the answer between the last two meshes of the adaptive
	// refinement (0 when not estimated); Accuracy says in a line how
	// converged the solves are.
	AmpereTurnsEstimate float64        `json:"ampere_turns_estimate,omitempty"`
	Accuracy            string         `json:"accuracy,omitempty"`
	Spec                Spec           `json:"-"`
	Result              *target.Result `json:"-"`
}

// WindowReport is the coil window in millimetres.
type WindowReport struct {
	Width    float64 `json:"radial_build_mm"`
	Height   float64 `json:"height_mm"`
	MeanTurn float64 `json:"mean_turn_mm"`
}

// NewSizing assembles the sizing report from a search result, the coil's
// winding and the coil options.
func NewSizing(model, probe string, res *target.Result, w Winding, spec Spec, opts []Option) *Sizing {
	if spec.FillFactor == 0 {
		spec.FillFactor = DefaultFillFactor
	}
	if spec.Temperature == 0 {
		spec.Temperature = DefaultTemperature
	}
	s := &Sizing{
		Model: model, Probe: probe, Target: res.Target, Reached: res.Reached,
		Field: res.Point.Field, AmpereTurns: res.AmpereTurns, Windings: w.Windings,
		Current: res.Current, Efficiency: res.Point.Efficiency, MaxIronB: res.Point.MaxIronB,
		Solves: len(res.Solves), Limit: res.Limit,
		Window:  WindowReport{Width: w.Window.Width * 1e3, Height: w.Window.Height * 1e3, MeanTurn: w.Window.MeanTurn * 1e3},
		Options: opts, Cautions: Cautions(), Spec: spec, Result: res,
	}
	if best, ok := Best(opts, LeastPower); ok {
		s.Best = &best
	} else if err := Explain(opts); err != nil {
		s.NoneReason = err.Error()
	}
	return s
}
