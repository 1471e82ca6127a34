package check

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"polegap/materials"
	"polegap/models"
	"polegap/post/study"
	"polegap/post/workflow/caution"
	"polegap/post/workflow/design"
)

// DefaultMinMuR sets the default saturation limit of an iron region: the
// flux density at which its relative permeability has fallen to this
// value. Above it the iron starts to take a noticeable share of the
// ampere-turns (common practice; about 1.9 T for low-carbon steel).
const DefaultMinMuR = 100

// CheckOptions are the requirements a design is checked against.
type CheckOptions struct {
	// SaturationLimit (T) applies to every iron region; 0 means each
	// region's curve's flux density at μr = DefaultMinMuR.
	SaturationLimit float64
	// Tolerance and HalfWidth (m): the field must stay within Tolerance
	// of the centre value over ±HalfWidth along the mid-plane line probe.
	// Zero skips the check.
	Tolerance, HalfWidth float64
	// TargetTolerance (relative) is how far below the model's target
	// field the field at its probe may fall and still reach it; 0 means
	// DefaultTargetTolerance. Give the accuracy the numbers are
	// converged to: a verdict finer than that is noise.
	TargetTolerance float64
}

// DefaultTargetTolerance is the target's tolerance when none is given:
// the default accuracy of the converged numbers.
const DefaultTargetTolerance = 1e-3

// CheckItem is one requirement and how the design meets it.
type CheckItem struct {
	What  string  `json:"what"`
	Value float64 `json:"value"`
	Limit float64 `json:"limit"`
	Unit  string  `json:"unit"`
	Pass  bool    `json:"pass"`
	Note  string  `json:"note,omitempty"`
	// Tolerance (relative), when set, marks Limit as a target: the item
	// passes when Value ≥ Limit × (1 − Tolerance).
	Tolerance float64 `json:"tolerance,omitempty"`
}

// Check is the outcome of checking a solved design.
type Check struct {
	Model    string               `json:"model"`
	Items    []CheckItem          `json:"items"`
	Fringing *design.FringeReport `json:"fringing,omitempty"`
	Pass     bool                 `json:"pass"`
	// Notes qualify the verdicts (a curve of typical values from memory).
	Notes []string `json:"notes,omitempty"`
	// Accuracy says how converged the checked numbers are (nil: not
	// recorded).
	Accuracy *design.Accuracy `json:"accuracy,omitempty"`
	// Cautions are the safety cautions quantified from the design (each
	// encodes to JSON as its sentence).
	Cautions []caution.Caution `json:"cautions,omitempty"`
}

