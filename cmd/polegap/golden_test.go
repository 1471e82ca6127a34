package main

import (
	"flag"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
)

// The golden files in testdata/golden pin polegap's public output: the
// text, --json and CSV that solve, check, size and sweep print or write
// for the embedded bench-dipole model. They guard refactors of the
// command line and of the libraries behind it: an intended change of the
// output is accepted with
//
//	go test ./cmd/polegap -run TestGolden -update
//
// and reviewed in the diff of testdata/golden.
//
// Canonical form. Before comparing (and before writing with -update) the
// output is masked so that nothing machine-dependent reaches a golden:
//
//   - timings: every number on the solve summary's "time" line becomes
//     <time>, and every value inside a JSON "time_s" object becomes
//     "<time>" (so the golden JSON stays valid JSON);
//   - paths: the test's temporary folder becomes $TMP.
//
// No other output depends on the machine: polegap prints no version, host
// or date. Model paths are those of the embedded examples.
//
// Numbers. The same build on the same machine prints the same bytes, but
// GOMAXPROCS 1 and 2 sum the Cholesky updates in another order
// (solver/sparse doc.go, Concurrency; post/study/determinism_test.go), so
// the last digits of full-precision numbers move by about 1e-15 relative,
// and the final Newton residual, which is round-off, by up to 3 %
// (measured: 1.1758e-12 against 1.2063e-12). The comparison therefore
// splits both texts into numbers and the text between them; the text must
// match exactly (runs of spaces count as one, since a column's padding
// follows the width of its number) and two numbers a, b match when
//
//	|a-b| <= 1e-9·max(|a|,|b|) + 1e-12
//
// or when they differ by exactly one unit in the last printed digit (a
// rounding flip of a short printed number; the same quantity is pinned
// at full precision in the JSON golden). 1e-9 relative is far above the
// 1e-15 noise and far below any change of the physics; the absolute
// 1e-12 (in the SI unit printed: T, A, J, m) covers the Newton residuals
// (1e-10 to 1e-12) and components that cancel to round-off (Bx on the
// mid-plane of a symmetric gap, 2.6e-7 T moving by 1.4e-14 T).
var update = flag.Bool("update", false, "rewrite the golden files in testdata/golden")

const goldenDir = "testdata/golden"

// goldenCase is one command line whose output is pinned. In args, $TMP
// names the test's temporary folder; every file the command writes there
// is compared with the golden name.FILE.
type goldenCase struct {
	name string
	args []string
	code int // expected exit status
}

var goldenCases = []goldenCase{
	{"solve", []string{"solve", "bench-dipole"}, 0},
	{"solve-json", []string{"solve", "--json", "bench-dipole"}, 0},
	{"solve-accuracy", []string{"solve", "--accuracy", "1e-3", "bench-dipole"}, 0},
	{"check", []string{"check", "bench-dipole"}, 0},
	{"check-json", []string{"check", "--json", "bench-dipole"}, 0},
	{"check-fail", []string{"check", "--saturation-limit", "1.7T", "--tolerance", "1e-4", "--half-width", "30mm", "bench-dipole"}, 1},
	{"size", []string{"size", "--csv", "$TMP/windings.csv", "bench-dipole"}, exitNoWinding},
	{"size-json", []string{"size", "--json", "--field", "800mT", "--cooling", "water", "--supply-voltage", "60V", "--supply-current", "50A", "--csv", "$TMP/windings.csv", "bench-dipole"}, exitNoWinding},
	{"size-water", []string{"size", "--cooling", "water", "--discharge-resistor", "0.5ohm", "bench-dipole"}, 0},
	{"sweep", []string{"sweep", "--points", "4", "--csv", "$TMP/curve.csv", "bench-dipole"}, 0},
	{"sweep-currents", []string{"sweep", "--currents", "20A,60A,0.1kA", "--gap", "40mm", "bench-dipole"}, 0},
	{"sweep-range", []string{"sweep", "--from", "30", "--to", "120A", "--points", "3", "bench-dipole"}, 0},
}

