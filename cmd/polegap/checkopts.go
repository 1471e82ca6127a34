package main

import (
	"flag"
	"fmt"
	"math"
	"strings"

	"polegap/post/workflow/check"
)

// tolSet reports whether --tolerance was given on the command line.
func tolSet(fs *flag.FlagSet) bool {
	set := false
	fs.Visit(func(f *flag.Flag) {
		if f.Name == "tolerance" {
			set = true
		}
	})
	return set
}

// checkOptions refuses check requirements that mean nothing: a
// uniformity tolerance without its half-width or the reverse, values
// that are negative, not finite or (tolerances) not below 1.
func checkOptions(o check.CheckOptions, tolGiven, halfGiven bool) error {
	bad := func(v float64) bool { return math.IsNaN(v) || math.IsInf(v, 0) }
	switch {
	case tolGiven && (bad(o.Tolerance) || o.Tolerance <= 0 || o.Tolerance >= 1):
		return usagef("--tolerance %g: give a relative tolerance in (0, 1), e.g. 5e-4", o.Tolerance)
	case halfGiven && (bad(o.HalfWidth) || o.HalfWidth <= 0):
		return usagef("--half-width: give a length above zero, e.g. 30mm")
	case tolGiven && !halfGiven:
		return usagef("--tolerance needs --half-width: the half-width over which the field must stay within it (solve prints the half-widths at 1e-3 and 1e-4)")
	case halfGiven && !tolGiven:
		return usagef("--half-width needs --tolerance: the relative tolerance the field must stay within")
	case bad(o.TargetTolerance) || o.TargetTolerance < 0 || o.TargetTolerance >= 1:
		return usagef("--target-tolerance %g: give a relative tolerance in [0, 1)", o.TargetTolerance)
	case bad(o.SaturationLimit) || o.SaturationLimit < 0:
		return usagef("--saturation-limit: give a field above zero, e.g. 1.8T")
	}
	return nil
}

// uncomputed returns an error for a requested uniformity check that the
// model cannot answer (no line probe through the gap centre).
func uncomputed(c *check.Check) error {
	for _, it := range c.Items {
		if strings.HasPrefix(it.What, "good-field half-width") && it.Value == 0 && !it.Pass && it.Note != "" {
			return fmt.Errorf("cannot check the good-field half-width: %s", it.Note)
		}
	}
	return nil
}
