package bench

import (
	"encoding/json"
	"fmt"
	"io"
	"math"
	"runtime"
	"runtime/debug"
	"strings"
	"text/tabwriter"
	"time"
)

// Machine describes where a table was measured.
type Machine struct {
	Go         string     `json:"go"`
	OS         string     `json:"os"`
	Arch       string     `json:"arch"`
	CPUs       int        `json:"cpus"`
	GOMAXPROCS int        `json:"gomaxprocs"`
	GCPercent  int        `json:"gc_percent"`         // the collector's target heap growth (GOGC), -1 off
	LoadStart  [3]float64 `json:"load_average_start"` // 1, 5, 15 min, from /proc/loadavg
	LoadEnd    [3]float64 `json:"load_average_end"`
}

// A Check is one figure of a case against its DESIGN.md goal.
type Check struct {
	Case   string  `json:"case"`
	Figure string  `json:"figure"`
	Unit   string  `json:"unit"`
	Value  float64 `json:"value"`
	Goal   float64 `json:"goal"` // the largest value allowed
	// Scaled is true when DESIGN.md states the goal at another size and
	// it was interpolated or scaled to this one (see goalCurve.at).
	Scaled bool `json:"scaled"`
	Pass   bool `json:"pass"`
}

// Growth is the fitted exponent p of cost ∝ N^p over the first-order cases.
type Growth struct {
	Figure   string  `json:"figure"`
	Exponent float64 `json:"exponent"`
	Sizes    int     `json:"sizes"` // points in the fit
	Goal     float64 `json:"goal"`
	Pass     bool    `json:"pass"`
}

// Table is the outcome of Run.
type Table struct {
	Machine Machine   `json:"machine"`
	Started time.Time `json:"started"`
	Repeat  int       `json:"repeat"`
	Results []Result  `json:"results"`
	Checks  []Check   `json:"checks"`
	Growth  []Growth  `json:"growth"`
	// Accurate holds the figures at the default accuracy, when measured.
	Accurate *Accurate `json:"default_accuracy,omitempty"`
}

func newTable(repeat int) *Table {
	return &Table{
		Machine: Machine{Go: runtime.Version(), OS: runtime.GOOS, Arch: runtime.GOARCH,
			CPUs: runtime.NumCPU(), GOMAXPROCS: runtime.GOMAXPROCS(0), GCPercent: gcPercent(), LoadStart: loadAverage()},
		Started: time.Now().UTC().Truncate(time.Second),
		Repeat:  repeat,
	}
}

// finish records the end load and computes the checks and growth exponents.
func (t *Table) finish() {
	t.Machine.LoadEnd = loadAverage()
	t.Checks = checks(t.Results)
	if t.Accurate != nil {
		t.Checks = append(t.Checks, t.Accurate.checks()...)
	}
	t.Growth = growth(t.Results)
}

// A figure is one row of the terminal table.
type figure struct {
	name, unit string
	get        func(*Result) float64
	format     string
	fit        bool // fit a growth exponent
}

var figures = []figure{
	{"mesh", "s", func(r *Result) float64 { return r.Mesh }, "%.3g", true},
	{"mesher triangles/s", "1/s", func(r *Result) float64 { return r.TrianglesPerSecond }, "%.3g", false},
	{"assembly", "s", func(r *Result) float64 { return r.Assemble }, "%.3g", true},
	{"ordering+symbolic", "s", func(r *Result) float64 { return r.Analyze }, "%.3g", true},
	{"numeric factor", "s", func(r *Result) float64 { return r.Factor }, "%.3g", true},
	{"triangular solve", "s", func(r *Result) float64 { return r.Solve }, "%.3g", true},
	{"linear solve (Cholesky)", "s", func(r *Result) float64 { return r.Linear }, "%.3g", true},
	{"factor entries", "", func(r *Result) float64 { return float64(r.FactorNNZ) }, "%.3g", true},
	{"factor flops", "", func(r *Result) float64 { return r.FactorFlops }, "%.3g", true},
	{"linear solve (PCG)", "s", func(r *Result) float64 { return r.PCG }, "%.3g", true},
	{"PCG iterations", "", func(r *Result) float64 { return float64(r.PCGIterations) }, "%.0f", true},
	{"nonlinear solve", "s", func(r *Result) float64 { return r.Nonlinear }, "%.3g", true},
	{"Newton iterations", "", func(r *Result) float64 { return float64(r.NewtonIterations) }, "%.0f", false},
	{"excitation curve", "s", func(r *Result) float64 { return r.Curve }, "%.3g", true},
	{"curve Newton steps", "", func(r *Result) float64 { return float64(r.CurveIterations) }, "%.0f", false},
	{"mesh CPU", "s", func(r *Result) float64 { return r.MeshCPU }, "%.3g", false},
	{"linear (Cholesky) CPU", "s", func(r *Result) float64 { return r.LinearCPU }, "%.3g", false},
	{"linear (PCG) CPU", "s", func(r *Result) float64 { return r.PCGCPU }, "%.3g", false},
	{"nonlinear CPU", "s", func(r *Result) float64 { return r.NonlinearCPU }, "%.3g", false},
	{"excitation curve CPU", "s", func(r *Result) float64 { return r.CurveCPU }, "%.3g", false},
	{"peak heap", "MiB", func(r *Result) float64 { return float64(r.PeakHeap) / (1 << 20) }, "%.4g", true},
	{"peak RSS", "MiB", func(r *Result) float64 { return float64(r.PeakRSS) / (1 << 20) }, "%.4g", false},
	{"peak bytes/node w/o factor", "B", func(r *Result) float64 { return r.BytesPerNode }, "%.0f", false},
	{"live heap", "MiB", func(r *Result) float64 { return float64(r.LiveHeap) / (1 << 20) }, "%.4g", true},
	{"live bytes/node w/o factor", "B", func(r *Result) float64 { return r.LiveBytesPerNode }, "%.0f", false},
}