// TestGolden runs each case and compares its standard output, its
// standard error (when not empty) and the files it writes with the golden
// files, in the canonical form described above.
func TestGolden(t *testing.T) {
	for _, c := range goldenCases {
		t.Run(c.name, func(t *testing.T) {
			tmp := t.TempDir()
			args := make([]string, len(c.args))
			for i, a := range c.args {
				args[i] = strings.ReplaceAll(a, "$TMP", tmp)
			}
			code, out, errs := runCmd(t, args...)
			if code != c.code {
				t.Fatalf("%s: exit %d, want %d\nstderr: %s", c.name, code, c.code, errs)
			}
			ext := ".txt"
			if strings.HasPrefix(out, "{") {
				ext = ".json"
			} else if strings.HasPrefix(out, "# polegap") {
				ext = ".csv"
			}
			checkGolden(t, c.name+ext, canonical(out, tmp))
			if errs != "" || exists(filepath.Join(goldenDir, c.name+".stderr")) {
				checkGolden(t, c.name+".stderr", canonical(errs, tmp))
			}
			ents, err := os.ReadDir(tmp)
			if err != nil {
				t.Fatal(err)
			}
			for _, e := range ents {
				data, err := os.ReadFile(filepath.Join(tmp, e.Name()))
				if err != nil {
					t.Fatal(err)
				}
				checkGolden(t, c.name+"."+e.Name(), canonical(string(data), tmp))
			}
		})
	}
}

func exists(path string) bool {
	_, err := os.Stat(path)
	return err == nil
}

var (
	timeLine = regexp.MustCompile(`(?m)^time .*$`)
	timeJSON = regexp.MustCompile(`"time_s": \{[^}]*\}`)
	number   = regexp.MustCompile(`[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?`)
	jsonTime = regexp.MustCompile(`(?m)(^\s*"[^"]+": )[-+0-9.eE]+`)
)

// canonical masks the machine-dependent parts of an output (see the
// comment on update).
func canonical(s, tmp string) string {
	s = strings.ReplaceAll(s, tmp, "$TMP")
	s = timeLine.ReplaceAllStringFunc(s, func(line string) string {
		return number.ReplaceAllString(line, "<time>")
	})
	return timeJSON.ReplaceAllStringFunc(s, func(obj string) string {
		return jsonTime.ReplaceAllString(obj, `$1"<time>"`)
	})
}

// checkGolden compares got with testdata/golden/name; with -update it
// rewrites the file. On a mismatch it writes got beside the golden as
// name.actual and reports the first differences.
func checkGolden(t *testing.T, name, got string) {
	t.Helper()
	path := filepath.Join(goldenDir, name)
	if *update {
		if err := os.MkdirAll(goldenDir, 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(path, []byte(got), 0o644); err != nil {
			t.Fatal(err)
		}
		os.Remove(path + ".actual")
		return
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run go test ./cmd/polegap -run TestGolden -update to create it)", err)
	}
	if msg := compareOutput(string(want), got); msg != "" {
		os.WriteFile(path+".actual", []byte(got), 0o644)
		t.Errorf("%s differs from the golden file (see %s.actual; go test -run TestGolden -update accepts it):\n%s", name, path, msg)
		return
	}
	os.Remove(path + ".actual")
}

// A token is a number or the text between two numbers, with its line.
type token struct {
	text   string
	number bool
	line   int
}

func tokenize(s string) []token {
	var toks []token
	line, last := 1, 0
	add := func(text string, num bool) {
		if text != "" {
			toks = append(toks, token{text, num, line})
		}
		line += strings.Count(text, "\n")
	}
	for _, loc := range number.FindAllStringIndex(s, -1) {
		add(s[last:loc[0]], false)
		add(s[loc[0]:loc[1]], true)
		last = loc[1]
	}
	add(s[last:], false)
	return toks
}

var spaces = regexp.MustCompile(` +`)

