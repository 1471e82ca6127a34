package main

import (
	"bytes"
	"context"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"

	"polegap/post/quantity/force"
	"polegap/post/workflow/sweep"
)

func runCmd(t *testing.T, args ...string) (code int, stdout, stderr string) {
	t.Helper()
	var out, errb bytes.Buffer
	code = run(args, &out, &errb)
	return code, out.String(), errb.String()
}

func TestUsage(t *testing.T) {
	if code, _, errs := runCmd(t); code != 2 || !strings.Contains(errs, "Usage") {
		t.Errorf("no arguments: code %d, stderr %q", code, errs)
	}
	if code, _, _ := runCmd(t, "frobnicate"); code != 2 {
		t.Errorf("unknown command: code %d, want 2", code)
	}
	if code, _, _ := runCmd(t, "mesh"); code != 2 {
		t.Errorf("mesh without model: code %d, want 2", code)
	}
	if code, _, _ := runCmd(t, "mesh", "--nonsense", "x"); code != 2 {
		t.Errorf("unknown flag: code %d, want 2", code)
	}
	code, out, _ := runCmd(t, "help", "solve")
	if code != 0 || !strings.Contains(out, "--json") {
		t.Errorf("help solve: code %d, out %q", code, out)
	}
	if code, _, errs := runCmd(t, "solve", "no-such-model.yaml"); code != 1 || !strings.Contains(errs, "no model file") {
		t.Errorf("missing model: code %d, stderr %q", code, errs)
	}
}

func TestExamplesRoundTrip(t *testing.T) {
	code, out, _ := runCmd(t, "examples")
	if code != 0 || !strings.Contains(out, "bench-dipole") {
		t.Fatalf("examples: code %d, out %q", code, out)
	}
	code, yaml, _ := runCmd(t, "examples", "calibration-solenoid")
	if code != 0 || !strings.Contains(yaml, "axisymmetric") {
		t.Fatalf("examples calibration-solenoid: code %d", code)
	}
	dir := t.TempDir()
	p := filepath.Join(dir, "sol.yaml")
	if err := os.WriteFile(p, []byte(yaml), 0o644); err != nil {
		t.Fatal(err)
	}
	vtu, png := filepath.Join(dir, "m.vtu"), filepath.Join(dir, "m.png")
	code, out, errs := runCmd(t, "mesh", p, "--out", vtu, "--png", png)
	if code != 0 {
		t.Fatalf("mesh: code %d, stderr %q", code, errs)
	}
	if !strings.Contains(out, "smallest angle") {
		t.Errorf("mesh output lacks the statistics: %q", out)
	}
	for _, f := range []string{vtu, png} {
		if st, err := os.Stat(f); err != nil || st.Size() == 0 {
			t.Errorf("%s not written: %v", f, err)
		}
	}
}

// TestSolveJSON checks the keys that the JSON report promises, for an
// axisymmetric model r, z, br, bz (the field values themselves are checked against physics in the solver and post
// packages).
func TestSolveJSON(t *testing.T) {
	code, out, errs := runCmd(t, "solve", "--json", "calibration-solenoid")
	if code != 0 {
		t.Fatalf("solve: code %d, stderr %q", code, errs)
	}
	var r struct {
		Mesh   struct{ Nodes, Triangles int }
		Newton struct {
			Iterations int
			Residual   float64
			Converged  bool
		}
		Probes map[string]map[string]any
	}
	if err := json.Unmarshal([]byte(out), &r); err != nil {
		t.Fatalf("JSON: %v\n%s", err, out)
	}
	if r.Mesh.Nodes == 0 || r.Mesh.Triangles == 0 || !r.Newton.Converged {
		t.Errorf("report: %+v", r)
	}
	found := false
	for name, p := range r.Probes {
		if p["kind"] != "point" {
			continue
		}
		found = true
		for _, k := range []string{"a", "br", "bz", "b"} { // axisymmetric: x, y are r, z
			if _, ok := p[k]; !ok {
				t.Errorf("point probe %s lacks %q", name, k)
			}
		}
	}
	if !found {
		t.Errorf("no point probe in the report: %v", r.Probes)
	}
}

