package library

import (
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"polegap/materials"
)

// The grade check of the command: the library's graded sheet meets its
// grade (IEC 60404-8-4 / EN 10106, values from memory); the same table
// weakened by 3 % in J, read from a CSV file, falls short with a warning.
func TestCheckGrade(t *testing.T) {
	var sb strings.Builder
	ok, err := CheckGrade(&sb, "silicon-steel-no", "")
	if err != nil || !ok || !strings.Contains(sb.String(), "meets the grade") || !strings.Contains(sb.String(), "from memory") {
		t.Fatalf("silicon-steel-no: %v, %v:\n%s", ok, err, sb.String())
	}
	m, _, _ := materials.Lookup("silicon-steel-no")
	h, b := m.(*materials.Curve).Table()
	var csv strings.Builder
	csv.WriteString("H (A/m),B (T)\n")
	for i := range h {
		fmt.Fprintf(&csv, "%g,%.6f\n", h[i], 0.97*(b[i]-materials.Mu0*h[i])+materials.Mu0*h[i])
	}
	path := filepath.Join(t.TempDir(), "weak.csv")
	if err := os.WriteFile(path, []byte(csv.String()), 0o644); err != nil {
		t.Fatal(err)
	}
	sb.Reset()
	ok, err = CheckGrade(&sb, path, "M270-35A")
	if err != nil || ok || !strings.Contains(sb.String(), "WARNING") || !strings.Contains(sb.String(), "SHORT") {
		t.Errorf("weakened: %v, %v:\n%s", ok, err, sb.String())
	}
	if _, err := CheckGrade(&sb, "team13-steel", ""); err == nil {
		t.Error("an ungraded curve without a grade gave no error")
	}
	if _, err := CheckGrade(&sb, "silicon-steel-no", "M1-1X"); err == nil {
		t.Error("an unknown grade gave no error")
	}
	sb.Reset()
	if err := WriteGrades(&sb); err != nil || !strings.Contains(sb.String(), "M270-35A") {
		t.Errorf("WriteGrades: %v\n%s", err, sb.String())
	}
}
