package main

import (
	"flag"

	"polegap/post/output/report"
	"polegap/post/workflow/check"
	"polegap/post/workflow/design"
	"polegap/solver"
)

var cmdCheck = &Command{
	UsageLine: "check [--saturation-limit B] [--tolerance T --half-width LENGTH] [--target-tolerance R] [--json] [--html FILE] MODEL",
	Short:     "check saturation, target field and field quality: exit 0 pass, 1 fail, 2 error",
	Long: `Check solves the model and checks it against requirements: the peak |B|
of each iron region (the largest mean |B| over a disc of radius half the
gap, at least 1/40 of the iron's size, printed with the result) against a
limit (--saturation-limit for all, or by default where the region's own
curve has fallen to μr = 100), the field at the target probe against the
model's target (a target, not a limit: it is reached when the field is at
least the target less its tolerance, --target-tolerance, by default the
accuracy the numbers are converged to), and, with --tolerance and
--half-width together, that the field stays within the tolerance (any
value in (0, 1)) of its centre value over ±half-width along the mid-plane
line probe. One without the other, a negative value, or a tolerance on a
model with no line probe through the gap centre is refused (exit 2). A --half-width without a unit is in the model's
units. The fringing factor is printed for information. The raw largest
|B| of each region is printed in the note but never checked: it sits at a
corner of the iron, where it grows without bound as the mesh is refined,
whereas the peak converges.

The numbers checked are converged first, as solve converges them
(--accuracy, else the model's mesh.accuracy, else 1e-3; --quick for a
one-solve preview), so that a verdict does not move with the mesh.

The exit status is 0 when every check passes, 1 when one fails and 2 on
an error (a bad model, a solve that did not converge), so that scripts
can use it.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		satLimit := quantity(fs, "saturation-limit", field, "limit on the peak |B| of each iron region (e.g. 1.8T); default per curve").in(positive)
		tol := realFlag(fs, "tolerance", 0, fraction, "field-uniformity tolerance |ΔB/B0|, in (0, 1), e.g. 5e-4; needs --half-width")
		targetTol := realFlag(fs, "target-tolerance", 0, fraction, "how far below the model's target field may fall and still reach it, relative (default: the accuracy, 1e-3)")
		half := quantity(fs, "half-width", length, "half-width over which the tolerance must hold (e.g. 30mm)").in(positive)
		half.metresBefore = true
		asJSON := fs.Bool("json", false, "print the check as JSON")
		af := addAccuracyFlags(fs)
		html := addHTMLFlag(fs, "check")
		return func(env *Env, args []string) error {
			if err := oneModel(args); err != nil {
				return err
			}
			m, err := loadModel(args[0])
			if err != nil {
				return exitError{2, err}
			}
			half.noteBare(env.Stderr, m)
			opt := check.CheckOptions{SaturationLimit: satLimit.SI(m), Tolerance: *tol, HalfWidth: half.SI(m), TargetTolerance: *targetTol}
			if err := checkOptions(opt, tolSet(fs), half.set); err != nil {
				return err
			}
			s, _, acc, err := solveToAccuracy(env, "check", m, af, solver.Options{})
			if err != nil {
				return exitError{2, err}
			}
			if opt.TargetTolerance == 0 && acc != nil && acc.Target > 0 {
				opt.TargetTolerance = acc.Target // as accurate as the numbers are
			}
			// The poles' attraction by Maxwell stress alone (no extra solves)
			// quantifies the force caution; no check reads it.
			dopt := design.DesignOptions{StressOnly: true}
			if opt.Tolerance > 0 {
				dopt.Tolerances = []float64{opt.Tolerance}
			}
			c := check.NewCheck(s, design.NewDesign(s, dopt), opt)
			if err := uncomputed(c); err != nil {
				return exitError{2, err}
			}
			c.Accuracy = acc
			if html.set() {
				if err := htmlCheck(html, args[0], s, acc, c); err != nil {
					return exitError{2, err}
				}
			}
			if *asJSON {
				err = writeJSON(env.Stdout, "check", c)
			} else {
				err = report.WriteCheck(env.Stdout, c)
			}
			if err != nil {
				return exitError{2, err}
			}
			if !c.Pass {
				return exitError{1, nil}
			}
			return nil
		}
	},
}
