package measure

import (
	"bytes"
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"

	"go.yaml.in/yaml/v3"

	"polegap/internal/num"
)

// FormatTag is the value of the format key that marks our measured-data
// YAML file, version 1 (see FORMAT.md).
const FormatTag = "polegap-measured/1"

// Methods of a measured-data file.
const (
	MethodDirect  = "direct"
	MethodBalance = "current-balance"
	MethodSearch  = "search-coil"
)

// The file as decoded. Numbers are SI: A, T, m, kg, s, V.
type fileDoc struct {
	Format      string          `yaml:"format"`
	Magnet      string          `yaml:"magnet"`
	Model       string          `yaml:"model"`
	Date        string          `yaml:"date"`
	Operator    string          `yaml:"operator"`
	Method      string          `yaml:"method"`
	Notes       string          `yaml:"notes"`
	RejectLevel float64         `yaml:"reject-level"`
	Probe       *probeDoc       `yaml:"probe"`
	Balance     *balanceDoc     `yaml:"balance"`
	Integrator  *integratorDoc  `yaml:"integrator"`
	Coil        *coilDoc        `yaml:"coil"`
	Calibration *calibrationDoc `yaml:"calibration"`
	Readings    []readingDoc    `yaml:"readings"`
}

type probeDoc struct {
	Sigma      float64 `yaml:"sigma"`
	ScaleSigma float64 `yaml:"scale-sigma"`
}

type balanceDoc struct {
	Length       float64 `yaml:"length"`
	LengthSigma  float64 `yaml:"length-sigma"`
	G            float64 `yaml:"g"`
	GSigma       float64 `yaml:"g-sigma"`
	MassSigma    float64 `yaml:"mass-sigma"`
	CurrentSigma float64 `yaml:"current-sigma"`
	Fit          string  `yaml:"fit"`
}

type integratorDoc struct {
	TimeConstant      float64 `yaml:"time-constant"`
	TimeConstantSigma float64 `yaml:"time-constant-sigma"`
	Gain              float64 `yaml:"gain"`
	GainSigma         float64 `yaml:"gain-sigma"`
	ReadingSigma      float64 `yaml:"reading-sigma"`
}

type coilDoc struct {
	Turns      float64 `yaml:"turns"`
	TurnsSigma float64 `yaml:"turns-sigma"`
	Area       float64 `yaml:"area"`
	AreaSigma  float64 `yaml:"area-sigma"`
}

type solenoidDoc struct {
	Turns             float64 `yaml:"turns"`
	TurnsSigma        float64 `yaml:"turns-sigma"`
	Length            float64 `yaml:"length"`
	LengthSigma       float64 `yaml:"length-sigma"`
	Radius            float64 `yaml:"radius"`
	RadiusSigma       float64 `yaml:"radius-sigma"`
	CurrentScaleSigma float64 `yaml:"current-scale-sigma"`
}

type calibrationDoc struct {
	Solenoid               *solenoidDoc `yaml:"solenoid"`
	FieldPerAmpere         float64      `yaml:"field-per-ampere"`
	FieldPerAmpereRelSigma float64      `yaml:"field-per-ampere-rel-sigma"`
	Gain                   float64      `yaml:"gain"`
	GainSigma              float64      `yaml:"gain-sigma"`
	ReadingSigma           float64      `yaml:"reading-sigma"`
	Readings               [][]*float64 `yaml:"readings"`
}

type readingDoc struct {
	Current *float64     `yaml:"current"`
	Field   floats       `yaml:"field"`
	Balance [][]*float64 `yaml:"balance"`
	Flux    floats       `yaml:"flux"`
}

// floats decodes one number or a list of numbers.
type floats []float64

func (f *floats) UnmarshalYAML(n *yaml.Node) error {
	if n.Kind == yaml.ScalarNode {
		var v float64
		if err := n.Decode(&v); err != nil {
			return err
		}
		*f = floats{v}
		return nil
	}
	var v []*float64
	if err := n.Decode(&v); err != nil {
		return err
	}
	*f = make(floats, len(v))
	for i, x := range v {
		if x == nil {
			return fmt.Errorf("line %d: reading %d is empty; give a number", n.Content[i].Line, i+1)
		}
		(*f)[i] = *x
	}
	return nil
}

