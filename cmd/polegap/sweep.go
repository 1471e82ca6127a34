package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"os"
	"strconv"
	"strings"

	"polegap/internal/fileout"
	"polegap/models"
	"polegap/post/output/figure"
	"polegap/post/study"
	"polegap/post/workflow/design"
	"polegap/post/workflow/sweep"
	"polegap/solver"
)

var cmdSweep = &Command{
	UsageLine: "sweep [--from I] [--to I] [--points N | --currents I1,I2,...] [--coil NAME] [--probe NAME] [--gap LENGTH] [--csv FILE] [--png FILE] [--html FILE] [--shard K/N] MODEL",
	Short:     "compute the excitation curve: gap field against ampere-turns",
	Long: `Sweep solves the model at a range of coil currents on one mesh, each
solve starting from the previous one, and reports the field at the probe
(the model's target probe unless --probe names another) against
ampere-turns, with the magnet efficiency B g/(μ0 NI) when the gap length
is known (--gap, or the model's template), the largest |B| in the iron,
the stored energy and the Newton steps of each point.

The default range is --points 20 currents from a twentieth of --to up to
--to, which defaults to twice the model's own coil current. Currents
without a unit are in ampere; a --gap without a unit is in the model's
units.

Without --csv the table goes to standard output as CSV (for a pipe);
--csv writes it to a file (a partial table, marked "# partial", if the
sweep is interrupted with Ctrl-C or a point fails) and prints a short
table for the terminal instead. --png draws the curve with the ideal line
μ0 NI/g and the efficiency. A sweep past the model's own (rated) current
prints the cautions, quantified at its highest point (to standard error
when standard output carries the CSV).

--shard K/N runs only points K, K+N, K+2N, ... so that a batch scheduler's
job array can run a long sweep in parallel; join the shards' tables with
'polegap merge'.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		from := quantity(fs, "from", current, "first coil current (e.g. 5A)").in(anyFinite)
		to := quantity(fs, "to", current, "last coil current (default twice the model's)").in(anyFinite)
		points := intFlag(fs, "points", 20, count(1, 100000), "number of currents")
		list := &quantityList{kind: current, rng: &anyFinite}
		fs.Var(list, "currents", "comma-separated coil currents, instead of a range")
		coil := fs.String("coil", "", "the swept coil (default the first)")
		probe := fs.String("probe", "", "the probe whose field is reported")
		gap := quantity(fs, "gap", length, "gap length for the ideal line and the efficiency (e.g. 40mm)").in(positive)
		gap.metresBefore = true
		csvOut := fs.String("csv", "", "write the table to this CSV file")
		png := fs.String("png", "", "draw the curve to this .png, .svg or .pdf file")
		pf := addPictureFlags(fs, false)
		shard := fs.String("shard", "", "run shard K of N (e.g. 2/8)")
		html := addHTMLFlag(fs, "sweep")
		af := addAccuracyFlags(fs)
		return func(env *Env, args []string) error {
			m, err := modelArg(args)
			if err != nil {
				return err
			}
			opt := sweep.Options{Coil: *coil, Probe: *probe, Solver: solver.Options{}}
			if opt.Currents, err = sweepCurrents(m, *coil, from, to, list, *points); err != nil {
				return err
			}
			if opt.Shard, opt.Shards, err = parseShard(*shard); err != nil {
				return err
			}
			gap.noteBare(env.Stderr, m)
			opt.GapLength = m.Gap
			if gap.set {
				opt.GapLength = gap.SI(m)
			}
			fine, coarse, acc, err := solveToAccuracy(env, "sweep", m, af, opt.Solver)
			if err != nil {
				return err
			}
			opt.Progress = newProgress(env.Stderr)
			pts, runErr := sweepOn(env, fine, coarse, opt)
			meta := sweep.Meta{Model: m.Name, Probe: probeFor(m, *probe), Shard: *shard, Accuracy: accuracyNote(acc)}
			if *shard != "" {
				meta.Points = len(opt.Currents) // so that merge sees points missing at the end
			}
			if runErr != nil {
				meta.Partial = runErr.Error()
			}
			if *csvOut != "" && (len(pts) > 0 || runErr == nil) {
				if err := fileout.Write(*csvOut, func(w io.Writer) error { return sweep.WriteCSV(w, meta, pts) }); err != nil {
					return err
				}
			}
			if runErr != nil {
				var ie *sweep.InterruptedError
				if errors.As(runErr, &ie) && *csvOut != "" {
					return fmt.Errorf("%v; the %d finished points are in %s, marked partial", runErr, len(pts), *csvOut)
				}
				return runErr
			}
			if *png != "" {
				if err := figure.DrawExcitation(*png, m.Name, pts, opt.GapLength, figure.ModelMarks(m, opt.Coil, opt.Probe), pf.options()); err != nil {
					return err
				}
			}
			if html.set() {
				if err := htmlSweep(html, args[0], fine, acc, pts, opt.GapLength, meta); err != nil {
					return err
				}
			}
			return writeSweepOut(env, m, *coil, meta, pts, *csvOut)
		}
	},
}

var cmdMerge = &Command{
	UsageLine: "merge --csv OUT [--png FILE] [--gap LENGTH] SHARD.csv...",
	Short:     "join the tables of a sharded sweep or scan",
	Long: `Merge reads the CSV tables written by 'polegap sweep --shard K/N' (or
'polegap scan --shard K/N') and writes one table with every point (or
variant) in order. It refuses tables of
different models or probes and points present twice, and marks the result
partial (listing what is missing) when points are missing: every point
of the sweep, the last ones too, since each shard's table records the
sweep's number of points ("# points: N"). Points are numbered as the
tables' index column, from 0. Merge reads no model, so --gap needs a
unit (e.g. 40mm).`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		out := fs.String("csv", "", "write the merged table here (required)")
		png := fs.String("png", "", "draw the merged curve to this .png, .svg or .pdf file")
		pf := addPictureFlags(fs, false)
		gap := quantity(fs, "gap", length, "gap length for the ideal line and the efficiency, with its unit (e.g. 40mm)").in(positive)
		gap.needUnit = true
		return func(env *Env, args []string) error {
			if *out == "" || len(args) == 0 {
				return usagef("merge needs --csv OUT and at least one shard table")
			}
			if isScanTable(args[0]) {
				return mergeScan(env, *out, args)
			}
			metas, pts, err := readTables(args, sweep.ReadCSV)
			if err != nil {
				return err
			}
			meta, all, missing, err := sweep.Merge(metas, pts)
			if err != nil {
				return err
			}
			if err := fileout.Write(*out, func(w io.Writer) error { return sweep.WriteCSV(w, meta, all) }); err != nil {
				return err
			}
			fmt.Fprintf(env.Stdout, "merged %d points from %d tables into %s\n", len(all), len(args), *out)
			if len(missing) > 0 {
				fmt.Fprintf(env.Stdout, "missing points (index, as in the tables' index column): %v\n", missing)
			}
			if meta.Points == 0 {
				fmt.Fprintf(env.Stdout, "note: no table records the sweep's number of points (\"# points: N\", written by sweep --shard since this version): points missing after the last one present cannot be seen\n")
			}
			if *png != "" {
				return figure.DrawExcitation(*png, meta.Model, all, gap.SI(nil), figure.ExcitationOptions{}, pf.options())
			}
			return nil
		}
	},
}

// sweepCurrents builds the list of currents from the flags.
func sweepCurrents(m *models.Model, coil string, from, to *quantityFlag, list *quantityList, n int) ([]float64, error) {
	if list.vals != nil {
		return list.SI(m), nil
	}
	if n < 1 {
		return nil, usagef("--points must be at least 1")
	}
	base := 0.0
	for _, c := range m.Coils {
		if coil == "" || c.Name == coil {
			base = c.Current
			break
		}
	}
	hi := 2 * base
	if to.set {
		hi = to.SI(m)
	}
	lo := hi / float64(n)
	if from.set {
		lo = from.SI(m)
	}
	if hi == 0 {
		return nil, usagef("the model's coil carries no current: give --to")
	}
	return sweep.Range(lo, hi, n), nil
}

func parseShard(s string) (k, n int, err error) {
	if s == "" {
		return 0, 0, nil
	}
	a, b, ok := strings.Cut(s, "/")
	k, err1 := strconv.Atoi(a)
	n, err2 := strconv.Atoi(b)
	if !ok || err1 != nil || err2 != nil || n < 1 || k < 1 || k > n {
		return 0, 0, usagef("--shard %q: write K/N with 1 <= K <= N, e.g. 3/8", s)
	}
	return k, n, nil
}

func probeFor(m *models.Model, probe string) string {
	if probe != "" {
		return probe
	}
	return m.MainProbe()
}

// newProgress makes the sweep's progress reporter; tests replace it.
var newProgress = progressBar

// progressBar draws the sweep's progress on a terminal and stays silent
// otherwise (a pipe or a file gets no control characters).
func progressBar(w io.Writer) func(done, total int, p sweep.Point) {
	f, ok := w.(*os.File)
	if !ok {
		return nil
	}
	if st, err := f.Stat(); err != nil || st.Mode()&os.ModeCharDevice == 0 {
		return nil
	}
	return func(done, total int, p sweep.Point) {
		const width = 30
		n := done * width / total
		fmt.Fprintf(w, "\r[%s%s] %d/%d  I = %.4g A  B = %.4f T ", strings.Repeat("#", n), strings.Repeat(".", width-n), done, total, p.Current, p.Field)
		if done == total {
			fmt.Fprintln(w)
		}
	}
}

// sweepOn runs the sweep on the final mesh of the adaptive refinement
// and, when there is one, beside it on the mesh before it, whose
// difference gives each point's error estimates (sweep.Both).
func sweepOn(env *Env, fine, coarse *study.Result, opt sweep.Options) ([]sweep.Point, error) {
	if coarse != nil {
		fmt.Fprintf(env.Stderr, "polegap sweep: the same points on the coarser mesh, for the error estimates\n")
	}
	return sweep.Both(env.Ctx, fine, coarse, opt)
}

// accuracyNote says in a line how converged a table's numbers are.
func accuracyNote(a *design.Accuracy) string {
	switch {
	case a == nil:
		return ""
	case a.Target == 0:
		return "quick mode, not converged, no estimates"
	case a.Reached:
		return fmt.Sprintf("%.0e relative reached at the model's currents after %d meshes; estimates per point from the mesh before", a.Target, a.Rounds)
	}
	return fmt.Sprintf("%.0e relative NOT reached at the model's currents (refinement limit, %d meshes); estimates per point from the mesh before", a.Target, a.Rounds)
}

// readTables reads the shard tables named in args with read (a sweep's or
// a scan's ReadCSV), in order.
func readTables[M, R any](args []string, read func(io.Reader, string) (M, []R, error)) ([]M, [][]R, error) {
	var metas []M
	var rows [][]R
	for _, a := range args {
		f, err := os.Open(a)
		if err != nil {
			return nil, nil, err
		}
		meta, r, err := read(f, a)
		f.Close()
		if err != nil {
			return nil, nil, err
		}
		metas, rows = append(metas, meta), append(rows, r)
	}
	return metas, rows, nil
}
