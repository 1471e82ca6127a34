package vtu

import "fmt"

const errNilSolution = "export: nil solution, problem or mesh"

// MaterialError reports a material whose reluctivity at a triangle's flux
// density is not finite and positive, so μr cannot be written.
type MaterialError struct {
	Triangle int
	Region   int32
	Nu       float64 // m/H
}

func (e *MaterialError) Error() string {
	return fmt.Sprintf("export: triangle %d (region %d): reluctivity %g m/H is not finite and positive", e.Triangle, e.Region, e.Nu)
}
