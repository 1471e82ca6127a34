package report

import (
	"strings"

	"polegap/post/workflow/design"
)

// writeAccuracy writes how far the numbers can be trusted: the accuracy
// asked for and reached, then each converged quantity with its value and
// error estimate (the change between the last two meshes).
func writeAccuracy(ew *errWriter, r *design.Report) {
	a := r.Accuracy
	if a == nil {
		return
	}
	if a.Target == 0 {
		ew.printf("\naccuracy   quick mode: one solve on the model's own mesh; the numbers above carry no error estimate\n")
		return
	}
	verdict := "reached"
	if !a.Reached {
		verdict = "NOT reached (refinement limit): trust each number only to its estimate"
	}
	ew.printf("\naccuracy   %.0e relative %s after %d meshes", a.Target, verdict, a.Rounds)
	if a.Worst != "" && a.Change > 0 {
		ew.printf(" (largest last change %.1e, %s)", a.Change, a.Worst)
	}
	ew.printf("\n")
	if len(r.Estimates) == 0 {
		return
	}
	flat := design.Flatten(r)
	ew.printf("%-44s %16s %12s %10s\n", "quantity (JSON path)", "value", "± estimate", "relative")
	for _, k := range r.EstimatedPaths() {
		if !shownEstimate(k) {
			continue
		}
		v, e := flat[k], r.Estimates[k]
		rel := 0.0
		if v != 0 {
			rel = e / abs(v)
		}
		ew.printf("%-44s %16.7g %12.2g %10.1e\n", k, v, e, rel)
	}
}

// shownEstimate selects the quantities the text lists with their
// estimates: the converging ones and the costly ones estimated beside
// them (incremental inductance, virtual-work forces); the JSON carries
// every estimate.
func shownEstimate(k string) bool {
	for _, s := range []string{"centre_B_T", "pole_face_mean_By_T", "fringing_factor", "flux_linkage_Wb", "apparent_inductance_H",
		"incremental_inductance_H", "stored_J", "coenergy_J", "mean_B_T", "peak_disc_mean_B_T", "maxwell_stress_N", "virtual_work_N"} {
		if strings.Contains(k, s) {
			return !strings.HasPrefix(k, "energy_j")
		}
	}
	return strings.HasPrefix(k, "probes.") && strings.HasSuffix(k, ".b")
}

func abs(x float64) float64 {
	if x < 0 {
		return -x
	}
	return x
}
