package target

import (
	"context"
	"errors"
	"fmt"
	"math"

	"polegap/internal/num"
	"polegap/post/workflow/sweep"
	"polegap/solver"
)

// Options control a search.
type Options struct {
	// Tol is the relative tolerance on the field; default 1e-4.
	Tol float64
	// MaxAmpereTurns bounds the search; 0 means LimitFactor times the
	// ideal ampere-turns B g/μ0 when the gap length is known, else
	// LimitFactor times the linear estimate from the model's own current.
	MaxAmpereTurns float64
	// GapLength (m), when known, gives the ideal estimate.
	GapLength float64
	// MaxSolves bounds the number of solves; default 40.
	MaxSolves int
	// Known are points already solved with the same runner, such as an
	// excitation curve: when two of them straddle the target, the search
	// starts from that bracket, and one within Tol is the answer without
	// a solve. nil starts from the ideal-circuit estimate.
	Known []sweep.Point
	// Progress, when set, is called after each solve.
	Progress func(p sweep.Point)
	Solver   solver.Options
}

// LimitFactor sets the default ampere-turn limit: this many times the
// ideal value (efficiency below 1/LimitFactor).
const LimitFactor = 5

// Result is the outcome of a search.
type Result struct {
	Target      float64       // T
	Reached     bool          // the target lies within the limit
	Point       sweep.Point   // the solve at the answer (or at the limit when not reached)
	AmpereTurns float64       // needed (when reached)
	Current     float64       // A, of the swept coil
	Limit       float64       // ampere-turn limit used
	Solves      []sweep.Point // every solve, in order
}

// UnreachableError says the target lies beyond the limit.
type UnreachableError struct {
	Target, Highest, Limit float64
}

func (e *UnreachableError) Error() string {
	return fmt.Sprintf("a field of %.4g T is out of reach: at the limit of %.4g ampere-turns the field is only %.4g T (the iron is deep in saturation); enlarge the poles or the yoke, shorten the gap, or raise the limit", e.Target, e.Limit, e.Highest)
}

