package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"polegap/models"
)

// TestShimCommand: two evaluations on the bench dipole with a shim-min
// print the unshimmed width, the start and a gain, and draw the profiles;
// a model without a dipole template is refused.
func TestShimCommand(t *testing.T) {
	data, err := models.Example("bench-dipole")
	if err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	model := filepath.Join(dir, "dipole.yaml")
	s := strings.Replace(string(data), "  chamfer: 5", "  shim-min: 0.5\n  chamfer: 5", 1)
	if err := os.WriteFile(model, []byte(s), 0o644); err != nil {
		t.Fatal(err)
	}
	png := filepath.Join(dir, "shim.png")
	code, out, errs := runCmd(t, "shim", "--quick", "--evaluations", "2", "--png", png, model)
	if code != 0 || !strings.Contains(out, "unshimmed") || !strings.Contains(out, "gain") {
		t.Fatalf("exit %d:\n%s%s", code, out, errs)
	}
	if st, err := os.Stat(png); err != nil || st.Size() == 0 {
		t.Errorf("no profile plot: %v", err)
	}
	if code, _, errs := runCmd(t, "shim", "--quick", "calibration-solenoid"); code != 1 || !strings.Contains(errs, "c-core or h-core") {
		t.Errorf("solenoid: exit %d, %s", code, errs)
	}
}
