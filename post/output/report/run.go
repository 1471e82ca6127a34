package report

import (
	"context"
	"encoding/json"
	"io"
	"os"
	"path/filepath"
	"time"

	gplot "gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"

	"polegap/internal/fileout"
	"polegap/models"
	"polegap/post/output/plot"
	"polegap/post/output/vtu"
	"polegap/post/study"
	"polegap/post/workflow/coil"
	"polegap/post/workflow/sweep"
	"polegap/post/workflow/target"
)

// RunOptions control a full design run.
type RunOptions struct {
	SweepPoints int          // default 20, from 1/SweepPoints to 2× the model's current
	Cooling     coil.Cooling // for the coil sizing
	Progress    func(stage string)
}

// Run is a full design run of one model: the solve with its design
// quantities and check, an excitation curve, and the ampere-turns and coil
// for the model's target.
type Run struct {
	Study  *study.Study
	Bundle *Bundle
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
	say("solving")
	s, err := study.Run(m, study.Options{})
	if err != nil {
		return nil, err
	}
	r := New(s, DesignOptions{Incremental: true})
	b := &Bundle{Report: r, When: time.Now()}
	b.Check = NewCheck(s, r.Design, CheckOptions{})
	// One runner on the solved mesh serves the curve and the target
	// search, which starts from the bracket the curve gives.
	var rn *sweep.Runner
	runner := func(probe string) (*sweep.Runner, error) {
		if rn == nil || rn.ProbeName() != probe && probe != "" {
			var err error
			if rn, err = sweep.NewRunnerFrom(s, "", probe, nil); err != nil {
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
		pts, err := r.Sweep(ctx, sweep.Options{Currents: sweep.Range(hi/float64(opt.SweepPoints), hi, opt.SweepPoints), GapLength: m.Gap})
		if err != nil {
			return nil, err
		}
		b.Sweep = pts
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
			w, werr := study.CoilWinding(m, &m.Coils[0])
			if werr == nil {
				spec := coil.Spec{AmpereTurns: res.AmpereTurns, Window: w.Window, Cooling: opt.Cooling,
					FillFactor: m.Coils[0].FillFactor, Temperature: m.Coils[0].Temperature,
					SupplyVoltage: m.Coils[0].SupplyVoltage, SupplyCurrent: m.Coils[0].SupplyCurrent}
				if spec.Validate() == nil {
					b.Sizing = NewSizing(m.Name, m.Target.Probe, &res, w, spec, coil.Options(spec, coil.DefaultWires(opt.Cooling)))
				}
			}
		}
	}
	say("drawing")
	if img, err := FieldImage(s, "png"); err == nil {
		b.Images = append(b.Images, Image{Title: "Field map: |B| and flux lines", PNG: img})
	} else {
		return nil, err
	}
	if len(b.Sweep) > 0 {
		img, err := excitationImage(m.Name, b.Sweep, m.Gap)
		if err != nil {
			return nil, err
		}
		b.Images = append(b.Images, Image{Title: "Excitation curve", PNG: img})
	}
	return &Run{Study: s, Bundle: b}, nil
}

func excitationImage(name string, pts []sweep.Point, gap float64) ([]byte, error) {
	bp, ep, err := sweep.Figures(name, pts, gap)
	if err != nil {
		return nil, err
	}
	row := []*gplot.Plot{bp}
	width := 14 * vg.Centimeter
	if ep != nil {
		row = append(row, ep)
		width = 26 * vg.Centimeter
	}
	c, err := plot.RenderGrid([][]*gplot.Plot{row}, width, 10*vg.Centimeter, "png")
	if err != nil {
		return nil, err
	}
	return bytesOf(c)
}

// WriteFolder writes the run's files into dir (created if needed) and
// returns their names: report.html, report.json, field.png, excitation.png
// and excitation.csv, windings.csv, mesh.png and solution.vtu.
func (r *Run) WriteFolder(dir string) ([]string, error) {
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return nil, err
	}
	var names []string
	write := func(name string, fill func(w io.Writer) error) error {
		names = append(names, name)
		return fileout.Write(filepath.Join(dir, name), fill)
	}
	b, s := r.Bundle, r.Study
	if err := write("report.html", func(w io.Writer) error { return WriteHTML(w, b) }); err != nil {
		return nil, err
	}
	if err := write("report.json", func(w io.Writer) error {
		enc := json.NewEncoder(w)
		enc.SetIndent("", "  ")
		return enc.Encode(struct {
			Report *Report       `json:"report"`
			Check  *Check        `json:"check"`
			Sweep  []sweep.Point `json:"sweep,omitempty"`
			Sizing *Sizing       `json:"sizing,omitempty"`
		}{b.Report, b.Check, b.Sweep, b.Sizing})
	}); err != nil {
		return nil, err
	}
	for i, img := range b.Images {
		name := []string{"field.png", "excitation.png"}[min(i, 1)]
		if err := write(name, func(w io.Writer) error { _, err := w.Write(img.PNG); return err }); err != nil {
			return nil, err
		}
	}
	if len(b.Sweep) > 0 {
		if err := write("excitation.csv", func(w io.Writer) error {
			return sweep.WriteCSV(w, sweep.Meta{Model: s.Model.Name, Probe: s.Model.MainProbe()}, b.Sweep)
		}); err != nil {
			return nil, err
		}
	}
	if b.Sizing != nil {
		if err := write("windings.csv", func(w io.Writer) error { return coil.WriteCSV(w, b.Sizing.Options) }); err != nil {
			return nil, err
		}
	}
	m := s.Disc.Mesh
	mp := plot.MeshFigure(s.Model.Name+": mesh", m.X, m.Y, m.Tri, m.Region, s.Disc.RegionKind)
	mp.X.Min, mp.X.Max, mp.Y.Min, mp.Y.Max = zoom(s)
	names = append(names, "mesh.png")
	if err := plot.Save(mp, cm(18), plot.EqualAspectHeight(mp, cm(18)), filepath.Join(dir, "mesh.png")); err != nil {
		return nil, err
	}
	if err := write("solution.vtu", func(w io.Writer) error { return vtu.WriteVTU(w, s.Solution, vtu.Options{}) }); err != nil {
		return nil, err
	}
	return names, nil
}
