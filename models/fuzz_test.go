package models

import (
	"errors"
	"strings"
	"testing"
)

// FuzzParse feeds arbitrary bytes to Parse: it must never panic, must return
// either a model that passes Check or a non-empty ErrorList of positioned
// messages, and never both. The seed corpus is in testdata/fuzz/FuzzParse
// plus the embedded examples and the base test model.
func FuzzParse(f *testing.F) {
	for _, n := range Examples() {
		data, err := Example(n)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(data)
	}
	f.Add([]byte(base))
	f.Add([]byte(base + "boundary: {margin: 0.5, margins: {left: 2, top: 0.25}, sides: {bottom: flux-normal}}\n"))
	f.Add([]byte(base + "boundary: {box: [[-10, -5], [110, 60]], sides: {left: flux-normal}}\n"))
	f.Fuzz(func(t *testing.T, data []byte) {
		m, err := Parse("f.yaml", data)
		if err != nil {
			if m != nil {
				t.Fatalf("model and error together: %v", err)
			}
			var list ErrorList
			if !errors.As(err, &list) || len(list) == 0 {
				t.Fatalf("error %T %v is not a non-empty ErrorList", err, err)
			}
			for _, e := range list {
				if e.Msg == "" || !strings.HasPrefix(e.Error(), "f.yaml") {
					t.Fatalf("bad error entry %q", e.Error())
				}
			}
			return
		}
		if err := m.Check(); err != nil {
			t.Fatalf("Parse accepted a model that fails Check: %v", err)
		}
	})
}
