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
