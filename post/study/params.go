package study

import (
	"fmt"
	"math"
	"slices"

	"polegap/models"
)

// Params are the values of a model's parameters for one solve. The zero
// value solves the model as its file states it. A Study never writes
// them into its model: each solve reads them from here.
//
// What a parameter changes decides what a solve at it reuses:
//
//	parameter   changes       a solve at a new value
//	Currents    sources       reuses mesh, numbering, pattern and ordering
//	Turns       sources       reuses everything, as Currents
//	IronScale   materials     reuses everything, as Currents
//	Gap         geometry      remeshes (Study.SolveAt says so: Result.Remeshed)
type Params struct {
	// Currents are the coil currents (A) in the order of the model's
	// coils; nil keeps the model's own. A shorter slice keeps the model's
	// currents of the coils it does not reach.
	Currents []float64
	// Turns are the coils' numbers of turns, as Currents.
	Turns []float64
	// IronScale multiplies the permeability of every B-H curve material
	// (its reluctivity is divided by it); 0 and 1 leave the curves as
	// they are. Calibration against a measured curve fits it: plausible
	// between 0.7 and 1.4, the spread between steel heats and after
	// machining stress (common practice, from memory).
	IronScale float64
	// Gap is the length (m) of the model's gap, opened or closed about the
	// mid-plane through the gap-centre probe (models.Model.WithGap); 0
	// keeps the model's own. Changing it remeshes.
	Gap float64
}

// ParamKind says what a parameter changes.
type ParamKind int

const (
	// SourceParam parameters (currents, turns) change only the right-hand side.
	SourceParam ParamKind = iota
	// MaterialParam parameters change the reluctivities.
	MaterialParam
	// GeometryParam parameters change the mesh: a solve at a new value remeshes.
	GeometryParam
)

func (k ParamKind) String() string {
	switch k {
	case SourceParam:
		return "source"
	case MaterialParam:
		return "material"
	case GeometryParam:
		return "geometry"
	}
	return fmt.Sprintf("ParamKind(%d)", int(k))
}

// Param describes one parameter a workflow may vary: its name, what it
// changes, its unit and its value in the model file.
type Param struct {
	Name    string // "current:COIL", "turns:COIL", "iron", "gap"
	Kind    ParamKind
	Unit    string // SI: "A", "", "m"
	Nominal float64
}

// Params lists the parameters of the study's model: each coil's current
// and turns, the iron scale, and the gap when the model states one.
func (s *Study) Params() []Param {
	m := s.Model
	var out []Param
	for _, c := range m.Coils {
		out = append(out, Param{Name: "current:" + c.Name, Kind: SourceParam, Unit: "A", Nominal: c.Current},
			Param{Name: "turns:" + c.Name, Kind: SourceParam, Unit: "", Nominal: c.Turns})
	}
	out = append(out, Param{Name: "iron", Kind: MaterialParam, Nominal: 1})
	if m.Gap > 0 {
		out = append(out, Param{Name: "gap", Kind: GeometryParam, Unit: "m", Nominal: m.Gap})
	}
	return out
}

// current returns the current of coil ci at these parameters.
func (p Params) current(m *models.Model, ci int) float64 {
	if ci < len(p.Currents) {
		return p.Currents[ci]
	}
	return m.Coils[ci].Current
}

// turns returns the turns of coil ci at these parameters.
func (p Params) turns(m *models.Model, ci int) float64 {
	if ci < len(p.Turns) {
		return p.Turns[ci]
	}
	return m.Coils[ci].Turns
}

// Current returns the current (A) of coil ci at these parameters: the
// given one, or the model's. It panics if ci is not a coil of m.
func (p Params) Current(m *models.Model, ci int) float64 { return p.current(m, ci) }

// TurnsOf returns the turns of coil ci at these parameters.
func (p Params) TurnsOf(m *models.Model, ci int) float64 { return p.turns(m, ci) }

// gap returns the gap length the parameters ask for on m (0: m's own).
func (p Params) gap(m *models.Model) float64 {
	if p.Gap == 0 || p.Gap == m.Gap {
		return 0
	}
	return p.Gap
}

// check validates the parameters against the model.
func (p Params) check(m *models.Model) error {
	if len(p.Currents) > len(m.Coils) || len(p.Turns) > len(m.Coils) {
		return fmt.Errorf("study: %d currents and %d turns given for a model with %d coils", len(p.Currents), len(p.Turns), len(m.Coils))
	}
	bad := func(v float64) bool { return math.IsNaN(v) || math.IsInf(v, 0) }
	for i, v := range p.Currents {
		if bad(v) {
			return fmt.Errorf("%s: coil %q: current %g A is not a finite number", m.File, m.Coils[i].Name, v)
		}
	}
	for i, v := range p.Turns {
		if bad(v) || v <= 0 {
			return fmt.Errorf("%s: coil %q: %g turns: give a positive number", m.File, m.Coils[i].Name, v)
		}
	}
	if bad(p.IronScale) || p.IronScale < 0 {
		return fmt.Errorf("%s: iron permeability scale %g: give a positive factor", m.File, p.IronScale)
	}
	if bad(p.Gap) || p.Gap < 0 {
		return fmt.Errorf("%s: gap %g m: give a positive length", m.File, p.Gap)
	}
	if p.Gap > 0 && !(m.Gap > 0) {
		return fmt.Errorf("%s: the model states no gap length (gap key or template), so its gap cannot be changed", m.File)
	}
	return nil
}

// Scaled returns the parameters with every coil's current at the given
// value of coil ci and the other coils' currents in proportion to the
// model's (each times current/I_ci of the model file; unchanged when the
// model's current of coil ci is zero), as an excitation curve drives a
// magnet with several windings on one supply.
func (p Params) Scaled(m *models.Model, ci int, current float64) Params {
	q := p
	q.Currents = make([]float64, len(m.Coils))
	ref := p.current(m, ci)
	for i := range m.Coils {
		base := p.current(m, i)
		switch {
		case i == ci:
			q.Currents[i] = current
		case ref != 0:
			q.Currents[i] = base * current / ref
		default:
			q.Currents[i] = base
		}
	}
	q.Turns = slices.Clone(p.Turns)
	return q
}
