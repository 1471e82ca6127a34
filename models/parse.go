package models

import (
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"

	"go.yaml.in/yaml/v3"
)

// Units a model file may use, and metres per unit.
var (
	unitNames = []string{"mm", "cm", "m", "in"}
	unitScale = map[string]float64{"mm": 1e-3, "cm": 1e-2, "m": 1, "in": 0.0254}
)

var topKeys = []string{"name", "description", "geometry", "units", "depth", "gap", "template", "dimensions",
	"materials", "regions", "coils", "boundary", "mesh", "probes", "target", "forces"}

// Load reads and parses the model file at path.
func Load(path string) (*Model, error) {
	data, err := os.ReadFile(path)
	if err != nil {
		return nil, err
	}
	return Parse(path, data)
}

// Parse decodes and validates a model file. filename is used in error
// messages and to resolve table-file paths. On any mistake it returns a nil
// model and an ErrorList sorted by position; it never panics.
func Parse(filename string, data []byte) (*Model, error) {
	d := &decoder{file: filename, scale: 1, units: "m"}
	m := d.parse(data)
	if len(d.errs) > 0 {
		d.errs.Sort()
		return nil, d.errs
	}
	return m, nil
}

var yamlLine = regexp.MustCompile(`line (\d+)`)

func (d *decoder) parse(data []byte) *Model {
	var root yaml.Node
	if err := yaml.Unmarshal(data, &root); err != nil {
		msg := strings.TrimPrefix(err.Error(), "yaml: ")
		e := &Error{File: d.file, Msg: "malformed YAML: " + msg}
		if sm := yamlLine.FindStringSubmatch(msg); sm != nil {
			e.Line, _ = strconv.Atoi(sm[1])
			e.Msg = "malformed YAML: " + strings.TrimSpace(strings.Replace(msg, sm[0]+":", "", 1))
			e.Column = firstColumn(data, e.Line)
		}
		e.Msg += "; " + yamlHint(msg)
		d.errs = append(d.errs, e)
		return nil
	}
	return d.parseRoot(&root)
}

// parseRoot decodes the document node of a model file.
func (d *decoder) parseRoot(root *yaml.Node) *Model {
	if len(root.Content) == 0 {
		d.fail(nil, "", "the file is empty; a model needs at least units and regions (or a template)")
		return nil
	}
	top, ok := d.mapping(root.Content[0], "", topKeys, "the model")
	if top == nil {
		return nil
	}
	_ = ok
	m := &Model{File: d.file}

	// Units first: every length depends on them.
	if n := d.need(top, "units", "add units: mm (or cm, m, in)"); n != nil {
		if u, ok := d.enum(n, "units", "unit", unitNames); ok {
			d.units, d.scale = u, unitScale[u]
		}
	}
	m.Units, m.Scale = d.units, d.scale

	m.Name = strings.TrimSuffix(filepath.Base(d.file), filepath.Ext(d.file))
	if n := top.get("name"); n != nil {
		if s, ok := d.str(n, "name", "a model name"); ok {
			m.Name = s
		}
	}
	if n := top.get("description"); n != nil {
		d.str(n, "description", "text")
	}
	if n := top.get("geometry"); n != nil {
		if g, ok := d.enum(n, "geometry", "geometry", []string{"planar", "axisymmetric"}); ok && g == "axisymmetric" {
			m.Geometry = Axisymmetric
		}
	} else if n := resolve(top.get("template")); n != nil && n.Kind == yaml.ScalarNode {
		if info, ok := templates[n.Value]; ok {
			m.Geometry = info.geometry // a template implies its geometry
		}
	}
	if m.Geometry == Planar {
		if n := d.need(top, "depth", "a planar model needs depth: the magnet's length into the page, in the model's units"); n != nil {
			m.Depth, _ = d.length(n, "depth", "depth")
		}
	} else if n := top.get("depth"); n != nil {
		d.fail(top.key["depth"], "depth", "depth has no meaning in an axisymmetric model; remove it")
	}

	if n := top.get("materials"); n != nil {
		d.materials(m, n)
	}

	var t *expansion
	if n := top.get("template"); n != nil {
		t = d.template(m, n, top.get("dimensions"), top.key["template"])
	} else if n := top.get("dimensions"); n != nil {
		d.fail(top.key["dimensions"], "dimensions", "dimensions need a template; add template: c-core (or solenoid) or remove dimensions")
	}
	if t != nil {
		m.Template = t.name
		m.Gap = t.gap
		m.Shim = t.shim
		m.Regions = t.regions
		m.Coils = t.coils
		m.Probes = t.probes
		m.Target = t.target
		m.Mesh.Refine = t.refine
		m.Boundary = t.boundary
		for _, mat := range t.materials {
			if _, ok := m.Material(mat.Name); !ok {
				m.Materials = append(m.Materials, mat)
			}
		}
	}

	if n := top.get("gap"); n != nil {
		m.Gap, _ = d.length(n, "gap", "gap") // the stated gap overrides a template's
	}
	if n := top.get("regions"); n != nil {
		d.regions(m, n)
	} else if top.get("template") == nil {
		d.fail(top.node, "", "missing required key \"regions\"; add a list of regions (name, material, polygon) or use a template")
	}
	if n := top.get("coils"); n != nil {
		d.coils(m, n)
	}
	if n := top.get("probes"); n != nil {
		d.probes(m, n)
	}
	if n := top.get("boundary"); n != nil {
		d.boundary(m, n)
	}
	if n := top.get("mesh"); n != nil {
		d.mesh(m, n)
	}
	if n := top.get("target"); n != nil {
		d.target(m, n)
	}
	if n := top.get("forces"); n != nil {
		d.forces(m, n)
	}

	m.Materials = append(m.Materials,
		Material{Name: "air", MuR: 1, Stacking: 1},
		Material{Name: "copper", MuR: 1, Stacking: 1})

	d.validate(m)
	d.defaults(m)
	d.dropThin(m)
	return m
}

