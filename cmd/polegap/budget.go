package main

import (
	"context"
	"errors"
	"flag"
	"fmt"
	"time"

	"polegap/post/study"
	"polegap/solver"
)

// Budgets. Every long computation has a limit whose reaching ends the
// command with a *study.LimitError naming the limit, what was reached and
// what to change:
//
//   - Newton steps: --max-iterations (solve; 30), solver.NotConvergedError;
//   - adaptive refinement: --max-levels (10 meshes) and --max-nodes
//     (2,000,000) on solve, check, size and sweep, which report the
//     numbers of the last mesh with their estimates;
//   - mesh size: the estimate before meshing (20,000,000 triangles and the
//     memory available) and the mesher's budget (post/study);
//   - wall time: --time-limit on every command (DefaultTimeLimit).
//
// Ctrl-C stops every command at its next safe point (main.go).

// DefaultTimeLimit is the wall time a command may take unless
// --time-limit says otherwise: far above any example (seconds) and the
// largest benchmark (minutes).
const DefaultTimeLimit = 2 * time.Hour

// durationFlag is a flag.Value for a positive duration.
type durationFlag struct{ d *time.Duration }

func (f *durationFlag) Set(s string) error {
	d, err := time.ParseDuration(s)
	if err != nil {
		return fmt.Errorf("not a duration: write e.g. 90s, 20m or 1h30m")
	}
	if d <= 0 {
		return fmt.Errorf("must be greater than 0; got %s", s)
	}
	*f.d = d
	return nil
}

func (f *durationFlag) String() string {
	if f.d == nil {
		return ""
	}
	return f.d.String()
}

// addTimeLimit defines --time-limit on fs, as run does for every command.
func addTimeLimit(fs *flag.FlagSet) *time.Duration {
	d := new(time.Duration)
	*d = DefaultTimeLimit
	fs.Var(&durationFlag{d}, "time-limit", "budget of wall time; the command stops with an error when it is spent")
	return d
}

// withTimeLimit returns ctx with the deadline d, whose cause is a
// *study.LimitError for the command name.
func withTimeLimit(ctx context.Context, name string, d time.Duration) (context.Context, context.CancelFunc) {
	return context.WithTimeoutCause(ctx, d, &study.LimitError{
		Limit:   fmt.Sprintf("the wall-time limit of %s", d),
		Reached: fmt.Sprintf("polegap %s ran that long without finishing; no result was written", name),
		Change:  "raise --time-limit, or ask for less: a coarser --accuracy, fewer sweep points, larger mesh sizes",
	})
}

// timedOut returns the *study.LimitError of ctx's time limit when err is
// the command stopping at it, else nil.
func timedOut(ctx context.Context, err error) error {
	var le *study.LimitError
	if !errors.As(context.Cause(ctx), &le) {
		return nil
	}
	var nc *solver.NotConvergedError
	if errors.Is(err, context.DeadlineExceeded) || errors.As(err, &nc) && errors.Is(nc.Err, context.DeadlineExceeded) {
		return le
	}
	return nil
}
