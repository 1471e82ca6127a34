package models

import (
	"strings"
	"testing"
)

// Each kind of bad input has its own table; every expected message carries
// file:line:column, the field path and what to do.

func TestErrMissingField(t *testing.T) {
	runErrCases(t, []errCase{
		{"units", edit(t, "units: mm\n", ""), `m.yaml:1:1: missing required key "units"; add units: mm (or cm, m, in)`},
		{"depth", edit(t, "depth: 100\n", ""), `m.yaml:1:1: missing required key "depth"; a planar model needs depth: the magnet's length into the page, in the model's units`},
		{"material", edit(t, "    material: steel\n", ""), `m.yaml:7:5: regions[0]: missing required key "material"; add material: <name> (a material defined under materials, or air or copper)`},
		{"turns", edit(t, "    turns: 100\n", ""), `m.yaml:14:5: coils[0]: missing required key "turns"; add turns: <conductors in each side>`},
		{"sense", edit(t, ", sense: +1", ""), `m.yaml:17:13: coils[0].sides[0]: missing required key "sense"; add sense: +1 (current out of the page, or along +phi) or -1`},
		{"target field", edit(t, ", field: 0.5", ""), `m.yaml:20:9: target: missing required key "field"; add field: <flux density in tesla>`},
		{"empty file", "", `m.yaml: the file is empty; a model needs at least units and regions (or a template)`},
	})
}

func TestErrUnknownKey(t *testing.T) {
	runErrCases(t, []errCase{
		{"top", edit(t, "depth: 100", "depth: 100\nmehs: {size: 5}"), `m.yaml:4:1: mehs: unknown key "mehs" in the model; did you mean "mesh"?`},
		{"region", edit(t, "    material: steel", "    material: steel\n    meshsize: 3"), `m.yaml:9:5: regions[0].meshsize: unknown key "meshsize" in a region; did you mean "mesh-size"?`},
		{"side", edit(t, "sense: +1", "sens: +1"), `m.yaml:17:30: coils[0].sides[0].sens: unknown key "sens" in a coil side; did you mean "sense"?`},
		{"material", edit(t, "{mu-r: 1000}", "{mur: 1000}"), `m.yaml:5:11: materials.steel.mur: unknown key "mur" in a material; did you mean "mu-r"?`},
		{"far off", edit(t, "depth: 100", "depth: 100\ncolour: red"), `m.yaml:4:1: colour: unknown key "colour" in the model; known keys are name, description, geometry, units, depth, gap, template, dimensions, materials, regions, coils, boundary, mesh, probes, target or forces`},
		{"duplicate", edit(t, "depth: 100", "depth: 100\ndepth: 50"), `m.yaml:4:1: depth: duplicate key "depth" (first at line 3); keep one`},
	})
}

func TestErrUnit(t *testing.T) {
	runErrCases(t, []errCase{
		{"mil", edit(t, "units: mm", "units: mil"), `m.yaml:2:8: units: unknown unit "mil"; did you mean "mm"? (allowed: mm, cm, m or in)`},
		{"feet", edit(t, "units: mm", "units: feet"), `m.yaml:2:8: units: unknown unit "feet"; use mm, cm, m or in`},
		{"number", edit(t, "units: mm", "units: 1"), `m.yaml:2:8: units: unknown unit "1"; use mm, cm, m or in`},
	})
}

