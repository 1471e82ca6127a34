package main

import (
	"flag"
	"fmt"
	"io"

	"polegap/internal/fileout"
	"polegap/post/workflow/adapt"
	"polegap/post/workflow/design"

	"polegap/post/output/figure"
	"polegap/post/output/report"
	"polegap/post/output/vtu"
	"polegap/post/study"
	"polegap/solver"
)

var cmdSolve = &Command{
	UsageLine: "solve [--accuracy R [--refine-by goal|energy]] [--stress-only] [--json] [--png FILE] [--vtu FILE] [--saturation-limit B] [--tolerance R] [--max-iterations N] MODEL",
	Short:     "solve a model and print the field and the design quantities",
	Long: `Solve meshes the model, solves for the magnetic vector potential (with
Newton–Raphson when the iron is nonlinear) and prints a summary: the mesh
size, how the solve converged, timings, the stored energy and the field at
each probe, and the design quantities: the gap field and the mean field
across the pole face, the field uniformity (the half-width within 1e-3 and
1e-4 along a mid-plane line probe, the deviation over a box probe), the
fringing (factor, effective width w + 2kg, effective gap), each coil's
flux linkage and apparent and incremental inductance, stored energy and
co-energy, and the saturation of each iron region (mean |B|, the area
above the knee of its curve, the largest |B| away from re-entrant
corners, where the raw maximum is mesh-dependent). Forces: each part the
model lists under forces and, for a model with a gap, the attraction
between its poles (the iron wholly above the gap's mid-plane), each by the
Maxwell stress and by virtual work, with their difference as the error
estimate; --stress-only skips the virtual work's solves. A point probe on
an interface between materials lists the field on each side. With --json
it prints the same as JSON: "mesh" {nodes,
triangles}, "newton" {iterations, residual, converged}, and "probes" keyed
by name (point probes give a, bx, by and b in tesla).

--accuracy R refines the mesh adaptively and re-solves until the probe
field changes by less than R between rounds, then reports on the last
mesh. --refine-by chooses where: goal (the default) weights the error
indicators of the solution by those of a dual solution for the probe
field; energy refines where the field's own error is largest, which
needed half the nodes of goal on a C-core deep in saturation.

A solve that does not converge prints its residual history and exits
with status 1; no result is reported for it.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		asJSON := fs.Bool("json", false, "print the report as JSON")
		tol := fs.Float64("tolerance", 1e-8, "relative residual at which Newton stops")
		alias(fs, "tol", "tolerance")
		maxIter := fs.Int("max-iterations", 30, "limit on Newton steps")
		png := fs.String("png", "", "draw the field map (|B| and flux lines) to this .png or .svg file")
		satLimit := quantity(fs, "saturation-limit", field, "flag iron regions whose |B| away from corners exceeds this (e.g. 1.8T)")
		accuracy := fs.Float64("accuracy", 0, "refine the mesh adaptively until the probe field changes by less than this between rounds (e.g. 1e-4)")
		refineBy := fs.String("refine-by", "goal", "with --accuracy: goal (weighted by the probe's dual solution) or energy (the field's own error)")
		stressOnly := fs.Bool("stress-only", false, "forces by Maxwell stress only: skip the virtual work (two solves per direction and part) and the error estimate")
		fs.Bool("virtual-work", false, aliasPrefix+"virtual work is computed by default now; the flag is kept for old scripts")
		vtuPath := fs.String("vtu", "", "write the solution (A, B, |B|, H, μr, region) to this VTK .vtu file")
		return func(env *Env, args []string) error {
			if err := oneModel(args); err != nil {
				return err
			}
			if *tol <= 0 || *tol >= 1 || *maxIter < 1 {
				return usagef("--tolerance must lie in (0, 1) and --max-iterations be at least 1")
			}
			m, err := loadModel(args[0])
			if err != nil {
				return err
			}
			dopt := design.DesignOptions{Incremental: true, StressOnly: *stressOnly, SaturationLimit: satLimit.SI(m)}
			marking := adapt.GoalOriented
			switch *refineBy {
			case "goal":
			case "energy":
				marking = adapt.Energy
			default:
				return usagef("--refine-by is goal or energy, not %q", *refineBy)
			}
			var s *study.Result
			if *accuracy > 0 {
				res, err := adapt.Run(env.Ctx, m, adapt.Options{Accuracy: *accuracy, Marking: marking, Study: study.Options{Solver: solver.Options{Tol: *tol, MaxIter: *maxIter}},
					Progress: func(r adapt.Round) {
						fmt.Fprintf(env.Stderr, "adaptive round: %d nodes, field %.6f T, change %.2e\n", r.Nodes, r.Value, r.Change)
					}})
				if err != nil {
					return err
				}
				if !res.Converged {
					fmt.Fprintf(env.Stderr, "adaptive refinement stopped at its round or node limit before reaching %g\n", *accuracy)
				}
				s = res.Study
			} else if s, err = runStudy(env.Ctx, m, study.Options{Solver: solver.Options{Tol: *tol, MaxIter: *maxIter}}); err != nil {
				return err
			}
			r := design.New(s, dopt)
			if err := env.Ctx.Err(); err != nil {
				return err // interrupted during the last round or the virtual work
			}
			if *vtuPath != "" {
				if err := fileout.Write(*vtuPath, func(w io.Writer) error { return vtu.WriteVTU(w, s.Solution, vtu.Options{}) }); err != nil {
					return err
				}
			}
			if *png != "" {
				if err := figure.DrawField(s, *png); err != nil {
					return err
				}
			}
			if *asJSON {
				return writeJSON(env.Stdout, r)
			}
			return report.WriteText(env.Stdout, r)
		}
	},
}
