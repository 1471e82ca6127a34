package models

import (
	"fmt"
	"math"
	"sort"

	"go.yaml.in/yaml/v3"
)

// expansion is what a template contributes before the user's own entries.
type expansion struct {
	name      string
	gap       float64 // m, the template's air gap
	shim      Shim    // the pole-edge shim (c-core, h-core)
	regions   []Region
	coils     []Coil
	probes    []Probe
	refine    []Refine
	target    *Target
	materials []Material
	boundary  Boundary // the template's default boundary; a boundary mapping in the file replaces it
}

// templateInfo describes one template: its geometry and its dimension keys.
type templateInfo struct {
	geometry Geometry
	keys     []string // every key its dimensions mapping accepts
	expand   func(m *Model, t *dims, x *expansion)
}

var templates = map[string]templateInfo{
	"c-core":     {Planar, cCoreKeys, expandCCore},
	"h-core":     {Planar, hCoreKeys, expandHCore},
	"round-pole": {Axisymmetric, roundPoleKeys, expandRoundPole},
	"solenoid":   {Axisymmetric, solenoidKeys, expandSolenoid},
}

func templateNames() []string {
	var s []string
	for k := range templates {
		s = append(s, k)
	}
	sort.Strings(s)
	return s
}

// dims reads a template's dimensions mapping.
type dims struct {
	d    *decoder
	f    *fields
	at   Pos // where generated things point: the template key
	name string
	ok   bool // false once any dimension is bad
}

// length reads a length key in file units and returns metres. A missing key
// gives def, or an error when required. zero allows the value 0.
func (t *dims) length(key string, def float64, required, zero bool) float64 {
	v := t.f.get(key)
	if v == nil {
		if required {
			t.d.fail(t.f.node, t.f.path, "template %s needs dimension %q; add %s: <length in the model's units>", t.name, key, key)
			t.ok = false
		}
		return def
	}
	x, ok := t.d.number(v, t.f.sub(key))
	if !ok {
		t.ok = false
		return def
	}
	if x < 0 || (x == 0 && !zero) {
		what := "greater than zero"
		if zero {
			what = "zero or more"
		}
		t.d.fail(v, t.f.sub(key), "%s must be %s, got %s", key, what, v.Value)
		t.ok = false
		return def
	}
	return t.d.m(x)
}

// number reads a plain number key (turns, current, field).
func (t *dims) number(key string, required, positive bool, hint string) float64 {
	v := t.f.get(key)
	if v == nil {
		if required {
			t.d.fail(t.f.node, t.f.path, "template %s needs %q; add %s: %s", t.name, key, key, hint)
			t.ok = false
		}
		return 0
	}
	var x float64
	var ok bool
	if positive {
		x, ok = t.d.positive(v, t.f.sub(key), key)
	} else {
		x, ok = t.d.number(v, t.f.sub(key))
	}
	t.ok = t.ok && ok
	return x
}

// misfit reports dimensions that do not fit together, at key.
func (t *dims) misfit(key, format string, args ...any) {
	n := t.f.node
	p := t.f.path
	if v := t.f.key[key]; v != nil {
		n, p = v, t.f.sub(key)
	}
	t.d.fail(n, p, format, args...)
	t.ok = false
}

// template decodes template + dimensions and expands them.
func (d *decoder) template(m *Model, n, dimsNode, key *yaml.Node) *expansion {
	name, ok := d.enum(n, "template", "template", templateNames())
	if !ok {
		return nil
	}
	info := templates[name]
	if m.Geometry != info.geometry {
		d.fail(n, "template", "template %s is %s; set geometry: %s", name, info.geometry, info.geometry)
		return nil
	}
	if dimsNode == nil {
		d.fail(key, "template", "template %s needs dimensions: a mapping of its named sizes (see REFERENCE.md)", name)
		return nil
	}
	f, good := d.mapping(dimsNode, "dimensions", info.keys, "the "+name+" dimensions")
	if f == nil {
		return nil
	}
	t := &dims{d: d, f: f, at: pos(resolve(n), "template"), name: name, ok: good}
	x := &expansion{name: name}
	info.expand(m, t, x)
	if !t.ok {
		return nil
	}
	// Every template is a magnet in open air: the default boundary is the
	// open one (Kelvin transformation) on a circle at the default margin.
	x.boundary = Boundary{Shape: "circle", Condition: "open", Pos: t.at}
	x.boundary.Pos.Path = fmt.Sprintf("template (%s boundary)", name)
	if d.generated == nil {
		d.generated = map[string]bool{}
	}
	for _, r := range x.regions {
		d.generated["region:"+r.Name] = true
	}
	for _, c := range x.coils {
		d.generated["coil:"+c.Name] = true
	}
	for _, p := range x.probes {
		d.generated["probe:"+p.Name] = true
	}
	return x
}

