package main

import (
	"flag"

	gplot "gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"io"
	"os"
	"runtime/debug"
	"strings"
	"time"

	"polegap/internal/fileout"
	"polegap/models"
	"polegap/post/output/figure"
	"polegap/post/output/plot"
	"polegap/post/output/report"
	"polegap/post/study"
	"polegap/post/workflow/check"
	"polegap/post/workflow/coil"
	"polegap/post/workflow/compare"
	"polegap/post/workflow/design"
	"polegap/post/workflow/sweep"
)

// htmlFlag is a command's --html FILE option: the report it writes is a
// report.Document the command fills with its own results.
type htmlFlag struct {
	path *string
	fs   *flag.FlagSet
	cmd  string
}

// addHTMLFlag adds --html to the command's flags.
func addHTMLFlag(fs *flag.FlagSet, cmd string) *htmlFlag {
	return &htmlFlag{cmd: cmd, fs: fs, path: fs.String("html", "", "also write a self-contained HTML report (inputs with the model's SHA-256, results with their estimates, pictures, cautions, sign-off block) to this file")}
}

// set reports whether a report was asked for.
func (h *htmlFlag) set() bool { return *h.path != "" }

// document starts the report of the command on the model named by arg:
// title, version, date, command line and the inputs.
func (h *htmlFlag) document(title, arg string, m *models.Model, acc *design.Accuracy, more ...string) *report.Document {
	var opts [][2]string
	words := []string{"polegap", h.cmd}
	h.fs.Visit(func(f *flag.Flag) {
		if f.Name == "html" {
			return
		}
		v := f.Value.String()
		if bf, ok := f.Value.(interface{ IsBoolFlag() bool }); ok && bf.IsBoolFlag() && v == "true" {
			v = ""
		}
		opts = append(opts, [2]string{f.Name, v})
		words = append(words, strings.TrimSpace("--"+f.Name+" "+v))
	})
	words = append(words, "--html", *h.path, arg)
	words = append(words, more...)
	note := accuracyNote(acc)
	if acc != nil && acc.Target > 0 {
		note = strings.TrimSuffix(note, "; estimates per point from the mesh before")
	}
	return &report.Document{
		Title:   title,
		Command: strings.Join(words, " "),
		Version: version(),
		When:    time.Now().UTC(),
		Inputs:  report.NewInputs(m, modelSource(arg), note, opts),
	}
}

// write writes the report atomically.
func (h *htmlFlag) write(d *report.Document) error {
	return fileout.Write(*h.path, func(w io.Writer) error { return report.WriteDocument(w, d) })
}

// addSolved appends a solved model's pictures: its mesh and field map.
func addSolved(d *report.Document, s *study.Result) error {
	if err := d.AddMesh(s.Model, s.Disc); err != nil {
		return err
	}
	return d.AddField(s)
}

// modelSource returns the bytes of the model named by arg (a file, or an
// embedded example), nil when they cannot be read.
func modelSource(arg string) []byte {
	if data, err := os.ReadFile(arg); err == nil {
		return data
	}
	if data, err := models.Example(arg); err == nil {
		return data
	}
	return nil
}

// version returns polegap's version: the module version and the VCS
// revision it was built from, when the build recorded them.
func version() string {
	bi, ok := debug.ReadBuildInfo()
	if !ok {
		return "(unknown version)"
	}
	v := bi.Main.Version
	var rev, dirty string
	for _, s := range bi.Settings {
		switch s.Key {
		case "vcs.revision":
			rev = s.Value
		case "vcs.modified":
			if s.Value == "true" {
				dirty = ", modified"
			}
		}
	}
	if len(rev) > 12 {
		rev = rev[:12]
	}
	if rev != "" {
		v += " (revision " + rev + dirty + ")"
	}
	return v
}

// The reports of the commands: each starts from the inputs, adds the
// command's results and pictures, and is written to the --html file.

func htmlSolve(h *htmlFlag, arg string, s *study.Result, acc *design.Accuracy, r *design.Report) error {
	d := h.document(s.Model.Name+" — solved model", arg, s.Model, acc)
	if err := d.AddReport(r); err != nil {
		return err
	}
	if err := addSolved(d, s); err != nil {
		return err
	}
	return h.write(d)
}

func htmlCheck(h *htmlFlag, arg string, s *study.Result, acc *design.Accuracy, c *check.Check) error {
	d := h.document(s.Model.Name+" — check", arg, s.Model, acc)
	d.AddDesignCautions(design.NewDesign(s, design.DesignOptions{StressOnly: true, NoPoleForce: true}))
	if err := d.AddCheck(c); err != nil {
		return err
	}
	if err := addSolved(d, s); err != nil {
		return err
	}
	return h.write(d)
}

func htmlSize(h *htmlFlag, arg string, s *study.Result, acc *design.Accuracy, z *coil.Sizing) error {
	d := h.document(s.Model.Name+" — coil sizing", arg, s.Model, acc)
	if err := d.AddSizing(z); err != nil {
		return err
	}
	if err := addSolved(d, s); err != nil {
		return err
	}
	return h.write(d)
}

func htmlSweep(h *htmlFlag, arg string, s *study.Result, acc *design.Accuracy, pts []sweep.Point, gap float64, meta sweep.Meta) error {
	d := h.document(s.Model.Name+" — excitation curve", arg, s.Model, acc)
	if err := d.AddSweep(s.Model.Name, pts, gap, meta.Accuracy); err != nil {
		return err
	}
	if err := d.AddMesh(s.Model, s.Disc); err != nil {
		return err
	}
	return h.write(d)
}

func htmlCompare(h *htmlFlag, args []string, m *models.Model, r *compare.Result, f *compare.Fit) error {
	p, err := figure.Comparison(m.Name+": measured and predicted", r, f)
	if err != nil {
		return err
	}
	c, err := plot.RenderGrid([][]*gplot.Plot{{p}}, 16*vg.Centimeter, 11*vg.Centimeter, "png")
	if err != nil {
		return err
	}
	png, err := figure.Bytes(c)
	if err != nil {
		return err
	}
	d := h.document(m.Name+" — measured against predicted", args[0], m, nil, args[1])
	d.Inputs.Accuracy = "the model's own mesh, not refined: the comparison solves once per measured current"
	if err := d.AddComparison(args[1], r, f, png); err != nil {
		return err
	}
	disc, err := study.Discretize(m)
	if err != nil {
		return err
	}
	if err := d.AddMesh(m, disc); err != nil {
		return err
	}
	return h.write(d)
}

// demoHeader gives the demo's report its inputs, version and command.
func demoHeader(b *report.Bundle, args []string, m *models.Model) {
	arg := models.DefaultExample
	if len(args) > 0 {
		arg = args[0]
	}
	b.Inputs = report.NewInputs(m, modelSource(arg), accuracyNote(b.Report.Accuracy), nil)
	b.Version = version()
	b.Command = strings.Join(append([]string{"polegap", "demo"}, args...), " ")
}