var materialKeys = []string{"curve", "table", "table-file", "mu-r", "stacking", "grade", "remanence", "mu-recoil", "direction"}

// materials decodes the materials mapping: name -> definition.
func (d *decoder) materials(m *Model, n *yaml.Node) {
	f, _ := d.mapping(n, "materials", nil, "material name -> definition")
	if f == nil {
		return
	}
	for _, name := range f.keys {
		path := f.sub(name)
		if name == "air" || name == "copper" {
			d.fail(f.key[name], path, "%q is built in (relative permeability 1); use it without defining it", name)
			continue
		}
		if strings.TrimSpace(name) == "" {
			d.fail(f.key[name], path, "a material needs a name")
			continue
		}
		mf, _ := d.mapping(f.val[name], path, materialKeys, "a material")
		if mf == nil {
			continue
		}
		mat := Material{Name: name, Stacking: 1, Pos: pos(f.key[name], path)}
		var kinds []string
		for _, k := range []string{"curve", "table", "table-file", "mu-r", "remanence"} {
			if mf.get(k) != nil {
				kinds = append(kinds, k)
			}
		}
		if len(kinds) != 1 {
			what := "none"
			if len(kinds) > 1 {
				what = strings.Join(kinds, " and ")
			}
			d.fail(mf.node, path, "a material needs exactly one of curve, table, table-file, mu-r or remanence (got %s)", what)
			m.Materials = append(m.Materials, mat) // keep the name: regions using it are not also wrong
			continue
		}
		kind := kinds[0]
		switch kind {
		case "curve":
			mat.Curve, _ = d.str(mf.get("curve"), mf.sub("curve"), "a built-in B-H curve name")
		case "table":
			mat.Table, mat.TablePos = d.table(mf.get("table"), mf.sub("table"))
		case "table-file":
			if p, ok := d.str(mf.get("table-file"), mf.sub("table-file"), "a CSV file path"); ok {
				if !filepath.IsAbs(p) {
					p = filepath.Join(filepath.Dir(d.file), p)
				}
				if st, err := os.Stat(p); err != nil || st.IsDir() {
					d.fail(mf.get("table-file"), mf.sub("table-file"), "cannot read B-H table file %s; paths are relative to the model file", p)
				}
				mat.TableFile = p
			}
		case "mu-r":
			mat.MuR, _ = d.positive(mf.get("mu-r"), mf.sub("mu-r"), "mu-r")
		case "remanence":
			mg := &Magnet{MuRecoil: 1}
			mg.Remanence, _ = d.positive(mf.get("remanence"), mf.sub("remanence"), "remanence (T)")
			if v := mf.get("mu-recoil"); v != nil {
				mg.MuRecoil, _ = d.positive(v, mf.sub("mu-recoil"), "mu-recoil")
			}
			if v := mf.get("direction"); v != nil {
				if a, ok := d.number(v, mf.sub("direction")); ok {
					mg.Direction = a * math.Pi / 180
				}
			}
			mat.Magnet = mg
		}
		if kind != "remanence" {
			for _, k := range []string{"mu-recoil", "direction"} {
				if mf.get(k) != nil {
					d.fail(mf.key[k], mf.sub(k), "%s belongs to a permanent magnet (remanence); remove it", k)
				}
			}
		}
		if v := mf.get("stacking"); v != nil {
			if kind == "curve" || kind == "table" || kind == "table-file" {
				if s, ok := d.positive(v, mf.sub("stacking"), "stacking"); ok {
					if s > 1 {
						d.fail(v, mf.sub("stacking"), "stacking is the steel fraction of a laminated stack and must lie in (0, 1], got %s", v.Value)
					} else {
						mat.Stacking = s
					}
				}
			} else {
				d.fail(mf.key["stacking"], mf.sub("stacking"), "stacking applies to B-H curves (curve, table, table-file) only; remove it")
			}
		}
		if v := mf.get("grade"); v != nil {
			if kind == "curve" || kind == "table" || kind == "table-file" {
				mat.Grade, _ = d.str(v, mf.sub("grade"), "a steel grade designation such as M270-35A")
				mat.GradePos = pos(v, mf.sub("grade"))
			} else {
				d.fail(mf.key["grade"], mf.sub("grade"), "grade applies to B-H curves (curve, table, table-file) only; remove it")
			}
		}
		m.Materials = append(m.Materials, mat)
	}
}

