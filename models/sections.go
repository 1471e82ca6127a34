package models

import (
	"math"
	"strings"

	"go.yaml.in/yaml/v3"
)

var probeKeys = []string{"point", "line", "box", "centre", "radius", "samples"}

// Default sample counts of line and circle probes.
const (
	defaultLineSamples   = 101
	defaultCircleSamples = 180
)

// probes decodes the probes mapping: name -> {point | line | box | centre and radius}.
func (d *decoder) probes(m *Model, n *yaml.Node) {
	f, _ := d.mapping(n, "probes", nil, "probe name -> definition")
	if f == nil {
		return
	}
	for _, name := range f.keys {
		path := f.sub(name)
		if strings.TrimSpace(name) == "" {
			d.fail(f.key[name], path, "a probe needs a name")
			continue
		}
		pf, _ := d.mapping(f.val[name], path, probeKeys, "a probe")
		if pf == nil {
			continue
		}
		p := Probe{Name: name, Pos: pos(f.key[name], path)}
		var kinds []string
		for _, k := range []string{"point", "line", "box", "centre"} {
			if pf.get(k) != nil {
				kinds = append(kinds, k)
			}
		}
		if len(kinds) != 1 {
			d.fail(pf.node, path, "a probe needs exactly one of point: [x, y], line: [[x0, y0], [x1, y1]], box: [[x0, y0], [x1, y1]] or centre: [x, y] with radius")
			continue
		}
		good := true
		switch kinds[0] {
		case "point":
			p.Kind = ProbePoint
			p.Point, good = d.point(pf.get("point"), pf.sub("point"))
		case "line":
			p.Kind, p.Samples = ProbeLine, defaultLineSamples
			p.Line, good = d.segment(pf.get("line"), pf.sub("line"))
			if good && p.Line[0] == p.Line[1] {
				d.fail(pf.get("line"), pf.sub("line"), "a line probe needs two different end points")
				good = false
			}
		case "box":
			p.Kind = ProbeBox
			var b [2][2]float64
			if b, good = d.segment(pf.get("box"), pf.sub("box")); good {
				p.Box = [2][2]float64{
					{math.Min(b[0][0], b[1][0]), math.Min(b[0][1], b[1][1])},
					{math.Max(b[0][0], b[1][0]), math.Max(b[0][1], b[1][1])}}
				if p.Box[0][0] == p.Box[1][0] || p.Box[0][1] == p.Box[1][1] {
					d.fail(pf.get("box"), pf.sub("box"), "a box probe needs opposite corners with different x and different y")
					good = false
				}
			}
		case "centre":
			p.Kind, p.Samples = ProbeCircle, defaultCircleSamples
			p.Centre, good = d.point(pf.get("centre"), pf.sub("centre"))
			if v := d.need(pf, "radius", "a circle probe needs radius: <length>"); v != nil {
				var ok bool
				p.Radius, ok = d.length(v, pf.sub("radius"), "radius")
				good = good && ok
			} else {
				good = false
			}
		}
		if pf.get("radius") != nil && p.Kind != ProbeCircle {
			d.fail(pf.key["radius"], pf.sub("radius"), "radius belongs to a circle probe (centre); remove it")
		}
		if v := pf.get("samples"); v != nil {
			if p.Kind != ProbeLine && p.Kind != ProbeCircle {
				d.fail(pf.key["samples"], pf.sub("samples"), "samples applies to line and circle probes only; remove it")
			} else if k, ok := d.integer(v, pf.sub("samples")); ok {
				if k < 2 || k > 1000000 {
					d.fail(v, pf.sub("samples"), "samples must lie between 2 and 1000000, got %d", k)
				} else {
					p.Samples = k
				}
			}
		}
		_ = good // a bad probe keeps its name, so a target naming it is not also wrong
		if old, ok := m.Probe(name); ok && d.generated["probe:"+name] {
			delete(d.generated, "probe:"+name)
			*old = p
			continue
		}
		m.Probes = append(m.Probes, p)
	}
}

// Boundary shapes, conditions and box sides.
var (
	boundaryShapes     = []string{"box", "circle"}
	boundaryConditions = []string{"zero-potential", "flux-normal", "open"}
	sideConditions     = []string{"zero-potential", "flux-normal"}
	boxSides           = []string{"left", "right", "bottom", "top"}
)

