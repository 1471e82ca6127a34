package supply

import (
	"fmt"
	"math"
	"sort"

	"polegap/post/workflow/sweep"
)

// Defaults of Options.
const (
	DefaultRampTime = 10.0 // s, a gentle ramp for a lab magnet (common practice)
	// DefaultDiodeDrop is the forward drop of a silicon power diode at
	// its rated current, about 0.7-1.5 V (from memory of data sheets).
	DefaultDiodeDrop = 1.0 // V
	DefaultSteps     = 10
	// FallTo is the fraction of the operating current at which the
	// discharge counts as over.
	FallTo = 0.01
)

// A CurvePoint is one point of the coil's excitation curve.
type CurvePoint struct {
	Current float64 // A, in the coil
	Linkage float64 // Wb, flux linkage of the whole coil
}

// Options control the supply figures.
type Options struct {
	RampTime float64 // s, linear ramp from 0 to the operating current; 0 = DefaultRampTime
	// DischargeResistance (Ω) is the resistor the coil discharges into
	// at switch-off; 0 means a free-wheeling diode of DiodeDrop.
	DischargeResistance float64
	DiodeDrop           float64 // V; 0 = DefaultDiodeDrop
	Steps               int     // ramp profile points after t = 0; 0 = DefaultSteps
}

// RampPoint is one point of the ramp profile.
type RampPoint struct {
	Time        float64 `json:"t_s"`
	Current     float64 `json:"current_A"`
	Incremental float64 `json:"incremental_inductance_H"`
	Voltage     float64 `json:"voltage_V"`
}

// Discharge is what switching off does.
type Discharge struct {
	Path         string  `json:"path"`                   // "discharge resistor" or "free-wheeling diode"
	Resistance   float64 `json:"resistance_ohm"`         // R_d, 0 for the diode
	PeakVoltage  float64 `json:"peak_voltage_V"`         // I₀ R_d, or the diode drop
	TimeConstant float64 `json:"time_constant_s"`        // L_inc(I₀)/(R + R_d)
	Time         float64 `json:"time_to_1_percent_s"`    // until the current is FallTo × I₀
	Energy       float64 `json:"energy_absorbed_J"`      // in R_d; for the diode, in the coil and diode (all of W)
	EnergyShare  float64 `json:"share_of_stored_energy"` // Energy / W
}

// Supply is what the supply must do for the coil, and its switch-off.
type Supply struct {
	Current      float64 `json:"current_A"`                // operating current I₀
	Resistance   float64 `json:"resistance_ohm"`           // R of the whole coil
	Apparent     float64 `json:"apparent_inductance_H"`    // Ψ(I₀)/I₀
	Incremental  float64 `json:"incremental_inductance_H"` // dΨ/dI just below I₀
	TimeConstant float64 `json:"time_constant_s"`          // L_inc(I₀)/R
	Energy       float64 `json:"stored_energy_J"`          // ∫ I dΨ to I₀
	// FieldEnergy (J), when the caller knows it, is the energy of the
	// field solution at I₀ (∫ H·dB over the volume), which Energy
	// approximates from the curve: their difference shows how well the
	// curve's few points resolve it. 0 when not given.
	FieldEnergy float64     `json:"field_energy_J,omitempty"`
	SteadyV     float64     `json:"steady_voltage_V"` // I₀ R
	RampTime    float64     `json:"ramp_time_s"`
	RampRate    float64     `json:"ramp_rate_A_per_s"`
	PeakVoltage float64     `json:"peak_ramp_voltage_V"` // largest V(t) during the ramp
	PeakAt      float64     `json:"peak_at_A"`           // the current at which it occurs
	Profile     []RampPoint `json:"ramp_profile"`
	Discharge   Discharge   `json:"discharge"`
}

// CurveError reports an excitation curve New cannot use.
type CurveError struct{ Reason string }

func (e *CurveError) Error() string { return "supply: excitation curve: " + e.Reason }

// CurveOf turns the points of a sweep or search of a model coil into the
// excitation curve of a winding of turns turns per winding carrying the
// same ampere-turns: I = NI/turns and Ψ = Ψ_model × turns/turns_model
// (the flux per turn is set by the ampere-turns alone). Points at zero
// current are dropped (New adds the origin), and so is a point at a
// current met before (a search may solve one current twice; the points
// of a sweep and of a search on one mesh may meet).
func CurveOf(pts []sweep.Point, turns int) []CurvePoint {
	out := make([]CurvePoint, 0, len(pts))
	seen := make(map[float64]bool, len(pts))
	for _, p := range pts {
		if p.Current == 0 || p.AmpereTurns == 0 || seen[p.Current] {
			continue
		}
		seen[p.Current] = true
		nm := p.AmpereTurns / p.Current
		out = append(out, CurvePoint{Current: p.AmpereTurns / float64(turns), Linkage: p.Linkage * float64(turns) / nm})
	}
	return out
}

