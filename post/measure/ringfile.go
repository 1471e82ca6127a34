package measure

import (
	"bytes"
	"errors"
	"fmt"
	"os"
	"strings"

	"go.yaml.in/yaml/v3"
)

// RingFormatTag marks our ring-test file, version 1 (FORMAT.md, "Ring
// test").
const RingFormatTag = "polegap-ring/1"

type ringDoc struct {
	Format          string        `yaml:"format"`
	Sample          string        `yaml:"sample"`
	Date            string        `yaml:"date"`
	Operator        string        `yaml:"operator"`
	Notes           string        `yaml:"notes"`
	Ring            ringGeomDoc   `yaml:"ring"`
	Windings        ringWindDoc   `yaml:"windings"`
	Switching       string        `yaml:"switching"`
	Integrator      *ringIntDoc   `yaml:"integrator"`
	Calibration     *ringCalDoc   `yaml:"calibration"`
	CurrentRelSigma float64       `yaml:"current-rel-sigma"`
	CurrentSigma    float64       `yaml:"current-sigma"`
	ReadingSigma    float64       `yaml:"reading-sigma"`
	Readings        []ringReadDoc `yaml:"readings"`
}

type ringGeomDoc struct {
	Outer        float64 `yaml:"outer-diameter"`
	OuterSigma   float64 `yaml:"outer-diameter-sigma"`
	Inner        float64 `yaml:"inner-diameter"`
	InnerSigma   float64 `yaml:"inner-diameter-sigma"`
	Height       float64 `yaml:"height"`
	HeightSigma  float64 `yaml:"height-sigma"`
	Mass         float64 `yaml:"mass"`
	MassSigma    float64 `yaml:"mass-sigma"`
	Density      float64 `yaml:"density"`
	DensitySigma float64 `yaml:"density-sigma"`
	Path         string  `yaml:"path"`
}

type ringWindDoc struct {
	N1              float64 `yaml:"magnetising-turns"`
	N2              float64 `yaml:"search-turns"`
	SearchArea      float64 `yaml:"search-area"`
	SearchAreaSigma float64 `yaml:"search-area-sigma"`
}

type ringIntDoc struct {
	Scale         float64 `yaml:"scale"`
	ScaleRelSigma float64 `yaml:"scale-rel-sigma"`
}

type ringCalDoc struct {
	Mutual                float64 `yaml:"mutual-inductance"`
	MutualRelSigma        float64 `yaml:"mutual-inductance-rel-sigma"`
	CurrentChange         float64 `yaml:"current-change"`
	CurrentChangeRelSigma float64 `yaml:"current-change-rel-sigma"`
	Readings              floats  `yaml:"readings"`
	ReadingSigma          float64 `yaml:"reading-sigma"`
}

type ringReadDoc struct {
	Current float64 `yaml:"current"`
	Reading floats  `yaml:"reading"`
}

// RingTest is a ring-test file: the sample's description and the ring,
// and its readings.
type RingTest struct {
	Name     string            // the sample's name, or the file name
	Meta     map[string]string // sample, date, operator, notes
	Ring     Ring
	Readings []RingReading
	file     string
	parser   *parser
}

// LoadRing reads a ring-test file (FORMAT.md, "Ring test").
func LoadRing(path string) (*RingTest, error) {
	data, err := os.ReadFile(path)
	if err != nil {
		return nil, &InputError{File: path, Msg: fmt.Sprintf("cannot read: %v", err), Err: err}
	}
	return ParseRing(path, data)
}

// ParseRing reads a ring-test file from data; name is used in errors.
// Errors are *InputError values (or an ErrorList) with line, column and
// field path.
func ParseRing(name string, data []byte) (*RingTest, error) {
	var root yaml.Node
	if err := yaml.Unmarshal(data, &root); err != nil {
		return nil, yamlError(name, err)
	}
	var d ringDoc
	dec := yaml.NewDecoder(bytes.NewReader(data))
	dec.KnownFields(true)
	if err := dec.Decode(&d); err != nil {
		return nil, yamlError(name, err)
	}
	p := &parser{name: name, root: &root}
	if d.Format != RingFormatTag {
		return nil, p.errAt(nil, "format", []any{"format"}, "format is %q; a ring-test file starts with format: %s", d.Format, RingFormatTag)
	}
	t := &RingTest{Name: d.Sample, Meta: map[string]string{}, file: name, parser: p}
	if t.Name == "" {
		t.Name = name
	}
	for k, v := range map[string]string{"sample": d.Sample, "date": d.Date, "operator": d.Operator, "notes": strings.TrimSpace(d.Notes)} {
		if v != "" {
			t.Meta[k] = v
		}
	}
	g, w := d.Ring, d.Windings
	t.Ring = Ring{
		Outer: g.Outer, OuterSigma: g.OuterSigma, Inner: g.Inner, InnerSigma: g.InnerSigma,
		Height: g.Height, HeightSigma: g.HeightSigma, Mass: g.Mass, MassSigma: g.MassSigma,
		Density: g.Density, DensitySigma: g.DensitySigma, Path: g.Path,
		N1: w.N1, N2: w.N2, SearchArea: w.SearchArea, SearchAreaSigma: w.SearchAreaSigma,
		Switching: d.Switching, CurrentRelSigma: d.CurrentRelSigma, CurrentSigma: d.CurrentSigma, ReadingSigma: d.ReadingSigma,
	}
	switch {
	case d.Integrator != nil && d.Calibration != nil:
		return nil, p.errAt(nil, "calibration", []any{"calibration"}, "give the integrator's scale or a calibration, not both")
	case d.Integrator != nil:
		t.Ring.Scale, t.Ring.ScaleRelSigma = d.Integrator.Scale, d.Integrator.ScaleRelSigma
	case d.Calibration != nil:
		c := d.Calibration
		t.Ring.Calibration = &RingCalibration{Mutual: c.Mutual, MutualRelSigma: c.MutualRelSigma, CurrentChange: c.CurrentChange,
			CurrentChangeRelSigma: c.CurrentChangeRelSigma, Readings: c.Readings, ReadingSigma: c.ReadingSigma}
	default:
		return nil, p.errAt(nil, "integrator", nil, "give the integrator's scale (integrator: {scale: ...}) or a calibration by a mutual inductor")
	}
	for _, rd := range d.Readings {
		t.Readings = append(t.Readings, RingReading{Current: rd.Current, Readings: rd.Reading})
	}
	if err := t.Ring.validate(); err != nil {
		return nil, p.errAt(err, "ring", []any{"ring"}, "%v", err)
	}
	return t, nil
}

// Reduce reduces the file's readings (Ring.Reduce); an error names the
// file, line and reading.
func (t *RingTest) Reduce() (*RingResult, error) {
	res, err := t.Ring.Reduce(t.Readings)
	if err == nil {
		return res, nil
	}
	var re *ReadingsError
	if errors.As(err, &re) {
		switch {
		case re.Method == "calibration":
			return nil, t.parser.errAt(err, "calibration.readings", []any{"calibration", "readings"}, "%v", err)
		case re.Index >= 0:
			return nil, t.parser.errAt(err, fmt.Sprintf("readings[%d]", re.Index), []any{"readings", re.Index}, "%v", err)
		}
	}
	return nil, t.parser.errAt(err, "readings", []any{"readings"}, "%v", err)
}
