package main

import (
	"fmt"
	"math"

	"polegap/models"
	"polegap/post/output/report"
	"polegap/post/workflow/caution"
	"polegap/post/workflow/sweep"
)

// writeSweepOut prints a finished sweep: the CSV on standard output when
// no --csv file took it, else a short table and where the CSV went; and
// the cautions when the sweep drives the coil past its rated (the
// model's) current.
func writeSweepOut(env *Env, m *models.Model, coilName string, meta sweep.Meta, pts []sweep.Point, csvPath string) error {
	var err error
	if csvPath == "" {
		err = sweep.WriteCSV(env.Stdout, meta, pts)
	} else {
		if err = report.WriteSweepText(env.Stdout, meta, pts); err == nil {
			_, err = fmt.Fprintf(env.Stdout, "\nwrote %d points to %s\n", len(pts), csvPath)
		}
	}
	if err != nil {
		return err
	}
	rated := 0.0
	for _, c := range m.Coils {
		if coilName == "" || c.Name == coilName {
			rated = math.Abs(c.Current)
			break
		}
	}
	top := -1
	for i, p := range pts {
		if top < 0 || math.Abs(p.Current) > math.Abs(pts[top].Current) {
			top = i
		}
	}
	if top < 0 || rated == 0 || math.Abs(pts[top].Current) <= rated*(1+1e-9) {
		return nil
	}
	p := pts[top]
	list := caution.List(caution.Facts{Energy: p.Energy, Current: p.Current, Inductance: p.Apparent, Rated: rated, Driven: math.Abs(p.Current)})
	w := env.Stdout
	if csvPath == "" {
		w = env.Stderr // standard output carries the CSV
	}
	return report.WriteCautions(w, list)
}