// pair returns the two numbers of a [x, y] reading, or an error at its
// node.
func (p *parser) pair(v []*float64, label string, path []any, what string) (x, y float64, err error) {
	if len(v) != 2 {
		return 0, 0, p.errAt(nil, label, path, "has %d numbers; give [%s]", len(v), what)
	}
	for k, e := range v {
		if e == nil {
			return 0, 0, p.errAt(nil, label, append(path, k), "is empty; give [%s]", what)
		}
	}
	return *v[0], *v[1], nil
}

// Load reads a measured-data file: our YAML format or a plain CSV (see
// Parse).
func Load(path string) (*Curve, error) {
	data, err := os.ReadFile(path)
	if err != nil {
		return nil, &InputError{File: path, Msg: fmt.Sprintf("cannot read: %v", err), Err: err}
	}
	return Parse(path, data)
}

// Parse reads a measured excitation curve from data; name is used in
// errors and as the curve's name when the file gives none. A name ending
// in .yaml or .yml, or data whose first line that is not blank or a
// comment is a "key:" line, is our YAML format (FORMAT.md): its raw
// readings are reduced to B with uncertainty by the file's method. Any
// other data is a plain CSV (ReadCSV).
//
// Errors name the file and line (and column where yaml gives it) and the
// field path: an *InputError, or an ErrorList of them. A reduction error
// is wrapped in an *InputError at the reading's line (errors.As finds the
// *ReadingsError or *NotLineError).
func Parse(name string, data []byte) (*Curve, error) {
	if !isYAML(name, data) {
		return ReadCSV(bytes.NewReader(data), name)
	}
	var root yaml.Node
	if err := yaml.Unmarshal(data, &root); err != nil {
		return nil, yamlError(name, err)
	}
	var doc fileDoc
	dec := yaml.NewDecoder(bytes.NewReader(data))
	dec.KnownFields(true)
	if err := dec.Decode(&doc); err != nil {
		return nil, yamlError(name, err)
	}
	p := parser{name: name, root: &root}
	return p.curve(&doc)
}

func isYAML(name string, data []byte) bool {
	switch strings.ToLower(filepath.Ext(name)) {
	case ".yaml", ".yml":
		return true
	case ".csv", ".txt", ".tsv":
		return false
	}
	for _, line := range strings.Split(string(data), "\n") {
		line = strings.TrimSpace(line)
		if line == "" || line[0] == '#' {
			continue
		}
		return line == "---" || yamlKey.MatchString(line)
	}
	return false
}

var (
	yamlKey  = regexp.MustCompile(`^[A-Za-z][A-Za-z0-9_-]*\s*:(\s|$)`)
	yamlLine = regexp.MustCompile(`^(?:yaml: )?line (\d+): (.*)$`)
	yamlKnow = regexp.MustCompile(`field (\S+) not found in type \S+`)
)

// yamlError turns a yaml error into positioned InputErrors.
func yamlError(name string, err error) error {
	var msgs []string
	var te *yaml.TypeError
	if errors.As(err, &te) {
		msgs = te.Errors
	} else {
		msgs = []string{err.Error()}
	}
	var out ErrorList
	for _, m := range msgs {
		e := &InputError{File: name, Msg: m, Err: err}
		if s := yamlLine.FindStringSubmatch(strings.TrimSpace(m)); s != nil {
			e.Line, _ = strconv.Atoi(s[1])
			e.Msg = s[2]
		}
		if s := yamlKnow.FindStringSubmatch(e.Msg); s != nil {
			e.Msg = fmt.Sprintf("unknown key %q; see FORMAT.md for the keys of each section", s[1])
		} else {
			e.Msg += "; see FORMAT.md"
		}
		out = append(out, e)
	}
	return out
}

// parser reduces a decoded file, with the node tree for line numbers.
type parser struct {
	name string
	root *yaml.Node
}

