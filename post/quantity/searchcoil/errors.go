package searchcoil

import "fmt"

// Panic messages for programmer misuse.
const (
	errNilField  = "searchcoil: nil Field"
	errTurns     = "searchcoil: Turns must be finite and > 0"
	errLength    = "searchcoil: Length must be finite and > 0"
	errArea      = "searchcoil: Area must be finite and > 0"
	errWidth     = "searchcoil: Width must be finite and >= 0"
	errAxis      = "searchcoil: Axis must be a non-zero finite vector"
	errSides     = "searchcoil: the two sides of a long coil coincide"
	errRadius    = "searchcoil: radii must be finite, >= 0 and R0 < R1, Z0 < Z1"
	errQuadOrder = "searchcoil: quadrature order must be 0 or 1..5"
)

// OutsideError reports a coil point outside the mesh, or where the field
// is not finite.
type OutsideError struct {
	What string // "P", "Q", "centre", "loop", ...
	X, Y float64
}

func (e *OutsideError) Error() string {
	return fmt.Sprintf("searchcoil: %s point (%g, %g) m lies outside the mesh; place the coil inside the solved domain", e.What, e.X, e.Y)
}
