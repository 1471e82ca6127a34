package measure

import (
	"fmt"
	"io"
)

// WriteRing prints a reduced ring test: how it was reduced and a table of
// H and B with their standard uncertainties.
func WriteRing(w io.Writer, name string, r Ring, res *RingResult) error {
	fmt.Fprintf(w, "ring test %s: D/d = %.4g, section A = %.5g m², mean path l = %.6g m (%s", name, res.RatioDd, res.Area, res.Path, res.PathRule)
	if res.PathRule == RingPathLog {
		fmt.Fprintf(w, " mean π(D-d)/ln(D/d); arithmetic π(D+d)/2 = %.6g m", res.PathMean)
	}
	fmt.Fprintf(w, ")\n")
	sw := r.Switching
	if sw == "" {
		sw = RingReversal
	}
	fmt.Fprintf(w, "H = N1 I / l with N1 = %g; B = k R / (s N2 A) - air flux, N2 = %g, s = %s; integrator k = %.6g Wb-turns per reading unit ± %.2g %%",
		r.N1, r.N2, map[string]string{RingReversal: "2 (reversal)", RingStep: "1 (step)"}[sw], res.Scale, 100*res.ScaleRelSigma)
	if r.Calibration != nil {
		fmt.Fprintf(w, " (calibrated by a mutual inductor)")
	}
	fmt.Fprintf(w, "\nuncertainties: standard, GUM (JCGM 100:2008) eq. 10; the nonuniformity correction (%d iterations) is counted in u(B)\n\n", res.Iterations)
	fmt.Fprintf(w, "%9s %11s %9s %9s %9s %10s %11s\n", "I (A)", "H (A/m)", "u(H)", "B (T)", "u(B)", "air (T)", "nonunif (T)")
	for _, p := range res.Points {
		fmt.Fprintf(w, "%9.4g %11.5g %9.2g %9.5f %9.2g %10.5f %11.5f\n", p.Current, p.H, p.HSigma, p.B, p.BSigma, p.AirCorrection, p.Nonuniform)
	}
	for _, n := range res.Notes {
		fmt.Fprintf(w, "note: %s\n", n)
	}
	return nil
}

// WriteRingCSV writes the reduced curve as a B-H table a model can use as
// its table-file (materials.ReadCurveCSV reads the H and B columns and
// ignores the uncertainties).
func WriteRingCSV(w io.Writer, name string, res *RingResult) error {
	fmt.Fprintf(w, "# B-H curve reduced by polegap ringcurve from the ring test %s\n", name)
	fmt.Fprintf(w, "# standard uncertainties u(H), u(B) by JCGM 100:2008\n")
	fmt.Fprintf(w, "H (A/m),B (T),u(H) (A/m),u(B) (T)\n")
	for _, p := range res.Points {
		if _, err := fmt.Fprintf(w, "%.6g,%.6g,%.3g,%.3g\n", p.H, p.B, p.HSigma, p.BSigma); err != nil {
			return err
		}
	}
	return nil
}

// WriteRingTable writes the reduced curve as a material of a model file,
// to paste under its materials: key.
func WriteRingTable(w io.Writer, material string, res *RingResult) error {
	fmt.Fprintf(w, "  %s:   # from the ring test; paste under materials:\n    table: [", material)
	for i, p := range res.Points {
		if i > 0 {
			fmt.Fprintf(w, ", ")
		}
		fmt.Fprintf(w, "[%.6g, %.6g]", p.H, p.B)
	}
	_, err := fmt.Fprintf(w, "]\n")
	return err
}
