package measure_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"polegap/post/measure"
)

func TestReadCSVHeaders(t *testing.T) {
	for _, tc := range []struct {
		name, data string
		kind       measure.Kind
		current    float64 // A, second point
		value      float64 // T or Wb, second point
		sigma      float64
	}{
		{"underscore", "current_A,field_T\n1,0.1\n2,0.2\n", measure.Field, 2, 0.2, 0},
		{"parentheses with sigma", "I (A),B (T),u(B) (T)\n1,0.1,0.001\n2,0.2,0.002\n", measure.Field, 2, 0.2, 0.002},
		{"brackets", "I [A], B [mT], sigma [mT]\n1, 100, 1\n2, 200, 2\n", measure.Field, 2, 0.2, 0.002},
		{"ISO slash", "I/A;B/T\n1;0.1\n2;0.2\n", measure.Field, 2, 0.2, 0},
		{"gauss and mA", "current_mA\tfield_G\n1000\t1000\n2000\t2000\n", measure.Field, 2, 0.2, 0},
		{"kilogauss", "I (A),B (kG),sigma_G\n1,1,10\n2,2,20\n", measure.Field, 2, 0.2, 0.002},
		{"flux linkage", "current_A,flux_Wb,sigma_Wb\n1,0.01,1e-4\n2,0.02,2e-4\n", measure.FluxLinkage, 2, 0.02, 2e-4},
		{"flux in mWb", "I (A),lambda (mWb)\n1,10\n2,20\n", measure.FluxLinkage, 2, 0.02, 0},
		{"extra columns ignored", "run,current_A,temp_C,field_T,note\n1,1,20,0.1,x\n2,2,21,0.2,y\n", measure.Field, 2, 0.2, 0},
		{"comments and blanks", "# magnet: test\n\ncurrent_A,field_T\n# a comment\n1,0.1 # first\n\n2,0.2\n", measure.Field, 2, 0.2, 0},
		{"empty sigma cell", "current_A,field_T,sigma_T\n1,0.1,\n2,0.2,0.002\n", measure.Field, 2, 0.2, 0.002},
		{"CRLF and BOM", "\ufeffcurrent_A,field_T\r\n1,0.1\r\n2,0.2\r\n", measure.Field, 2, 0.2, 0},
		{"spaces", "current_A   field_T  sigma_T\n1 0.1 0.001\n 2  0.2\t0.002\n", measure.Field, 2, 0.2, 0.002},
		{"quoted", "\"I (A)\",\"B (T)\",\"u(B) (T)\"\n\"1\",\"0.1\",\"\"\n 2, \"0.2\", \" 0.002 \"\n", measure.Field, 2, 0.2, 0.002},
	} {
		c, err := measure.ReadCSV(strings.NewReader(tc.data), tc.name)
		if err != nil {
			t.Errorf("%s: %v", tc.name, err)
			continue
		}
		if err := c.Check(); err != nil {
			t.Errorf("%s: %v", tc.name, err)
		}
		v, s := c.Values()
		// Unit factors are exact decimal powers, so 1e-12 relative.
		close := func(a, b float64) bool { return math.Abs(a-b) <= 1e-12*math.Abs(b) }
		if c.Kind != tc.kind || len(c.Points) != 2 || !close(c.Points[1].Current, tc.current) || !close(v[1], tc.value) || !close(s[1], tc.sigma) {
			t.Errorf("%s: kind %v, points %+v; want kind %v, second point %g A, %g ± %g", tc.name, c.Kind, c.Points, tc.kind, tc.current, tc.value, tc.sigma)
		}
	}
	c, _ := measure.ReadCSV(strings.NewReader("# magnet: bench\n# date: 2026-11-20\ncurrent_A,field_T\n1,0.1\n2,0.2\n"), "m")
	if c.Meta["magnet"] != "bench" || c.Meta["date"] != "2026-11-20" || c.Points[0].Row != 4 {
		t.Errorf("meta %v, first row %d; want magnet and date, row 4", c.Meta, c.Points[0].Row)
	}
}

