package study

import (
	"math"

	"gonum.org/v1/gonum/integrate/quad"

	"polegap/internal/compsum"
	"polegap/internal/num"
	"polegap/solver"
)

const twoPi = 2 * math.Pi

// QuadDegree returns the Dunavant rule degree the solver uses for the
// stiffness of a mesh of this order and formulation: 1 (P1) or 2 (P2)
// planar, 4 axisymmetric. The energies here use the same rule, so they
// are the energies of the discrete problem that was solved (and the
// identities W = λI/2 of a linear model hold to rounding).
func QuadDegree(order int, f solver.Formulation) int {
	switch {
	case f == solver.Axisymmetric:
		return 4
	case order == 2:
		return 2
	}
	return 1
}

// Panel width (T) of the composite Gauss–Legendre rule of EnergyDensity,
// and its 3-point nodes and weights on [0, 1], computed once by gonum's
// quad.Legendre (they agree to rounding with Abramowitz and Stegun,
// Handbook of Mathematical Functions, 1964, table 25.4: ±√(3/5), 0 with
// weights 5/9, 8/9 mapped to [0, 1]).
const panelB = 0.02

var gl3x, gl3w = legendre3()

func legendre3() (x, w [3]float64) {
	quad.Legendre{}.FixedLocations(x[:], w[:], 0, 1)
	return x, w
}

// EnergyDensity returns the energy density w = ∫₀^|B| ν(b²) b db and the
// co-energy density w' = ν(|B|²)|B|² − w (J/m³) of a material at
// b2 = |B|² (T²). For a linear material w = w' = ν b2 / 2 exactly.
func EnergyDensity(mat solver.Material, b2 float64) (w, wco float64) {
	return energyDensity(mat, breaks(mat), b2)
}

// breaks returns the flux densities of a tabled curve's points, or nil.
func breaks(mat solver.Material) []float64 {
	if tb, ok := mat.(tabled); ok {
		_, bs := tb.Table()
		return bs
	}
	return nil
}

// energyDensity is EnergyDensity with the curve's break points given.
func energyDensity(mat solver.Material, bs []float64, b2 float64) (w, wco float64) {
	if !(b2 > 0) {
		return 0, 0
	}
	nu, dnu := mat.Nu(b2)
	if dnu == 0 {
		// Linear: exact, and no panels.
		nu0, _ := mat.Nu(0)
		if nu0 == nu {
			w = 0.5 * nu * b2
			return w, w
		}
	}
	b := math.Sqrt(b2)
	lo := 0.0
	// Panels break at the table's flux densities, where the
	// interpolant's second derivative jumps.
	for _, bk := range bs {
		if bk <= lo {
			continue
		}
		if bk >= b {
			break
		}
		w += glPanels(mat, lo, bk)
		lo = bk
	}
	w += glPanels(mat, lo, b)
	return w, nu*b2 - w
}

// tabled is a B-H curve given by a table (materials.Curve): Table returns
// its points (A/m, T), increasing.
type tabled interface {
	Table() (h, b []float64)
}

// glPanels returns ∫ ν(b²) b db over [b0, b1] by 3-point Gauss–Legendre
// on panels of at most panelB.
func glPanels(mat solver.Material, b0, b1 float64) float64 {
	n := int(math.Ceil((b1 - b0) / panelB))
	if n < 1 {
		n = 1
	}
	h := (b1 - b0) / float64(n)
	var w float64
	for k := 0; k < n; k++ {
		lo := b0 + float64(k)*h
		var s float64
		for i := range gl3x {
			bi := lo + gl3x[i]*h
			ni, _ := mat.Nu(bi * bi)
			s += gl3w[i] * ni * bi
		}
		w += s * h
	}
	return w
}

// Energies returns the stored energy W and the co-energy W' of a solution
// (J): planar values times the problem's Depth, axisymmetric ones over the
// full revolution, the exterior of an open boundary included. It returns a *NotFiniteError if either is not finite.
func Energies(sol *solver.Solution) (w, wco float64, err error) {
	if sol == nil || sol.Problem == nil || sol.Problem.Mesh == nil {
		panic(errNilSolution)
	}
	p := sol.Problem
	f := NewQuadField(sol, QuadDegree(p.Mesh.Order(), p.Formulation))
	var sw, sc compsum.Sum
	nq := f.NumPoints()
	bs := make([][]float64, len(p.Materials))
	for r, mat := range p.Materials {
		if mat != nil {
			bs[r] = breaks(mat)
		}
	}
	// The Kelvin image of an axisymmetric open boundary holds the energy
	// of the exterior with the weight ρ'²/R² (solver.Exterior).
	ext := map[int32]solver.Exterior{}
	for _, e := range p.Exterior {
		ext[e.Region] = e
	}
	for t := 0; t < p.Mesh.NumTriangles(); t++ {
		reg := p.Mesh.Region[t]
		mat := p.Materials[reg]
		ex, isExt := ext[reg]
		var et, ct float64
		for q := 0; q < nq; q++ {
			pt := f.At(t, q)
			e, c := energyDensity(mat, bs[reg], pt.Bx*pt.Bx+pt.By*pt.By)
			wt := pt.W
			if isExt {
				wt *= ((pt.X-ex.CX)*(pt.X-ex.CX) + (pt.Y-ex.CY)*(pt.Y-ex.CY)) / (ex.Radius * ex.Radius)
			}
			et += wt * e
			ct += wt * c
		}
		sw.Add(et)
		sc.Add(ct)
	}
	scale := depthOf(p)
	w, wco = sw.Value()*scale, sc.Value()*scale
	if !num.Finite(w) {
		return 0, 0, &NotFiniteError{Quantity: "stored energy", Value: w}
	}
	if !num.Finite(wco) {
		return 0, 0, &NotFiniteError{Quantity: "co-energy", Value: wco}
	}
	return w, wco, nil
}

// depthOf is the factor from the solver's per-metre integrals to the
// magnet: Depth for planar problems, 1 for axisymmetric ones (whose
// integrals already carry 2π r).
func depthOf(p *solver.Problem) float64 {
	if p.Formulation == solver.Axisymmetric {
		return 1
	}
	return p.Depth
}
