package samples

import (
	"bytes"
	"os"
	"path/filepath"
	"testing"
)

// TestSamplesMatch: each embedded sample is byte for byte the file in
// testdata/measured (copy it again after regenerating those), and every
// file there is embedded and described.
func TestSamplesMatch(t *testing.T) {
	src := filepath.Join("..", "..", "..", "testdata", "measured")
	ents, err := os.ReadDir(src)
	if err != nil {
		t.Fatal(err)
	}
	n := 0
	for _, e := range ents {
		if e.Name() == "README.md" {
			continue
		}
		n++
		want, err := os.ReadFile(filepath.Join(src, e.Name()))
		if err != nil {
			t.Fatal(err)
		}
		got, err := Data(e.Name())
		if err != nil || !bytes.Equal(got, want) {
			t.Errorf("%s: the embedded copy differs from testdata/measured (%v): cp testdata/measured/%s post/measure/samples/", e.Name(), err, e.Name())
		}
		if Summaries[e.Name()] == "" {
			t.Errorf("%s has no summary", e.Name())
		}
	}
	if len(Names()) != n {
		t.Errorf("%d samples embedded, %d in testdata/measured", len(Names()), n)
	}
	if _, err := Data("../x"); err == nil {
		t.Error("a path was accepted as a sample name")
	}
}
