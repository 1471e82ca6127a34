package caution

import (
	"encoding/json"
	"fmt"
	"math"
)

// Hazard names what a caution is about.
type Hazard string

// The hazards, in the order List gives them.
const (
	Energy    Hazard = "stored energy"
	SwitchOff Hazard = "switch-off voltage"
	PoleForce Hazard = "pole attraction"
	Heat      Hazard = "coil temperature"
	Water     Hazard = "cooling water"
	Overdrive Hazard = "current above rating"
	Codes     Hazard = "codes and practice"
)

const (
	standardGravity = 9.80665 // m/s², standard acceleration of gravity (3rd CGPM, 1901)
	copperHeat      = 385.0   // J/(kg·K), specific heat of copper near 20 °C (handbook value, from memory)
)

// A Caution is one safety note: its hazard, one sentence with the
// design's numbers, and the figure it is about (SI, 0 when general).
type Caution struct {
	Hazard Hazard
	Text   string
	Value  float64 // SI value of the figure the sentence quotes; 0 when none
	Unit   string  // SI unit of Value ("J", "V", "N", "°C", "K/s", "A")
}

// MarshalJSON encodes a caution as its sentence, so that a "cautions"
// array stays an array of strings.
func (c Caution) MarshalJSON() ([]byte, error) { return json.Marshal(c.Text) }

// Facts are what is known of a design when its cautions are written;
// a zero field is unknown and leaves its caution general.
type Facts struct {
	Energy  float64 // J stored in the field at the operating point
	Current float64 // A in the coil at the operating point
	// Inductance (H, apparent) of that coil: with no discharge path
	// designed, the switch-off caution quotes L I / 1 ms, the voltage of
	// a circuit broken in a millisecond.
	Inductance float64
	// SwitchOffVoltage (V) is the voltage across the coil when its
	// current is switched off through the chosen path (a discharge
	// resistor: I R_d); DischargeTime (s) how long the current takes to
	// fall to 1 %.
	SwitchOffVoltage, DischargeTime float64
	// DischargePath names the switch-off path ("discharge resistor",
	// "free-wheeling diode"); empty when not designed.
	DischargePath   string
	Force           float64 // N, attraction between the poles
	Power           float64 // W dissipated in the coil
	CopperMass      float64 // kg of copper, for the heating rate without cooling
	CoilTemperature float64 // °C, design or hottest conductor temperature
	Water           bool    // water-cooled
	WaterPressure   float64 // Pa, pressure drop across the coil
	WaterFlow       float64 // m³/s
	// Rated and Driven (A): a sweep that drives the coil to Driven,
	// above its Rated (the model's) current.
	Rated, Driven float64
}

