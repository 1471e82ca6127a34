package models

import (
	"fmt"
	"regexp"
	"strconv"
	"strings"

	"go.yaml.in/yaml/v3"
)

// Setting is one value written into a model file before it is decoded:
// the way a design scan varies a template dimension, the depth or a
// material's curve without any other package knowing the file format.
type Setting struct {
	// Path names the key by its mapping keys joined with dots, as error
	// messages print it: "dimensions.pole-width", "depth",
	// "materials.yoke-steel.curve". Missing mappings and keys on the way
	// are added; a list or a scalar on the way is an error.
	Path string
	// Value is the value as it would be written in the file: a number in
	// the file's units ("220") or a name ("low-carbon-steel").
	Value string
}

// ParseWith decodes a model file as Parse does, after writing each
// setting into it in order. Every other value keeps its line and column
// in messages; a set value is reported at its path with no line. A path
// that cannot be written is an ErrorList entry naming it.
func ParseWith(filename string, data []byte, set []Setting) (*Model, error) {
	if len(set) == 0 {
		return Parse(filename, data)
	}
	var root yaml.Node
	if err := yaml.Unmarshal(data, &root); err != nil || len(root.Content) == 0 {
		return Parse(filename, data) // the same message as without settings
	}
	d := &decoder{file: filename, scale: 1, units: "m"}
	for _, s := range set {
		if err := setPath(root.Content[0], s); err != nil {
			return nil, ErrorList{&Error{File: filename, Path: s.Path, Msg: err.Error()}}
		}
	}
	m := d.parseRoot(&root)
	if len(d.errs) > 0 {
		d.errs.Sort()
		return nil, d.errs
	}
	return m, nil
}

var settingKey = regexp.MustCompile(`^[A-Za-z0-9_-]+$`)

// setPath writes s.Value at s.Path below the mapping n.
func setPath(n *yaml.Node, s Setting) error {
	keys := strings.Split(s.Path, ".")
	for _, k := range keys {
		if !settingKey.MatchString(k) {
			return fmt.Errorf("cannot set %q: write the path as keys joined with dots, e.g. dimensions.pole-width", s.Path)
		}
	}
	for i, k := range keys {
		n = resolve(n)
		if n == nil || n.Kind != yaml.MappingNode {
			return fmt.Errorf("cannot set %q: %s is not a mapping", s.Path, strings.Join(keys[:i], "."))
		}
		var v *yaml.Node
		at := -1
		for j := 0; j+1 < len(n.Content); j += 2 {
			if n.Content[j].Value == k {
				v, at = n.Content[j+1], j+1
			}
		}
		last := i == len(keys)-1
		if v == nil {
			v = &yaml.Node{Kind: yaml.MappingNode}
			if last {
				v = &yaml.Node{Kind: yaml.ScalarNode}
			}
			n.Content = append(n.Content, &yaml.Node{Kind: yaml.ScalarNode, Value: k}, v)
			at = len(n.Content) - 1
		}
		if last {
			if r := resolve(v); r != nil && r.Kind != yaml.ScalarNode {
				return fmt.Errorf("cannot set %q: it holds %s, not a single value", s.Path, describe(r))
			}
			// A fresh node: an anchored value and its aliases elsewhere
			// keep theirs.
			nv := &yaml.Node{Kind: yaml.ScalarNode, Value: s.Value}
			if _, err := strconv.ParseFloat(s.Value, 64); err != nil {
				nv.Tag = "!!str" // a name stays a name ("no" and "1e" included)
			}
			n.Content[at] = nv
			return nil
		}
		n = v
	}
	return nil
}
