package main

import (
	"flag"
	"io"

	"gonum.org/v1/plot/vg"

	"polegap/internal/fileout"
	"polegap/models"
	"polegap/post/output/figure"
	"polegap/post/output/plot"
	"polegap/post/quantity/gap"
	"polegap/post/study"
)

var cmdProfile = &Command{
	UsageLine: "profile [--probe NAME] [--samples N] [--csv FILE] [--png FILE] MODEL",
	Short:     "sample Bx, By and |B| along a line probe",
	Long: `Profile solves the model and samples the flux density along a line
probe (--probe, default the model's first line probe), writing the samples
as CSV (x_m,y_m,bx_T,by_T,b_T, or r_m,z_m,br_T,bz_T,b_T for an
axisymmetric model; to standard output unless --csv names a
file) and, with --png (or .svg), a plot of Bx, By and |B| against the
distance along the line.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		probe := fs.String("probe", "", "the line probe to sample (default the first)")
		samples := intFlag(fs, "samples", 0, count(2, 1000000), "number of samples (default the probe's)")
		csvOut := fs.String("csv", "", "write the samples to this CSV file")
		png := fs.String("png", "", "draw the profile to this .png, .svg or .pdf file")
		pf := addPictureFlags(fs, false)
		return func(env *Env, args []string) error {
			m, err := modelArg(args)
			if err != nil {
				return err
			}
			var p *models.Probe
			for i := range m.Probes {
				if m.Probes[i].Kind == models.ProbeLine && (*probe == "" || m.Probes[i].Name == *probe) {
					p = &m.Probes[i]
					break
				}
			}
			if p == nil {
				return usagef("the model has no line probe %q; add one under probes (line: [[x0, y0], [x1, y1]])", *probe)
			}
			n := p.Samples
			if *samples > 0 {
				n = *samples
			}
			if n < 2 {
				n = 101
			}
			s, err := runStudy(env.Ctx, m, study.Options{})
			if err != nil {
				return err
			}
			ss := gap.ProfileTo(nil, s.Field(), p.Line[0], p.Line[1], n)
			if *png != "" {
				fig, err := figure.ProfileWith(m.Name+": profile along "+p.Name, ss, m.Geometry == models.Axisymmetric)
				if err != nil {
					return err
				}
				if err := plot.Save(fig, 16*vg.Centimeter, 10*vg.Centimeter, *png, pf.options()); err != nil {
					return err
				}
			}
			if *csvOut != "" {
				return fileout.Write(*csvOut, func(w io.Writer) error { return gap.WriteCSVAxes(w, ss, m.Geometry == models.Axisymmetric) })
			}
			return gap.WriteCSVAxes(env.Stdout, ss, m.Geometry == models.Axisymmetric)
		}
	},
}
