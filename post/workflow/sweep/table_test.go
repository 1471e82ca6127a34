package sweep

import (
	"strings"
	"testing"
)

// TestReadCSVErrors: a table that is not WriteCSV's, or a bad row, is an
// error naming the file and the row's line.
func TestReadCSVErrors(t *testing.T) {
	// A table of the earlier 12-column form (no estimates) still reads.
	head := "# polegap excitation curve\n# model: m\n# probe: p\n" + strings.Join(oldColumns, ",") + "\n"
	good := "0,1,100,0.1,0.99,0.3,1.5,0,0,0,3,1e-10\n"
	for _, tc := range []struct{ name, data, want string }{
		{"empty", "", "t.csv: not an excitation-curve table"},
		{"other header", "# model: m\nH,B\n0,0\n", "t.csv: not an excitation-curve table"},
		{"short row", head + good + "1,2,200\n", "t.csv:6: the row has 3 columns, want 12"},
		{"bad number", head + good + "\n1,2,200,x,0.99,0.3,1.5,0,0,0,3,1e-10\n", "t.csv:7: strconv.ParseFloat: parsing \"x\""},
		{"bad index", head + "one,1,100,0.1,0.99,0.3,1.5,0,0,0,3,1e-10\n", "t.csv:5: strconv.Atoi"},
		{"bad quote", head + "0,\"1\"x,100,0.1,0.99,0.3,1.5,0,0,0,3,1e-10\n", "t.csv:5:5: extraneous or missing \""},
	} {
		_, _, err := ReadCSV(strings.NewReader(tc.data), "t.csv")
		if err == nil || !strings.HasPrefix(err.Error(), tc.want) {
			t.Errorf("%s: error %v, want prefix %q", tc.name, err, tc.want)
		}
	}
	// Comments, blank lines and CRLF are the dialect's.
	meta, pts, err := ReadCSV(strings.NewReader(strings.ReplaceAll(head+"\n"+good+"# done\n", "\n", "\r\n")), "t.csv")
	if err != nil || len(pts) != 1 || pts[0].Current != 1 || meta.Model != "m" || meta.Probe != "p" {
		t.Errorf("got %+v %+v %v; want model m, probe p, one point at 1 A", meta, pts, err)
	}
}

// TestCSVEstimates: the estimate columns round-trip.
func TestCSVEstimates(t *testing.T) {
	in := []Point{{Index: 0, Current: 1, Field: 0.5, FieldEstimate: 2e-4, EnergyEstimate: 0.3, LinkageEstimate: 1e-3}}
	var b strings.Builder
	if err := WriteCSV(&b, Meta{Model: "m", Probe: "p"}, in); err != nil {
		t.Fatal(err)
	}
	_, out, err := ReadCSV(strings.NewReader(b.String()), "t.csv")
	if err != nil || len(out) != 1 || out[0] != in[0] {
		t.Errorf("read back %+v, %v; want %+v", out, err, in[0])
	}
}