// New computes the supply figures for a coil of resistance r (Ω)
// driven to current i0 (A), with the excitation curve pts (any order;
// the curve is extended linearly past its last point when i0 lies
// beyond it).
func New(pts []CurvePoint, r, i0 float64, opt Options) (*Supply, error) {
	fin := func(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
	if !(r > 0) || !fin(r) || !(i0 > 0) || !fin(i0) {
		panic("supply: resistance and current must be finite and > 0")
	}
	if opt.RampTime == 0 {
		opt.RampTime = DefaultRampTime
	}
	if opt.DiodeDrop == 0 {
		opt.DiodeDrop = DefaultDiodeDrop
	}
	if opt.Steps == 0 {
		opt.Steps = DefaultSteps
	}
	if !(opt.RampTime > 0) || !fin(opt.RampTime) || !(opt.DischargeResistance >= 0) || !fin(opt.DischargeResistance) ||
		!(opt.DiodeDrop > 0) || !fin(opt.DiodeDrop) || opt.Steps < 1 {
		panic("supply: ramp time, discharge resistance, diode drop or steps out of range")
	}
	c, err := newCurve(pts)
	if err != nil {
		return nil, err
	}
	s := &Supply{Current: i0, Resistance: r, RampTime: opt.RampTime, RampRate: i0 / opt.RampTime, SteadyV: i0 * r}
	s.Apparent = c.linkage(i0) / i0
	s.Incremental = c.slope(i0)
	s.TimeConstant = s.Incremental / r
	s.Energy = c.energy(i0)
	// Ramp: V rises with I R and jumps where L_inc changes; its largest
	// value on each interval is at the interval's top (or at I₀).
	volts := func(i float64) float64 { return c.slope(i)*s.RampRate + i*r }
	s.PeakAt = i0
	s.PeakVoltage = volts(i0)
	for _, x := range c.i {
		if x > 0 && x < i0 {
			if v := volts(x); v > s.PeakVoltage {
				s.PeakVoltage, s.PeakAt = v, x
			}
		}
	}
	for k := 0; k <= opt.Steps; k++ {
		t := opt.RampTime * float64(k) / float64(opt.Steps)
		i := i0 * float64(k) / float64(opt.Steps)
		if k == opt.Steps {
			t, i = opt.RampTime, i0 // exactly, not rounded: the last interval's L_inc
		}
		s.Profile = append(s.Profile, RampPoint{Time: t, Current: i, Incremental: c.slope(i), Voltage: volts(i)})
	}
	s.Discharge = c.discharge(r, i0, opt)
	s.Discharge.EnergyShare = s.Discharge.Energy / s.Energy
	return s, nil
}

// curve is Ψ(I), piecewise linear through (0, 0) and the points.
type curve struct{ i, psi []float64 }

func newCurve(pts []CurvePoint) (*curve, error) {
	ps := append([]CurvePoint(nil), pts...)
	sort.SliceStable(ps, func(a, b int) bool { return ps[a].Current < ps[b].Current })
	c := &curve{i: []float64{0}, psi: []float64{0}}
	for _, p := range ps {
		if math.IsNaN(p.Current) || math.IsInf(p.Current, 0) || math.IsNaN(p.Linkage) || math.IsInf(p.Linkage, 0) {
			return nil, &CurveError{fmt.Sprintf("non-finite point (%g A, %g Wb)", p.Current, p.Linkage)}
		}
		if p.Current < 0 {
			return nil, &CurveError{fmt.Sprintf("negative current %g A", p.Current)}
		}
		last := len(c.i) - 1
		if p.Current == c.i[last] {
			if p.Current == 0 {
				continue
			}
			return nil, &CurveError{fmt.Sprintf("two points at %g A", p.Current)}
		}
		if p.Linkage < c.psi[last] {
			return nil, &CurveError{fmt.Sprintf("flux linkage falls from %g to %g Wb between %g and %g A", c.psi[last], p.Linkage, c.i[last], p.Current)}
		}
		c.i, c.psi = append(c.i, p.Current), append(c.psi, p.Linkage)
	}
	if len(c.i) < 2 {
		return nil, &CurveError{"no point above zero current"}
	}
	return c, nil
}

// seg returns the interval k (i[k] < x <= i[k+1]) of current x > 0,
// the last one past the curve's end.
func (c *curve) seg(x float64) int {
	k := sort.SearchFloat64s(c.i, x) - 1 // i[k] < x <= i[k+1]
	return max(0, min(k, len(c.i)-2))
}

// slope is L_inc on the interval below x (the first one at x = 0).
func (c *curve) slope(x float64) float64 {
	k := c.seg(x)
	return (c.psi[k+1] - c.psi[k]) / (c.i[k+1] - c.i[k])
}

func (c *curve) linkage(x float64) float64 {
	k := c.seg(x)
	return c.psi[k] + c.slope(x)*(x-c.i[k])
}

// energy is ∫₀^x I dΨ, exact for the piecewise-linear Ψ: on each
// interval the trapezoid (I_a + I_b)/2 (Ψ_b − Ψ_a).
func (c *curve) energy(x float64) float64 {
	w := 0.0
	for k := 0; k+1 < len(c.i) && c.i[k] < x; k++ {
		b := math.Min(c.i[k+1], x)
		if k == len(c.i)-2 {
			b = x // extended past the last point
		}
		l := c.slope(b)
		w += 0.5 * (c.i[k] + b) * l * (b - c.i[k])
	}
	return w
}

// discharge integrates the decay from i0 to FallTo × i0 interval by
// interval (see the package doc).
func (c *curve) discharge(r, i0 float64, opt Options) Discharge {
	d := Discharge{Path: "discharge resistor", Resistance: opt.DischargeResistance}
	rt := r + opt.DischargeResistance
	vd := 0.0
	if opt.DischargeResistance == 0 {
		d.Path, vd = "free-wheeling diode", opt.DiodeDrop
	}
	d.PeakVoltage = i0 * opt.DischargeResistance
	if vd > 0 {
		d.PeakVoltage = vd
	}
	d.TimeConstant = c.slope(i0) / rt
	end := FallTo * i0
	top := i0
	for top > end {
		k := c.seg(top)
		bot := math.Max(c.i[k], end)
		l := c.slope(top)
		d.Time += l / rt * math.Log((top*rt+vd)/(bot*rt+vd))
		top = bot
	}
	w := c.energy(i0)
	d.Energy = w
	if opt.DischargeResistance > 0 {
		d.Energy = w * opt.DischargeResistance / rt
	}
	return d
}
