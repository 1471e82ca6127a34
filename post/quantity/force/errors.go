package force

import "fmt"

const (
	errNilSolution = "force: nil solution or problem"
	errEmptyPart   = "force: empty part (no region tags)"
	errBadDelta    = "force: displacement must be finite and not negative"
	errBadDir      = "force: direction must be a non-zero vector"
	errBadAxis     = "force: axis must be 0 (x) or 1 (y)"
)

// ContactError reports a part that touches a region other than air, so
// that no band of air surrounds it.
type ContactError struct {
	Tag  int32   // region tag of the neighbour
	X, Y float64 // a shared node (m)
}

func (e *ContactError) Error() string {
	return fmt.Sprintf("force: the part touches region %d at (%g, %g) m; the stress method needs air all round (model the joint as a thin air slit)", e.Tag, e.X, e.Y)
}

// PartError reports a part whose tags hold no elements.
type PartError struct{ Tags []int32 }

func (e *PartError) Error() string {
	return fmt.Sprintf("force: part regions %v have no elements in the mesh", e.Tags)
}

// RegionError reports a region name that the model does not have.
type RegionError struct{ Name string }

func (e *RegionError) Error() string { return fmt.Sprintf("force: no region %q in the model", e.Name) }

// NotFiniteError reports a NaN or infinite force.
type NotFiniteError struct{ Value [2]float64 }

func (e *NotFiniteError) Error() string {
	return fmt.Sprintf("force: result is not finite (%v)", e.Value)
}