func checks(rs []Result) []Check {
	var cs []Check
	add := func(r *Result, name, unit string, v float64, g goalCurve, n float64) {
		goal, scaled := g.at(n)
		cs = append(cs, Check{Case: r.Case, Figure: name, Unit: unit, Value: v, Goal: goal, Scaled: scaled, Pass: v <= goal})
	}
	for i := range rs {
		r := &rs[i]
		n := float64(r.Nodes)
		add(r, "mesh", "s", r.Mesh, goalMesh, float64(r.Triangles))
		add(r, "linear solve (Cholesky)", "s", r.Linear, goalLinear, n)
		if r.PCGIterations > 0 {
			add(r, "linear solve (PCG)", "s", r.PCG, goalLinear, n)
		}
		if r.PCGIterations > 0 && !r.PCGConverged {
			// Stopped at PCGMaxIter: the time is a lower bound.
			cs[len(cs)-1].Pass = false
			cs[len(cs)-1].Figure = fmt.Sprintf("linear solve (PCG, stopped at %d iterations, residual %.1e)", r.PCGIterations, r.PCGResidual)
		}
		add(r, "nonlinear solve", "s", r.Nonlinear, goalNonlinear, n)
		if r.CurvePoints > 0 {
			// The goal is for 20 points; other counts scale in proportion.
			g := goalCurve{{goalCurve20[0].n, goalCurve20[0].cost * float64(r.CurvePoints) / CurvePoints}}
			add(r, fmt.Sprintf("excitation curve (%d points)", r.CurvePoints), "s", r.Curve, g, n)
		}
		cs = append(cs, Check{Case: r.Case, Figure: "peak bytes/node w/o factor", Unit: "B", Value: r.BytesPerNode,
			Goal: GoalBytesPerNode, Pass: r.BytesPerNode <= GoalBytesPerNode},
			Check{Case: r.Case, Figure: "live bytes/node w/o factor", Unit: "B", Value: r.LiveBytesPerNode,
				Goal: GoalBytesPerNode, Pass: r.LiveBytesPerNode <= GoalBytesPerNode})
	}
	return cs
}

func growth(rs []Result) []Growth {
	var gs []Growth
	for _, f := range figures {
		if !f.fit {
			continue
		}
		var n, c []float64
		for i := range rs {
			if rs[i].Order == 1 {
				n = append(n, float64(rs[i].Nodes))
				c = append(c, f.get(&rs[i]))
			}
		}
		p, _, ok := Fit(n, c)
		if !ok {
			continue
		}
		k := 0
		for i := range n {
			if c[i] > 0 {
				k++
			}
		}
		gs = append(gs, Growth{Figure: f.name, Exponent: p, Sizes: k, Goal: GoalExponent, Pass: p <= GoalExponent})
	}
	return gs
}

// WriteJSON writes the table as indented JSON.
func (t *Table) WriteJSON(w io.Writer) error {
	e := json.NewEncoder(w)
	e.SetIndent("", "  ")
	return e.Encode(t)
}