func TestErrWrongType(t *testing.T) {
	runErrCases(t, []errCase{
		{"depth text", edit(t, "depth: 100", "depth: deep"), `m.yaml:3:8: depth: expected a number, got "deep"`},
		{"quoted number", edit(t, "depth: 100", `depth: "100"`), `m.yaml:3:8: depth: expected a number, got "100"`},
		{"regions map", edit(t, "regions:\n", "regions: {}\nx:\n"), `m.yaml:6:10: regions: expected a list (regions), got a mapping`},
		{"point short", edit(t, "[100, 20], [0, 20]]", "[100, 20], [0]]"), `m.yaml:9:44: regions[0].polygon[3]: expected a point [x, y], got a list of 1 items`},
		{"turns list", edit(t, "turns: 100", "turns: [100]"), `m.yaml:15:12: coils[0].turns: expected a number, got a list`},
		{"nan", edit(t, "current: 2", "current: .nan"), `m.yaml:16:14: coils[0].current: must be a finite number, got .nan`},
		{"sense 2", edit(t, "sense: +1", "sense: 2"), `m.yaml:17:37: coils[0].sides[0].sense: sense must be +1 or -1, got 2`},
		{"top list", "- a\n- b\n", `m.yaml:1:1: expected a mapping (the model), got a list`},
		{"huge", edit(t, "depth: 100", "depth: 1e300"), `m.yaml:3:8: depth: 1e300 is out of range; numbers in a model must lie within ±1e15`},
	})
}

func TestErrBadEnum(t *testing.T) {
	runErrCases(t, []errCase{
		{"geometry", edit(t, "units: mm", "units: mm\ngeometry: axial"), `m.yaml:3:11: geometry: unknown geometry "axial"; use planar or axisymmetric`},
		{"boundary", base + "boundary: {condition: dirichlet}\n", `m.yaml:21:23: boundary.condition: unknown boundary condition "dirichlet"; use zero-potential, flux-normal or open`},
		{"open box", base + "boundary: {shape: box, condition: open}\n", `m.yaml:21:35: boundary.condition: an open boundary (Kelvin transformation) needs shape: circle`},
		{"order", base + "mesh: {order: 3}\n", `m.yaml:21:15: mesh.order: element order must be 1 or 2, got 3`},
		{"side", base + "boundary: {sides: {middle: flux-normal}}\n", `m.yaml:21:20: boundary.sides.middle: unknown key "middle" in box side -> condition; known keys are left, right, bottom or top`},
	})
}

func TestErrOpenPolygon(t *testing.T) {
	runErrCases(t, []errCase{
		{"two vertices", edit(t, "[[0, 0], [100, 0], [100, 20], [0, 20]]", "[[0, 0], [100, 0]]"),
			`m.yaml:7:5: regions[0].polygon: open or degenerate polygon: region "core" has 2 vertices, needs at least 3`},
		{"collinear", edit(t, "[[0, 0], [100, 0], [100, 20], [0, 20]]", "[[0, 0], [50, 0], [100, 0]]"),
			`m.yaml:7:5: regions[0].polygon: open or degenerate polygon: region "core" has zero area (are all vertices on one line?)`},
		{"closing repeat", edit(t, "[[0, 0], [100, 0], [100, 20], [0, 20]]", "[[0, 0], [100, 0], [100, 20], [0, 20], [0, 0]]"),
			`m.yaml:9:53: regions[0].polygon[4]: the last vertex repeats the first; polygons close by themselves, remove it`},
		{"duplicate", edit(t, "[[0, 0], [100, 0], [100, 20], [0, 20]]", "[[0, 0], [100, 0], [100, 0], [100, 20], [0, 20]]"),
			`m.yaml:9:33: regions[0].polygon[2]: vertex 2 repeats vertex 1 at (100, 0) mm; remove the duplicate`},
		{"full circle arc", edit(t, "[[0, 0], [100, 0], [100, 20], [0, 20]]", "[[0, 0], {at: [100, 0], arc: 360}, [100, 20]]"),
			`m.yaml:9:43: regions[0].polygon[1].arc: an arc must sweep less than 360 degrees, got 360; split a full circle into two arcs`},
	})
}