// table reads an inline B-H table: rows [H A/m, B T]. Monotonicity is
// checked by package materials; here each row must hold two finite numbers.
func (d *decoder) table(n *yaml.Node, path string) ([][2]float64, []Pos) {
	rows, ok := d.list(n, path, "rows [H, B]")
	if !ok {
		return nil, nil
	}
	if len(rows) < 2 {
		d.fail(n, path, "a B-H table needs at least 2 rows [H, B], got %d", len(rows))
		return nil, nil
	}
	out := make([][2]float64, 0, len(rows))
	var at []Pos
	for i, r := range rows {
		p := index(path, i)
		if r.Kind != yaml.SequenceNode || len(r.Content) != 2 {
			d.fail(r, p, "expected a row [H, B] (H in A/m, B in T), got %s", describeLen(r))
			return nil, nil
		}
		h, ok1 := d.number(r.Content[0], index(p, 0))
		b, ok2 := d.number(r.Content[1], index(p, 1))
		if !ok1 || !ok2 {
			return nil, nil
		}
		if h < 0 || b < 0 {
			d.fail(r, p, "H and B in a B-H table must not be negative (the curve is given for the first quadrant)")
			return nil, nil
		}
		out = append(out, [2]float64{h, b})
		at = append(at, pos(r, p))
	}
	return out, at
}

var regionKeys = []string{"name", "material", "polygon", "mesh-size"}

