package report

import (
	"fmt"
	"io"
	"strings"

	"polegap/post/workflow/coil"
)

// WriteSizing writes the sizing summary, the limits used, the table of
// windings (absurd ones left out and counted; the recommended one marked
// "*"), the verdict and the cautions.
func WriteSizing(w io.Writer, s *coil.Sizing) error {
	ew := &errWriter{w: w}
	ew.printf("target      %.4g T at probe %s of %s\n", s.Target, s.Probe, s.Model)
	ew.printf("needs       %.0f ampere-turns per winding (%d winding(s) in series), found in %d nonlinear solve%s\n", s.AmpereTurns, s.Windings, s.Solves, plural(s.Solves))
	ew.printf("            reached %.5f T; magnet efficiency %.1f %%; largest element |B| in the iron %.2f T", s.Field, 100*s.Efficiency, s.MaxIronB)
	if s.IronLimit > 0 {
		verdict := "below"
		if s.MaxIronB > s.IronLimit {
			verdict = "ABOVE"
		}
		ew.printf(",\n            %s the limit %.2f T where the steel's μr falls to 100 (common practice; the element value is mesh-dependent at corners)", verdict, s.IronLimit)
	}
	ew.printf("\n            with the model's turns that is %.4g A\n", s.Current)
	if s.AmpereTurnsEstimate > 0 {
		ew.printf("            ampere-turns ± %.2g (%.1e relative; change from the coarser mesh)\n", s.AmpereTurnsEstimate, s.AmpereTurnsEstimate/s.AmpereTurns)
	}
	if s.Accuracy != "" {
		ew.printf("accuracy    %s\n", s.Accuracy)
	}
	ew.printf("window      radial build %.1f mm, height %.1f mm, mean turn %.0f mm; fill %.2f, copper at %.0f °C, %s cooling\n",
		s.Window.Width, s.Window.Height, s.Window.MeanTurn, s.Spec.FillFactor, s.Spec.Temperature, s.Spec.Cooling)
	for i, l := range coil.LimitLines(s.Spec) {
		head := ""
		if i == 0 {
			head = "limits"
		}
		ew.printf("%-12s%s\n", head, l)
	}
	ew.printf("\n")
	if ew.err != nil {
		return ew.err
	}
	hid, err := coil.WriteReviewTable(w, s.Spec, s.Options, s.BestIndex)
	if err != nil {
		return err
	}
	if n := hid.Total(); n > 0 {
		var why []string
		for i, r := range hid.Reasons {
			why = append(why, fmt.Sprintf("%d %s", hid.Counts[i], r))
		}
		ew.printf("\n%d of %d windings not listed (CSV and JSON keep them): %s\n", n, len(s.Options), strings.Join(why, "; "))
	}
	ok := 0
	for i := range s.Options {
		if s.Options[i].OK() {
			ok++
		}
	}
	if s.Best != nil {
		b := s.Best
		ew.printf("\n* recommended: %s, the least power (I²R) of the %d winding(s) that meet every limit: %d turns at %.4g A (%.2f A/mm²), %.4g V, %.4g W, %.3g kg of copper per winding",
			b.Wire.Name, ok, b.Turns, b.Current, b.CurrentDensity*1e-6, b.Voltage, b.Power, b.Mass)
		if b.WaterCircuits > 0 {
			ew.printf("; %d water circuit(s), %.3g l/min, %.3g bar", b.WaterCircuits, b.WaterFlow*6e4, b.WaterPressure*1e-5)
		}
		ew.printf("\n")
		if s.Windings > 1 {
			ew.printf("the %d windings in series need %.4g V and %.4g W together\n", s.Windings, float64(s.Windings)*b.Voltage, float64(s.Windings)*b.Power)
		}
	} else {
		ew.printf("\nno winding meets every limit: %s\n", s.NoneReason)
	}
	if s.Supply != nil {
		writeSupply(ew, s.Supply, s.Windings, s.Planar)
	}
	writeCautionList(ew, s.Cautions)
	return ew.err
}

func plural(n int) string {
	if n == 1 {
		return ""
	}
	return "s"
}

// WriteSizingSummary writes the sizing result in a few lines (no table) with
// the cautions.
func WriteSizingSummary(w io.Writer, s *coil.Sizing) error {
	ew := &errWriter{w: w}
	ew.printf("target %.4g T at %s: %.0f ampere-turns per winding (%d in series), %d nonlinear solve%s, efficiency %.1f %%\n",
		s.Target, s.Probe, s.AmpereTurns, s.Windings, s.Solves, plural(s.Solves), 100*s.Efficiency)
	if b := s.Best; b != nil {
		ew.printf("coil (%s cooling): %s, %d turns at %.4g A (%.2f A/mm²), %.4g V, %.4g W, %.3g kg of copper per winding\n",
			s.Spec.Cooling, b.Wire.Name, b.Turns, b.Current, b.CurrentDensity*1e-6, b.Voltage, b.Power, b.Mass)
	} else {
		ew.printf("no winding meets every limit: %s\n", s.NoneReason)
	}
	writeCautionList(ew, s.Cautions)
	return ew.err
}
