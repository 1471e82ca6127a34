package measure

import (
	"fmt"
	"math"
)

// Kind says what a Curve's points carry.
type Kind int

const (
	// Field: each point's Field (T) and FieldSigma hold the gap field.
	Field Kind = iota
	// FluxLinkage: each point's Flux (Wb-turns) and FluxSigma hold a
	// search-coil flux-linkage change; Field and FieldSigma are zero.
	FluxLinkage
)

func (k Kind) String() string {
	switch k {
	case Field:
		return "field"
	case FluxLinkage:
		return "flux-linkage"
	}
	return fmt.Sprintf("Kind(%d)", int(k))
}

// Point is one measured point of an excitation curve.
//
// Current is the magnet coil current (A). Field is the gap field (T) with
// its standard uncertainty FieldSigma (T; 0 when none was stated or
// derived). Flux is a search-coil flux-linkage change (Wb-turns) with its
// standard uncertainty FluxSigma, zero when not measured. Row is the line
// of the file the point comes from (1-based; 0 when it was not read from a
// file).
type Point struct {
	Current, Field, FieldSigma float64
	Flux, FluxSigma            float64
	Row                        int
}

// Curve is a measured excitation curve: points in file order, what they
// carry, and free-form metadata (magnet, date, operator, method, ...).
type Curve struct {
	Name   string
	Points []Point
	Kind   Kind
	Meta   map[string]string
}

// MinPoints is the fewest points a Curve holds.
const MinPoints = 2

// Check verifies the invariants of c: at least MinPoints points, every
// number finite, uncertainties non-negative, no magnet current repeated,
// and, for a FluxLinkage curve, zero Field and FieldSigma. It returns the
// first violation found, or nil. It panics on a nil Curve.
func (c *Curve) Check() error {
	if c == nil {
		panic(errNilCurve)
	}
	if c.Kind != Field && c.Kind != FluxLinkage {
		return fmt.Errorf("measure: curve %q: unknown kind %d", c.Name, int(c.Kind))
	}
	if len(c.Points) < MinPoints {
		return fmt.Errorf("measure: curve %q has %d points, fewer than %d", c.Name, len(c.Points), MinPoints)
	}
	seen := make(map[float64]int, len(c.Points))
	for i, p := range c.Points {
		for _, v := range [...]float64{p.Current, p.Field, p.FieldSigma, p.Flux, p.FluxSigma} {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return fmt.Errorf("measure: curve %q point %d: non-finite value", c.Name, i)
			}
		}
		if p.FieldSigma < 0 || p.FluxSigma < 0 {
			return fmt.Errorf("measure: curve %q point %d: negative uncertainty", c.Name, i)
		}
		if c.Kind == FluxLinkage && (p.Field != 0 || p.FieldSigma != 0) {
			return fmt.Errorf("measure: curve %q point %d: a flux-linkage curve carries no field", c.Name, i)
		}
		if j, dup := seen[p.Current]; dup {
			return fmt.Errorf("measure: curve %q points %d and %d share the current %g A", c.Name, j, i, p.Current)
		}
		seen[p.Current] = i
	}
	return nil
}

// Currents returns the magnet currents of c in point order (A).
func (c *Curve) Currents() []float64 {
	out := make([]float64, len(c.Points))
	for i, p := range c.Points {
		out[i] = p.Current
	}
	return out
}

// Values returns the measured values of c in point order with their
// standard uncertainties: Field and FieldSigma (T) for a Field curve, Flux
// and FluxSigma (Wb-turns) for a FluxLinkage curve.
func (c *Curve) Values() (v, sigma []float64) {
	v = make([]float64, len(c.Points))
	sigma = make([]float64, len(c.Points))
	for i, p := range c.Points {
		if c.Kind == FluxLinkage {
			v[i], sigma[i] = p.Flux, p.FluxSigma
		} else {
			v[i], sigma[i] = p.Field, p.FieldSigma
		}
	}
	return v, sigma
}
