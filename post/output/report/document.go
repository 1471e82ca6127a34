package report

import (
	"bytes"
	"fmt"
	"html/template"
	"io"
	"math"
	"time"

	gplot "gonum.org/v1/plot"

	"polegap/models"
	"polegap/post/output/figure"
	"polegap/post/output/plot"
	"polegap/post/study"
	"polegap/post/workflow/check"
	"polegap/post/workflow/coil"
	"polegap/post/workflow/compare"
	"polegap/post/workflow/design"
	"polegap/post/workflow/sweep"
)

// Document is an HTML report any command fills: a title, the tool's
// version and the date, the cautions (at the top), the inputs, sections
// of results with their pictures, and a revision and sign-off block for
// the reviewer. WriteDocument writes it as one self-contained page
// (pictures embedded, no scripts) that prints on A4 or Letter with a page
// break before each section.
//
// The Add methods append a section each; their order is the page's.
// Cautions holds the quantified cautions the results call for, in the
// order added; WriteDocument follows them with the general cautions of
// coil.Cautions.
type Document struct {
	Title   string
	Command string // the command line that made it
	Version string // the tool's version
	When    time.Time
	Inputs  *Inputs
	// Cautions are sentences with the numbers that make them concrete.
	Cautions []string
	Sections []Section
}

// Section is one part of a Document: a title, a body of HTML made by the
// Add methods from polegap's own templates, and pictures.
type Section struct {
	Title  string
	Body   template.HTML
	Images []Image
}

// add executes the named section template on data into a new section.
func (d *Document) add(title, name string, data any, imgs ...Image) error {
	var buf bytes.Buffer
	if err := sections.ExecuteTemplate(&buf, name, data); err != nil {
		return err
	}
	d.Sections = append(d.Sections, Section{Title: title, Body: template.HTML(buf.String()), Images: imgs})
	return nil
}

// AddCaution appends quantified cautions (a place for every command's
// and workflow's own).
func (d *Document) AddCaution(c ...string) { d.Cautions = append(d.Cautions, c...) }

// AddImage appends a section holding one picture.
func (d *Document) AddImage(title string, png []byte) {
	d.Sections = append(d.Sections, Section{Title: title, Images: []Image{{Title: title, PNG: png}}})
}

// AddReport appends the results of a solved model: the field at the
// probes, the design quantities, and how far to trust the numbers (each
// with its error estimate). It adds the cautions the report quantifies:
// the stored energy and the pole attraction.
func (d *Document) AddReport(r *design.Report) error {
	if err := d.add("Field at the probes", "probes", r); err != nil {
		return err
	}
	if r.Design != nil {
		if err := d.add("Design quantities", "design", r.Design); err != nil {
			return err
		}
		d.AddDesignCautions(r.Design)
	}
	if r.Accuracy != nil {
		return d.add("How far to trust the numbers", "accuracy", struct {
			Accuracy  *design.Accuracy
			Estimates []EstimateRow
		}{r.Accuracy, estimateRows(r)})
	}
	return nil
}

// AddDesignCautions adds the cautions a design's numbers make concrete:
// each coil's current and the stored energy, and each computed force.
func (d *Document) AddDesignCautions(ds *design.Design) {
	d.AddCaution(designCautions(ds)...)
}

func designCautions(ds *design.Design) []string {
	var out []string
	for _, c := range ds.Coils {
		if c.Current != 0 {
			out = append(out, fmt.Sprintf("Coil %s carries %.4g A (%.5g ampere-turns); the field stores %.4g J at this current. Switching off under current makes a high voltage across the coil: provide a free-wheeling path or dump resistor and ramp down.", c.Name, c.Current, c.AmpereTurns, ds.Energy.Energy))
		}
	}
	for _, f := range ds.Forces {
		if f.Error != "" {
			continue
		}
		fx, fy := f.Stress[0], f.Stress[1]
		if mag := math.Hypot(fx, fy); mag > 0 {
			out = append(out, fmt.Sprintf("The force on %s is %.3g kN (Maxwell stress; x %.4g N, y %.4g N): keep hands, tools and loose steel away from the gap and the yoke while energised, and design frames and fixings to local codes.", f.Part, mag/1e3, fx, fy))
		}
	}
	return out
}

// AddField appends the field map of a solved model (|B| and flux lines).
func (d *Document) AddField(s *study.Result) error {
	img, err := figure.FieldImage(s, "png")
	if err != nil {
		return err
	}
	d.AddImage("Field map: |B| and flux lines", img)
	return nil
}

// AddMesh appends the picture of the mesh the results were computed on.
func (d *Document) AddMesh(m *models.Model, disc *study.Discretization) error {
	img, err := MeshImage(m, disc)
	if err != nil {
		return err
	}
	msh := disc.Mesh
	d.Sections = append(d.Sections, Section{Title: "Mesh",
		Body:   template.HTML(fmt.Sprintf("<p>%d nodes, %d triangles.</p>", len(msh.X), len(msh.Tri)/3)),
		Images: []Image{{Title: "Mesh", PNG: img}}})
	return nil
}

