package coil

import (
	"polegap/post/workflow/caution"
	"polegap/post/workflow/supply"
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
	// Cautions, quantified from the sizing and its supply (each encodes
	// to JSON as its sentence).
	Cautions []caution.Caution `json:"cautions"`
	// Supply is what the supply must do for the recommended winding
	// (nil when none is recommended or not computed; see SetSupply).
	Supply *supply.Supply `json:"supply,omitempty"`
	// AmpereTurnsEstimate is the error estimate of AmpereTurns: the
	// change of the answer between the last two meshes of the adaptive
	// refinement (0 when not estimated); Accuracy says in a line how
	// converged the solves are.
	AmpereTurnsEstimate float64        `json:"ampere_turns_estimate,omitempty"`
	Accuracy            string         `json:"accuracy,omitempty"`
	Spec                Spec           `json:"-"`
	Result              *target.Result `json:"-"`
	// Planar is true for a planar model (its inductance leaves out the
	// end turns).
	Planar bool `json:"-"`
	// BestIndex is Best's index in Options (-1: none).
	BestIndex int `json:"-"`
	// IronLimit (T), when set, is the flux density the iron's largest
	// |B| is compared with (the caller's choice, e.g. where the steel's
	// μr falls to 100); 0 when not known.
	IronLimit float64 `json:"iron_limit_B_T,omitempty"`
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
		Options: opts, Spec: spec, Result: res,
	}
	s.BestIndex = -1
	if best, ok := Best(opts, LeastPower); ok {
		s.Best = &best
		for i := range opts {
			if opts[i].Wire.Name == best.Wire.Name && opts[i].Turns == best.Turns {
				s.BestIndex = i
				break
			}
		}
	} else if err := Explain(opts); err != nil {
		s.NoneReason = err.Error()
	}
	s.Cautions = caution.List(s.Facts())
	return s
}

// SetSupply records the supply figures of the recommended winding and
// quantifies the cautions with them.
func (s *Sizing) SetSupply(sup *supply.Supply) {
	s.Supply = sup
	s.Cautions = caution.List(s.Facts())
}

// Facts returns what the sizing knows for its cautions: the recommended
// winding's power, copper and temperature (all windings together), its
// water, and the supply's stored energy and switch-off.
func (s *Sizing) Facts() caution.Facts {
	f := caution.Facts{CoilTemperature: s.Spec.Defaults().Temperature, Water: s.Spec.Cooling == Water}
	if s.Result != nil {
		f.Energy = s.Result.Point.Energy // the field's, whatever the winding
	}
	if b := s.Best; b != nil {
		n := float64(max(s.Windings, 1))
		f.Current, f.Power, f.CopperMass = b.Current, n*b.Power, n*b.Mass
		f.WaterFlow, f.WaterPressure = n*b.WaterFlow, b.WaterPressure
		if b.HotSpot > 0 {
			f.CoilTemperature = b.HotSpot
		}
	}
	if sup := s.Supply; sup != nil {
		f.Energy, f.Current = sup.Energy, sup.Current
		f.DischargePath, f.SwitchOffVoltage, f.DischargeTime = sup.Discharge.Path, sup.Discharge.PeakVoltage, sup.Discharge.Time
	}
	return f
}
