package measure_test

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"polegap/post/measure"
)

const directFile = `format: polegap-measured/1
magnet: test-magnet
date: 2026-11-20
method: direct
probe: {sigma: 0.002, scale-sigma: 0.001}
readings:
  - {current: 10, field: 0.100}
  - {current: 20, field: [0.199, 0.201]}
`

func TestParseDirect(t *testing.T) {
	c, err := measure.Parse("probe.yaml", []byte(directFile))
	if err != nil {
		t.Fatal(err)
	}
	if err := c.Check(); err != nil {
		t.Fatal(err)
	}
	if c.Name != "test-magnet" || c.Meta["method"] != "direct" || c.Meta["date"] != "2026-11-20" || c.Kind != measure.Field {
		t.Errorf("name %q, meta %v, kind %v", c.Name, c.Meta, c.Kind)
	}
	p := c.Points[1]
	if p.Current != 20 || p.Field != 0.2 || p.Row != 8 {
		t.Errorf("second point %+v, want 20 A, 0.2 T, row 8", p)
	}
	// Detection by content when the name has no extension.
	if _, err := measure.Parse("stdin", []byte("# a lab file\n"+directFile)); err != nil {
		t.Errorf("sniffed YAML: %v", err)
	}
	if c, err := measure.Parse("stdin", []byte("I (A),B (T)\n1,0.1\n2,0.2\n")); err != nil || len(c.Points) != 2 {
		t.Errorf("sniffed CSV: %v", err)
	}
}

// TestParseErrors checks file:line and field path for each kind of bad
// file.
func TestParseErrors(t *testing.T) {
	balance := `format: polegap-measured/1
method: current-balance
balance: {length: 0.05}
readings:
  - current: 10
    balance: [[0, 0.001], [1, 0.002], [2, 0.003], [3, 0.004]]
  - current: 20
    balance: [[0, 0.001], [1, 0.003], [2, 0.002], [3, 0.007]]
`
	for _, tc := range []struct {
		name, data string
		want       []string // in order: each in one error message
	}{
		{"syntax", "format: [\n", []string{"bad.yaml:"}},
		{"unknown key", strings.Replace(directFile, "probe:", "prob:", 1), []string{"bad.yaml:5: unknown key \"prob\""}},
		{"bad number", strings.Replace(directFile, "0.100", "abc", 1), []string{"bad.yaml:7:", "abc"}},
		{"wrong format", strings.Replace(directFile, "polegap-measured/1", "other", 1), []string{"bad.yaml:1:9: format: format is \"other\""}},
		{"unknown method", strings.Replace(directFile, "method: direct", "method: guess", 1), []string{"bad.yaml:4:9: method: method \"guess\""}},
		{"foreign section", directFile + "balance: {length: 0.05}\n", []string{"section balance does not belong to method direct"}},
		{"foreign readings", directFile + "  - {current: 30, flux: 0.3}\n", []string{"bad.yaml:9:25: readings[2].flux: method direct takes field readings"}},
		{"repeated current", directFile + "  - {current: 20, field: 0.3}\n", []string{"bad.yaml:9:15: readings[2].current: current 20 A repeats readings[1]"}},
		{"no current", directFile + "  - {field: 0.3}\n", []string{"bad.yaml:9:5: readings[2]: no current"}},
		{"too few readings", strings.Split(directFile, "  - {current: 20")[0], []string{"readings: 1 readings"}},
		{"non-monotone balance", balance, []string{"bad.yaml:8:39: readings[1].balance[2]: at 20 A: current-balance reading 3: balance readings are not monotone"}},
		{"bad pair", strings.Replace(balance, "[3, 0.004]", "[3]", 1), []string{"readings[0].balance[3]: has 1 numbers"}},
		{"no length", strings.Replace(balance, "{length: 0.05}", "{g: 9.81}", 1), []string{"bad.yaml:3:10: balance: current-balance: conductor length 0 m"}},
		{"bad fit", strings.Replace(balance, "{length: 0.05}", "{length: 0.05, fit: cubic}", 1), []string{"balance.fit: fit \"cubic\""}},
		{"null mass", strings.Replace(balance, "[1, 0.002]", "[1, ~]", 1), []string{"bad.yaml:6:31: readings[0].balance[1]: is empty; give [conductor current A, mass kg]"}},
		{"null field", strings.Replace(directFile, "0.100", "~", 1), []string{"bad.yaml:7:5: readings[0]: no field readings"}},
		{"null repeat", strings.Replace(directFile, "0.199", "~", 1), []string{"bad.yaml:8: reading 1 is empty"}},
		{"search without coil", "format: polegap-measured/1\nmethod: search-coil\nintegrator: {gain: 1}\nreadings: [{current: 1, flux: 1}, {current: 2, flux: 2}]\n", []string{"needs a calibration section or a coil section"}},
		{"search one pull", "format: polegap-measured/1\nmethod: search-coil\nintegrator: {gain: 1}\ncoil: {turns: 10, area: 1e-4}\nreadings: [{current: 1, flux: 1}, {current: 2, flux: 2}]\n", []string{"readings[0].flux: at 1 A: search-coil: one reading", "readings[1].flux"}},
	} {
		_, err := measure.Parse("bad.yaml", []byte(tc.data))
		if err == nil {
			t.Errorf("%s: no error", tc.name)
			continue
		}
		msg := err.Error()
		at := 0
		for _, w := range tc.want {
			i := strings.Index(msg[at:], w)
			if i < 0 {
				t.Errorf("%s: error\n%s\nlacks %q", tc.name, msg, w)
				break
			}
			at += i + len(w)
		}
	}
	// The reduction error stays reachable.
	_, err := measure.Parse("bad.yaml", []byte(balance))
	var re *measure.ReadingsError
	if !errors.As(err, &re) || re.Index != 2 {
		t.Errorf("errors.As ReadingsError: %v", err)
	}
}

func TestLoad(t *testing.T) {
	if _, err := measure.Load(filepath.Join(t.TempDir(), "missing.csv")); err == nil || !strings.Contains(err.Error(), "cannot read") {
		t.Errorf("missing file: %v", err)
	}
	path := filepath.Join(t.TempDir(), "m.yaml")
	if err := os.WriteFile(path, []byte(directFile), 0o644); err != nil {
		t.Fatal(err)
	}
	if c, err := measure.Load(path); err != nil || len(c.Points) != 2 {
		t.Errorf("Load: %v", err)
	}
}
