package models

import (
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

func TestExamplesLoad(t *testing.T) {
	names := Examples()
	if len(names) < 3 || !contains(names, DefaultExample) {
		t.Fatalf("examples %v: want at least 3 including %q", names, DefaultExample)
	}
	// gap (m) on the flux path of each example, for the sizing check below.
	gaps := map[string]float64{
		"bench-dipole":         0.040,
		"calibration-solenoid": 0.020,
		"relaxometry-magnet":   0.030,
		"holding-magnet":       0.002, // two 1 mm gaps in series
	}
	// The separator's upper pole face is a 40° arc on a 60 mm chord: its
	// sagitta is R(1 - cos 20°) with R = 30/sin 20°, so the gap at the centre
	// is 15 mm less that.
	r := 0.030 / math.Sin(20*math.Pi/180)
	gaps["mineral-separator"] = 0.015 - r*(1-math.Cos(20*math.Pi/180))
	for _, name := range names {
		src, err := Example(name)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		if !strings.HasPrefix(string(src), "#") {
			t.Errorf("%s: no comment header describing the scenario", name)
		}
		m, err := LoadExample(name)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		if err := m.Check(); err != nil {
			t.Errorf("%s: %v", name, err)
		}
		if m.Name != name {
			t.Errorf("%s: model name %q", name, m.Name)
		}
		if m.Target == nil || len(m.Coils) == 0 {
			t.Fatalf("%s: needs a coil and a target", name)
		}
		// Ideal magnetic circuit: with infinitely permeable iron, Ampère's
		// circuital law around the flux path gives B = μ0·NI/g (e.g. Jiles,
		// "Introduction to Magnetism and Magnetic Materials", 2nd ed. 1998,
		// §5 magnetic circuits). NI is the current enclosed by the flux path:
		// the sides of positive sense. The examples must land in 0.5-1.5 T
		// and their targets must lie below this iron-free upper bound.
		g, ok := gaps[name]
		if !ok {
			t.Errorf("%s: add its gap to this test", name)
			continue
		}
		ni := 0.0
		for _, c := range m.Coils {
			for _, s := range c.Sides {
				if s.Sense > 0 {
					ni += c.Turns * c.Current
				}
			}
		}
		b := 4e-7 * math.Pi * ni / g
		if b < 0.5 || b > 1.5 {
			t.Errorf("%s: ideal gap field %.3f T outside 0.5-1.5 T", name, b)
		}
		if m.Target.Field >= b {
			t.Errorf("%s: target %.3f T not below the ideal-circuit bound %.3f T", name, m.Target.Field, b)
		}
	}
	if _, err := Example("no-such"); err == nil {
		t.Errorf("Example(no-such): no error")
	}
	if _, err := Example("../doc"); err == nil {
		t.Errorf("Example(../doc): no error")
	}
}

// TestUnitsExact checks the conversion to metres. 1 in = 25.4 mm exactly
// (international yard and pound agreement, 1959); metric units divide by a
// power of ten. Each result must be the double nearest the exact value.
func TestUnitsExact(t *testing.T) {
	cases := []struct {
		units string
		v     string  // a coordinate as written
		want  float64 // metres, nearest double
	}{
		{"mm", "100", 0.1},
		{"mm", "25.4", 0.0254},
		{"mm", "1", 0.001},
		{"mm", "0.5", 0.0005},
		{"cm", "10", 0.1},
		{"cm", "2.54", 0.0254},
		{"m", "0.1", 0.1},
		{"in", "1", 0.0254},
		{"in", "10", 0.254},
		{"in", "1000", 25.4},
		{"in", "0.5", 0.0127},
	}
	for _, c := range cases {
		src := strings.NewReplacer("UNITS", c.units, "V", c.v).Replace(`units: UNITS
depth: V
regions: [{name: a, material: air, polygon: [[0, 0], [V, 0], [V, V]]}]
probes: {p: {point: [V, 0]}}
mesh: {size: V}
`)
		m := mustParse(t, c.units+" "+c.v, src)
		got := []float64{m.Depth, m.Regions[0].X[1], m.Regions[0].Y[2], m.Probes[0].Point[0], m.Mesh.Size}
		for i, g := range got {
			if g != c.want {
				t.Errorf("%s %s: value %d = %.17g m, want %.17g", c.units, c.v, i, g, c.want)
			}
		}
		if m.Scale != unitScale[c.units] || m.Units != c.units {
			t.Errorf("%s: Scale %g Units %q", c.units, m.Scale, m.Units)
		}
	}
}

// TestArcArea checks arcs against closed forms: a half-disc of radius r
// has area πr²/2, and its bounding box reaches y = r.
func TestArcArea(t *testing.T) {
	for _, sweep := range []string{"180", "-180"} {
		src := `units: m
depth: 1
regions: [{name: d, material: air, polygon: [[-2, 0], [0, 0], {at: [2, 0], arc: ` + sweep + `}]}]
`
		m := mustParse(t, "half-disc "+sweep, src)
		r := &m.Regions[0]
		// Tolerance: 1e-14 relative, a few roundings of the segment formula.
		if a, want := r.Area(), math.Pi*2; math.Abs(a-want) > 1e-14*want {
			t.Errorf("sweep %s: area %.17g want %.17g", sweep, a, want)
		}
		x0, y0, x1, y1 := m.Extent()
		wantY0, wantY1 := 0.0, 2.0
		if sweep == "-180" { // clockwise sweep from (2,0) to (-2,0) bulges down
			wantY0, wantY1 = -2, 0
		}
		if math.Abs(x0+2) > 1e-15 || math.Abs(x1-2) > 1e-15 || math.Abs(y0-wantY0) > 1e-15 || math.Abs(y1-wantY1) > 1e-15 {
			t.Errorf("sweep %s: extent %g %g %g %g", sweep, x0, y0, x1, y1)
		}
	}
}

// TestClockwiseReversed: a clockwise polygon is stored counter-clockwise,
// each arc keeping its shape (same area, same extent).
func TestClockwiseReversed(t *testing.T) {
	ccw := mustParse(t, "ccw", `units: mm
depth: 1
regions: [{name: r, material: air, polygon: [[0, 0], [100, 0], {at: [100, 50], arc: 90}, [0, 50]]}]
`)
	cw := mustParse(t, "cw", `units: mm
depth: 1
regions: [{name: r, material: air, polygon: [{at: [0, 50], arc: -90}, [100, 50], [100, 0], [0, 0]]}]
`)
	a, b := &ccw.Regions[0], &cw.Regions[0]
	if math.Abs(a.Area()-b.Area()) > 1e-15 || a.Area() <= 0.005 {
		t.Errorf("areas %g and %g", a.Area(), b.Area())
	}
	ax0, ay0, ax1, ay1 := a.Bounds()
	bx0, by0, bx1, by1 := b.Bounds()
	if ax0 != bx0 || ay0 != by0 || math.Abs(ax1-bx1) > 1e-15 || math.Abs(ay1-by1) > 1e-15 {
		t.Errorf("bounds %g %g %g %g vs %g %g %g %g", ax0, ay0, ax1, ay1, bx0, by0, bx1, by1)
	}
	// The stored vertex positions follow the vertices.
	if b.VertexPos(0).Path != "regions[0].polygon[3]" || b.X[0] != 0 || b.Y[0] != 0 {
		t.Errorf("reversed start vertex (%g, %g) %+v", b.X[0], b.Y[0], b.VertexPos(0))
	}
}

func TestDefaults(t *testing.T) {
	m := mustParse(t, "base", base)
	x0, y0, x1, y1 := m.Extent()
	if x0 != 0 || y0 != 0 || x1 != 0.1 || y1 != 0.05 {
		t.Errorf("extent %g %g %g %g", x0, y0, x1, y1)
	}
	// base states no element size: the size field is automatic and the
	// elements second order.
	if m.Mesh.Size != 0.1/30 || m.Mesh.Order != 2 || !m.Mesh.Auto || m.Mesh.Grading != 0.3 ||
		m.Mesh.MinAngle != 28*math.Pi/180 || m.Mesh.Chord != 0 {
		t.Errorf("mesh defaults %+v", m.Mesh)
	}
	if m.Boundary.Shape != "box" || m.Boundary.Margin != 1 || m.Boundary.Condition != "zero-potential" {
		t.Errorf("boundary defaults %+v", m.Boundary)
	}
	if mat, ok := m.Material("steel"); !ok || mat.Stacking != 1 || mat.MuR != 1000 {
		t.Errorf("steel %+v", mat)
	}
	for _, name := range []string{"air", "copper"} {
		if mat, ok := m.Material(name); !ok || mat.MuR != 1 {
			t.Errorf("%s: %+v", name, mat)
		}
	}
	if m.Name != "t" || m.File != "base.yaml" || m.Geometry != Planar || m.Depth != 0.1 {
		t.Errorf("header %q %q %v %g", m.Name, m.File, m.Geometry, m.Depth)
	}
}

func TestMaterialsDecoded(t *testing.T) {
	src := edit(t, "  steel: {mu-r: 1000}", `  steel: {mu-r: 1000}
  lam: {curve: silicon-steel, stacking: 0.95, grade: M270-35A}
  tab: {table: [[0, 0], [100, 1.0], [1000, 1.5]]}
  csv: {table-file: curves/m.csv}
  pm: {remanence: 1.2, mu-recoil: 1.05, direction: 90}`)
	dir := t.TempDir()
	if err := os.MkdirAll(filepath.Join(dir, "curves"), 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(dir, "curves", "m.csv"), []byte("0,0\n100,1\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	m := mustParse(t, filepath.Join(dir, "model"), src)
	lam, _ := m.Material("lam")
	tab, _ := m.Material("tab")
	csv, _ := m.Material("csv")
	pm, _ := m.Material("pm")
	if lam.Curve != "silicon-steel" || lam.Stacking != 0.95 || lam.Grade != "M270-35A" || lam.GradePos.Line != 6 {
		t.Errorf("lam %+v", lam)
	}
	if len(tab.Table) != 3 || tab.Table[2] != [2]float64{1000, 1.5} {
		t.Errorf("tab %+v", tab)
	}
	if csv.TableFile != filepath.Join(dir, "curves", "m.csv") {
		t.Errorf("csv path %q: want it relative to the model file", csv.TableFile)
	}
	if pm.Magnet == nil || pm.Magnet.Remanence != 1.2 || pm.Magnet.MuRecoil != 1.05 || math.Abs(pm.Magnet.Direction-math.Pi/2) > 1e-15 {
		t.Errorf("pm %+v", pm.Magnet)
	}
	if lam.Pos.Line != 6 || lam.Pos.Path != "materials.lam" {
		t.Errorf("lam pos %+v", lam.Pos)
	}
}

func TestProbesDecoded(t *testing.T) {
	src := edit(t, "  p: {point: [50, 60]}", `  p: {point: [50, 60]}
  l: {line: [[0, 0], [10, 0]], samples: 11}
  b: {box: [[10, 8], [0, 2]]}
  c: {centre: [5, 5], radius: 2}`)
	m := mustParse(t, "probes", src)
	l, _ := m.Probe("l")
	b, _ := m.Probe("b")
	c, _ := m.Probe("c")
	if l.Kind != ProbeLine || l.Samples != 11 || l.Line[1][0] != 0.01 {
		t.Errorf("line %+v", l)
	}
	if b.Kind != ProbeBox || b.Box != [2][2]float64{{0, 0.002}, {0.01, 0.008}} {
		t.Errorf("box corners not ordered: %+v", b.Box)
	}
	if c.Kind != ProbeCircle || c.Radius != 0.002 || c.Samples != defaultCircleSamples {
		t.Errorf("circle %+v", c)
	}
}

func TestErrorFormat(t *testing.T) {
	cases := []struct {
		e    Error
		want string
	}{
		{Error{"a.yaml", 3, 7, "regions[2].polygon[3]", "bad"}, "a.yaml:3:7: regions[2].polygon[3]: bad"},
		{Error{"a.yaml", 3, 0, "", "bad"}, "a.yaml:3: bad"},
		{Error{"a.yaml", 0, 0, "x", "bad"}, "a.yaml: x: bad"},
	}
	for _, c := range cases {
		if got := c.e.Error(); got != c.want {
			t.Errorf("got %q want %q", got, c.want)
		}
	}
	l := ErrorList{{File: "a", Line: 9, Msg: "late"}, {File: "a", Line: 2, Column: 5, Msg: "early"}, {File: "a", Line: 2, Column: 1, Msg: "first"}}
	l.Sort()
	if got := l.Error(); got != "a:2:1: first\na:2:5: early\na:9: late" {
		t.Errorf("sorted list:\n%s", got)
	}
}

func TestManyErrorsSorted(t *testing.T) {
	src := edit(t, "depth: 100", "depth: -1\nmehs: 1")
	src = strings.Replace(src, "turns: 100", "turns: x", 1)
	_, err := Parse("m.yaml", []byte(src))
	list, _ := err.(ErrorList)
	if len(list) != 3 {
		t.Fatalf("got %d errors:\n%v", len(list), err)
	}
	for i := 1; i < len(list); i++ {
		if list[i].Line < list[i-1].Line {
			t.Errorf("not sorted:\n%v", err)
		}
	}
}

// TestMergeKeys: YAML merge keys (<<: *anchor) fill in keys a mapping does
// not set itself; unknown keys in the merged mapping are still errors.
func TestMergeKeys(t *testing.T) {
	src := `units: mm
depth: 10
regions:
  - &r {name: a, material: air, polygon: [[0, 0], [10, 0], [10, 10]], mesh-size: 2}
  - <<: *r
    name: b
    polygon: [[20, 0], [30, 0], [30, 10]]
`
	m := mustParse(t, "merge", src)
	b, _ := m.Region("b")
	if b.Material != "air" || b.MeshSize != 0.002 || b.X[0] != 0.02 {
		t.Errorf("merged region %+v", b)
	}
	if m.Mesh.MinAngleDegrees() != 28 {
		t.Errorf("MinAngleDegrees %g", m.Mesh.MinAngleDegrees())
	}
	bad := strings.Replace(src, "mesh-size: 2}", "mesh-size: 2, colour: red}", 1)
	runErrCases(t, []errCase{{"merged unknown key", bad,
		`m.yaml:4:85: regions[0].colour: unknown key "colour" in a region; known keys are name, material, polygon or mesh-size`}})
}

// TestMergeBomb: merge keys that fan out at every level must fail fast
// rather than expand exponentially.
func TestMergeBomb(t *testing.T) {
	var sb strings.Builder
	sb.WriteString("units: mm\ndepth: 1\nmaterials:\n  m0: &a0 {mu-r: 1}\n")
	for i := 1; i <= 12; i++ {
		fmt.Fprintf(&sb, "  m%d: &a%d {<<: [*a%d, *a%d, *a%d, *a%d]}\n", i, i, i-1, i-1, i-1, i-1)
	}
	sb.WriteString("regions: [{name: a, material: air, polygon: [[0, 0], [1, 0], [0, 1]]}]\n")
	_, err := Parse("bomb.yaml", []byte(sb.String()))
	if err == nil || !strings.Contains(err.Error(), "merge keys") {
		t.Errorf("merge bomb: %v", err)
	}
}

// TestBoundaryMarginsBox: boundary.margins keeps its multiples as given,
// boundary.box is read in file units and stored in metres, and Clone
// copies both (a change to the copy leaves the original alone).
func TestBoundaryMarginsBox(t *testing.T) {
	m := mustParse(t, "margins", base+"boundary: {margin: 0.5, margins: {left: 2, top: 0.25}}\n")
	if b := m.Boundary; b.Shape != "box" || b.Margin != 0.5 || len(b.Margins) != 2 || b.Margins["left"] != 2 || b.Margins["top"] != 0.25 || b.Box != nil {
		t.Errorf("margins: boundary %+v", b)
	}
	c := m.Clone()
	c.Boundary.Margins["left"] = 9
	if m.Boundary.Margins["left"] != 2 {
		t.Error("Clone shares boundary.margins")
	}
	m = mustParse(t, "box", strings.Replace(base, "units: mm", "units: cm", 1)+"boundary: {box: [[-1, -2.5], [110, 60]], sides: {left: flux-normal}}\n")
	want := [2][2]float64{{-0.01, -0.025}, {1.1, 0.6}}
	if b := m.Boundary; b.Box == nil || *b.Box != want || b.Sides["left"] != "flux-normal" || b.Margins != nil {
		t.Errorf("box: boundary %+v, box %v want %v", b, b.Box, want)
	}
	c = m.Clone()
	c.Boundary.Box[0][0] = 5
	if m.Boundary.Box[0][0] != -0.01 {
		t.Error("Clone shares boundary.box")
	}
	if err := m.Check(); err != nil {
		t.Error(err)
	}
}

// TestMeshAuto pins when the size field is automatic: the file states no
// element size (no mesh.size, no region mesh-size, no mesh.refine list,
// even an empty one); a template's own refinements do not count. The
// element order defaults to 2 then, and to 1 when sizes are stated.
func TestMeshAuto(t *testing.T) {
	const tmpl = `name: t
units: mm
depth: 100
template: c-core
dimensions: {gap: 10, pole-width: 50, pole-height: 40, arm-thickness: 40, leg-width: 40,
  window-width: 80, coil-width: 30, coil-height: 60, turns: 100, current: 10}
`
	cases := []struct {
		name      string
		src       string
		auto      bool
		order     int
		keepsSize bool // Mesh.Size is the stated 5 mm
	}{
		{"no mesh section", base, true, 2, false},
		{"order only", base + "mesh: {order: 1}\n", true, 1, false},
		{"grading only", base + "mesh: {grading: 0.2}\n", true, 2, false},
		{"size", base + "mesh: {size: 5}\n", false, 1, true},
		{"size and order", base + "mesh: {size: 5, order: 2}\n", false, 2, true},
		{"refine", base + "mesh: {refine: [{point: [10, 10], size: 1}]}\n", false, 1, false},
		{"empty refine", base + "mesh: {refine: []}\n", false, 1, false},
		{"region mesh-size", edit(t, "    material: steel\n", "    material: steel\n    mesh-size: 5\n"), false, 1, false},
		{"template, no mesh section", tmpl, true, 2, false},
		{"template with size", tmpl + "mesh: {size: 5}\n", false, 1, true},
	}
	for _, c := range cases {
		m := mustParse(t, c.name, c.src)
		if m.Mesh.Auto != c.auto || m.Mesh.Order != c.order {
			t.Errorf("%s: Auto %t, Order %d; want %t, %d", c.name, m.Mesh.Auto, m.Mesh.Order, c.auto, c.order)
		}
		if c.keepsSize && m.Mesh.Size != 0.005 {
			t.Errorf("%s: Size %g, want the stated 0.005 m", c.name, m.Mesh.Size)
		}
	}
}
