package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestCautionsWhereTheDangerIs: help, solve, check and a sweep past the
// rated current print the cautions, quantified from the design; a sweep
// within the rating prints none, and a sweep with --csv prints a short
// table, not the CSV.
func TestCautionsWhereTheDangerIs(t *testing.T) {
	dir := t.TempDir()
	for _, c := range []struct {
		name string
		args []string
		want []string
		not  []string
	}{
		{"help", []string{"help"}, []string{"Safety.", "licensed practice", "dump resistor"}, nil},
		{"solve", []string{"solve", "--quick", "--stress-only", "bench-dipole"}, []string{"CAUTION", "stored energy: The field stores 1.33 kJ at 100 A", "poles attract each other with 22.4 kN", "(L I / 1 ms)"}, nil},
		{"check", []string{"check", "--quick", "bench-dipole"}, []string{"CAUTION", "The field stores", "poles attract each other"}, nil},
		{"sweep past rating", []string{"sweep", "--quick", "--points", "2", "--to", "150A", "--csv", filepath.Join(dir, "a.csv"), "bench-dipole"},
			[]string{"index", "wrote 2 points to", "current above rating", "1.5 times its rated 100 A"}, []string{"# polegap excitation curve"}},
		{"sweep within rating", []string{"sweep", "--quick", "--points", "2", "--to", "80A", "--csv", filepath.Join(dir, "b.csv"), "bench-dipole"},
			[]string{"wrote 2 points"}, []string{"CAUTION"}},
	} {
		code, out, errs := runCmd(t, c.args...)
		if code != 0 {
			t.Errorf("%s: code %d\n%s", c.name, code, errs)
			continue
		}
		for _, w := range c.want {
			if !strings.Contains(out, w) {
				t.Errorf("%s: output lacks %q:\n%s", c.name, w, out)
			}
		}
		for _, w := range c.not {
			if strings.Contains(out, w) {
				t.Errorf("%s: output has %q:\n%s", c.name, w, out)
			}
		}
	}
	if b, err := os.ReadFile(filepath.Join(dir, "a.csv")); err != nil || !strings.HasPrefix(string(b), "# polegap excitation curve") {
		t.Errorf("sweep --csv file: %v", err)
	}
}
