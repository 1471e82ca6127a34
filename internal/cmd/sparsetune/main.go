package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"math"
	"os"
	"strconv"
	"strings"
	"time"

	"polegap/solver/sparse"
)

func main() { os.Exit(run(os.Args[1:], os.Stdout, os.Stderr)) }

// command is one table of the tool: flags defines its flags on fs and
// returns the function that prints the table.
type command struct {
	name  string
	short string
	flags func(fs *flag.FlagSet) func(out io.Writer) error
}

var commands = []command{
	{"order", "orderings: nnz(L), multiply-adds and ordering time", orderCmd},
	{"solve", "whole linear solves: analyze, factor and solve times, Cholesky and IC(0)-PCG", solveCmd},
	{"nd", "nested dissection under settings of NDOptions", ndCmd},
	{"relax", "Cholesky under settings of SupernodeOptions", relaxCmd},
}

// usageError is a mistake on the command line (exit status 2).
type usageError struct{ error }

func run(args []string, stdout, stderr io.Writer) int {
	if len(args) == 0 || args[0] == "help" || args[0] == "-h" || args[0] == "-help" {
		usage(stderr)
		return 2
	}
	for _, c := range commands {
		if c.name != args[0] {
			continue
		}
		fs := flag.NewFlagSet(c.name, flag.ContinueOnError)
		fs.SetOutput(stderr)
		table := c.flags(fs)
		if err := fs.Parse(args[1:]); err != nil {
			return 2
		}
		if fs.NArg() > 0 {
			fmt.Fprintf(stderr, "sparsetune %s: unexpected arguments %q\n", c.name, fs.Args())
			return 2
		}
		if err := table(stdout); err != nil {
			fmt.Fprintf(stderr, "sparsetune %s: %v\n", c.name, err)
			var ue usageError
			if errors.As(err, &ue) {
				return 2
			}
			return 1
		}
		return 0
	}
	fmt.Fprintf(stderr, "sparsetune: unknown command %q\n", args[0])
	usage(stderr)
	return 2
}

func usage(w io.Writer) {
	fmt.Fprintf(w, "usage: sparsetune <command> [flags]   (sparsetune <command> -h lists the flags)\n\ncommands:\n")
	for _, c := range commands {
		fmt.Fprintf(w, "  %-6s %s\n", c.name, c.short)
	}
}

// matrixFlags are the matrices a table runs on.
type matrixFlags struct {
	grid, ccore, mtx *string
}

func addMatrixFlags(fs *flag.FlagSet, grid, ccore string) matrixFlags {
	return matrixFlags{
		grid:  fs.String("grid", grid, "jittered unit-square grids: comma-separated cells per side (101: 10k unknowns, 317: 100k, 1001: 1M)"),
		ccore: fs.String("ccore", ccore, "benchmark C-core matrices: comma-separated node counts (10k, 100k, 1M or plain numbers)"),
		mtx:   fs.String("mtx", "", "comma-separated Matrix Market files (symmetric, both triangles or one)"),
	}
}

// matrices builds the matrices the flags name, grids first.
func (f matrixFlags) matrices() ([]matrix, error) {
	var ms []matrix
	for _, s := range splitList(*f.grid) {
		nx, err := strconv.Atoi(s)
		if err != nil || nx < 2 {
			return nil, usageError{fmt.Errorf("-grid: %q is not a cell count of at least 2", s)}
		}
		ms = append(ms, matrix{"grid", gridSystem(nx), nx})
	}
	for _, s := range splitList(*f.ccore) {
		n, err := parseCount(s)
		if err != nil || n < 100 {
			return nil, usageError{fmt.Errorf("-ccore: %q is not a node count of at least 100", s)}
		}
		ms = append(ms, matrix{"c-core", cCore(n), 0})
	}
	for _, path := range splitList(*f.mtx) {
		a, err := readMTX(path)
		if err != nil {
			return nil, err
		}
		ms = append(ms, matrix{path, a, 0})
	}
	if len(ms) == 0 {
		return nil, usageError{errors.New("no matrix: give -grid, -ccore or -mtx")}
	}
	return ms, nil
}

