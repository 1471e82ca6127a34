package report

import (
	"strings"

	"polegap/post/workflow/supply"
)

// writeSupply writes what the supply must do for a sized coil and its
// switch-off.
func writeSupply(ew *errWriter, s *supply.Supply, windings int, planar bool) {
	ew.printf("\nsupply      ramp 0 → %.4g A in %.3g s (%.3g A/s): peak %.4g V at %.4g A (V = L_inc dI/dt + I R); steady %.4g V (I R, R = %.4g Ω",
		s.Current, s.RampTime, s.RampRate, s.PeakVoltage, s.PeakAt, s.SteadyV, s.Resistance)
	if windings > 1 {
		ew.printf(", %d windings in series", windings)
	}
	ew.printf(")\n")
	ew.printf("            L apparent %.4g H, incremental %.4g H at %.4g A; L/R time constant %.3g s; stored energy %.4g J (∫ I dΨ",
		s.Apparent, s.Incremental, s.Current, s.TimeConstant, s.Energy)
	if s.FieldEnergy > 0 {
		ew.printf("; the field solution's own %.4g J", s.FieldEnergy)
	}
	ew.printf(")\n")
	var prof []string
	for _, p := range s.Profile {
		prof = append(prof, ew.sprintf("%.3g s %.4g V", p.Time, p.Voltage))
	}
	ew.printf("            ramp profile: %s\n", strings.Join(prof, ", "))
	d := s.Discharge
	if d.Resistance > 0 {
		ew.printf("switch-off  discharge resistor %.4g Ω: peak %.4g V across the coil (I R_d); current to 1 %% in %.3g s (τ = %.3g s); the resistor absorbs %.4g J (%.0f %% of the stored energy)\n",
			d.Resistance, d.PeakVoltage, d.Time, d.TimeConstant, d.Energy, 100*d.EnergyShare)
	} else {
		ew.printf("switch-off  free-wheeling diode (%.2g V drop): current to 1 %% in %.3g s (τ = %.3g s); the coil and diode absorb all %.4g J\n",
			d.PeakVoltage, d.Time, d.TimeConstant, d.Energy)
	}
	if planar {
		ew.printf("            (2D model: the end turns' inductance is not included, so L, the ramp voltage and the energy are lower bounds)\n")
	}
}
