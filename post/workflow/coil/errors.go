package coil

import (
	"fmt"
	"slices"
	"strings"
)

// Panic messages for programmer misuse.
const (
	errBadTemperature = "coil: temperature below the zero-resistance point of the linear law, or not finite"
	errBadConductor   = "coil: conductor length must be finite and >= 0, area finite and > 0"
	errBadAWG         = "coil: AWG number outside 0000 (-3) .. 56"
	errBadGrade       = "coil: unknown insulation Grade"
	errBadSeries      = "coil: unknown Series"
	errBadCriterion   = "coil: unknown Criterion"
	errBadMeanTurn    = "coil: mean-turn dimensions must be finite and >= 0, build > 0"
)

// SpecError reports a Spec field with a value that cannot describe a coil.
// Field is the Go field path ("Window.Width"), so a caller that read the
// spec from a file can map it back to a position.
type SpecError struct {
	Field  string
	Value  float64
	Reason string
}

func (e *SpecError) Error() string {
	return fmt.Sprintf("coil: Spec.%s = %g: %s", e.Field, e.Value, e.Reason)
}

// WireError reports a wire whose dimensions are not physical (an overall
// size smaller than the conductor, a bore larger than the bar, ...).
type WireError struct {
	Name   string
	Reason string
}

func (e *WireError) Error() string {
	return fmt.Sprintf("coil: wire %q: %s", e.Name, e.Reason)
}

// NoneError explains why no winding meets every limit: how many candidate
// windings were found and how many break each limit (a winding may break
// several).
type NoneError struct {
	Windings     int // windings that fit the window
	OverVoltage  int // above Spec.SupplyVoltage
	OverCurrent  int // above Spec.SupplyCurrent
	OverDensity  int // current density above the cooling's limit
	OverHeat     int // power above what the cooling removes
	OverPressure int // water pressure drop above the supply's
	OverSpeed    int // water speed in the bore above the limit
	// OverTemperature counts windings whose hottest conductor (water
	// outlet plus the film drop) is above the design temperature.
	OverTemperature int
}

func (e *NoneError) Error() string {
	if e.Windings == 0 {
		return "coil: no wire fits the requested turns in the coil window; enlarge the window, lower the turns or add finer wires"
	}
	var parts, fixes []string
	add := func(n int, what string, fix ...string) {
		if n == 0 {
			return
		}
		parts = append(parts, fmt.Sprintf("%d %s", n, what))
		for _, f := range fix {
			if !slices.Contains(fixes, f) {
				fixes = append(fixes, f)
			}
		}
	}
	add(e.OverVoltage, "exceed the supply voltage", "a higher supply voltage")
	add(e.OverCurrent, "exceed the supply current", "a higher supply current")
	add(e.OverDensity, "exceed the current-density limit", "stronger cooling")
	add(e.OverHeat, "dissipate more than the cooling removes", "stronger cooling", "a larger window")
	add(e.OverPressure, "need more water pressure than the supply gives", "more parallel water circuits")
	add(e.OverSpeed, "need water faster than the bore's speed limit", "more parallel water circuits")
	add(e.OverTemperature, "run hotter than the design temperature at the water outlet", "a larger water flow (a smaller water rise)", "a larger window")
	return fmt.Sprintf("coil: none of %d windings meets every limit: %s; consider %s",
		e.Windings, strings.Join(parts, ", "), strings.Join(fixes, ", or "))
}