// node returns the node at path (string keys, int indices), or nil.
func (p *parser) node(path ...any) *yaml.Node {
	n := p.root
	if n != nil && n.Kind == yaml.DocumentNode && len(n.Content) > 0 {
		n = n.Content[0]
	}
	for _, k := range path {
		if n == nil {
			return nil
		}
		switch k := k.(type) {
		case string:
			var next *yaml.Node
			if n.Kind == yaml.MappingNode {
				for i := 0; i+1 < len(n.Content); i += 2 {
					if n.Content[i].Value == k {
						next = n.Content[i+1]
					}
				}
			}
			n = next
		case int:
			if n.Kind != yaml.SequenceNode || k >= len(n.Content) {
				return nil
			}
			n = n.Content[k]
		}
	}
	return n
}

// errAt builds an InputError at the node of path, labelled with label.
func (p *parser) errAt(err error, label string, path []any, format string, a ...any) *InputError {
	e := &InputError{File: p.name, Path: label, Msg: fmt.Sprintf(format, a...), Err: err}
	if n := p.node(path...); n != nil {
		e.Line, e.Column = n.Line, n.Column
	}
	return e
}

func (p *parser) curve(d *fileDoc) (*Curve, error) {
	if d.Format != FormatTag {
		return nil, p.errAt(nil, "format", []any{"format"}, "format is %q; a measured-data file starts with format: %s", d.Format, FormatTag)
	}
	name := d.Magnet
	if name == "" {
		name = p.name
	}
	c := &Curve{Name: name, Kind: Field, Meta: map[string]string{"format": d.Format, "method": d.Method}}
	for k, v := range map[string]string{"magnet": d.Magnet, "model": d.Model, "date": d.Date, "operator": d.Operator, "notes": strings.TrimSpace(d.Notes)} {
		if v != "" {
			c.Meta[k] = v
		}
	}
	if !(d.RejectLevel >= 0 && d.RejectLevel < 1) {
		return nil, p.errAt(nil, "reject-level", []any{"reject-level"}, "reject-level %g must be in [0, 1); omit it for %g", d.RejectLevel, DefaultAlpha)
	}
	sections := map[string]bool{"probe": d.Probe != nil, "balance": d.Balance != nil, "integrator": d.Integrator != nil, "coil": d.Coil != nil, "calibration": d.Calibration != nil}
	allowed := map[string][]string{MethodDirect: {"probe"}, MethodBalance: {"balance"}, MethodSearch: {"integrator", "coil", "calibration"}}
	own, ok := allowed[d.Method]
	if !ok {
		return nil, p.errAt(nil, "method", []any{"method"}, "method %q is not one of %s, %s, %s", d.Method, MethodDirect, MethodBalance, MethodSearch)
	}
	for _, s := range []string{"probe", "balance", "integrator", "coil", "calibration"} {
		if sections[s] && !contains(own, s) {
			return nil, p.errAt(nil, s, []any{s}, "section %s does not belong to method %s; remove it or change the method", s, d.Method)
		}
	}
	if len(d.Readings) < MinPoints {
		return nil, p.errAt(nil, "readings", []any{"readings"}, "%d readings; a measured curve needs at least %d magnet currents", len(d.Readings), MinPoints)
	}
	var red func(i int, r *readingDoc) (Point, error)
	var err error
	switch d.Method {
	case MethodDirect:
		red, err = p.direct(d)
	case MethodBalance:
		red, err = p.balance(d, c)
	case MethodSearch:
		red, err = p.search(d, c)
	}
	if err != nil {
		return nil, err
	}
	var errs ErrorList
	seen := map[float64]int{}
	for i := range d.Readings {
		r := &d.Readings[i]
		path := []any{"readings", i}
		label := fmt.Sprintf("readings[%d]", i)
		if r.Current == nil {
			errs = append(errs, p.errAt(nil, label, path, "no current; give the magnet coil current in A"))
			continue
		}
		if !num.Finite(*r.Current) {
			errs = append(errs, p.errAt(nil, label+".current", append(path, "current"), "current %g is not finite; give the magnet coil current in A", *r.Current))
			continue
		}
		line := 0
		if n := p.node(path...); n != nil {
			line = n.Line
		}
		if j, dup := seen[*r.Current]; dup {
			errs = append(errs, p.errAt(nil, label+".current", append(path, "current"), "current %g A repeats readings[%d]; put all readings of one current in one entry", *r.Current, j))
			continue
		}
		seen[*r.Current] = i
		pt, err := red(i, r)
		if err != nil {
			var ie *InputError
			if errors.As(err, &ie) {
				errs = append(errs, ie)
			} else {
				errs = append(errs, p.errAt(err, label, path, "at %g A: %v", *r.Current, err))
			}
			continue
		}
		pt.Current, pt.Row = *r.Current, line
		c.Points = append(c.Points, pt)
	}
	if len(errs) > 0 {
		return nil, errs
	}
	if err := c.Check(); err != nil {
		return nil, &InputError{File: p.name, Msg: err.Error()}
	}
	return c, nil
}

