package main

import (
	"regexp"
	"strings"
	"testing"
)

// TestSmallSlips: the coil line names its turns; no flag's help states
// its default twice; every example is listed with a description.
func TestSmallSlips(t *testing.T) {
	if code, out, _ := runCmd(t, "solve", "--quick", "--stress-only", "bench-dipole"); code != 0 || !strings.Contains(out, "100 A × 320 turns = 32000 A-t") {
		t.Errorf("solve: code %d, coil line:\n%s", code, out)
	}
	twice := regexp.MustCompile(`\(default[^)]*\).*\(default`)
	for _, c := range commands {
		_, out, _ := runCmd(t, "help", c.Name())
		for _, line := range strings.Split(out, "\n") {
			if twice.MatchString(line) {
				t.Errorf("help %s: default stated twice: %q", c.Name(), line)
			}
		}
	}
	_, out, _ := runCmd(t, "examples")
	for _, line := range strings.Split(strings.TrimSpace(out), "\n") {
		if line == "" {
			continue // before the measured samples
		}
		if f := strings.Fields(line); len(f) < 4 {
			t.Errorf("examples: %q has no description", line)
		}
	}
}

// TestBuiltInSamples: the measured samples the README uses are built in
// as the examples are: listed, printed by name, and read by compare
// from a folder where no such file exists.
func TestBuiltInSamples(t *testing.T) {
	code, out, _ := runCmd(t, "examples", "bench-dipole-hall.csv")
	if code != 0 || !strings.Contains(out, "current") {
		t.Errorf("examples bench-dipole-hall.csv: code %d\n%s", code, out)
	}
	code, out, errs := runCmd(t, "compare", "bench-dipole", "bench-dipole-hall.csv")
	if code != 0 || !strings.Contains(out, "model bench-dipole against bench-dipole-hall.csv") {
		t.Errorf("compare with the built-in sample: code %d\n%s%s", code, out, errs)
	}
}