// MeshImage draws the mesh of a discretised model (zoomed on the model,
// as the field map) to PNG bytes.
func MeshImage(m *models.Model, disc *study.Discretization) ([]byte, error) {
	msh := disc.Mesh
	mp := plot.MeshFigure(m.Name+": mesh", msh.X, msh.Y, msh.Tri, msh.Region, disc.RegionKind)
	mp.X.Min, mp.X.Max, mp.Y.Min, mp.Y.Max = zoom(m)
	w := figure.CM(16)
	c, err := plot.RenderGrid([][]*gplot.Plot{{mp}}, w, plot.EqualAspectHeight(mp, w), "png")
	if err != nil {
		return nil, err
	}
	return figure.Bytes(c)
}

// zoom is the frame of the model's pictures (mm): its extent and a
// fifth of its largest dimension around it, as figure.Zoom.
func zoom(m *models.Model) (x0, x1, y0, y1 float64) {
	xmin, ymin, xmax, ymax := m.Extent()
	d := 0.2 * max(xmax-xmin, ymax-ymin)
	return (xmin - d) * 1e3, (xmax + d) * 1e3, (ymin - d) * 1e3, (ymax + d) * 1e3
}

// AddCheck appends the check's verdicts.
func (d *Document) AddCheck(c *check.Check) error {
	return d.add("Check", "check", c)
}

// AddSweep appends the excitation curve: its table, with the field's
// error estimate per point, and its picture (the ideal line μ0·NI/g and
// the efficiency when gap > 0), under one heading.
func (d *Document) AddSweep(name string, pts []sweep.Point, gap float64, accuracy string) error {
	img, err := excitationImage(name, pts, gap)
	if err != nil {
		return err
	}
	top := 0
	for i, p := range pts {
		if abs(p.Current) > abs(pts[top].Current) {
			top = i
		}
	}
	if len(pts) > 0 && pts[top].Energy > 0 {
		p := pts[top]
		d.AddCaution(fmt.Sprintf("At the highest current of the sweep, %.4g A (%.5g ampere-turns), the field stores %.4g J and the flux linkage is %.4g Wb: a supply switched off there must be able to absorb that energy through a free-wheeling path or dump resistor. Check that the coil is rated for this current before driving it there.", p.Current, p.AmpereTurns, p.Energy, p.Linkage))
	}
	return d.add("Excitation curve", "sweep", struct {
		Points   []sweep.Point
		Accuracy string
	}{pts, accuracy}, Image{Title: "Excitation curve", PNG: img})
}

// AddSizing appends the coil sizing with its windings, and its cautions.
func (d *Document) AddSizing(s *coil.Sizing) error {
	if s.Best != nil {
		b := s.Best
		d.AddCaution(fmt.Sprintf("The recommended winding runs at %.4g A, %.4g V and dissipates %.4g W per winding: check the temperature rise%s before running at full current.",
			b.Current, b.Voltage, b.Power, map[bool]string{true: " and the cooling-water flow", false: ""}[s.Spec.Cooling == coil.Water]))
	}
	d.AddCaution(s.Cautions...)
	return d.add("Coil for the target field", "sizing", s)
}

// AddComparison appends a measured curve against the prediction, the
// calibration if any, and the comparison's picture (png, nil for none).
func (d *Document) AddComparison(measured string, r *compare.Result, f *compare.Fit, png []byte) error {
	var imgs []Image
	if png != nil {
		imgs = append(imgs, Image{Title: "Measured and predicted", PNG: png})
	}
	return d.add("Measured against predicted", "comparison", struct {
		Measured string
		R        *compare.Result
		F        *compare.Fit
		Citation string
	}{measured, r, f, compare.BirgeCitation}, imgs...)
}

// WriteDocument writes d as a self-contained HTML page.
func WriteDocument(w io.Writer, d *Document) error {
	seen := map[string]bool{}
	var cautions []string
	for _, c := range append(append([]string(nil), d.Cautions...), coil.Cautions()...) {
		if !seen[c] {
			seen[c] = true
			cautions = append(cautions, c)
		}
	}
	return page.Execute(w, struct {
		*Document
		AllCautions []string
	}{d, cautions})
}

