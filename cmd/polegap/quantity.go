package main

import (
	"flag"
	"fmt"
	"io"
	"math"
	"slices"
	"strconv"
	"strings"

	"polegap/models"
)

// A quantityKind is the kind of physical quantity a flag takes.
type quantityKind uint8

const (
	length      quantityKind = iota // bare: the model's units
	area                            // bare: the model's units squared
	field                           // bare: tesla
	current                         // bare: ampere
	ampereTurns                     // bare: ampere-turns
	voltage                         // bare: volt
	temperature                     // bare: degree Celsius
	duration                        // bare: second
	resistance                      // bare: ohm
	pressure                        // bare: bar (SI: Pa)
)

// quantityKinds lists, per kind, its name in messages, an example, the
// unit a bare number is in (empty for the model's units) and the unit
// suffixes with their factor to SI (m, m², T, A, ampere-turns, V, °C).
// Suffixes are case-sensitive (mT is not MT); 1 G = 1e-4 T (the CGS
// gauss), 1 in = 0.0254 m (the international inch).
var quantityKinds = [...]struct {
	name, example, bare string
	units               map[string]float64
}{
	length:      {"length", "40mm", "", map[string]float64{"m": 1, "cm": 1e-2, "mm": 1e-3, "in": 0.0254}},
	area:        {"area", "100mm2", "", map[string]float64{"m2": 1, "cm2": 1e-4, "mm2": 1e-6}},
	field:       {"field", "1.2T", "T", map[string]float64{"T": 1, "mT": 1e-3, "G": 1e-4, "kG": 0.1}},
	current:     {"current", "25A", "A", map[string]float64{"A": 1, "kA": 1e3, "mA": 1e-3}},
	ampereTurns: {"ampere-turns", "32000At", "At", map[string]float64{"At": 1, "A": 1, "kAt": 1e3, "kA": 1e3}},
	voltage:     {"voltage", "48V", "V", map[string]float64{"V": 1, "kV": 1e3, "mV": 1e-3}},
	temperature: {"temperature", "60C", "°C", map[string]float64{"C": 1, "°C": 1}},
	duration:    {"duration", "30s", "s", map[string]float64{"s": 1, "ms": 1e-3, "min": 60, "h": 3600}},
	resistance:  {"resistance", "2ohm", "Ω", map[string]float64{"ohm": 1, "Ω": 1, "mohm": 1e-3, "mΩ": 1e-3, "kohm": 1e3, "kΩ": 1e3}},
	pressure:    {"pressure", "6bar", "bar", map[string]float64{"bar": 1e5, "Pa": 1, "kPa": 1e3, "MPa": 1e6}},
}

func (k quantityKind) String() string { return quantityKinds[k].name }

// bareUnit says, for the help, what a number without a unit means.
func (k quantityKind) bareUnit() string {
	switch k {
	case length:
		return "the model's units"
	case area:
		return "the model's units squared"
	}
	return quantityKinds[k].bare
}

// parseQuantity reads a number with an optional unit suffix, such as
// "1.2T", "40 mm", "850mT", "12kG", "32000At" or "100mm2". It returns the
// number and the SI factor of the suffix, or a factor of 0 when there is
// no suffix (the caller decides what a bare number means). Its errors do
// not repeat s: the flag package's message already quotes it.
func parseQuantity(s string, kind quantityKind) (num, factor float64, err error) {
	k := quantityKinds[kind]
	t := strings.TrimSpace(s)
	i := len(t)
	for i > 0 && isUnitByte(t, i-1, kind) {
		i--
	}
	// An exponent such as 1e3 ends in a digit, so it is never taken as a unit.
	numText, unit := strings.TrimSpace(t[:i]), t[i:]
	v, perr := strconv.ParseFloat(numText, 64)
	if perr != nil || numText == "" {
		return 0, 0, fmt.Errorf("not a %s: write a number with an optional unit, e.g. %s", k.name, k.example)
	}
	if unit != "" {
		var ok bool
		if factor, ok = k.units[unit]; !ok {
			names := make([]string, 0, len(k.units))
			for u := range k.units {
				names = append(names, u)
			}
			slices.Sort(names)
			return 0, 0, fmt.Errorf("unknown %s unit %q (use one of %s)", k.name, unit, strings.Join(names, ", "))
		}
	}
	r := v
	if factor != 0 {
		r *= factor
	}
	if math.IsNaN(r) || math.Abs(r) > 1e300 {
		return 0, 0, fmt.Errorf("not a finite %s", k.name)
	}
	return v, factor, nil
}