// TestSizeJSON: the sizing reaches its target within the search tolerance
// (1e-4 relative) and proposes a winding whose turns × current deliver
// the ampere-turns found.
func TestSizeJSON(t *testing.T) {
	code, out, errs := runCmd(t, "size", "--json", "--cooling", "water", "--field", "0.8T", "bench-dipole")
	if code != 0 {
		t.Fatalf("size: code %d, stderr %q", code, errs)
	}
	var r struct {
		Reached     bool
		Field       float64 `json:"field_T"`
		AmpereTurns float64 `json:"ampere_turns_per_winding"`
		Best        *struct {
			Turns   int     `json:"turns"`
			Current float64 `json:"current_A"`
		}
		Cautions []string
	}
	if err := json.Unmarshal([]byte(out), &r); err != nil {
		t.Fatal(err)
	}
	if !r.Reached || math.Abs(r.Field-0.8) > 1e-4*0.8 || r.Best == nil || len(r.Cautions) == 0 {
		t.Fatalf("sizing: %+v", r)
	}
	if ni := float64(r.Best.Turns) * r.Best.Current; math.Abs(ni-r.AmpereTurns) > 1e-9*ni {
		t.Errorf("best winding gives %g ampere-turns, want %g", ni, r.AmpereTurns)
	}
}

// TestCheckExitCodes: 0 when every check passes, 1 when one fails, 2 on
// an error (issue: scripts rely on it).
func TestCheckExitCodes(t *testing.T) {
	if code, out, errs := runCmd(t, "check", "bench-dipole"); code != 0 || !strings.Contains(out, "all checks pass") {
		t.Errorf("check bench-dipole: code %d\n%s%s", code, out, errs)
	}
	if code, out, _ := runCmd(t, "check", "--saturation-limit", "1.5T", "bench-dipole"); code != 1 || !strings.Contains(out, "FAIL") {
		t.Errorf("check with a 1.5 T limit: code %d, want 1\n%s", code, out)
	}
	if code, _, _ := runCmd(t, "check", "no-such-model.yaml"); code != 2 {
		t.Errorf("check of a missing model: code %d, want 2", code)
	}
}

// TestDemo runs the README's first command end to end and pins the
// default model's gap-centre field. The pin (0.9648 T, converged to 1e-3
// with the open boundary; 3e-4 relative for mesh and solver changes)
// guards against regressions;
// the physics is checked against published values in the solver and post
// packages. The ideal magnetic circuit gives μ0·32000/0.040 = 1.005 T, so
// 0.97 T is the expected few per cent below it.
func TestDemo(t *testing.T) {
	if testing.Short() {
		t.Skip("the full design run takes a while")
	}
	dir := t.TempDir()
	code, out, errs := runCmd(t, "demo", "--out", dir)
	if code != 0 {
		t.Fatalf("demo: code %d\n%s", code, errs)
	}
	for _, f := range []string{"report.html", "report.json", "field.png", "excitation.png", "excitation.csv", "windings.csv", "mesh.png", "solution.vtu"} {
		if st, err := os.Stat(filepath.Join(dir, f)); err != nil || st.Size() == 0 {
			t.Errorf("demo did not write %s", f)
		}
	}
	data, err := os.ReadFile(filepath.Join(dir, "report.json"))
	if err != nil {
		t.Fatal(err)
	}
	validateJSON(t, "demo report.json", data) // the JSON contract (schema_test.go)
	var r struct {
		Report struct {
			Probes map[string]struct {
				B float64 `json:"b"`
			}
		}
		Check struct{ Pass bool }
	}
	if err := json.Unmarshal(data, &r); err != nil {
		t.Fatal(err)
	}
	if b := r.Report.Probes["gap-centre"].B; math.Abs(b-0.9648) > 3e-4*0.9648 {
		t.Errorf("gap-centre field %.5f T, pinned 0.9648 T", b)
	}
	if !r.Check.Pass || !strings.Contains(out, "CAUTION") {
		t.Errorf("demo output lacks a passing check or the cautions:\n%s", out)
	}
	html, _ := os.ReadFile(filepath.Join(dir, "report.html"))
	text := regexp.MustCompile(`src="data:image/png;base64,[^"]*"`).ReplaceAllString(string(html), "")
	if n := strings.Count(string(html), "data:image/png;base64,"); n < 2 || strings.Contains(text, "NaN") {
		t.Errorf("report.html has %d embedded pictures (want 2) or contains NaN", n)
	}
}

