package coil

import (
	"fmt"
	"io"
	"text/tabwriter"
)

// Defaults returns s with every zero field replaced by its documented
// default (the values Options works with).
func (s Spec) Defaults() Spec { return s.withDefaults() }

// Limits past which a winding is not worth showing to a designer at all
// (Absurd): a judgement, stated so that the hidden rows can be explained.
const (
	// AbsurdVoltage is the top of the low-voltage range for direct
	// current, 1500 V (EU Low Voltage Directive 2014/35/EU, art. 1:
	// 75-1500 V d.c.): a magnet coil above it needs high-voltage
	// practice throughout.
	AbsurdVoltage = 1500.0 // V
	// AbsurdDensityFactor: a current density this many times the
	// cooling's limit cannot be made to work by adjusting the cooling.
	AbsurdDensityFactor = 3.0
	// AbsurdPressureFactor: a water pressure drop this many times the
	// supply's cannot be made to work by adding circuits.
	AbsurdPressureFactor = 10.0
)

// Absurd says why winding o of spec s is too far from a buildable coil
// to list on a terminal ("" when it is worth listing): a voltage above
// AbsurdVoltage, a current density above AbsurdDensityFactor times the
// limit, or a water pressure drop above AbsurdPressureFactor times the
// limit. CSV and JSON outputs keep every winding.
func Absurd(s Spec, o *Option) string {
	s = s.withDefaults()
	switch {
	case o.Voltage > AbsurdVoltage:
		return fmt.Sprintf("need more than %.0f V (the top of the low-voltage range for d.c.)", AbsurdVoltage)
	case o.CurrentDensity > AbsurdDensityFactor*s.MaxCurrentDensity:
		return fmt.Sprintf("run at more than %g times the current-density limit", AbsurdDensityFactor)
	case s.MaxWaterPressure > 0 && o.WaterPressure > AbsurdPressureFactor*s.MaxWaterPressure:
		return fmt.Sprintf("need more than %g times the water pressure limit", AbsurdPressureFactor)
	}
	return ""
}

// Hidden counts, per reason (in order of first appearance), the windings
// of opts that Absurd leaves out.
type Hidden struct {
	Reasons []string
	Counts  []int
}

// Total returns the number of hidden windings.
func (h Hidden) Total() int {
	n := 0
	for _, c := range h.Counts {
		n += c
	}
	return n
}

// WriteReviewTable writes the windings of opts a designer acts on, as an
// aligned text table in engineering units: turns, current, current
// density, voltage and power, and by the cooling either the surface heat
// flux (air) or the water circuits, flow, bore speed, Reynolds number,
// pressure drop, water rise and hottest conductor (water). The winding
// at index best (-1: none) is marked "*". Windings that Absurd rejects
// are left out and counted in the returned Hidden.
func WriteReviewTable(w io.Writer, s Spec, opts []Option, best int) (Hidden, error) {
	var hid Hidden
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	water := s.Cooling == Water
	if water {
		fmt.Fprintln(tw, "\twire\tturns\tI A\tJ A/mm²\tV V\tP W\tcircuits\tl/min\tm/s\tRe\tΔp bar\tΔT K\thot °C\tlimits\t")
	} else {
		fmt.Fprintln(tw, "\twire\tturns\tI A\tJ A/mm²\tV V\tP W\tW/m²\tCu kg\tfill\tlimits\t")
	}
	for i := range opts {
		o := &opts[i]
		if why := Absurd(s, o); why != "" {
			k := 0
			for k < len(hid.Reasons) && hid.Reasons[k] != why {
				k++
			}
			if k == len(hid.Reasons) {
				hid.Reasons, hid.Counts = append(hid.Reasons, why), append(hid.Counts, 0)
			}
			hid.Counts[k]++
			continue
		}
		mark := ""
		if i == best {
			mark = "*"
		}
		fmt.Fprintf(tw, "%s\t%s\t%d\t%.4g\t%.2f\t%.4g\t%.4g\t", mark, o.Wire.Name, o.Turns, o.Current, o.CurrentDensity*1e-6, o.Voltage, o.Power)
		switch {
		case water && o.WaterCircuits > 0:
			fmt.Fprintf(tw, "%d\t%.3g\t%.2f\t%.0f\t%.3g\t%.0f\t%.0f\t", o.WaterCircuits, o.WaterFlow*6e4, o.WaterSpeed, o.Reynolds, o.WaterPressure*1e-5, o.WaterRise, o.HotSpot)
		case water:
			fmt.Fprintf(tw, "-\t%.3g\t-\t-\t-\t%.0f\t-\t", o.WaterFlow*6e4, o.WaterRise)
		default:
			fmt.Fprintf(tw, "%.0f\t%.3g\t%.3f\t", o.SurfaceFlux, o.Mass, o.CopperFill)
		}
		fmt.Fprintf(tw, "%s\t\n", o.Flags)
	}
	return hid, tw.Flush()
}

// LimitLines states, one line each, the limits the windings of s are
// flagged against and where each comes from, for printing beside the
// table.
func LimitLines(s Spec) []string {
	d := s.withDefaults()
	var out []string
	src := "common practice for " + d.Cooling.String() + " cooling"
	if s.MaxCurrentDensity != 0 {
		src = "given"
	}
	out = append(out, fmt.Sprintf("current density ≤ %.3g A/mm² (%s; still air %.3g, fan %.3g, water %.3g)",
		d.MaxCurrentDensity*1e-6, src, JMaxAirNatural*1e-6, JMaxAirForced*1e-6, JMaxWater*1e-6))
	rise := d.Temperature - d.Ambient
	switch d.Cooling {
	case AirNatural, AirForced:
		h := HAirNatural
		if d.Cooling == AirForced {
			h = HAirForced
		}
		out = append(out, fmt.Sprintf("surface heat flux ≤ %.0f W/m² = %.0f W/(m²·K) × %.0f K rise (%.0f °C coil, %.0f °C air) over %.3g m² (common practice)",
			h*rise, h, rise, d.Temperature, d.Ambient, d.CoolingSurface))
	case Water:
		p := "no pressure limit"
		if d.MaxWaterPressure > 0 {
			p = fmt.Sprintf("Δp ≤ %.3g bar per circuit", d.MaxWaterPressure*1e-5)
		}
		v := "no speed limit"
		if d.MaxWaterSpeed > 0 {
			v = fmt.Sprintf("bore speed ≤ %.3g m/s", d.MaxWaterSpeed)
		}
		c := fmt.Sprintf("%d circuit(s)", d.WaterCircuits)
		if d.WaterCircuits == 0 {
			c = fmt.Sprintf("circuits chosen per winding, 1 to %d", s.MaxWaterCircuits)
		}
		out = append(out,
			fmt.Sprintf("water %s, %s (common practice), %s", p, v, c),
			fmt.Sprintf("water ΔT %.3g K from a %.0f °C inlet; hottest conductor (outlet plus film, Gnielinski 1976) ≤ %.0f °C; Δp by Darcy–Weisbach, Blasius (1913) or 64/Re friction, straight bore only",
				d.WaterRise, d.Ambient, d.Temperature))
	}
	if d.SupplyVoltage > 0 || d.SupplyCurrent > 0 {
		out = append(out, fmt.Sprintf("supply ≤ %s, ≤ %s (given)", orNone(d.SupplyVoltage, "V"), orNone(d.SupplyCurrent, "A")))
	}
	return out
}

func orNone(v float64, unit string) string {
	if v == 0 {
		return "any " + unit
	}
	return fmt.Sprintf("%.4g %s", v, unit)
}
