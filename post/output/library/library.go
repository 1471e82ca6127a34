package library

import (
	"fmt"
	"io"
	"math"

	"image/color"

	gplot "gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"

	"polegap/materials"
	"polegap/post/output/plot"
)

// Curves samples a B-H curve for display: n points of B(H) with H spaced
// logarithmically from the first table point past the origin to four times
// the last, and μr(B) at the same points.
func Curves(c *materials.Curve, n int) (h, b, mur []float64) {
	th, _ := c.Table()
	return sample(c, th[1]/4, 4*th[len(th)-1], n)
}

// WriteList prints the library as a table with the source of each entry.
func WriteList(w io.Writer) error {
	if _, err := fmt.Fprintf(w, "%-20s %-10s %s\n", "name", "kind", "description / source"); err != nil {
		return err
	}
	for _, e := range materials.Library() {
		if _, err := fmt.Fprintf(w, "%-20s %-10s %s\n%-31s source: %s\n", e.Name, e.Kind, e.Description, "", e.Source); err != nil {
			return err
		}
	}
	return nil
}

// Describe prints one entry and, for a B-H curve, a short table of B and
// μr at round values of H.
func Describe(w io.Writer, name string) error {
	mat, e, ok := materials.Lookup(name)
	if !ok {
		return fmt.Errorf("no built-in material %q; 'polegap materials' lists them", name)
	}
	fmt.Fprintf(w, "%s (%s): %s\nsource: %s\n", e.Name, e.Kind, e.Description, e.Source)
	if e.Grade != "" {
		fmt.Fprintf(w, "grade: %s ('polegap grades %s' checks it)\n", e.Grade, e.Name)
	}
	c, isCurve := mat.(*materials.Curve)
	if !isCurve {
		nu, _ := mat.Nu(0)
		_, err := fmt.Fprintf(w, "relative permeability %.4g\n", 1/(nu*materials.Mu0))
		return err
	}
	fmt.Fprintf(w, "\n%12s %10s %10s\n", "H (A/m)", "B (T)", "mu_r")
	for _, h := range []float64{10, 30, 100, 300, 1e3, 3e3, 1e4, 3e4, 1e5, 3e5} {
		b := c.B(h)
		fmt.Fprintf(w, "%12.0f %10.4f %10.1f\n", h, b, c.MuR(b))
	}
	return nil
}

// DrawnMargin is how far past a B-H table's last point the figures draw
// the curve: to this multiple of its H, where the curve continues with
// slope μ0 (about 1.25 × H adds 0.05-0.1 T to a steel's last B: enough
// to see the extrapolation start, little enough to keep the table's
// knee, 1.2-2.2 T for steels, spread over the plot).
const DrawnMargin = 1.25

// Figures returns the B(H) and μr(B) plots of the named curves, drawn
// from a quarter of the table's first non-zero H to DrawnMargin times its
// last, with the table's points marked. H is on a logarithmic axis, and
// so is μr, which spans three or four decades from the knee to
// saturation.
func Figures(names ...string) (bh, mu *gplot.Plot, err error) {
	var sb, sm []plot.Series
	for i, name := range names {
		mat, _, ok := materials.Lookup(name)
		if !ok {
			return nil, nil, fmt.Errorf("no built-in material %q; 'polegap materials' lists them", name)
		}
		c, isCurve := mat.(*materials.Curve)
		if !isCurve {
			return nil, nil, fmt.Errorf("material %q is linear: it has no B-H curve to draw", name)
		}
		th, tb := c.Table()
		h, b, mur := sample(c, th[1]/4, DrawnMargin*th[len(th)-1], 200)
		hk := make([]float64, len(h))
		for k := range h {
			hk[k] = h[k] / 1e3
		}
		var ph, pb, pm []float64
		for k := range th {
			if th[k] > 0 {
				ph, pb, pm = append(ph, th[k]/1e3), append(pb, tb[k]), append(pm, c.MuR(tb[k]))
			}
		}
		col := plotColour(i)
		sb = append(sb, plot.Series{Name: name, X: hk, Y: b, Colour: col},
			plot.Series{Name: name + " table", X: ph, Y: pb, Points: true, Colour: col, Size: vg.Points(2)})
		sm = append(sm, plot.Series{Name: name, X: b, Y: mur, Colour: col},
			plot.Series{Name: name + " table", X: pb, Y: pm, Points: true, Colour: col, Size: vg.Points(2)})
	}
	title := fmt.Sprintf("B-H curve (drawn to %.3g × the last table H)", DrawnMargin)
	if bh, err = plot.LineFigure(title, "field strength H (kA/m, log scale)", "flux density B (T)", sb...); err != nil {
		return nil, nil, err
	}
	bh.X.Scale = gplot.LogScale{}
	bh.X.Tick.Marker = plot.LogTicks{}
	bh.Y.Min = 0
	plot.PlaceLegend(bh, sb...)
	if mu, err = plot.LineFigure("relative permeability μr = B/(μ0 H)", "flux density B (T)", "μr (log scale)", sm...); err != nil {
		return nil, nil, err
	}
	mu.Y.Scale = gplot.LogScale{}
	mu.Y.Tick.Marker = plot.LogTicks{}
	mu.X.Min = 0
	return bh, mu, nil
}

// sample returns n points of B(H) and μr(B), H spaced logarithmically
// over [hmin, hmax].
func sample(c *materials.Curve, hmin, hmax float64, n int) (h, b, mur []float64) {
	h, b, mur = make([]float64, n), make([]float64, n), make([]float64, n)
	for i := range n {
		h[i] = hmin * math.Pow(hmax/hmin, float64(i)/float64(n-1))
		b[i] = c.B(h[i])
		mur[i] = c.MuR(b[i])
	}
	return h, b, mur
}

// plotColour is the i-th of a few well-separated line colours.
func plotColour(i int) color.Color {
	cols := []color.Color{
		color.RGBA{R: 30, G: 90, B: 160, A: 255},
		color.RGBA{R: 200, G: 90, B: 30, A: 255},
		color.RGBA{R: 60, G: 140, B: 70, A: 255},
		color.RGBA{R: 140, G: 60, B: 140, A: 255},
	}
	return cols[i%len(cols)]
}
