package materials

import (
	"encoding/csv"
	"errors"
	"math"
	"strings"
	"testing"
)

// TestReadCurveCSV reads the accepted header styles, separators, units and
// comments; each must give the same curve as the table given directly.
func TestReadCurveCSV(t *testing.T) {
	want, err := NewCurve([]float64{0, 200, 1000, 10000}, []float64{0, 1, 1.5, 1.8})
	if err != nil {
		t.Fatal(err)
	}
	cases := []struct{ name, data string }{
		{"plain", "H,B\n0,0\n200,1\n1000,1.5\n10000,1.8\n"},
		{"units", "H (A/m),B (T)\n0,0\n200,1\n1000,1.5\n10000,1.8\n"},
		{"brackets and spaces", "  H [A/m] ,  B [T]  \n0, 0\n200 ,1\n1000, 1.5\n10000 , 1.8\n"},
		{"kA/m and mT", "H (kA/m),B (mT)\n0.2,1000\n1,1500\n10,1800\n"},
		{"no origin, reversed columns", "B (T),H (A/m)\n1,200\n1.5,1000\n1.8,10000\n"},
		{"comments and blanks", "# measured on a ring sample\n\nH (A/m),B (T) # header\n# origin\n0,0\n200,1 # knee\n\n1000,1.5\n10000,1.8"},
		{"extra column", "H (A/m),mu_r,B (T)\n200,3979,1\n1000,1194,1.5\n10000,143,1.8\n"},
		{"quoted", "\"H (A/m)\",\"B (T)\"\n\"200\",\"1\"\n1000,1.5\n10000,1.8\n"},
		{"semicolon", "H;B\n200;1\n1000;1.5\n10000;1.8\n"},
		{"tabs", "H\tB\n200\t1\n1000\t1.5\n10000\t1.8\n"},
		{"spaces", "H(A/m)  B(T)\n200 1\n 1000   1.5\n10000 \t1.8\n"},
		{"polarisation J", "H (A/m),J (T)\n200,0.9997486725877128\n1000,1.498743362938564\n10000,1.7874336293856408\n"},
		{"CRLF and BOM", "\ufeffH,B\r\n200,1\r\n1000,1.5\r\n10000,1.8\r\n"},
	}
	for _, tc := range cases {
		c, err := ReadCurveCSV(strings.NewReader(tc.data), tc.name)
		if err != nil {
			t.Errorf("%s: %v", tc.name, err)
			continue
		}
		if c.Name() != tc.name {
			t.Errorf("%s: Name() = %q", tc.name, c.Name())
		}
		h, b := c.Table()
		wh, wb := want.Table()
		if len(h) != len(wh) {
			t.Errorf("%s: %d points, want %d", tc.name, len(h), len(wh))
			continue
		}
		for i := range h {
			// kA/m and mT scale by 1e3 and 1e-3: one rounding, 1 ulp.
			if !near(h[i], wh[i], 2e-16) || !near(b[i], wb[i], 2.3e-16) {
				t.Errorf("%s: point %d = (%g, %g), want (%g, %g)", tc.name, i, h[i], b[i], wh[i], wb[i])
			}
		}
		if err := c.Check(); err != nil {
			t.Errorf("%s: %v", tc.name, err)
		}
	}
}