// steel reads the template's iron material and defines it when it names
// the default, undefined "yoke-steel".
func (t *dims) steel(m *Model, x *expansion) string {
	name := defaultSteel
	if v := t.f.get("steel"); v != nil {
		s, ok := t.d.str(v, t.f.sub("steel"), "a material name")
		if !ok {
			t.ok = false
			return name
		}
		name = s
	}
	if _, ok := m.Material(name); !ok && name == defaultSteel {
		x.materials = append(x.materials, Material{Name: name, Curve: defaultSteelCurve, Stacking: 1, Pos: t.at})
	}
	return name
}

// The iron of a template when dimensions give no steel.
const (
	defaultSteel      = "yoke-steel"
	defaultSteelCurve = "low-carbon-steel"
)

// rect returns a counter-clockwise rectangle region.
func (t *dims) rect(name, material string, x0, y0, x1, y1 float64) Region {
	return t.poly(name, material, []float64{x0, x1, x1, x0}, []float64{y0, y0, y1, y1})
}

// poly returns a region at the template's position.
func (t *dims) poly(name, material string, xs, ys []float64) Region {
	r := Region{Name: name, Material: material, X: xs, Y: ys, Pos: t.at}
	r.Pos.Path = fmt.Sprintf("template (%s region %s)", t.name, name)
	r.vertexPos = make([]Pos, len(xs))
	for i := range r.vertexPos {
		r.vertexPos[i] = r.Pos
	}
	return r
}

// mirrorY returns r reflected in y = 0 (kept counter-clockwise).
func mirrorY(r Region, name string) Region {
	n := len(r.X)
	out := r
	out.Name = name
	out.X, out.Y = make([]float64, n), make([]float64, n)
	out.vertexPos = append([]Pos(nil), r.vertexPos...)
	for i := 0; i < n; i++ {
		out.X[n-1-i], out.Y[n-1-i] = r.X[i], -r.Y[i]
	}
	return out
}

// dropDuplicates removes consecutive repeated vertices (from zero chamfers).
func dropDuplicates(xs, ys []float64) ([]float64, []float64) {
	var ox, oy []float64
	for i := range xs {
		if k := len(ox); k > 0 && ox[k-1] == xs[i] && oy[k-1] == ys[i] {
			continue
		}
		ox, oy = append(ox, xs[i]), append(oy, ys[i])
	}
	if k := len(ox); k > 1 && ox[k-1] == ox[0] && oy[k-1] == oy[0] {
		ox, oy = ox[:k-1], oy[:k-1]
	}
	return ox, oy
}

func (t *dims) point(name string, x, y float64) Probe {
	return Probe{Name: name, Kind: ProbePoint, Point: [2]float64{x, y}, Pos: t.at}
}

func (t *dims) line(name string, x0, y0, x1, y1 float64) Probe {
	return Probe{Name: name, Kind: ProbeLine, Line: [2][2]float64{{x0, y0}, {x1, y1}}, Samples: defaultLineSamples, Pos: t.at}
}

func (t *dims) box(name string, x0, y0, x1, y1 float64) Probe {
	return Probe{Name: name, Kind: ProbeBox, Box: [2][2]float64{{math.Min(x0, x1), math.Min(y0, y1)}, {math.Max(x0, x1), math.Max(y0, y1)}}, Pos: t.at}
}

func (t *dims) refinePoint(x, y, size float64) Refine {
	p := [2]float64{x, y}
	return Refine{Point: &p, Size: size, Pos: t.at}
}

// target sets the template's target when dimensions give field.
func (t *dims) target(x *expansion, probe string) {
	if f := t.number("field", false, true, ""); f > 0 {
		x.target = &Target{Probe: probe, Field: f, Pos: t.at}
	}
}
