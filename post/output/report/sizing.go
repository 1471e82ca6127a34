package report

import (
	"io"

	"polegap/post/workflow/coil"
)

// WriteSizing writes the sizing summary, the table of windings and the
// cautions.
func WriteSizing(w io.Writer, s *coil.Sizing) error {
	ew := &errWriter{w: w}
	ew.printf("target      %.4g T at probe %s of %s\n", s.Target, s.Probe, s.Model)
	ew.printf("needs       %.0f ampere-turns per winding (%d winding(s) in series), found in %d nonlinear solves\n", s.AmpereTurns, s.Windings, s.Solves)
	ew.printf("            reached %.5f T; magnet efficiency %.1f %%; largest element |B| in the iron %.2f T\n", s.Field, 100*s.Efficiency, s.MaxIronB)
	ew.printf("            with the model's turns that is %.4g A\n", s.Current)
	if s.AmpereTurnsEstimate > 0 {
		ew.printf("            ampere-turns ± %.2g (%.1e relative; change from the coarser mesh)\n", s.AmpereTurnsEstimate, s.AmpereTurnsEstimate/s.AmpereTurns)
	}
	if s.Accuracy != "" {
		ew.printf("accuracy    %s\n", s.Accuracy)
	}
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

// WriteSizingSummary writes the sizing result in a few lines (no table) with
// the cautions.
func WriteSizingSummary(w io.Writer, s *coil.Sizing) error {
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
