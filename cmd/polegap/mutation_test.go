package main

import (
	"fmt"
	"math/rand/v2"
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
	"time"
	"unicode/utf16"

	"polegap/models"
)

// The mutation attack (issue 20): seeded, deterministic mutants of the
// embedded examples, each run through `polegap mesh --vtu` and some
// through `polegap solve --quick --vtu`. For every mutant:
//
//   - no panic (a panic fails the test binary) and no hang: each run
//     returns within mutantBudget (its --time-limit is set below that);
//   - a run that succeeds prints no NaN or Inf and writes a whole .vtu;
//   - a run that fails exits non-zero with a message that names the model
//     file, and leaves neither the .vtu nor a temporary of it behind.
//
// The counts are logged (go test -run TestMutants -v) and recorded in
// BAD-INPUT.md. -short runs the first mutantsShort mutants (CI).
const (
	mutantSeed   = 20
	mutantsFull  = 300
	mutantsShort = 40
	// mutantBudget is the wall time one run may take before it counts as
	// a hang; its --time-limit is a little less.
	mutantBudget = 60 * time.Second
)

// mutantNumbers replace a number of the model text.
var mutantNumbers = []string{".nan", ".inf", "-.inf", "1e308", "-1e308", "0", "-1", "1e-30", "1e9", "1e14", "-0", "0x10", "1e-300", "2e9"}

// mutate returns the mutant k of src (an example's text), and its recipe.
func mutate(r *rand.Rand, src string) (string, string) {
	lines := strings.Split(src, "\n")
	pick := func() int { return r.IntN(len(lines)) }
	number := regexp.MustCompile(`-?\d+(\.\d+)?(e-?\d+)?`)
	switch op := r.IntN(12); op {
	case 0: // delete a line (a key, a vertex, a material)
		i := pick()
		return strings.Join(append(lines[:i:i], lines[i+1:]...), "\n"), fmt.Sprintf("delete line %d", i+1)
	case 1, 2, 3: // replace one number by an extreme one
		for range 20 {
			i := pick()
			locs := number.FindAllStringIndex(lines[i], -1)
			if len(locs) == 0 || strings.HasPrefix(strings.TrimSpace(lines[i]), "#") {
				continue
			}
			l := locs[r.IntN(len(locs))]
			v := mutantNumbers[r.IntN(len(mutantNumbers))]
			lines[i] = lines[i][:l[0]] + v + lines[i][l[1]:]
			return strings.Join(lines, "\n"), fmt.Sprintf("line %d: number -> %s", i+1, v)
		}
	case 4: // rename a key
		for range 20 {
			i := pick()
			if k, rest, ok := strings.Cut(lines[i], ":"); ok && !strings.HasPrefix(strings.TrimSpace(k), "#") && strings.TrimSpace(k) != "" {
				lines[i] = k + "x:" + rest
				return strings.Join(lines, "\n"), fmt.Sprintf("line %d: key renamed", i+1)
			}
		}
	case 5: // retype a value: a number becomes a word or a list
		for range 20 {
			i := pick()
			if k, rest, ok := strings.Cut(lines[i], ": "); ok && number.MatchString(rest) && !strings.Contains(k, "#") {
				v := []string{"deep", "[1, 2]", "{a: 1}", "''", "~"}[r.IntN(5)]
				lines[i] = k + ": " + v
				return strings.Join(lines, "\n"), fmt.Sprintf("line %d: value -> %s", i+1, v)
			}
		}
	case 6: // truncate
		n := r.IntN(len(src))
		return src[:n], fmt.Sprintf("truncated at byte %d", n)
	case 7: // encodings
		switch r.IntN(3) {
		case 0:
			return "\ufeff" + src, "BOM"
		case 1:
			return strings.ReplaceAll(src, "\n", "\r"), "CR line ends"
		}
		u := utf16.Encode([]rune(src))
		b := make([]byte, 2+2*len(u))
		b[0], b[1] = 0xff, 0xfe
		for i, c := range u {
			b[2+2*i], b[3+2*i] = byte(c), byte(c>>8)
		}
		return string(b), "UTF-16"
	case 8: // duplicate a line
		i := pick()
		return strings.Join(append(lines[:i+1:i+1], lines[i:]...), "\n"), fmt.Sprintf("line %d duplicated", i+1)
	case 9: // an extra region: a sliver, a thin gap, a tiny or an overlapping one
		t := []float64{1e-7, 1e-5, 1e-3, 0}[r.IntN(4)]
		x0 := []float64{-1e4, 0, 50, 130}[r.IntN(4)]
		reg := fmt.Sprintf("  - {name: extra, material: copper, polygon: [[%g, 0], [%g, 0], [%g, %g], [%g, %g]]}\n", x0, x0+60, x0+60, t*300, x0, t*300)
		if i := strings.Index(src, "\nregions:\n"); i >= 0 {
			return src[:i+10] + reg + src[i+10:], fmt.Sprintf("extra region %g thick at x = %g", t*300, x0)
		}
	case 10: // a YAML alias bomb
		bomb := "bomb: &a [x, x, x, x, x, x, x, x, x]\nb1: &b [*a, *a, *a, *a, *a, *a, *a, *a, *a]\nb2: &c [*b, *b, *b, *b, *b, *b, *b, *b, *b]\nb3: &d [*c, *c, *c, *c, *c, *c, *c, *c, *c]\nb4: [*d, *d, *d, *d, *d, *d, *d, *d, *d]\n"
		return bomb + src, "alias bomb"
	case 11: // swap two vertices of a polygon line (self-crossing)
		for range 20 {
			i := pick()
			if strings.Contains(lines[i], "polygon: [[") {
				a, b, ok := strings.Cut(lines[i], "[[")
				if !ok {
					continue
				}
				pts := strings.Split(b, "], [")
				if len(pts) < 4 {
					continue
				}
				pts[0], pts[1] = pts[1], pts[0]
				if strings.Contains(pts[0], "]]") || strings.Contains(pts[1], "]]") {
					continue
				}
				lines[i] = a + "[[" + strings.Join(pts, "], [")
				return strings.Join(lines, "\n"), fmt.Sprintf("line %d: vertices swapped", i+1)
			}
		}
	}
	i := pick()
	return strings.Join(append(lines[:i:i], lines[i+1:]...), "\n"), fmt.Sprintf("delete line %d", i+1)
}