// isUnitByte reports whether t[i] belongs to a unit suffix: a letter, a
// byte of a non-ASCII sign such as °, or the 2 of mm2 in an area.
func isUnitByte(t string, i int, kind quantityKind) bool {
	c := t[i]
	letter := func(c byte) bool { return c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' }
	return letter(c) || c >= 0x80 || kind == area && c == '2' && i == len(t)-1 && i > 0 && letter(t[i-1])
}

// A quantityFlag is a flag.Value for a physical quantity with an optional
// unit. Every flag that takes a physical quantity uses it, so they all
// follow one rule: a number without a unit is in the unit the model file
// uses for that kind (lengths in the model's units, areas in those units
// squared, fields in tesla, currents in ampere, ampere-turns, volts, °C).
type quantityFlag struct {
	kind   quantityKind
	name   string  // the flag's name, for messages
	text   string  // as given
	num    float64 // the number
	factor float64 // SI factor of the unit given; 0 for a bare number
	set    bool
	// metresBefore marks a length or area flag whose bare numbers were
	// read in metres before the one rule: a bare number given to it prints
	// a note (see noteBare).
	metresBefore bool
	// needUnit refuses a bare length or area: the command reads no model.
	needUnit bool
	// rng, when set, is the range the number must lie in (see in).
	rng *numRange
}

func (q *quantityFlag) Set(s string) error {
	num, f, err := parseQuantity(s, q.kind)
	if err != nil {
		return err
	}
	if q.needUnit && f == 0 {
		return fmt.Errorf("give the %s with its unit, e.g. %s (there is no model whose units a bare number could take)", q.kind, quantityKinds[q.kind].example)
	}
	if q.rng != nil {
		v := num
		if f != 0 {
			v *= f
		}
		if err := q.rng.check(v, s); err != nil {
			return fmt.Errorf("the %s %v", q.kind, err)
		}
	}
	q.text, q.num, q.factor, q.set = s, num, f, true
	return nil
}

func (q *quantityFlag) String() string { return q.text }

// bare reports whether the flag was given a number without a unit.
func (q *quantityFlag) bare() bool { return q.set && q.factor == 0 }

// SI returns the value in SI units (0 when the flag was not given); a bare
// length or area is scaled by m's metres per model unit.
func (q *quantityFlag) SI(m *models.Model) float64 {
	if !q.bare() {
		return q.num * q.factor
	}
	switch q.kind {
	case length:
		return q.num * m.Scale
	case area:
		return q.num * m.Scale * m.Scale
	case pressure:
		return q.num * 1e5 // a bare pressure is in bar
	}
	return q.num
}

// noteBare warns, on w, when a bare number is given to a flag that read
// bare numbers in metres before and the model's units are not metres, so
// that an old script's "--gap 0.04" is not silently taken as 0.04 mm.
func (q *quantityFlag) noteBare(w io.Writer, m *models.Model) {
	if q.metresBefore && q.bare() && m.Scale != 1 {
		sq := ""
		if q.kind == area {
			sq = "²"
		}
		fmt.Fprintf(w, "note: --%s %s has no unit and is read in the model's units (%s%s); write e.g. %s to be explicit\n",
			q.name, q.text, m.Units, sq, quantityKinds[q.kind].example)
	}
}

// quantity defines a quantity flag on fs.
func quantity(fs *flag.FlagSet, name string, kind quantityKind, usage string) *quantityFlag {
	q := &quantityFlag{kind: kind, name: name}
	fs.Var(q, name, usage)
	return q
}

// quantityList is a flag.Value for a comma-separated list of quantities
// of one kind (sweep --currents), read by the same rule as quantityFlag.
type quantityList struct {
	kind quantityKind
	text string
	vals []quantityFlag
	rng  *numRange // as quantityFlag.rng, for each value
}

func (l *quantityList) Set(s string) error {
	l.text, l.vals = s, nil
	for _, f := range strings.Split(s, ",") {
		q := quantityFlag{kind: l.kind, rng: l.rng}
		if err := q.Set(f); err != nil {
			return fmt.Errorf("%q: %v", f, err)
		}
		l.vals = append(l.vals, q)
	}
	return nil
}

func (l *quantityList) String() string { return l.text }

// SI returns the values in SI units (see quantityFlag.SI).
func (l *quantityList) SI(m *models.Model) []float64 {
	out := make([]float64, len(l.vals))
	for i := range l.vals {
		out[i] = l.vals[i].SI(m)
	}
	return out
}

// aliasPrefix starts the usage of a hidden alias: help does not list it.
const aliasPrefix = "alias of --"

// alias defines old as a hidden second name of the flag name, so that
// command lines written with the old name keep working.
func alias(fs *flag.FlagSet, old, name string) {
	f := fs.Lookup(name)
	if f == nil {
		panic("polegap: alias of undefined flag " + name)
	}
	fs.Var(f.Value, old, aliasPrefix+name)
}