func splitList(s string) []string {
	var out []string
	for _, f := range strings.Split(s, ",") {
		if f = strings.TrimSpace(f); f != "" {
			out = append(out, f)
		}
	}
	return out
}

// parseCount reads 10k, 1M or a plain number.
func parseCount(s string) (int, error) {
	mul := 1.0
	switch {
	case strings.HasSuffix(s, "k"):
		mul, s = 1e3, strings.TrimSuffix(s, "k")
	case strings.HasSuffix(s, "M"):
		mul, s = 1e6, strings.TrimSuffix(s, "M")
	}
	v, err := strconv.ParseFloat(s, 64)
	return int(v * mul), err
}

// timed runs fn repeat times and returns the best wall and CPU seconds.
func timed(repeat int, fn func()) (wall, cpu float64) {
	wall, cpu = 1e300, 1e300
	for r := 0; r < max(1, repeat); r++ {
		c0 := cpuSeconds()
		t0 := time.Now()
		fn()
		wall = min(wall, time.Since(t0).Seconds())
		cpu = min(cpu, cpuSeconds()-c0)
	}
	return wall, cpu
}

// symbolic returns nnz(L) and the multiply-adds of the factor under perm.
func symbolic(a *sparse.CSR, perm []int32) (int, float64, error) {
	if !sparse.IsPermutation(perm) || len(perm) != a.N {
		return 0, 0, errors.New("the ordering is not a permutation")
	}
	ch := &sparse.Cholesky{Options: sparse.CholeskyOptions{Perm: perm, Workers: 1}}
	if err := ch.Analyze(a); err != nil {
		return 0, 0, err
	}
	return ch.NNZL(), ch.Flops(), nil
}

// orderCmd: the figures of solver/sparse doc.go, Orderings.
func orderCmd(fs *flag.FlagSet) func(io.Writer) error {
	mf := addMatrixFlags(fs, "71,101,173,317,548", "10k,100k")
	repeat := fs.Int("repeat", 1, "runs per ordering; the best time is printed")
	return func(out io.Writer) error {
		ms, err := mf.matrices()
		if err != nil {
			return err
		}
		fmt.Fprintf(out, "%-7s %8s %-18s %11s %9s %8s %8s\n", "matrix", "n", "ordering", "nnz(L)", "madds", "wall-s", "cpu-s")
		for _, m := range ms {
			type ord struct {
				name  string
				order func() []int32
			}
			ords := []ord{
				{"nested-dissection", func() []int32 { return sparse.Order(m.a, sparse.NestedDissection) }},
				{"amd", func() []int32 { return sparse.Order(m.a, sparse.AMD) }},
			}
			if m.nx > 0 {
				ords = append(ords, ord{"geometric", func() []int32 { return geoND(m.nx) }})
			}
			for _, o := range ords {
				var p []int32
				wall, cpu := timed(*repeat, func() { p = o.order() })
				nnzL, madds, err := symbolic(m.a, p)
				if err != nil {
					return fmt.Errorf("%s n=%d %s: %w", m.name, m.a.N, o.name, err)
				}
				fmt.Fprintf(out, "%-7s %8d %-18s %11d %9.3g %8.3f %8.3f\n", m.name, m.a.N, o.name, nnzL, madds, wall, cpu)
			}
		}
		return nil
	}
}

