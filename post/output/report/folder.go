package report

import (
	"io"
	"os"
	"path/filepath"

	gplot "gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"

	"polegap/internal/fileout"
	"polegap/post/output/figure"
	"polegap/post/output/plot"
	"polegap/post/output/vtu"
	"polegap/post/workflow/check"
	"polegap/post/workflow/coil"
	"polegap/post/workflow/demo"
	"polegap/post/workflow/design"
	"polegap/post/workflow/sweep"
)

// NewBundle draws the pictures of a design run (the field map and, with
// an excitation curve, the curve and the efficiency) and gathers them
// with the run's results for the HTML report.
func NewBundle(r *demo.Run) (*Bundle, error) {
	b := &Bundle{Report: r.Report, Check: r.Check, Sweep: r.Sweep, Sizing: r.Sizing, When: r.When, Estimates: estimateRows(r.Report)}
	img, err := figure.FieldImage(r.Result, "png", figure.FieldOptions{Report: r.Report})
	if err != nil {
		return nil, err
	}
	b.Images = append(b.Images, Image{Title: "Field map: |B| and flux lines", PNG: img})
	if b.Mesh, err = MeshImage(r.Result.Model, r.Result.Disc); err != nil {
		return nil, err
	}
	if len(r.Sweep) > 0 {
		img, err := excitationImage(r.Result.Model.Name, r.Sweep, r.Result.Model.Gap, figure.ModelMarks(r.Result.Model, "", ""))
		if err != nil {
			return nil, err
		}
		b.Images = append(b.Images, Image{Title: "Excitation curve", PNG: img})
	}
	return b, nil
}

func excitationImage(name string, pts []sweep.Point, gap float64, marks figure.ExcitationOptions) ([]byte, error) {
	bp, ep, err := figure.ExcitationWith(name, pts, gap, marks)
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
	return figure.Bytes(c)
}

// WriteFolder writes a design run's files into dir (created if needed)
// and returns their names: report.html, report.json, field.png,
// excitation.png and excitation.csv, windings.csv, mesh.png and
// solution.vtu. b holds the run's pictures (NewBundle).
func WriteFolder(dir string, r *demo.Run, b *Bundle) ([]string, error) {
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return nil, err
	}
	var names []string
	write := func(name string, fill func(w io.Writer) error) error {
		names = append(names, name)
		return fileout.Write(filepath.Join(dir, name), fill)
	}
	s := r.Result
	if err := write("report.html", func(w io.Writer) error { return WriteHTML(w, b) }); err != nil {
		return nil, err
	}
	if err := write("report.json", func(w io.Writer) error {
		return WriteJSON(w, "demo", struct {
			Report *design.Report `json:"report"`
			Check  *check.Check   `json:"check"`
			Sweep  []sweep.Point  `json:"sweep,omitempty"`
			Sizing *coil.Sizing   `json:"sizing,omitempty"`
		}{r.Report, r.Check, r.Sweep, r.Sizing})
	}); err != nil {
		return nil, err
	}
	for i, img := range b.Images {
		name := []string{"field.png", "excitation.png"}[min(i, 1)]
		if err := write(name, func(w io.Writer) error { _, err := w.Write(img.PNG); return err }); err != nil {
			return nil, err
		}
	}
	if len(r.Sweep) > 0 {
		if err := write("excitation.csv", func(w io.Writer) error {
			return sweep.WriteCSV(w, sweep.Meta{Model: s.Model.Name, Probe: s.Model.MainProbe()}, r.Sweep)
		}); err != nil {
			return nil, err
		}
	}
	if r.Sizing != nil {
		if err := write("windings.csv", func(w io.Writer) error { return coil.WriteCSV(w, r.Sizing.Options) }); err != nil {
			return nil, err
		}
	}
	mp := figure.Mesh(s.Disc, false)
	names = append(names, "mesh.png")
	if err := plot.Save(mp, figure.CM(18), plot.EqualAspectHeight(mp, figure.CM(18)), filepath.Join(dir, "mesh.png")); err != nil {
		return nil, err
	}
	if err := write("solution.vtu", func(w io.Writer) error { return vtu.WriteVTU(w, s.Solution, vtu.Options{}) }); err != nil {
		return nil, err
	}
	return names, nil
}
