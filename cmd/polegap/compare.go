package main

import (
	"flag"
	"io"

	"polegap/internal/fileout"
	"polegap/post/output/figure"
	"polegap/post/workflow/compare"
)

var cmdCompare = &Command{
	UsageLine: "compare [--fit gap,iron,turns,offset] [--turns-area NA] [--coil NAME] [--probe NAME] [--png FILE] [--csv FILE] [--html FILE] [--json] MODEL MEASURED",
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

--fit calibrates model parameters to the measurement, one or several at
once (comma-separated): the gap length, a scale on the iron's
permeability, the coil's turns, and a constant offset (the remanent
field at zero current, or a probe's zero). It reports each fitted value
with its standard uncertainty, their correlation, χ² and the degrees of
freedom ν, and whether each change is plausible for a built magnet.
When the residuals scatter more than the stated uncertainties allow
(χ²/ν > 1) the uncertainties are multiplied by the Birge ratio
sqrt(χ²/ν) and the output says so (R. T. Birge, Phys. Rev. 40, 207,
1932; GUM, JCGM 100:2008). The gap and the iron scale are told apart
only by points that reach saturation: below it both act as one
reluctance, and their correlation near ±1 says so. --png draws both curves with the measured
points' error bars; --csv writes the residual table.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		fit := fs.String("fit", "", "calibrate these parameters together, comma-separated: gap, iron, turns, offset")
		na := quantity(fs, "turns-area", area, "search-coil turns × area (e.g. 0.5m2) for flux-linkage curves").in(positive)
		na.metresBefore = true
		coilName := fs.String("coil", "", "the coil whose current was measured (default the first)")
		probe := fs.String("probe", "", "the probe where the field was measured (default the target's)")
		png := fs.String("png", "", "draw the comparison and its residuals to this .png, .svg or .pdf file")
		pf := addPictureFlags(fs, false)
		csvOut := fs.String("csv", "", "write the residuals to this CSV file")
		asJSON := fs.Bool("json", false, "print the result as JSON")
		html := addHTMLFlag(fs, "compare")
		return func(env *Env, args []string) error {
			if len(args) != 2 {
				return usagef("compare needs MODEL and MEASURED")
			}
			params, err := compare.ParseParameters(*fit)
			if err != nil {
				return usagef("--fit: %v", err)
			}
			m, err := loadModel(args[0])
			if err != nil {
				return err
			}
			na.noteBare(env.Stderr, m)
			curve, err := loadMeasured(args[1])
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
			if len(params) > 0 {
				if out.Fit, err = compare.Calibrate(env.Ctx, m, curve, params, opt); err != nil {
					return err
				}
			}
			if *png != "" {
				if err := figure.DrawComparison(*png, m.Name+": measured and predicted", out.Result, out.Fit, pf.options()); err != nil {
					return err
				}
			}
			if html.set() {
				if err := htmlCompare(html, args, m, out.Result, out.Fit); err != nil {
					return err
				}
			}
			if *csvOut != "" {
				if err := fileout.Write(*csvOut, func(w io.Writer) error { return compare.WriteCSV(w, out.Result) }); err != nil {
					return err
				}
			}
			if *asJSON {
				return writeJSON(env.Stdout, "compare", out)
			}
			return compare.WriteText(env.Stdout, m.Name, args[1], out.Result, out.Fit)
		}
	},
}
