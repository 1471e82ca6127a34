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
