package report

import (
	"io"

	"polegap/post/workflow/sweep"
)

// WriteSweepText writes an excitation curve for a terminal: one line per
// point, numbered by the same index as the CSV's index column, with the
// field's error estimate when there is one.
func WriteSweepText(w io.Writer, meta sweep.Meta, pts []sweep.Point) error {
	ew := &errWriter{w: w}
	ew.printf("excitation curve of %s at probe %s", meta.Model, meta.Probe)
	if meta.Shard != "" {
		ew.printf(", shard %s", meta.Shard)
	}
	ew.printf("\n")
	if meta.Accuracy != "" {
		ew.printf("accuracy   %s\n", meta.Accuracy)
	}
	ew.printf("\n%5s %10s %12s %10s %10s %10s %10s %10s %10s\n", "index", "I A", "NI A-t", "B T", "± T", "efficiency", "iron B T", "energy J", "L_inc H")
	for _, p := range pts {
		est := "-"
		if p.FieldEstimate != 0 {
			est = ew.sprintf("%.2g", p.FieldEstimate)
		}
		ew.printf("%5d %10.4g %12.5g %10.5f %10s %10.3f %10.3f %10.4g %10.4g\n",
			p.Index, p.Current, p.AmpereTurns, p.Field, est, p.Efficiency, p.MaxIronB, p.Energy, p.Incremental)
	}
	return ew.err
}
