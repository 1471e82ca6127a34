package models

import (
	"math"
	"strings"
	"testing"
)

// checkNoOverlap asserts that no two regions' interiors overlap, with the
// same test Parse uses, and that every area is positive.
func checkNoOverlap(t *testing.T, name string, m *Model) {
	t.Helper()
	for i := range m.Regions {
		if a := m.Regions[i].Area(); !(a > 0) {
			t.Errorf("%s: region %s area %g", name, m.Regions[i].Name, a)
		}
		for j := i + 1; j < len(m.Regions); j++ {
			if x, y, ok := overlap(&m.Regions[i], &m.Regions[j], 1e-12); ok {
				t.Errorf("%s: %s overlaps %s at (%g, %g)", name, m.Regions[i].Name, m.Regions[j].Name, x, y)
			}
		}
	}
}

// checkAreas compares region areas with hand-computed values (m²). The
// tolerance, 1e-12 relative, allows for the rounding of a few products.
func checkAreas(t *testing.T, name string, m *Model, want map[string]float64) {
	t.Helper()
	if len(m.Regions) != len(want) {
		t.Errorf("%s: %d regions, want %d", name, len(m.Regions), len(want))
	}
	for rn, w := range want {
		r, ok := m.Region(rn)
		if !ok {
			t.Errorf("%s: no region %q", name, rn)
			continue
		}
		if a := r.Area(); math.Abs(a-w) > 1e-12*w {
			t.Errorf("%s: region %s area %.15g m², want %.15g", name, rn, a, w)
		}
	}
}

const cCore = `units: mm
depth: 100
template: c-core
dimensions: {gap: 40, pole-width: 200, pole-height: 80, arm-thickness: 180, leg-width: 180,
  window-width: 120, coil-width: 100, coil-height: 160, clearance: 10, turns: 320, current: 100}
`

func TestCCoreAreas(t *testing.T) {
	mm2 := 1e-6 // m² per mm²
	// Hand computation for gap 40, pole 200 × 80, arm 180, leg 180,
	// window 120, coil 100 × 160: back leg 180 × (40 + 2·80); arm
	// (180 + 120 + 200) × 180; pole 200 × 80; gap 200 × 40.
	m := mustParse(t, "c-core", cCore)
	checkNoOverlap(t, "c-core", m)
	checkAreas(t, "c-core", m, map[string]float64{
		"back-leg": 180 * 200 * mm2, "upper-arm": 500 * 180 * mm2, "lower-arm": 500 * 180 * mm2,
		"upper-pole": 200 * 80 * mm2, "lower-pole": 200 * 80 * mm2, "gap": 200 * 40 * mm2,
		"coil-left": 100 * 160 * mm2, "coil-right": 100 * 160 * mm2,
	})
	// Tapered face 160 wide with 10 chamfers: trapezoid (200 + 160)/2 × 80
	// less two corner triangles ½·c²·sin φ, φ the angle between the face and
	// the side, whose direction is (20, 80)/|(20, 80)|: sin φ = 80/√6800.
	// The gap spans the flat face, 160 - 2·10 = 140 wide.
	tp := strings.Replace(cCore, "gap: 40", "gap: 40, pole-face-width: 160, chamfer: 10, coil: poles, coil-height: 60", 1)
	tp = strings.Replace(tp, "coil-height: 160, ", "", 1)
	tp = strings.Replace(tp, "coil-width: 100", "coil-width: 90", 1)
	m = mustParse(t, "c-core tapered", tp)
	checkNoOverlap(t, "c-core tapered", m)
	sinPhi := 80 / math.Sqrt(6800)
	pole := ((200+160)/2*80 - 2*0.5*10*10*sinPhi) * mm2
	checkAreas(t, "c-core tapered", m, map[string]float64{
		"back-leg": 180 * 200 * mm2, "upper-arm": 500 * 180 * mm2, "lower-arm": 500 * 180 * mm2,
		"upper-pole": pole, "lower-pole": pole, "gap": 140 * 40 * mm2,
		"coil-upper-left": 90 * 60 * mm2, "coil-upper-right": 90 * 60 * mm2,
		"coil-lower-left": 90 * 60 * mm2, "coil-lower-right": 90 * 60 * mm2,
	})
	// Pole coils in series: each side carries the coil's turns; the senses
	// drive the gap field along +y (window sides +1, outer sides -1).
	c, _ := m.Coil("main")
	senses := map[string]float64{}
	for _, s := range c.Sides {
		senses[s.Region] = s.Sense
	}
	if senses["coil-upper-left"] != 1 || senses["coil-lower-left"] != 1 || senses["coil-upper-right"] != -1 || senses["coil-lower-right"] != -1 {
		t.Errorf("pole coil senses %v", senses)
	}
	if m.Gap != 0.04 {
		t.Errorf("template gap %g m, want 0.04", m.Gap)
	}
	// A top-level gap overrides the template's.
	if m2 := mustParse(t, "gap override", "gap: 41\n"+tp); m2.Gap != 0.041 {
		t.Errorf("stated gap %g m, want 0.041", m2.Gap)
	}
	// Probes: gap-centre at the pole centre on the mid-plane.
	p, _ := m.Probe("gap-centre")
	if p.Point != [2]float64{0.4, 0} {
		t.Errorf("gap-centre %v", p.Point)
	}
	if m.Target != nil {
		t.Errorf("target without field: %+v", m.Target)
	}
}

