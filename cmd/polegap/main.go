// Command polegap is a finite-element design calculator for iron-core
// electromagnets. See doc.go for the manual.
package main

import (
	"context"
	"errors"
	"flag"
	"fmt"
	"io"
	"os"
	"os/signal"
	"runtime/debug"
	"sort"
	"strings"

	"polegap/post/workflow/caution"
	"polegap/solver"
)

func main() {
	setGC()
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}

// gcPercent is the garbage collector's target heap growth polegap runs
// with unless the GOGC environment variable says otherwise. Its heap is
// mostly a few large arrays that live through a whole solve (mesh,
// matrix, factor), so collecting at 50 % growth instead of Go's default
// 100 % lowers the peak by about a fifth at no measured cost: on the
// 100k-node benchmark C-core the peak heap was 128 MiB against 162 MiB,
// the 20-point curve 9.9 s against 10.0 s.
const gcPercent = 50

func setGC() {
	if _, set := os.LookupEnv("GOGC"); !set {
		debug.SetGCPercent(gcPercent)
	}
}

// A Command is one sub-command: its usage, help texts, flags and action.
type Command struct {
	UsageLine string // "mesh [flags] MODEL"
	Short     string // one line for the command list
	Long      string // the help page
	// Flags registers the command's flags on fs and returns the action to
	// run once they are parsed; args are the positional arguments.
	Flags func(fs *flag.FlagSet) func(env *Env, args []string) error
}

// Env carries the standard streams and the run's context to a command.
type Env struct {
	Stdout, Stderr io.Writer
	// Ctx is cancelled by Ctrl-C (SIGINT); long-running commands pass it
	// down and return its error when they stop early.
	Ctx context.Context
}

// Name is the first word of the usage line.
func (c *Command) Name() string {
	name, _, _ := strings.Cut(c.UsageLine, " ")
	return name
}

// usageError marks a mistake in the command line itself (exit status 2).
type usageError struct{ msg string }

func (e *usageError) Error() string { return e.msg }

func usagef(format string, args ...any) error {
	return &usageError{fmt.Sprintf(format, args...)}
}

func lookup(name string) *Command {
	for _, c := range commands {
		if c.Name() == name {
			return c
		}
	}
	return nil
}

// run is main without os.Exit, so that tests can call it and defers run.
// It returns 0 on success, 1 on failure and 2 on a usage error.
func run(args []string, stdout, stderr io.Writer) int {
	env := &Env{Stdout: stdout, Stderr: stderr}
	notes = stderr
	if len(args) == 0 {
		printUsage(stderr)
		return 2
	}
	name := args[0]
	if name == "help" || name == "-h" || name == "--help" || name == "-help" {
		if len(args) > 1 {
			if c := lookup(args[1]); c != nil {
				printHelp(stdout, c)
				return 0
			}
			fmt.Fprintf(stderr, "polegap help %s: unknown command\n", args[1])
			return 2
		}
		printUsage(stdout)
		return 0
	}
	c := lookup(name)
	if c == nil {
		fmt.Fprintf(stderr, "polegap %s: unknown command\nRun 'polegap help' for the list of commands.\n", name)
		return 2
	}
	fs := flag.NewFlagSet(name, flag.ContinueOnError)
	fs.SetOutput(io.Discard)
	action := c.Flags(fs)
	timeLimit := addTimeLimit(fs)
	pos, err := parseInterspersed(fs, args[1:])
	if errors.Is(err, flag.ErrHelp) {
		printHelp(stdout, c)
		return 0
	}
	if err == nil {
		ctx, stop := interruptible()
		defer stop()
		go func() {
			// After the first Ctrl-C the command winds down (a solve that
			// cannot be interrupted finishes first); a second one ends the
			// process at once.
			<-ctx.Done()
			stop()
			// The cause is the signal, or context.Canceled once the command
			// has returned. Only a file (a terminal) takes this concurrent
			// write safely.
			if f, ok := stderr.(*os.File); ok && context.Cause(ctx) != context.Canceled {
				fmt.Fprintf(f, "polegap %s: interrupted; stopping at the next safe point (Ctrl-C again quits at once)\n", name)
			}
		}()
		tctx, cancel := withTimeLimit(ctx, name, *timeLimit)
		defer cancel()
		env.Ctx = tctx
		err = action(env, pos)
		if le := timedOut(tctx, err); le != nil {
			err = le
		} else if xe, ok := err.(exitError); ok && timedOut(tctx, xe.err) != nil {
			err = exitError{xe.code, timedOut(tctx, xe.err)}
		} else if err == context.Canceled || stoppedSolve(err) {
			err = errInterrupted // a bare ctx.Err() or a solve stopped by it; other wrapped ones say more
		} else if xe, ok := err.(exitError); ok && (xe.err == context.Canceled || stoppedSolve(xe.err)) {
			err = exitError{xe.code, errInterrupted}
		}
	}
	if err != nil {
		var ue *usageError
		var fe flagError
		var xe exitError
		if errors.As(err, &xe) {
			if xe.err != nil {
				fmt.Fprintf(stderr, "polegap %s: %v\n", name, xe.err)
			}
			return xe.code
		}
		switch {
		case errors.As(err, &ue), errors.As(err, &fe):
			fmt.Fprintf(stderr, "polegap %s: %v\nusage: polegap %s\nRun 'polegap help %s' for details.\n", name, err, c.UsageLine, name)
			return 2
		}
		fmt.Fprintf(stderr, "polegap %s: %v\n", name, err)
		printHistory(stderr, err)
		return 1
	}
	return 0
}