// compareOutput compares two outputs token by token (see the comment on
// update for the rule) and returns "" when they match, or a description
// of the first difference with the lines around it.
func compareOutput(want, got string) string {
	w, g := tokenize(want), tokenize(got)
	for i := 0; i < len(w) || i < len(g); i++ {
		if i >= len(w) || i >= len(g) {
			line := 1
			if i < len(w) {
				line = w[i].line
			} else if i < len(g) {
				line = g[i].line
			}
			return excerpt(want, got, line, "one output is longer")
		}
		a, b := w[i], g[i]
		switch {
		case a.number != b.number:
		case !a.number && spaces.ReplaceAllString(a.text, " ") == spaces.ReplaceAllString(b.text, " "):
			continue
		case a.number && numbersMatch(a.text, b.text):
			continue
		}
		return excerpt(want, got, a.line, fmt.Sprintf("golden %q, actual %q", a.text, b.text))
	}
	return ""
}

// numbersMatch reports whether two printed numbers agree within 1e-9
// relative plus 1e-12 absolute, or differ by one unit in the last digit.
func numbersMatch(a, b string) bool {
	if a == b {
		return true
	}
	x, err1 := strconv.ParseFloat(a, 64)
	y, err2 := strconv.ParseFloat(b, 64)
	if err1 != nil || err2 != nil {
		return false
	}
	d := math.Abs(x - y)
	if d <= 1e-9*math.Max(math.Abs(x), math.Abs(y))+1e-12 {
		return true
	}
	u := math.Max(lastUnit(a), lastUnit(b))
	return d <= u*(1+1e-9)
}

// lastUnit is the value of one unit in the last printed digit of s:
// 0.01 for "1.69", 1e-13 for "4.50e-11", 1 for "32000".
func lastUnit(s string) float64 {
	mant, exp := s, 0
	if i := strings.IndexAny(s, "eE"); i >= 0 {
		mant = s[:i]
		exp, _ = strconv.Atoi(s[i+1:])
	}
	decimals := 0
	if i := strings.IndexByte(mant, '.'); i >= 0 {
		decimals = len(mant) - i - 1
	}
	return math.Pow(10, float64(exp-decimals))
}

// excerpt shows the lines around line in both outputs.
func excerpt(want, got string, line int, what string) string {
	var b strings.Builder
	fmt.Fprintf(&b, "line %d: %s\n", line, what)
	for _, side := range []struct {
		name, text string
	}{{"golden", want}, {"actual", got}} {
		lines := strings.Split(side.text, "\n")
		fmt.Fprintf(&b, "--- %s\n", side.name)
		for i := max(line-3, 1); i <= min(line+2, len(lines)); i++ {
			mark := " "
			if i == line {
				mark = ">"
			}
			fmt.Fprintf(&b, "%s%4d  %s\n", mark, i, lines[i-1])
		}
	}
	return b.String()
}

// TestCompareOutput pins the comparison rule of the golden files, so that
// a loosened rule shows up here.
func TestCompareOutput(t *testing.T) {
	cases := []struct {
		name, want, got string
		match           bool
	}{
		{"same", "B 0.96990 T\n", "B 0.96990 T\n", true},
		{"1e-15 relative", `"b": 0.9699046300084571`, `"b": 0.9699046300084560`, true},
		{"1e-8 relative", `"b": 0.9699046300084571`, `"b": 0.9699046400084571`, false},
		{"round-off residual", "residual 1.175820609e-12", "residual 1.206309941e-12", true},
		{"rounding flip", "mean 0.95860 T", "mean 0.95861 T", true},
		{"two units", "mean 0.95860 T", "mean 0.95862 T", false},
		{"padding", "x   1.69 T", "x  1.691 T", true},
		{"text", "PASS 1.7 T", "FAIL 1.7 T", false},
		{"longer", "a 1\n", "a 1\nb 2\n", false},
		{"number for text", "a 1 b", "a x b", false},
	}
	for _, c := range cases {
		msg := compareOutput(c.want, c.got)
		if (msg == "") != c.match {
			t.Errorf("%s: match %v, want %v (%s)", c.name, msg == "", c.match, msg)
		}
	}
}