func TestHCoreAreas(t *testing.T) {
	src := `units: mm
depth: 100
template: h-core
dimensions: {gap: 40, pole-width: 200, pole-height: 80, yoke-thickness: 150, leg-width: 100,
  window-width: 120, coil-width: 100, coil-height: 60, turns: 160, current: 100}
`
	mm2 := 1e-6
	// Hand computation: legs 100 × (40 + 2·80); yokes span 2·(100 + 120 +
	// 100) = 640 by 150; poles 200 × 80; gap 200 × 40; coil sides 100 × 60.
	m := mustParse(t, "h-core", src)
	checkNoOverlap(t, "h-core", m)
	checkAreas(t, "h-core", m, map[string]float64{
		"left-leg": 100 * 200 * mm2, "right-leg": 100 * 200 * mm2,
		"upper-yoke": 640 * 150 * mm2, "lower-yoke": 640 * 150 * mm2,
		"upper-pole": 200 * 80 * mm2, "lower-pole": 200 * 80 * mm2, "gap": 200 * 40 * mm2,
		"coil-upper-left": 100 * 60 * mm2, "coil-upper-right": 100 * 60 * mm2,
		"coil-lower-left": 100 * 60 * mm2, "coil-lower-right": 100 * 60 * mm2,
	})
	x0, y0, x1, y1 := m.Extent()
	if x0 != -0.32 || x1 != 0.32 || y0 != -0.25 || y1 != 0.25 {
		t.Errorf("h-core extent %g %g %g %g", x0, y0, x1, y1)
	}
	runErrCases(t, []errCase{{"coil too wide", strings.Replace(src, "coil-width: 100", "coil-width: 110", 1),
		`m.yaml:5:22: dimensions.coil-width: a coil side in the window needs coil-width + 2·clearance = 132, but window-width is 120`}})
}

