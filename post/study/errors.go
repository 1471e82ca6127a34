package study

import "fmt"

const errNilSolution = "study: nil solution or problem"

// NotFiniteError reports a NaN or infinite integral of a solution, with
// the quantity's name.
type NotFiniteError struct {
	Quantity string
	Value    float64
}

func (e *NotFiniteError) Error() string {
	return fmt.Sprintf("study: %s is not finite (%g)", e.Quantity, e.Value)
}

const errShortWeights = "study: Deformed needs one weight per corner node"

// FoldError reports a mesh deformation (Study.Deformed) that turns a
// triangle over: the displacement is too large for the elements it
// stretches.
type FoldError struct {
	X, Y   float64 // a corner of the folded triangle (m)
	DX, DY float64 // the displacement asked for (m)
}

func (e *FoldError) Error() string {
	return fmt.Sprintf("study: moving by (%g, %g) m folds an element near (%g, %g) m over; take a smaller step", e.DX, e.DY, e.X, e.Y)
}

// LimitError reports a computation stopped by one of its budgets (the
// mesh's triangles, Newton steps, adaptive refinement levels, wall time):
// which limit, what was reached and what to change.
type LimitError struct {
	Limit   string // "the mesh budget of 8.4e+05 triangles"
	Reached string // what the run had reached when it stopped
	Change  string // what to change to get an answer
	Err     error  // the underlying error, if any
}

func (e *LimitError) Error() string {
	return fmt.Sprintf("stopped at %s: %s; %s", e.Limit, e.Reached, e.Change)
}

func (e *LimitError) Unwrap() error { return e.Err }
