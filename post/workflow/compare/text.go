package compare

import (
	"encoding/csv"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"text/tabwriter"
)

// BirgeCitation names the method behind a Birge-scaled uncertainty.
const BirgeCitation = "R. T. Birge, Phys. Rev. 40, 207 (1932); GUM, JCGM 100:2008"

// WriteText prints the comparison (and the calibration, if any).
func WriteText(w io.Writer, model, measured string, r *Result, fit *Fit) error {
	fmt.Fprintf(w, "model %s against %s (%s, %s)\n\n", model, measured, r.Kind, r.Unit)
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintf(tw, "current A\tmeasured\tu\tpredicted\tresidual\tresidual/u\trelative\t\n")
	undefined := 0
	for _, x := range r.Residuals {
		rel := "undefined"
		if x.Rel != nil {
			rel = fmt.Sprintf("%+.2f%%", 100**x.Rel)
		} else {
			undefined++
		}
		z := "-"
		if x.Normalised != nil {
			z = fmt.Sprintf("%+.2f", *x.Normalised)
		}
		fmt.Fprintf(tw, "%.4g\t%.5f\t%.2g\t%.5f\t%+.5f\t%s\t%s\t\n", x.Current, x.Measured, x.Sigma, x.Predicted, x.Abs, z, rel)
	}
	if err := tw.Flush(); err != nil {
		return err
	}
	if undefined > 0 {
		fmt.Fprintf(w, "(relative residual undefined at zero current or zero prediction: %d point(s) judged by the absolute residual only)\n", undefined)
	}
	fmt.Fprintf(w, "\nRMS residual %.4g %s, largest %.4g %s", r.RMS, r.Unit, r.Max, r.Unit)
	if r.RelPoints > 0 {
		fmt.Fprintf(w, "; relative RMS %.2f %%, largest %.2f %% (over %d points)", 100*r.RMSRel, 100*r.MaxRel, r.RelPoints)
	}
	fmt.Fprintln(w)
	if r.Weighted > 0 {
		fmt.Fprintf(w, "χ² = %.3g, ν = %d points with stated uncertainties, χ²/ν = %.3g (about 1 if the model and the uncertainties are right)\n", r.ChiSquare, r.Weighted, r.ChiSquare/float64(r.Weighted))
	}
	if fit != nil {
		writeFit(w, r.Unit, fit)
	}
	return nil
}

func writeFit(w io.Writer, unit string, fit *Fit) {
	fmt.Fprintf(w, "\ncalibrated %s together (%d iterations, %d solve rounds", fit.Names(), fit.Iterations, fit.Solves)
	if !fit.Converged {
		fmt.Fprintf(w, "; NOT converged: the last step was still above the tolerance")
	}
	fmt.Fprintln(w, "):")
	for _, e := range fit.Parameters {
		nom, val, sig, u := e.Shown()
		if u != "" {
			u = " " + u
		}
		fmt.Fprintf(w, "  %-6s %s%s (model %.5g%s)\n", e.Parameter, withUncertainty(val, sig), u, nom, u)
	}
	if len(fit.Parameters) > 1 {
		fmt.Fprintf(w, "  correlation:")
		for a := range fit.Parameters {
			for b := a + 1; b < len(fit.Parameters); b++ {
				fmt.Fprintf(w, " ρ(%s, %s) = %+.3f", fit.Parameters[a].Parameter, fit.Parameters[b].Parameter, fit.Correlation[a][b])
			}
		}
		fmt.Fprintln(w)
	}
	switch {
	case fit.Dof == 0:
		fmt.Fprintf(w, "χ² = %.3g with ν = 0 degrees of freedom: the data cannot test the fit, the uncertainties are the stated ones propagated\n", fit.ChiSquare)
	case fit.Uncertainty == "scatter":
		fmt.Fprintf(w, "no stated uncertainty on every point: unweighted, uncertainties from the residual scatter (the points' variance estimated as Σr²/ν), Σr² = %.3g %s², ν = %d\n", fit.ChiSquare, unit, fit.Dof)
	case fit.BirgeScaled:
		fmt.Fprintf(w, "χ² = %.3g, ν = %d, χ²/ν = %.3g > 1: the residuals scatter more than the stated uncertainties allow; the uncertainties above are scaled by the Birge ratio sqrt(χ²/ν) = %.3g (%s)\n",
			fit.ChiSquare, fit.Dof, fit.BirgeRatio*fit.BirgeRatio, fit.BirgeRatio, BirgeCitation)
	default:
		fmt.Fprintf(w, "χ² = %.3g, ν = %d, χ²/ν = %.3g ≤ 1: consistent with the stated uncertainties, which are used unscaled (%s)\n", fit.ChiSquare, fit.Dof, fit.BirgeRatio*fit.BirgeRatio, BirgeCitation)
	}
	fmt.Fprintf(w, "RMS residual %.4g → %.4g %s\n", fit.Before.RMS, fit.After.RMS, unit)
	for _, e := range fit.Parameters {
		fmt.Fprintf(w, "%s: %s\n", e.Parameter, e.Verdict)
	}
}

// WriteCSV writes the residual table with units in the header. The
// relative residual is empty where it is undefined (zero current or zero
// prediction), the normalised one (residual/σ) where no σ is stated.
func WriteCSV(w io.Writer, r *Result) error {
	cw := csv.NewWriter(w)
	u := strings.ReplaceAll(r.Unit, "-", "_")
	cw.Write([]string{"current_A", "measured_" + u, "sigma_" + u, "predicted_" + u, "residual_" + u, "relative", "normalised"})
	g := func(v float64) string { return strconv.FormatFloat(v, 'g', 10, 64) }
	for _, x := range r.Residuals {
		rel := ""
		if x.Rel != nil {
			rel = g(*x.Rel)
		}
		z := ""
		if x.Normalised != nil {
			z = g(*x.Normalised)
		}
		cw.Write([]string{g(x.Current), g(x.Measured), g(x.Sigma), g(x.Predicted), g(x.Abs), rel, z})
	}
	cw.Flush()
	return cw.Error()
}

// withUncertainty writes v ± u with u to two significant digits and v to
// the same decimal place (GUM, JCGM 100:2008, 7.2.6).
func withUncertainty(v, u float64) string {
	if !(u > 0) || math.IsInf(u, 0) {
		return fmt.Sprintf("%.5g ± %.2g", v, u)
	}
	d := 1 - int(math.Floor(math.Log10(u)))
	d = max(0, min(d, 12))
	return fmt.Sprintf("%.*f ± %.*f", d, v, d, u)
}

// ShownWithUncertainty writes the estimate as "value ± u unit" in its
// printed unit (see Shown), u to two significant digits.
func (e Estimate) ShownWithUncertainty() string {
	_, v, u, unit := e.Shown()
	if unit != "" {
		unit = " " + unit
	}
	return withUncertainty(v, u) + unit
}