func TestErrSelfIntersecting(t *testing.T) {
	runErrCases(t, []errCase{
		{"bow tie", edit(t, "[[0, 0], [100, 0], [100, 20], [0, 20]]", "[[0, 0], [100, 20], [100, 0], [0, 20]]"),
			`m.yaml:9:15: regions[0].polygon[0]: self-intersecting polygon: edges from vertex 0 and vertex 2 of region "core" meet near (50, 10) mm; a region must be a simple polygon, split it into two regions`},
		{"touching vertex", edit(t, "[[0, 0], [100, 0], [100, 20], [0, 20]]", "[[0, 0], [100, 0], [100, 20], [50, 0], [0, 20]]"),
			`m.yaml:9:15: regions[0].polygon[0]: self-intersecting polygon: edges from vertex 0 and vertex 2 of region "core" meet near (50, 0) mm; a region must be a simple polygon, split it into two regions`},
		{"arc crosses edge", edit(t, "[[0, 0], [100, 0], [100, 20], [0, 20]]", "[[0, 0], [100, 0], {at: [100, 20], arc: -180}, [0, 20]]"),
			`m.yaml:9:15: regions[0].polygon[0]: self-intersecting polygon: edges from vertex 0 and vertex 2 of region "core" meet near (95.7838, 0) mm; a region must be a simple polygon, split it into two regions`},
	})
}

func TestErrOverlap(t *testing.T) {
	runErrCases(t, []errCase{
		{"crossing", edit(t, "[[0, 30], [40, 30], [40, 50], [0, 50]]", "[[10, 10], [40, 10], [40, 50], [10, 50]]"),
			`m.yaml:10:5: regions[1]: region "coil-a" overlaps region "core" near (40, 20) mm; regions may touch or share edges but not overlap (one inside another is an overlap too: cut a hole by splitting the outer region)`},
		{"inside", edit(t, "[[0, 30], [40, 30], [40, 50], [0, 50]]", "[[10, 5], [40, 5], [40, 15], [10, 15]]"),
			`m.yaml:10:5: regions[1]: region "coil-a" overlaps region "core" near (10, 5) mm; regions may touch or share edges but not overlap (one inside another is an overlap too: cut a hole by splitting the outer region)`},
		{"identical", edit(t, "[[0, 30], [40, 30], [40, 50], [0, 50]]", "[[0, 20], [0, 0], [100, 0], [100, 20]]"),
			`m.yaml:10:5: regions[1]: region "coil-a" overlaps region "core" near (50, 0.0001) mm; regions may touch or share edges but not overlap (one inside another is an overlap too: cut a hole by splitting the outer region)`},
		{"shared edge inside", edit(t, "[[0, 30], [40, 30], [40, 50], [0, 50]]", "[[0, 0], [40, 0], [40, 20], [0, 20]]"),
			`m.yaml:10:5: regions[1]: region "coil-a" overlaps region "core" near (0.0001, 10) mm; regions may touch or share edges but not overlap (one inside another is an overlap too: cut a hole by splitting the outer region)`},
		{"arc bulges in", edit(t, "[[0, 30], [40, 30], [40, 50], [0, 50]]", "[{at: [0, 30], arc: 120}, [40, 30], [40, 50], [0, 50]]"),
			`m.yaml:10:5: regions[1]: region "coil-a" overlaps region "core" near (11.729, 20) mm; regions may touch or share edges but not overlap (one inside another is an overlap too: cut a hole by splitting the outer region)`},
	})
}

func TestErrCoilSide(t *testing.T) {
	runErrCases(t, []errCase{
		{"missing region", edit(t, "{region: coil-a, sense: +1}", "{region: coil-b, sense: +1}"),
			`m.yaml:17:22: coils[0].sides[0].region: coil side names region "coil-b", which does not exist; add it under regions; did you mean "coil-a"?`},
		{"used twice", edit(t, "{region: coil-a, sense: +1}", "{region: coil-a, sense: +1}, {region: coil-a, sense: -1}"),
			`m.yaml:17:51: coils[0].sides[1].region: region "coil-a" is already a coil side (coils[0].sides[0].region, line 17); each region carries one coil side`},
		{"zero turns", edit(t, "turns: 100", "turns: 0"),
			`m.yaml:15:12: coils[0].turns: turns must be greater than zero, got 0`},
		{"no sides", edit(t, "sides: [{region: coil-a, sense: +1}]", "sides: []"),
			`m.yaml:17:12: coils[0].sides: a coil needs at least one side`},
	})
}