// boundary decodes the boundary mapping. It replaces a template's
// boundary as a whole: keys it leaves out take the plain defaults.
func (d *decoder) boundary(m *Model, n *yaml.Node) {
	f, _ := d.mapping(n, "boundary", []string{"shape", "margin", "margins", "box", "condition", "sides"}, "the boundary")
	if f == nil {
		return
	}
	m.Boundary = Boundary{}
	b := &m.Boundary
	b.Pos = pos(f.node, "boundary")
	if v := f.get("shape"); v != nil {
		b.Shape, _ = d.enum(v, f.sub("shape"), "boundary shape", boundaryShapes)
	}
	if v := f.get("margin"); v != nil {
		b.Margin, _ = d.positive(v, f.sub("margin"), "margin (a multiple of the model's largest dimension)")
	}
	if v := f.get("condition"); v != nil {
		b.Condition, _ = d.enum(v, f.sub("condition"), "boundary condition", boundaryConditions)
		if b.Condition == "open" && b.Shape != "circle" {
			d.fail(v, f.sub("condition"), "an open boundary (Kelvin transformation) needs shape: circle")
		}
	}
	if v := f.get("sides"); v != nil {
		if b.Shape == "circle" {
			d.fail(f.key["sides"], f.sub("sides"), "sides applies to a box boundary only; remove it or use shape: box")
		} else if sf, _ := d.mapping(v, f.sub("sides"), boxSides, "box side -> condition"); sf != nil {
			b.Sides = map[string]string{}
			for _, k := range sf.keys {
				if k == "left" && m.Geometry == Axisymmetric {
					d.fail(sf.key[k], sf.sub(k), "in an axisymmetric model the left side is the axis r = 0; remove it")
					continue
				}
				if c, ok := d.enum(sf.val[k], sf.sub(k), "side condition", sideConditions); ok {
					b.Sides[k] = c
				}
			}
		}
	}
	if v := f.get("margins"); v != nil {
		d.margins(m, f, v)
	}
	if v := f.get("box"); v != nil {
		d.boundaryBox(m, f, v)
	}
}

// margins decodes boundary.margins: box side -> margin, each a multiple of
// the model's largest dimension like margin, which the sides not listed
// keep.
func (d *decoder) margins(m *Model, f *fields, v *yaml.Node) {
	b := &m.Boundary
	if b.Shape == "circle" {
		d.fail(f.key["margins"], f.sub("margins"), "margins applies to a box boundary only; remove it or use shape: box")
		return
	}
	mf, _ := d.mapping(v, f.sub("margins"), boxSides, "box side -> margin")
	if mf == nil {
		return
	}
	b.Margins = map[string]float64{}
	for _, k := range mf.keys {
		switch {
		case k == "left" && m.Geometry == Axisymmetric:
			d.fail(mf.key[k], mf.sub(k), "in an axisymmetric model the left side is the axis r = 0 and has no margin; remove it")
			continue
		case b.Sides[k] != "":
			d.fail(mf.key[k], mf.sub(k), "the %s side is a symmetry side (boundary.sides.%s) lying on the model's extent, without margin; remove one of the two", k, k)
			continue
		}
		if x, ok := d.positive(mf.val[k], mf.sub(k), "a side's margin (a multiple of the model's largest dimension)"); ok {
			b.Margins[k] = x
		}
	}
}

// boundaryBox decodes boundary.box: the box's corners in file units, in
// place of margins. That the regions lie inside it is checked in validate.
func (d *decoder) boundaryBox(m *Model, f *fields, v *yaml.Node) {
	b := &m.Boundary
	path := f.sub("box")
	if b.Shape == "circle" {
		d.fail(f.key["box"], path, "box applies to a box boundary only; remove it or use shape: box")
		return
	}
	for _, k := range []string{"margin", "margins"} {
		if f.get(k) != nil {
			d.fail(f.key[k], f.sub(k), "boundary.box places all four sides; remove %s (or remove box)", k)
			return
		}
	}
	c, ok := d.segment(v, path)
	if !ok {
		return
	}
	if !(c[0][0] < c[1][0] && c[0][1] < c[1][1]) {
		d.fail(v, path, "a box is [[x0, y0], [x1, y1]] with its lower-left corner first (x0 < x1, y0 < y1), got %s to %s",
			d.fmtPoint(c[0][0], c[0][1]), d.fmtPoint(c[1][0], c[1][1]))
		return
	}
	if m.Geometry == Axisymmetric && c[0][0] != 0 {
		d.fail(resolve(v).Content[0], index(path, 0), "in an axisymmetric model the box starts at the axis: x0 must be 0, got %s %s", d.fmtLen(c[0][0]), d.units)
		return
	}
	b.Box = &c
	b.boxPos = pos(resolve(v), path)
}

var meshKeys = []string{"size", "order", "min-angle", "grading", "chord", "accuracy", "refine", "min-feature"}