var nanInf = regexp.MustCompile(`\bNaN\b|\b[+-]?Inf\b`)

// TestMutants runs the mutation attack (see above).
func TestMutants(t *testing.T) {
	n := mutantsFull
	if testing.Short() {
		n = mutantsShort
	}
	names := models.Examples()
	srcs := make([]string, len(names))
	for i, name := range names {
		b, err := models.Example(name)
		if err != nil {
			t.Fatal(err)
		}
		srcs[i] = string(b)
	}
	r := rand.New(rand.NewPCG(mutantSeed, 1))
	dir := t.TempDir()
	var tried, refused, solved, located, fileOnly int
	for k := range n {
		e := r.IntN(len(srcs))
		text, recipe := mutate(r, srcs[e])
		name := fmt.Sprintf("m%03d-%s.yaml", k, names[e])
		path := filepath.Join(dir, name)
		if err := os.WriteFile(path, []byte(text), 0o644); err != nil {
			t.Fatal(err)
		}
		vtu := filepath.Join(dir, fmt.Sprintf("m%03d.vtu", k))
		args := []string{"mesh", "--time-limit", "50s", "--vtu", vtu, path}
		if k%5 == 4 {
			args = []string{"solve", "--quick", "--time-limit", "50s", "--vtu", vtu, path}
		}
		what := fmt.Sprintf("mutant %d (%s, %s; polegap %s)", k, names[e], recipe, args[0])
		type outcome struct {
			code     int
			out, err string
		}
		done := make(chan outcome, 1)
		go func() {
			c, o, se := runCmd(t, args...)
			done <- outcome{c, o, se}
		}()
		var oc outcome
		select {
		case oc = <-done:
		case <-time.After(mutantBudget):
			t.Fatalf("%s: no answer after %v (a hang)", what, mutantBudget)
		}
		tried++
		if nanInf.MatchString(oc.out) {
			t.Errorf("%s: NaN or Inf in the output:\n%s", what, oc.out)
		}
		if strings.Contains(oc.err, "panic") || strings.Contains(oc.err, "goroutine ") {
			t.Errorf("%s: %s", what, oc.err)
		}
		left, _ := filepath.Glob(filepath.Join(dir, fmt.Sprintf(".m%03d.vtu.tmp-*", k)))
		if len(left) > 0 {
			t.Errorf("%s: a temporary file is left: %v", what, left)
		}
		b, statErr := os.ReadFile(vtu)
		if oc.code == 0 {
			solved++
			if statErr != nil || !strings.HasSuffix(strings.TrimSpace(string(b)), "</VTKFile>") {
				t.Errorf("%s: succeeded without a whole .vtu (%v)", what, statErr)
			}
			continue
		}
		refused++
		if statErr == nil {
			t.Errorf("%s: exit %d but %s was written", what, oc.code, vtu)
		}
		switch {
		case regexp.MustCompile(regexp.QuoteMeta(name) + `:\d+(:\d+)?`).MatchString(oc.err):
			located++
		case strings.Contains(oc.err, name):
			fileOnly++
			t.Logf("%s: refused naming the file only: %s", what, strings.SplitN(oc.err, "\n", 2)[0])
		default:
			t.Errorf("%s: exit %d with a message that names no file:\n%s", what, oc.code, oc.err)
		}
	}
	t.Logf("mutants tried %d: refused %d (located file:line %d, naming the file only %d), solved %d; panics, hangs and NaN/Inf outputs 0 unless reported above",
		tried, refused, located, fileOnly, solved)
}
