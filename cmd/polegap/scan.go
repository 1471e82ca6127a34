package main

import (
	"bufio"
	"errors"
	"flag"
	"fmt"
	"io"
	"os"
	"strconv"
	"strings"

	"gonum.org/v1/plot/vg"

	"polegap/internal/csvtab"
	"polegap/internal/fileout"
	"polegap/models"
	"polegap/post/output/figure"
	"polegap/post/output/plot"
	"polegap/post/workflow/coil"
	"polegap/post/workflow/scan"
)

var cmdScan = &Command{
	UsageLine: "scan --vary NAME=VALUES [--vary ...] [--lhs N [--seed S]] [--variants FILE] [--field B | --no-target] [--tolerance T] [--coil NAME] [--cooling KIND] [--fill F] [--temperature T] [--wires TABLE] [--csv FILE] [--json FILE] [--plot FILE --x COLUMN --y COLUMN] [--pareto FILE --objectives min:A,max:B] [--shard K/N] MODEL",
	Short:     "solve many variants of a design and tabulate their design quantities",
	Long: `Scan solves the model at variants of named parameters and writes one
table: for each variant the gap-centre field B0, the ampere-turns per
winding for the target field, the good-field half-width at --tolerance
(default 1e-4), the largest converged iron |B| (peak disc mean), the coil
power of the least-power winding at those ampere-turns, and the iron and
copper mass for the model's depth, each beside its error estimate (the
change from the mesh before the last of the adaptive refinement).

A parameter is a template dimension (pole-width, gap, chamfer, turns, ...,
in the model's units), depth, any key path of the model file
(materials.yoke-steel.curve), current:COIL or turns:COIL, or iron (the
permeability scale). --vary gives its values: a list (NAME=170,180,190,
or names), or a range NAME=LO:HI:N of N even steps. The variants are every
combination (a full grid, the first --vary slowest), or with --lhs N a
Latin hypercube of N variants over the ranges NAME=LO:HI (seeded by
--seed, default 1), or the rows of --variants FILE (a CSV whose header
names the parameters).

Each variant is solved on its own, so the table is the same whatever the
order or the machine. --shard K/N solves variants K, K+N, ... for a batch
scheduler's job array; join the shard tables with 'polegap merge'. Ctrl-C
keeps the finished rows in --csv, marked "# partial". A variant that
cannot be built or solved keeps its row with the error.

--plot draws column --y against column --x; --pareto draws two objectives
(--objectives min:power_W,max:half_width_m) with their Pareto front.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		var vary varyFlag
		fs.Var(&vary, "vary", "a parameter and its values: NAME=V1,V2,... or NAME=LO:HI:N (NAME=LO:HI with --lhs); repeat for more")
		lhs := intFlag(fs, "lhs", 0, count(0, 1000000), "a Latin hypercube of this many variants instead of the full grid")
		seed := intFlag(fs, "seed", 1, count(0, 1<<53), "seed of the Latin hypercube")
		list := fs.String("variants", "", "a CSV file of variants: a header of parameter names, one row per variant")
		want := quantity(fs, "field", field, "target field for the ampere-turns (default the model's target)")
		noTarget := fs.Bool("no-target", false, "skip the ampere-turn search; the power is at the model's own ampere-turns")
		tol := realFlag(fs, "tolerance", 1e-4, fraction, "relative tolerance of the good-field half-width (1e-3 or 1e-4)")
		coilName := fs.String("coil", "", "the coil of the ampere-turns and the power (default the first)")
		cooling := fs.String("cooling", "air-natural", "air-natural, air-forced or water")
		fill := realFlag(fs, "fill", 0, numRange{lo: 0, hi: 0.9069, hint: "0.9069 is the densest packing of round wires; 0 for the default"}, "fill factor of the winding (default 0.6)")
		temp := quantity(fs, "temperature", temperature, "coil temperature for the resistance, °C (default 60)")
		wires := fs.String("wires", "auto", "wire table: iec, awg, hollow or all")
		csvOut := fs.String("csv", "", "write the table to this CSV file")
		jsonOut := fs.String("json", "", "write the table to this JSON file")
		plotOut := fs.String("plot", "", "draw --y against --x to this .png or .svg file")
		xcol := fs.String("x", "", "the column on the plot's x axis (a parameter)")
		ycol := fs.String("y", "B0_T", "the column on the plot's y axis (a quantity)")
		paretoOut := fs.String("pareto", "", "draw the two --objectives and their Pareto front to this file")
		objectives := fs.String("objectives", "min:power_W,max:half_width_m", "two objectives, min:COLUMN or max:COLUMN")
		shard := fs.String("shard", "", "run shard K of N (e.g. 2/8)")
		af := addAccuracyFlags(fs)
		return func(env *Env, args []string) error {
			if err := oneModel(args); err != nil {
				return err
			}
			src, m, err := scanSource(args[0])
			if err != nil {
				return err
			}
			opt := scan.Options{Params: vary.params, Coil: *coilName, Tol: *tol, NoTarget: *noTarget, Quick: *af.quick}
			if opt.Variants, opt.Plan, err = scanVariants(&opt, *lhs, uint64(*seed), *list); err != nil {
				return err
			}
			if opt.Shard, opt.Shards, err = parseShard(*shard); err != nil {
				return err
			}
			if !*af.quick {
				if opt.Accuracy, err = af.target(m); err != nil {
					return err
				}
			}
			if want.set {
				opt.Target = want.SI(m)
			}
			opt.Spec = coil.Spec{FillFactor: *fill, Temperature: temp.SI(m)}
			if opt.Spec.Cooling, err = parseCooling(*cooling); err != nil {
				return usagef("--cooling: %v", err)
			}
			if opt.Wires, err = wireTable(*wires, opt.Spec.Cooling); err != nil {
				return usagef("--wires: %v", err)
			}
			meta := scan.Meta{Model: m.Name, Plan: opt.Plan, Variants: len(opt.Variants), Params: names(opt.Params), Shard: *shard,
				Settings: scanSettings(opt, *cooling, *wires)}
			opt.Progress = scanProgress(env.Stderr)
			rows, runErr := scan.Run(env.Ctx, src, opt)
			if runErr != nil {
				meta.Partial = runErr.Error()
			}
			if err := writeScan(*csvOut, *jsonOut, meta, rows); err != nil {
				return err
			}
			if runErr != nil {
				var ie *scan.InterruptedError
				if errors.As(runErr, &ie) && *csvOut != "" {
					return fmt.Errorf("%v; the %d finished variants are in %s, marked partial", runErr, len(rows), *csvOut)
				}
				return runErr
			}
			if err := drawScan(meta, rows, *plotOut, *xcol, *ycol, *paretoOut, *objectives); err != nil {
				return err
			}
			return scan.WriteCSV(env.Stdout, meta, rows)
		}
	},
}

// varyFlag collects the --vary parameters.
type varyFlag struct{ params []scan.Param }

func (v *varyFlag) String() string { return "" }

// Set reads NAME=V1,V2,..., NAME=LO:HI:N or NAME=LO:HI.
func (v *varyFlag) Set(s string) error {
	name, vals, ok := strings.Cut(s, "=")
	name, vals = strings.TrimSpace(name), strings.TrimSpace(vals)
	if !ok || name == "" || vals == "" {
		return fmt.Errorf("write NAME=V1,V2,... or NAME=LO:HI:N, e.g. pole-width=180:220:5")
	}
	p := scan.Param{Name: name}
	if parts := strings.Split(vals, ":"); len(parts) >= 2 && len(parts) <= 3 && !strings.Contains(vals, ",") {
		lo, err1 := strconv.ParseFloat(parts[0], 64)
		hi, err2 := strconv.ParseFloat(parts[1], 64)
		if err1 != nil || err2 != nil || !(hi > lo) {
			return fmt.Errorf("%s: a range is LO:HI or LO:HI:N with numbers LO < HI", name)
		}
		p.Lo, p.Hi = lo, hi
		if len(parts) == 3 {
			n, err := strconv.Atoi(parts[2])
			if err != nil || n < 2 {
				return fmt.Errorf("%s: the number of steps N in LO:HI:N must be 2 or more", name)
			}
			p.Values = scan.Range(lo, hi, n)
		}
	} else {
		for _, x := range strings.Split(vals, ",") {
			if x = strings.TrimSpace(x); x == "" {
				return fmt.Errorf("%s: an empty value in %q", name, vals)
			}
			p.Values = append(p.Values, x)
		}
	}
	for _, q := range v.params {
		if q.Name == name {
			return fmt.Errorf("%s is given twice", name)
		}
	}
	v.params = append(v.params, p)
	return nil
}

// scanVariants makes the variants from the flags: a list file, a Latin
// hypercube or the full grid.
func scanVariants(opt *scan.Options, lhs int, seed uint64, list string) ([][]string, string, error) {
	switch {
	case list != "":
		if len(opt.Params) > 0 || lhs > 0 {
			return nil, "", usagef("--variants gives the parameters itself: leave out --vary and --lhs")
		}
		params, rows, err := readVariants(list)
		opt.Params = params
		return rows, "list " + list, err
	case len(opt.Params) == 0:
		return nil, "", usagef("give the parameters to vary: --vary NAME=VALUES (or --variants FILE)")
	case lhs > 0:
		v, err := scan.LatinHypercube(opt.Params, lhs, seed)
		if err != nil {
			return nil, "", usagef("%v", err)
		}
		return v, fmt.Sprintf("latin hypercube, %d variants, seed %d", lhs, seed), nil
	}
	for _, p := range opt.Params {
		if len(p.Values) == 0 {
			return nil, "", usagef("--vary %s=LO:HI needs a number of steps for a grid (LO:HI:N), or --lhs N", p.Name)
		}
	}
	v, err := scan.Grid(opt.Params)
	if err != nil {
		return nil, "", usagef("%v", err)
	}
	return v, "grid", nil
}

// readVariants reads a CSV of variants: a header of parameter names and
// a row of values per variant. Errors carry file:line.
func readVariants(path string) ([]scan.Param, [][]string, error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, nil, err
	}
	defer f.Close()
	cr := csvtab.NewReader(bufio.NewReader(f))
	header, err := cr.Read()
	if err != nil {
		return nil, nil, fmt.Errorf("%s: %v", path, err)
	}
	params := make([]scan.Param, len(header))
	for i, h := range header {
		params[i].Name = h
	}
	var rows [][]string
	for {
		rec, err := cr.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			return nil, nil, fmt.Errorf("%s: %v", path, err)
		}
		if len(rec) != len(header) {
			return nil, nil, fmt.Errorf("%s:%d: the row has %d values for %d parameters", path, cr.Line(), len(rec), len(header))
		}
		rows = append(rows, append([]string(nil), rec...))
	}
	if len(rows) == 0 {
		return nil, nil, fmt.Errorf("%s: no variants below the header", path)
	}
	return params, rows, nil
}

// scanSource reads the model's text (a file, or an embedded example) and
// parses it once to check it.
func scanSource(arg string) (scan.Source, *models.Model, error) {
	src := scan.Source{File: arg}
	var err error
	if _, serr := os.Stat(arg); serr == nil {
		src.Data, err = os.ReadFile(arg)
	} else if src.Data, err = models.Example(arg); err == nil {
		src.File = "examples/" + arg + ".yaml"
	} else {
		return src, nil, fmt.Errorf("no model file %q (and no embedded example of that name; 'polegap examples' lists them)", arg)
	}
	if err != nil {
		return src, nil, err
	}
	m, err := models.Parse(src.File, src.Data)
	return src, m, err
}

func names(ps []scan.Param) []string {
	out := make([]string, len(ps))
	for i, p := range ps {
		out[i] = p.Name
	}
	return out
}

// scanSettings says in a line what the quantities are computed at.
func scanSettings(opt scan.Options, cooling, wires string) string {
	acc := "quick (no estimates)"
	if !opt.Quick {
		acc = fmt.Sprintf("accuracy %.0e", opt.Accuracy)
	}
	tgt := "the model's target"
	switch {
	case opt.NoTarget:
		tgt = "no target (power at the model's ampere-turns)"
	case opt.Target > 0:
		tgt = fmt.Sprintf("target %g T", opt.Target)
	}
	c := opt.Coil
	if c == "" {
		c = "first coil"
	}
	fill, temp := "default fill", "default temperature"
	if opt.Spec.FillFactor > 0 {
		fill = fmt.Sprintf("fill %g", opt.Spec.FillFactor)
	}
	if opt.Spec.Temperature != 0 {
		temp = fmt.Sprintf("%g °C", opt.Spec.Temperature)
	}
	return fmt.Sprintf("%s; %s; good field at %g; %s, %s cooling, %s wires, %s, %s",
		acc, tgt, opt.Tol, c, cooling, wires, fill, temp)
}

// writeScan writes the table to the files asked for (a partial table
// too, when it has rows).
func writeScan(csvOut, jsonOut string, meta scan.Meta, rows []scan.Row) error {
	if len(rows) == 0 && meta.Partial != "" {
		return nil
	}
	if csvOut != "" {
		if err := fileout.Write(csvOut, func(w io.Writer) error { return scan.WriteCSV(w, meta, rows) }); err != nil {
			return err
		}
	}
	if jsonOut != "" {
		return fileout.Write(jsonOut, func(w io.Writer) error { return scan.WriteJSON(w, meta, rows) })
	}
	return nil
}

// drawScan draws the quantity plot and the Pareto front asked for.
func drawScan(meta scan.Meta, rows []scan.Row, plotOut, xcol, ycol, paretoOut, objectives string) error {
	if plotOut != "" {
		if xcol == "" && len(meta.Params) > 0 {
			xcol = meta.Params[0]
		}
		x, err := scan.Column(meta, rows, xcol)
		if err != nil {
			return usagef("--x: %v", err)
		}
		y, err := scan.Column(meta, rows, ycol)
		if err != nil {
			return usagef("--y: %v", err)
		}
		est, _ := scan.Column(meta, rows, scan.EstimateName(ycol))
		p, err := figure.ScanQuantity(meta.Model+": "+ycol+" against "+xcol, xcol, ycol, x, y, est)
		if err != nil {
			return err
		}
		if err := plot.Save(p, 14*vg.Centimeter, 10*vg.Centimeter, plotOut); err != nil {
			return err
		}
	}
	if paretoOut == "" {
		return nil
	}
	parts := strings.Split(objectives, ",")
	if len(parts) != 2 {
		return usagef("--objectives: give two, e.g. min:power_W,max:half_width_m")
	}
	var obj [2]scan.Objective
	var col [2][]float64
	for i, s := range parts {
		o, err := scan.ParseObjective(strings.TrimSpace(s))
		if err != nil {
			return usagef("--objectives: %v", err)
		}
		if col[i], err = scan.Column(meta, rows, o.Column); err != nil {
			return usagef("--objectives: %v", err)
		}
		obj[i] = o
	}
	front := scan.Front(col[0], col[1], obj[0].Maximise, obj[1].Maximise)
	p, err := figure.Pareto(meta.Model+": Pareto front", obj[0].Column, obj[1].Column, col[0], col[1], front)
	if err != nil {
		return err
	}
	return plot.Save(p, 14*vg.Centimeter, 10*vg.Centimeter, paretoOut)
}

// scanProgress draws the scan's progress on a terminal and stays silent
// otherwise; tests replace it.
var scanProgress = func(w io.Writer) func(done, total int, r scan.Row) {
	bar := progressBar(w)
	if bar == nil {
		return nil
	}
	return func(done, total int, r scan.Row) {
		const width = 30
		n := done * width / total
		fmt.Fprintf(w, "\r[%s%s] %d/%d variants  %s  B0 = %.4f T ", strings.Repeat("#", n), strings.Repeat(".", width-n), done, total, strings.Join(r.Values, " "), r.Q[scan.B0])
		if done == total {
			fmt.Fprintln(w)
		}
	}
}

// mergeScan joins the shard tables of a design scan (merge's work when
// the first table is a scan's).
func mergeScan(env *Env, out string, args []string) error {
	metas, rows, err := readTables(args, scan.ReadCSV)
	if err != nil {
		return err
	}
	meta, all, missing, err := scan.Merge(metas, rows)
	if err != nil {
		return err
	}
	if err := fileout.Write(out, func(w io.Writer) error { return scan.WriteCSV(w, meta, all) }); err != nil {
		return err
	}
	fmt.Fprintf(env.Stdout, "merged %d variants from %d tables into %s\n", len(all), len(args), out)
	if len(missing) > 0 {
		fmt.Fprintf(env.Stdout, "missing variants (index, as in the tables' index column): %v\n", missing)
	}
	return nil
}

// isScanTable reports whether the file at path starts as a scan table.
func isScanTable(path string) bool {
	f, err := os.Open(path)
	if err != nil {
		return false
	}
	defer f.Close()
	line, _ := bufio.NewReader(f).ReadString('\n')
	return scan.IsTable(line)
}
