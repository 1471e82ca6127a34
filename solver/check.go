package solver

import (
	"fmt"
	"math"

	"polegap/internal/num"
)

// Check verifies the invariants of a solution: one finite potential per
// node, fixed nodes at their prescribed values, identified nodes equal. It
// returns the first violation found.
func (s *Solution) Check() error {
	if s == nil || s.as == nil {
		return fmt.Errorf("solver: Check: solution not produced by Solve")
	}
	m := s.as.m
	if len(s.A) != m.NumNodes() {
		return fmt.Errorf("solver: Check: %d potentials for %d nodes", len(s.A), m.NumNodes())
	}
	d := &s.as.d
	first := make([]float64, d.n)
	seen := make([]bool, d.n)
	for i, a := range s.A {
		if !num.Finite(a) {
			return fmt.Errorf("solver: Check: A[%d] = %g", i, a)
		}
		c := d.dof[i]
		if c < 0 {
			if a != d.value[i] {
				return fmt.Errorf("solver: Check: fixed node %d at %g, prescribed %g", i, a, d.value[i])
			}
			continue
		}
		if !seen[c] {
			seen[c], first[c] = true, a
		} else if a != first[c] {
			return fmt.Errorf("solver: Check: identified node %d at %g, its unknown at %g", i, a, first[c])
		}
	}
	if !s.Converged || !(s.Residual <= 1) && !math.IsNaN(s.Residual) {
		return fmt.Errorf("solver: Check: solution not converged (residual %g)", s.Residual)
	}
	return nil
}
