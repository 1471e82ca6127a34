package main

import (
	"flag"
	"fmt"

	"polegap/models"
	"polegap/post/report"
	"polegap/post/study"
)

var cmdDemo = &Command{
	UsageLine: "demo [--png FILE]",
	Short:     "run the default embedded model end to end",
	Long: `Demo runs polegap on its default embedded model, a bench C-core dipole,
meshes and solves it with the nonlinear B-H curve of its steel, and prints
what a designer reads off it: the field at the gap centre and over the
good-field region, the stored energy, and how the solve converged. It needs no input file, so it is
the quickest way to see that polegap works on a new machine.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		png := fs.String("png", "", "also draw the field map to this .png or .svg file")
		return func(env *Env, args []string) error {
			if len(args) != 0 {
				return usagef("demo takes no arguments")
			}
			m, err := models.LoadExample(models.DefaultExample)
			if err != nil {
				return err
			}
			s, err := study.Run(m, study.Options{})
			if err != nil {
				return err
			}
			if err := report.New(s, report.DesignOptions{Incremental: true}).WriteText(env.Stdout); err != nil {
				return err
			}
			if *png != "" {
				if err := report.DrawField(s, *png); err != nil {
					return err
				}
				fmt.Fprintf(env.Stdout, "\nfield map drawn to %s\n", *png)
			}
			return nil
		}
	},
}
