package materials

import (
	"fmt"
	"strconv"
	"strings"
)

// Grade is a non-oriented electrical-steel grade of IEC 60404-8-4 /
// EN 10106 (cold-rolled non-oriented sheet, fully processed), named by its
// designation M<loss>-<thickness>A: "M270-35A" is at most 2.70 W/kg at
// 1.5 T and 50 Hz, 0.35 mm thick. The standard gives each grade a minimum
// magnetic polarisation J = B - μ0 H at three field strengths (peak values
// at 50 Hz, measured on Epstein strips of mixed directions).
type Grade struct {
	Name      string  // designation, e.g. "M270-35A"
	Loss      float64 // W/kg at 1.5 T, 50 Hz: maximum specific total loss
	Thickness float64 // m
	// JMin are the minimum polarisations (T) at GradeH.
	JMin [3]float64
	// Source says where JMin comes from.
	Source string
}

// GradeH are the field strengths (A/m) at which the standard specifies the
// minimum polarisation: 2500, 5000 and 10000 A/m.
var GradeH = [3]float64{2500, 5000, 10000}

// Shortfall is a field strength at which a curve's polarisation falls
// below the grade's minimum.
type Shortfall struct {
	H    float64 // A/m
	J    float64 // the curve's polarisation there, T
	JMin float64 // the grade's minimum, T
}

func (s Shortfall) String() string {
	return fmt.Sprintf("J = %.3f T at %g A/m, below the minimum %.2f T", s.J, s.H, s.JMin)
}

// Grades returns the grades polegap knows, thinnest first. The slice is
// the caller's.
func Grades() []Grade { return append([]Grade(nil), grades...) }

// LookupGrade returns the grade with the designation name (case and
// surrounding space ignored).
func LookupGrade(name string) (Grade, bool) {
	name = strings.ToUpper(strings.TrimSpace(name))
	for _, g := range grades {
		if g.Name == name {
			return g, true
		}
	}
	return Grade{}, false
}

// CheckGrade compares the curve's polarisation J = B(H) - μ0 H at GradeH
// with the grade's minimum values and returns the shortfalls, none when
// the curve meets the grade. The standard's values are for 50 Hz peak
// polarisation and the curve is a d.c. (normal) curve; the two agree to
// within a few hundredths of a tesla at these fields in thin sheet (from
// memory), so a shortfall of that order deserves a look at the data
// rather than a verdict.
//
// k is the stacking factor the curve was built with (Stacked), 1 for the
// sheet's own curve: the sheet's polarisation is recovered as
// (B_eff - μ0 H)/k, since B_eff - μ0 H = k (B - μ0 H). It panics unless
// 0 < k <= 1.
func (c *Curve) CheckGrade(g Grade, k float64) []Shortfall {
	if !(k > 0 && k <= 1) {
		panic(errBadStacking)
	}
	var out []Shortfall
	for i, h := range GradeH {
		j := (c.B(h) - Mu0*h) / k
		if j < g.JMin[i] {
			out = append(out, Shortfall{H: h, J: j, JMin: g.JMin[i]})
		}
	}
	return out
}

// parseGrade reads the loss and thickness from a designation
// M<loss·100>-<thickness·100>A; it panics on a malformed built-in name.
func parseGrade(name string, j [3]float64, source string) Grade {
	bad := func() { panic("materials: bad built-in grade designation " + name) }
	if !strings.HasPrefix(name, "M") || !strings.HasSuffix(name, "A") {
		bad()
	}
	loss, thick, ok := strings.Cut(name[1:len(name)-1], "-")
	if !ok {
		bad()
	}
	l, err1 := strconv.Atoi(loss)
	t, err2 := strconv.Atoi(thick)
	if err1 != nil || err2 != nil {
		bad()
	}
	return Grade{Name: name, Loss: float64(l) / 100, Thickness: float64(t) / 1e5, JMin: j, Source: source}
}