func TestErrNegativeSize(t *testing.T) {
	runErrCases(t, []errCase{
		{"depth", edit(t, "depth: 100", "depth: -100"), `m.yaml:3:8: depth: depth must be greater than zero, got -100`},
		{"mesh size", base + "mesh: {size: 0}\n", `m.yaml:21:14: mesh.size: mesh size must be greater than zero, got 0`},
		{"region mesh size", edit(t, "    material: steel", "    material: steel\n    mesh-size: -2"), `m.yaml:9:16: regions[0].mesh-size: mesh-size must be greater than zero, got -2`},
		{"refine size", base + "mesh: {refine: [{near: core, size: -1}]}\n", `m.yaml:21:36: mesh.refine[0].size: refine size must be greater than zero, got -1`},
		{"circle radius", edit(t, "p: {point: [50, 60]}", "p: {centre: [50, 60], radius: 0}"), `m.yaml:19:33: probes.p.radius: radius must be greater than zero, got 0`},
		{"stacking", edit(t, "{mu-r: 1000}", "{curve: low-carbon-steel, stacking: 1.2}"), `m.yaml:5:46: materials.steel.stacking: stacking is the steel fraction of a laminated stack and must lie in (0, 1], got 1.2`},
	})
}

func TestErrReferences(t *testing.T) {
	runErrCases(t, []errCase{
		{"target probe", edit(t, "{probe: p, field", "{probe: q, field"), `m.yaml:20:17: target.probe: target probe "q" is not defined; add it under probes`},
		{"refine near", base + "mesh: {refine: [{near: cor, size: 1}]}\n", `m.yaml:21:24: mesh.refine[0].near: refine near "cor" names no region or probe; did you mean "core"?`},
		{"material", edit(t, "    material: steel", "    material: steal"), `m.yaml:8:15: regions[0].material: material "steal" is not defined; define it under materials (air and copper are built in); did you mean "steel"?`},
		{"air defined", edit(t, "steel: {mu-r: 1000}", "steel: {mu-r: 1000}\n  air: {mu-r: 1}"), `m.yaml:6:3: materials.air: "air" is built in (relative permeability 1); use it without defining it`},
		{"table file", edit(t, "{mu-r: 1000}", "{table-file: no/such.csv}"), `m.yaml:5:23: materials.steel.table-file: cannot read B-H table file no/such.csv; paths are relative to the model file`},
		{"probe name", edit(t, "  p: {point: [50, 60]}", "  p: {point: [50, 60]}\n  \"\": {point: [0, 0]}"), `m.yaml:20:3: probes.: a probe needs a name`},
		{"two kinds", edit(t, "{mu-r: 1000}", "{mu-r: 1000, curve: x}"), `m.yaml:5:10: materials.steel: a material needs exactly one of curve, table, table-file, mu-r or remanence (got curve and mu-r)`},
	})
}

func TestErrAxisymmetric(t *testing.T) {
	ax := edit(t, "depth: 100\n", "geometry: axisymmetric\n")
	runErrCases(t, []errCase{
		{"r < 0", ax[:0] + replace(t, ax, "[[0, 0], [100, 0], [100, 20], [0, 20]]", "[[-5, 0], [100, 0], [100, 20], [-5, 20]]"), `m.yaml:9:15: regions[0].polygon[0]: region "core" reaches r = -5; an axisymmetric model lies in r = x >= 0 (the axis is x = 0)`},
		{"arc past axis", replace(t, ax, "[[0, 0], [100, 0], [100, 20], [0, 20]]", "[[0, 0], [100, 0], [100, 20], {at: [0, 20], arc: 90}]"), `m.yaml:9:44: regions[0].polygon[3]: region "core" reaches r = -4.14214; an axisymmetric model lies in r = x >= 0 (the axis is x = 0)`},
		{"depth given", edit(t, "depth: 100\n", "geometry: axisymmetric\ndepth: 100\n"), `m.yaml:4:1: depth: depth has no meaning in an axisymmetric model; remove it`},
		{"left side", replace(t, ax, "target:", "boundary: {sides: {left: flux-normal}}\ntarget:"), `m.yaml:20:20: boundary.sides.left: in an axisymmetric model the left side is the axis r = 0; remove it`},
	})
}

