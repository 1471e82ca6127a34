package demo

import (
	"context"
	"time"

	"polegap/models"
	"polegap/post/study"
	"polegap/post/workflow/adapt"
	"polegap/post/workflow/check"
	"polegap/post/workflow/coil"
	"polegap/post/workflow/design"
	"polegap/post/workflow/supply"
	"polegap/post/workflow/sweep"
	"polegap/post/workflow/target"
)

// RunOptions control a full design run.
type RunOptions struct {
	SweepPoints int          // default 20, from 1/SweepPoints to 2× the model's current
	Cooling     coil.Cooling // for the coil sizing
	Progress    func(stage string)
	// Accuracy and Quick choose how far the solves are converged
	// (design.SolveOptions): 0 and false refine to the model's
	// mesh.accuracy, else design.DefaultAccuracy.
	Accuracy float64
	Quick    bool
}

// Run is a full design run of one model: the solve with its design
// quantities and check, an excitation curve, and the ampere-turns and coil
// for the model's target. Any part but Result, Report and Check may be
// nil.
type Run struct {
	Result *study.Result
	Report *design.Report
	Check  *check.Check
	Sweep  []sweep.Point
	Sizing *coil.Sizing
	When   time.Time
}

// RunAll does the whole design job on a model.
func RunAll(ctx context.Context, m *models.Model, opt RunOptions) (*Run, error) {
	if opt.SweepPoints <= 0 {
		opt.SweepPoints = 20
	}
	say := func(s string) {
		if opt.Progress != nil {
			opt.Progress(s)
		}
	}
	say("solving and refining the mesh until every quantity converges")
	s, coarse, acc, err := design.SolveAccurate(ctx, m, design.SolveOptions{Accuracy: opt.Accuracy, Quick: opt.Quick, Marking: adapt.Energy})
	if err != nil {
		return nil, err
	}
	r := design.NewEstimated(s, coarse, acc, design.DesignOptions{Incremental: true})
	b := &Run{Result: s, Report: r, When: time.Now()}
	b.Check = check.NewCheck(s, r.Design, check.CheckOptions{})
	// One runner on the solved mesh serves the curve and the target
	// search, which starts from the bracket the curve gives.
	var rn *sweep.Runner
	runner := func(probe string) (*sweep.Runner, error) {
		if rn == nil || rn.ProbeName() != probe && probe != "" {
			var err error
			if rn, err = sweep.NewRunnerFrom(s, "", probe); err != nil {
				return nil, err
			}
		}
		return rn, nil
	}
	if len(m.Coils) > 0 && m.Coils[0].Current != 0 {
		say("sweeping the excitation curve")
		hi := 2 * m.Coils[0].Current
		r, err := runner("")
		if err != nil {
			return nil, err
		}
		so := sweep.Options{Currents: sweep.Range(hi/float64(opt.SweepPoints), hi, opt.SweepPoints), GapLength: m.Gap}
		pts, err := r.Sweep(ctx, so)
		if err != nil {
			return nil, err
		}
		b.Sweep = pts
		if coarse != nil {
			// The same curve on the mesh before the last, for the
			// estimates of each point.
			if err := sweep.EstimateOn(ctx, coarse, so, b.Sweep); err != nil {
				return nil, err
			}
		}
	}
	if m.Target != nil && len(m.Coils) > 0 {
		say("finding the ampere-turns for the target")
		known := b.Sweep
		if rn != nil && m.Target.Probe != "" && rn.ProbeName() != m.Target.Probe {
			known = nil // the curve reads another probe
		}
		r, err := runner(m.Target.Probe)
		if err != nil {
			return nil, err
		}
		res, err := target.Search(ctx, r, m.Target.Field, target.Options{GapLength: m.Gap, Known: known})
		if err != nil && !target.IsUnreachable(err) {
			return nil, err
		}
		if err == nil {
			w, werr := coil.CoilWinding(m, &m.Coils[0])
			if werr == nil {
				spec := coil.Spec{AmpereTurns: res.AmpereTurns, Window: w.Window, Cooling: opt.Cooling,
					FillFactor: m.Coils[0].FillFactor, Temperature: m.Coils[0].Temperature,
					SupplyVoltage: m.Coils[0].SupplyVoltage, SupplyCurrent: m.Coils[0].SupplyCurrent,
					MaxWaterPressure: coil.CommonWaterPressure, MaxWaterSpeed: coil.CommonWaterSpeed, MaxWaterCircuits: coil.CommonWaterCircuits}
				if spec.Validate() == nil {
					b.Sizing = coil.NewSizing(m.Name, m.Target.Probe, &res, w, spec, coil.Options(spec, coil.DefaultWires(opt.Cooling)))
					b.Sizing.Planar = m.Geometry != models.Axisymmetric
					if bw := b.Sizing.Best; bw != nil {
						// The supply from the curve and the search's solves (one mesh).
						pts := append(append([]sweep.Point(nil), b.Sweep...), res.Solves...)
						r := float64(max(w.Windings, 1)) * bw.Resistance
						if sup, err := supply.New(supply.CurveOf(pts, bw.Turns), r, bw.Current, supply.Options{}); err == nil {
							sup.FieldEnergy = res.Point.Energy
							b.Sizing.SetSupply(sup)
						}
					}
				}
			}
		}
	}
	return b, nil
}