// TestCompare: the sample current-balance readings (drawn from the bench
// dipole's prediction with a 41.5 mm gap, see testdata/measured/README.md)
// reduce and compare within a few per cent of the 40 mm model, with the
// field below the prediction (a wider gap), and a bad CSV row is reported
// by number.
func TestCompare(t *testing.T) {
	code, out, errs := runCmd(t, "compare", "--json", "bench-dipole", "../../testdata/measured/bench-dipole-balance.yaml")
	if code != 0 {
		t.Fatalf("compare: code %d\n%s", code, errs)
	}
	var r struct {
		Comparison struct {
			RMSRel    float64 `json:"rms_relative"`
			Residuals []struct{ Residual float64 }
		}
	}
	if err := json.Unmarshal([]byte(out), &r); err != nil {
		t.Fatal(err)
	}
	// A 1.5 mm wider gap lowers the field by about 1.5/41.5 = 3.6 % in the
	// linear range (ideal magnetic circuit): expect an RMS of 1-6 %.
	if rr := r.Comparison.RMSRel; rr < 0.01 || rr > 0.06 {
		t.Errorf("RMS relative residual %g, want 1-6 %%", rr)
	}
	bad := filepath.Join(t.TempDir(), "bad.csv")
	os.WriteFile(bad, []byte("current_A,field_T\n10,0.1\n20,abc\n30,0.3\n"), 0o644)
	code, _, errs = runCmd(t, "compare", "bench-dipole", bad)
	if code != 1 || !strings.Contains(errs, "bad.csv:3:4: field_T") {
		t.Errorf("bad CSV: code %d, stderr %q", code, errs)
	}
}

// TestHoldingForce: the holding magnet's pull on its plate by Maxwell
// stress and by virtual work agree within 2 % (the requirement;
// measured 1e-5 with the virtual work on the deformed mesh), their
// difference is the error estimate reported, and they lie below the ideal two-gap force 2·B²A/(2μ0) with B = μ0NI/(2g)
// = 0.628 T, A = 30 mm × 100 mm (about 943 N; the ideal magnetic circuit
// and the Maxwell pressure B²/2μ0, e.g. Griffiths, Introduction to
// Electrodynamics, 4th ed., 2013, §8.2.2) but not far below it: 80-100 %.
func TestHoldingForce(t *testing.T) {
	if testing.Short() {
		t.Skip("virtual work solves four more times")
	}
	code, out, errs := runCmd(t, "solve", "--json", "holding-magnet")
	if code != 0 {
		t.Fatalf("solve: code %d\n%s", code, errs)
	}
	var r struct {
		Forces []struct {
			Part        string
			Stress      [2]float64  `json:"maxwell_stress_N"`
			VirtualWork *[2]float64 `json:"virtual_work_N"`
			Estimate    *float64    `json:"error_estimate_N"`
			Error       string
		}
	}
	if err := json.Unmarshal([]byte(out), &r); err != nil {
		t.Fatal(err)
	}
	if len(r.Forces) != 1 || r.Forces[0].Error != "" || r.Forces[0].VirtualWork == nil || r.Forces[0].Estimate == nil {
		t.Fatalf("forces: %+v", r.Forces)
	}
	fs, fv := r.Forces[0].Stress[1], r.Forces[0].VirtualWork[1]
	if math.Abs(fs-fv) > 0.02*math.Abs(fv) {
		t.Errorf("pull by stress %g N, by virtual work %g N: more than 2 %% apart", fs, fv)
	}
	f := r.Forces[0]
	if d := force.SafetyFactor * math.Hypot(f.Stress[0]-f.VirtualWork[0], f.Stress[1]-f.VirtualWork[1]); math.Abs(d-*f.Estimate) > 1e-9*math.Abs(fv) {
		t.Errorf("error estimate %g N, %g × the difference of the two %g N", *f.Estimate, float64(force.SafetyFactor), d)
	}
	b := 4e-7 * math.Pi * 1000 / 0.002
	ideal := 2 * b * b * 0.030 * 0.100 / (2 * 4e-7 * math.Pi)
	if fs < 0.8*ideal || fs > ideal {
		t.Errorf("pull %g N against the ideal %g N", fs, ideal)
	}
}

