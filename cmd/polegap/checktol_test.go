package main

import (
	"encoding/json"
	"fmt"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
)

// halfWidthAt runs check with a uniformity tolerance and returns the
// half-width it reports (mm).
func halfWidthAt(t *testing.T, tol string) float64 {
	t.Helper()
	code, out, errs := runCmd(t, "check", "--quick", "--tolerance", tol, "--half-width", "1mm", "bench-dipole")
	if code != 0 {
		t.Fatalf("check --tolerance %s: code %d\n%s%s", tol, code, out, errs)
	}
	m := regexp.MustCompile(`good-field half-width at \|ΔB/B0\| < \S+\s+([0-9.]+) mm`).FindStringSubmatch(out)
	if m == nil {
		t.Fatalf("check --tolerance %s: no half-width in\n%s", tol, out)
	}
	v, _ := strconv.ParseFloat(m[1], 64)
	return v
}

// TestCheckAnyTolerance: a tolerance between 1e-4 and 1e-3 gets its own
// half-width, strictly between theirs (the deviation grows away from the
// centre, so the half-width grows with the tolerance).
func TestCheckAnyTolerance(t *testing.T) {
	lo, mid, hi := halfWidthAt(t, "1e-4"), halfWidthAt(t, "5e-4"), halfWidthAt(t, "1e-3")
	if !(lo < mid && mid < hi) || lo <= 0 {
		t.Errorf("half-widths %g (1e-4), %g (5e-4), %g (1e-3) mm: want increasing", lo, mid, hi)
	}
}

// TestCheckRefuses: meaningless requirements are usage errors (exit 2).
func TestCheckRefuses(t *testing.T) {
	for _, args := range [][]string{
		{"--tolerance", "1e-3"},
		{"--half-width", "20mm"},
		{"--tolerance", "-1e-3", "--half-width", "20mm"},
		{"--tolerance", "1e-3", "--half-width", "-20mm"},
		{"--tolerance", "1.5", "--half-width", "20mm"},
		{"--target-tolerance", "-1e-3"},
	} {
		if code, _, errs := runCmd(t, append(append([]string{"check", "--quick"}, args...), "bench-dipole")...); code != 2 {
			t.Errorf("check %v: code %d, want 2\n%s", args, code, errs)
		}
	}
}

// TestCheckTargetTolerance: a field 4e-4 below the target reaches it
// within the default tolerance (the accuracy, 1e-3) and misses it
// within 1e-4; the report calls it a target.
func TestCheckTargetTolerance(t *testing.T) {
	code, out, _ := runCmd(t, "check", "--quick", "--json", "bench-dipole")
	var c struct {
		Items []struct {
			What  string
			Value float64
		}
	}
	if code != 0 || json.Unmarshal([]byte(out), &c) != nil {
		t.Fatalf("check --json: code %d\n%s", code, out)
	}
	v := 0.0
	for _, it := range c.Items {
		if strings.HasPrefix(it.What, "field at") {
			v = it.Value
		}
	}
	_, yaml, _ := runCmd(t, "examples", "bench-dipole")
	target := v * (1 + 4e-4)
	mod := strings.Replace(yaml, "field: 0.9 ", fmt.Sprintf("field: %.9f ", target), 1)
	if mod == yaml || v == 0 {
		t.Fatal("could not set the target")
	}
	p := filepath.Join(t.TempDir(), "near.yaml")
	if err := os.WriteFile(p, []byte(mod), 0o644); err != nil {
		t.Fatal(err)
	}
	if code, out, _ := runCmd(t, "check", "--quick", p); code != 0 || !strings.Contains(out, "(target ") {
		t.Errorf("4e-4 below the target, default tolerance: code %d\n%s", code, out)
	}
	if code, out, _ := runCmd(t, "check", "--quick", "--target-tolerance", "1e-4", p); code != 1 {
		t.Errorf("4e-4 below the target, tolerance 1e-4: code %d\n%s", code, out)
	}
}
