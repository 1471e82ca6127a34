package models

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"go.yaml.in/yaml/v3"
)

// decoder walks a yaml.Node tree, converting values and collecting errors
// with their positions. It never panics on any tree yaml.v3 produces.
type decoder struct {
	file  string
	errs  ErrorList
	scale float64 // metres per file unit
	units string

	generated   map[string]bool
	targetProbe Pos  // where target.probe was written
	depth       int  // nesting of merge keys being expanded
	merges      int  // merged mappings expanded so far (bounded by maxMerges) // "region:name", "coil:name", "probe:name" made by a template
	refineKey   bool // the file has a mesh.refine list (perhaps empty)
}

// fail records an error at node n (at the start of the file when n is nil).
func (d *decoder) fail(n *yaml.Node, path, format string, args ...any) {
	if len(d.errs) >= maxErrors {
		return
	}
	e := &Error{File: d.file, Path: path, Msg: fmt.Sprintf(format, args...)}
	if n != nil {
		e.Line, e.Column = n.Line, n.Column
	}
	d.errs = append(d.errs, e)
}

// failAt records an error at a stored position.
func (d *decoder) failAt(p Pos, format string, args ...any) {
	if len(d.errs) >= maxErrors {
		return
	}
	d.errs = append(d.errs, &Error{File: d.file, Line: p.Line, Column: p.Column, Path: p.Path, Msg: fmt.Sprintf(format, args...)})
}

func pos(n *yaml.Node, path string) Pos {
	if n == nil {
		return Pos{Path: path}
	}
	return Pos{Line: n.Line, Column: n.Column, Path: path}
}

// resolve follows aliases to the node they name.
func resolve(n *yaml.Node) *yaml.Node {
	for i := 0; n != nil && n.Kind == yaml.AliasNode && i < 32; i++ {
		n = n.Alias
	}
	if n != nil && n.Kind == yaml.AliasNode {
		return nil
	}
	return n
}

// describe names what a node holds, for "expected X, got Y" messages.
func describe(n *yaml.Node) string {
	switch n.Kind {
	case yaml.MappingNode:
		return "a mapping"
	case yaml.SequenceNode:
		return "a list"
	case yaml.ScalarNode:
		switch n.ShortTag() {
		case "!!null":
			return "nothing"
		case "!!int", "!!float":
			return "the number " + n.Value
		case "!!bool":
			return "the boolean " + n.Value
		}
		v := n.Value
		if len(v) > 40 {
			v = v[:40] + "..."
		}
		return strconv.Quote(v)
	}
	return "an unexpected value"
}

// fields is a checked YAML mapping.
type fields struct {
	node *yaml.Node
	path string
	val  map[string]*yaml.Node
	key  map[string]*yaml.Node
	keys []string // in file order
}

// get returns the value under k, or nil.
func (f *fields) get(k string) *yaml.Node {
	if f == nil {
		return nil
	}
	return f.val[k]
}

// sub returns the path of key k inside f.
func (f *fields) sub(k string) string { return join(f.path, k) }

func join(path, k string) string {
	if path == "" {
		return k
	}
	return path + "." + k
}

func index(path string, i int) string { return fmt.Sprintf("%s[%d]", path, i) }