func TestRoundPoleAreas(t *testing.T) {
	src := `units: mm
geometry: axisymmetric
template: round-pole
dimensions: {gap: 30, pole-diameter: 160, pole-height: 90, plate-thickness: 70, window-width: 90,
  return-thickness: 60, coil-width: 70, coil-height: 70, turns: 200, current: 60, field: 1.0}
`
	mm2 := 1e-6
	// Hand computation (r-z half-plane areas): pole 80 × 90; plates reach
	// r = 80 + 90 + 60 = 230, 70 thick; return shell 60 × 2·(15 + 90);
	// gap 80 × 30; coils 70 × 70.
	m := mustParse(t, "round-pole", src)
	checkNoOverlap(t, "round-pole", m)
	checkAreas(t, "round-pole", m, map[string]float64{
		"upper-pole": 80 * 90 * mm2, "lower-pole": 80 * 90 * mm2,
		"upper-plate": 230 * 70 * mm2, "lower-plate": 230 * 70 * mm2,
		"return-yoke": 60 * 210 * mm2, "gap": 80 * 30 * mm2,
		"upper-coil": 70 * 70 * mm2, "lower-coil": 70 * 70 * mm2,
	})
	if m.Geometry != Axisymmetric || m.Target.Probe != "gap-centre" {
		t.Errorf("geometry %v target %+v", m.Geometry, m.Target)
	}
	// A conical face with a chamfer: frustum section (80 + 60)/2 × 90 less
	// the chamfer triangle ½·c²·sin φ, sin φ = 90/√(20² + 90²).
	tp := strings.Replace(src, "gap: 30,", "gap: 30, pole-face-diameter: 120, chamfer: 5,", 1)
	m = mustParse(t, "round-pole tapered", tp)
	checkNoOverlap(t, "round-pole tapered", m)
	p, _ := m.Region("upper-pole")
	want := ((80+60)/2*90 - 0.5*25*90/math.Sqrt(20*20+90*90)) * mm2
	if math.Abs(p.Area()-want) > 1e-12*want {
		t.Errorf("tapered pole area %.15g want %.15g", p.Area(), want)
	}
}

func TestSolenoidAreas(t *testing.T) {
	src := `units: mm
geometry: axisymmetric
template: solenoid
dimensions: {inner-radius: 40, thickness: 50, length: 100, clearance: 4, turns: 1000, current: 14, field: 0.8}
`
	mm2 := 1e-6
	m := mustParse(t, "air solenoid", src)
	checkAreas(t, "air solenoid", m, map[string]float64{"winding": 50 * 100 * mm2})
	// Without a geometry key the template's geometry applies.
	if m2 := mustParse(t, "implied geometry", strings.Replace(src, "geometry: axisymmetric\n", "", 1)); m2.Geometry != Axisymmetric {
		t.Errorf("implied geometry %v", m2.Geometry)
	}
	if m.Target == nil || m.Target.Probe != "centre" || m.Target.Field != 0.8 {
		t.Errorf("target %+v", m.Target)
	}
	// With yoke and poles: shell inner radius 40 + 50 + 4 = 94, outer 119;
	// plates from z = 54 to 79, hole radius 35; poles r <= 35 from z = 10.
	// Yoke = (119 - 35) × 158 - (94 - 35) × 108; pole = 35 × (79 - 10).
	src = strings.Replace(src, "clearance: 4,", "clearance: 4, yoke-thickness: 25, bore-radius: 35, pole-gap: 20,", 1)
	m = mustParse(t, "iron solenoid", src)
	checkNoOverlap(t, "iron solenoid", m)
	checkAreas(t, "iron solenoid", m, map[string]float64{
		"winding": 50 * 100 * mm2, "yoke": (84*158 - 59*108) * mm2,
		"upper-pole": 35 * 69 * mm2, "lower-pole": 35 * 69 * mm2,
	})
	// The geometry must lie in r >= 0 and touch the axis only with the poles.
	x0, _, x1, _ := m.Extent()
	if x0 != 0 || math.Abs(x1-0.119) > 1e-15 {
		t.Errorf("extent r from %g to %g", x0, x1)
	}
}

