package force

import (
	"math"

	"polegap/internal/num"
	"polegap/post/study"
	"polegap/solver"
)

// DeltaFraction is the default virtual displacement as a fraction of the
// median length of the part's boundary edges (the element size at the
// part). With the mesh deformed rather than rebuilt the central
// difference's error falls as δ²: on a wire over an iron block it was
// 4e-6 at a tenth of the edge, 4e-8 at a hundredth, and rounding of the
// co-energy difference showed below a thousandth (6e-9 there, 4e-7 at
// 1e-5). A hundredth keeps both far below any discretisation error.
const DeltaFraction = 0.01

// VirtualWorkOptions control VirtualWork. The zero value deforms the
// solved mesh by DeltaFraction of the part's boundary edges.
type VirtualWorkOptions struct {
	// Delta is the displacement (m); zero means DeltaFraction times the
	// median length of the part's boundary edges.
	Delta float64
	// Remesh moves the part in the model and meshes each position afresh
	// (study.Study.Moved) instead of deforming the solved mesh. The
	// mesher's decisions then change with the displacement and add a
	// noise of the order of the co-energy's discretisation error over 2δ
	// (measured up to 6 % on a wire over iron at δ of a few hundredths of
	// a millimetre): use it with a large δ, and only to cross-check.
	Remesh bool
	// Joints lets the part touch other regions, as StressOptions.Joints;
	// the regions it touches deform with the air.
	Joints bool
	// Solver options of the two solves at ±δ (Initial is set to the
	// result's potential when the mesh is deformed).
	Solver solver.Options
}

// Work is a force component by virtual work.
type Work struct {
	F     float64 // N, along the direction asked for
	Delta float64 // the displacement used (m)
}

// CoEnergy solves the study at the parameter values p and returns its
// co-energy (J, whole magnet), the quantity whose derivative at constant
// current is the force.
func CoEnergy(s *study.Study, p study.Params, opt solver.Options) (float64, error) {
	r, err := s.SolveAt(p, opt)
	if err != nil {
		return 0, err
	}
	_, wco, err := study.Energies(r.Solution)
	return wco, err
}

// VirtualWork returns the force component along the unit vector of dir on
// the named regions at the result's parameter values, by the central
// difference of the co-energy at constant current with the part moved
// by ±δ along dir: (W'(+δ) − W'(−δ)) / (2δ).
//
// By default the part moves on the solved mesh (study.Study.Deformed):
// its nodes move rigidly and every node of the air around it by the
// fraction g = d_b/(d_p + d_b) of the displacement, d_p and d_b its
// path distances through the air from the part and from the nearest
// other body or the outer boundary, so that the deformation spreads over
// all the room the part has. The discrete co-energy is then smooth in δ,
// the difference converges at O(δ²), and its limit is J. L. Coulomb's
// virtual work with that deformation (IEEE Trans. Magn. 19(6), 1983):
// the Maxwell stress weighted by g over the whole air around the part,
// where Stress weighs a narrow band. The two differ only by the
// discretisation error of the field, which their difference estimates.
// The solves start from the result's potential (same numbering).
//
// It panics if dir is zero or opt.Delta negative. An unknown region is a
// *RegionError; a part not surrounded by air a *ContactError (unless
// Joints); a step that folds an element a *study.FoldError.
func VirtualWork(r *study.Result, regions []string, dir [2]float64, opt VirtualWorkOptions) (Work, error) {
	if opt.Delta < 0 || math.IsInf(opt.Delta, 0) || math.IsNaN(opt.Delta) {
		panic(errBadDelta)
	}
	n := math.Hypot(dir[0], dir[1])
	if !(n > 0) || math.IsInf(n, 0) {
		panic(errBadDir)
	}
	ux, uy := dir[0]/n, dir[1]/n
	tags, err := tagsOf(r, regions)
	if err != nil {
		return Work{}, err
	}
	pt, err := newPart(r.Problem, tags, opt.Joints)
	if err != nil {
		return Work{}, err
	}
	delta := opt.Delta
	if delta == 0 {
		edge, _ := pt.sizes()
		delta = DeltaFraction * edge
	}
	var g []float64
	so := opt.Solver
	if !opt.Remesh {
		g = pt.fill()
		so.Initial = r.Solution.A
	}
	var w [2]float64
	for k, s := range [2]float64{1, -1} {
		var moved *study.Study
		if opt.Remesh {
			moved, err = r.Study.Moved(regions, s*delta*ux, s*delta*uy)
		} else {
			moved, err = r.Study.Deformed(g, s*delta*ux, s*delta*uy)
		}
		if err != nil {
			return Work{}, err
		}
		if w[k], err = CoEnergy(moved, r.Params, so); err != nil {
			return Work{}, err
		}
	}
	f := (w[0] - w[1]) / (2 * delta)
	if !num.Finite(f) {
		return Work{}, &NotFiniteError{Value: [2]float64{f, 0}}
	}
	return Work{F: f, Delta: delta}, nil
}

// tagsOf returns the region tags of the named regions of the result's
// model, or a *RegionError.
func tagsOf(r *study.Result, regions []string) ([]int32, error) {
	tags := make([]int32, 0, len(regions))
	for _, name := range regions {
		i := -1
		for k := range r.Model.Regions {
			if r.Model.Regions[k].Name == name {
				i = k
				break
			}
		}
		if i < 0 {
			return nil, &RegionError{Name: name}
		}
		tags = append(tags, study.Tag(i))
	}
	if len(tags) == 0 {
		panic(errEmptyPart)
	}
	return tags, nil
}
