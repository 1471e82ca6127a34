package probes

import (
	"math"

	"polegap/internal/num"
	"polegap/models"
	"polegap/solver"
)

// Field is what the probes need of a solution: the potential and flux
// density at a point, ok = false outside the mesh.
type Field interface {
	At(x, y float64) (a, bx, by float64, ok bool)
}

// Sided is a Field that also evaluates each region meeting at a point on
// its own (solver.Solution.SidesTo; Recovered when its base field is
// Sided). A point probe on such a field is checked for lying on an
// interface.
type Sided interface {
	Field
	SidesTo(dst []solver.Side, x, y float64) []solver.Side
}

// Sample is the field at one point.
type Sample struct {
	X, Y      float64 // m
	A, Bx, By float64
	Inside    bool
}

// B returns |B|.
func (s Sample) B() float64 { return math.Hypot(s.Bx, s.By) }

// Stats summarises a set of samples.
type Stats struct {
	N              int     // samples inside the mesh
	Mean, Min, Max float64 // of |B|
	MeanBx, MeanBy float64
	MinBy, MaxBy   float64
	Uniformity     float64 // (max |B| - min |B|) / mean |B|
}

// Result is one evaluated probe.
type Result struct {
	Name    string
	Kind    string
	Valid   bool   // at least one sample lies inside the mesh
	Outside int    // samples outside the mesh
	Point   Sample // point probes
	// Sides, for a point probe on an interface between materials of
	// different permeability (see Interface), is the field on each side;
	// Point is then the side of the largest reluctivity.
	Sides   []solver.Side
	Samples []Sample // line, box and circle probes
	Stats   Stats
}

// Default sample counts when a probe does not set its own.
const (
	DefaultLineSamples = 101
	DefaultGridSamples = 41 // per side of a box
)

// Evaluate evaluates every probe of the model on f, in the model's order.
func Evaluate(f Field, ps []models.Probe) []Result {
	out := make([]Result, len(ps))
	for i := range ps {
		out[i] = EvaluateOne(f, &ps[i])
	}
	return out
}

// EvaluateOne evaluates one probe.
func EvaluateOne(f Field, p *models.Probe) Result {
	r := Result{Name: p.Name, Kind: p.Kind}
	switch p.Kind {
	case models.ProbePoint:
		r.Point = at(f, p.Point[0], p.Point[1])
		if sf, ok := f.(Sided); ok && r.Point.Inside {
			if sides, ok := Interface(sf, p.Point[0], p.Point[1]); ok {
				r.Sides = sides
				s := sides[Reported(sides)]
				r.Point = Sample{X: r.Point.X, Y: r.Point.Y, A: s.A, Bx: s.Bx, By: s.By, Inside: true}
			}
		}
		r.Samples = []Sample{r.Point}
	case models.ProbeLine:
		n := p.Samples
		if n < 2 {
			n = DefaultLineSamples
		}
		r.Samples = make([]Sample, n)
		for k := range n {
			t := float64(k) / float64(n-1)
			x := p.Line[0][0] + t*(p.Line[1][0]-p.Line[0][0])
			y := p.Line[0][1] + t*(p.Line[1][1]-p.Line[0][1])
			r.Samples[k] = at(f, x, y)
		}
	case models.ProbeBox:
		n := DefaultGridSamples
		for j := range n {
			for k := range n {
				x := p.Box[0][0] + (p.Box[1][0]-p.Box[0][0])*float64(k)/float64(n-1)
				y := p.Box[0][1] + (p.Box[1][1]-p.Box[0][1])*float64(j)/float64(n-1)
				r.Samples = append(r.Samples, at(f, x, y))
			}
		}
	case models.ProbeCircle:
		n := p.Samples
		if n < 3 {
			n = DefaultLineSamples
		}
		for k := range n {
			a := 2 * math.Pi * float64(k) / float64(n)
			r.Samples = append(r.Samples, at(f, p.Centre[0]+p.Radius*math.Cos(a), p.Centre[1]+p.Radius*math.Sin(a)))
		}
	}
	r.Stats = Summarise(r.Samples)
	r.Valid = r.Stats.N > 0
	r.Outside = len(r.Samples) - r.Stats.N
	return r
}

// nuTol is the relative difference of reluctivity below which two sides
// count as the same material (air against copper, two air regions): B
// does not jump there, and the point is not on a magnetic interface.
const nuTol = 1e-9

// Interface reports whether (x, y) lies on an interface between materials
// of different permeability: within solver.SideTol of the mesh's extent
// of an edge or corner where elements of two or more regions meet whose
// reluctivities there differ by more than 1e-9 relative. It returns the
// field on each side (in region-tag order). On such an interface B jumps
// (its normal component is continuous, its tangential one scales with μ:
// J. D. Jackson, Classical Electrodynamics, 3rd ed. 1998, section 5.9),
// so a point there has no single field.
func Interface(f Sided, x, y float64) ([]solver.Side, bool) {
	sides := f.SidesTo(nil, x, y)
	if len(sides) < 2 {
		return nil, false
	}
	lo, hi := sides[0].Nu, sides[0].Nu
	for _, s := range sides[1:] {
		lo, hi = math.Min(lo, s.Nu), math.Max(hi, s.Nu)
	}
	if !(hi-lo > nuTol*hi) {
		return nil, false
	}
	for _, s := range sides {
		if !num.Finite(s.A) || !num.Finite(s.Bx) || !num.Finite(s.By) {
			return nil, false
		}
	}
	return sides, true
}

// Reported returns the index of the side whose field a point probe on an
// interface reports: the one of the largest reluctivity, the lowest
// permeability, usually air. A probe placed on a pole face stands for the
// field in the gap, which is what a Hall probe or search coil, always in
// air, reads; the iron side's field is not measurable there. The first
// such side in tag order on a tie.
func Reported(sides []solver.Side) int {
	k := 0
	for i, s := range sides {
		if s.Nu > sides[k].Nu {
			k = i
		}
	}
	return k
}

func at(f Field, x, y float64) Sample {
	a, bx, by, ok := f.At(x, y)
	if !ok || !num.Finite(a) || !num.Finite(bx) || !num.Finite(by) {
		return Sample{X: x, Y: y}
	}
	return Sample{X: x, Y: y, A: a, Bx: bx, By: by, Inside: true}
}

// Summarise returns the statistics of the samples inside the mesh.
func Summarise(ss []Sample) Stats {
	var s Stats
	s.Min, s.MinBy = math.Inf(1), math.Inf(1)
	s.Max, s.MaxBy = math.Inf(-1), math.Inf(-1)
	var sum, sx, sy float64
	for _, v := range ss {
		if !v.Inside {
			continue
		}
		b := v.B()
		s.N++
		sum += b
		sx += v.Bx
		sy += v.By
		s.Min = math.Min(s.Min, b)
		s.Max = math.Max(s.Max, b)
		s.MinBy = math.Min(s.MinBy, v.By)
		s.MaxBy = math.Max(s.MaxBy, v.By)
	}
	if s.N == 0 {
		return Stats{}
	}
	n := float64(s.N)
	s.Mean, s.MeanBx, s.MeanBy = sum/n, sx/n, sy/n
	if s.Mean > 0 {
		s.Uniformity = (s.Max - s.Min) / s.Mean
	}
	return s
}
