package coil

import (
	"bytes"
	"encoding/csv"
	"flag"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "rewrite the golden files in testdata")

// golden compares got with testdata/name; with -update it rewrites the
// file, and on a mismatch it writes got beside it as name.actual.
func golden(t *testing.T, name string, got []byte) {
	t.Helper()
	path := filepath.Join("testdata", name)
	if *update {
		if err := os.WriteFile(path, got, 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run go test -update to create it)", err)
	}
	if !bytes.Equal(got, want) {
		os.WriteFile(path+".actual", got, 0o644)
		t.Errorf("%s differs from the golden file; see %s.actual (go test -update to accept)", name, path)
	}
}

func benchOptions() []Option {
	s := bench()
	s.Cooling = Water
	s.SupplyVoltage = 200
	s.SupplyCurrent = 300
	ws := IECWires(R20, Grade2)
	ws = append(ws[len(ws)-6:], HollowWires()[4:]...)
	return Options(s, ws)
}

func TestWriteTableGolden(t *testing.T) {
	var b bytes.Buffer
	if err := WriteTable(&b, benchOptions()); err != nil {
		t.Fatal(err)
	}
	golden(t, "bench_table.txt", b.Bytes())
}

func TestWriteCSV(t *testing.T) {
	opts := benchOptions()
	var b bytes.Buffer
	if err := WriteCSV(&b, opts); err != nil {
		t.Fatal(err)
	}
	golden(t, "bench.csv", b.Bytes())
	// Round trip: the CSV parses, every row has the header's width, and
	// the numbers read back exactly (full-precision formatting).
	recs, err := csv.NewReader(bytes.NewReader(b.Bytes())).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	if len(recs) != len(opts)+1 {
		t.Fatalf("%d records, want %d", len(recs), len(opts)+1)
	}
	col := map[string]int{}
	for i, h := range recs[0] {
		col[h] = i
	}
	for i, o := range opts {
		r := recs[i+1]
		p, err := strconv.ParseFloat(r[col["power_W"]], 64)
		if err != nil || p != o.Power {
			t.Errorf("row %d: power %q, want %v", i, r[col["power_W"]], o.Power)
		}
		if n, _ := strconv.Atoi(r[col["turns"]]); n != o.Turns {
			t.Errorf("row %d: turns %q, want %d", i, r[col["turns"]], o.Turns)
		}
	}
	for _, h := range recs[0][2:] {
		if h != "turns" && h != "max_turns" && h != "copper_fill" && h != "reynolds" && h != "limits" && !strings.Contains(h, "_") {
			t.Errorf("column %q names no unit", h)
		}
	}
}

func TestCautions(t *testing.T) {
	// DESIGN.md "Cautions the tool shows": injury, high voltage at
	// switch-off, attraction of steel, heating, disconnect, codes.
	all := strings.ToLower(strings.Join(Cautions(), " "))
	for _, w := range []string{"injure", "high voltage", "free-wheeling", "dump resistor", "attract", "heat", "disconnect", "discharge", "electrical codes", "licensed"} {
		if !strings.Contains(all, w) {
			t.Errorf("cautions do not mention %q", w)
		}
	}
	c := Cautions()
	c[0] = "changed"
	if Cautions()[0] == "changed" {
		t.Error("Cautions returns shared storage")
	}
}
