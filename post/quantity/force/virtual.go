package force

import (
	"math"

	"polegap/internal/num"
	"polegap/post/study"
	"polegap/solver"
)

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

// VirtualWork returns the force component (N) along the unit vector of
// dir on the named regions, by the central difference of the co-energy
// with the regions moved by ±delta (m) along dir, each position meshed
// and solved afresh inside the unmoved model's outer boundary
// (study.Study.Moved) at the result's parameter values. It panics if
// delta is not positive or dir is zero. Moving a region into another one
// is an error from the model's mesher; an unknown region a *RegionError.
func VirtualWork(r *study.Result, regions []string, dir [2]float64, delta float64, opt solver.Options) (float64, error) {
	if !(delta > 0) || math.IsInf(delta, 0) {
		panic(errBadDelta)
	}
	n := math.Hypot(dir[0], dir[1])
	if !(n > 0) || math.IsInf(n, 0) {
		panic(errBadDir)
	}
	ux, uy := dir[0]/n, dir[1]/n
	var w [2]float64
	for k, s := range [2]float64{1, -1} {
		for _, name := range regions {
			if _, ok := r.Model.Region(name); !ok {
				return 0, &RegionError{Name: name}
			}
		}
		moved, err := r.Study.Moved(regions, s*delta*ux, s*delta*uy)
		if err != nil {
			return 0, err
		}
		if w[k], err = CoEnergy(moved, r.Params, opt); err != nil {
			return 0, err
		}
	}
	f := (w[0] - w[1]) / (2 * delta)
	if !num.Finite(f) {
		return 0, &NotFiniteError{Value: [2]float64{f, 0}}
	}
	return f, nil
}
