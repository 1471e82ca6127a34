package report

import (
	"io"

	"polegap/post/study"
	"polegap/post/workflow/coil"
	"polegap/post/workflow/target"
)

// Sizing is the answer to "what does it take to reach this field": the
// ampere-turns found by nonlinear solves and the windings that deliver
// them in the model's coil window.
type Sizing struct {
	Model       string         `json:"model"`
	Probe       string         `json:"probe"`
	Target      float64        `json:"target_T"`
	Reached     bool           `json:"reached"`
	Field       float64        `json:"field_T"`
	AmpereTurns float64        `json:"ampere_turns_per_winding"`
	Windings    int            `json:"windings_in_series"`
	Current     float64        `json:"model_turns_current_A"`
	Efficiency  float64        `json:"efficiency"`
	MaxIronB    float64        `json:"max_iron_B_T"`
	Solves      int            `json:"solves"`
	Limit       float64        `json:"ampere_turn_limit"`
	Window      WindowReport   `json:"window"`
	Options     []coil.Option  `json:"options"`
	Best        *coil.Option   `json:"best,omitempty"`
	NoneReason  string         `json:"none_meets_limits,omitempty"`
	Cautions    []string       `json:"cautions"`
	Spec        coil.Spec      `json:"-"`
	Result      *target.Result `json:"-"`
}

// WindowReport is the coil window in millimetres.
type WindowReport struct {
	Width    float64 `json:"radial_build_mm"`
	Height   float64 `json:"height_mm"`
	MeanTurn float64 `json:"mean_turn_mm"`
}

// NewSizing assembles the sizing report from a search result, the coil's
// winding and the coil options.
func NewSizing(model, probe string, res *target.Result, w study.Winding, spec coil.Spec, opts []coil.Option) *Sizing {
	if spec.FillFactor == 0 {
		spec.FillFactor = coil.DefaultFillFactor
	}
	if spec.Temperature == 0 {
		spec.Temperature = coil.DefaultTemperature
	}
	s := &Sizing{
		Model: model, Probe: probe, Target: res.Target, Reached: res.Reached,
		Field: res.Point.Field, AmpereTurns: res.AmpereTurns, Windings: w.Windings,
		Current: res.Current, Efficiency: res.Point.Efficiency, MaxIronB: res.Point.MaxIronB,
		Solves: len(res.Solves), Limit: res.Limit,
		Window:  WindowReport{Width: w.Window.Width * 1e3, Height: w.Window.Height * 1e3, MeanTurn: w.Window.MeanTurn * 1e3},
		Options: opts, Cautions: coil.Cautions(), Spec: spec, Result: res,
	}
	if best, ok := coil.Best(opts, coil.LeastPower); ok {
		s.Best = &best
	} else if err := coil.Explain(opts); err != nil {
		s.NoneReason = err.Error()
	}
	return s
}

// WriteText writes the sizing summary, the table of windings and the
// cautions.
func (s *Sizing) WriteText(w io.Writer) error {
	ew := &errWriter{w: w}
	ew.printf("target      %.4g T at probe %s of %s\n", s.Target, s.Probe, s.Model)
	ew.printf("needs       %.0f ampere-turns per winding (%d winding(s) in series), found in %d nonlinear solves\n", s.AmpereTurns, s.Windings, s.Solves)
	ew.printf("            reached %.5f T; magnet efficiency %.1f %%; largest element |B| in the iron %.2f T\n", s.Field, 100*s.Efficiency, s.MaxIronB)
	ew.printf("            with the model's turns that is %.4g A\n", s.Current)
	ew.printf("window      radial build %.1f mm, height %.1f mm, mean turn %.0f mm; fill %.2f, copper at %.0f °C, %s cooling\n\n",
		s.Window.Width, s.Window.Height, s.Window.MeanTurn, s.Spec.FillFactor, s.Spec.Temperature, s.Spec.Cooling)
	if ew.err != nil {
		return ew.err
	}
	if err := coil.WriteTable(w, s.Options); err != nil {
		return err
	}
	if s.Best != nil {
		b := s.Best
		ew.printf("\nleast power within every limit: %s, %d turns at %.4g A (%.2f A/mm²), %.4g V, %.4g W, %.3g kg of copper per winding\n",
			b.Wire.Name, b.Turns, b.Current, b.CurrentDensity*1e-6, b.Voltage, b.Power, b.Mass)
		if s.Windings > 1 {
			ew.printf("the %d windings in series need %.4g V and %.4g W together\n", s.Windings, float64(s.Windings)*b.Voltage, float64(s.Windings)*b.Power)
		}
	} else {
		ew.printf("\nno winding meets every limit: %s\n", s.NoneReason)
	}
	ew.printf("\nCAUTION\n")
	for _, c := range s.Cautions {
		ew.printf("  - %s\n", c)
	}
	return ew.err
}

// WriteSummary writes the sizing result in a few lines (no table) with
// the cautions.
func (s *Sizing) WriteSummary(w io.Writer) error {
	ew := &errWriter{w: w}
	ew.printf("target %.4g T at %s: %.0f ampere-turns per winding (%d in series), %d nonlinear solves, efficiency %.1f %%\n",
		s.Target, s.Probe, s.AmpereTurns, s.Windings, s.Solves, 100*s.Efficiency)
	if b := s.Best; b != nil {
		ew.printf("coil (%s cooling): %s, %d turns at %.4g A (%.2f A/mm²), %.4g V, %.4g W, %.3g kg of copper per winding\n",
			s.Spec.Cooling, b.Wire.Name, b.Turns, b.Current, b.CurrentDensity*1e-6, b.Voltage, b.Power, b.Mass)
	} else {
		ew.printf("no winding meets every limit: %s\n", s.NoneReason)
	}
	ew.printf("CAUTION\n")
	for _, c := range s.Cautions {
		ew.printf("  - %s\n", c)
	}
	return ew.err
}