// List returns the cautions for a design with the given facts: every
// general caution, quantified where the facts allow, plus the water and
// overdrive cautions when they apply.
func List(f Facts) []Caution {
	var out []Caution
	add := func(h Hazard, v float64, unit, text string) {
		out = append(out, Caution{Hazard: h, Text: text, Value: v, Unit: unit})
	}
	if f.Energy > 0 {
		add(Energy, f.Energy, "J", fmt.Sprintf("The field stores %s%s: magnet currents and this energy can injure or kill; treat the supply and the coil as hazardous and disconnect and discharge them before touching the coil or its terminals.",
			withPrefix(f.Energy, "J"), atCurrent(f.Current)))
	} else {
		add(Energy, 0, "", "Magnet currents and the energy stored in the field can injure or kill: treat the supply and the coil as hazardous, and disconnect and discharge them before touching the coil or its terminals.")
	}
	if f.DischargePath != "" {
		t := ""
		if f.DischargeTime > 0 {
			t = fmt.Sprintf(" and the current takes %s to fall to 1 %%", withPrefix(f.DischargeTime, "s"))
		}
		add(SwitchOff, f.SwitchOffVoltage, "V", fmt.Sprintf("Switching off through the %s makes %s across the coil%s; opening the circuit without that path makes a far higher voltage: never break the coil circuit under current, and rate the switch, the discharge path and the insulation for it.",
			f.DischargePath, withPrefix(f.SwitchOffVoltage, "V"), t))
	} else if f.Inductance > 0 && f.Current != 0 {
		v := f.Inductance * math.Abs(f.Current) / 1e-3
		add(SwitchOff, v, "V", fmt.Sprintf("Switching off or disconnecting a coil under current makes a high voltage across it: breaking %s in %.3g H within a millisecond would make about %s (L I / 1 ms); provide a free-wheeling path or dump resistor and ramp the current down.",
			withPrefix(math.Abs(f.Current), "A"), f.Inductance, withPrefix(v, "V")))
	} else {
		add(SwitchOff, 0, "", "Switching off or disconnecting a coil under current makes a high voltage across it: provide a free-wheeling path or dump resistor and ramp the current down.")
	}
	if f.Force > 0 {
		add(PoleForce, f.Force, "N", fmt.Sprintf("The poles attract each other with %s (the weight of about %s): design frames and fixings for it, and keep tools and steel objects away from the gap and the yoke while the magnet is energised.",
			withPrefix(f.Force, "N"), massText(f.Force/standardGravity)))
	} else {
		add(PoleForce, 0, "", "Iron poles attract tools and steel objects with large forces: keep them away from the gap and the yoke while the magnet is energised.")
	}
	switch {
	case f.Power > 0 && f.CopperMass > 0:
		rate := f.Power / (f.CopperMass * copperHeat)
		tt := ""
		if f.CoilTemperature > 0 {
			tt = fmt.Sprintf(" and runs at up to %.0f °C when cooled as designed", f.CoilTemperature)
		}
		add(Heat, rate, "K/s", fmt.Sprintf("The coil dissipates %s%s; without cooling its %.3g kg of copper heats by %.2g K per second (%.3g K per minute): check the temperature rise before running at full current.",
			withPrefix(f.Power, "W"), tt, f.CopperMass, rate, 60*rate))
	case f.CoilTemperature > 0:
		add(Heat, f.CoilTemperature, "°C", fmt.Sprintf("The coil is designed to run at up to %.0f °C: check the temperature rise (and any cooling-water flow) before running at full current.", f.CoilTemperature))
	default:
		add(Heat, 0, "", "Coils heat: check the temperature rise (and the cooling-water flow) before running at full current.")
	}
	if f.Water {
		extra := ""
		if f.WaterFlow > 0 {
			extra = fmt.Sprintf(" (%.3g l/min", f.WaterFlow*6e4)
			if f.WaterPressure > 0 {
				extra += fmt.Sprintf(" at %.3g bar", f.WaterPressure*1e-5)
			}
			extra += ")"
		}
		add(Water, f.WaterFlow, "m³/s", fmt.Sprintf("Interlock the supply on the cooling water%s: a flow switch on each circuit's return and a thermal switch on the coil must turn the current off when the water stops; pressure-test the circuits and hoses before running.", extra))
	}
	if f.Rated > 0 && f.Driven > f.Rated*(1+1e-9) {
		add(Overdrive, f.Driven, "A", fmt.Sprintf("This drives the coil to %s, %.2g times its rated %s: the coil heats %.2g times as fast and the stored energy and forces grow with it; run there only briefly and within the supply's and the coil's ratings.",
			withPrefix(f.Driven, "A"), f.Driven/f.Rated, withPrefix(f.Rated, "A"), math.Pow(f.Driven/f.Rated, 2)))
	}
	add(Codes, 0, "", "Follow local electrical codes and licensed practice for anything built; these figures are design estimates, not a safety assessment.")
	return out
}

// atCurrent says " at 12.3 A" or nothing.
func atCurrent(i float64) string {
	if i == 0 {
		return ""
	}
	return " at " + withPrefix(math.Abs(i), "A")
}

// massText writes a mass in kg or t.
func massText(kg float64) string {
	if kg >= 1000 {
		return fmt.Sprintf("%.3g t", kg/1000)
	}
	return fmt.Sprintf("%.3g kg", kg)
}

// withPrefix writes v with an SI prefix (m, none, k, M) and 3 figures.
func withPrefix(v float64, unit string) string {
	a := math.Abs(v)
	switch {
	case a >= 1e6:
		return fmt.Sprintf("%.3g M%s", v/1e6, unit)
	case a >= 1e3:
		return fmt.Sprintf("%.3g k%s", v/1e3, unit)
	case a >= 1 || a == 0:
		return fmt.Sprintf("%.3g %s", v, unit)
	}
	return fmt.Sprintf("%.3g m%s", v*1e3, unit)
}
