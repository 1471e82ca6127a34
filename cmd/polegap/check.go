package main

import (
	"flag"

	"polegap/models"
	"polegap/post/output/report"
	"polegap/post/study"
	"polegap/post/workflow/check"
	"polegap/post/workflow/design"
)

var cmdCheck = &Command{
	UsageLine: "check [--saturation-limit B] [--tolerance T --half-width LENGTH] [--json] MODEL",
	Short:     "check saturation, target field and field quality: exit 0 pass, 1 fail, 2 error",
	Long: `Check solves the model and checks it against requirements: the largest
|B| of each iron region away from re-entrant corners against a limit
(--saturation-limit for all, or by default where the region's own curve
has fallen to μr = 100), the field at the target probe against the
model's target, and, with --tolerance and --half-width, that the field
stays within the tolerance of its centre value over ±half-width along the
mid-plane line probe. The fringing factor is printed for information.

The exit status is 0 when every check passes, 1 when one fails and 2 on
an error (a bad model, a solve that did not converge), so that scripts
can use it.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		satLimit := fs.String("saturation-limit", "", "limit on |B| in the iron (e.g. 1.8T); default per curve")
		tol := fs.Float64("tolerance", 0, "field-uniformity tolerance |ΔB/B0| (1e-3 or 1e-4)")
		half := fs.String("half-width", "", "half-width over which the tolerance must hold (e.g. 30mm)")
		asJSON := fs.Bool("json", false, "print the check as JSON")
		return func(env *Env, args []string) error {
			if err := oneModel(args); err != nil {
				return err
			}
			var opt check.CheckOptions
			var err error
			if *satLimit != "" {
				if opt.SaturationLimit, err = models.ParseQuantity(*satLimit, "field"); err != nil {
					return usagef("--saturation-limit: %v", err)
				}
			}
			if *half != "" {
				if opt.HalfWidth, err = models.ParseQuantity(*half, "length"); err != nil {
					return usagef("--half-width: %v", err)
				}
			}
			opt.Tolerance = *tol
			m, err := loadModel(args[0])
			if err != nil {
				return exitError{2, err}
			}
			s, err := study.Run(m, study.Options{})
			if err != nil {
				return exitError{2, err}
			}
			c := check.NewCheck(s, design.NewDesign(s, design.DesignOptions{}), opt)
			if *asJSON {
				err = writeJSON(env.Stdout, c)
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
