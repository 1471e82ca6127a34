// Package samples holds the measured-curve samples built into polegap,
// as the example models are, so that 'polegap compare bench-dipole
// bench-dipole-hall.csv' runs without a checkout. They are copies of
// testdata/measured at the repository root, which the generator in
// post/measure (gen_test.go) writes and documents (testdata/measured/
// README.md); TestSamplesMatch fails when a copy drifts from its source.
package samples

import (
	"embed"
	"fmt"
	"io/fs"
	"sort"
	"strings"
)

//go:embed *.csv *.yaml
var sampleFS embed.FS

// Names returns the sample file names, sorted.
func Names() []string {
	ents, err := fs.ReadDir(sampleFS, ".")
	if err != nil {
		panic("samples: embedded samples unreadable: " + err.Error())
	}
	var out []string
	for _, e := range ents {
		if !e.IsDir() && !strings.HasSuffix(e.Name(), ".go") {
			out = append(out, e.Name())
		}
	}
	sort.Strings(out)
	return out
}

// Data returns the text of the sample called name.
func Data(name string) ([]byte, error) {
	if strings.ContainsAny(name, "/\\") {
		return nil, fmt.Errorf("samples: no measured sample %q", name)
	}
	data, err := sampleFS.ReadFile(name)
	if err != nil {
		return nil, fmt.Errorf("samples: no measured sample %q; the samples are %s", name, strings.Join(Names(), ", "))
	}
	return data, nil
}

// Summaries describes each sample in a line (testdata/measured/README.md
// gives the truth and noise behind each).
var Summaries = map[string]string{
	"bench-dipole-hall.csv":        "bench dipole, Hall-probe field readings (plain CSV)",
	"bench-dipole-balance.yaml":    "bench dipole, current-balance readings (measured-data format)",
	"bench-dipole-searchcoil.yaml": "bench dipole, search-coil readings with a solenoid calibration (measured-data format)",
	"ring-team13.yaml":             "ring-sample test of a steel (IEC 60404-4 ring method) for 'polegap ringcurve'",
}
