package main

import (
	"context"
	"io"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"polegap/post/workflow/scan"
)

// TestScanShards: a scan run whole and the same scan run as two shards
// and merged write the same table, byte for byte.
func TestScanShards(t *testing.T) {
	dir := t.TempDir()
	args := []string{"scan", "--quick", "--no-target", "--tolerance", "1e-3", "--vary", "pole-face-width=170,180", "--vary", "chamfer=4"}
	whole := filepath.Join(dir, "whole.csv")
	if code, _, errs := runCmd(t, append(args, "--csv", whole, "bench-dipole")...); code != 0 {
		t.Fatalf("whole: exit %d: %s", code, errs)
	}
	var shards []string
	for _, k := range []string{"1", "2"} {
		out := filepath.Join(dir, "shard-"+k+".csv")
		if code, _, errs := runCmd(t, append(args, "--shard", k+"/2", "--csv", out, "bench-dipole")...); code != 0 {
			t.Fatalf("shard %s: exit %d: %s", k, code, errs)
		}
		shards = append(shards, out)
	}
	merged := filepath.Join(dir, "merged.csv")
	if code, out, errs := runCmd(t, append([]string{"merge", "--csv", merged}, shards[1], shards[0])...); code != 0 || !strings.Contains(out, "merged 2 variants") {
		t.Fatalf("merge: exit %d: %s%s", code, out, errs)
	}
	a, _ := os.ReadFile(whole)
	b, _ := os.ReadFile(merged)
	if string(a) != string(b) || len(a) == 0 {
		t.Errorf("merged table differs from the whole scan:\n%s\nwant\n%s", b, a)
	}
}

// TestScanInterrupted: Ctrl-C after the first variant keeps it in the
// --csv table, marked partial.
func TestScanInterrupted(t *testing.T) {
	ctx, cancel := context.WithCancel(context.Background())
	oldI, oldP := interruptible, scanProgress
	defer func() { interruptible, scanProgress = oldI, oldP }()
	interruptible = func() (context.Context, context.CancelFunc) { return ctx, cancel }
	scanProgress = func(io.Writer) func(int, int, scan.Row) {
		return func(done, _ int, _ scan.Row) {
			if done == 1 {
				cancel()
			}
		}
	}
	out := filepath.Join(t.TempDir(), "scan.csv")
	code, _, errs := runCmd(t, "scan", "--quick", "--no-target", "--vary", "pole-face-width=170,180,190", "--csv", out, "bench-dipole")
	if code != 1 || !strings.Contains(errs, "interrupted") {
		t.Fatalf("code %d, stderr %q", code, errs)
	}
	data, err := os.ReadFile(out)
	if err != nil {
		t.Fatal(err)
	}
	s := string(data)
	if rows := strings.Count(s, "\n") - strings.Count(s, "#") - 1; !strings.Contains(s, "# partial:") || rows != 1 {
		t.Errorf("partial table with %d rows:\n%s", rows, s)
	}
}