// mapping checks that n is a mapping whose keys are all known (nil known
// accepts any key) and distinct. what names the thing for messages.
func (d *decoder) mapping(n *yaml.Node, path string, known []string, what string) (*fields, bool) {
	n = resolve(n)
	if n == nil {
		return nil, false
	}
	if n.Kind != yaml.MappingNode {
		d.fail(n, path, "expected a mapping (%s), got %s", what, describe(n))
		return nil, false
	}
	f := &fields{node: n, path: path, val: map[string]*yaml.Node{}, key: map[string]*yaml.Node{}}
	ok := true
	var merges []*yaml.Node // "<<: *anchor" sources, applied after the explicit keys
	for i := 0; i+1 < len(n.Content); i += 2 {
		kn, vn := resolve(n.Content[i]), resolve(n.Content[i+1])
		if kn == nil || vn == nil {
			d.fail(n.Content[i], path, "alias could not be resolved")
			ok = false
			continue
		}
		if kn.Kind != yaml.ScalarNode {
			d.fail(kn, path, "a key must be a plain name, got %s", describe(kn))
			ok = false
			continue
		}
		k := kn.Value
		if kn.ShortTag() == "!!merge" {
			merges = append(merges, vn)
			continue
		}
		if _, dup := f.val[k]; dup {
			d.fail(kn, join(path, k), "duplicate key %q (first at line %d); keep one", k, f.key[k].Line)
			ok = false
			continue
		}
		if known != nil && !contains(known, k) {
			msg := fmt.Sprintf("unknown key %q in %s", k, what)
			if s := closest(k, known); s != "" {
				msg += fmt.Sprintf("; did you mean %q?", s)
			} else {
				msg += "; known keys are " + oneOf(known)
			}
			d.fail(kn, join(path, k), "%s", msg)
			ok = false
			continue
		}
		f.val[k], f.key[k] = vn, kn
		f.keys = append(f.keys, k)
	}
	// YAML merge keys: keys of the merged mappings that the mapping does not
	// set itself, first source first.
	for _, src := range merges {
		list := []*yaml.Node{src}
		if src.Kind == yaml.SequenceNode {
			list = src.Content
		}
		for _, mn := range list {
			d.merges++
			if d.depth > 16 || d.merges > maxMerges {
				d.fail(mn, path, "too many or too deeply nested merge keys (<<); write the values out")
				return f, false
			}
			d.depth++
			mf, mok := d.mapping(mn, path, known, what)
			d.depth--
			ok = ok && mok
			if mf == nil {
				ok = false
				continue
			}
			for _, k := range mf.keys {
				if _, set := f.val[k]; !set {
					f.val[k], f.key[k] = mf.val[k], mf.key[k]
					f.keys = append(f.keys, k)
				}
			}
		}
	}
	return f, ok
}

func contains(list []string, s string) bool {
	for _, v := range list {
		if v == s {
			return true
		}
	}
	return false
}

// need returns f's value under key, or records a "missing" error with hint.
func (d *decoder) need(f *fields, key, hint string) *yaml.Node {
	if v := f.get(key); v != nil {
		return v
	}
	d.fail(f.node, f.path, "missing required key %q; %s", key, hint)
	return nil
}

// list checks that n is a sequence and returns its items.
func (d *decoder) list(n *yaml.Node, path, what string) ([]*yaml.Node, bool) {
	n = resolve(n)
	if n == nil {
		return nil, false
	}
	if n.Kind != yaml.SequenceNode {
		d.fail(n, path, "expected a list (%s), got %s", what, describe(n))
		return nil, false
	}
	out := make([]*yaml.Node, len(n.Content))
	for i, c := range n.Content {
		out[i] = resolve(c)
		if out[i] == nil {
			d.fail(c, index(path, i), "alias could not be resolved")
			return nil, false
		}
	}
	return out, true
}

// number converts a scalar to a finite float64.
func (d *decoder) number(n *yaml.Node, path string) (float64, bool) {
	n = resolve(n)
	if n == nil {
		return 0, false
	}
	if n.Kind != yaml.ScalarNode {
		d.fail(n, path, "expected a number, got %s", describe(n))
		return 0, false
	}
	tag := n.ShortTag()
	if tag != "!!int" && tag != "!!float" {
		d.fail(n, path, "expected a number, got %s", describe(n))
		return 0, false
	}
	v := strings.ReplaceAll(n.Value, "_", "")
	var x float64
	var err error
	if tag == "!!int" {
		var i int64
		if i, err = strconv.ParseInt(v, 0, 64); err == nil {
			x = float64(i)
		} else {
			x, err = strconv.ParseFloat(v, 64)
		}
	} else {
		x, err = strconv.ParseFloat(v, 64)
	}
	if err != nil && !strings.Contains(v, "inf") && !strings.Contains(strings.ToLower(v), "nan") {
		d.fail(n, path, "cannot read %q as a number", n.Value)
		return 0, false
	}
	if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
		d.fail(n, path, "must be a finite number, got %s", n.Value)
		return 0, false
	}
	if math.Abs(x) > maxMagnitude {
		d.fail(n, path, "%s is out of range; numbers in a model must lie within ±1e15", n.Value)
		return 0, false
	}
	return x, true
}

// maxMerges bounds the merged mappings one file may expand, so that nested
// merge keys cannot make decoding exponentially slow.
const maxMerges = 1000

// maxMagnitude bounds every number in a model file, so that no unit
// conversion or area overflows.
const maxMagnitude = 1e15

// positive reads a number > 0.
func (d *decoder) positive(n *yaml.Node, path, what string) (float64, bool) {
	x, ok := d.number(n, path)
	if !ok {
		return 0, false
	}
	if x <= 0 {
		d.fail(n, path, "%s must be greater than zero, got %s", what, resolve(n).Value)
		return 0, false
	}
	return x, true
}