// solveCmd: the figures of solver/sparse doc.go, Figures.
func solveCmd(fs *flag.FlagSet) func(io.Writer) error {
	mf := addMatrixFlags(fs, "101,317", "")
	return func(out io.Writer) error {
		ms, err := mf.matrices()
		if err != nil {
			return err
		}
		fmt.Fprintf(out, "%-7s %9s %-26s %11s %9s %9s %9s %9s %9s %9s %8s\n", "matrix", "n", "method", "nnz(L)", "madds", "analyze", "factor", "solve", "total", "cpu", "iters")
		for _, m := range ms {
			a := m.a
			rhs := make([]float64, a.N)
			for i := range rhs {
				rhs[i] = math.Sin(float64(i)) + 0.5
			}
			x := make([]float64, a.N)
			for _, o := range []sparse.Ordering{sparse.NestedDissection, sparse.AMD} {
				ch := &sparse.Cholesky{Options: sparse.CholeskyOptions{Ordering: o}}
				t, _, err := phases(ch, a, x, rhs)
				if err != nil {
					return fmt.Errorf("%s n=%d cholesky/%v: %w", m.name, a.N, o, err)
				}
				fmt.Fprintf(out, "%-7s %9d %-26s %11d %9.3g %9.3f %9.3f %9.3f %9.3f %9.3f %8s\n", m.name, a.N, "cholesky/"+o.String(),
					ch.NNZL(), ch.Flops(), t[0], t[1], t[2], t[0]+t[1]+t[2], t[3], "-")
			}
			p := &sparse.PCG{}
			t, res, err := phases(p, a, x, rhs)
			if err != nil {
				return fmt.Errorf("%s n=%d pcg/ic0: %w", m.name, a.N, err)
			}
			fmt.Fprintf(out, "%-7s %9d %-26s %11s %9s %9.3f %9.3f %9.3f %9.3f %9.3f %8d\n", m.name, a.N, "pcg/ic0 to 1e-10", "-", "-",
				t[0], t[1], t[2], t[0]+t[1]+t[2], t[3], res.Iterations)
		}
		return nil
	}
}

// phases runs Analyze, Factor and SolveTo and returns their wall seconds
// and the CPU seconds of the three.
func phases(s sparse.Solver, a *sparse.CSR, x, b []float64) ([4]float64, sparse.Result, error) {
	var t [4]float64
	c0 := cpuSeconds()
	t0 := time.Now()
	if err := s.Analyze(a); err != nil {
		return t, sparse.Result{}, err
	}
	t1 := time.Now()
	if err := s.Factor(a); err != nil {
		return t, sparse.Result{}, err
	}
	t2 := time.Now()
	res, err := s.SolveTo(x, b)
	t3 := time.Now()
	t = [4]float64{t1.Sub(t0).Seconds(), t2.Sub(t1).Seconds(), t3.Sub(t2).Seconds(), cpuSeconds() - c0}
	return t, res, err
}

// ndCmd orders one matrix under settings of NDOptions.
func ndCmd(fs *flag.FlagSet) func(io.Writer) error {
	mf := addMatrixFlags(fs, "", "100k")
	set := fs.String("set", "base", "settings separated by ';', each a comma-separated list of knob=value; knobs: "+
		"leaf, leafshare, coarsento, balance, trials, initpasses, passes, parallel, visit (swapped, natural, shuffled); "+
		"'base' is the default. Ordering is serial (parallel=-1) unless parallel is set")
	repeat := fs.Int("repeat", 3, "orderings per setting; the best time is printed")
	return func(out io.Writer) error {
		var opts []sparse.NDOptions
		labels := splitSets(*set)
		for _, s := range labels {
			o, err := ndSetting(s)
			if err != nil {
				return usageError{err}
			}
			opts = append(opts, o)
		}
		ms, err := mf.matrices()
		if err != nil {
			return err
		}
		fmt.Fprintf(out, "%-7s %8s %-40s %11s %9s %8s %8s\n", "matrix", "n", "setting", "nnz(L)", "madds", "wall-s", "cpu-s")
		for _, m := range ms {
			for k, o := range opts {
				var p []int32
				wall, cpu := timed(*repeat, func() { p = sparse.OrderND(m.a, o) })
				nnzL, madds, err := symbolic(m.a, p)
				if err != nil {
					return fmt.Errorf("%s n=%d %s: %w", m.name, m.a.N, labels[k], err)
				}
				fmt.Fprintf(out, "%-7s %8d %-40s %11d %9.3g %8.3f %8.3f\n", m.name, m.a.N, labels[k], nnzL, madds, wall, cpu)
			}
		}
		return nil
	}
}

func splitSets(s string) []string {
	var out []string
	for _, f := range strings.Split(s, ";") {
		if f = strings.TrimSpace(f); f != "" {
			out = append(out, f)
		}
	}
	return out
}

