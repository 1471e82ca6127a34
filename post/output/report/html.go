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
	// Inputs, Version and Command head the report (nil or empty: left
	// out).
	Inputs           *Inputs
	Version, Command string
	// Mesh is the picture of the mesh (nil: left out).
	Mesh []byte
}

// Document returns the bundle as a report Document: the inputs, the
// solved model's results, the check, the excitation curve with its
// picture, the sizing, the remaining pictures, and the cautions.
func (b *Bundle) Document() (*Document, error) {
	d := &Document{Title: b.Report.Model + " — magnet design report", Version: b.Version, When: b.When, Inputs: b.Inputs, Command: b.Command}
	if err := d.AddReport(b.Report); err != nil {
		return nil, err
	}
	if b.Check != nil {
		if err := d.AddCheck(b.Check); err != nil {
			return nil, err
		}
	}
	var curve []byte
	for _, img := range b.Images {
		if img.Title == "Excitation curve" {
			curve = img.PNG
			continue
		}
		d.AddImage(img.Title, img.PNG)
	}
	if b.Mesh != nil {
		d.AddImage("Mesh", b.Mesh)
	}
	if len(b.Sweep) > 0 {
		var imgs []Image
		if curve != nil {
			imgs = append(imgs, Image{Title: "Excitation curve", PNG: curve})
		}
		if err := d.add("Excitation curve", "sweep", struct {
			Points   []sweep.Point
			Accuracy string
		}{b.Sweep, ""}, imgs...); err != nil {
			return nil, err
		}
	}
	if b.Sizing != nil {
		if err := d.AddSizing(b.Sizing); err != nil {
			return nil, err
		}
	}
	return d, nil
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

// WriteHTML writes the demo's self-contained HTML report: the bundle's
// Document (pictures embedded as data URLs, no external files or
// scripts).
func WriteHTML(w io.Writer, b *Bundle) error {
	d, err := b.Document()
	if err != nil {
		return err
	}
	return WriteDocument(w, d)
}

// funcs are the helpers of the section templates.
var funcs = template.FuncMap{
	"img": func(png []byte) template.URL {
		return template.URL("data:image/png;base64," + base64.StdEncoding.EncodeToString(png))
	},
	"f":     func(format string, v float64) string { return fmt.Sprintf(format, v) },
	"mm":    func(v float64) string { return fmt.Sprintf("%.2f", v*1e3) },
	"pct":   func(v float64) string { return fmt.Sprintf("%.1f", 100*v) },
	"kA":    func(v float64) string { return fmt.Sprintf("%.3f", v/1e3) },
	"amm2":  func(v float64) string { return fmt.Sprintf("%.2f", v*1e-6) },
	"flags": func(f coil.Flags) string { return f.String() },
	"join":  func(s []string) string { return strings.Join(s, ", ") },
	"deref": func(p *float64) float64 {
		if p == nil {
			return 0
		}
		return *p
	},
	"lpm": func(v float64) float64 { return v * 60e3 },
	"bar": func(v float64) float64 { return v * 1e-5 },
	"relpct": func(p *float64) string {
		if p == nil {
			return "undefined"
		}
		return fmt.Sprintf("%+.2f %%", 100**p)
	},
}

// sections holds one template per kind of section; Document's Add
// methods execute them into a Section's body.
var sections = template.Must(template.New("sections").Funcs(funcs).Parse(`
{{define "probes"}}<table><tr><th>probe</th><th>kind</th><th>|B| (T)</th><th>{{if eq .Geometry "axisymmetric"}}Bz{{else}}By{{end}} (T)</th><th>min |B| (T)</th><th>max |B| (T)</th></tr>
{{range $name, $p := .Probes}}<tr><td>{{$name}}</td><td>{{$p.Kind}}</td>
{{if not $p.Valid}}<td colspan="4">outside the mesh</td>{{else if $p.B}}<td>{{f "%.5f" (deref $p.B)}}</td><td>{{f "%.5f" (deref $p.By)}}</td><td></td><td></td>
{{else}}<td>{{f "%.5f" (deref $p.BMean)}}</td><td>{{f "%.5f" (deref $p.ByMean)}}</td><td>{{f "%.5f" (deref $p.BMin)}}</td><td>{{f "%.5f" (deref $p.BMax)}}</td>{{end}}</tr>
{{range $p.Sides}}<tr class="note"><td>&nbsp;&nbsp;side {{.Region}}{{if .Reported}} (reported){{end}}</td><td>μr {{f "%.4g" .MuR}}</td><td>{{f "%.5f" .B}}</td><td>{{f "%.5f" .By}}</td><td></td><td></td></tr>
{{end}}{{end}}</table>

{{end}}

{{define "design"}}<h3>Gap, uniformity and fringing</h3>
<table>
{{with .Gap}}<tr><td>centre field |B| at {{.Probe}}</td><td>{{f "%.5f" .CentreB}} T</td></tr>
{{if .PoleFaceAvg}}<tr><td>mean By across the {{mm .PoleWidth}} mm pole face</td><td>{{f "%.5f" .PoleFaceAvg}} T</td></tr>{{end}}{{end}}
{{with .Uniformity}}{{if .Box}}<tr><td>max |ΔB/B0| over box {{.Box}}</td><td>{{f "%.2e" .BoxMaxDev}}</td></tr>{{end}}
{{range .HalfWidths}}<tr><td>half-width with |ΔB/B0| &lt; {{f "%.0e" .Tol}}</td><td>{{if not .Bounded}}≥ {{end}}{{mm .HalfWidth}} mm</td></tr>{{end}}{{end}}
{{with .Fringing}}<tr><td>fringing factor (flux over B0·w)</td><td>{{f "%.3f" .Factor}}</td></tr>
<tr><td>effective pole width w + 2kg (k per edge)</td><td>{{mm .WidthEff}} mm (k = {{f "%.3f" .KPerEdge}})</td></tr>
<tr><td>effective gap length μ0·NI/B0</td><td>{{mm .GapEff}} mm</td></tr>{{end}}
</table>

<h3>Coils and energy</h3>
<table><tr><th>coil</th><th>current (A)</th><th>ampere-turns</th><th>flux linkage (Wb)</th><th>L apparent (H)</th><th>L incremental (H)</th></tr>
{{range .Coils}}<tr><td>{{.Name}}</td><td>{{f "%.4g" .Current}}</td><td>{{f "%.5g" .AmpereTurns}}</td><td>{{f "%.5g" .Linkage}}</td><td>{{f "%.5g" .Apparent}}</td><td>{{if .Incremental}}{{f "%.5g" .Incremental}}{{end}}</td></tr>{{end}}
</table>
<p>Stored energy {{f "%.5g" .Energy.Energy}} J; co-energy {{f "%.5g" .Energy.CoEnergy}} J.{{with .Energy.Bounds}}
Bounds from the vector-potential and complementary solutions: between {{f "%.6g" .Lower}} and {{f "%.6g" .Upper}} J{{with .InductanceH}}; inductance between {{f "%.6g" (index . 0)}} and {{f "%.6g" (index . 1)}} H{{end}}{{if not .Guaranteed}} (not a guaranteed bracket: {{.Note}}){{end}}.{{end}}</p>

{{if .Saturation}}<h3>Saturation of the iron</h3>
<table><tr><th>region</th><th>knee (T)</th><th>mean |B| (T)</th><th>area above knee</th><th>peak |B| (T): largest mean over a disc of radius {{mm (index .Saturation 0).Radius}} mm</th><th>max raw |B| (T), mesh-dependent</th><th>area beyond the last table point</th><th>B-H curve and its source</th></tr>
{{range .Saturation}}<tr><td>{{.Region}}</td><td>{{f "%.2f" .Knee}}</td><td>{{f "%.3f" .Mean}}</td><td>{{pct .AboveKnee}} %</td><td>{{f "%.3f" .Peak}}</td><td>{{f "%.3f" .Max}}{{if .MaxAtCorner}} (at a corner){{end}}</td><td>{{pct .BeyondTable}} % (above {{f "%.2f" .TableEnd}} T)</td><td>{{if .Curve}}{{.Curve}}: {{end}}{{if .FromMemory}}<strong>from memory: typical values, not a cited source</strong>{{else}}{{.Source}}{{end}}</td></tr>{{end}}
</table>{{end}}
{{if .Forces}}<h3>Forces</h3>
<table><tr><th>part</th><th>Fx by Maxwell stress (N)</th><th>Fy by Maxwell stress (N)</th><th>by virtual work (N)</th><th>error estimate (N)</th></tr>
{{range .Forces}}<tr><td>{{.Part}}{{if .Automatic}} ({{join .Regions}}){{end}}</td>{{if .Error}}<td colspan="4">not computed: {{.Error}}</td>{{else}}<td>{{f "%.5g" (index .Stress 0)}}</td><td>{{f "%.5g" (index .Stress 1)}}</td><td>{{with .VirtualWork}}({{f "%.5g" (index . 0)}}, {{f "%.5g" (index . 1)}}){{end}}</td><td>{{with .ErrorEstimate}}±{{f "%.2g" (deref .)}}{{end}}</td>{{end}}</tr>{{end}}
</table>
<p class="caution">Iron poles attract tools and steel objects with large forces: keep hands and loose steel away from an energised magnet, and design frames and fixings to local codes and licensed engineering practice, not to these estimates alone.</p>{{end}}
{{range .Notes}}<p class="note">Note: {{.}}</p>{{end}}
{{end}}

{{define "accuracy"}}{{with .Accuracy}}{{if .Target}}<p>Every converging quantity was refined to {{f "%.0e" .Target}} relative: {{if .Reached}}reached{{else}}<span class="fail">NOT reached</span> (refinement limit){{end}} after {{.Rounds}} meshes{{if .Worst}} (largest last change {{f "%.1e" .Change}}, {{.Worst}}){{end}}. The estimate of each number is its change between the last two meshes.</p>
{{else}}<p class="fail">Quick mode: one solve on the model's own mesh; the numbers carry no error estimate.</p>{{end}}{{end}}
{{with .Estimates}}<table><tr><th>quantity (JSON path)</th><th>value</th><th>± estimate</th><th>relative</th></tr>
{{range .}}<tr><td>{{.Path}}</td><td>{{f "%.7g" .Value}}</td><td>{{f "%.2g" .Estimate}}</td><td>{{f "%.1e" .Relative}}</td></tr>{{end}}
</table>{{end}}

{{end}}

{{define "check"}}<p>Verdict: {{if .Pass}}<span class="pass">every check passes</span>{{else}}<span class="fail">some checks FAIL</span>{{end}}.
{{with .Accuracy}}{{if not .Target}}Quick mode: the values are not converged.{{else if .Reached}}Values converged to {{f "%.0e" .Target}} relative ({{.Rounds}} meshes).{{else}}<span class="fail">Values NOT converged</span> to {{f "%.0e" .Target}} relative ({{.Rounds}} meshes): a verdict near its limit is uncertain.{{end}}{{end}}</p>
<table><tr><th>requirement</th><th>value</th><th>limit</th><th>verdict</th></tr>
{{range .Items}}<tr><td>{{.What}}{{if .Note}}<br><span class="note">{{.Note}}</span>{{end}}</td><td>{{f "%.4g" .Value}} {{.Unit}}</td><td>{{f "%.4g" .Limit}} {{.Unit}}</td><td>{{if .Pass}}<span class="pass">pass</span>{{else}}<span class="fail">FAIL</span>{{end}}</td></tr>{{end}}
</table>{{range .Notes}}<p class="note">Note: {{.}}</p>{{end}}
{{with .Fringing}}<p class="note">Fringing factor {{f "%.3f" .Factor}}, effective width {{mm .WidthEff}} mm (for information).</p>{{end}}
{{end}}

{{define "sweep"}}<table><tr><th>current (A)</th><th>ampere-turns</th><th>field (T)</th><th>efficiency</th><th>max iron |B| (T)</th><th>L apparent (H)</th><th>L incremental (H)</th><th>± field (T)</th></tr>
{{range .Points}}<tr><td>{{f "%.4g" .Current}}</td><td>{{f "%.0f" .AmpereTurns}}</td><td>{{f "%.4f" .Field}}</td><td>{{if .Efficiency}}{{pct .Efficiency}} %{{end}}</td><td>{{f "%.3f" .MaxIronB}}</td><td>{{f "%.4g" .Apparent}}</td><td>{{f "%.4g" .Incremental}}</td><td>{{if .FieldEstimate}}{{f "%.1e" .FieldEstimate}}{{end}}</td></tr>{{end}}
</table>
{{with .Accuracy}}<p class="note">Accuracy: {{.}}.</p>{{end}}
{{end}}

{{define "comparison"}}<p>Measured: <code>{{.Measured}}</code> ({{.R.Kind}}, {{.R.Unit}}).</p>
<table><tr><th>current (A)</th><th>measured</th><th>u</th><th>predicted</th><th>residual</th><th>residual/u</th><th>relative</th></tr>
{{range .R.Residuals}}<tr><td>{{f "%.4g" .Current}}</td><td>{{f "%.5f" .Measured}}</td><td>{{f "%.2g" .Sigma}}</td><td>{{f "%.5f" .Predicted}}</td><td>{{f "%+.5f" .Abs}}</td><td>{{with .Normalised}}{{f "%+.2f" (deref .)}}{{else}}–{{end}}</td><td>{{relpct .Rel}}</td></tr>{{end}}
</table>
<p>RMS residual {{f "%.4g" .R.RMS}} {{.R.Unit}}, largest {{f "%.4g" .R.Max}} {{.R.Unit}}{{if .R.RelPoints}}; relative RMS {{pct .R.RMSRel}} % over {{.R.RelPoints}} points{{end}}.
The relative residual is undefined at zero current and at a zero prediction; such points count in the absolute figures only.
{{if .R.Weighted}}χ² = {{f "%.3g" .R.ChiSquare}} over ν = {{.R.Weighted}} points with stated uncertainties.{{end}}</p>
{{with .F}}<h3>Calibration of {{.Names}}</h3>
<table><tr><th>parameter</th><th>fitted ± standard uncertainty</th><th>judgement</th></tr>
{{range .Parameters}}<tr><td>{{.Parameter}}</td><td>{{.ShownWithUncertainty}}</td><td style="text-align:left">{{if not .Plausible}}<span class="fail">NOT plausible</span>: {{end}}{{.Verdict}}</td></tr>{{end}}
</table>
{{if gt (len .Correlation) 1}}<p>Correlation coefficients:</p><table><tr><th></th>{{range .Parameters}}<th>{{.Parameter}}</th>{{end}}</tr>
{{range $i, $row := .Correlation}}<tr><td>{{(index $.F.Parameters $i).Parameter}}</td>{{range $row}}<td>{{f "%+.3f" .}}</td>{{end}}</tr>{{end}}</table>{{end}}
<p>χ² = {{f "%.3g" .ChiSquare}}, ν = {{.Dof}}{{if .Dof}}, Birge ratio sqrt(χ²/ν) = {{f "%.3g" .BirgeRatio}}{{end}}.
{{if eq .Uncertainty "scatter"}}Not every point states its uncertainty: the fit is unweighted and the uncertainties come from the residual scatter.
{{else if .BirgeScaled}}<b>The residuals scatter more than the stated uncertainties allow: every uncertainty above is multiplied by the Birge ratio</b> ({{$.Citation}}).
{{else}}The residuals are consistent with the stated uncertainties, which are used unscaled ({{$.Citation}}).{{end}}
{{.Iterations}} iterations, {{.Solves}} solve rounds{{if not .Converged}}, <span class="fail">NOT converged</span>{{end}}; RMS residual {{f "%.4g" .Before.RMS}} → {{f "%.4g" .After.RMS}} {{.After.Unit}}.</p>
{{end}}
{{end}}

{{define "sizing"}}<p>To reach {{f "%.4g" .Target}} T at {{.Probe}} the magnet needs {{f "%.0f" .AmpereTurns}}{{if .AmpereTurnsEstimate}} ± {{f "%.2g" .AmpereTurnsEstimate}}{{end}} ampere-turns per winding ({{.Windings}} in series),
found in {{.Solves}} nonlinear solves (field reached {{f "%.5f" .Field}} T, efficiency {{pct .Efficiency}} %).
Coil window: radial build {{f "%.1f" .Window.Width}} mm, height {{f "%.1f" .Window.Height}} mm, mean turn {{f "%.0f" .Window.MeanTurn}} mm.</p>
{{with .Best}}<p>Least power within every limit: <b>{{.Wire.Name}}</b>, {{.Turns}} turns at {{f "%.4g" .Current}} A ({{amm2 .CurrentDensity}} A/mm²),
{{f "%.4g" .Voltage}} V, {{f "%.4g" .Power}} W, {{f "%.3g" .Mass}} kg of copper per winding.</p>{{else}}<p class="fail">No winding meets every limit: {{.NoneReason}}</p>{{end}}
<p>Copper at {{f "%.0f" .Spec.Temperature}} °C, fill factor {{f "%.2f" .Spec.FillFactor}}, {{.Spec.Cooling}} cooling{{if .Spec.SupplyVoltage}}, supply limited to {{f "%.4g" .Spec.SupplyVoltage}} V{{end}}{{if .Spec.SupplyCurrent}}, supply limited to {{f "%.4g" .Spec.SupplyCurrent}} A{{end}}{{if .Spec.Turns}}, {{.Spec.Turns}} turns fixed{{end}}{{with .Accuracy}}; accuracy: {{.}}{{end}}.</p>
<h3>Windings that fit the window</h3>
<table><tr><th>wire</th><th>turns</th><th>current (A)</th><th>A/mm²</th><th>voltage (V)</th><th>power (W)</th><th>copper (kg)</th><th>water (l/min)</th><th>speed (m/s)</th><th>Δp (bar)</th><th>limits broken</th></tr>
{{range .Options}}<tr><td>{{.Wire.Name}}</td><td>{{.Turns}}</td><td>{{f "%.4g" .Current}}</td><td>{{amm2 .CurrentDensity}}</td><td>{{f "%.4g" .Voltage}}</td><td>{{f "%.4g" .Power}}</td><td>{{f "%.3g" .Mass}}</td><td>{{if .WaterFlow}}{{f "%.3g" (lpm .WaterFlow)}}{{end}}</td><td>{{if .WaterSpeed}}{{f "%.2g" .WaterSpeed}}{{end}}</td><td>{{if .WaterPressure}}{{f "%.3g" (bar .WaterPressure)}}{{end}}</td><td>{{if .Flags}}<span class="fail">{{flags .Flags}}</span>{{else}}none{{end}}</td></tr>{{end}}
</table>

{{end}}
`))
