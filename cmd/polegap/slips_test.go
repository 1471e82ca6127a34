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
		if f := strings.Fields(line); len(f) < 4 {
			t.Errorf("examples: %q has no description", line)
		}
	}
}