var page = template.Must(template.New("page").Funcs(funcs).Parse(`<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8">
<title>polegap report: {{.Title}}</title>
<style>
body{font-family:system-ui,sans-serif;max-width:62rem;margin:2rem auto;padding:0 1rem;color:#1d2430;line-height:1.45}
h1{font-size:1.6rem;border-bottom:2px solid #2a4a7a;padding-bottom:.3rem}
h2{font-size:1.2rem;margin-top:2rem;color:#2a4a7a}
h3{font-size:1.05rem;margin-top:1.2rem;color:#2a4a7a}
table{border-collapse:collapse;margin:.6rem 0;font-size:.92rem}
td,th{border:1px solid #c8d0dc;padding:.25rem .6rem;text-align:right;vertical-align:top}
th{background:#eef2f8}
td:first-child,th:first-child{text-align:left}
table.inputs td{text-align:left}
.fail{color:#a01818;font-weight:bold}.pass{color:#1b6b2a;font-weight:bold}
.caution{background:#fff4e0;border-left:4px solid #d08a1a;padding:.6rem 1rem}
img{max-width:100%;border:1px solid #dde3ec;margin:.5rem 0}
.note{color:#4a5568;font-size:.9rem}
code{font-size:.85rem;word-break:break-all}
table.signoff{width:100%}table.signoff td{height:2.2rem;text-align:left}
@page{margin:15mm}
@media print{
 body{max-width:none;margin:0;padding:0;font-size:10pt}
 section{break-before:page}
 h2,h3{break-after:avoid}
 table,img,.caution{break-inside:avoid}
 img{max-height:230mm}
}
</style></head><body>
<header>
<h1>{{.Title}}</h1>
<p>{{with .Command}}Command <code>{{.}}</code>. {{end}}Produced by polegap {{.Version}}{{if not .When.IsZero}} on {{.When.Format "2006-01-02 15:04 MST"}}{{end}}.</p>
</header>

<section class="first" id="cautions">
<h2>Cautions</h2>
<div class="caution"><ul>{{range .AllCautions}}<li>{{.}}</li>{{end}}</ul></div>
</section>

{{with .Inputs}}<section id="inputs">
<h2>Inputs</h2>
<table class="inputs">
<tr><td>model</td><td>{{.Model}}</td></tr>
<tr><td>model file</td><td><code>{{.File}}</code></td></tr>
<tr><td>SHA-256 of the file</td><td>{{if .SHA256}}<code>{{.SHA256}}</code>{{else}}not available{{end}}</td></tr>
<tr><td>geometry</td><td>{{.Geometry}}; lengths in the file in {{.Units}}{{if .Template}}; drawn from the {{.Template}} template{{end}}</td></tr>
<tr><td>extent</td><td>{{f "%.4g" (index .ExtentMM 0)}} to {{f "%.4g" (index .ExtentMM 2)}} mm across, {{f "%.4g" (index .ExtentMM 1)}} to {{f "%.4g" (index .ExtentMM 3)}} mm up</td></tr>
{{if .GapMM}}<tr><td>gap</td><td>{{f "%.4g" .GapMM}} mm</td></tr>{{end}}
<tr><td>boundary</td><td>{{.Boundary}}</td></tr>
<tr><td>mesh</td><td>{{.Mesh}}</td></tr>
<tr><td>accuracy</td><td>{{if .Accuracy}}{{.Accuracy}}{{else}}not recorded{{end}}</td></tr>
{{if .Options}}<tr><td>options</td><td>{{range $i, $o := .Options}}{{if $i}}, {{end}}<code>--{{index $o 0}}{{with index $o 1}} {{.}}{{end}}</code>{{end}}</td></tr>{{end}}
</table>
<h3>Regions</h3>
<table><tr><th>region</th><th>material</th><th>width (mm)</th><th>height (mm)</th></tr>
{{range .Regions}}<tr><td>{{.Name}}</td><td>{{.Material}}</td><td>{{f "%.4g" .WidthMM}}</td><td>{{f "%.4g" .HeightMM}}{{if .Arcs}} (with arcs){{end}}</td></tr>{{end}}
</table>
<h3>Materials</h3>
<table class="inputs"><tr><th>material</th><th>kind</th><th>source of the data</th></tr>
{{range .Materials}}<tr><td>{{.Name}}</td><td>{{.Kind}}</td><td>{{.Source}}</td></tr>{{end}}
</table>
{{if .Coils}}<h3>Coils</h3>
<table><tr><th>coil</th><th>turns</th><th>current (A)</th><th>ampere-turns</th><th>sides (sense)</th></tr>
{{range .Coils}}<tr><td>{{.Name}}</td><td>{{f "%.6g" .Turns}}</td><td>{{f "%.6g" .Current}}</td><td>{{f "%.6g" .AmpereTurns}}</td><td>{{.Sides}}</td></tr>{{end}}
</table>{{end}}
</section>{{end}}

{{range .Sections}}<section>
<h2>{{.Title}}</h2>
{{.Body}}
{{range .Images}}<figure><img src="{{img .PNG}}" alt="{{.Title}}"></figure>{{end}}
</section>
{{end}}

<section id="signoff">
<h2>Revision and sign-off</h2>
<p class="note">To be filled in by the reviewer. The numbers above are design estimates from a two-dimensional model, not a safety assessment.</p>
<table class="signoff"><tr><th>revision</th><th>date</th><th>description</th><th>prepared by</th><th>checked by</th><th>approved by</th></tr>
<tr><td></td><td></td><td></td><td></td><td></td><td></td></tr>
<tr><td></td><td></td><td></td><td></td><td></td><td></td></tr>
</table>
</section>
</body></html>
`))
