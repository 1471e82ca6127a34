package bench

import "fmt"

// StageError reports a stage of a case that failed.
type StageError struct {
	Case  string // case name
	Stage string // "model", "mesh", "problem", "linear", "pcg", "nonlinear", "curve"
	Err   error
}

func (e *StageError) Error() string {
	return fmt.Sprintf("bench case %s: %s: %v", e.Case, e.Stage, e.Err)
}

func (e *StageError) Unwrap() error { return e.Err }

// Panic messages for programmer misuse.
const (
	errNoCases  = "bench: Run needs at least one case"
	errFitLen   = "bench: Fit needs as many costs as sizes"
	errBadOrder = "bench: case order must be 1 or 2"
)
