package force

import (
	"math"

	"polegap/post/study"
	"polegap/solver"
)

// Options control Estimate. The zero value uses the defaults of Stress
// and VirtualWork.
type Options struct {
	// Band is the stress band width (StressOptions.Band).
	Band float64
	// Delta is the virtual displacement (VirtualWorkOptions.Delta).
	Delta float64
	// Joints lets the part touch other regions (StressOptions.Joints).
	Joints bool
	// Solver options of the virtual-work solves.
	Solver solver.Options
}

// Estimated is the force on a part by both methods and how far to trust
// it.
type Estimated struct {
	// Stress is the Maxwell-stress force over the narrow band.
	Stress Force
	// VirtualWork is the force by virtual work (N; component x is 0 for
	// an axisymmetric model, whose radial force vanishes by symmetry) and
	// Delta the displacement used (m).
	VirtualWork [2]float64
	Delta       float64
	// Error is SafetyFactor × |Stress.F − VirtualWork| (N): the two weigh
	// the stress of the same discrete field over different parts of the
	// air (a narrow band, and all the room around the part), and would
	// agree for the exact field, so their difference measures the field's
	// discretisation error around the part. The two errors are partly
	// alike (curved second-order elements make them so: measured 1.8e-3
	// and 1.3e-3 with a difference of 6e-4 on the wire over iron), so the
	// difference alone can fall below the error; the factor makes up for
	// it. It is an estimate, not a bound: an error of the field far from
	// the part (a coarse mesh on a distant iron face) reaches both alike.
	Error float64
}

// Estimate returns the force on the named regions by the Maxwell stress
// (Stress, default band) and by virtual work (VirtualWork on the deformed
// mesh: two solves per direction, x skipped for an axisymmetric model),
// with their difference as the error estimate. Errors as Stress and
// VirtualWork.
func Estimate(r *study.Result, regions []string, opt Options) (Estimated, error) {
	return estimate(r, regions, opt, r.Problem.Formulation != solver.Axisymmetric, true)
}

// EstimateAlong is Estimate with the virtual work along one axis only
// (axis 0: x, 1: y), the other component of VirtualWork left 0 and the
// error estimate taken along that axis: two solves instead of four.
func EstimateAlong(r *study.Result, regions []string, axis int, opt Options) (Estimated, error) {
	if axis != 0 && axis != 1 {
		panic(errBadAxis)
	}
	return estimate(r, regions, opt, axis == 0, axis == 1)
}

func estimate(r *study.Result, regions []string, opt Options, alongX, alongY bool) (Estimated, error) {
	tags, err := tagsOf(r, regions)
	if err != nil {
		return Estimated{}, err
	}
	f, err := Stress(r.Solution, tags, StressOptions{Band: opt.Band, Joints: opt.Joints})
	if err != nil {
		return Estimated{}, err
	}
	out := Estimated{Stress: f}
	var diff [2]float64
	for k, dir := range [2][2]float64{{1, 0}, {0, 1}} {
		if k == 0 && !alongX || k == 1 && !alongY {
			continue
		}
		w, err := VirtualWork(r, regions, dir, VirtualWorkOptions{Delta: opt.Delta, Joints: opt.Joints, Solver: opt.Solver})
		if err != nil {
			return Estimated{}, err
		}
		out.VirtualWork[k], out.Delta = w.F, w.Delta
		diff[k] = f.F[k] - w.F
	}
	out.Error = SafetyFactor * math.Hypot(diff[0], diff[1])
	return out, nil
}

// SafetyFactor multiplies the difference of two force estimates into an
// error estimate: 3, the factor P. J. Roache's grid convergence index
// applies to an error estimated from two solutions (Roache, "Perspective:
// a method for uniform reporting of grid refinement studies", J. Fluids
// Eng. 116, 1994; from memory).
const SafetyFactor = 3