// printHistory prints the residual history of a Newton run that did not
// converge, so the user sees whether it stalled, oscillated or diverged.
func printHistory(w io.Writer, err error) {
	var nc *solver.NotConvergedError
	if !errors.As(err, &nc) || len(nc.History) == 0 {
		return
	}
	fmt.Fprintf(w, "residual history (relative, one per Newton step):\n")
	for i, r := range nc.History {
		fmt.Fprintf(w, "  %3d  %.3e\n", i, r)
	}
	fmt.Fprintf(w, "no result was written. Try a smaller current step (sweep with more points), --max-iterations, or check the B-H curve near the working point.\n")
}

// flagError is a mistake in the flags, reported with the flags spelled
// as polegap documents them (--name; the flag package writes -name).
type flagError struct{ error }

func (e flagError) Error() string {
	msg := e.error.Error()
	for _, s := range []string{"for flag -", "not defined: -"} {
		msg = strings.Replace(msg, s, s+"-", 1)
	}
	return msg
}

// errInterrupted ends a command stopped by Ctrl-C (exit status 1).
var errInterrupted = errors.New("interrupted (Ctrl-C); no result was written")

// interruptible returns the context of a command: cancelled by Ctrl-C.
// Tests replace it.
var interruptible = func() (context.Context, context.CancelFunc) {
	return signal.NotifyContext(context.Background(), os.Interrupt)
}

// exitError ends a command with a given status; a nil err prints nothing.
type exitError struct {
	code int
	err  error
}

func (e exitError) Error() string {
	if e.err == nil {
		return ""
	}
	return e.err.Error()
}

// parseInterspersed parses flags that may come before, between or after
// the positional arguments ("polegap mesh model.yaml --vtu m.vtu"). A
// "--" ends the flags: every argument after it is positional, even one
// that starts with a dash.
func parseInterspersed(fs *flag.FlagSet, args []string) ([]string, error) {
	var pos []string
	for {
		if err := fs.Parse(args); err != nil {
			if errors.Is(err, flag.ErrHelp) {
				return nil, err
			}
			return nil, flagError{err}
		}
		rest := fs.Args()
		if used := len(args) - len(rest); used > 0 && args[used-1] == "--" && !takesValue(fs, args[:used-1]) {
			return append(pos, rest...), nil // fs.Parse stopped at "--"
		}
		if len(rest) == 0 {
			return pos, nil
		}
		pos = append(pos, rest[0])
		args = rest[1:]
	}
}

// takesValue reports whether the last of args is a flag waiting for its
// value (--png followed by a file named "--").
func takesValue(fs *flag.FlagSet, args []string) bool {
	if len(args) == 0 {
		return false
	}
	a := args[len(args)-1]
	if len(a) < 2 || a[0] != '-' || a == "--" || strings.Contains(a, "=") {
		return false
	}
	f := fs.Lookup(strings.TrimLeft(a, "-"))
	if f == nil {
		return false
	}
	b, ok := f.Value.(interface{ IsBoolFlag() bool })
	return !ok || !b.IsBoolFlag()
}

func printUsage(w io.Writer) {
	fmt.Fprint(w, "polegap designs iron-core electromagnets with 2D finite elements.\n\nUsage:\n\n\tpolegap <command> [arguments]\n\nThe commands are:\n\n")
	for _, c := range commands {
		fmt.Fprintf(w, "\t%-10s %s\n", c.Name(), c.Short)
	}
	fmt.Fprint(w, "\nUse 'polegap help <command>' for more about a command.\n")
	fmt.Fprint(w, "\nSafety. polegap's figures are design estimates; solve, size, sweep and check\nprint these cautions quantified from the design:\n\n")
	for _, c := range caution.List(caution.Facts{}) {
		fmt.Fprintf(w, "  - %s\n", c.Text)
	}
}

func printHelp(w io.Writer, c *Command) {
	fmt.Fprintf(w, "usage: polegap %s\n\n%s\n", c.UsageLine, strings.TrimSpace(c.Long))
	fs := flag.NewFlagSet(c.Name(), flag.ContinueOnError)
	c.Flags(fs)
	addTimeLimit(fs)
	var names []string
	fs.VisitAll(func(f *flag.Flag) {
		if !strings.HasPrefix(f.Usage, aliasPrefix) {
			names = append(names, f.Name)
		}
	})
	if len(names) == 0 {
		return
	}
	sort.Strings(names)
	fmt.Fprint(w, "\nFlags:\n")
	for _, n := range names {
		f := fs.Lookup(n)
		def := ""
		if f.DefValue != "" && f.DefValue != "false" && f.DefValue != "0" && !strings.Contains(f.Usage, "(default") {
			def = fmt.Sprintf(" (default %s)", f.DefValue)
		}
		switch v := f.Value.(type) {
		case *quantityFlag:
			if v.needUnit {
				def += " [unit required]"
			} else {
				def += fmt.Sprintf(" [no unit: %s]", v.kind.bareUnit())
			}
		case *quantityList:
			def += fmt.Sprintf(" [no unit: %s]", v.kind.bareUnit())
		}
		fmt.Fprintf(w, "  --%-12s %s%s\n", n, f.Usage, def)
	}
}

// stoppedSolve reports whether err is a Newton solve stopped by Ctrl-C
// (a *solver.NotConvergedError wrapping context.Canceled).
func stoppedSolve(err error) bool {
	var nc *solver.NotConvergedError
	return errors.As(err, &nc) && errors.Is(nc.Err, context.Canceled)
}
