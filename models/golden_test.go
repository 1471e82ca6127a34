package models

import (
	"bytes"
	"encoding/json"
	"flag"
	"os"
	"path/filepath"
	"testing"
)

var update = flag.Bool("update", false, "rewrite the golden files in testdata/golden")

// TestGoldenExamples pins every embedded example, fully expanded (template
// geometry, defaults, SI units), as canonical JSON in testdata/golden. A
// change in the schema, a template or a default shows up as a diff there;
// run `go test ./models -run Golden -update` to accept it. On a mismatch
// the actual output is written beside the golden as *.actual.
func TestGoldenExamples(t *testing.T) {
	for _, name := range Examples() {
		m, err := LoadExample(name)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		got, err := json.MarshalIndent(m, "", "  ")
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		got = append(got, '\n')
		path := filepath.Join("testdata", "golden", name+".json")
		if *update {
			if err := os.WriteFile(path, got, 0o644); err != nil {
				t.Fatal(err)
			}
			continue
		}
		want, err := os.ReadFile(path)
		if err != nil {
			t.Fatalf("%s: %v (run with -update to create it)", name, err)
		}
		if !bytes.Equal(got, want) {
			os.WriteFile(path+".actual", got, 0o644)
			t.Errorf("%s: expanded model differs from %s; see %s.actual", name, path, path)
		}
		// Idempotence: parsing the same text twice gives the same model.
		m2, _ := LoadExample(name)
		again, _ := json.MarshalIndent(m2, "", "  ")
		if !bytes.Equal(append(again, '\n'), got) {
			t.Errorf("%s: two parses differ", name)
		}
	}
}
