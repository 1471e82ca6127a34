package coil

import (
	"encoding/csv"
	"fmt"
	"io"
	"strconv"
	"text/tabwriter"
)

// WriteTable writes opts as an aligned text table for a terminal, in
// engineering units (mm, A/mm², kg), one line per winding, followed by
// nothing else: print Cautions() beside it.
func WriteTable(w io.Writer, opts []Option) error {
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "wire\tover mm\tturns\tI A\tJ A/mm²\tR Ω\tV V\tP W\tCu kg\tfill\tlimits\t")
	for i := range opts {
		o := &opts[i]
		ow, _ := o.Wire.Envelope()
		fmt.Fprintf(tw, "%s\t%.3f\t%d\t%.3g\t%.2f\t%.4g\t%.4g\t%.4g\t%.3g\t%.3f\t%s\t\n",
			o.Wire.Name, ow*1e3, o.Turns, o.Current, o.CurrentDensity*1e-6,
			o.Resistance, o.Voltage, o.Power, o.Mass, o.CopperFill, o.Flags)
	}
	return tw.Flush()
}

// csvHeader names the CSV columns with their units.
var csvHeader = []string{
	"wire", "shape", "conductor_mm2", "overall_width_mm", "overall_height_mm",
	"turns", "max_turns", "current_A", "current_density_A_per_mm2",
	"resistance_ohm", "voltage_V", "power_W", "copper_mass_kg", "conductor_length_m",
	"copper_fill", "cooling_power_W", "water_flow_l_per_min", "water_speed_m_per_s", "reynolds", "water_pressure_bar",
	"water_circuits", "water_rise_K", "hottest_conductor_C", "surface_flux_W_per_m2", "limits",
}

// WriteCSV writes opts as CSV (RFC 4180) with a header row naming every
// column and its unit. SI values are written exactly (shortest form that
// reads back to the same float64); values scaled to mm, mm², A/mm² or
// l/min carry 12 significant figures.
func WriteCSV(w io.Writer, opts []Option) error {
	cw := csv.NewWriter(w)
	if err := cw.Write(csvHeader); err != nil {
		return err
	}
	// g is exact (shortest round-trip form); u is for values scaled to
	// engineering units, 12 figures, so 3.275e-3 m prints as 3.275 mm.
	g := func(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }
	u := func(v, scale float64) string { return strconv.FormatFloat(v*scale, 'g', 12, 64) }
	rec := make([]string, len(csvHeader))
	for i := range opts {
		o := &opts[i]
		ow, oh := o.Wire.Envelope()
		rec = append(rec[:0],
			o.Wire.Name, o.Wire.Shape.String(), u(o.Wire.Area(), 1e6), u(ow, 1e3), u(oh, 1e3),
			strconv.Itoa(o.Turns), strconv.Itoa(o.MaxTurns), g(o.Current), u(o.CurrentDensity, 1e-6),
			g(o.Resistance), g(o.Voltage), g(o.Power), g(o.Mass), g(o.Length),
			g(o.CopperFill), g(o.CoolingPower), u(o.WaterFlow, 6e4), g(o.WaterSpeed),
			g(o.Reynolds), u(o.WaterPressure, 1e-5),
			strconv.Itoa(o.WaterCircuits), g(o.WaterRise), g(o.HotSpot), g(o.SurfaceFlux), o.Flags.String())
		if err := cw.Write(rec); err != nil {
			return err
		}
	}
	cw.Flush()
	return cw.Error()
}
