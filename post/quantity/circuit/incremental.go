package circuit

import (
	"math"

	"polegap/internal/num"
	"polegap/post/study"
	"polegap/solver"
)

// IncrementalOptions control Incremental. The zero value uses a relative
// step of 1e-3 and the solver's default options.
type IncrementalOptions struct {
	// Step is the relative current step h: coil j is solved at
	// I_j·(1 ± h), or at ±h amperes when I_j = 0. Default 1e-3; it must
	// lie in (0, 0.1).
	Step float64
	// Solver options of the two perturbation solves; Initial is replaced
	// by the solution's A (warm start).
	Solver solver.Options
}

// Incremental returns the incremental inductances dλ_i/dI_j (H) of every
// coil i with respect to the current of coil j, at the operating point
// of sol (whose problem must carry the coils' current densities, as
// post/study builds them): column j of the incremental inductance
// matrix. It solves the problem twice more on the same mesh with coil j's
// ampere-turns changed by ±h·N·I_j, warm-started from sol, and takes the
// central difference of the linkages. It panics if j is out of range.
func Incremental(sol *solver.Solution, coils []Coil, j int, opt IncrementalOptions) ([]float64, error) {
	if sol == nil || sol.Problem == nil || sol.Problem.Mesh == nil {
		panic(errNilSolution)
	}
	if j < 0 || j >= len(coils) {
		panic(errCoilIndex)
	}
	h := opt.Step
	if h == 0 {
		h = 1e-3
	}
	if !(h > 0 && h < 0.1) {
		panic(errBadStep)
	}
	c := &coils[j]
	dI := h * math.Abs(c.Current)
	if dI == 0 {
		dI = h
	}
	areas := sol.Problem.Mesh.RegionAreas()
	for _, s := range c.Sides {
		if !(areas[s.Tag] > 0) {
			return nil, &SideError{Coil: c.Name, Tag: s.Tag}
		}
	}
	var lam [2][]float64
	for k, sign := range [2]float64{1, -1} {
		p := *sol.Problem
		n := len(p.Materials)
		jd := make([]float64, n)
		copy(jd, p.CurrentDensity)
		for _, s := range c.Sides {
			jd[s.Tag] += sign * c.Turns * dI * s.Sense / areas[s.Tag]
		}
		p.CurrentDensity = jd
		so := opt.Solver
		so.Initial = sol.A
		ps, err := solver.Solve(&p, so)
		if err != nil {
			return nil, &PerturbError{Coil: c.Name, Current: c.Current + sign*dI, Err: err}
		}
		if lam[k], err = LinkagesTo(nil, ps, coils); err != nil {
			return nil, err
		}
	}
	out := make([]float64, len(coils))
	for i := range out {
		out[i] = (lam[0][i] - lam[1][i]) / (2 * dI)
		if !num.Finite(out[i]) {
			return nil, &NotFiniteError{Quantity: "incremental inductance", Value: out[i]}
		}
	}
	return out, nil
}

// IncrementalAt is Incremental on a solved study: the two perturbation
// solves run on the result's compiled study (study.Study.SolveAt) with
// coil j's current changed by ±h·I_j and every other parameter as
// solved, so they reuse its numbering, pattern and ordering instead of
// preparing the problem twice more. The coils are those of the result's
// model at its parameters (CoilsAt). It panics if j is not a coil.
func IncrementalAt(r *study.Result, j int, opt IncrementalOptions) ([]float64, error) {
	if r == nil || r.Solution == nil {
		panic(errNilSolution)
	}
	m := r.Model
	if j < 0 || j >= len(m.Coils) {
		panic(errCoilIndex)
	}
	h := opt.Step
	if h == 0 {
		h = 1e-3
	}
	if !(h > 0 && h < 0.1) {
		panic(errBadStep)
	}
	coils := CoilsAt(m, r.Params)
	c := &coils[j]
	dI := h * math.Abs(c.Current)
	if dI == 0 {
		dI = h
	}
	var lam [2][]float64
	for k, sign := range [2]float64{1, -1} {
		p := r.Params
		p.Currents = make([]float64, len(m.Coils))
		for i := range m.Coils {
			p.Currents[i] = r.Params.Current(m, i)
		}
		p.Currents[j] = c.Current + sign*dI
		so := opt.Solver
		so.Initial = r.Solution.A
		ps, err := r.Study.SolveAt(p, so)
		if err != nil {
			return nil, &PerturbError{Coil: c.Name, Current: c.Current + sign*dI, Err: err}
		}
		if lam[k], err = LinkagesTo(nil, ps.Solution, coils); err != nil {
			return nil, err
		}
	}
	out := make([]float64, len(coils))
	for i := range out {
		out[i] = (lam[0][i] - lam[1][i]) / (2 * dI)
		if !num.Finite(out[i]) {
			return nil, &NotFiniteError{Quantity: "incremental inductance", Value: out[i]}
		}
	}
	return out, nil
}
