package main

import (
	"encoding/json"
	"math"
	"testing"
)

// TestLengthCommand: the bench dipole's JSON carries an effective length
// above the iron length, the field integral B0·L_eff, and the measured
// ratio asked for; the solenoid (axisymmetric) is refused.
func TestLengthCommand(t *testing.T) {
	code, out, errs := runCmd(t, "length", "--quick", "--json", "--measured", "0.33", "bench-dipole")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errs)
	}
	var r lengthReport
	if err := json.Unmarshal([]byte(out), &r); err != nil {
		t.Fatal(err)
	}
	if !(r.LEff > r.IronLength) || math.Abs(r.Integral-r.B0*r.LEff) > 1e-12 || math.Abs(r.MeasuredRatio-0.33/r.Integral) > 1e-12 || !r.Quick {
		t.Errorf("report %+v", r)
	}
	if code, _, _ := runCmd(t, "length", "--quick", "calibration-solenoid"); code != 1 {
		t.Errorf("solenoid: exit %d, want 1", code)
	}
}
