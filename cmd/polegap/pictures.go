package main

import (
	"flag"

	"polegap/post/output/plot"
)

// pictureFlags registers the flags every command that draws shares:
// --dpi for the raster resolution and, with whole true, --whole-domain.
type pictureFlags struct {
	dpi   *float64
	whole *bool
}

func addPictureFlags(fs *flag.FlagSet, whole bool) pictureFlags {
	var pf pictureFlags
	pf.dpi = realFlag(fs, "dpi", 0, numRange{lo: 0, hi: 4800, hint: "dots per inch, 0 for the default"}, "resolution of a .png picture in dots per inch (default: 1600 pixels wide)")
	if whole {
		pf.whole = fs.Bool("whole-domain", false, "draw the whole meshed domain instead of the magnet and a margin")
	}
	return pf
}

func (pf pictureFlags) options() plot.Options { return plot.Options{DPI: *pf.dpi} }

func (pf pictureFlags) wholeDomain() bool { return pf.whole != nil && *pf.whole }
