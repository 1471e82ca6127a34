package report

import (
	"encoding/base64"
	"fmt"
	"html/template"
	"io"
	"strings"
	"time"

	"polegap/post/workflow/check"
	"polegap/post/workflow/coil"
	"polegap/post/workflow/design"
	"polegap/post/workflow/sweep"
)

// Image is a picture for the HTML report.
type Image struct {
	Title string
	PNG   []byte
}

// Bundle is everything a full design run produced, for the HTML report.
// Any part but Report may be nil.
type Bundle struct {
	Report *design.Report
	Check  *check.Check
	Sweep  []sweep.Point
	Sizing *coil.Sizing
	Images []Image
	When   time.Time
	// Estimates are the rows of the accuracy table: each converged
	// quantity with its value and error estimate (see writeAccuracy).
	Estimates []EstimateRow
}

// EstimateRow is one number of the report with its error estimate.
type EstimateRow struct {
	Path            string // the value's path in the JSON report
	Value, Estimate float64
	Relative        float64 // Estimate / |Value|, 0 for a zero value
}

// estimateRows returns the rows of the accuracy table of a report.
func estimateRows(r *design.Report) []EstimateRow {
	if r == nil || len(r.Estimates) == 0 {
		return nil
	}
	flat := design.Flatten(r)
	var out []EstimateRow
	for _, k := range r.EstimatedPaths() {
		if !shownEstimate(k) {
			continue
		}
		row := EstimateRow{Path: k, Value: flat[k], Estimate: r.Estimates[k]}
		if row.Value != 0 {
			row.Relative = row.Estimate / abs(row.Value)
		}
		out = append(out, row)
	}
	return out
}

// WriteHTML writes a self-contained HTML page (pictures embedded as data
// URLs, no external files or scripts) summarising the bundle.
func WriteHTML(w io.Writer, b *Bundle) error {
	return page.Execute(w, b)
}