// Search finds the coil current of r's swept coil at which the probe's
// field equals target (T). The returned Result lists every solve; when the
// target is out of reach the error is an *UnreachableError.
func Search(ctx context.Context, r *sweep.Runner, target float64, opt Options) (Result, error) {
	if !(target > 0) || math.IsInf(target, 0) {
		return Result{}, fmt.Errorf("target field %g T: give a positive field", target)
	}
	if opt.Tol <= 0 {
		opt.Tol = 1e-4
	}
	if opt.MaxSolves <= 0 {
		opt.MaxSolves = 40
	}
	res := Result{Target: target}
	turns := r.Turns()
	if turns == 0 {
		return res, fmt.Errorf("the swept coil has no turns")
	}
	eval := func(current float64) (sweep.Point, error) {
		if err := ctx.Err(); err != nil {
			return sweep.Point{}, err
		}
		if len(res.Solves) >= opt.MaxSolves {
			return sweep.Point{}, fmt.Errorf("no answer within %d solves", opt.MaxSolves)
		}
		so := opt.Solver
		if so.Context == nil {
			so.Context = ctx
		}
		p, err := r.Solve(current, so)
		if err != nil {
			return p, err
		}
		p.Index = len(res.Solves)
		if opt.GapLength > 0 && p.AmpereTurns != 0 {
			p.Efficiency = p.Field * opt.GapLength / (num.Mu0 * math.Abs(p.AmpereTurns))
		}
		res.Solves = append(res.Solves, p)
		if opt.Progress != nil {
			opt.Progress(p)
		}
		return p, nil
	}
	// First guess: the ideal circuit when the gap is known, else a linear
	// scaling of the model's own solution.
	i0 := r.BaseCurrent()
	b0 := r.BaseField()
	var guess, limitI float64
	switch {
	case opt.GapLength > 0:
		guess = target * opt.GapLength / (num.Mu0 * turns)
	case b0 > 0 && i0 != 0:
		guess = math.Abs(i0) * target / b0
	default:
		return res, fmt.Errorf("cannot estimate the current: the model's own solution has no field at the probe; set a coil current or a gap")
	}
	limitI = LimitFactor * guess
	if opt.MaxAmpereTurns > 0 {
		limitI = opt.MaxAmpereTurns / turns
	}
	res.Limit = limitI * turns

	lo, hi := 0.0, math.NaN() // currents with field below / above target
	flo, fhi := -target, math.NaN()
	cur := math.Min(guess, limitI)
	// Known points: the tightest bracket they give.
	for _, p := range opt.Known {
		i := p.Current
		if !(i > 0) || math.Abs(p.AmpereTurns) > res.Limit || math.IsNaN(p.Field) {
			continue
		}
		f := p.Field - target
		if math.Abs(f) <= opt.Tol*target {
			res.Reached, res.Point, res.AmpereTurns, res.Current = true, p, p.AmpereTurns, i
			return res, nil
		}
		if f < 0 && i > lo {
			lo, flo = i, f
		}
		if f > 0 && (math.IsNaN(hi) || i < hi) {
			hi, fhi = i, f
		}
	}
	switch {
	case !math.IsNaN(hi) && lo < hi:
		return res, illinois(&res, eval, lo, hi, flo, fhi, target, opt.Tol)
	case !math.IsNaN(hi):
		hi, fhi = math.NaN(), math.NaN() // inconsistent points: ignore them
		lo, flo = 0, -target
	case lo > 0:
		// Every known point lies below the target: step up from the
		// highest, linearly through the origin, at least 10 %.
		cur = math.Min(lo*math.Max(1.1, target/(target+flo)), limitI)
	}
	for {
		p, err := eval(cur)
		if err != nil {
			return res, err
		}
		f := p.Field - target
		if math.Abs(f) <= opt.Tol*target {
			res.Reached, res.Point, res.AmpereTurns, res.Current = true, p, p.AmpereTurns, cur
			return res, nil
		}
		if f < 0 {
			lo, flo = cur, f
			if !math.IsNaN(hi) {
				break
			}
			if cur >= limitI {
				res.Point = p
				return res, &UnreachableError{Target: target, Highest: p.Field, Limit: res.Limit}
			}
			// Step up: linear extrapolation through the origin, at least 10 %.
			next := cur * math.Max(1.1, target/p.Field)
			if p.Field <= 0 {
				next = 2 * cur
			}
			cur = math.Min(next, limitI)
			continue
		}
		hi, fhi = cur, f
		if lo > 0 || len(res.Solves) > 1 {
			break
		}
		cur = cur * target / p.Field // below the first guess
	}
	return res, illinois(&res, eval, lo, hi, flo, fhi, target, opt.Tol)
}

// illinois closes in on the target current inside [lo, hi], where the
// field is below the target at lo (flo < 0) and above it at hi (fhi > 0),
// by the Illinois variant of regula falsi.
func illinois(res *Result, eval func(float64) (sweep.Point, error), lo, hi, flo, fhi, target, tol float64) error {
	side := 0
	for {
		cur := (lo*fhi - hi*flo) / (fhi - flo)
		if !(cur > lo && cur < hi) {
			cur = 0.5 * (lo + hi)
		}
		p, err := eval(cur)
		if err != nil {
			return err
		}
		f := p.Field - target
		if math.Abs(f) <= tol*target || (hi-lo) <= 1e-12*hi {
			res.Reached, res.Point, res.AmpereTurns, res.Current = true, p, p.AmpereTurns, cur
			return nil
		}
		if f < 0 {
			lo, flo = cur, f
			if side == -1 {
				fhi /= 2
			}
			side = -1
		} else {
			hi, fhi = cur, f
			if side == +1 {
				flo /= 2
			}
			side = +1
		}
	}
}

// IsUnreachable reports whether err says the target is out of reach.
func IsUnreachable(err error) bool {
	var u *UnreachableError
	return errors.As(err, &u)
}