func TestTemplateOverride(t *testing.T) {
	src := cCore + `regions:
  - {name: gap, material: brass, polygon: [[320, -20], [480, -20], [480, 20], [320, 20]]}
  - {name: shim, material: brass, polygon: [[600, 0], [610, 0], [610, 10]]}
materials:
  brass: {mu-r: 1}
coils:
  - {name: main, turns: 10, current: 1, sides: [{region: coil-left, sense: +1}]}
probes:
  gap-centre: {point: [300, 0]}
  extra: {point: [0, 0]}
mesh: {refine: [{near: shim, size: 1}]}
target: {probe: extra, field: 0.1}
`
	m := mustParse(t, "override", src)
	g, _ := m.Region("gap")
	if g.Material != "brass" || g.Pos.Line == 0 || math.Abs(g.Area()-160*40*1e-6) > 1e-12*160*40*1e-6 {
		t.Errorf("gap not replaced: %+v", g)
	}
	if len(m.Regions) != 9 || m.Regions[8].Name != "shim" {
		t.Errorf("regions: %v", regionNames(m))
	}
	c, _ := m.Coil("main")
	if len(m.Coils) != 1 || c.Turns != 10 || len(c.Sides) != 1 {
		t.Errorf("coil not replaced: %+v", c)
	}
	p, _ := m.Probe("gap-centre")
	if p.Point[0] != 0.3 || len(m.Probes) != 4 {
		t.Errorf("probes: %v", m.Probes)
	}
	if len(m.Mesh.Refine) != 1 || m.Mesh.Refine[0].Near != "shim" {
		t.Errorf("refine not replaced: %+v", m.Mesh.Refine)
	}
	if m.Target.Probe != "extra" {
		t.Errorf("target %+v", m.Target)
	}
	// A user region overlapping a template region is an error at the user's line.
	bad := cCore + "regions: [{name: plate, material: air, polygon: [[0, 0], [10, 0], [10, 10]]}]\n"
	runErrCases(t, []errCase{{"overlaps template", bad,
		`m.yaml:6:11: regions[0]: region "plate" overlaps region "back-leg" near (5, 0.0005) mm; regions may touch or share edges but not overlap (one inside another is an overlap too: cut a hole by splitting the outer region)`}})
}

// TestTemplateBoundary: every template defaults to the open boundary on a
// circle at the default margin (the Kelvin transformation; a box held at
// A = 0 one model size away leaves a finite solenoid's centre field
// several per cent low, post/study TestSolenoidTemplateDefaults). A
// boundary mapping in the file replaces the template's as a whole, and a
// model without a template keeps the box.
func TestTemplateBoundary(t *testing.T) {
	sol := `units: mm
template: solenoid
dimensions: {inner-radius: 40, thickness: 50, length: 100, turns: 1000, current: 14}
`
	rp := `units: mm
template: round-pole
dimensions: {gap: 30, pole-diameter: 160, pole-height: 90, plate-thickness: 70, window-width: 90,
  return-thickness: 60, coil-width: 70, coil-height: 70, clearance: 8, turns: 220, current: 32}
`
	hc := `units: mm
depth: 100
template: h-core
dimensions: {gap: 40, pole-width: 200, pole-height: 80, yoke-thickness: 150, leg-width: 100,
  window-width: 120, coil-width: 100, coil-height: 60, turns: 160, current: 100}
`
	open := Boundary{Shape: "circle", Margin: DefaultMargin, Condition: "open"}
	box := Boundary{Shape: "box", Margin: DefaultMargin, Condition: "zero-potential"}
	for _, c := range []struct {
		name, src string
		want      Boundary
	}{
		{"solenoid", sol, open},
		{"round-pole", rp, open},
		{"c-core", cCore, open},
		{"h-core", hc, open},
		{"solenoid, margin only", sol + "boundary: {margin: 2}\n", Boundary{Shape: "box", Margin: 2, Condition: "zero-potential"}},
		{"c-core, box", cCore + "boundary: {shape: box, margin: 1.0, condition: zero-potential}\n", box},
		{"c-core, open margin", cCore + "boundary: {shape: circle, margin: 0.5, condition: open}\n", Boundary{Shape: "circle", Margin: 0.5, Condition: "open"}},
		{"no template", "units: mm\ndepth: 1\nregions: [{name: a, material: air, polygon: [[0, 0], [1, 0], [0, 1]]}]\n", box},
	} {
		m := mustParse(t, c.name, c.src)
		got := m.Boundary
		got.Pos = Pos{}
		if got.Shape != c.want.Shape || got.Margin != c.want.Margin || got.Condition != c.want.Condition || got.Sides != nil {
			t.Errorf("%s: boundary %+v, want %+v", c.name, got, c.want)
		}
		if c.want.Condition == "open" && m.Boundary.Pos.Line == 0 {
			t.Errorf("%s: the boundary has no position for messages", c.name)
		}
	}
}