// regions decodes the regions list. A region named like a template region
// replaces it in place.
func (d *decoder) regions(m *Model, n *yaml.Node) {
	items, ok := d.list(n, "regions", "regions")
	if !ok {
		return
	}
	for i, it := range items {
		path := index("regions", i)
		f, _ := d.mapping(it, path, regionKeys, "a region")
		if f == nil {
			continue
		}
		r := Region{Pos: pos(it, path)}
		if v := d.need(f, "name", "add name: <region name>"); v != nil {
			r.Name, _ = d.str(v, f.sub("name"), "a region name")
		}
		if v := d.need(f, "material", "add material: <name> (a material defined under materials, or air or copper)"); v != nil {
			r.Material, _ = d.str(v, f.sub("material"), "a material name")
			r.materialPos = pos(v, f.sub("material"))
		}
		if v := f.get("mesh-size"); v != nil {
			r.MeshSize, _ = d.length(v, f.sub("mesh-size"), "mesh-size")
		}
		if v := d.need(f, "polygon", "add polygon: [[x0, y0], [x1, y1], [x2, y2], ...]"); v != nil {
			if !d.polygon(&r, v, f.sub("polygon")) {
				r.X, r.Y, r.Sweep = nil, nil, nil
			}
		}
		if r.Name == "" {
			continue
		}
		if old, ok := m.Region(r.Name); ok {
			if d.generated["region:"+r.Name] { // the user's region replaces the template's
				delete(d.generated, "region:"+r.Name)
				*old = r
				continue
			}
			d.fail(it, path, "region name %q is already used by %s (line %d); names must be unique", r.Name, old.Pos.Path, old.Pos.Line)
			continue
		}
		m.Regions = append(m.Regions, r)
	}
}

// polygon reads a vertex list: [x, y] or {at: [x, y], arc: degrees}.
func (d *decoder) polygon(r *Region, n *yaml.Node, path string) bool {
	items, ok := d.list(n, path, "vertices [x, y]")
	if !ok {
		return false
	}
	var sweep []float64
	hasArc := false
	good := true
	for i, it := range items {
		p := index(path, i)
		var xy [2]float64
		s := 0.0
		if it.Kind == yaml.MappingNode {
			f, _ := d.mapping(it, p, []string{"at", "arc"}, "an arc vertex {at: [x, y], arc: degrees}")
			if f == nil {
				good = false
				continue
			}
			at := d.need(f, "at", "add at: [x, y]")
			an := d.need(f, "arc", "add arc: <signed sweep in degrees, + counter-clockwise>")
			if at == nil || an == nil {
				good = false
				continue
			}
			var ok1, ok2 bool
			xy, ok1 = d.point(at, f.sub("at"))
			deg, ok2 := d.number(an, f.sub("arc"))
			if !ok1 || !ok2 {
				good = false
				continue
			}
			if math.Abs(deg) >= 360 {
				d.fail(an, f.sub("arc"), "an arc must sweep less than 360 degrees, got %s; split a full circle into two arcs", an.Value)
				good = false
				continue
			}
			s = deg * math.Pi / 180
			hasArc = hasArc || s != 0
		} else {
			var ok1 bool
			if xy, ok1 = d.point(it, p); !ok1 {
				good = false
				continue
			}
		}
		r.X = append(r.X, xy[0])
		r.Y = append(r.Y, xy[1])
		sweep = append(sweep, s)
		r.vertexPos = append(r.vertexPos, pos(it, p))
	}
	if hasArc {
		r.Sweep = sweep
	}
	return good
}

var coilKeys = []string{"name", "turns", "current", "sides", "fill-factor", "temperature", "supply-voltage", "supply-current"}

