package main

import (
	"flag"
	"fmt"
	"math"
	"strconv"
	"strings"

	"polegap/internal/bench"
)

var cmdBench = &Command{
	UsageLine: "bench [--sizes 10k,100k,1M] [--order2 N] [--repeat N] [--curve-all] [--quick] [--json]",
	Short:     "measure speed and memory on generated C-core models",
	Long: `Bench generates a C-core dipole in low-carbon steel at about 10k, 100k
and 1M nodes (first order) and one second-order case at 100k nodes, and
measures in one run, for each: the mesher (time, triangles per second);
the linear solve with the steel taken as μr = 1000, split into assembly,
fill-reducing ordering with symbolic analysis, numeric Cholesky
factorization and triangular solves; the same system by IC(0)-preconditioned
conjugate gradients (on cases up to 100k nodes unless --pcg-all: at 1M
it takes about 7 minutes); the nonlinear Newton solve to a relative residual of
1e-8 and its iterations; a 20-point excitation curve (on cases up to 100k
nodes unless --curve-all); the peak Go heap and resident memory, the live
heap with the solve's factor held, and both per node without the
Cholesky factor. It then fits the growth
exponent p of each cost ∝ N^p over the first-order sizes and prints each
figure beside the goal of the design notes with a verdict (ok or MISSED).

Timings depend on the machine and on its load: the table prints the load
average at start and end and the CPU time of each stage beside its wall
time. Compare figures from one run, on an idle machine where possible;
--repeat N keeps the median of N runs of each stage (not of the curve).
The 1M case needs about 1.5 GB of memory and takes about a minute;
--quick runs 10k and 100k only.

Last, it times the bench-dipole example at the default accuracy as solve
and sweep run it (adaptive refinement with error estimates; the report
with incremental inductance and virtual-work forces; the 20-point
excitation curve on the last two meshes), with the nodes and Newton
steps of each round, against the goals of 0.5 s and 3 s.

Progress goes to standard error; --json prints the table as JSON.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		sizes := fs.String("sizes", "10k,100k,1M", "first-order node counts (k = 1e3, M = 1e6)")
		order2 := fs.String("order2", "100k", "node count of the second-order case, or 0 for none")
		repeat := intFlag(fs, "repeat", 1, count(1, 1000), "runs of each stage; the median is reported")
		quick := fs.Bool("quick", false, "only the 10k and 100k first-order cases and the second-order case")
		curveAll := fs.Bool("curve-all", false, "draw the excitation curve at every size, 1M included")
		pcgAll := fs.Bool("pcg-all", false, "run the conjugate-gradient comparison at every size, 1M included (about 7 minutes there)")
		asJSON := fs.Bool("json", false, "print the table as JSON")
		return func(env *Env, args []string) error {
			if len(args) > 0 {
				return usagef("bench takes no arguments, got %q", args)
			}
			ns, err := parseSizes(*sizes)
			if *quick {
				ns, err = bench.QuickSizes, nil
			}
			if err != nil {
				return usagef("--sizes: %v", err)
			}
			n2 := 0
			if *order2 != "0" {
				o2, err := parseSizes(*order2)
				if err != nil || len(o2) != 1 {
					return usagef("--order2: one size such as 100k, or 0")
				}
				n2 = o2[0]
			}
			opt := bench.Options{Repeat: *repeat, Accurate: true, Progress: func(c bench.Case, stage string) {
				fmt.Fprintf(env.Stderr, "bench: %s (%d nodes, order %d): %s\n", c.Name, c.Nodes, c.Order, stage)
			}, Done: func(r bench.Result) {
				fmt.Fprintf(env.Stderr, "bench: %s done: %d nodes, mesh %.3g s, linear %.3g s, nonlinear %.3g s\n", r.Case, r.Nodes, r.Mesh, r.Linear, r.Nonlinear)
			}}
			t, err := bench.Run(env.Ctx, bench.Cases(ns, n2, *curveAll, *pcgAll), opt)
			if err != nil {
				return err
			}
			if *asJSON {
				return t.WriteJSON(env.Stdout)
			}
			return t.WriteText(env.Stdout)
		}
	},
}

// parseSizes reads a comma-separated list of node counts such as
// "10k,100k,1M" (suffixes k = 1e3 and M = 1e6; decimals allowed: 2.5k).
// Each size must be between 1000 and 10M nodes.
func parseSizes(s string) ([]int, error) {
	var out []int
	for _, f := range strings.Split(s, ",") {
		f = strings.TrimSpace(f)
		if f == "" {
			return nil, &sizeError{Entry: f, Reason: "empty entry"}
		}
		mult := 1.0
		num := f
		switch {
		case strings.HasSuffix(f, "k"), strings.HasSuffix(f, "K"):
			mult, num = 1e3, f[:len(f)-1]
		case strings.HasSuffix(f, "M"), strings.HasSuffix(f, "m"):
			mult, num = 1e6, f[:len(f)-1]
		}
		v, err := strconv.ParseFloat(num, 64)
		if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
			return nil, &sizeError{Entry: f, Reason: "not a number (use e.g. 10k, 100k, 1M)"}
		}
		n := v * mult
		if n < 1000 || n > 10e6 {
			return nil, &sizeError{Entry: f, Reason: "a size must lie between 1k and 10M nodes"}
		}
		out = append(out, int(math.Round(n)))
	}
	return out, nil
}

// sizeError reports an entry of a size list that is not a node count.
type sizeError struct {
	Entry  string
	Reason string
}

func (e *sizeError) Error() string {
	return fmt.Sprintf("size %q: %s", e.Entry, e.Reason)
}
