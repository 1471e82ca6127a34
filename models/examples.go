package models

import (
	"embed"
	"fmt"
	"io/fs"
	"sort"
	"strings"
)

//go:embed examples/*.yaml
var exampleFS embed.FS

// DefaultExample is the example model the demo runs: a bench C-core dipole.
const DefaultExample = "bench-dipole"

// Examples returns the names of the embedded example models, sorted.
func Examples() []string {
	ents, err := fs.ReadDir(exampleFS, "examples")
	if err != nil {
		panic("models: embedded examples unreadable: " + err.Error())
	}
	var names []string
	for _, e := range ents {
		if strings.HasSuffix(e.Name(), ".yaml") {
			names = append(names, strings.TrimSuffix(e.Name(), ".yaml"))
		}
	}
	sort.Strings(names)
	return names
}

// Example returns the text of the embedded example model called name.
func Example(name string) ([]byte, error) {
	data, err := exampleFS.ReadFile("examples/" + name + ".yaml")
	if err != nil || strings.ContainsAny(name, "/\\") {
		return nil, fmt.Errorf("models: no example model %q; the examples are %s", name, oneOf(Examples()))
	}
	return data, nil
}

// LoadExample parses the embedded example model called name. Its File is
// "examples/<name>.yaml".
func LoadExample(name string) (*Model, error) {
	data, err := Example(name)
	if err != nil {
		return nil, err
	}
	return Parse("examples/"+name+".yaml", data)
}

// ExampleSummary returns a one-line description of the embedded example
// called name: the first sentence or clause (up to a colon or a full
// stop) of the comment block that opens its file; "" when it has none.
func ExampleSummary(name string) string {
	data, err := Example(name)
	if err != nil {
		return ""
	}
	var words []string
	for _, line := range strings.Split(string(data), "\n") {
		t := strings.TrimSpace(line)
		if !strings.HasPrefix(t, "#") {
			break
		}
		words = append(words, strings.Fields(strings.TrimPrefix(t, "#"))...)
	}
	s := strings.Join(words, " ")
	if i := strings.IndexAny(s, ":."); i > 0 {
		s = s[:i]
	}
	return s
}
