package measure_test

import (
	"bytes"
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"polegap/post/measure"
)

func addSeeds(f *testing.F) {
	for _, s := range []string{
		"current_A,field_T\n1,0.1\n2,0.2\n",
		"I (A),B (mT),u(B) (mT)\n1,100,1\n2,200,2\n",
		"current_A,flux_Wb,sigma_Wb\n1,0.01,1e-4\n2,0.02,2e-4\n",
		"# magnet: x\nI/A;B/T\n1;0.1\n1;0.2\n",
		"current_A,field_T\n1,NaN\n2,abc\n,\n",
		"current_A,field_T,sigma_T\n1,0.1,-1\n2\n",
		"\ufeffI [kA]\tB [G]\n1\t1\n",
		directFile,
		"",
	} {
		f.Add([]byte(s))
	}
	files, _ := filepath.Glob(filepath.Join(sampleDir, "*"))
	for _, p := range files {
		if b, err := os.ReadFile(p); err == nil {
			f.Add(b)
		}
	}
}

// checkResult asserts what every reader promises: a curve passing Check,
// or an error that is an InputError or a list of them, never both.
func checkResult(t *testing.T, c *measure.Curve, err error) {
	t.Helper()
	if err != nil {
		if c != nil {
			t.Fatalf("curve and error %v", err)
		}
		var ie *measure.InputError
		if !errors.As(err, &ie) {
			t.Fatalf("error %T %v is not an InputError", err, err)
		}
		return
	}
	if cerr := c.Check(); cerr != nil {
		t.Fatalf("curve fails Check: %v", cerr)
	}
}

func FuzzReadCSV(f *testing.F) {
	addSeeds(f)
	f.Fuzz(func(t *testing.T, data []byte) {
		c, err := measure.ReadCSV(bytes.NewReader(data), "fuzz.csv")
		checkResult(t, c, err)
	})
}

func FuzzParse(f *testing.F) {
	addSeeds(f)
	f.Fuzz(func(t *testing.T, data []byte) {
		name := "fuzz"
		if bytes.Contains(data, []byte("format:")) {
			name = "fuzz.yaml"
		}
		c, err := measure.Parse(name, data)
		checkResult(t, c, err)
		if err != nil && strings.Contains(err.Error(), "NaN") && !bytes.Contains(bytes.ToLower(data), []byte("nan")) {
			t.Fatalf("NaN in an error for input without one: %v", err)
		}
	})
}

// FuzzBalance feeds arbitrary readings and constants to the balance
// reduction: it returns an error or a finite field with a finite,
// non-negative uncertainty, and never panics.
func FuzzBalance(f *testing.F) {
	f.Add(0.0, 1e-3, 1.0, 2e-3, 2.0, 3e-3, 3.0, 4.1e-3, 0.05, 1e-6, false)
	f.Add(1.0, 1e-3, 2.0, 2e-3, 3.0, 3e-3, 4.0, 4e-3, 0.05, 0.0, true)
	f.Fuzz(func(t *testing.T, i0, m0, i1, m1, i2, m2, i3, m3, L, sig float64, origin bool) {
		bal := measure.Balance{Length: L, MassSigma: sig}
		if origin {
			bal.Fit = measure.ThroughOrigin
		}
		res, err := bal.Reduce([]measure.BalanceReading{{i0, m0}, {i1, m1}, {i2, m2}, {i3, m3}})
		if err != nil {
			return
		}
		for _, v := range []float64{res.Field, res.FieldSigma, res.SigmaFit, res.SigmaG, res.SigmaLength} {
			if v-v != 0 {
				t.Fatalf("non-finite result %+v", res)
			}
		}
		if res.FieldSigma < 0 {
			t.Fatalf("negative uncertainty %+v", res)
		}
	})
}
