package main

import (
	"bytes"
	"context"
	"os"
	"path/filepath"
	"strings"
	"sync"
	"testing"
	"time"
)

// withContext makes run use ctx as the Ctrl-C context until the test ends.
func withContext(t *testing.T, ctx context.Context, cancel context.CancelFunc) {
	old := interruptible
	t.Cleanup(func() { interruptible = old })
	interruptible = func() (context.Context, context.CancelFunc) { return ctx, cancel }
}

// TestInterruptedCommands: every long-running command given a context
// already cancelled (a Ctrl-C before its first safe point) stops without
// a result: exit status 1 (check: 2, its status for an error), nothing
// on standard output and no file written. Each returns within the one
// solve it cannot interrupt (the bench dipole solves in well under a
// second; 20 s leaves room for a loaded machine).
func TestInterruptedCommands(t *testing.T) {
	cases := []struct {
		name string
		args []string // $TMP is the folder that must stay empty
		code int
	}{
		{"solve", []string{"solve", "--vtu", "$TMP/a.vtu", "--png", "$TMP/a.png", "bench-dipole"}, 1},
		{"solve --accuracy", []string{"solve", "--accuracy", "1e-5", "--vtu", "$TMP/a.vtu", "bench-dipole"}, 1},
		{"check", []string{"check", "bench-dipole"}, 2},
		{"size", []string{"size", "--csv", "$TMP/w.csv", "bench-dipole"}, 1},
		{"sweep", []string{"sweep", "--points", "4", "--png", "$TMP/s.png", "bench-dipole"}, 1},
		{"compare", []string{"compare", "--csv", "$TMP/c.csv", "bench-dipole", "../../testdata/measured/bench-dipole-balance.yaml"}, 1},
		{"demo", []string{"demo", "--out", "$TMP/demo"}, 1},
		{"bench", []string{"bench", "--quick"}, 1},
		{"profile", []string{"profile", "--csv", "$TMP/p.csv", "bench-dipole"}, 1},
		{"mesh", []string{"mesh", "--vtu", "$TMP/m.vtu", "bench-dipole"}, 1},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			ctx, cancel := context.WithCancel(context.Background())
			cancel()
			withContext(t, ctx, cancel)
			dir := t.TempDir()
			args := make([]string, len(c.args))
			for i, a := range c.args {
				args[i] = strings.ReplaceAll(a, "$TMP", dir)
			}
			start := time.Now()
			code, out, errs := runCmd(t, args...)
			if el := time.Since(start); el > 20*time.Second {
				t.Errorf("took %v after the interrupt", el)
			}
			if code != c.code || out != "" || !strings.Contains(errs, "interrupted") {
				t.Errorf("exit %d (want %d), stdout %q, stderr %q", code, c.code, out, errs)
			}
			if ents, _ := os.ReadDir(dir); len(ents) != 0 {
				t.Errorf("an interrupted run left files: %v", ents)
			}
		})
	}
}

// cancelOn is a standard error that cancels the run's context when a
// line containing trigger is written to it, as Ctrl-C would then.
type cancelOn struct {
	mu      sync.Mutex
	buf     bytes.Buffer
	trigger string
	cancel  context.CancelFunc
}

func (w *cancelOn) Write(p []byte) (int, error) {
	w.mu.Lock()
	defer w.mu.Unlock()
	if strings.Contains(string(p), w.trigger) {
		w.cancel()
	}
	return w.buf.Write(p)
}

// TestSolveAccuracyInterrupted: Ctrl-C during the adaptive refinement
// (here after its first round) stops solve --accuracy before the next
// round: exit status 1, no report and none of the files asked for. At
// 1e-6 the refinement would otherwise run several rounds more.
func TestSolveAccuracyInterrupted(t *testing.T) {
	ctx, cancel := context.WithCancel(context.Background())
	withContext(t, ctx, cancel)
	dir := t.TempDir()
	stderr := &cancelOn{trigger: "nodes solved", cancel: cancel}
	var stdout bytes.Buffer
	start := time.Now()
	code := run([]string{"solve", "--accuracy", "1e-6", "--vtu", filepath.Join(dir, "a.vtu"), "--png", filepath.Join(dir, "a.png"), "bench-dipole"}, &stdout, stderr)
	el := time.Since(start)
	errs := stderr.buf.String()
	if code != 1 || stdout.Len() != 0 || strings.Count(errs, "nodes solved") != 1 || !strings.Contains(errs, "interrupted (Ctrl-C); no result was written") {
		t.Errorf("exit %d, stdout %q, stderr %q; want exit 1 after one round", code, stdout.String(), errs)
	}
	if ents, _ := os.ReadDir(dir); len(ents) != 0 {
		t.Errorf("an interrupted solve left files: %v", ents)
	}
	// One round of the bench dipole takes well under a second; 20 s leaves
	// room for a loaded machine.
	if el > 20*time.Second {
		t.Errorf("took %v", el)
	}
}