func TestErrTemplate(t *testing.T) {
	const cc = `units: mm
depth: 100
template: c-core
dimensions: {gap: 40, pole-width: 200, pole-height: 80, arm-thickness: 180, leg-width: 180,
  window-width: 120, coil-width: 100, coil-height: 160, turns: 320, current: 100}
`
	mustParse(t, "c-core", cc)
	runErrCases(t, []errCase{
		{"zero gap", replace(t, cc, "gap: 40", "gap: 0"), `m.yaml:4:14: dimensions.gap: gap is 0: the pole faces must stand apart, so gap must be greater than zero`},
		{"negative gap", replace(t, cc, "gap: 40", "gap: -4"), `m.yaml:4:14: dimensions.gap: gap is -4: the pole faces must stand apart, so gap must be greater than zero`},
		{"face wider than pole", replace(t, cc, "gap: 40", "gap: 40, pole-face-width: 220"), `m.yaml:4:23: dimensions.pole-face-width: pole-face-width (220) must not exceed pole-width (200)`},
		{"coil too wide", replace(t, cc, "coil-width: 100", "coil-width: 115"), `m.yaml:5:22: dimensions.coil-width: the coil side in the window needs coil-width + 2·clearance = 138, but window-width is 120`},
		{"coil too tall", replace(t, cc, "coil-height: 160", "coil-height: 200"), `m.yaml:5:39: dimensions.coil-height: coil-height + 2·clearance = 220 exceeds the back leg between the arms (gap + 2·pole-height = 200)`},
		{"missing dimension", replace(t, cc, "leg-width: 180,", ""), `m.yaml:4:13: dimensions: template c-core needs dimension "leg-width"; add leg-width: <length in the model's units>`},
		{"unknown dimension", replace(t, cc, "gap: 40", "gap: 40, gpa: 3"), `m.yaml:4:23: dimensions.gpa: unknown key "gpa" in the c-core dimensions; did you mean "gap"?`},
		{"placement", replace(t, cc, "gap: 40", "gap: 40, coil: arms"), `m.yaml:4:29: dimensions.coil: unknown coil placement "arms"; use back-leg or poles`},
		{"chamfer", replace(t, cc, "gap: 40", "gap: 40, chamfer: 100"), `m.yaml:4:23: dimensions.chamfer: two chamfers (2 × 100) must be narrower than the pole face (200)`},
		{"unknown template", replace(t, cc, "c-core", "e-core"), `m.yaml:3:11: template: unknown template "e-core"; did you mean "c-core"? (allowed: c-core, h-core, round-pole or solenoid)`},
		{"solenoid planar", replace(t, cc, "template: c-core", "geometry: planar\ntemplate: solenoid"), `m.yaml:4:11: template: template solenoid is axisymmetric; set geometry: axisymmetric`},
		{"dimensions alone", replace(t, cc, "template: c-core\n", ""), `m.yaml:3:1: dimensions: dimensions need a template; add template: c-core (or solenoid) or remove dimensions`},
	})
}

func TestErrMalformedYAML(t *testing.T) {
	runErrCases(t, []errCase{
		{"bad indent", "units: mm\ndepth: 100\n  regions: x\n", `m.yaml:3:3: malformed YAML: mapping values are not allowed in this context; check this line's indentation against the line above (a key indented under a value), or quote a value that contains ": "`},
		{"unclosed flow", "units: mm\nregions: [[0, 0], [1, 0]\n", `m.yaml:1:1: malformed YAML: did not find expected ',' or ']'; a [ ... ] or { ... } that starts here is not closed, or its items lack commas`},
		{"tab", "units: mm\n\tdepth: 1\n", `m.yaml:2:2: malformed YAML: found a tab character that violates indentation; indent with spaces, not tabs`},
	})
}

// replace is edit on any text.
func replace(t *testing.T, s, old, new string) string {
	t.Helper()
	if n := countOf(s, old); n != 1 {
		t.Fatalf("replace: %q occurs %d times", old, n)
	}
	return replaceOnce(s, old, new)
}

