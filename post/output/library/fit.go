package library

import (
	"fmt"
	"io"
	"math"
	"os"

	gplot "gonum.org/v1/plot"

	"polegap/materials"
	"polegap/post/output/plot"
)

// ReadPoints reads the (H, B) points of a CSV file in the format of
// materials.ReadCurveCSV, without the origin.
func ReadPoints(path string) (h, b []float64, err error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, nil, err
	}
	defer f.Close()
	c, err := materials.ReadCurveCSV(f, path)
	if err != nil {
		return nil, nil, err
	}
	th, tb := c.Table()
	return th[1:], tb[1:], nil
}

// WriteFit prints what a fit rests on and how far it can be trusted.
func WriteFit(w io.Writer, name string, f *materials.Fit) error {
	n := len(f.H)
	how := "fitted: the Kennelly line H/J = α + β H through the last three points"
	if !f.JsFitted {
		how = "given"
	}
	fmt.Fprintf(w, "fit of %s: %d points, %g to %g A/m\n", name, n, f.H[0], f.H[n-1])
	fmt.Fprintf(w, "between the points: monotone cubic in log J against log H (Fritsch and Butland 1984)\n")
	fmt.Fprintf(w, "beyond the last point: Fröhlich-Kennelly approach to saturation, J = J_s - (J_s - J_n)(H_n + H_0)/(H + H_0), B -> μ0 H + J_s\n")
	fmt.Fprintf(w, "J_s = %.4f T (%s), H_0 = %.4g A/m\n", f.Js, how, f.H0)
	fmt.Fprintf(w, "trust: the data from %g to %g A/m; the extrapolation to about %.3g A/m (%.3g times the last point)", f.H[0], f.H[n-1], f.TrustH, f.TrustH/f.H[n-1])
	if f.JsFitted {
		fmt.Fprintf(w, ", where two estimates of the tail (Kennelly lines through the last 3 and the last 2 points) agree within %.0f %% in B\n", 100*materials.FitTrustTol)
	} else {
		fmt.Fprintf(w, ", the range over which a Fröhlich-Kennelly law is reproduced to 1 %% (materials.TestFitFrohlichKennelly)\n")
	}
	fmt.Fprintf(w, "below the first point the curve is a guess (J ∝ H^p); results report how much iron ran beyond the last point\n\n")
	fmt.Fprintf(w, "%12s %10s %10s %10s\n", "H (A/m)", "B (T)", "J (T)", "mu_r")
	for _, h := range sampleH(f) {
		b := f.Curve.B(h)
		mark := ""
		if h > f.H[n-1] {
			mark = "  extrapolated"
		}
		fmt.Fprintf(w, "%12.5g %10.4f %10.4f %10.1f%s\n", h, b, b-materials.Mu0*h, b/(materials.Mu0*h), mark)
	}
	return nil
}

// WriteFitCSV writes the fitted curve as a table a model can use
// (table-file), its provenance in comment lines, and the last point of the
// data as a "# data-end:" comment, so that results from the table still
// report the iron beyond the data (materials.MetaDataEnd).
func WriteFitCSV(w io.Writer, name string, f *materials.Fit) error {
	fmt.Fprintf(w, "# B-H curve fitted by polegap bhfit to the %d points of %s\n", len(f.H), name)
	fmt.Fprintf(w, "# beyond %g A/m: Fröhlich-Kennelly extrapolation, J_s = %.4f T, H_0 = %.4g A/m; trusted to about %.3g A/m\n", f.H[len(f.H)-1], f.Js, f.H0, f.TrustH)
	fmt.Fprintf(w, "# %s: %.8g\n", materials.MetaDataEnd, f.H[len(f.H)-1])
	fmt.Fprintf(w, "H (A/m),B (T)\n")
	h, b := f.Curve.Table()
	for i := range h {
		if _, err := fmt.Fprintf(w, "%.8g,%.8g\n", h[i], b[i]); err != nil {
			return err
		}
	}
	return nil
}

// FitFigure plots the fitted curve and the points it was fitted to.
func FitFigure(f *materials.Fit) (*gplot.Plot, error) {
	var hk, bk []float64
	hmin, hmax := f.H[0]/2, 10*f.H[len(f.H)-1]
	for i := 0; i <= 200; i++ {
		h := hmin * math.Pow(hmax/hmin, float64(i)/200)
		hk = append(hk, h/1e3)
		bk = append(bk, f.Curve.B(h))
	}
	pk := make([]float64, len(f.H))
	for i, h := range f.H {
		pk[i] = h / 1e3
	}
	p, err := plot.LineFigure("fitted B-H curve", "H (kA/m, log scale)", "B (T)",
		plot.Series{Name: "fit and extrapolation", X: hk, Y: bk},
		plot.Series{Name: "points given", X: pk, Y: f.B, Points: true})
	if err != nil {
		return nil, err
	}
	p.X.Scale = gplot.LogScale{}
	p.X.Tick.Marker = gplot.LogTicks{Prec: -1}
	return p, nil
}

// sampleH returns round field strengths over the data and up to ten times
// the last point, with the points themselves.
func sampleH(f *materials.Fit) []float64 {
	var out []float64
	last := f.H[len(f.H)-1]
	for e := -1; e <= 7; e++ {
		for _, m := range []float64{1, 2, 5} {
			h := m * math.Pow(10, float64(e))
			if h >= f.H[0] && h <= 10*last {
				out = append(out, h)
			}
		}
	}
	return out
}
