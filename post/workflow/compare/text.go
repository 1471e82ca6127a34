package compare

import (
	"encoding/csv"
	"fmt"
	"io"
	"strconv"
	"text/tabwriter"
)

// WriteText prints the comparison (and the calibration, if any).
func WriteText(w io.Writer, model, measured string, r *Result, fit *Fit) error {
	fmt.Fprintf(w, "model %s against %s (%s, %s)\n\n", model, measured, r.Kind, r.Unit)
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintf(tw, "current A\tmeasured\tu\tpredicted\tresidual\trelative\t\n")
	for _, x := range r.Residuals {
		fmt.Fprintf(tw, "%.4g\t%.5f\t%.2g\t%.5f\t%+.5f\t%+.2f%%\t\n", x.Current, x.Measured, x.Sigma, x.Predicted, x.Abs, 100*x.Rel)
	}
	if err := tw.Flush(); err != nil {
		return err
	}
	fmt.Fprintf(w, "\nRMS residual %.4g %s (%.2f %%), largest %.4g %s (%.2f %%)\n", r.RMS, r.Unit, 100*r.RMSRel, r.Max, r.Unit, 100*r.MaxRel)
	if r.Weighted > 0 {
		fmt.Fprintf(w, "χ² = %.3g over %d points with stated uncertainties (about %d expected if the model and the uncertainties are right)\n", r.ChiSquare, r.Weighted, r.Weighted)
	}
	if fit != nil {
		unit := fit.Unit
		nom, val, sig := fit.Nominal, fit.Value, fit.Sigma
		if unit == "m" {
			unit, nom, val, sig = "mm", nom*1e3, val*1e3, sig*1e3
		}
		fmt.Fprintf(w, "\ncalibrated %s: %.5g ± %.2g %s (model %.5g %s), %d iterations\n", fit.Parameter, val, sig, unit, nom, unit, fit.Iterations)
		fmt.Fprintf(w, "RMS residual %.4g → %.4g %s\n", fit.Before.RMS, fit.After.RMS, r.Unit)
		fmt.Fprintf(w, "%s\n", fit.Verdict)
	}
	return nil
}

// WriteCSV writes the residual table with units in the header.
func WriteCSV(w io.Writer, r *Result) error {
	cw := csv.NewWriter(w)
	u := r.Unit
	cw.Write([]string{"current_A", "measured_" + u, "sigma_" + u, "predicted_" + u, "residual_" + u, "relative"})
	g := func(v float64) string { return strconv.FormatFloat(v, 'g', 10, 64) }
	for _, x := range r.Residuals {
		cw.Write([]string{g(x.Current), g(x.Measured), g(x.Sigma), g(x.Predicted), g(x.Abs), g(x.Rel)})
	}
	cw.Flush()
	return cw.Error()
}
