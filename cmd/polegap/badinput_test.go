package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"polegap/post/measure"
)

// badDir holds one bad input per case; BAD-INPUT.md at the repository root
// is the catalogue of them.
const badDir = "../../testdata/bad"

// badCase is one bad input run through the command line.
type badCase struct {
	name string
	args []string // the command line; the file is in badDir
	code int      // 1: bad model, 2: usage error
	// want are substrings of stderr: the where (file:line:column and field
	// path), the what and the what-to-do.
	want []string
}

// TestBadInputs runs every bad model of testdata/bad through
// `polegap solve` (or `size`) and checks the exit status, that the message
// names the place in the file, and that nothing is printed on stdout (no
// result claims success).
func TestBadInputs(t *testing.T) {
	cases := []badCase{
		{"malformed YAML", []string{"solve", "malformed.yaml"}, 1,
			[]string{"malformed.yaml:6:3: malformed YAML: mapping values are not allowed in this context; check this line's indentation"}},
		{"wrong type", []string{"solve", "wrong-type.yaml"}, 1,
			[]string{`wrong-type.yaml:5:8: depth: expected a number, got "deep"`}},
		{"unknown key", []string{"solve", "unknown-key.yaml"}, 1,
			[]string{`unknown-key.yaml:24:18: mesh.gradng: unknown key "gradng"`, `did you mean "grading"?`}},
		{"missing turns", []string{"solve", "missing-turns.yaml"}, 1,
			[]string{`missing-turns.yaml:19:5: coils[0]: missing required key "turns"; add turns:`}},
		{"missing units", []string{"solve", "missing-units.yaml"}, 1,
			[]string{`missing-units.yaml:3:1: missing required key "units"; add units: mm`}},
		{"unknown unit", []string{"solve", "unknown-unit.yaml"}, 1,
			[]string{`unknown-unit.yaml:4:8: units: unknown unit "mils"; use mm, cm, m or in`}},
		{"zero depth", []string{"solve", "zero-depth.yaml"}, 1,
			[]string{"zero-depth.yaml:5:8: depth: depth must be greater than zero, got 0"}},
		{"negative mesh size", []string{"solve", "negative-mesh-size.yaml"}, 1,
			[]string{"negative-mesh-size.yaml:24:14: mesh.size: mesh size must be greater than zero, got -5"}},
		{"open polygon", []string{"solve", "open-polygon.yaml"}, 1,
			[]string{`open-polygon.yaml:9:5: regions[0].polygon: open or degenerate polygon: region "core" has 2 vertices, needs at least 3`}},
		{"self-intersecting", []string{"solve", "self-intersecting.yaml"}, 1,
			[]string{`self-intersecting.yaml:11:15: regions[0].polygon[0]: self-intersecting polygon`, "split it into two regions"}},
		{"overlap", []string{"solve", "overlap.yaml"}, 1,
			[]string{`overlap.yaml:12:5: regions[1]: region "coil-a" overlaps region "core" near (40, 20) mm`, "may touch or share edges but not overlap"}},
		{"coil side not a region", []string{"solve", "coil-side-missing.yaml"}, 1,
			[]string{`coil-side-missing.yaml:22:51: coils[0].sides[1].region: coil side names region "coil-c", which does not exist; add it under regions`}},
		{"coil side of zero area", []string{"solve", "coil-side-zero-area.yaml"}, 1,
			[]string{`coil-side-zero-area.yaml:15:5: regions[2].polygon: open or degenerate polygon: region "coil-b" has zero area`}},
		{"zero turns", []string{"solve", "zero-turns.yaml"}, 1,
			[]string{"zero-turns.yaml:20:12: coils[0].turns: turns must be greater than zero, got 0"}},
		{"empty B-H table", []string{"solve", "bh-empty.yaml"}, 1,
			[]string{"bh-empty.yaml:7:18: materials.steel.table: a B-H table needs at least 2 rows [H, B], got 0"}},
		{"non-monotone B-H table", []string{"solve", "bh-nonmonotone.yaml"}, 1,
			[]string{"bh-nonmonotone.yaml:7:51: materials.steel.table[3]: ", "row 4 of the B-H table (H = 300 A/m, B = 1.1 T)", "B must rise with H"}},
		{"repeated H in a B-H table", []string{"solve", "bh-repeated-h.yaml"}, 1,
			[]string{"bh-repeated-h.yaml:7:39: materials.steel.table[2]: ", "row 3 of the B-H table (H = 100 A/m, B = 0.9 T)", "sort the table by H"}},
		{"non-monotone B-H file", []string{"solve", "bh-file-nonmonotone.yaml"}, 1,
			[]string{"bh-file-nonmonotone.yaml:7:3: materials.steel: ", "bh-nonmonotone.csv:5: B is not above", "correct or remove the row"}},
		{"B-H file with a bad row", []string{"solve", "bh-file-bad-row.yaml"}, 1,
			[]string{"bh-file-bad-row.yaml:7:3: materials.steel: ", `bh-bad-row.csv:4: column B: "1.2x" is not a number`}},
		{"empty B-H file", []string{"solve", "bh-file-empty.yaml"}, 1,
			[]string{"bh-file-empty.yaml:7:3: materials.steel: ", "bh-empty.csv: the table is empty"}},
		{"axisymmetric r < 0", []string{"solve", "axisymmetric-negative-r.yaml"}, 1,
			[]string{`axisymmetric-negative-r.yaml:11:15: regions[0].polygon[0]: region "core" reaches r = -5`, "the axis is x = 0"}},
		{"boundary box cutting a region", []string{"solve", "box-cuts-region.yaml"}, 1,
			[]string{`box-cuts-region.yaml:23:17: boundary.box: region "core" reaches from (0, 0) mm to (100, 20) mm, outside the boundary box`, "enlarge the box"}},
		{"too fine for memory", []string{"solve", "too-fine.yaml"}, 1,
			[]string{"too-fine.yaml:24:7: mesh: the mesh would need at least ", "over the limit of 20000000 triangles", "enlarge mesh.size (now 0.001 mm) at least"}},
		{"target above the iron", []string{"size", "--quick", "--field", "8T", "unreachable-field.yaml"}, 1,
			[]string{"a field of 8 T is out of reach", "the iron is deep in saturation", "enlarge the poles or the yoke, shorten the gap"}},
		{"usage: unknown unit on a flag", []string{"size", "--field", "8 furlongs", "unreachable-field.yaml"}, 2,
			[]string{"usage: polegap size"}},
		// Issue 20: a sliver 1e-7 of the model's size thick ran out of
		// memory in the mesher; the estimate now counts the band of small
		// elements along it and names it.
		{"sliver region", []string{"solve", "sliver.yaml"}, 1,
			[]string{`sliver.yaml:45:5: regions[5]: region "sliver" is a sliver 3e-05 mm thick over 60 mm near`, "far below the mesh size", "over the limit of 20000000 triangles", "set mesh.min-feature (a length above 3e-05 mm)"}},
		{"hair-thin gap", []string{"mesh", "thin-gap.yaml"}, 1,
			[]string{`thin-gap.yaml:45:5: regions[5]: region "yoke" and region "plate" are 3e-05 mm apart over 140 mm near`, "close or widen the gap", "mesh.min-feature"}},
		// Issue 20: both panicked in package searchcoil before the flags
		// were checked where they are parsed (flagcheck.go).
		{"usage: negative search-coil width", []string{"searchcoil", "--turns", "10", "--area", "100mm2", "--at", "0,0", "--width", "-5", "unreachable-field.yaml"}, 2,
			[]string{`polegap searchcoil: invalid value "-5" for flag --width: the length must be at least 0; got -5`, "usage: polegap searchcoil"}},
		{"usage: infinite search-coil turns", []string{"searchcoil", "--turns", "Inf", "--area", "100mm2", "--at", "0,0", "unreachable-field.yaml"}, 2,
			[]string{`polegap searchcoil: invalid value "Inf" for flag --turns: not a finite number`, "usage: polegap searchcoil"}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			args := append([]string(nil), c.args...)
			args[len(args)-1] = filepath.Join(badDir, args[len(args)-1])
			code, out, errs := runCmd(t, args...)
			if code != c.code {
				t.Errorf("%s: exit %d, want %d\nstderr: %s", c.name, code, c.code, errs)
			}
			for _, w := range c.want {
				if !strings.Contains(errs, w) {
					t.Errorf("%s: stderr lacks %q\nstderr: %s", c.name, w, errs)
				}
			}
			if out != "" {
				t.Errorf("%s: a failed run printed a result on stdout:\n%s", c.name, out)
			}
			if strings.Contains(errs, "panic") || strings.Contains(errs, "NaN") {
				t.Errorf("%s: stderr shows a panic or NaN: %s", c.name, errs)
			}
		})
	}
}

