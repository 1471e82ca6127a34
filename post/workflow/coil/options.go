package coil

import (
	"math"
	"strings"
)

// Flags marks the limits a winding breaks; the zero value means it meets
// every limit.
type Flags uint8

const (
	OverVoltage     Flags = 1 << iota // voltage above Spec.SupplyVoltage
	OverCurrent                       // current above Spec.SupplyCurrent
	OverDensity                       // current density above the cooling's limit
	OverHeat                          // power above what air cooling removes (not for Water)
	OverPressure                      // water pressure drop above Spec.MaxWaterPressure
	OverSpeed                         // water speed in the bore above Spec.MaxWaterSpeed
	OverTemperature                   // hottest conductor (water outlet plus film) above Spec.Temperature
)

// String lists the flags as short words
// ("volts,amps,density,heat,water,speed,temp"),
// or "ok" for none.
func (f Flags) String() string {
	if f == 0 {
		return "ok"
	}
	var s []string
	for _, p := range []struct {
		f Flags
		w string
	}{{OverVoltage, "volts"}, {OverCurrent, "amps"}, {OverDensity, "density"}, {OverHeat, "heat"}, {OverPressure, "water"}, {OverSpeed, "speed"}, {OverTemperature, "temp"}} {
		if f&p.f != 0 {
			s = append(s, p.w)
		}
	}
	return strings.Join(s, ",")
}

// Option is one winding that delivers Spec.AmpereTurns: a wire, its turns
// and what it asks of the supply and the cooling. SI units throughout.
type Option struct {
	Wire     Wire `json:"wire"`
	Turns    int  `json:"turns"`     // turns wound (Spec.Turns, or MaxTurns)
	MaxTurns int  `json:"max_turns"` // turns of this wire that fit the window

	Current        float64 `json:"current_A"`                // A, AmpereTurns / Turns
	CurrentDensity float64 `json:"current_density_A_per_m2"` // A/m², Current / Wire.Area()
	Resistance     float64 `json:"resistance_ohm"`           // Ω at Spec.Temperature
	Voltage        float64 `json:"voltage_V"`                // V, Current × Resistance
	Power          float64 `json:"power_W"`                  // W, Current² × Resistance
	Mass           float64 `json:"copper_mass_kg"`           // kg of copper, density × Turns × area × MeanTurn
	Length         float64 `json:"conductor_length_m"`       // m of conductor, Turns × MeanTurn
	CopperFill     float64 `json:"copper_fill"`              // copper area over window area, Turns × area / (Width × Height)

	CoolingPower  float64 `json:"air_cooling_W"`          // W the air cooling removes at the allowed rise; 0 for Water
	WaterFlow     float64 `json:"water_flow_m3_per_s"`    // m³/s of water to carry Power at Spec.WaterRise; 0 for air
	WaterSpeed    float64 `json:"water_speed_m_per_s"`    // m/s in the bore, flow shared by Spec.WaterCircuits; 0 unless Hollow
	Reynolds      float64 `json:"reynolds_number"`        // Reynolds number of the bore flow; 0 unless Hollow
	WaterPressure float64 `json:"water_pressure_drop_Pa"` // Pa, pressure drop along one circuit's bore; 0 unless Hollow

	Flags Flags `json:"limits_broken"` // as words (Flags.MarshalJSON)
	// Figures added for buildable coils (snake_case JSON keys, unit in
	// the key).
	SurfaceFlux   float64 `json:"surface_flux_W_per_m2,omitempty"` // W/m², Power over the cooling surface; air cooling only
	WaterCircuits int     `json:"water_circuits,omitempty"`        // parallel water circuits (Hollow)
	WaterRise     float64 `json:"water_rise_K,omitempty"`          // K, inlet to outlet; Water only
	HotSpot       float64 `json:"hottest_conductor_C,omitempty"`   // °C, water outlet plus the film drop (Hollow)
}

// OK reports whether the winding meets every limit.
func (o *Option) OK() bool { return o.Flags == 0 }

// FitTurns returns how many turns of wire w fit the window under the
// spec's packing (see Packing); 0 when not even one fits.
func FitTurns(s Spec, w *Wire) int {
	s = s.withDefaults()
	ww, wh := w.Envelope()
	W, H := s.Window.Width, s.Window.Height
	if ww > W || wh > H {
		return 0
	}
	layered := int(math.Floor(W/ww)) * int(math.Floor(H/wh))
	if w.Shape != Round {
		return layered
	}
	if s.Packing == ByLayers {
		return layered
	}
	d := w.Overall
	layers := 1 + int(math.Floor((W-d)/(d*math.Sqrt(3)/2)))
	full := int(math.Floor(H / d))
	short := full
	if H-float64(full)*d < d/2 {
		short = full - 1
	}
	ortho := (layers+1)/2*full + layers/2*short
	if s.Packing == Orthocyclic {
		return max(ortho, layered)
	}
	// ByFill, capped by the densest lay for windows only a few wires wide.
	return min(int(math.Floor(s.FillFactor*W*H/(math.Pi/4*d*d))), max(ortho, layered))
}