// mesh decodes the mesh controls. A refine list replaces the template's.
func (d *decoder) mesh(m *Model, n *yaml.Node) {
	f, _ := d.mapping(n, "mesh", meshKeys, "the mesh controls")
	if f == nil {
		return
	}
	mc := &m.Mesh
	mc.Pos = pos(f.node, "mesh")
	if v := f.get("size"); v != nil {
		mc.Size, _ = d.length(v, f.sub("size"), "mesh size")
	}
	if v := f.get("order"); v != nil {
		if k, ok := d.integer(v, f.sub("order")); ok {
			if k != 1 && k != 2 {
				d.fail(v, f.sub("order"), "element order must be 1 or 2, got %d", k)
			} else {
				mc.Order = k
			}
		}
	}
	if v := f.get("min-angle"); v != nil {
		if a, ok := d.positive(v, f.sub("min-angle"), "min-angle"); ok {
			if a > maxMinAngle {
				d.fail(v, f.sub("min-angle"), "min-angle above %g degrees may keep refinement from finishing; use 20 to 33", float64(maxMinAngle))
			} else {
				mc.MinAngle = a * math.Pi / 180
			}
		}
	}
	if v := f.get("grading"); v != nil {
		if g, ok := d.positive(v, f.sub("grading"), "grading"); ok {
			if g > 1 {
				d.fail(v, f.sub("grading"), "grading is the allowed growth of element size per element and must lie in (0, 1], got %s", v.Value)
			} else {
				mc.Grading = g
			}
		}
	}
	if v := f.get("chord"); v != nil {
		mc.Chord, _ = d.length(v, f.sub("chord"), "chord")
	}
	if v := f.get("min-feature"); v != nil {
		mc.MinFeature, _ = d.length(v, f.sub("min-feature"), "min-feature")
	}
	if v := f.get("accuracy"); v != nil {
		if a, ok := d.positive(v, f.sub("accuracy"), "accuracy"); ok {
			if a >= 0.1 {
				d.fail(v, f.sub("accuracy"), "accuracy is the relative error allowed in each reported quantity, such as 1e-3; give a value below 0.1, got %s", v.Value)
			} else {
				mc.Accuracy = a
			}
		}
	}
	if v := f.get("refine"); v != nil {
		d.refineKey = true
		mc.Refine = nil
		items, ok := d.list(v, f.sub("refine"), "refinements")
		if !ok {
			return
		}
		for i, it := range items {
			path := index(f.sub("refine"), i)
			rf, _ := d.mapping(it, path, []string{"near", "point", "line", "size"}, "a refinement")
			if rf == nil {
				continue
			}
			r := Refine{Pos: pos(it, path)}
			cnt := 0
			for _, k := range []string{"near", "point", "line"} {
				if rf.get(k) != nil {
					cnt++
				}
			}
			if cnt != 1 {
				d.fail(it, path, "a refinement needs exactly one of near: <region or probe>, point: [x, y] or line: [[x0, y0], [x1, y1]]")
				continue
			}
			good := true
			if v := rf.get("near"); v != nil {
				r.Near, good = d.str(v, rf.sub("near"), "a region or probe name")
				r.nearPos = pos(v, rf.sub("near"))
			}
			if v := rf.get("point"); v != nil {
				var p [2]float64
				if p, good = d.point(v, rf.sub("point")); good {
					r.Point = &p
				}
			}
			if v := rf.get("line"); v != nil {
				var l [2][2]float64
				if l, good = d.segment(v, rf.sub("line")); good {
					r.Line = &l
				}
			}
			if v := d.need(rf, "size", "add size: <largest element size there>"); v != nil {
				var ok bool
				r.Size, ok = d.length(v, rf.sub("size"), "refine size")
				good = good && ok
			} else {
				good = false
			}
			if good {
				mc.Refine = append(mc.Refine, r)
			}
		}
	}
}

// maxMinAngle is the largest min-angle accepted, in degrees. Delaunay
// refinement is proven to terminate up to about 20.7° (Ruppert 1995) and in
// practice does up to about 33.8° (Shewchuk 2002, "Delaunay refinement
// algorithms for triangular mesh generation", Comput. Geom. 22).
const maxMinAngle = 34

// target decodes the target mapping. It replaces a template's target.
func (d *decoder) target(m *Model, n *yaml.Node) {
	f, _ := d.mapping(n, "target", []string{"probe", "field"}, "the target")
	if f == nil {
		return
	}
	t := &Target{Pos: pos(f.node, "target")}
	good := true
	if v := d.need(f, "probe", "add probe: <name of a probe under probes>"); v != nil {
		t.Probe, good = d.str(v, f.sub("probe"), "a probe name")
		d.targetProbe = pos(v, f.sub("probe"))
	} else {
		good = false
	}
	if v := d.need(f, "field", "add field: <flux density in tesla>"); v != nil {
		var ok bool
		t.Field, ok = d.positive(v, f.sub("field"), "target field (T)")
		good = good && ok
	} else {
		good = false
	}
	if good {
		m.Target = t
	}
}