// knobs parses "k=v,k=v" (or "base") and calls set for each pair.
func knobs(s string, set func(k, v string) error) error {
	if s == "base" {
		return nil
	}
	for _, kv := range strings.Split(s, ",") {
		k, v, ok := strings.Cut(strings.TrimSpace(kv), "=")
		if !ok {
			return fmt.Errorf("%q: want knob=value", kv)
		}
		if err := set(k, v); err != nil {
			return fmt.Errorf("%q: %w", kv, err)
		}
	}
	return nil
}

func ndSetting(s string) (sparse.NDOptions, error) {
	o := sparse.NDOptions{Parallel: -1}
	err := knobs(s, func(k, v string) error {
		var err error
		switch k {
		case "leaf":
			o.Leaf, err = strconv.Atoi(v)
		case "leafshare":
			o.LeafShare, err = strconv.ParseFloat(v, 64)
		case "coarsento":
			o.CoarsenTo, err = strconv.Atoi(v)
		case "balance":
			o.Balance, err = strconv.ParseFloat(v, 64)
		case "trials":
			o.Trials, err = strconv.Atoi(v)
		case "initpasses":
			o.InitPasses, err = strconv.Atoi(v)
		case "passes":
			o.Passes, err = strconv.Atoi(v)
		case "parallel":
			o.Parallel, err = strconv.Atoi(v)
		case "visit":
			switch v {
			case "swapped":
				o.Visit = sparse.MatchSwapped
			case "natural":
				o.Visit = sparse.MatchNatural
			case "shuffled":
				o.Visit = sparse.MatchShuffled
			default:
				err = errors.New("visit is swapped, natural or shuffled")
			}
		default:
			err = errors.New("unknown knob")
		}
		return err
	})
	return o, err
}

// relaxCmd factors one matrix under settings of SupernodeOptions, with the
// same nested dissection permutation for all.
func relaxCmd(fs *flag.FlagSet) func(io.Writer) error {
	mf := addMatrixFlags(fs, "317", "")
	set := fs.String("set", "always=4;base;always=8,zeros16=0.6,zeros48=0.2,zeroswide=0.05;always=16,zeros16=0.7,zeros48=0.3,zeroswide=0.05;always=2,zeros16=0.3,zeros48=0.05,zeroswide=0.01",
		"settings separated by ';', each a comma-separated list of knob=value; knobs: always, zeros16, zeros48, zeroswide; 'base' is the default")
	repeat := fs.Int("repeat", 3, "factorizations per setting (one worker); the best time is printed")
	return func(out io.Writer) error {
		var opts []sparse.SupernodeOptions
		labels := splitSets(*set)
		for _, s := range labels {
			var o sparse.SupernodeOptions
			err := knobs(s, func(k, v string) error {
				var err error
				switch k {
				case "always":
					o.Always, err = strconv.Atoi(v)
				case "zeros16":
					o.Zeros16, err = strconv.ParseFloat(v, 64)
				case "zeros48":
					o.Zeros48, err = strconv.ParseFloat(v, 64)
				case "zeroswide":
					o.ZerosWide, err = strconv.ParseFloat(v, 64)
				default:
					err = errors.New("unknown knob")
				}
				return err
			})
			if err != nil {
				return usageError{err}
			}
			opts = append(opts, o)
		}
		ms, err := mf.matrices()
		if err != nil {
			return err
		}
		fmt.Fprintf(out, "%-7s %8s %-52s %11s %9s %9s %8s\n", "matrix", "n", "setting", "nnz(L)", "madds", "factor-s", "cpu-s")
		for _, m := range ms {
			perm := sparse.Order(m.a, sparse.NestedDissection)
			for k, o := range opts {
				ch := &sparse.Cholesky{Options: sparse.CholeskyOptions{Perm: perm, Workers: 1, Supernodes: o}}
				if err := ch.Analyze(m.a); err != nil {
					return err
				}
				var ferr error
				wall, cpu := timed(*repeat, func() { ferr = ch.Factor(m.a) })
				if ferr != nil {
					return fmt.Errorf("%s n=%d %s: %w", m.name, m.a.N, labels[k], ferr)
				}
				fmt.Fprintf(out, "%-7s %8d %-52s %11d %9.3g %9.3f %8.3f\n", m.name, m.a.N, labels[k], ch.NNZL(), ch.Flops(), wall, cpu)
			}
		}
		return nil
	}
}
