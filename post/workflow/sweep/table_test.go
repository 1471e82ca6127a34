package sweep

import (
	"strings"
	"testing"
)

// TestReadCSVErrors: a table that is not WriteCSV's, or a bad row, is an
// error naming the file and the row's line.
func TestReadCSVErrors(t *testing.T) {
	head := "# polegap excitation curve\n# model: m\n# probe: p\n" + strings.Join(Columns, ",") + "\n"
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
