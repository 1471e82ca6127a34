package materials

import (
	"strings"
	"sync"
)

// Kind says which Material type a library entry is.
type Kind int

const (
	KindNonlinear Kind = iota + 1 // a *Curve
	KindLinear                    // a Linear
	KindMagnet                    // a Magnet
)

func (k Kind) String() string {
	switch k {
	case KindNonlinear:
		return "nonlinear"
	case KindLinear:
		return "linear"
	case KindMagnet:
		return "magnet"
	}
	return "unknown"
}

// Entry describes a built-in material.
type Entry struct {
	Name        string // look-up key: lower case, words joined by '-'
	Description string // what the material is, in a line
	Source      string // where the data come from
	Kind        Kind
	// Grade is the IEC 60404-8-4 / EN 10106 designation the curve is
	// meant to meet (LookupGrade), "" for ungraded material.
	Grade string
}

// FromMemory reports whether the entry's data are typical values from
// memory rather than a cited source: a design that rests on such a curve
// should be checked against the supplier's or a measured curve.
func (e Entry) FromMemory() bool { return strings.HasPrefix(e.Source, fromMemory) }

// CurveEntry returns the library entry a curve came from (also through
// Stacked, which keeps the name), and false for a user's curve.
func CurveEntry(c *Curve) (Entry, bool) {
	if c == nil || !c.builtin {
		return Entry{}, false
	}
	for _, t := range curveTables {
		if t.entry.Name == c.name {
			return t.entry, true
		}
	}
	return Entry{}, false
}

// Library returns the entries of the built-in library, nonlinear curves
// first, in a fixed order. The slice is the caller's.
func Library() []Entry {
	out := make([]Entry, 0, len(curveTables)+len(linearEntries))
	for _, t := range curveTables {
		out = append(out, t.entry)
	}
	for _, t := range linearEntries {
		out = append(out, t.entry)
	}
	return out
}

var libCurves = sync.OnceValue(func() map[string]*Curve {
	m := make(map[string]*Curve, len(curveTables))
	for _, t := range curveTables {
		var c *Curve
		var err error
		if t.b != nil {
			c, err = NewCurve(t.h, t.b)
		} else {
			c, err = curveFromJ(t.h, t.j)
		}
		if err != nil {
			panic(errBuiltinCurve + ": " + t.entry.Name + ": " + err.Error())
		}
		c.name, c.builtin = t.entry.Name, true
		m[t.entry.Name] = c
	}
	return m
})

// curveFromJ builds a curve from H in A/m and polarisation J = B - μ0 H in T.
func curveFromJ(h, j []float64) (*Curve, error) {
	b := make([]float64, len(h))
	for i := range h {
		b[i] = j[i] + Mu0*h[i]
	}
	return NewCurve(h, b)
}

// Lookup returns the built-in material called name, its entry and true, or
// false if there is none. Nonlinear materials are shared, immutable *Curve
// values (use Stacked for laminations); linear ones are Linear or Magnet
// values (a Magnet's Direction is 0: set it from the model).
func Lookup(name string) (Material, Entry, bool) {
	for _, t := range curveTables {
		if t.entry.Name == name {
			return libCurves()[name], t.entry, true
		}
	}
	for _, t := range linearEntries {
		if t.entry.Name == name {
			return t.mat, t.entry, true
		}
	}
	return nil, Entry{}, false
}