// TestDocListsEveryCommand keeps the manual in doc.go in step with the
// command table.
func TestDocListsEveryCommand(t *testing.T) {
	doc, err := os.ReadFile("doc.go")
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range commands {
		if !strings.Contains(string(doc), "\t"+c.Name()+" ") {
			t.Errorf("doc.go does not list %q", c.Name())
		}
	}
}

// TestProfile: the line profile's CSV has the documented columns (r, z,
// Br, Bz for this axisymmetric model) and one row per sample inside the
// mesh; at the gap centre it carries the field the solve reports there
// (same field evaluation).
func TestProfile(t *testing.T) {
	dir := t.TempDir()
	csvPath, png := filepath.Join(dir, "p.csv"), filepath.Join(dir, "p.png")
	code, _, errs := runCmd(t, "profile", "--samples", "11", "--csv", csvPath, "--png", png, "holding-magnet")
	if code != 2 || !strings.Contains(errs, "no line probe") {
		t.Errorf("a model without line probes: code %d, stderr %q", code, errs)
	}
	code, _, errs = runCmd(t, "profile", "--samples", "11", "--csv", csvPath, "--png", png, "calibration-solenoid")
	if code != 0 {
		t.Fatalf("profile: code %d, stderr %q", code, errs)
	}
	data, err := os.ReadFile(csvPath)
	if err != nil {
		t.Fatal(err)
	}
	lines := strings.Split(strings.TrimSpace(string(data)), "\n")
	if lines[0] != "r_m,z_m,br_T,bz_T,b_T" || len(lines) != 12 { // axisymmetric: x, y are r, z
		t.Errorf("CSV header %q and %d rows, want the documented header and 11 rows", lines[0], len(lines)-1)
	}
	if st, err := os.Stat(png); err != nil || st.Size() == 0 {
		t.Error("profile plot not written")
	}
}

// TestSearchCoil: a small coil at the gap centre pulled out of the field
// reads N·S·B (the definition of flux linkage for a coil small against
// the field's variation), with B the gap-centre field of the solve.
func TestSearchCoil(t *testing.T) {
	if code, _, _ := runCmd(t, "searchcoil", "--turns", "200", "--at", "15,-0.5", "holding-magnet"); code != 2 {
		t.Errorf("a planar search coil without --area: code %d, want 2", code)
	}
	code, out, errs := runCmd(t, "searchcoil", "--turns", "200", "--area", "100mm2", "--at", "15,-0.5", "holding-magnet")
	if code != 0 {
		t.Fatalf("searchcoil: code %d, stderr %q", code, errs)
	}
	// searchcoil solves once on the model's mesh: compare with the same.
	_, js, _ := runCmd(t, "solve", "--quick", "--json", "holding-magnet")
	var r struct {
		Probes map[string]struct{ By float64 }
	}
	if err := json.Unmarshal([]byte(js), &r); err != nil {
		t.Fatal(err)
	}
	want := 200 * 100e-6 * r.Probes["gap-left"].By
	var got float64
	fmt.Sscanf(out[strings.Index(out, ": ")+2:], "%g", &got)
	if math.Abs(got-want) > 1e-5*math.Abs(want) {
		t.Errorf("linkage %g Wb-turns, want N·S·By = %g", got, want)
	}
}

