package main

import (
	"flag"
	"fmt"
	"io"
	"math"

	"polegap/post/workflow/design"
	"polegap/post/workflow/efflen"
	"polegap/solver"
)

var cmdLength = &Command{
	UsageLine: "length [--reach LENGTH] [--measured T·m] [--json] MODEL",
	Short:     "compute the effective magnetic length and field integral of a dipole",
	Long: `Length builds the side view of a dipole — the plane through the gap
centre along the depth (the beam's path), the pole and yoke above the gap
as tall as the cross-section's iron, as long as the model's depth — solves
it with ideal iron and reports the effective length L_eff = ∫B dz / B0
over the iron and --reach beyond each end (default two gaps), beside the
common rule L_eff ≈ L_iron + (1.0 … 1.2)·g (common practice). With B0
from the cross-section, solved to the accuracy asked for, it reports the
field integral ∫B dz = B0·L_eff, each with its estimate.

--measured gives a measured field integral along the beam axis in T·m,
which is compared with the prediction. A bare --reach is in the model's
units.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		reach := quantity(fs, "reach", length, "how far beyond each iron end to integrate (default 2 × gap)")
		measured := realFlag(fs, "measured", 0, anyFinite, "a measured field integral ∫B dz along the beam axis, T·m")
		asJSON := fs.Bool("json", false, "print the result as JSON")
		af := addAccuracyFlags(fs)
		return func(env *Env, args []string) error {
			m, err := modelArg(args)
			if err != nil {
				return err
			}
			geo, err := efflen.FromModel(m)
			if err != nil {
				return err
			}
			side, err := efflen.Side(geo, efflen.Options{Reach: reach.SI(m)})
			if err != nil {
				return err
			}
			fine, coarse, acc, err := solveToAccuracy(env, "length", m, af, solver.Options{})
			if err != nil {
				return err
			}
			rep := design.NewEstimated(fine, coarse, acc, design.DesignOptions{StressOnly: true, NoPoleForce: true})
			if rep.Gap == nil {
				return fmt.Errorf("%s: no gap-centre field: %v", m.File, rep.Notes)
			}
			out := newLengthReport(m.Name, side, rep, *measured)
			out.Quick = coarse == nil
			if *asJSON {
				return writeJSON(env.Stdout, "length", out)
			}
			return writeLength(env.Stdout, out)
		}
	},
}

// lengthReport is the result of the length command (SI units).
type lengthReport struct {
	Model         string  `json:"model"`
	Gap           float64 `json:"gap_m"`
	IronLength    float64 `json:"iron_length_m"`
	IronHeight    float64 `json:"iron_height_m"`
	Reach         float64 `json:"reach_m"`
	LEff          float64 `json:"effective_length_m"`
	LEffEstimate  float64 `json:"effective_length_estimate_m"`
	K             float64 `json:"k"`
	Whole         float64 `json:"whole_midplane_length_m"`
	RuleLow       float64 `json:"rule_low_m"`
	RuleHigh      float64 `json:"rule_high_m"`
	B0            float64 `json:"B0_T"`
	B0Estimate    float64 `json:"B0_estimate_T"`
	Integral      float64 `json:"field_integral_Tm"`
	IntegralEst   float64 `json:"field_integral_estimate_Tm"`
	Measured      float64 `json:"measured_Tm,omitempty"`
	MeasuredRatio float64 `json:"measured_over_predicted,omitempty"`
	MeasuredLEff  float64 `json:"measured_effective_length_m,omitempty"`
	// Quick: B0 from one solve on the model's mesh, without an estimate.
	Quick bool `json:"quick,omitempty"`
}

func newLengthReport(name string, s *efflen.Result, rep *design.Report, measured float64) *lengthReport {
	lo, hi := efflen.Rule(s.Geometry)
	b0e, _ := rep.Est("gap.centre_B_T")
	r := &lengthReport{Model: name, Gap: s.Gap, IronLength: s.Length, IronHeight: s.Height, Reach: s.Reach,
		LEff: s.LEff, LEffEstimate: s.Estimate, K: s.K, Whole: s.Whole, RuleLow: lo, RuleHigh: hi,
		B0: rep.Gap.CentreB, B0Estimate: b0e}
	r.Integral = r.B0 * r.LEff
	// Independent errors of the two factors, added in quadrature.
	r.IntegralEst = r.Integral * math.Hypot(r.B0Estimate/r.B0, r.LEffEstimate/r.LEff)
	if measured != 0 {
		r.Measured, r.MeasuredRatio, r.MeasuredLEff = measured, measured/r.Integral, measured/r.B0
	}
	return r
}

func writeLength(w io.Writer, r *lengthReport) error {
	mm := func(v float64) float64 { return 1e3 * v }
	fmt.Fprintf(w, "model        %s: gap %.4g mm, iron %.4g mm long, %.4g mm of iron above the pole face\n", r.Model, mm(r.Gap), mm(r.IronLength), mm(r.IronHeight))
	fmt.Fprintf(w, "side view    ideal iron; field integrated to %.4g mm beyond each end\n", mm(r.Reach))
	fmt.Fprintf(w, "L_eff        %.2f mm ± %.2g mm = L_iron + %.3f·g\n", mm(r.LEff), mm(r.LEffEstimate), r.K)
	fmt.Fprintf(w, "rule         L_iron + (1.0 … 1.2)·g = %.1f … %.1f mm (common practice)\n", mm(r.RuleLow), mm(r.RuleHigh))
	fmt.Fprintf(w, "whole plane  %.2f mm: the two-dimensional view's whole integral, an upper bound\n", mm(r.Whole))
	if r.Quick {
		fmt.Fprintf(w, "B0           %.5f T (cross-section, gap centre; quick: no estimate)\n", r.B0)
		fmt.Fprintf(w, "∫B dz        %.5g T·m (the side view's share of its error: ± %.2g T·m)\n", r.Integral, r.IntegralEst)
	} else {
		fmt.Fprintf(w, "B0           %.5f T ± %.2g T (cross-section, gap centre)\n", r.B0, r.B0Estimate)
		fmt.Fprintf(w, "∫B dz        %.5g T·m ± %.2g T·m\n", r.Integral, r.IntegralEst)
	}
	if r.Measured != 0 {
		fmt.Fprintf(w, "measured     %.5g T·m: %.4f of the prediction; measured L_eff = ∫B dz / B0 = %.2f mm\n", r.Measured, r.MeasuredRatio, mm(r.MeasuredLEff))
	}
	return nil
}
