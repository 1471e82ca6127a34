package main

import (
	"flag"
	"io"
	"os"

	"gonum.org/v1/plot/vg"

	"polegap/internal/fileout"
	"polegap/post/measure"
	"polegap/post/measure/samples"
	"polegap/post/output/library"
	"polegap/post/output/plot"
)

var cmdRingCurve = &Command{
	UsageLine: "ringcurve [--csv FILE] [--png FILE] [--material NAME] [--compare CURVE] RING.yaml",
	Short:     "reduce a ring-sample test to a B-H curve with uncertainties",
	Long: `Ringcurve reduces a ring test (the d.c. ring method of IEC 60404-4: a
toroidal sample with a magnetising and a search winding on an integrating
fluxmeter) to a B-H curve: H = N1 I / l with the logarithmic mean path
l = π(D-d)/ln(D/d) (or the arithmetic mean, path: arithmetic), and
B = k R/(s N2 A) less the air flux inside the search winding, corrected
for the uneven magnetisation of a thick ring, each with its standard
uncertainty (JCGM 100:2008). The file format is described in
post/measure/FORMAT.md ("Ring test"); testdata/measured/ring-team13.yaml
is a sample. It prints the reduction and the points, and the curve as a
material to paste into a model (--material names it); --csv writes it as
a table-file, --png (or .svg) plots it, with a built-in curve for
comparison when --compare names one.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		csvOut := fs.String("csv", "", "write the curve as a CSV table-file")
		png := fs.String("png", "", "plot the curve to this .png or .svg file")
		material := fs.String("material", "ring-steel", "material name of the printed model table")
		compare := fs.String("compare", "", "a built-in curve to draw beside the points")
		return func(env *Env, args []string) error {
			if len(args) != 1 {
				return usagef("ringcurve needs one ring-test file")
			}
			rt, err := loadRing(args[0])
			if err != nil {
				return err
			}
			res, err := rt.Reduce()
			if err != nil {
				return err
			}
			if err := measure.WriteRing(env.Stdout, rt.Name, rt.Ring, res); err != nil {
				return err
			}
			io.WriteString(env.Stdout, "\n")
			if err := measure.WriteRingTable(env.Stdout, *material, res); err != nil {
				return err
			}
			if *csvOut != "" {
				if err := fileout.Write(*csvOut, func(w io.Writer) error { return measure.WriteRingCSV(w, rt.Name, res) }); err != nil {
					return err
				}
			}
			if *png == "" {
				return nil
			}
			p, err := library.RingFigure(res, *compare)
			if err != nil {
				return err
			}
			return plot.Save(p, 16*vg.Centimeter, 11*vg.Centimeter, *png)
		}
	},
}

// loadRing reads a ring-test file, or a built-in sample when no file of
// that name exists ('polegap examples' lists them).
func loadRing(arg string) (*measure.RingTest, error) {
	if _, err := os.Stat(arg); err != nil {
		if data, serr := samples.Data(arg); serr == nil {
			return measure.ParseRing(arg, data)
		}
	}
	return measure.LoadRing(arg)
}
