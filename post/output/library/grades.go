package library

import (
	"fmt"
	"io"
	"os"

	"polegap/materials"
)

// WriteGrades prints the known electrical-steel grades with their minimum
// polarisation at materials.GradeH and the source of the values.
func WriteGrades(w io.Writer) error {
	h := materials.GradeH
	fmt.Fprintf(w, "%-10s %8s %7s   minimum J (T) at %g / %g / %g A/m\n", "grade", "thick mm", "W/kg", h[0], h[1], h[2])
	var src string
	for _, g := range materials.Grades() {
		fmt.Fprintf(w, "%-10s %8.2f %7.2f   %.2f / %.2f / %.2f\n", g.Name, g.Thickness*1e3, g.Loss, g.JMin[0], g.JMin[1], g.JMin[2])
		src = g.Source
	}
	_, err := fmt.Fprintf(w, "W/kg: maximum specific total loss at 1.5 T, 50 Hz\nsource: %s\n", src)
	return err
}

// CheckGrade checks a curve against a grade and prints the polarisation at
// each field strength of the standard beside the minimum. The curve is a
// library name or a CSV file (materials.ReadCurveCSV); grade "" takes the
// library entry's own grade. It reports whether the curve meets the grade.
func CheckGrade(w io.Writer, curve, grade string) (bool, error) {
	c, e, err := openCurve(curve)
	if err != nil {
		return false, err
	}
	if grade == "" {
		grade = e.Grade
	}
	if grade == "" {
		return false, fmt.Errorf("curve %q names no grade; give one, e.g. M270-35A ('polegap grades' lists them)", curve)
	}
	g, ok := materials.LookupGrade(grade)
	if !ok {
		return false, fmt.Errorf("unknown grade %q; 'polegap grades' lists the known ones", grade)
	}
	short := map[float64]bool{}
	sf := c.CheckGrade(g, 1)
	for _, s := range sf {
		short[s.H] = true
	}
	fmt.Fprintf(w, "curve %s against grade %s (%s)\n%10s %10s %10s\n", curve, g.Name, g.Source, "H (A/m)", "J (T)", "min J (T)")
	for i, h := range materials.GradeH {
		flag := "ok"
		if short[h] {
			flag = "SHORT"
		}
		fmt.Fprintf(w, "%10.0f %10.3f %10.2f  %s\n", h, c.B(h)-materials.Mu0*h, g.JMin[i], flag)
	}
	if e.FromMemory() {
		fmt.Fprintf(w, "note: curve %s is typical values from memory, not a cited source\n", e.Name)
	}
	verdict := "meets the grade"
	if len(sf) > 0 {
		verdict = "WARNING: falls short of the grade"
	}
	_, err = fmt.Fprintln(w, verdict)
	return len(sf) == 0, err
}

// openCurve returns the library curve called name, or the curve in the CSV
// file name with an empty entry.
func openCurve(name string) (*materials.Curve, materials.Entry, error) {
	if m, e, ok := materials.Lookup(name); ok {
		c, isCurve := m.(*materials.Curve)
		if !isCurve {
			return nil, e, fmt.Errorf("material %q is linear: it has no B-H curve", name)
		}
		return c, e, nil
	}
	f, err := os.Open(name)
	if err != nil {
		return nil, materials.Entry{}, fmt.Errorf("%q is neither a built-in curve nor a readable CSV file: %v", name, err)
	}
	defer f.Close()
	c, err := materials.ReadCurveCSV(f, name)
	return c, materials.Entry{}, err
}