// TestBadInputsEveryFileUsed: each model in testdata/bad is in a test, so
// the folder and the catalogue do not drift apart.
func TestBadInputsEveryFileUsed(t *testing.T) {
	used := map[string]bool{
		// models used in TestBadInputs
		"malformed.yaml": true, "wrong-type.yaml": true, "unknown-key.yaml": true, "missing-turns.yaml": true,
		"missing-units.yaml": true, "unknown-unit.yaml": true, "zero-depth.yaml": true, "negative-mesh-size.yaml": true,
		"open-polygon.yaml": true, "self-intersecting.yaml": true, "overlap.yaml": true, "coil-side-missing.yaml": true,
		"coil-side-zero-area.yaml": true, "zero-turns.yaml": true, "bh-empty.yaml": true, "bh-nonmonotone.yaml": true,
		"bh-repeated-h.yaml": true, "bh-file-nonmonotone.yaml": true, "bh-file-bad-row.yaml": true,
		"bh-file-empty.yaml": true, "axisymmetric-negative-r.yaml": true, "too-fine.yaml": true,
		"unreachable-field.yaml": true, "box-cuts-region.yaml": true, "sliver.yaml": true, "thin-gap.yaml": true,
		// TestMinFeature
		"sliver-min-feature.yaml": true,
		// tables read by those models
		"bh-nonmonotone.csv": true, "bh-bad-row.csv": true, "bh-empty.csv": true,
		// TestBadMeasuredCSV
		"measured-bad-number.csv": true, "measured-short-row.csv": true, "measured-negative-sigma.csv": true,
		"measured-misplaced-quote.csv": true,
		// TestBadInputsKnownGaps
		"probe-outside.yaml": true, "probe-beyond-symmetry.yaml": true,
	}
	ents, err := os.ReadDir(badDir)
	if err != nil {
		t.Fatal(err)
	}
	for _, e := range ents {
		if !used[e.Name()] {
			t.Errorf("testdata/bad/%s is in no test", e.Name())
		}
	}
}