var page = template.Must(template.New("report").Funcs(template.FuncMap{
	"img": func(png []byte) template.URL {
		return template.URL("data:image/png;base64," + base64.StdEncoding.EncodeToString(png))
	},
	"f":        func(format string, v float64) string { return fmt.Sprintf(format, v) },
	"mm":       func(v float64) string { return fmt.Sprintf("%.2f", v*1e3) },
	"pct":      func(v float64) string { return fmt.Sprintf("%.1f", 100*v) },
	"kA":       func(v float64) string { return fmt.Sprintf("%.3f", v/1e3) },
	"amm2":     func(v float64) string { return fmt.Sprintf("%.2f", v*1e-6) },
	"flags":    func(f coil.Flags) string { return f.String() },
	"cautions": coil.Cautions,
	"join":     func(s []string) string { return strings.Join(s, ", ") },
	"deref": func(p *float64) float64 {
		if p == nil {
			return 0
		}
		return *p
	},
}).Parse(`<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8">
<title>polegap report: {{.Report.Model}}</title>
<style>
body{font-family:system-ui,sans-serif;max-width:62rem;margin:2rem auto;padding:0 1rem;color:#1d2430;line-height:1.45}
h1{font-size:1.6rem;border-bottom:2px solid #2a4a7a;padding-bottom:.3rem}
h2{font-size:1.2rem;margin-top:2rem;color:#2a4a7a}
table{border-collapse:collapse;margin:.6rem 0;font-size:.92rem}
td,th{border:1px solid #c8d0dc;padding:.25rem .6rem;text-align:right}
th{background:#eef2f8}
td:first-child,th:first-child{text-align:left}
.fail{color:#a01818;font-weight:bold}.pass{color:#1b6b2a;font-weight:bold}
.caution{background:#fff4e0;border-left:4px solid #d08a1a;padding:.6rem 1rem}
img{max-width:100%;border:1px solid #dde3ec;margin:.5rem 0}
.note{color:#4a5568;font-size:.9rem}
</style></head><body>
{{with .Report}}
<h1>{{.Model}} — magnet design report</h1>
<p>Model file <code>{{.File}}</code>, {{.Geometry}}; mesh of {{.Mesh.Nodes}} nodes and {{.Mesh.Triangles}} triangles (order {{.Mesh.Order}});
Newton converged in {{.Newton.Iterations}} step(s) to a relative residual of {{f "%.1e" .Newton.Residual}}.
Produced by polegap{{if not $.When.IsZero}} on {{$.When.Format "2006-01-02 15:04"}}{{end}}.</p>

<h2>Field at the probes</h2>
<table><tr><th>probe</th><th>kind</th><th>|B| (T)</th><th>{{if eq .Geometry "axisymmetric"}}Bz{{else}}By{{end}} (T)</th><th>min |B| (T)</th><th>max |B| (T)</th></tr>
{{range $name, $p := .Probes}}<tr><td>{{$name}}</td><td>{{$p.Kind}}</td>
{{if not $p.Valid}}<td colspan="4">outside the mesh</td>{{else if $p.B}}<td>{{f "%.5f" (deref $p.B)}}</td><td>{{f "%.5f" (deref $p.By)}}</td><td></td><td></td>
{{else}}<td>{{f "%.5f" (deref $p.BMean)}}</td><td>{{f "%.5f" (deref $p.ByMean)}}</td><td>{{f "%.5f" (deref $p.BMin)}}</td><td>{{f "%.5f" (deref $p.BMax)}}</td>{{end}}</tr>
{{range $p.Sides}}<tr class="note"><td>&nbsp;&nbsp;side {{.Region}}{{if .Reported}} (reported){{end}}</td><td>μr {{f "%.4g" .MuR}}</td><td>{{f "%.5f" .B}}</td><td>{{f "%.5f" .By}}</td><td></td><td></td></tr>
{{end}}{{end}}</table>

{{with .Design}}
<h2>Gap, uniformity and fringing</h2>
<table>
{{with .Gap}}<tr><td>centre field |B| at {{.Probe}}</td><td>{{f "%.5f" .CentreB}} T</td></tr>
{{if .PoleFaceAvg}}<tr><td>mean By across the {{mm .PoleWidth}} mm pole face</td><td>{{f "%.5f" .PoleFaceAvg}} T</td></tr>{{end}}{{end}}
{{with .Uniformity}}{{if .Box}}<tr><td>max |ΔB/B0| over box {{.Box}}</td><td>{{f "%.2e" .BoxMaxDev}}</td></tr>{{end}}
{{range .HalfWidths}}<tr><td>half-width with |ΔB/B0| &lt; {{f "%.0e" .Tol}}</td><td>{{if not .Bounded}}≥ {{end}}{{mm .HalfWidth}} mm</td></tr>{{end}}{{end}}
{{with .Fringing}}<tr><td>fringing factor (flux over B0·w)</td><td>{{f "%.3f" .Factor}}</td></tr>
<tr><td>effective pole width w + 2kg (k per edge)</td><td>{{mm .WidthEff}} mm (k = {{f "%.3f" .KPerEdge}})</td></tr>
<tr><td>effective gap length μ0·NI/B0</td><td>{{mm .GapEff}} mm</td></tr>{{end}}
</table>

<h2>Coils and energy</h2>
<table><tr><th>coil</th><th>current (A)</th><th>ampere-turns</th><th>flux linkage (Wb)</th><th>L apparent (H)</th><th>L incremental (H)</th></tr>
{{range .Coils}}<tr><td>{{.Name}}</td><td>{{f "%.4g" .Current}}</td><td>{{f "%.5g" .AmpereTurns}}</td><td>{{f "%.5g" .Linkage}}</td><td>{{f "%.5g" .Apparent}}</td><td>{{if .Incremental}}{{f "%.5g" .Incremental}}{{end}}</td></tr>{{end}}
</table>
<p>Stored energy {{f "%.5g" .Energy.Energy}} J; co-energy {{f "%.5g" .Energy.CoEnergy}} J.</p>

{{if .Saturation}}<h2>Saturation of the iron</h2>
<table><tr><th>region</th><th>knee (T)</th><th>mean |B| (T)</th><th>area above knee</th><th>peak |B| (T): largest mean over a disc of radius {{mm (index .Saturation 0).Radius}} mm</th><th>max raw |B| (T), mesh-dependent</th></tr>
{{range .Saturation}}<tr><td>{{.Region}}</td><td>{{f "%.2f" .Knee}}</td><td>{{f "%.3f" .Mean}}</td><td>{{pct .AboveKnee}} %</td><td>{{f "%.3f" .Peak}}</td><td>{{f "%.3f" .Max}}{{if .MaxAtCorner}} (at a corner){{end}}</td></tr>{{end}}
</table>{{end}}
{{if .Forces}}<h2>Forces</h2>
<table><tr><th>part</th><th>Fx by Maxwell stress (N)</th><th>Fy by Maxwell stress (N)</th><th>by virtual work (N)</th><th>error estimate (N)</th></tr>
{{range .Forces}}<tr><td>{{.Part}}{{if .Automatic}} ({{join .Regions}}){{end}}</td>{{if .Error}}<td colspan="4">not computed: {{.Error}}</td>{{else}}<td>{{f "%.5g" (index .Stress 0)}}</td><td>{{f "%.5g" (index .Stress 1)}}</td><td>{{with .VirtualWork}}({{f "%.5g" (index . 0)}}, {{f "%.5g" (index . 1)}}){{end}}</td><td>{{with .ErrorEstimate}}±{{f "%.2g" (deref .)}}{{end}}</td>{{end}}</tr>{{end}}
</table>
<p class="caution">Iron poles attract tools and steel objects with large forces: keep hands and loose steel away from an energised magnet, and design frames and fixings to local codes and licensed engineering practice, not to these estimates alone.</p>{{end}}
{{range .Notes}}<p class="note">Note: {{.}}</p>{{end}}
{{end}}
{{end}}

{{with .Report.Accuracy}}<h2>How far to trust the numbers</h2>
{{if .Target}}<p>Every converging quantity was refined to {{f "%.0e" .Target}} relative: {{if .Reached}}reached{{else}}<span class="fail">NOT reached</span> (refinement limit){{end}} after {{.Rounds}} meshes{{if .Worst}} (largest last change {{f "%.1e" .Change}}, {{.Worst}}){{end}}. The estimate of each number is its change between the last two meshes.</p>
{{else}}<p class="fail">Quick mode: one solve on the model's own mesh; the numbers carry no error estimate.</p>{{end}}{{end}}
{{with .Estimates}}<table><tr><th>quantity (JSON path)</th><th>value</th><th>± estimate</th><th>relative</th></tr>
{{range .}}<tr><td>{{.Path}}</td><td>{{f "%.7g" .Value}}</td><td>{{f "%.2g" .Estimate}}</td><td>{{f "%.1e" .Relative}}</td></tr>{{end}}
</table>{{end}}

{{with .Check}}<h2>Check</h2>
<table><tr><th>requirement</th><th>value</th><th>limit</th><th>verdict</th></tr>
{{range .Items}}<tr><td>{{.What}}{{if .Note}}<br><span class="note">{{.Note}}</span>{{end}}</td><td>{{f "%.4g" .Value}} {{.Unit}}</td><td>{{f "%.4g" .Limit}} {{.Unit}}</td><td>{{if .Pass}}<span class="pass">pass</span>{{else}}<span class="fail">FAIL</span>{{end}}</td></tr>{{end}}
</table>{{end}}

{{with .Sweep}}<h2>Excitation curve</h2>
<table><tr><th>current (A)</th><th>ampere-turns</th><th>field (T)</th><th>efficiency</th><th>max iron |B| (T)</th><th>L apparent (H)</th><th>L incremental (H)</th><th>± field (T)</th></tr>
{{range .}}<tr><td>{{f "%.4g" .Current}}</td><td>{{f "%.0f" .AmpereTurns}}</td><td>{{f "%.4f" .Field}}</td><td>{{if .Efficiency}}{{pct .Efficiency}} %{{end}}</td><td>{{f "%.3f" .MaxIronB}}</td><td>{{f "%.4g" .Apparent}}</td><td>{{f "%.4g" .Incremental}}</td><td>{{if .FieldEstimate}}{{f "%.1e" .FieldEstimate}}{{end}}</td></tr>{{end}}
</table>{{end}}

{{with .Sizing}}<h2>Coil for the target field</h2>
<p>To reach {{f "%.4g" .Target}} T at {{.Probe}} the magnet needs {{f "%.0f" .AmpereTurns}}{{if .AmpereTurnsEstimate}} ± {{f "%.2g" .AmpereTurnsEstimate}}{{end}} ampere-turns per winding ({{.Windings}} in series),
found in {{.Solves}} nonlinear solves (field reached {{f "%.5f" .Field}} T, efficiency {{pct .Efficiency}} %).
Coil window: radial build {{f "%.1f" .Window.Width}} mm, height {{f "%.1f" .Window.Height}} mm, mean turn {{f "%.0f" .Window.MeanTurn}} mm.</p>
{{with .Best}}<p>Least power within every limit: <b>{{.Wire.Name}}</b>, {{.Turns}} turns at {{f "%.4g" .Current}} A ({{amm2 .CurrentDensity}} A/mm²),
{{f "%.4g" .Voltage}} V, {{f "%.4g" .Power}} W, {{f "%.3g" .Mass}} kg of copper per winding.</p>{{else}}<p class="fail">No winding meets every limit: {{.NoneReason}}</p>{{end}}
{{end}}

{{range .Images}}<h2>{{.Title}}</h2><img src="{{img .PNG}}" alt="{{.Title}}">{{end}}

<h2>Cautions</h2>
<div class="caution"><ul>{{range cautions}}<li>{{.}}</li>{{end}}</ul></div>
</body></html>
`))