func contains(s []string, v string) bool {
	for _, x := range s {
		if x == v {
			return true
		}
	}
	return false
}

// only reports readings keys that do not belong to the method.
func (p *parser) only(i int, r *readingDoc, method, key string) error {
	have := map[string]bool{"field": r.Field != nil, "balance": r.Balance != nil, "flux": r.Flux != nil}
	for _, k := range []string{"field", "balance", "flux"} {
		if have[k] && k != key {
			return p.errAt(nil, fmt.Sprintf("readings[%d].%s", i, k), []any{"readings", i, k}, "method %s takes %s readings, not %s", method, key, k)
		}
	}
	if !have[key] {
		return p.errAt(nil, fmt.Sprintf("readings[%d]", i), []any{"readings", i}, "no %s readings at this current; method %s needs them", key, method)
	}
	return nil
}

func (p *parser) direct(d *fileDoc) (func(int, *readingDoc) (Point, error), error) {
	var probe Probe
	if d.Probe != nil {
		probe = Probe{Sigma: d.Probe.Sigma, RelSigma: d.Probe.ScaleSigma}
	}
	if _, _, err := probe.Field([]float64{1, 1}); err != nil {
		return nil, p.errAt(err, "probe", []any{"probe"}, "%v", err)
	}
	return func(i int, r *readingDoc) (Point, error) {
		if err := p.only(i, r, MethodDirect, "field"); err != nil {
			return Point{}, err
		}
		b, u, err := probe.Field(r.Field)
		if err != nil {
			return Point{}, p.errAt(err, fmt.Sprintf("readings[%d].field", i), []any{"readings", i, "field"}, "at %g A: %v", *r.Current, err)
		}
		return Point{Field: b, FieldSigma: u}, nil
	}, nil
}

func (p *parser) balance(d *fileDoc, c *Curve) (func(int, *readingDoc) (Point, error), error) {
	if d.Balance == nil {
		return nil, p.errAt(nil, "balance", nil, "method %s needs a balance section with the conductor length", MethodBalance)
	}
	b := d.Balance
	bal := Balance{Length: b.Length, LengthSigma: b.LengthSigma, G: b.G, GSigma: b.GSigma,
		MassSigma: b.MassSigma, CurrentSigma: b.CurrentSigma, Alpha: d.RejectLevel}
	switch b.Fit {
	case "", "intercept":
		bal.Fit = WithIntercept
	case "origin":
		bal.Fit = ThroughOrigin
	default:
		return nil, p.errAt(nil, "balance.fit", []any{"balance", "fit"}, "fit %q is not intercept or origin", b.Fit)
	}
	if err := bal.validate(); err != nil {
		return nil, p.errAt(err, "balance", []any{"balance"}, "%v", err)
	}
	c.Meta["fit"] = bal.Fit.String()
	return func(i int, r *readingDoc) (Point, error) {
		if err := p.only(i, r, MethodBalance, "balance"); err != nil {
			return Point{}, err
		}
		rs := make([]BalanceReading, len(r.Balance))
		for j, pr := range r.Balance {
			x, y, err := p.pair(pr, fmt.Sprintf("readings[%d].balance[%d]", i, j), []any{"readings", i, "balance", j}, "conductor current A, mass kg")
			if err != nil {
				return Point{}, err
			}
			rs[j] = BalanceReading{Current: x, Mass: y}
		}
		res, err := bal.Reduce(rs)
		if err != nil {
			path := []any{"readings", i, "balance"}
			label := fmt.Sprintf("readings[%d].balance", i)
			var re *ReadingsError
			if errors.As(err, &re) && re.Index >= 0 {
				path = append(path, re.Index)
				label = fmt.Sprintf("%s[%d]", label, re.Index)
			}
			return Point{}, p.errAt(err, label, path, "at %g A: %v", *r.Current, err)
		}
		return Point{Field: res.Field, FieldSigma: res.FieldSigma}, nil
	}, nil
}

