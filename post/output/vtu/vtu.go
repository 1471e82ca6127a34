package vtu

import (
	"io"
	"math"

	"polegap/internal/num"
	"polegap/mesh"
	"polegap/solver"
)

// Options control what is exported. The zero value writes the standard
// arrays (see the package documentation).
type Options struct {
	// NodalB adds "B_nodal", the area-weighted average of the element
	// flux densities at each node (solver.Solution.NodalBTo).
	NodalB bool
}

// Arrays returns the data arrays of s that WriteVTU writes, in order, so
// that a caller can add its own before calling mesh.WriteVTU. It returns a
// *MaterialError if a reluctivity is not finite and positive.
func Arrays(s *solver.Solution, opt Options) ([]mesh.DataArray, error) {
	if s == nil || s.Problem == nil || s.Problem.Mesh == nil {
		panic(errNilSolution)
	}
	p := s.Problem
	m := p.Mesh
	nt := m.NumTriangles()
	b := s.BTo(nil)
	bv := make([]float64, 2*nt)
	babs := make([]float64, nt)
	hv := make([]float64, 2*nt)
	mur := make([]float64, nt)
	jv := make([]float64, nt)
	for t := range nt {
		reg := m.Region[t]
		bx, by := b[t][0], b[t][1]
		bv[2*t], bv[2*t+1] = bx, by
		babs[t] = math.Hypot(bx, by)
		nu, _ := p.Materials[reg].Nu(bx*bx + by*by)
		if !(nu > 0) || math.IsInf(nu, 0) {
			return nil, &MaterialError{Triangle: t, Region: reg, Nu: nu}
		}
		var mg [2]float64
		if int(reg) < len(p.Magnetization) {
			mg = p.Magnetization[reg]
		}
		hv[2*t], hv[2*t+1] = nu*bx-mg[0], nu*by-mg[1]
		mur[t] = 1 / (num.Mu0 * nu)
		if int(reg) < len(p.CurrentDensity) {
			jv[t] = p.CurrentDensity[reg]
		}
	}
	out := []mesh.DataArray{
		{Name: "A", PerNode: true, Values: s.A},
		{Name: "B", Components: 2, Values: bv},
		{Name: "B_abs", Values: babs},
		{Name: "H", Components: 2, Values: hv},
		{Name: "mu_r", Values: mur},
		{Name: "J", Values: jv},
	}
	if opt.NodalB {
		nb := s.NodalBTo(nil)
		v := make([]float64, 2*len(nb))
		for i, x := range nb {
			v[2*i], v[2*i+1] = x[0], x[1]
		}
		out = append(out, mesh.DataArray{Name: "B_nodal", Components: 2, PerNode: true, Values: v})
	}
	return out, nil
}

// WriteVTU writes the mesh of s and its fields (see Arrays) to w as a VTK
// XML unstructured grid. It returns a *MaterialError, mesh's
// *NonFiniteError (nothing written) or the first error of w.
func WriteVTU(w io.Writer, s *solver.Solution, opt Options) error {
	arrays, err := Arrays(s, opt)
	if err != nil {
		return err
	}
	return mesh.WriteVTU(w, s.Problem.Mesh, arrays...)
}
