package main

import (
	"flag"
	"io"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"polegap/models"
)

// TestQuantityFlag: units, bare numbers and their SI values in a model
// drawn in millimetres and one in metres. The factors are definitions:
// 1 G = 1e-4 T (CGS gauss), 1 in = 0.0254 m (international inch, 1959).
func TestQuantityFlag(t *testing.T) {
	mm := &models.Model{Units: "mm", Scale: 1e-3}
	metres := &models.Model{Units: "m", Scale: 1}
	cases := []struct {
		in        string
		kind      quantityKind
		inMM, inM float64 // SI value in the millimetre and the metre model
	}{
		{"1.2T", field, 1.2, 1.2},
		{"850 mT", field, 0.85, 0.85},
		{"12kG", field, 1.2, 1.2},
		{"1.2", field, 1.2, 1.2}, // bare field: tesla
		{"40mm", length, 0.04, 0.04},
		{"4cm", length, 0.04, 0.04},
		{"1in", length, 0.0254, 0.0254},
		{"40", length, 0.04, 40}, // bare length: the model's units
		{"2.5e-3m", length, 2.5e-3, 2.5e-3},
		{"100mm2", area, 1e-4, 1e-4},
		{"2.5 cm2", area, 2.5e-4, 2.5e-4},
		{"100", area, 1e-4, 100}, // bare area: the model's units squared
		{"25A", current, 25, 25},
		{"0.1kA", current, 100, 100},
		{"25", current, 25, 25},
		{"32000At", ampereTurns, 32000, 32000},
		{"3.2kAt", ampereTurns, 3200, 3200},
		{"3.2kA", ampereTurns, 3200, 3200},
		{"48V", voltage, 48, 48},
		{"80C", temperature, 80, 80},
		{"80°C", temperature, 80, 80},
		{"80", temperature, 80, 80},
	}
	for _, c := range cases {
		q := quantityFlag{kind: c.kind, name: "x"}
		if err := q.Set(c.in); err != nil {
			t.Errorf("%s %q: %v", c.kind, c.in, err)
			continue
		}
		// Exact up to the rounding of one product (1 ulp).
		for _, m := range []struct {
			model *models.Model
			want  float64
		}{{mm, c.inMM}, {metres, c.inM}} {
			if got := q.SI(m.model); math.Abs(got-m.want) > 1e-15*math.Abs(m.want) {
				t.Errorf("%s %q in a model in %s: %g, want %g", c.kind, c.in, m.model.Units, got, m.want)
			}
		}
	}
	bad := []struct {
		in   string
		kind quantityKind
		msg  string
	}{
		{"1.2X", field, `unknown field unit "X" (use one of G, T, kG, mT)`},
		{"1.2MT", field, `unknown field unit "MT"`},
		{"T", field, "not a field: write a number with an optional unit, e.g. 1.2T"},
		{"", length, "not a length"},
		{"nan", field, "not a field"},
		{"inf", current, "not a current"},
		{"1e301", current, "not a finite current"},
		{"30 furlongs", length, `unknown length unit "furlongs" (use one of cm, in, m, mm)`},
		{"100mm3", area, "not a area"},
		{"5V", current, `unknown current unit "V"`},
	}
	for _, c := range bad {
		q := quantityFlag{kind: c.kind}
		err := q.Set(c.in)
		if err == nil || !strings.Contains(err.Error(), c.msg) {
			t.Errorf("%s %q: error %v, want one containing %q", c.kind, c.in, err, c.msg)
		}
	}
}

// TestQuantityFlagMessage: a bad quantity is a usage error (exit 2) that
// names the flag and the unit it did not know.
func TestQuantityFlagMessage(t *testing.T) {
	cases := []struct {
		args []string
		want string
	}{
		{[]string{"size", "--field", "8 furlongs", "bench-dipole"}, `invalid value "8 furlongs" for flag --field: unknown field unit "furlongs" (use one of G, T, kG, mT)`},
		{[]string{"check", "--half-width=3 parsecs", "bench-dipole"}, `invalid value "3 parsecs" for flag --half-width: unknown length unit "parsecs"`},
		{[]string{"sweep", "--currents", "10A,20 amps", "bench-dipole"}, `invalid value "10A,20 amps" for flag --currents: "20 amps": unknown current unit "amps"`},
		{[]string{"solve", "--saturation-limit", "lots", "bench-dipole"}, `invalid value "lots" for flag --saturation-limit: not a field`},
		{[]string{"size", "--nonsense", "bench-dipole"}, "flag provided but not defined: --nonsense"},
	}
	for _, c := range cases {
		code, out, errs := runCmd(t, c.args...)
		if code != 2 || out != "" || !strings.Contains(errs, c.want) || !strings.Contains(errs, "usage: polegap "+c.args[0]) {
			t.Errorf("%q: exit %d, stdout %q, stderr %q; want exit 2 and %q", c.args, code, out, errs, c.want)
		}
	}
}

