package circuit

import "fmt"

const (
	errNilSolution = "circuit: nil solution or problem"
	errCoilIndex   = "circuit: coil index out of range"
	errDstLen      = "circuit: destination length does not match the number of coils"
	errBadStep     = "circuit: relative step must be positive and below 0.1"
)

// SideError reports a coil side whose region tag has no area in the mesh.
type SideError struct {
	Coil string
	Tag  int32
}

func (e *SideError) Error() string {
	return fmt.Sprintf("circuit: coil %q: side region tag %d has no area in the mesh", e.Coil, e.Tag)
}

// PerturbError reports a failed perturbation solve of Incremental: the
// coil, the current it was solved at and the solver's error.
type PerturbError struct {
	Coil    string
	Current float64 // A, the perturbed current
	Err     error
}

func (e *PerturbError) Error() string {
	return fmt.Sprintf("circuit: incremental inductance of coil %q: solve at %g A: %v", e.Coil, e.Current, e.Err)
}

func (e *PerturbError) Unwrap() error { return e.Err }

// NotFiniteError reports a NaN or infinite result, with the quantity's name.
type NotFiniteError struct {
	Quantity string
	Value    float64
}

func (e *NotFiniteError) Error() string {
	return fmt.Sprintf("circuit: %s is not finite (%g)", e.Quantity, e.Value)
}
