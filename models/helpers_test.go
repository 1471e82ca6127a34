package models

import (
	"errors"
	"strings"
	"testing"
)

// base is a small valid planar model; the error tests edit copies of it.
const base = `name: t
units: mm
depth: 100
materials:
  steel: {mu-r: 1000}
regions:
  - name: core
    material: steel
    polygon: [[0, 0], [100, 0], [100, 20], [0, 20]]
  - name: coil-a
    material: copper
    polygon: [[0, 30], [40, 30], [40, 50], [0, 50]]
coils:
  - name: main
    turns: 100
    current: 2
    sides: [{region: coil-a, sense: +1}]
probes:
  p: {point: [50, 60]}
target: {probe: p, field: 0.5}
`

// edit returns base with old replaced by new (exactly once).
func edit(t *testing.T, old, new string) string {
	t.Helper()
	if strings.Count(base, old) != 1 {
		t.Fatalf("edit: %q occurs %d times in base", old, strings.Count(base, old))
	}
	return strings.Replace(base, old, new, 1)
}

// errCase is one bad input and the error it must produce.
type errCase struct {
	name string
	src  string
	want string // one entry of the ErrorList, exactly
}

// runErrCases parses each case and looks for the wanted message among the
// errors. Every error must carry a position (line > 0) except a missing
// whole-file value, and Parse must return a nil model.
func runErrCases(t *testing.T, cases []errCase) {
	t.Helper()
	for _, c := range cases {
		m, err := Parse("m.yaml", []byte(c.src))
		if err == nil {
			t.Errorf("%s: no error, want %q", c.name, c.want)
			continue
		}
		if m != nil {
			t.Errorf("%s: non-nil model with an error", c.name)
		}
		var list ErrorList
		if !errors.As(err, &list) {
			t.Errorf("%s: error %T is not an ErrorList", c.name, err)
			continue
		}
		found := false
		for _, e := range list {
			if e.Error() == c.want {
				found = true
			}
		}
		if !found {
			t.Errorf("%s:\n got: %s\nwant: %s", c.name, strings.ReplaceAll(err.Error(), "\n", "\n      "), c.want)
		}
	}
}

// mustParse parses src and checks the model's invariants.
func mustParse(t *testing.T, name, src string) *Model {
	t.Helper()
	m, err := Parse(name+".yaml", []byte(src))
	if err != nil {
		t.Fatalf("%s: %v", name, err)
	}
	if err := m.Check(); err != nil {
		t.Fatalf("%s: Check: %v", name, err)
	}
	return m
}

func TestBaseIsValid(t *testing.T) {
	m := mustParse(t, "base", base)
	if len(m.Regions) != 2 || len(m.Coils) != 1 || m.Target == nil {
		t.Errorf("base: %d regions, %d coils, target %v", len(m.Regions), len(m.Coils), m.Target)
	}
}

func countOf(s, sub string) int             { return strings.Count(s, sub) }
func replaceOnce(s, old, new string) string { return strings.Replace(s, old, new, 1) }