// Per-side margins and an explicit boundary box (REFERENCE.md, boundary).
func TestErrBoundaryBox(t *testing.T) {
	ax := replace(t, edit(t, "depth: 100\n", "geometry: axisymmetric\n"), "target:", "boundary: BND\ntarget:")
	axi := func(b string) string { return strings.Replace(ax, "BND", b, 1) }
	runErrCases(t, []errCase{
		{"margins circle", base + "boundary: {shape: circle, margins: {left: 2}}\n", `m.yaml:21:27: boundary.margins: margins applies to a box boundary only; remove it or use shape: box`},
		{"margins side", base + "boundary: {margins: {middle: 2}}\n", `m.yaml:21:22: boundary.margins.middle: unknown key "middle" in box side -> margin; known keys are left, right, bottom or top`},
		{"margins zero", base + "boundary: {margins: {top: 0}}\n", `m.yaml:21:27: boundary.margins.top: a side's margin (a multiple of the model's largest dimension) must be greater than zero, got 0`},
		{"margins text", base + "boundary: {margins: {top: wide}}\n", `m.yaml:21:27: boundary.margins.top: expected a number, got "wide"`},
		{"margins list", base + "boundary: {margins: [1, 2]}\n", `m.yaml:21:21: boundary.margins: expected a mapping (box side -> margin), got a list`},
		{"margins and sides", base + "boundary: {sides: {bottom: flux-normal}, margins: {bottom: 1}}\n", `m.yaml:21:52: boundary.margins.bottom: the bottom side is a symmetry side (boundary.sides.bottom) lying on the model's extent, without margin; remove one of the two`},
		{"margins axis", axi("{margins: {left: 1}}"), `m.yaml:20:22: boundary.margins.left: in an axisymmetric model the left side is the axis r = 0 and has no margin; remove it`},
		{"box circle", base + "boundary: {shape: circle, box: [[-10, -10], [110, 60]]}\n", `m.yaml:21:27: boundary.box: box applies to a box boundary only; remove it or use shape: box`},
		{"box and margin", base + "boundary: {margin: 2, box: [[-10, -10], [110, 60]]}\n", `m.yaml:21:12: boundary.margin: boundary.box places all four sides; remove margin (or remove box)`},
		{"box and margins", base + "boundary: {margins: {top: 2}, box: [[-10, -10], [110, 60]]}\n", `m.yaml:21:12: boundary.margins: boundary.box places all four sides; remove margins (or remove box)`},
		{"box order", base + "boundary: {box: [[110, 60], [-10, -10]]}\n", `m.yaml:21:17: boundary.box: a box is [[x0, y0], [x1, y1]] with its lower-left corner first (x0 < x1, y0 < y1), got (110, 60) mm to (-10, -10) mm`},
		{"box flat", base + "boundary: {box: [[-10, 60], [110, 60]]}\n", `m.yaml:21:17: boundary.box: a box is [[x0, y0], [x1, y1]] with its lower-left corner first (x0 < x1, y0 < y1), got (-10, 60) mm to (110, 60) mm`},
		{"box shape", base + "boundary: {box: [-10, -10, 110, 60]}\n", `m.yaml:21:17: boundary.box: expected two points [[x0, y0], [x1, y1]], got a list of 4 items`},
		{"box small", base + "boundary: {box: [[-10, -10], [90, 60]]}\n", `m.yaml:21:17: boundary.box: region "core" reaches from (0, 0) mm to (100, 20) mm, outside the boundary box (-10, -10) mm to (90, 60) mm; enlarge the box (or use margin)`},
		{"box open", base + "boundary: {box: [[-10, -10], [110, 60]], condition: open}\n", `m.yaml:21:53: boundary.condition: an open boundary (Kelvin transformation) needs shape: circle`},
		{"box axis", axi("{box: [[-10, -10], [110, 60]]}"), `m.yaml:20:18: boundary.box[0]: in an axisymmetric model the box starts at the axis: x0 must be 0, got -10 mm`},
	})
}
