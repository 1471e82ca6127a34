package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestMergeTrailing: a four-point sweep run as two shards; merging shard
// 1/2 alone (indices 0 and 2) finds both missing points, the last one
// too, numbered as the CSV's index column; both shards together are
// complete.
func TestMergeTrailing(t *testing.T) {
	dir := t.TempDir()
	for _, k := range []string{"1", "2"} {
		p := filepath.Join(dir, "s"+k+".csv")
		if code, _, errs := runCmd(t, "sweep", "--quick", "--points", "4", "--to", "80A", "--shard", k+"/2", "--csv", p, "bench-dipole"); code != 0 {
			t.Fatalf("shard %s: code %d\n%s", k, code, errs)
		}
		if b, _ := os.ReadFile(p); !strings.Contains(string(b), "# points: 4\n") {
			t.Fatalf("shard %s does not record the sweep's points:\n%s", k, b)
		}
	}
	out1 := filepath.Join(dir, "m1.csv")
	code, out, errs := runCmd(t, "merge", "--csv", out1, filepath.Join(dir, "s1.csv"))
	if code != 0 || !strings.Contains(out, "missing points (index, as in the tables' index column): [1 3]") {
		t.Errorf("merge of shard 1 alone: code %d\n%s%s", code, out, errs)
	}
	if b, _ := os.ReadFile(out1); !strings.Contains(string(b), "# partial: 2 point(s) missing") {
		t.Errorf("merged table not marked partial:\n%s", b)
	}
	code, out, errs = runCmd(t, "merge", "--csv", filepath.Join(dir, "m.csv"), filepath.Join(dir, "s2.csv"), filepath.Join(dir, "s1.csv"))
	if code != 0 || strings.Contains(out, "missing") || !strings.Contains(out, "merged 4 points") {
		t.Errorf("merge of both shards: code %d\n%s%s", code, out, errs)
	}
}
