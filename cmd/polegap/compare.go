package main

import (
	"flag"
	"fmt"
	"io"

	"polegap/internal/fileout"
	"polegap/post/measure"
	"polegap/post/output/figure"
	"polegap/post/workflow/compare"
)

var cmdCompare = &Command{
	UsageLine: "compare [--fit gap|iron|turns] [--turns-area NA] [--coil NAME] [--probe NAME] [--png FILE] [--csv FILE] [--json] MODEL MEASURED",
	Short:     "compare a measured excitation curve with the prediction, and calibrate",
	Long: `Compare reads a measured excitation curve and solves the model at the
measured coil currents, then reports the residuals (measured minus
predicted, absolute and relative, their RMS and maximum).

MEASURED is a plain CSV with a header row (coil current and field, e.g.
"current_A,field_T", optionally an uncertainty column "sigma_T"; mT and G
are converted; or "current_A,flux_Wb" for search-coil flux-linkage
readings, which need --turns-area: the search coil's turns × area, e.g.
0.5m2, a bare number in the model's units squared), or a raw-readings file in polegap's
measured-data format (current balance or search coil readings with their
instrument constants, reduced to B with uncertainties; see
post/measure/FORMAT.md).

--fit calibrates one model parameter to the measurement: the gap length,
a scale on the iron's permeability, or the coil's turns, and reports the
fitted value with its standard uncertainty and whether the change is
plausible for a built magnet. --png draws both curves with the measured
points' error bars; --csv writes the residual table.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		fit := fs.String("fit", "", "calibrate this parameter: gap, iron or turns")
		na := quantity(fs, "turns-area", area, "search-coil turns × area (e.g. 0.5m2) for flux-linkage curves")
		na.metresBefore = true
		coilName := fs.String("coil", "", "the coil whose current was measured (default the first)")
		probe := fs.String("probe", "", "the probe where the field was measured (default the target's)")
		png := fs.String("png", "", "draw the comparison and its residuals to this .png, .svg or .pdf file")
		pf := addPictureFlags(fs, false)
		csvOut := fs.String("csv", "", "write the residuals to this CSV file")
		asJSON := fs.Bool("json", false, "print the result as JSON")
		return func(env *Env, args []string) error {
			if len(args) != 2 {
				return usagef("compare needs MODEL and MEASURED")
			}
			param, err := parseParameter(*fit)
			if err != nil {
				return usagef("--fit: %v", err)
			}
			m, err := loadModel(args[0])
			if err != nil {
				return err
			}
			na.noteBare(env.Stderr, m)
			curve, err := measure.Load(args[1])
			if err != nil {
				return err
			}
			opt := compare.Options{Coil: *coilName, Probe: *probe, TurnsArea: na.SI(m)}
			out := struct {
				Model    string          `json:"model"`
				Measured string          `json:"measured"`
				Result   *compare.Result `json:"comparison"`
				Fit      *compare.Fit    `json:"calibration,omitempty"`
			}{Model: m.Name, Measured: args[1]}
			if out.Result, err = compare.Compare(env.Ctx, m, curve, opt); err != nil {
				return err
			}
			if param != "" {
				if out.Fit, err = compare.Calibrate(env.Ctx, m, curve, param, opt); err != nil {
					return err
				}
			}
			if *png != "" {
				if err := figure.DrawComparison(*png, m.Name+": measured and predicted", out.Result, out.Fit, pf.options()); err != nil {
					return err
				}
			}
			if *csvOut != "" {
				if err := fileout.Write(*csvOut, func(w io.Writer) error { return compare.WriteCSV(w, out.Result) }); err != nil {
					return err
				}
			}
			if *asJSON {
				return writeJSON(env.Stdout, out)
			}
			return compare.WriteText(env.Stdout, m.Name, args[1], out.Result, out.Fit)
		}
	},
}

// parseParameter reads the --fit flag: "" (no fit), gap, iron or turns.
func parseParameter(s string) (compare.Parameter, error) {
	switch p := compare.Parameter(s); p {
	case "", compare.Gap, compare.Iron, compare.Turns:
		return p, nil
	}
	return "", fmt.Errorf("unknown parameter %q: use gap, iron or turns", s)
}
