package circuit

import (
	"polegap/internal/compsum"
	"polegap/internal/num"
	"polegap/models"
	"polegap/post/study"
	"polegap/solver"
)

// Side is one coil side: the mesh region tag holding its conductors and
// its sense (+1 current out of the page or along +φ, −1 the reverse).
type Side struct {
	Tag   int32
	Sense float64
}

// Coil is a winding as the circuit sees it: Turns conductors in every
// side, each carrying Current (A).
type Coil struct {
	Name    string
	Turns   float64
	Current float64
	Sides   []Side
}

// AmpereTurns returns Turns·Current.
func (c *Coil) AmpereTurns() float64 { return c.Turns * c.Current }

// CoilsOf returns the coils of a model with their sides as mesh region
// tags (post/study's numbering: model region i has tag i+1). A side
// naming no region is left out; models.Parse never produces one.
func CoilsOf(m *models.Model) []Coil { return CoilsAt(m, study.Params{}) }

// CoilsAt returns the coils of a model at the parameter values p (the
// currents and turns p gives, else the model's).
func CoilsAt(m *models.Model, p study.Params) []Coil {
	out := make([]Coil, 0, len(m.Coils))
	for ci, mc := range m.Coils {
		c := Coil{Name: mc.Name, Turns: p.TurnsOf(m, ci), Current: p.Current(m, ci)}
		for _, s := range mc.Sides {
			for i := range m.Regions {
				if m.Regions[i].Name == s.Region {
					c.Sides = append(c.Sides, Side{Tag: study.Tag(i), Sense: s.Sense})
					break
				}
			}
		}
		out = append(out, c)
	}
	return out
}

// CoilOf returns coil ci of a model at the parameter values p.
func CoilOf(m *models.Model, p study.Params, ci int) Coil { return CoilsAt(m, p)[ci] }

// Linkage returns the flux linkage λ (Wb-turns) of coil c in the solved
// field (see the package documentation for the formula). It returns a
// *SideError if a side's tag has no area in the mesh.
func Linkage(sol *solver.Solution, c *Coil) (float64, error) {
	l, err := LinkagesTo(nil, sol, []Coil{*c})
	if err != nil {
		return 0, err
	}
	return l[0], nil
}

// LinkagesTo writes the flux linkage of every coil into dst and returns
// it; a nil dst is allocated, otherwise it must have len(coils) entries.
func LinkagesTo(dst []float64, sol *solver.Solution, coils []Coil) ([]float64, error) {
	if sol == nil || sol.Problem == nil || sol.Problem.Mesh == nil {
		panic(errNilSolution)
	}
	if dst == nil {
		dst = make([]float64, len(coils))
	}
	if len(dst) != len(coils) {
		panic(errDstLen)
	}
	p := sol.Problem
	m := p.Mesh
	// ∫ A dΩ (times 2π r) and the cross-section area per region tag, over
	// the tags that coils use, in one pass over the triangles.
	type tagSums struct{ a, area compsum.Sum }
	want := map[int32]*tagSums{}
	for ci := range coils {
		for _, s := range coils[ci].Sides {
			want[s.Tag] = &tagSums{}
		}
	}
	deg := 2 // A is of degree 1 or 2
	if p.Formulation == solver.Axisymmetric {
		deg = 4 // r·A: degree 3 for P2; the rule of degree 3 has a negative weight
	}
	f := study.NewQuadField(sol, deg)
	nq := f.NumPoints()
	for t := 0; t < m.NumTriangles(); t++ {
		acc := want[m.Region[t]]
		if acc == nil {
			continue
		}
		var it float64
		for q := 0; q < nq; q++ {
			pt := f.At(t, q)
			it += pt.W * pt.A
		}
		acc.a.Add(it)
		acc.area.Add(m.TriangleArea(t)) // curved triangles with their curved sides
	}
	areas := map[int32]float64{}
	for tag, acc := range want {
		areas[tag] = acc.area.Value()
	}
	for ci := range coils {
		for _, s := range coils[ci].Sides {
			if !(areas[s.Tag] > 0) {
				return nil, &SideError{Coil: coils[ci].Name, Tag: s.Tag}
			}
		}
	}
	scale := study.Depth(p)
	for ci := range coils {
		var l float64
		for _, s := range coils[ci].Sides {
			l += s.Sense * coils[ci].Turns / areas[s.Tag] * want[s.Tag].a.Value()
		}
		dst[ci] = l * scale
		if !num.Finite(dst[ci]) {
			return nil, &NotFiniteError{Quantity: "flux linkage of coil " + coils[ci].Name, Value: dst[ci]}
		}
	}
	return dst, nil
}

// Apparent returns the apparent (secant) inductance λ/I (H) of a coil,
// or 0 when its current is zero.
func Apparent(lambda, current float64) float64 {
	if current == 0 {
		return 0
	}
	return lambda / current
}
