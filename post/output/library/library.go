package library

import (
	"fmt"
	"io"
	"math"

	gplot "gonum.org/v1/plot"

	"polegap/materials"
	"polegap/post/output/plot"
)

// Curves samples a B-H curve for display: n points of B(H) with H spaced
// logarithmically from the first table point past the origin to four times
// the last, and μr(B) at the same points.
func Curves(c *materials.Curve, n int) (h, b, mur []float64) {
	th, _ := c.Table()
	hmin := th[1] / 4
	hmax := 4 * th[len(th)-1]
	h, b, mur = make([]float64, n), make([]float64, n), make([]float64, n)
	for i := range n {
		h[i] = hmin * math.Pow(hmax/hmin, float64(i)/float64(n-1))
		b[i] = c.B(h[i])
		mur[i] = c.MuR(b[i])
	}
	return h, b, mur
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

// Figures returns the B(H) and μr(B) plots of the named curves.
func Figures(names ...string) (bh, mu *gplot.Plot, err error) {
	var sb, sm []plot.Series
	for _, name := range names {
		mat, _, ok := materials.Lookup(name)
		if !ok {
			return nil, nil, fmt.Errorf("no built-in material %q; 'polegap materials' lists them", name)
		}
		c, isCurve := mat.(*materials.Curve)
		if !isCurve {
			return nil, nil, fmt.Errorf("material %q is linear: it has no B-H curve to draw", name)
		}
		h, b, mur := Curves(c, 200)
		hk := make([]float64, len(h))
		for i := range h {
			hk[i] = h[i] / 1e3
		}
		sb = append(sb, plot.Series{Name: name, X: hk, Y: b})
		sm = append(sm, plot.Series{Name: name, X: b, Y: mur})
	}
	if bh, err = plot.LineFigure("B-H curve", "H (kA/m, log scale)", "B (T)", sb...); err != nil {
		return nil, nil, err
	}
	bh.X.Scale = gplot.LogScale{}
	bh.X.Tick.Marker = gplot.LogTicks{Prec: -1}
	if mu, err = plot.LineFigure("relative permeability", "B (T)", "μr", sm...); err != nil {
		return nil, nil, err
	}
	return bh, mu, nil
}