// TestBadMeasuredCSV reads measured excitation curves with bad rows
// through the reader `polegap compare` uses: each is refused, naming the
// file and the row ("file:row N:", N the line in the file; the reader
// gives no column).
func TestBadMeasuredCSV(t *testing.T) {
	cases := []struct {
		file string
		want []string
	}{
		{"measured-bad-number.csv", []string{`measured-bad-number.csv:8:4: field_T: "0.28x75" is not a number; write a decimal number`}},
		{"measured-short-row.csv", []string{"measured-short-row.csv:9: has 2 values but the header has 3 columns; give one value per column"}},
		{"measured-negative-sigma.csv", []string{"measured-negative-sigma.csv:10:13: sigma_T: uncertainty -0.002 is negative"}},
		{"measured-misplaced-quote.csv", []string{`measured-misplaced-quote.csv:7:12: extraneous or missing " in a quoted field; quote a whole field`}},
	}
	for _, c := range cases {
		curve, err := measure.Load(filepath.Join(badDir, c.file))
		if err == nil || curve != nil {
			t.Errorf("%s: curve %v, error %v; want an error and no curve", c.file, curve != nil, err)
			continue
		}
		for _, w := range c.want {
			if !strings.Contains(err.Error(), w) {
				t.Errorf("%s: error lacks %q: %v", c.file, w, err)
			}
		}
		t.Logf("%s: %v", c.file, err)
	}
}

// TestBadInputsKnownGaps holds the checks of bad inputs that were once
// let through or reported without a full position (all fixed now): a
// malformed YAML line's column and hint, probes outside the boundary, an
// inline B-H row's position, a measured CSV cell's line:column.
func TestBadInputsKnownGaps(t *testing.T) {
	t.Run("malformed YAML column and fix", func(t *testing.T) {
		_, _, errs := runCmd(t, "solve", filepath.Join(badDir, "malformed.yaml"))
		if !strings.Contains(errs, "malformed.yaml:6:3:") || !strings.Contains(errs, "indent") {
			t.Errorf("stderr: %s", errs)
		}
	})
	for _, f := range []string{"probe-outside.yaml", "probe-beyond-symmetry.yaml"} {
		t.Run(f, func(t *testing.T) {
			code, _, errs := runCmd(t, "solve", filepath.Join(badDir, f))
			if code != 1 || !strings.Contains(errs, ":26:3: probes.p:") || !strings.Contains(errs, "outside the model's outer boundary") {
				t.Errorf("exit %d, stderr: %s", code, errs)
			}
		})
	}
	t.Run("inline B-H row position", func(t *testing.T) {
		_, _, errs := runCmd(t, "solve", filepath.Join(badDir, "bh-nonmonotone.yaml"))
		if !strings.Contains(errs, "bh-nonmonotone.yaml:7:") || strings.Contains(errs, "materials.steel: ") || strings.Count(errs, "B-H table") > 1 {
			t.Errorf("stderr: %s", errs)
		}
	})
	t.Run("measured CSV line:column", func(t *testing.T) {
		_, err := measure.Load(filepath.Join(badDir, "measured-bad-number.csv"))
		if err == nil || !strings.Contains(err.Error(), "measured-bad-number.csv:8:4:") {
			t.Errorf("error: %v", err)
		}
	})
}

