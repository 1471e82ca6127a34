package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestReadmeModel checks that the model shown in the README loads and
// solves, so that the first thing a new user copies works.
func TestReadmeModel(t *testing.T) {
	data, err := os.ReadFile("../../README.md")
	if err != nil {
		t.Fatal(err)
	}
	s := string(data)
	i := strings.Index(s, "```yaml\n")
	if i < 0 {
		t.Fatal("README has no yaml block")
	}
	s = s[i+len("```yaml\n"):]
	s = s[:strings.Index(s, "```")]
	p := filepath.Join(t.TempDir(), "readme.yaml")
	if err := os.WriteFile(p, []byte(s), 0o644); err != nil {
		t.Fatal(err)
	}
	code, out, errs := runCmd(t, "solve", p)
	if code != 0 {
		t.Fatalf("README model: code %d\n%s%s", code, out, errs)
	}
	if !strings.Contains(out, "gap-centre") {
		t.Errorf("README model output lacks the probe:\n%s", out)
	}
}