// coils decodes the coils list. A coil named like a template coil replaces it.
func (d *decoder) coils(m *Model, n *yaml.Node) {
	items, ok := d.list(n, "coils", "coils")
	if !ok {
		return
	}
	for i, it := range items {
		path := index("coils", i)
		f, _ := d.mapping(it, path, coilKeys, "a coil")
		if f == nil {
			continue
		}
		c := Coil{Pos: pos(it, path)}
		if v := d.need(f, "name", "add name: <coil name>"); v != nil {
			c.Name, _ = d.str(v, f.sub("name"), "a coil name")
		}
		if v := d.need(f, "turns", "add turns: <conductors in each side>"); v != nil {
			c.Turns, _ = d.positive(v, f.sub("turns"), "turns")
		}
		if v := d.need(f, "current", "add current: <ampere per conductor>"); v != nil {
			c.Current, _ = d.number(v, f.sub("current"))
		}
		if v := f.get("fill-factor"); v != nil {
			if x, ok := d.positive(v, f.sub("fill-factor"), "fill-factor"); ok {
				if x > 1 {
					d.fail(v, f.sub("fill-factor"), "fill-factor is the copper fraction of the coil side and must lie in (0, 1], got %s", v.Value)
				}
				c.FillFactor = x
			}
		}
		if v := f.get("temperature"); v != nil {
			if x, ok := d.number(v, f.sub("temperature")); ok {
				if x < -273.15 {
					d.fail(v, f.sub("temperature"), "temperature is in degrees Celsius and cannot be below absolute zero (-273.15)")
				}
				c.Temperature = x
			}
		}
		if v := f.get("supply-voltage"); v != nil {
			c.SupplyVoltage, _ = d.positive(v, f.sub("supply-voltage"), "supply-voltage")
		}
		if v := f.get("supply-current"); v != nil {
			c.SupplyCurrent, _ = d.positive(v, f.sub("supply-current"), "supply-current")
		}
		if v := d.need(f, "sides", "add sides: [{region: <name>, sense: +1}, {region: <name>, sense: -1}]"); v != nil {
			if sides, ok := d.list(v, f.sub("sides"), "coil sides"); ok {
				if len(sides) == 0 {
					d.fail(v, f.sub("sides"), "a coil needs at least one side")
				}
				for j, sn := range sides {
					sp := index(f.sub("sides"), j)
					sf, _ := d.mapping(sn, sp, []string{"region", "sense"}, "a coil side")
					if sf == nil {
						continue
					}
					s := CoilSide{Pos: pos(sn, sp)}
					if rv := d.need(sf, "region", "add region: <name of the region holding these conductors>"); rv != nil {
						s.Region, _ = d.str(rv, sf.sub("region"), "a region name")
						s.regionPos = pos(rv, sf.sub("region"))
					}
					if sv := d.need(sf, "sense", "add sense: +1 (current out of the page, or along +phi) or -1"); sv != nil {
						if x, ok := d.number(sv, sf.sub("sense")); ok {
							if x != 1 && x != -1 {
								d.fail(sv, sf.sub("sense"), "sense must be +1 or -1, got %s", sv.Value)
							}
							s.Sense = x
						}
					}
					c.Sides = append(c.Sides, s)
				}
			}
		}
		if c.Name == "" {
			continue
		}
		if old, ok := m.Coil(c.Name); ok {
			if d.generated["coil:"+c.Name] {
				delete(d.generated, "coil:"+c.Name)
				*old = c
				continue
			}
			d.fail(it, path, "coil name %q is already used by %s (line %d); names must be unique", c.Name, old.Pos.Path, old.Pos.Line)
			continue
		}
		m.Coils = append(m.Coils, c)
	}
}

// firstColumn returns the 1-based column of the first non-blank character
// of line n of data (1 when the line is blank or missing): the parser
// reports only the line of a syntax error.
func firstColumn(data []byte, n int) int {
	lines := strings.Split(string(data), "\n")
	if n < 1 || n > len(lines) {
		return 0
	}
	l := lines[n-1]
	for i, r := range l {
		if r != ' ' && r != '\t' {
			return i + 1
		}
	}
	return 1
}

// yamlHint says what usually causes a YAML syntax error.
func yamlHint(msg string) string {
	switch {
	case strings.Contains(msg, "mapping values are not allowed"):
		return "check this line's indentation against the line above (a key indented under a value), or quote a value that contains \": \""
	case strings.Contains(msg, "did not find expected ',' or ']'"), strings.Contains(msg, "did not find expected ',' or '}'"):
		return "a [ ... ] or { ... } that starts here is not closed, or its items lack commas"
	case strings.Contains(msg, "tab character"):
		return "indent with spaces, not tabs"
	case strings.Contains(msg, "did not find expected key"):
		return "check the indentation: keys of one mapping must start in the same column"
	}
	return "check the indentation and the quotes on and above this line"
}
