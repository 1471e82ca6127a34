package main

import (
	"flag"
	"strings"

	gplot "gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"

	"polegap/post/output/library"
	"polegap/post/output/plot"
)

var cmdMaterials = &Command{
	UsageLine: "materials [--png FILE] [NAME[,NAME...]]",
	Short:     "list the built-in materials, or show and plot B-H curves",
	Long: `Materials lists the built-in library of materials with the source of
each curve. With a NAME it prints that material and, for a B-H curve, B
and the relative permeability at round values of H. With --png (or .svg)
it draws B(H) and μr(B); several names separated by commas share the plot.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		png := fs.String("png", "", "draw B(H) and μr(B) to this .png, .svg or .pdf file")
		pf := addPictureFlags(fs, false)
		return func(env *Env, args []string) error {
			switch len(args) {
			case 0:
				if *png != "" {
					return usagef("--png needs a material NAME")
				}
				return library.WriteList(env.Stdout)
			case 1:
			default:
				return usagef("too many arguments")
			}
			names := strings.Split(args[0], ",")
			for _, n := range names {
				if err := library.Describe(env.Stdout, n); err != nil {
					return err
				}
			}
			if *png == "" {
				return nil
			}
			bh, mu, err := library.Figures(names...)
			if err != nil {
				return err
			}
			return plot.SaveGrid([][]*gplot.Plot{{bh, mu}}, 28*vg.Centimeter, 11*vg.Centimeter, *png, pf.options())
		}
	},
}