func (p *parser) search(d *fileDoc, c *Curve) (func(int, *readingDoc) (Point, error), error) {
	if d.Integrator == nil {
		return nil, p.errAt(nil, "integrator", nil, "method %s needs an integrator section (time-constant, gain, reading-sigma)", MethodSearch)
	}
	it := d.Integrator
	sc := SearchCoil{
		Integrator:   Integrator{TimeConstant: it.TimeConstant, TimeConstantSigma: it.TimeConstantSigma, Gain: it.Gain, GainSigma: it.GainSigma},
		ReadingSigma: it.ReadingSigma,
		Alpha:        d.RejectLevel,
	}
	if d.Coil != nil {
		sc.Turns, sc.TurnsSigma, sc.Area, sc.AreaSigma = d.Coil.Turns, d.Coil.TurnsSigma, d.Coil.Area, d.Coil.AreaSigma
	}
	where, wpath := "coil", []any{"coil"}
	if cal := d.Calibration; cal != nil {
		where, wpath = "calibration", []any{"calibration"}
		switch {
		case cal.Solenoid == nil && cal.FieldPerAmpere == 0:
			return nil, p.errAt(nil, "calibration", wpath, "calibration needs a solenoid section (turns, length, radius) or field-per-ampere")
		case cal.Solenoid != nil && cal.FieldPerAmpere != 0:
			return nil, p.errAt(nil, "calibration", wpath, "calibration gives both a solenoid and field-per-ampere; keep one")
		}
		sc.Calibration = &Calibration{
			FieldPerAmpere: cal.FieldPerAmpere, FieldPerAmpereRelSigma: cal.FieldPerAmpereRelSigma,
			ReadingSigma: cal.ReadingSigma, Gain: cal.Gain, GainSigma: cal.GainSigma,
		}
		if s := cal.Solenoid; s != nil {
			sc.Calibration.Solenoid = Solenoid{Turns: s.Turns, TurnsSigma: s.TurnsSigma, Length: s.Length, LengthSigma: s.LengthSigma,
				Radius: s.Radius, RadiusSigma: s.RadiusSigma, CurrentRelSigma: s.CurrentScaleSigma}
		}
		for j, pr := range cal.Readings {
			x, y, err := p.pair(pr, fmt.Sprintf("calibration.readings[%d]", j), []any{"calibration", "readings", j}, "solenoid current A, integrator reading")
			if err != nil {
				return nil, err
			}
			sc.Calibration.Readings = append(sc.Calibration.Readings, CalReading{Current: x, Reading: y})
		}
	} else if d.Coil == nil {
		return nil, p.errAt(nil, "coil", nil, "method %s needs a calibration section or a coil section (turns, area)", MethodSearch)
	}
	k, err := sc.Calibrate()
	if err != nil {
		var re *ReadingsError
		if errors.As(err, &re) && re.Method == "calibration" && re.Index >= 0 {
			wpath = append(wpath, "readings", re.Index)
		}
		return nil, p.errAt(err, where, wpath, "%v", err)
	}
	c.Meta["turns-area"] = strconv.FormatFloat(k.TurnsArea, 'g', 6, 64)
	c.Meta["turns-area-sigma"] = strconv.FormatFloat(k.Sigma, 'g', 3, 64)
	c.Meta["calibrated"] = strconv.FormatBool(k.Calibrated)
	return func(i int, r *readingDoc) (Point, error) {
		if err := p.only(i, r, MethodSearch, "flux"); err != nil {
			return Point{}, err
		}
		res, err := sc.Field(k, r.Flux)
		if err != nil {
			return Point{}, p.errAt(err, fmt.Sprintf("readings[%d].flux", i), []any{"readings", i, "flux"}, "at %g A: %v", *r.Current, err)
		}
		return Point{Field: res.Field, FieldSigma: res.FieldSigma, Flux: res.Linkage, FluxSigma: res.LinkageSigma}, nil
	}, nil
}
