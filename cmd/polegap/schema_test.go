package main

import (
	"encoding/json"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"sort"
	"strings"
	"sync"
	"testing"
)

// The JSON contract: every command's --json output validates against
// schema/output.schema.json (JSON Schema, draft 2020-12). The validator
// below implements the keywords the schema uses and refuses any other,
// so that the schema cannot rely on one it does not check.

var loadSchema = sync.OnceValues(func() (map[string]any, error) {
	data, err := os.ReadFile("../../schema/output.schema.json")
	if err != nil {
		return nil, err
	}
	var s map[string]any
	return s, json.Unmarshal(data, &s)
})

// validate returns the first few places where doc breaks schema (the
// root of the schema document, for $ref).
func validate(root, schema map[string]any, doc any, path string) []string {
	var errs []string
	fail := func(format string, a ...any) { errs = append(errs, path+": "+fmt.Sprintf(format, a...)) }
	keys := make([]string, 0, len(schema))
	for k := range schema {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	for _, k := range keys {
		v := schema[k]
		switch k {
		case "$schema", "$id", "title", "description", "$defs":
		case "$ref":
			ref := v.(string)
			if !strings.HasPrefix(ref, "#/$defs/") {
				fail("unsupported $ref %s", ref)
				continue
			}
			def, ok := root["$defs"].(map[string]any)[strings.TrimPrefix(ref, "#/$defs/")].(map[string]any)
			if !ok {
				fail("no definition %s", ref)
				continue
			}
			errs = append(errs, validate(root, def, doc, path)...)
		case "type":
			var types []string
			switch t := v.(type) {
			case string:
				types = []string{t}
			case []any:
				for _, x := range t {
					types = append(types, x.(string))
				}
			}
			ok := false
			for _, t := range types {
				ok = ok || hasType(doc, t)
			}
			if !ok {
				fail("%s is not of type %v", short(doc), types)
			}
		case "enum":
			ok := false
			for _, e := range v.([]any) {
				ok = ok || reflect.DeepEqual(e, doc)
			}
			if !ok {
				fail("%s is not one of %v", short(doc), v)
			}
		case "const":
			if !reflect.DeepEqual(v, doc) {
				fail("%s is not %v", short(doc), v)
			}
		case "required":
			if obj, ok := doc.(map[string]any); ok {
				for _, r := range v.([]any) {
					if _, ok := obj[r.(string)]; !ok {
						fail("lacks %q", r)
					}
				}
			}
		case "properties", "additionalProperties":
			obj, ok := doc.(map[string]any)
			if !ok || k == "additionalProperties" {
				continue // both are handled under "properties"
			}
			props, _ := v.(map[string]any)
			for name, val := range obj {
				if ps, ok := props[name]; ok {
					errs = append(errs, validate(root, ps.(map[string]any), val, path+"."+name)...)
					continue
				}
				switch ap := schema["additionalProperties"].(type) {
				case bool:
					if !ap {
						fail("key %q is not in the schema", name)
					}
				case map[string]any:
					errs = append(errs, validate(root, ap, val, path+"."+name)...)
				}
			}
		case "items":
			if arr, ok := doc.([]any); ok {
				for i, x := range arr {
					errs = append(errs, validate(root, v.(map[string]any), x, fmt.Sprintf("%s[%d]", path, i))...)
				}
			}
		case "minItems", "maxItems":
			if arr, ok := doc.([]any); ok {
				n := int(v.(float64))
				if (k == "minItems" && len(arr) < n) || (k == "maxItems" && len(arr) > n) {
					fail("%d items, %s %d", len(arr), k, n)
				}
			}
		case "allOf", "oneOf":
			matched := 0
			var first []string
			for _, sub := range v.([]any) {
				e := validate(root, sub.(map[string]any), doc, path)
				switch {
				case len(e) == 0:
					matched++
				case k == "allOf":
					first = append(first, e...)
				case first == nil || len(e) < len(first):
					first = e // the closest branch's complaints
				}
			}
			if k == "allOf" && matched < len(v.([]any)) {
				errs = append(errs, first...)
			}
			if k == "oneOf" && matched != 1 {
				fail("matches %d of the oneOf schemas, want 1; the closest one's complaints: %v", matched, first)
			}
		default:
			fail("the schema uses %q, which this validator does not implement", k)
		}
	}
	if schema["additionalProperties"] != nil && schema["properties"] == nil {
		if obj, ok := doc.(map[string]any); ok {
			for name, val := range obj {
				switch ap := schema["additionalProperties"].(type) {
				case bool:
					if !ap {
						fail("key %q is not in the schema", name)
					}
				case map[string]any:
					errs = append(errs, validate(root, ap, val, path+"."+name)...)
				}
			}
		}
	}
	if len(errs) > 5 {
		errs = errs[:5]
	}
	return errs
}

func hasType(doc any, t string) bool {
	switch t {
	case "object":
		_, ok := doc.(map[string]any)
		return ok
	case "array":
		_, ok := doc.([]any)
		return ok
	case "string":
		_, ok := doc.(string)
		return ok
	case "boolean":
		_, ok := doc.(bool)
		return ok
	case "null":
		return doc == nil
	case "number":
		_, ok := doc.(float64)
		return ok
	case "integer":
		f, ok := doc.(float64)
		return ok && f == math.Trunc(f)
	}
	return false
}

func short(doc any) string {
	b, _ := json.Marshal(doc)
	if len(b) > 60 {
		return string(b[:60]) + "…"
	}
	return string(b)
}

// validateJSON checks one JSON document against the schema.
func validateJSON(t *testing.T, name string, data []byte) {
	t.Helper()
	schema, err := loadSchema()
	if err != nil {
		t.Fatal(err)
	}
	var doc any
	if err := json.Unmarshal(data, &doc); err != nil {
		t.Errorf("%s: not JSON: %v", name, err)
		return
	}
	for _, e := range validate(schema, schema, doc, name) {
		t.Error(e)
	}
	if !strings.HasPrefix(string(data), "{\n  \"schema_version\": ") {
		t.Errorf("%s: schema_version is not the first key", name)
	}
}

// TestValidator: the validator rejects what it must (the schema test is
// only as good as it).
func TestValidator(t *testing.T) {
	schema := map[string]any{
		"type": "object", "required": []any{"a"}, "additionalProperties": false,
		"properties": map[string]any{
			"a": map[string]any{"enum": []any{"round", "hollow"}},
			"b": map[string]any{"type": "array", "items": map[string]any{"type": "integer"}, "maxItems": 2.0},
			"c": map[string]any{"type": []any{"number", "null"}},
		},
	}
	for _, c := range []struct {
		doc  string
		fail bool
	}{
		{`{"a": "round"}`, false},
		{`{"a": "round", "b": [1, 2], "c": null}`, false},
		{`{"a": 2}`, true},                       // enum as a number
		{`{"b": [1]}`, true},                     // required
		{`{"a": "round", "Flags": 0}`, true},     // unknown key
		{`{"a": "round", "b": [1.5]}`, true},     // integer
		{`{"a": "round", "b": [1, 2, 3]}`, true}, // maxItems
		{`{"a": "round", "c": "x"}`, true},       // type list
	} {
		var doc any
		json.Unmarshal([]byte(c.doc), &doc)
		if errs := validate(schema, schema, doc, "doc"); (len(errs) > 0) != c.fail {
			t.Errorf("%s: errors %v, want failure %v", c.doc, errs, c.fail)
		}
	}
	if errs := validate(schema, map[string]any{"pattern": "x"}, "y", "doc"); len(errs) == 0 {
		t.Error("an unimplemented keyword passed silently")
	}
}

// TestJSONSchema: the JSON output of every command that prints JSON
// validates against the schema, with schema_version first; the same runs
// write each command's --html report (solve, size, sweep, check,
// compare), checked by checkHTMLReport and, when chromium is installed,
// loaded in it.
func TestJSONSchema(t *testing.T) {
	dir := t.TempDir()
	cases := []struct {
		args []string
		html []string // what the --html report must hold; nil: no report
	}{
		{[]string{"solve", "--json", "--quick", "--stress-only", "bench-dipole"}, []string{"Field at the probes", "Design quantities", "Field map", "The force on pole attraction"}},
		{[]string{"solve", "--json", "--quick", "--stress-only", "calibration-solenoid"}, nil},
		{[]string{"solve", "--json", "--quick", "holding-magnet"}, nil},
		{[]string{"check", "--json", "--quick", "--saturation-limit", "1.5T", "bench-dipole"}, []string{"<h2>Check</h2>", "--saturation-limit 1.5T", "some checks FAIL"}},
		{[]string{"size", "--json", "--quick", "--cooling", "water", "bench-dipole"}, []string{"Coil for the target field", "water (l/min)", "--cooling water"}},
		{[]string{"size", "--json", "--quick", "bench-dipole"}, nil},
		{[]string{"compare", "--json", "--fit", "offset", "bench-dipole", "../../testdata/measured/bench-dipole-hall.csv"}, []string{"Measured against predicted", "relative residual is undefined at zero current", "Birge ratio"}},
		{[]string{"mesh", "--json", "bench-dipole"}, nil},
		{[]string{"sweep", "--quick", "--points", "3", "bench-dipole"}, []string{"Excitation curve", "At the highest current of the sweep"}},
	}
	var pages [][2]string
	for i, c := range cases {
		name := strings.Join(c.args, " ")
		args := c.args
		page := filepath.Join(dir, fmt.Sprintf("%d-%s.html", i, c.args[0]))
		if c.html != nil {
			args = append([]string{args[0], "--html", page}, args[1:]...)
		}
		code, out, errs := runCmd(t, args...)
		if code != 0 && !(c.args[0] == "check" && code == 1) && !(c.args[0] == "size" && code == exitNoWinding) {
			t.Errorf("%s: code %d\n%s", name, code, errs)
			continue
		}
		if c.args[0] != "sweep" {
			validateJSON(t, name, []byte(out))
		}
		if c.html != nil {
			checkHTMLReport(t, name, page, c.html)
			pages = append(pages, [2]string{c.args[0], page})
		}
	}
	renderAll(t, pages)
	// The pinned outputs too (testdata/golden), which cost no solve.
	goldens, _ := filepath.Glob("testdata/golden/*.json")
	if len(goldens) == 0 {
		t.Error("no golden JSON found")
	}
	for _, g := range goldens {
		data, err := os.ReadFile(g)
		if err != nil {
			t.Fatal(err)
		}
		// golden_test.go masks the timings as "<time>".
		data = []byte(strings.ReplaceAll(string(data), `"<time>"`, "0"))
		validateJSON(t, g, data)
	}
}