// length reads a positive length in file units and returns metres.
func (d *decoder) length(n *yaml.Node, path, what string) (float64, bool) {
	x, ok := d.positive(n, path, what)
	return d.m(x), ok
}

// integer reads a whole number.
func (d *decoder) integer(n *yaml.Node, path string) (int, bool) {
	x, ok := d.number(n, path)
	if !ok {
		return 0, false
	}
	if x != math.Trunc(x) || math.Abs(x) > 1e9 {
		d.fail(n, path, "expected a whole number, got %s", resolve(n).Value)
		return 0, false
	}
	return int(x), true
}

// str reads a non-empty text scalar.
func (d *decoder) str(n *yaml.Node, path, what string) (string, bool) {
	n = resolve(n)
	if n == nil {
		return "", false
	}
	if n.Kind != yaml.ScalarNode || n.ShortTag() == "!!null" {
		d.fail(n, path, "expected %s, got %s", what, describe(n))
		return "", false
	}
	if strings.TrimSpace(n.Value) == "" {
		d.fail(n, path, "%s must not be empty", what)
		return "", false
	}
	return n.Value, true
}

// enum reads one of the allowed words.
func (d *decoder) enum(n *yaml.Node, path, what string, allowed []string) (string, bool) {
	s, ok := d.str(n, path, "one of "+oneOf(allowed))
	if !ok {
		return "", false
	}
	if !contains(allowed, s) {
		msg := fmt.Sprintf("unknown %s %q; use %s", what, s, oneOf(allowed))
		if c := closest(s, allowed); c != "" {
			msg = fmt.Sprintf("unknown %s %q; did you mean %q? (allowed: %s)", what, s, c, oneOf(allowed))
		}
		d.fail(n, path, "%s", msg)
		return "", false
	}
	return s, true
}

// point reads [x, y] in file units and returns metres.
func (d *decoder) point(n *yaml.Node, path string) ([2]float64, bool) {
	var p [2]float64
	n = resolve(n)
	if n == nil {
		return p, false
	}
	if n.Kind != yaml.SequenceNode || len(n.Content) != 2 {
		d.fail(n, path, "expected a point [x, y], got %s", describeLen(n))
		return p, false
	}
	x, ok1 := d.number(n.Content[0], index(path, 0))
	y, ok2 := d.number(n.Content[1], index(path, 1))
	if !ok1 || !ok2 {
		return p, false
	}
	return [2]float64{d.m(x), d.m(y)}, true
}

// segment reads [[x0, y0], [x1, y1]] in file units and returns metres.
func (d *decoder) segment(n *yaml.Node, path string) ([2][2]float64, bool) {
	var s [2][2]float64
	n = resolve(n)
	if n == nil {
		return s, false
	}
	if n.Kind != yaml.SequenceNode || len(n.Content) != 2 {
		d.fail(n, path, "expected two points [[x0, y0], [x1, y1]], got %s", describeLen(n))
		return s, false
	}
	a, ok1 := d.point(n.Content[0], index(path, 0))
	b, ok2 := d.point(n.Content[1], index(path, 1))
	return [2][2]float64{a, b}, ok1 && ok2
}

func describeLen(n *yaml.Node) string {
	if n.Kind == yaml.SequenceNode {
		return fmt.Sprintf("a list of %d items", len(n.Content))
	}
	return describe(n)
}

// fmtLen formats a length in metres back in file units, for messages.
func (d *decoder) fmtLen(x float64) string {
	return strconv.FormatFloat(x/d.scale, 'g', 6, 64)
}

func (d *decoder) fmtPoint(x, y float64) string {
	// Drop rounding noise such as -4e-16 next to a coordinate of 100.
	s := math.Max(math.Abs(x), math.Abs(y))
	if math.Abs(x) < 1e-9*s {
		x = 0
	}
	if math.Abs(y) < 1e-9*s {
		y = 0
	}
	return fmt.Sprintf("(%s, %s) %s", d.fmtLen(x), d.fmtLen(y), d.units)
}

// m converts a length in file units to metres, rounding once: the metric
// units divide by a power of ten and inches multiply by 254/10000, since
// 1 in = 25.4 mm exactly (international yard and pound agreement, 1959).
func (d *decoder) m(x float64) float64 {
	switch d.units {
	case "mm":
		return x / 1000
	case "cm":
		return x / 100
	case "in":
		return x * 254 / 10000
	}
	return x * d.scale
}