// TestReadCSVErrors checks that every bad row is reported with its row and
// what to do.
func TestReadCSVErrors(t *testing.T) {
	data := `current_A,field_T,sigma_T
1,0.1,0.001
2,abc,0.001
3,NaN,0.001
4,0.4,-0.001
5,,0.001
6,0.6
1,0.7,0.001
7,0.8,0.001
8,Inf,0.001
9,1e999,0.001
`
	_, err := measure.ReadCSV(strings.NewReader(data), "lab.csv")
	var list measure.ErrorList
	if !errors.As(err, &list) {
		t.Fatalf("error %T %v, want an ErrorList", err, err)
	}
	want := []string{
		"lab.csv:3:3: field_T: \"abc\" is not a number",
		"lab.csv:4:3: field_T: \"NaN\" is not a finite number",
		"lab.csv:5:7: sigma_T: uncertainty -0.001 is negative",
		"lab.csv:6:3: field_T: is empty",
		"lab.csv:7: has 2 values but the header has 3 columns",
		"lab.csv:8: current_A: current 1 A repeats row 2",
		"lab.csv:10:3: field_T: \"Inf\" is not a finite number",
		"lab.csv:11:3: field_T: \"1e999\" is not a finite number",
	}
	if len(list) != len(want) {
		t.Fatalf("%d errors, want %d:\n%v", len(list), len(want), err)
	}
	for i, w := range want {
		if !strings.HasPrefix(list[i].Error(), w) {
			t.Errorf("error %d: %q, want prefix %q", i, list[i], w)
		}
	}
	for _, tc := range []struct{ name, data, want string }{
		{"empty", "", "no header row"},
		{"comments only", "# nothing\n", "no header row"},
		{"no unit", "current,field_T\n1,1\n2,2\n", "has no unit"},
		{"wrong unit", "current_T,field_T\n1,1\n2,2\n", "is a current but its unit T is not"},
		{"no field", "current_A,temp_C\n1,1\n2,2\n", "no field or flux column"},
		{"no current", "field_T\n1\n2\n", "no current column"},
		{"two fields", "current_A,field_T,B (mT)\n1,1,1\n2,2,2\n", "second field column"},
		{"sigma in A", "current_A,field_T,sigma_A\n1,1,1\n2,2,2\n", "uncertainty column"},
		{"flux sigma alone", "current_A,field_T,sigma_Wb\n1,1,1\n2,2,2\n", "without a flux column"},
		{"one point", "current_A,field_T\n1,0.1\n", "a measured curve needs at least 2"},
		{"misplaced quote", "current_A,field_T\n1,0.1\n2,\"0.2\"x\n3,0.3\n", "misplaced quote:3:7: extraneous or missing \""},
	} {
		_, err := measure.ReadCSV(strings.NewReader(tc.data), tc.name)
		if err == nil || !strings.Contains(err.Error(), tc.want) || !strings.HasPrefix(err.Error(), tc.name+":") {
			t.Errorf("%s: error %v, want %q after the name", tc.name, err, tc.want)
		}
	}
}

func TestCurveCheck(t *testing.T) {
	ok := measure.Curve{Name: "c", Points: []measure.Point{{Current: 1, Field: 0.1}, {Current: 2, Field: 0.2}}}
	if err := ok.Check(); err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		name string
		edit func(c *measure.Curve)
	}{
		{"one point", func(c *measure.Curve) { c.Points = c.Points[:1] }},
		{"NaN", func(c *measure.Curve) { c.Points[0].Field = math.NaN() }},
		{"negative sigma", func(c *measure.Curve) { c.Points[1].FieldSigma = -1 }},
		{"duplicate", func(c *measure.Curve) { c.Points[1].Current = 1 }},
		{"flux curve with field", func(c *measure.Curve) { c.Kind = measure.FluxLinkage }},
		{"bad kind", func(c *measure.Curve) { c.Kind = 7 }},
	} {
		c := ok
		c.Points = append([]measure.Point(nil), ok.Points...)
		tc.edit(&c)
		if c.Check() == nil {
			t.Errorf("%s: Check passed", tc.name)
		}
	}
}
