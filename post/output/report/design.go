package report

import (
	"fmt"
	"strings"

	"polegap/post/workflow/design"
)

// writeDesign writes the design quantities of the summary.
func writeDesign(ew *errWriter, d *design.Design) {
	if g := d.Gap; g != nil {
		ew.printf("\ngap        |B| %.5f T at %s", g.CentreB, g.Probe)
		if g.PoleFaceAvg != 0 {
			ew.printf("; mean By across the %.1f mm pole face %.5f T", g.PoleWidth*1e3, g.PoleFaceAvg)
		}
		ew.printf("\n")
	}
	if u := d.Uniformity; u != nil {
		if u.Box != "" {
			ew.printf("uniformity max |ΔB/B0| %.2e over box %s\n", u.BoxMaxDev, u.Box)
		}
		for _, h := range u.HalfWidths {
			bound := ""
			if !h.Bounded {
				bound = " (at least: the line ends first)"
			}
			ew.printf("           |ΔB/B0| < %.0e within ±%.2f mm of the centre along %s%s\n", h.Tol, h.HalfWidth*1e3, u.Line, bound)
		}
	}
	if f := d.Fringing; f != nil {
		ew.printf("fringing   factor %.3f, effective width %.1f mm (k = %.3f per edge), effective gap %.2f mm\n",
			f.Factor, f.WidthEff*1e3, f.KPerEdge, f.GapEff*1e3)
	}
	for _, c := range d.Coils {
		if c.Current != 0 {
			ew.printf("coil %-5s %.5g A × %.5g turns = %.5g A-t; flux linkage %.5g Wb; L apparent %.5g H", c.Name, c.Current, c.AmpereTurns/c.Current, c.AmpereTurns, c.Linkage, c.Apparent)
		} else {
			ew.printf("coil %-5s 0 A, no ampere-turns; flux linkage %.5g Wb; L apparent %.5g H", c.Name, c.Linkage, c.Apparent)
		}
		if c.Incremental != 0 {
			ew.printf(", incremental %.5g H", c.Incremental)
		}
		ew.printf("\n")
	}
	ew.printf("energy     stored %.5g J, co-energy %.5g J\n", d.Energy.Energy, d.Energy.CoEnergy)
	if b := d.Energy.Bounds; b != nil {
		what := "co-energy"
		if b.InductanceH != nil || b.Guaranteed {
			what = "energy"
		}
		ew.printf("           %s between %.6g and %.6g J (vector-potential and complementary solutions)", what, b.Lower, b.Upper)
		if b.InductanceH != nil {
			ew.printf("; coil %s: L between %.6g and %.6g H", b.Coil, b.InductanceH[0], b.InductanceH[1])
		}
		if !b.Guaranteed {
			ew.printf("\n           not a guaranteed bracket: %s", b.Note)
		}
		ew.printf("\n")
	}
	if len(d.Saturation) > 0 {
		ew.printf("\n%-16s %8s %8s %12s %10s %12s\n", "iron region", "knee T", "mean T", "above knee", "peak T", "max raw T")
		for _, s := range d.Saturation {
			flag := ""
			if s.MaxAtCorner {
				flag = " (at a corner)"
			}
			if s.Limit > 0 && !s.Pass {
				flag += "  OVER LIMIT"
			}
			ew.printf("%-16s %8.2f %8.3f %11.1f%% %10.3f %12.3f%s\n", s.Region, s.Knee, s.Mean, 100*s.AboveKnee, s.Peak, s.Max, flag)
		}
		ew.printf("peak T: largest mean |B| over a disc of radius %.3g mm in the region; limits apply to it\n"+
			"max raw T: largest element value, mesh-dependent (grows without bound at corners); never checked\n", d.Saturation[0].Radius*1e3)
		ew.printf("beyond the last point of the B-H table (on the curve's extrapolation):")
		var labels []string
		regions := map[string][]string{}
		for i, s := range d.Saturation {
			sep := ","
			if i == 0 {
				sep = ""
			}
			ew.printf("%s %s %.1f%%", sep, s.Region, 100*s.BeyondTable)
			l := curveLabel(s)
			if regions[l] == nil {
				labels = append(labels, l)
			}
			regions[l] = append(regions[l], s.Region)
		}
		ew.printf("\n")
		for _, l := range labels {
			ew.printf("B-H curve of %s: %s\n", strings.Join(regions[l], ", "), l)
		}
	}
	for _, f := range d.Forces {
		name := f.Part
		if f.Automatic {
			name = fmt.Sprintf("%s (%s)", f.Part, strings.Join(f.Regions, ", "))
		}
		if f.Error != "" {
			ew.printf("force on %s: not computed: %s\n", name, f.Error)
			continue
		}
		ew.printf("force on %-8s Maxwell stress (%.5g, %.5g) N", name, f.Stress[0], f.Stress[1])
		if f.VirtualWork != nil {
			ew.printf("; virtual work (%.5g, %.5g) N", f.VirtualWork[0], f.VirtualWork[1])
		}
		if f.ErrorEstimate != nil {
			ew.printf("; error estimate ±%.2g N", *f.ErrorEstimate)
		}
		ew.printf("\n")
	}
	if len(d.Forces) > 0 {
		ew.printf("caution:   iron poles attract tools and steel objects with large forces; design frames and\n" +
			"           fixings to local codes and licensed engineering practice, not to these estimates alone\n")
	}
	for _, n := range d.Notes {
		ew.printf("note: %s\n", n)
	}
	for _, n := range d.Warnings {
		ew.printf("warning: %s\n", n)
	}
}

// curveLabel names a region's curve and its source for the reports, and
// says so when the curve is typical values from memory.
func curveLabel(s design.SatReport) string {
	if s.Curve == "" {
		return s.Source
	}
	if s.FromMemory {
		return s.Curve + ": FROM MEMORY (typical values, not a cited source)"
	}
	return s.Curve + ": " + s.Source
}
