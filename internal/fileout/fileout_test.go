package fileout

import (
	"errors"
	"io"
	"os"
	"path/filepath"
	"testing"
)

func TestWriteReplacesAtomically(t *testing.T) {
	dir := t.TempDir()
	p := filepath.Join(dir, "out.csv")
	if err := os.WriteFile(p, []byte("old"), 0o644); err != nil {
		t.Fatal(err)
	}
	boom := errors.New("boom")
	err := Write(p, func(w io.Writer) error {
		io.WriteString(w, "half")
		return boom
	})
	if !errors.Is(err, boom) {
		t.Fatalf("Write error = %v, want wrapping boom", err)
	}
	got, _ := os.ReadFile(p)
	if string(got) != "old" {
		t.Fatalf("failed write changed the file to %q", got)
	}
	if err := Write(p, func(w io.Writer) error { _, err := io.WriteString(w, "new"); return err }); err != nil {
		t.Fatal(err)
	}
	got, _ = os.ReadFile(p)
	if string(got) != "new" {
		t.Fatalf("file = %q, want new", got)
	}
	ents, _ := os.ReadDir(dir)
	if len(ents) != 1 {
		t.Fatalf("temporary files left behind: %v", ents)
	}
}
