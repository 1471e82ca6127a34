package design

import (
	"math"

	"polegap/post/workflow/caution"
)

// CautionFacts returns what a solved design knows for its cautions: the
// stored energy, the current and apparent inductance of the coil with
// the largest ampere-turns, and the largest force on a part (the poles'
// attraction when computed), by its Maxwell stress.
func CautionFacts(d *Design) caution.Facts {
	var f caution.Facts
	if d == nil {
		return f
	}
	f.Energy = d.Energy.Energy
	best := -1.0
	for _, c := range d.Coils {
		if a := math.Abs(c.AmpereTurns); a > best {
			best, f.Current, f.Inductance = a, c.Current, c.Apparent
		}
	}
	for _, fr := range d.Forces {
		if fr.Error != "" {
			continue
		}
		f.Force = math.Max(f.Force, math.Hypot(fr.Stress[0], fr.Stress[1]))
	}
	return f
}
