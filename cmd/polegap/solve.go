package main

import (
	"flag"

	"polegap/post/report"
	"polegap/post/study"
	"polegap/solver"
)

var cmdSolve = &Command{
	UsageLine: "solve [--json] [--png FILE] [--tol R] [--max-iterations N] MODEL",
	Short:     "solve a model and print the field at its probes",
	Long: `Solve meshes the model, solves for the magnetic vector potential (with
Newton–Raphson when the iron is nonlinear) and prints a summary: the mesh
size, how the solve converged, timings, the stored energy and the field at
each probe. With --json it prints the same as JSON: "mesh" {nodes,
triangles}, "newton" {iterations, residual, converged}, and "probes" keyed
by name (point probes give a, bx, by and b in tesla).

A solve that does not converge prints its residual history and exits
with status 1; no result is reported for it.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		asJSON := fs.Bool("json", false, "print the report as JSON")
		tol := fs.Float64("tol", 1e-8, "relative residual at which Newton stops")
		maxIter := fs.Int("max-iterations", 30, "limit on Newton steps")
		png := fs.String("png", "", "draw the field map (|B| and flux lines) to this .png or .svg file")
		return func(env *Env, args []string) error {
			if err := oneModel(args); err != nil {
				return err
			}
			if *tol <= 0 || *tol >= 1 || *maxIter < 1 {
				return usagef("--tol must lie in (0, 1) and --max-iterations be at least 1")
			}
			m, err := loadModel(args[0])
			if err != nil {
				return err
			}
			s, err := study.Run(m, study.Options{Solver: solver.Options{Tol: *tol, MaxIter: *maxIter}})
			if err != nil {
				return err
			}
			r := report.New(s)
			if *png != "" {
				if err := report.DrawField(s, *png); err != nil {
					return err
				}
			}
			if *asJSON {
				return writeJSON(env.Stdout, r)
			}
			return r.WriteText(env.Stdout)
		}
	},
}
