package main

import (
	"flag"
	"fmt"
	"path/filepath"
	"time"

	"polegap/models"
	"polegap/post/output/report"
	"polegap/post/workflow/coil"
	"polegap/post/workflow/demo"
)

var cmdDemo = &Command{
	UsageLine: "demo [--out DIR] [MODEL]",
	Short:     "run the whole design job on the default embedded model",
	Long: `Demo runs the whole design job on polegap's default embedded model, a
bench C-core dipole (or on MODEL): it meshes and solves it with the
nonlinear B-H curve of its steel and prints what a designer reads off it
(gap field, uniformity, fringing, inductance, energy, saturation), checks
it, computes its excitation curve, finds the ampere-turns for its target
field and a water-cooled coil that delivers them, and writes everything to
a folder (--out, default polegap-demo): report.html (self-contained, with
the pictures), report.json, field.png, excitation.png and .csv,
windings.csv, mesh.png and solution.vtu for outside viewers.

It needs no input file, so it is the quickest way to see that polegap works
on a new machine; it takes well under a minute.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		out := fs.String("out", "polegap-demo", "folder for the report and pictures")
		return func(env *Env, args []string) error {
			var m *models.Model
			var err error
			switch len(args) {
			case 0:
				m, err = models.LoadExample(models.DefaultExample)
			case 1:
				m, err = loadModel(args[0])
			default:
				return usagef("demo takes at most one MODEL")
			}
			if err != nil {
				return err
			}
			start := time.Now()
			run, err := demo.RunAll(env.Ctx, m, demo.RunOptions{Cooling: coil.Water,
				Progress: func(stage string) { fmt.Fprintf(env.Stderr, "polegap demo: %s...\n", stage) }})
			if err != nil {
				return err
			}
			if err := report.WriteText(env.Stdout, run.Report); err != nil {
				return err
			}
			fmt.Fprintln(env.Stdout)
			if err := report.WriteCheck(env.Stdout, run.Check); err != nil {
				return err
			}
			if run.Sizing != nil {
				fmt.Fprintln(env.Stdout)
				if err := report.WriteSizingSummary(env.Stdout, run.Sizing); err != nil {
					return err
				}
			}
			fmt.Fprintf(env.Stderr, "polegap demo: drawing...\n")
			b, err := report.NewBundle(run)
			if err != nil {
				return err
			}
			demoHeader(b, args, m)
			names, err := report.WriteFolder(*out, run, b)
			if err != nil {
				return err
			}
			abs, _ := filepath.Abs(*out)
			fmt.Fprintf(env.Stdout, "\nwrote %d files to %s in %.1f s:\n", len(names), abs, time.Since(start).Seconds())
			for _, n := range names {
				fmt.Fprintf(env.Stdout, "  %s\n", n)
			}
			return nil
		}
	},
}