// WriteText writes the table for a terminal: the machine and its load,
// the cases, a figure per row with the growth exponent, then each figure
// against its goal with a verdict.
func (t *Table) WriteText(w io.Writer) error {
	m := &t.Machine
	var b strings.Builder
	fmt.Fprintf(&b, "polegap bench: generated C-core in low-carbon steel; %s %s/%s, %d CPUs (GOMAXPROCS %d, GOGC %d)\n",
		m.Go, m.OS, m.Arch, m.CPUs, m.GOMAXPROCS, m.GCPercent)
	fmt.Fprintf(&b, "load average %s at start, %s at end; times are wall-clock medians of %d run(s)\n",
		fmtLoad(m.LoadStart), fmtLoad(m.LoadEnd), t.Repeat)
	b.WriteString("Timings depend on the machine and on its load: compare figures from one run.\n\n")

	tw := tabwriter.NewWriter(&b, 0, 0, 2, ' ', tabwriter.AlignRight)
	row := func(cells ...string) { fmt.Fprintln(tw, strings.Join(cells, "\t")+"\t") }
	head := []string{"", "unit"}
	for _, r := range t.Results {
		head = append(head, r.Case)
	}
	head = append(head, "growth N^p")
	row(head...)
	size := func(name string, get func(*Result) string) {
		cells := []string{name, ""}
		for i := range t.Results {
			cells = append(cells, get(&t.Results[i]))
		}
		row(append(cells, "")...)
	}
	size("nodes", func(r *Result) string { return group(r.Nodes) })
	size("triangles", func(r *Result) string { return group(r.Triangles) })
	size("unknowns", func(r *Result) string { return group(r.Unknowns) })
	size("element size mm", func(r *Result) string { return fmt.Sprintf("%.3g", r.MeshSize) })
	exps := map[string]Growth{}
	for _, g := range t.Growth {
		exps[g.Figure] = g
	}
	for _, f := range figures {
		cells := []string{f.name, f.unit}
		for i := range t.Results {
			v := f.get(&t.Results[i])
			if v == 0 && f.name != "Newton iterations" {
				cells = append(cells, "-")
				continue
			}
			cells = append(cells, fmt.Sprintf(f.format, v))
		}
		g := ""
		if e, ok := exps[f.name]; ok {
			g = fmt.Sprintf("%.2f", e.Exponent)
		}
		row(append(cells, g)...)
	}
	if err := tw.Flush(); err != nil {
		return err
	}
	if t.Accurate != nil {
		t.Accurate.writeText(&b)
	}

	b.WriteString("\nAgainst DESIGN.md (~ marks a goal scaled from the size it is stated at; " + AccurateModel + ": the speed goals at the default accuracy):\n\n")
	tw = tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, "case\tfigure\tvalue\tgoal\tverdict")
	for _, c := range t.Checks {
		mark := ""
		if c.Scaled {
			mark = "~"
		}
		fmt.Fprintf(tw, "%s\t%s\t%s %s\t≤ %s%s %s\t%s\n", c.Case, c.Figure, fmtNum(c.Value), c.Unit, mark, fmtNum(c.Goal), c.Unit, verdict(c.Pass))
	}
	for _, g := range t.Growth {
		fmt.Fprintf(tw, "growth\t%s\tN^%.2f (%d sizes)\t≤ N^%.1f\t%s\n", g.Figure, g.Exponent, g.Sizes, g.Goal, verdict(g.Pass))
	}
	if err := tw.Flush(); err != nil {
		return err
	}
	_, err := io.WriteString(w, b.String())
	return err
}

func verdict(pass bool) string {
	if pass {
		return "ok"
	}
	return "MISSED"
}

func fmtNum(v float64) string {
	switch {
	case v == 0:
		return "0"
	case math.Abs(v) >= 1e4:
		return group(int(math.Round(v)))
	}
	return fmt.Sprintf("%.3g", v)
}

// gcPercent reads the collector's current target heap growth.
func gcPercent() int {
	p := debug.SetGCPercent(100)
	debug.SetGCPercent(p)
	return p
}

func fmtLoad(l [3]float64) string {
	return fmt.Sprintf("%.2f %.2f %.2f", l[0], l[1], l[2])
}

// group writes n with thousands separators: 1,234,567.
func group(n int) string {
	s := fmt.Sprint(n)
	neg := strings.HasPrefix(s, "-")
	if neg {
		s = s[1:]
	}
	var b strings.Builder
	for i, ch := range s {
		if i > 0 && (len(s)-i)%3 == 0 {
			b.WriteByte(',')
		}
		b.WriteRune(ch)
	}
	if neg {
		return "-" + b.String()
	}
	return b.String()
}
