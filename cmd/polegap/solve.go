package main

import (
	"flag"
	"io"

	"polegap/internal/fileout"
	"polegap/post/workflow/caution"
	"polegap/post/workflow/design"

	"polegap/post/output/figure"
	"polegap/post/output/report"
	"polegap/post/output/vtu"
	"polegap/solver"
)

var cmdSolve = &Command{
	UsageLine: "solve [--accuracy R | --quick] [--refine-by energy|goal] [--stress-only] [--energy-bounds] [--json] [--png FILE] [--vtu FILE] [--html FILE] [--saturation-limit B] [--tolerance R] [--max-iterations N] MODEL",
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
above the knee of its curve, the peak: the largest mean |B| over a disc
of the printed radius, and the raw maximum, which is mesh-dependent).
Forces: each part the model lists under forces and, for a model with a
gap, the attraction between its poles (the iron wholly above the gap's
mid-plane), each by the Maxwell stress and by virtual work, with their
difference as the error estimate; --stress-only skips the virtual work's
solves. A point probe on an interface between materials lists the field
on each side.

Energy bounds: a model whose materials are all linear also gets two
numbers that bracket its stored energy, and from them its inductance:
the vector-potential solution bounds the energy from below, a
complementary solution for the magnetic field (a scalar potential plus
a source field that carries the coil currents) from above, both on the
final mesh. The bracket is rigorous for the meshed geometry (unless a
current-carrying part is curved). --energy-bounds asks for them on a
nonlinear model too, where they bracket the co-energy at the cost of a
few Newton steps more. With --json it prints the same as JSON: "mesh" {nodes,
triangles}, "newton" {iterations, residual, converged}, and "probes"
keyed by name (point probes give a, bx, by and b in tesla).

Every number is converged: the mesh is refined adaptively and the model
solved again until each reported quantity (gap field, pole-face mean,
fringing, flux linkage, energy and co-energy, saturation figures, forces,
point probes) changes by less than the accuracy between two meshes
(--accuracy, else the model's mesh.accuracy, else 1e-3), and the change
on the last mesh is printed beside each number as its error estimate
(JSON: "estimates", keyed by the path of each value; "accuracy" says
whether the target was reached). --refine-by chooses where refinement
goes: energy (the default) where the field's own error is largest, goal
weighted by a dual solution for the probe field. --quick solves once on
the model's own mesh for a preview, and says that its numbers carry no
estimate.

A solve that does not converge prints its residual history and exits
with status 1; no result is reported for it.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		asJSON := fs.Bool("json", false, "print the report as JSON")
		tol := realFlag(fs, "tolerance", 1e-8, fraction, "relative residual at which Newton stops")
		alias(fs, "tol", "tolerance")
		maxIter := intFlag(fs, "max-iterations", 30, count(1, 10000), "limit on Newton steps")
		png := fs.String("png", "", "draw the field map (|B| and flux lines) to this .png, .svg or .pdf file")
		pf := addPictureFlags(fs, true)
		satLimit := quantity(fs, "saturation-limit", field, "flag iron regions whose peak |B| exceeds this (e.g. 1.8T)").in(positive)
		af := addAccuracyFlags(fs)
		allBounds := fs.Bool("energy-bounds", false, "bracket the co-energy by a complementary solve on a nonlinear model too (linear models always get the bounds)")
		stressOnly := fs.Bool("stress-only", false, "forces by Maxwell stress only: skip the virtual work (two solves per direction and part) and the error estimate")
		fs.Bool("virtual-work", false, aliasPrefix+"virtual work is computed by default now; the flag is kept for old scripts")
		vtuPath := fs.String("vtu", "", "write the solution (A, B, |B|, H, μr, region) to this VTK .vtu file")
		html := addHTMLFlag(fs, "solve")
		return func(env *Env, args []string) error {
			if err := oneModel(args); err != nil {
				return err
			}
			m, err := loadModel(args[0])
			if err != nil {
				return err
			}
			dopt := design.DesignOptions{Incremental: true, StressOnly: *stressOnly, SaturationLimit: satLimit.SI(m), Bounds: design.LinearBounds}
			if *allBounds {
				dopt.Bounds = design.AllBounds
			}
			s, coarse, acc, err := solveToAccuracy(env, "solve", m, af, solver.Options{Tol: *tol, MaxIter: *maxIter})
			if err != nil {
				return err
			}
			r := design.NewEstimated(s, coarse, acc, dopt)
			r.Cautions = caution.List(design.CautionFacts(r.Design))
			if err := env.Ctx.Err(); err != nil {
				return err // interrupted during the last round or the virtual work
			}
			if *vtuPath != "" {
				if err := fileout.Write(*vtuPath, func(w io.Writer) error { return vtu.WriteVTU(w, s.Solution, vtu.Options{}) }); err != nil {
					return err
				}
			}
			if *png != "" {
				if err := figure.DrawFieldWith(s, *png, pf.options(), figure.FieldOptions{Report: r, Whole: pf.wholeDomain()}); err != nil {
					return err
				}
			}
			if html.set() {
				if err := htmlSolve(html, args[0], s, acc, r); err != nil {
					return err
				}
			}
			if *asJSON {
				return writeJSON(env.Stdout, "solve", r)
			}
			return report.WriteText(env.Stdout, r)
		}
	},
}
