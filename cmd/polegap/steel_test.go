package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"polegap/materials"
)

// The steel-data commands run end to end: grades lists and checks, and
// bhfit fits five points of a Fröhlich–Kennelly law (B = H/(75 + 0.5 H),
// values rounded to 4 decimals) and writes a table a model can read.
func TestSteelCommands(t *testing.T) {
	code, out, errOut := runCmd(t, "grades", "silicon-steel-no")
	if code != 0 || !strings.Contains(out, "meets the grade") {
		t.Errorf("grades silicon-steel-no: exit %d\n%s%s", code, out, errOut)
	}
	dir := t.TempDir()
	pts := filepath.Join(dir, "pts.csv")
	if err := os.WriteFile(pts, []byte("H (A/m),B (T)\n60,0.5714\n200,1.1429\n600,1.6\n2000,1.8605\n6000,1.9512\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	table := filepath.Join(dir, "fit.csv")
	code, out, errOut = runCmd(t, "bhfit", "--csv", table, pts)
	if code != 0 || !strings.Contains(out, "J_s = 1.99") || !strings.Contains(out, "extrapolated") {
		t.Errorf("bhfit: exit %d\n%s%s", code, out, errOut)
	}
	f, err := os.Open(table)
	if err != nil {
		t.Fatal(err)
	}
	c, err := materials.ReadCurveCSV(f, table)
	f.Close()
	if h, _ := c.TableEnd(); err != nil || h != 6000 {
		t.Errorf("fitted table: %v, data end at %g A/m, want the last point given, 6000", err, h)
	}
	code, out, errOut = runCmd(t, "grades", table, "M400-50A")
	if code != 0 || !strings.Contains(out, "against grade M400-50A") {
		t.Errorf("grades on the fitted table: exit %d\n%s%s", code, out, errOut)
	}
}

// ringcurve reduces the ring sample and writes a table-file that a model
// can read back (materials.ReadCurveCSV through grades).
func TestRingCurveCommand(t *testing.T) {
	dir := t.TempDir()
	table := filepath.Join(dir, "ring.csv")
	code, out, errOut := runCmd(t, "ringcurve", "--csv", table, "--png", filepath.Join(dir, "ring.svg"), "--compare", "team13-steel", "../../testdata/measured/ring-team13.yaml")
	if code != 0 || !strings.Contains(out, "logarithmic mean") || !strings.Contains(out, "table: [[") {
		t.Fatalf("ringcurve: exit %d\n%s%s", code, out, errOut)
	}
	code, out, errOut = runCmd(t, "grades", table, "M800-50A")
	if code != 0 || !strings.Contains(out, "against grade M800-50A") {
		t.Errorf("grades on the ring table: exit %d\n%s%s", code, out, errOut)
	}
}
