package main

import (
	"flag"
	"io"

	"gonum.org/v1/plot/vg"

	"polegap/internal/fileout"
	"polegap/materials"
	"polegap/post/output/library"
	"polegap/post/output/plot"
)

var cmdBHFit = &Command{
	UsageLine: "bhfit [--js T] [--csv FILE] [--png FILE] POINTS.csv",
	Short:     "fit a full B-H curve to a few points and extrapolate it to saturation",
	Long: `Bhfit fits a smooth monotone B-H curve to a few points (a steel
supplier's sheet often gives 5 to 10) read from a CSV file of H and B (or
J) columns, as a model's table-file. Beyond the last point it
extrapolates with the Fröhlich-Kennelly law of approach to saturation, so
that B tends to μ0 H + J_s; J_s is fitted from the last points, or given
with --js. It prints the fit, how far it can be trusted, and a table;
--csv writes the fitted curve as a table-file for a model, --png (or .svg)
plots it with the points.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		js := realFlag(fs, "js", 0, nonNegative, "saturation polarisation J_s in T (0: fit it)")
		csvOut := fs.String("csv", "", "write the fitted curve as a CSV table-file")
		png := fs.String("png", "", "plot the fit to this .png or .svg file")
		return func(env *Env, args []string) error {
			if len(args) != 1 {
				return usagef("bhfit needs one CSV file of points")
			}
			h, b, err := library.ReadPoints(args[0])
			if err != nil {
				return err
			}
			f, err := materials.FitCurve(h, b, materials.FitOptions{Js: *js})
			if err != nil {
				return err
			}
			if err := library.WriteFit(env.Stdout, args[0], f); err != nil {
				return err
			}
			if *csvOut != "" {
				if err := fileout.Write(*csvOut, func(w io.Writer) error { return library.WriteFitCSV(w, args[0], f) }); err != nil {
					return err
				}
			}
			if *png != "" {
				p, err := library.FitFigure(f)
				if err != nil {
					return err
				}
				return plot.Save(p, 16*vg.Centimeter, 11*vg.Centimeter, *png)
			}
			return nil
		}
	},
}