// TestNotConvergedCLI: a Newton run cut short by --max-iterations fails
// with exit 1, prints no result and writes none of the files asked for.
func TestNotConvergedCLI(t *testing.T) {
	dir := t.TempDir()
	vtu, png := filepath.Join(dir, "a.vtu"), filepath.Join(dir, "a.png")
	code, out, errs := runCmd(t, "solve", "--max-iterations", "1", "--tol", "1e-14", "--vtu", vtu, "--png", png, "bench-dipole")
	if code != 1 || out != "" || !strings.Contains(errs, "did not converge after 1 iterations") {
		t.Errorf("exit %d, stdout %q, stderr %q; want exit 1, no result and the non-convergence", code, out, errs)
	}
	if ents, _ := os.ReadDir(dir); len(ents) != 0 {
		t.Errorf("a failed solve left files: %v", ents)
	}
	t.Run("residual history", func(t *testing.T) {
		if !strings.Contains(errs, "residual history") || strings.Contains(errs, "Inf") {
			t.Errorf("stderr: %s", errs)
		}
	})
}

// TestFailedWriteLeavesNothing: output files are written through a
// temporary file and a rename (internal/fileout); when the write fails the
// run exits 1 and leaves neither the file nor the temporary behind.
func TestFailedWriteLeavesNothing(t *testing.T) {
	model := filepath.Join(badDir, "unreachable-field.yaml")
	t.Run("missing folder", func(t *testing.T) {
		dir := t.TempDir()
		target := filepath.Join(dir, "no-such-dir", "x.vtu")
		code, _, errs := runCmd(t, "solve", "--quick", "--vtu", target, model)
		if code != 1 || !strings.Contains(errs, "writing "+target) {
			t.Errorf("exit %d, stderr %q", code, errs)
		}
		if ents, _ := os.ReadDir(dir); len(ents) != 0 {
			t.Errorf("left behind: %v", ents)
		}
	})
	t.Run("rename fails", func(t *testing.T) {
		// A folder where the file should go: the temporary file is written
		// in full, then the rename fails.
		dir := t.TempDir()
		target := filepath.Join(dir, "x.vtu")
		if err := os.Mkdir(target, 0o755); err != nil {
			t.Fatal(err)
		}
		code, _, errs := runCmd(t, "solve", "--quick", "--vtu", target, model)
		if code != 1 || !strings.Contains(errs, "writing "+target) {
			t.Errorf("exit %d, stderr %q", code, errs)
		}
		ents, _ := os.ReadDir(dir)
		if len(ents) != 1 || ents[0].Name() != "x.vtu" || !ents[0].IsDir() {
			t.Errorf("left behind: %v", ents)
		}
	})
}

// TestMinFeature: with mesh.min-feature the sliver of sliver.yaml is
// dropped with a located note, and the model solves (issue 20).
func TestMinFeature(t *testing.T) {
	code, out, errs := runCmd(t, "mesh", filepath.Join(badDir, "sliver-min-feature.yaml"))
	if code != 0 || !strings.Contains(errs, `note: `) || !strings.Contains(errs, `sliver-min-feature.yaml:45:5: regions[5]: region "sliver" (3e-05 mm wide) dropped: thinner than mesh.min-feature (0.01 mm)`) {
		t.Errorf("exit %d, stderr %q", code, errs)
	}
	if !strings.Contains(out, "triangles") || strings.Contains(out, "\nsliver ") {
		t.Errorf("the mesh should be made without the sliver:\n%s", out)
	}
}