// TestBareLength: on the bench dipole (drawn in mm) --gap 40, --gap 40mm
// and --gap 0.04m give the same table; the bare number prints a note,
// since --gap read bare numbers in metres before. merge, which reads no
// model, refuses a bare --gap.
func TestBareLength(t *testing.T) {
	var first string
	for _, g := range []string{"40mm", "0.04m", "40"} {
		code, out, errs := runCmd(t, "sweep", "--currents", "50", "--gap", g, "bench-dipole")
		if code != 0 {
			t.Fatalf("--gap %s: exit %d, stderr %q", g, code, errs)
		}
		if first == "" {
			first = out
		} else if out != first {
			t.Errorf("--gap %s gives another table:\n%s\nwant\n%s", g, out, first)
		}
		if note := strings.Contains(errs, "note: --gap 40 has no unit and is read in the model's units (mm)"); note != (g == "40") {
			t.Errorf("--gap %s: note printed %v, stderr %q", g, note, errs)
		}
	}
	code, _, errs := runCmd(t, "merge", "--csv", filepath.Join(t.TempDir(), "x.csv"), "--gap", "40", "a.csv")
	if code != 2 || !strings.Contains(errs, `invalid value "40" for flag --gap: give the length with its unit, e.g. 40mm`) {
		t.Errorf("merge with a bare --gap: exit %d, stderr %q", code, errs)
	}
}

// TestAliases: the older flag names still work and do what the new ones
// do, and help lists only the new ones.
func TestAliases(t *testing.T) {
	dir := t.TempDir()
	a, b := filepath.Join(dir, "a.vtu"), filepath.Join(dir, "b.vtu")
	if code, _, errs := runCmd(t, "mesh", "--out", a, "calibration-solenoid"); code != 0 {
		t.Fatalf("mesh --out: exit %d, %s", code, errs)
	}
	if code, _, errs := runCmd(t, "mesh", "--vtu", b, "calibration-solenoid"); code != 0 {
		t.Fatalf("mesh --vtu: exit %d, %s", code, errs)
	}
	da, _ := os.ReadFile(a)
	db, _ := os.ReadFile(b)
	if len(da) == 0 || string(da) != string(db) {
		t.Errorf("mesh --out and --vtu wrote different files (%d and %d bytes)", len(da), len(db))
	}
	// --tol 1e-14 and --tolerance 1e-14 both stop Newton short of the
	// tolerance after one step.
	for _, name := range []string{"--tol", "--tolerance"} {
		code, _, errs := runCmd(t, "solve", "--max-iterations", "1", name, "1e-14", "bench-dipole")
		if code != 1 || !strings.Contains(errs, "did not converge after 1 iterations") {
			t.Errorf("solve %s 1e-14: exit %d, stderr %q", name, code, errs)
		}
	}
	for _, c := range []struct{ cmd, alias, name string }{{"solve", "tol", "tolerance"}, {"mesh", "out", "vtu"}} {
		_, help, _ := runCmd(t, "help", c.cmd)
		if strings.Contains(help, "--"+c.alias+" ") || !strings.Contains(help, "--"+c.name+" ") {
			t.Errorf("help %s lists --%s or lacks --%s:\n%s", c.cmd, c.alias, c.name, help)
		}
	}
}

// TestParseInterspersed: flags anywhere among the arguments, and "--"
// ending them.
func TestParseInterspersed(t *testing.T) {
	cases := []struct {
		args []string
		pos  []string
		json bool
		png  string
	}{
		{[]string{"m.yaml", "--json"}, []string{"m.yaml"}, true, ""},
		{[]string{"--json", "m.yaml", "--png", "f.png"}, []string{"m.yaml"}, true, "f.png"},
		{[]string{"--", "--json"}, []string{"--json"}, false, ""},
		{[]string{"--json", "--", "-m.yaml", "--png", "x"}, []string{"-m.yaml", "--png", "x"}, true, ""},
		{[]string{"m.yaml", "--", "a", "--json"}, []string{"m.yaml", "a", "--json"}, false, ""},
		{[]string{"--png", "--", "m.yaml", "--json"}, []string{"m.yaml"}, true, "--"}, // "--" is --png's value
		{[]string{"--png=--", "--", "--json"}, []string{"--json"}, false, "--"},
		{[]string{"a", "--", "--"}, []string{"a", "--"}, false, ""},
	}
	for _, c := range cases {
		fs := flag.NewFlagSet("t", flag.ContinueOnError)
		fs.SetOutput(io.Discard)
		asJSON := fs.Bool("json", false, "")
		png := fs.String("png", "", "")
		pos, err := parseInterspersed(fs, c.args)
		if err != nil || strings.Join(pos, " ") != strings.Join(c.pos, " ") || len(pos) != len(c.pos) || *asJSON != c.json || *png != c.png {
			t.Errorf("%q: args %q json %v png %q err %v; want %q %v %q", c.args, pos, *asJSON, *png, err, c.pos, c.json, c.png)
		}
	}
}

// TestDoubleDash: a model file whose name starts with a dash is read
// after "--", and a flag after "--" is an argument.
func TestDoubleDash(t *testing.T) {
	data, err := models.Example("calibration-solenoid")
	if err != nil {
		t.Fatal(err)
	}
	t.Chdir(t.TempDir())
	if err := os.WriteFile("-draft.yaml", data, 0o644); err != nil {
		t.Fatal(err)
	}
	if code, out, errs := runCmd(t, "mesh", "--json", "--", "-draft.yaml"); code != 0 || !strings.Contains(out, `"nodes"`) {
		t.Errorf("mesh --json -- -draft.yaml: exit %d, stderr %q", code, errs)
	}
	if code, _, errs := runCmd(t, "mesh", "-draft.yaml"); code != 2 || !strings.Contains(errs, "not defined: --draft.yaml") {
		t.Errorf("mesh -draft.yaml without --: exit %d, stderr %q", code, errs)
	}
	if code, _, errs := runCmd(t, "check", "calibration-solenoid", "--", "--json"); code != 2 || !strings.Contains(errs, `too many arguments: ["--json"]`) {
		t.Errorf("check MODEL -- --json: exit %d, stderr %q", code, errs)
	}
}
