package design

import (
	"fmt"
	"math"

	"polegap/internal/num"
	"polegap/post/quantity/circuit"
	"polegap/post/study"
)

// Plausibility limits. A result beyond one is reported with a warning and
// its reason; it is not refused, since the model may mean it.
const (
	// FieldWarn is the |B| (T) above which a field is implausible for an
	// iron-core electromagnet: its iron saturates near 2 T, and the
	// strongest steady laboratory magnets reach about 45 T (from memory).
	FieldWarn = 30.0
	// FieldStop is the |B| (T) above which adaptive refinement stops: a
	// field this far beyond any magnet means a wrong excitation or unit,
	// and refining it further only spends time.
	FieldStop = 1000.0
	// IronBeyondTable is how far (T) the |B| of iron (the largest mean
	// over a disc, as the saturation report gives) may pass the last point
	// of its B-H table before a warning: past it the curve goes on with
	// slope μ0 and the iron is as good as air.
	IronBeyondTable = 1.0
	// CurrentDensityWarn is the coil current density (A/m²) beyond any
	// cooling: air-cooled windings run at 1 to 3 A/mm², forced air to
	// about 5 and water-cooled hollow conductors to about 10 to 30 A/mm²
	// (common practice); 50 A/mm² is beyond all of them.
	CurrentDensityWarn = 50e6
	// EfficiencyWarn is the magnet efficiency B·g/(μ0·NI) above which a
	// model without permanent magnets gives more gap field than the ideal
	// magnetic circuit allows (Ampère's law along a path through the gap:
	// B·g/μ0 ≤ NI when the iron's H is small; the 1 % allows for the
	// error of a converged field).
	EfficiencyWarn = 1.01
)

// Plausibility returns a warning, with its reason, for each result of d
// (solved as s) that no iron-core electromagnet gives: magnet efficiency
// above 1 without permanent magnets (usually a wrong gap key), fields
// above FieldWarn, iron far past the end of its B-H table, coil current
// densities beyond any cooling.
func Plausibility(s *study.Result, d *Design) []string {
	m := s.Model
	var w []string
	units := func(v float64) string { return fmt.Sprintf("%.3g %s", v/m.Scale, m.Units) }
	// Efficiency.
	var ni float64
	for _, c := range d.Coils {
		ni += math.Abs(c.AmpereTurns)
	}
	magnets := false
	for i := range m.Materials {
		magnets = magnets || m.Materials[i].Magnet != nil
	}
	if g := d.Gap; g != nil && m.Gap > 0 && ni > 0 && !magnets {
		eff := g.CentreB * m.Gap / (num.Mu0 * ni)
		if eff > EfficiencyWarn {
			w = append(w, fmt.Sprintf("magnet efficiency B·g/(μ0·NI) is %.3g, above 1: %.4g T at %s across the stated gap of %s from %.4g ampere-turns is more field than the ideal magnetic circuit allows without permanent magnets; the gap key is usually wrong: this field and excitation fit a gap of at most %s",
				eff, g.CentreB, g.Probe, units(m.Gap), ni, units(num.Mu0*ni/g.CentreB)))
		}
	}
	// Largest field anywhere in the model (elements of the exterior disk
	// of an open boundary excluded).
	if bmax, at := maxField(s); bmax > FieldWarn {
		w = append(w, fmt.Sprintf("|B| reaches %.4g T near (%s, %s), above %g T: iron saturates near 2 T and no steady magnet passes about 45 T; check the turns, the current and the model's units", bmax, units(at[0]), units(at[1]), FieldWarn))
	}
	// Iron past its table.
	for _, sr := range d.Saturation {
		r, ok := m.Region(sr.Region)
		if !ok {
			continue
		}
		mat, _, err := study.Material(m, r)
		if err != nil {
			continue
		}
		tb, ok := mat.(interface{ Table() (h, b []float64) })
		if !ok {
			continue
		}
		h, b := tb.Table()
		if len(b) == 0 {
			continue
		}
		if last := b[len(b)-1]; sr.Peak > last+IronBeyondTable {
			w = append(w, fmt.Sprintf("iron region %s reaches %.4g T (largest mean over a disc), far beyond the last point of its B-H table (%.4g T at %.4g A/m): past it the curve goes on with slope μ0 and the iron works as air, so the result rests on an extrapolation; check the excitation, or extend the table", sr.Region, sr.Peak, last, h[len(h)-1]))
		}
	}
	// Current density.
	for ci, c := range circuit.CoilsAt(m, s.Params) {
		mc := &m.Coils[ci]
		for _, sd := range mc.Sides {
			r, ok := m.Region(sd.Region)
			if !ok {
				continue
			}
			a := r.Area()
			if !(a > 0) {
				continue
			}
			if j := math.Abs(c.Current*c.Turns) / a; j > CurrentDensityWarn {
				w = append(w, fmt.Sprintf("coil %s: the current density in %s is %.3g A/mm², beyond any cooling (air-cooled windings run at 1 to 3 A/mm², water-cooled hollow conductors at 10 to 30); check the turns, the current and the side's area", c.Name, sd.Region, j*1e-6))
				break
			}
		}
	}
	return w
}

// maxField returns the largest element |B| (T) of s outside the exterior
// disk of an open boundary, and where (the element's first corner).
func maxField(s *study.Result) (float64, [2]float64) {
	msh := s.Disc.Mesh
	kt := study.KelvinTag(s.Model)
	b := s.ElementB()
	var best float64
	var at [2]float64
	for t, v := range b {
		if t < len(msh.Region) && msh.Region[t] == kt {
			continue
		}
		if h := math.Hypot(v[0], v[1]); h > best {
			best = h
			p := msh.Tri[3*t]
			at = [2]float64{msh.X[p], msh.Y[p]}
		}
	}
	return best, at
}

// Implausible returns why refining s further is pointless (a field above
// FieldStop somewhere), or "" when nothing is.
func Implausible(s *study.Result) string {
	if bmax, _ := maxField(s); bmax > FieldStop {
		return fmt.Sprintf("|B| reaches %.3g T, above %g T, where no magnet goes: the excitation or the units are almost surely wrong, and refining the mesh would only spend time", bmax, FieldStop)
	}
	return ""
}
