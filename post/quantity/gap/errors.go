package gap

import "fmt"

// Panic messages for programmer misuse.
const (
	errNilField   = "gap: nil Field"
	errFewPoints  = "gap: a profile needs at least 2 points"
	errBadTol     = "gap: tolerance must be finite and > 0"
	errBadGap     = "gap: FringeOptions.Gap and PoleWidth must be finite and > 0"
	errBadEdges   = "gap: FringeOptions.Edges must be >= 0"
	errComponent  = "gap: unknown Component"
	errBadFrac    = "gap: end fraction must be in [0, 1)"
	errSamePoints = "gap: segment end points coincide"
)

// OutsideError reports a point that lies outside the mesh (or where the
// field is not finite), so the quantity asked for cannot be read there.
type OutsideError struct {
	What string // which point: "P", "Q", "centre", ...
	X, Y float64
}

func (e *OutsideError) Error() string {
	return fmt.Sprintf("gap: %s point (%g, %g) m lies outside the mesh; move it into the solved domain", e.What, e.X, e.Y)
}

// ZeroFieldError reports a reference field B0 that is zero or not finite,
// so deviations relative to it are undefined (for instance an unexcited
// magnet).
type ZeroFieldError struct {
	B0 float64
}

func (e *ZeroFieldError) Error() string {
	return fmt.Sprintf("gap: reference field B0 = %g T cannot normalise deviations; is the magnet excited?", e.B0)
}

// EmptyError reports a set of samples with none (or too few) inside the mesh.
type EmptyError struct {
	Samples int // samples given
	Inside  int // samples inside the mesh
}

func (e *EmptyError) Error() string {
	return fmt.Sprintf("gap: %d of %d samples lie inside the mesh; move the line or box into the solved domain", e.Inside, e.Samples)
}
