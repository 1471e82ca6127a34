package gap

import (
	"math"

	"polegap/internal/num"
)

// DefaultTolerances are the relative field tolerances for which
// GoodFieldWidths reports half-widths when none are given: 1e-3 and 1e-4,
// the good-field levels commonly quoted for laboratory and beam-line
// dipoles (common practice).
var DefaultTolerances = []float64{1e-3, 1e-4}

// Uniformity summarises the relative deviation (B − B0)/B0 of one field
// component over a set of samples (a good-field line or box).
type Uniformity struct {
	Component Component
	B0        float64    // the reference (centre) value, T
	N         int        // samples inside the mesh
	MaxAbs    float64    // max |B − B0|/|B0|
	MaxAbsAt  [2]float64 // where MaxAbs occurs, m
	Min, Max  float64    // smallest and largest signed (B − B0)/B0
	RMS       float64    // root mean square of (B − B0)/B0
}

// Deviation returns the uniformity of component c over the samples inside
// the mesh, relative to b0 (T, usually the value at the centre of the good
// field region). It returns a *ZeroFieldError if b0 is zero or not finite,
// and an *EmptyError if no sample lies inside the mesh.
func Deviation(ss []Sample, b0 float64, c Component) (Uniformity, error) {
	u := Uniformity{Component: c, B0: b0}
	if b0 == 0 || !num.Finite(b0) {
		return u, &ZeroFieldError{B0: b0}
	}
	u.Min, u.Max = math.Inf(1), math.Inf(-1)
	var sq float64
	for _, s := range ss {
		if !s.Inside {
			continue
		}
		d := (c.Of(s) - b0) / b0
		u.N++
		sq += d * d
		u.Min = math.Min(u.Min, d)
		u.Max = math.Max(u.Max, d)
		if math.Abs(d) > u.MaxAbs || u.N == 1 {
			u.MaxAbs, u.MaxAbsAt = math.Abs(d), [2]float64{s.X, s.Y}
		}
	}
	if u.N == 0 {
		return Uniformity{Component: c, B0: b0}, &EmptyError{Samples: len(ss)}
	}
	u.RMS = math.Sqrt(sq / float64(u.N))
	return u, nil
}

// GoodField is the extent of the region along a line, walking out from its
// centre, where |B − B0|/|B0| stays within Tol.
type GoodField struct {
	Tol float64
	// Minus and Plus are the distances (m) from the centre towards the
	// line's start and its end at which the deviation first exceeds Tol,
	// the crossing interpolated linearly between the bracketing samples.
	Minus, Plus float64
	// MinusFound and PlusFound are false when the walk reached the end of
	// the line (or left the mesh) without exceeding Tol: the distance is
	// then only a lower bound, and the line should be made longer.
	MinusFound, PlusFound bool
}

// HalfWidth returns the smaller of Minus and Plus (m).
func (g GoodField) HalfWidth() float64 { return math.Min(g.Minus, g.Plus) }

// Bounded reports whether both crossings were found, so HalfWidth is a
// value and not a lower bound.
func (g GoodField) Bounded() bool { return g.MinusFound && g.PlusFound }

// GoodFieldWidths walks the profile ss (samples ordered by S, as ProfileTo
// makes them) out from the point at distance centre (m) from its start, in
// both directions, and reports for each tolerance where the relative
// deviation of component c from b0 first exceeds it. tols nil means
// DefaultTolerances. The deviation at the centre itself is linearly
// interpolated between the samples around it. It returns a
// *ZeroFieldError for b0 zero or not finite, an *OutsideError if the
// centre is outside the mesh or the line, and panics if a tolerance is not
// finite and positive.
func GoodFieldWidths(ss []Sample, centre, b0 float64, c Component, tols []float64) ([]GoodField, error) {
	if tols == nil {
		tols = DefaultTolerances
	}
	for _, t := range tols {
		if !(t > 0) || !num.Finite(t) {
			panic(errBadTol)
		}
	}
	if b0 == 0 || !num.Finite(b0) {
		return nil, &ZeroFieldError{B0: b0}
	}
	if len(ss) == 0 {
		return nil, &EmptyError{}
	}
	// i0 is the last sample at or before the centre.
	i0 := -1
	for i := range ss {
		if ss[i].S <= centre {
			i0 = i
		}
	}
	if i0 < 0 || !ss[i0].Inside || (i0+1 < len(ss) && !ss[i0+1].Inside) || (i0 == len(ss)-1 && ss[i0].S < centre) {
		x, y := centrePoint(ss, centre)
		return nil, &OutsideError{What: "centre", X: x, Y: y}
	}
	dev := func(i int) float64 { return (c.Of(ss[i]) - b0) / b0 }
	// Deviation at the centre, interpolated.
	d0 := dev(i0)
	if i0+1 < len(ss) && ss[i0+1].S > ss[i0].S {
		t := (centre - ss[i0].S) / (ss[i0+1].S - ss[i0].S)
		d0 += t * (dev(i0+1) - d0)
	}
	out := make([]GoodField, len(tols))
	for j, tol := range tols {
		g := GoodField{Tol: tol}
		g.Plus, g.PlusFound = walk(ss, dev, centre, d0, i0+1, +1, tol)
		g.Minus, g.MinusFound = walk(ss, dev, centre, d0, i0, -1, tol)
		out[j] = g
	}
	return out, nil
}

// walk steps from sample i in direction step until |dev| exceeds tol and
// returns the interpolated distance from the centre (s0, deviation d0).
func walk(ss []Sample, dev func(int) float64, s0, d0 float64, i, step int, tol float64) (float64, bool) {
	if math.Abs(d0) > tol {
		return 0, true
	}
	ps, pd := s0, d0
	for ; i >= 0 && i < len(ss); i += step {
		if !ss[i].Inside {
			break
		}
		s, d := ss[i].S, dev(i)
		if math.Abs(d) > tol {
			target := math.Copysign(tol, d)
			// pd lies within [-tol, tol] and d beyond target, so the
			// crossing lies in [ps, s].
			t := (target - pd) / (d - pd)
			return math.Abs(ps + t*(s-ps) - s0), true
		}
		ps, pd = s, d
	}
	return math.Abs(ps - s0), false
}

func centrePoint(ss []Sample, centre float64) (x, y float64) {
	if len(ss) < 2 {
		return ss[0].X, ss[0].Y
	}
	a, b := ss[0], ss[len(ss)-1]
	l := b.S - a.S
	if l == 0 {
		return a.X, a.Y
	}
	t := (centre - a.S) / l
	return a.X + t*(b.X-a.X), a.Y + t*(b.Y-a.Y)
}
