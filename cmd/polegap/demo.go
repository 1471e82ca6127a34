package main

import (
	"flag"
	"fmt"
	"time"

	"polegap/models"
	"polegap/post/prepare"
)

var cmdDemo = &Command{
	UsageLine: "demo [--png FILE]",
	Short:     "run the default embedded model end to end",
	Long: `Demo runs polegap on its default embedded model, a bench C-core dipole,
and prints what a designer reads off it. It needs no input file, so it is
the quickest way to see that polegap works on a new machine.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		png := fs.String("png", "", "also draw the mesh to this .png or .svg file")
		return func(env *Env, args []string) error {
			if len(args) != 0 {
				return usagef("demo takes no arguments")
			}
			m, err := models.LoadExample(models.DefaultExample)
			if err != nil {
				return err
			}
			start := time.Now()
			d, err := prepare.Discretize(m)
			if err != nil {
				return err
			}
			printMeshStats(env.Stdout, d, time.Since(start))
			if *png != "" {
				if err := drawMesh(*png, d); err != nil {
					return err
				}
				fmt.Fprintf(env.Stdout, "\nmesh drawn to %s\n", *png)
			}
			return nil
		}
	},
}