// NewCheck checks the design quantities of a solved study against the
// requirements: saturation of each iron region (its peak: the largest
// mean |B| over a disc of the report's radius, which converges as the mesh
// is refined; never the raw maximum, which grows without bound at
// corners), the target field at its probe, and the good-field half-width
// when asked.
func NewCheck(s *study.Result, d *design.Design, opt CheckOptions) *Check {
	c := &Check{Model: s.Model.Name, Fringing: d.Fringing, Pass: true, Cautions: caution.List(design.CautionFacts(d))}
	add := func(it CheckItem) {
		c.Items = append(c.Items, it)
		c.Pass = c.Pass && it.Pass
	}
	m := s.Model
	var memory []string
	memCurve := map[string]bool{}
	for _, sr := range d.Saturation {
		limit := opt.SaturationLimit
		note := "limit given"
		if limit == 0 {
			r, _ := m.Region(sr.Region)
			mat, _, _ := study.Material(m, r)
			if cv, ok := mat.(*materials.Curve); ok {
				limit = BAtMuR(cv, DefaultMinMuR)
				note = fmt.Sprintf("limit where μr falls to %d", DefaultMinMuR)
			}
		}
		note += fmt.Sprintf("; mean |B| over the worst disc of radius %.3g mm; raw maximum %.3f T mesh-dependent, not checked", sr.Radius*1e3, sr.Max)
		if sr.FromMemory {
			memory = append(memory, sr.Region)
			memCurve[sr.Curve] = true
		}
		for _, sf := range sr.GradeShortfalls {
			note += fmt.Sprintf("; WARNING: below grade %s: %s", sr.Grade, sf)
		}
		if sr.BeyondTable > 0 {
			note += fmt.Sprintf("; %.1f %% of the region beyond the curve's last table point (%.2f T), on its extrapolation", 100*sr.BeyondTable, sr.TableEnd)
		}
		add(CheckItem{What: "saturation of " + sr.Region, Value: sr.Peak, Limit: limit, Unit: "T", Pass: sr.Peak <= limit, Note: note})
	}
	if len(memory) > 0 {
		var curves []string
		for name := range memCurve {
			curves = append(curves, name)
		}
		sort.Strings(curves)
		c.Notes = append(c.Notes, fmt.Sprintf("the saturation verdicts of %s rest on %s: typical values from memory, not a cited source; confirm with the supplier's or a measured curve ('polegap materials' lists the sourced ones)",
			strings.Join(memory, ", "), strings.Join(curves, ", ")))
	}
	if m.Target != nil {
		for _, p := range s.Probes {
			if p.Name != m.Target.Probe {
				continue
			}
			v := p.Stats.Mean
			if p.Kind == "point" {
				v = p.Point.B()
			}
			tt := opt.TargetTolerance
			if tt == 0 {
				tt = DefaultTargetTolerance
			}
			add(CheckItem{What: "field at " + p.Name, Value: v, Limit: m.Target.Field, Unit: "T", Tolerance: tt, Pass: v >= m.Target.Field*(1-tt),
				Note: fmt.Sprintf("the model's target, reached at the model's currents within %.0e relative", tt)})
		}
	}
	if opt.Tolerance > 0 && opt.HalfWidth > 0 {
		it := CheckItem{What: fmt.Sprintf("good-field half-width at |ΔB/B0| < %s", tolText(opt.Tolerance)), Limit: opt.HalfWidth, Unit: "m"}
		if d.Uniformity == nil || d.Uniformity.Line == "" {
			it.Note = "no line probe through the gap centre to measure it on"
		} else {
			// Walk the requested tolerance on the stored profile.
			found := false
			for _, h := range d.Uniformity.HalfWidths {
				if math.Abs(h.Tol-opt.Tolerance) <= 1e-12*opt.Tolerance {
					it.Value, it.Pass, found = h.HalfWidth, h.HalfWidth >= opt.HalfWidth, true
					if !h.Bounded {
						it.Note = "at least this: the line probe ends before the field leaves the tolerance"
					}
				}
			}
			if !found {
				it.Note = "tolerance not computed: pass it to design.DesignOptions.Tolerances"
			}
		}
		add(it)
	}
	return c
}

// BAtMuR returns the flux density above the curve's steepest point at
// which its relative permeability falls to mur (bisection; the curve's μr
// decreases monotonically there towards 1).
func BAtMuR(c *materials.Curve, mur float64) float64 {
	// Start at the peak of μr, found on a coarse scan.
	lo, best := 0.0, 0.0
	for b := 0.05; b < 3; b += 0.05 {
		if v := c.MuR(b); v > best {
			best, lo = v, b
		}
	}
	if best <= mur {
		return lo
	}
	hi := lo
	for c.MuR(hi) > mur && hi < 10 {
		hi += 0.1
	}
	for i := 0; i < 60; i++ {
		mid := 0.5 * (lo + hi)
		if c.MuR(mid) > mur {
			lo = mid
		} else {
			hi = mid
		}
	}
	return 0.5 * (lo + hi)
}

// IronLimit returns the lowest default saturation limit over the
// model's nonlinear iron regions (each curve's flux density at
// μr = DefaultMinMuR), or 0 when the model has no B-H curve.
func IronLimit(m *models.Model) float64 {
	lim := 0.0
	for i := range m.Regions {
		mat, _, err := study.Material(m, &m.Regions[i])
		if err != nil {
			continue
		}
		if cv, ok := mat.(*materials.Curve); ok {
			if b := BAtMuR(cv, DefaultMinMuR); lim == 0 || b < lim {
				lim = b
			}
		}
	}
	return lim
}

// tolText writes a tolerance with one figure (1e-04) when that is exact
// to 1e-12, else with three (5.25e-04).
func tolText(t float64) string {
	one := fmt.Sprintf("%.0e", t)
	var back float64
	fmt.Sscan(one, &back)
	if math.Abs(back-t) <= 1e-12*t {
		return one
	}
	return fmt.Sprintf("%.3g", t)
}