// TestReadCurveCSVErrors: each fault names its line and what is wrong.
func TestReadCurveCSVErrors(t *testing.T) {
	cases := []struct {
		name, data string
		err        error
		msg        string
	}{
		{"empty", "", ErrEmpty, "f.csv: no header and no data"},
		{"comments only", "# nothing\n\n", ErrEmpty, "no header and no data"},
		{"no header", "0,0\n100,1\n", ErrMissingColumn, "f.csv:1: no header row"},
		{"no B column", "H (A/m),M (A/m)\n0,0\n", ErrMissingColumn, "f.csv:1: header has no column B"},
		{"no H column", "X,B\n0,0\n", ErrMissingColumn, "header has no column H;"},
		{"no columns", "x,y\n", ErrMissingColumn, "no column H and B"},
		{"duplicate", "H,B,H\n", ErrHeader, "names column H twice"},
		{"B and J", "H,B,J (T)\n", ErrHeader, "column J after column B (columns 2 and 3); give one of B and J"},
		{"bad unit H", "H (Oe),B (T)\n", ErrHeader, "unit \"Oe\" of column H"},
		{"bad unit B", "H (A/m),B (G)\n", ErrHeader, "unit \"G\" of column B"},
		{"bad number", "H,B\n0,0\n100,1.2x\n", ErrNumber, "f.csv:3: column B: \"1.2x\" is not a number"},
		{"empty field", "H,B\n0,0\n,1.2\n", ErrNumber, "f.csv:3: column H: \"\" is not a number"},
		{"missing column", "# c\nH,B\n0,0\n100\n", ErrMissingColumn, "f.csv:4: missing column B"},
		{"non-monotone", "H,B\n0,0\n100,1\n# gap\n\n300,0.9\n", ErrBNotIncreasing, "f.csv:6: B is not above"},
		{"negative", "H,B\n0,0\n-100,1\n300,1.5\n", ErrNegative, "f.csv:3: negative value"},
		{"NaN", "H,B\n0,0\nNaN,1\n300,1.5\n", ErrNotFinite, "f.csv:3: H is not a finite number"},
		{"overflow", "H,B\n0,0\n1e999,1\n300,1.5\n", ErrNotFinite, "f.csv:3"},
		{"two points", "H,B\n0,0\n100,1\n", ErrTooFewPoints, "f.csv: the table has 2 points"},
		{"misplaced quote", "H,B\n0,0\n\"100\"x,1\n", csv.ErrQuote, "f.csv:3: column 5: extraneous or missing \""},
		{"long line", "H,B\n" + strings.Repeat("1", maxCSVLine+10) + "\n", ErrNumber, "f.csv:2: line longer than"},
	}
	for _, tc := range cases {
		c, err := ReadCurveCSV(strings.NewReader(tc.data), "f.csv")
		if c != nil || !errors.Is(err, tc.err) {
			t.Errorf("%s: got %v, %v; want %v", tc.name, c, err, tc.err)
			continue
		}
		var ce *CSVError
		if !errors.As(err, &ce) {
			t.Errorf("%s: %T is not a *CSVError", tc.name, err)
		}
		if !strings.Contains(err.Error(), tc.msg) {
			t.Errorf("%s: message %q lacks %q", tc.name, err.Error(), tc.msg)
		}
	}
}

// FuzzReadCurveCSV: any input gives a curve that passes Check and returns
// finite ν, or an error; never a panic.
func FuzzReadCurveCSV(f *testing.F) {
	seeds := []string{
		"H (A/m),B (T)\n0,0\n200,1\n1000,1.5\n10000,1.8\n",
		"H,B\n100,1\n1e4,1.8\n1e5,1.95\n",
		"H [kA/m]; B [mT]\n0.01;10\n0.1;500\n1;1400\n100;2000\n",
		"# c\nB,H\n1,100\n2,1e5\n2.1,2e5\n",
		"H\tB\n1e-6\t1e-12\n1\t1e-3\n1e10\t1e3\n",
		"H,B\n0,0\n1e-6,1e-12\n2e-6,3e-12\n",
		"H,B\n0,0\n100,NaN\n",
		"H,B\n0,0\n100,1\n100,1\n",
		"x\n",
		"\"H\",\"B\"\n\"1\",\"0.001\"\n2,0.002\n3,0.003\n",
	}
	for _, s := range seeds {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, data string) {
		c, err := ReadCurveCSV(strings.NewReader(data), "fuzz.csv")
		if err != nil {
			if c != nil {
				t.Fatalf("curve and error: %v", err)
			}
			if err.Error() == "" {
				t.Fatal("empty error message")
			}
			return
		}
		if err := c.Check(); err != nil {
			t.Fatalf("Check: %v\ninput %q", err, data)
		}
		bl := c.bl
		for _, bv := range []float64{0, 1e-9, 0.5 * bl, bl, 2 * bl, 1e6} {
			nu, g := c.Nu(bv * bv)
			if !(nu > 0) || math.IsInf(nu, 0) || math.IsNaN(g) || math.IsInf(g, 0) {
				t.Fatalf("Nu(%g²) = (%g, %g)\ninput %q", bv, nu, g, data)
			}
			if h := c.H(bv); math.IsNaN(h) || math.IsInf(h, 0) || c.B(h) < 0 {
				t.Fatalf("H(%g) = %g\ninput %q", bv, h, data)
			}
		}
	})
}

// A "# data-end: H" comment marks where the data end and the table's
// extrapolation begins (in the table's H unit); Curve.TableEnd returns it.
// Without it, or with an H that is not in the table, the last row is the
// end.
func TestCSVDataEnd(t *testing.T) {
	for _, tc := range []struct {
		comment string
		h       float64
	}{{"# data-end: 2\n", 2000}, {"", 8000}, {"# data-end: 3\n", 8000}} {
		src := tc.comment + "H (kA/m),B (T)\n0.5,1.0\n2,1.5\n8,1.7\n"
		c, err := ReadCurveCSV(strings.NewReader(src), "t.csv")
		if err != nil {
			t.Fatal(err)
		}
		if h, _ := c.TableEnd(); h != tc.h {
			t.Errorf("%q: TableEnd H = %g, want %g", tc.comment, h, tc.h)
		}
	}
}