// Options returns, for every wire of wires that fits the turns in the
// window, the winding that delivers s.AmpereTurns, in the order of wires.
// With s.Turns = 0 each wire is wound with as many turns as fit; with
// s.Turns > 0 the wires that cannot hold that many are left out.
//
// The quantities of a winding of N turns of copper cross-section A, mean
// turn l, at temperature T:
//
//	I = NI/N,  J = I/A,  R = ρ(T) N l / A,  V = I R,  P = I² R = ρ(T) J² (N A l)
//
// (ρ(T) from CopperResistivity), so for a given copper fill N A / (W H)
// the power does not depend on the wire size: P = ρ (NI)² l / (N A).
//
// Options panics if s fails Validate or a wire fails Check: validate
// user input first.
func Options(s Spec, wires []Wire) []Option {
	if err := s.Validate(); err != nil {
		panic(err.Error())
	}
	s = s.withDefaults()
	out := make([]Option, 0, len(wires))
	rho := CopperResistivity(s.Temperature)
	rise := s.Temperature - s.Ambient
	for i := range wires {
		w := &wires[i]
		if err := w.Check(); err != nil {
			panic(err.Error())
		}
		fit := FitTurns(s, w)
		n := s.Turns
		if n == 0 {
			n = fit
		}
		if fit == 0 || n > fit {
			continue
		}
		o := Option{Wire: *w, Turns: n, MaxTurns: fit}
		a := w.Area()
		N := float64(n)
		o.Current = s.AmpereTurns / N
		o.CurrentDensity = o.Current / a
		o.Length = N * s.Window.MeanTurn
		o.Resistance = rho * o.Length / a
		o.Voltage = o.Current * o.Resistance
		o.Power = o.Current * o.Voltage
		o.Mass = CopperDensity * o.Length * a
		o.CopperFill = N * a / s.Window.Area()
		switch s.Cooling {
		case AirNatural:
			o.CoolingPower = HAirNatural * s.CoolingSurface * rise
			o.SurfaceFlux = o.Power / s.CoolingSurface
		case AirForced:
			o.CoolingPower = HAirForced * s.CoolingSurface * rise
			o.SurfaceFlux = o.Power / s.CoolingSurface
		case Water:
			waterCircuit(&o, &s)
		}
		if s.SupplyVoltage > 0 && o.Voltage > s.SupplyVoltage {
			o.Flags |= OverVoltage
		}
		if s.SupplyCurrent > 0 && o.Current > s.SupplyCurrent {
			o.Flags |= OverCurrent
		}
		if o.CurrentDensity > s.MaxCurrentDensity {
			o.Flags |= OverDensity
		}
		if s.Cooling != Water && o.Power > o.CoolingPower {
			o.Flags |= OverHeat
		}
		if s.MaxWaterPressure > 0 && o.WaterPressure > s.MaxWaterPressure {
			o.Flags |= OverPressure
		}
		if s.MaxWaterSpeed > 0 && o.WaterSpeed > s.MaxWaterSpeed {
			o.Flags |= OverSpeed
		}
		if o.HotSpot > s.Temperature {
			o.Flags |= OverTemperature
		}
		out = append(out, o)
	}
	return out
}

// Criterion is what Best minimises among the windings that meet every
// limit.
type Criterion uint8

const (
	LeastPower   Criterion = iota // lowest I²R (the default)
	LeastCurrent                  // lowest supply current
	LeastVoltage                  // lowest supply voltage
	LeastMass                     // least copper
)

func (c Criterion) key(o *Option) float64 {
	switch c {
	case LeastPower:
		return o.Power
	case LeastCurrent:
		return o.Current
	case LeastVoltage:
		return o.Voltage
	case LeastMass:
		return o.Mass
	}
	panic(errBadCriterion)
}

// Best returns the winding of opts that meets every limit and has the
// least of by; the first in opts wins a tie. ok is false when none meets
// every limit; Explain says why.
func Best(opts []Option, by Criterion) (best Option, ok bool) {
	by.key(&Option{}) // panics on an unknown criterion even for empty opts
	for i := range opts {
		o := &opts[i]
		if !o.OK() {
			continue
		}
		if !ok || by.key(o) < by.key(&best) {
			best, ok = *o, true
		}
	}
	return best, ok
}

// Explain returns nil when some winding of opts meets every limit, and
// otherwise a *NoneError counting the limits broken.
func Explain(opts []Option) error {
	e := &NoneError{Windings: len(opts)}
	for i := range opts {
		f := opts[i].Flags
		if f == 0 {
			return nil
		}
		if f&OverVoltage != 0 {
			e.OverVoltage++
		}
		if f&OverCurrent != 0 {
			e.OverCurrent++
		}
		if f&OverDensity != 0 {
			e.OverDensity++
		}
		if f&OverHeat != 0 {
			e.OverHeat++
		}
		if f&OverPressure != 0 {
			e.OverPressure++
		}
		if f&OverSpeed != 0 {
			e.OverSpeed++
		}
		if f&OverTemperature != 0 {
			e.OverTemperature++
		}
	}
	return e
}
