package study

import (
	"math"

	"polegap/internal/num"
	"polegap/solver"
)

const twoPi = 2 * math.Pi

// QuadDegree returns the Dunavant rule degree the solver uses for the
// stiffness of a mesh of this order and formulation: 1 (P1) or 2 (P2)
// planar, 4 axisymmetric. solver.Solution.Energies uses the same rule,
// so the energies are those of the discrete problem that was solved (and
// the identities W = λI/2 of a linear model hold to rounding).
func QuadDegree(order int, f solver.Formulation) int {
	switch {
	case f == solver.Axisymmetric:
		return 4
	case order == 2:
		return 2
	}
	return 1
}

// EnergyDensity returns the energy density w = ∫₀^|B| ν(b²) b db and the
// co-energy density w' = ν(|B|²)|B|² − w (J/m³) of a material at
// b2 = |B|² (T²): solver.EnergyDensity, the one rule every energy of
// polegap uses.
func EnergyDensity(mat solver.Material, b2 float64) (w, wco float64) {
	return solver.EnergyDensity(mat, b2)
}

// Energies returns the stored energy W and the co-energy W' of a solution
// (J): solver.Solution.Energies, planar values times the problem's Depth,
// axisymmetric ones over the full revolution. Every energy polegap
// reports comes from here. It returns a *NotFiniteError if either is not
// finite.
func Energies(sol *solver.Solution) (w, wco float64, err error) {
	if sol == nil || sol.Problem == nil || sol.Problem.Mesh == nil {
		panic(errNilSolution)
	}
	w, wco = sol.Energies()
	scale := Depth(sol.Problem)
	w, wco = w*scale, wco*scale
	if !num.Finite(w) {
		return 0, 0, &NotFiniteError{Quantity: "stored energy", Value: w}
	}
	if !num.Finite(wco) {
		return 0, 0, &NotFiniteError{Quantity: "co-energy", Value: wco}
	}
	return w, wco, nil
}

// Depth is the factor from the solver's per-metre integrals to the
// magnet: Depth for planar problems, 1 for axisymmetric ones (whose
// integrals already carry 2π r).
func Depth(p *solver.Problem) float64 {
	if p.Formulation == solver.Axisymmetric {
		return 1
	}
	return p.Depth
}

// CoEnergyBounds returns solver.Solution.EnergyBounds scaled as Energies
// scales: two numbers that bracket the co-energy W' of the meshed
// problem (the stored energy W with linear materials), J. It returns the
// solver's *BoundsError for problems the complementary formulation does
// not cover, and a *NotFiniteError if a bound is not finite.
func CoEnergyBounds(sol *solver.Solution) (solver.EnergyBounds, error) {
	if sol == nil || sol.Problem == nil || sol.Problem.Mesh == nil {
		panic(errNilSolution)
	}
	b, err := sol.EnergyBounds(solver.Options{})
	if err != nil {
		return b, err
	}
	scale := Depth(sol.Problem)
	b.Lower, b.Upper = b.Lower*scale, b.Upper*scale
	if !num.Finite(b.Lower) || !num.Finite(b.Upper) {
		return b, &NotFiniteError{Quantity: "co-energy bounds", Value: b.Upper - b.Lower}
	}
	return b, nil
}
