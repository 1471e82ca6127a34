package figure

import (
	gplot "gonum.org/v1/plot"

	"polegap/post/output/plot"
	"polegap/post/quantity/gap"
)

// Profile returns the plot of a line profile: Bx, By and |B| against
// the distance along the line (mm). Samples outside the mesh are left out.
func Profile(title string, ss []gap.Sample) (*gplot.Plot, error) {
	return ProfileWith(title, ss, false)
}

// ProfileWith is Profile for a planar (x, y) or an axisymmetric (r, z)
// model: the components are named Br and Bz in the second case.
func ProfileWith(title string, ss []gap.Sample, axisymmetric bool) (*gplot.Plot, error) {
	var s, bx, by, b []float64
	for _, v := range ss {
		if !v.Inside {
			continue
		}
		s = append(s, v.S*1e3)
		bx = append(bx, v.Bx)
		by = append(by, v.By)
		b = append(b, v.B())
	}
	nx, ny := "Bx", "By"
	if axisymmetric {
		nx, ny = "Br", "Bz"
	}
	return plot.LineFigure(title, "distance along the line (mm)", "flux density (T)",
		plot.Series{Name: "|B|", X: s, Y: b},
		plot.Series{Name: ny, X: s, Y: by, Dashed: true},
		plot.Series{Name: nx, X: s, Y: bx, Dashed: true})
}