// TestSweepInterrupted: an interrupted sweep (Ctrl-C, here a cancelled
// context after two points) exits 1, and its CSV holds the finished points
// marked partial; no temporary file is left.
func TestSweepInterrupted(t *testing.T) {
	ctx, cancel := context.WithCancel(context.Background())
	oldI, oldP := interruptible, newProgress
	defer func() { interruptible, newProgress = oldI, oldP }()
	interruptible = func() (context.Context, context.CancelFunc) { return ctx, cancel }
	newProgress = func(io.Writer) func(int, int, sweep.Point) {
		return func(done, _ int, _ sweep.Point) {
			if done == 2 {
				cancel()
			}
		}
	}
	dir := t.TempDir()
	out := filepath.Join(dir, "curve.csv")
	code, _, errs := runCmd(t, "sweep", "--points", "6", "--csv", out, "calibration-solenoid")
	if code != 1 || !strings.Contains(errs, "interrupted") {
		t.Fatalf("code %d, stderr %q", code, errs)
	}
	data, err := os.ReadFile(out)
	if err != nil {
		t.Fatal(err)
	}
	s := string(data)
	rows := strings.Count(s, "\n") - strings.Count(s, "#") - 1
	if !strings.Contains(s, "# partial:") || rows != 2 {
		t.Errorf("partial table with %d points:\n%s", rows, s)
	}
	if ents, _ := os.ReadDir(dir); len(ents) != 1 {
		t.Errorf("files left: %v", ents)
	}
}

// TestSolveAccuracy: solve --accuracy refines until every converging
// quantity settles, with either marking, and says so; an unknown
// --refine-by is a usage error.
func TestSolveAccuracy(t *testing.T) {
	for _, by := range []string{"goal", "energy"} {
		code, out, errs := runCmd(t, "solve", "--accuracy", "1e-3", "--refine-by", by, "calibration-solenoid")
		if code != 0 || strings.Count(errs, "refined to") < 1 || !strings.Contains(out, "gap") || !strings.Contains(out, "reached after") {
			t.Errorf("--refine-by %s: code %d, stderr %q", by, code, errs)
		}
	}
	if code, _, errs := runCmd(t, "solve", "--accuracy", "1e-3", "--refine-by", "corners", "calibration-solenoid"); code != 2 || !strings.Contains(errs, "energy or goal") {
		t.Errorf("bad --refine-by: code %d, stderr %q", code, errs)
	}
}

// TestCheckVerdictStable (issue 13): the check's verdicts are the same at
// the default accuracy (1e-3) and ten times tighter, with a saturation
// limit within 2 % of the arms' peak (1.676 T measured), where a verdict
// read off the raw corner maximum would flip with the mesh.
func TestCheckVerdictStable(t *testing.T) {
	verdicts := func(args ...string) []string {
		t.Helper()
		_, out, errs := runCmd(t, append([]string{"check", "--saturation-limit", "1.65T"}, args...)...)
		var v []string
		for _, line := range strings.Split(out, "\n") {
			if strings.HasPrefix(line, "PASS") || strings.HasPrefix(line, "FAIL") {
				v = append(v, line[:4]+" "+strings.Fields(line)[3])
			}
		}
		if len(v) == 0 {
			t.Fatalf("check %v: no verdicts; stderr %q", args, errs)
		}
		return v
	}
	a, b := verdicts("bench-dipole"), verdicts("--accuracy", "1e-4", "bench-dipole")
	if strings.Join(a, "; ") != strings.Join(b, "; ") {
		t.Errorf("verdicts at 1e-3 %v, at 1e-4 %v", a, b)
	}
}
