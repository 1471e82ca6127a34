package report

import (
	"io"
	"polegap/post/workflow/check"
)

// WriteCheck prints the check as a table with PASS/FAIL per line.
func WriteCheck(w io.Writer, c *check.Check) error {
	ew := &errWriter{w: w}
	ew.printf("check of %s\n\n", c.Model)
	for _, it := range c.Items {
		verdict := "PASS"
		if !it.Pass {
			verdict = "FAIL"
		}
		val, lim := it.Value, it.Limit
		unit := it.Unit
		if unit == "m" {
			val, lim, unit = val*1e3, lim*1e3, "mm"
		}
		if it.Tolerance > 0 {
			ew.printf("%-4s  %-40s %9.4g %s (target %.4g %s within %.0e: at least %.5g %s)", verdict, it.What, val, unit, lim, unit, it.Tolerance, lim*(1-it.Tolerance), unit)
		} else {
			ew.printf("%-4s  %-40s %9.4g %s (limit %.4g %s)", verdict, it.What, val, unit, lim, unit)
		}
		if it.Note != "" {
			ew.printf("  [%s]", it.Note)
		}
		ew.printf("\n")
	}
	if f := c.Fringing; f != nil {
		ew.printf("info  fringing factor %.3f, effective width %.1f mm\n", f.Factor, f.WidthEff*1e3)
	}
	if a := c.Accuracy; a != nil {
		switch {
		case a.Target == 0:
			ew.printf("info  quick mode: one solve on the model's own mesh; the values are not converged\n")
		case a.Reached:
			ew.printf("info  values converged to %.0e relative (%d meshes)\n", a.Target, a.Rounds)
		default:
			ew.printf("info  values NOT converged to %.0e relative (refinement limit, %d meshes): a verdict near its limit is uncertain\n", a.Target, a.Rounds)
		}
	}
	for _, n := range c.Notes {
		ew.printf("note  %s\n", n)
	}
	if c.Pass {
		ew.printf("\nall checks pass\n")
	} else {
		ew.printf("\nsome checks FAIL\n")
	}
	writeCautionList(ew, c.Cautions)
	return ew.err
}
