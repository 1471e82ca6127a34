package bench

import (
	"math"

	"gonum.org/v1/gonum/floats"
	"gonum.org/v1/gonum/stat"

	"polegap/internal/num"
)

// Fit returns the least-squares slope p and intercept c of
// log(cost) = c + p·log(n) (gonum's stat.LinearRegression): the growth
// exponent of a cost with the size. Points with a non-positive or
// non-finite n or cost are left out; ok is false when fewer than two points
// with distinct n remain. It panics if the slices differ in length.
func Fit(n, cost []float64) (p, c float64, ok bool) {
	if len(n) != len(cost) {
		panic(errFitLen)
	}
	var lx, ly []float64
	for i := range n {
		if n[i] > 0 && cost[i] > 0 && !math.IsInf(n[i], 0) && !math.IsInf(cost[i], 0) {
			lx = append(lx, math.Log(n[i]))
			ly = append(ly, math.Log(cost[i]))
		}
	}
	if len(lx) < 2 || floats.Min(lx) == floats.Max(lx) {
		return 0, 0, false
	}
	c, p = stat.LinearRegression(lx, ly, nil, false)
	if !num.Finite(p) || !num.Finite(c) {
		return 0, 0, false
	}
	return p, c, true
}

// A goalCurve is a DESIGN.md figure stated at one or more sizes: the
// allowed cost at each size in points (ascending sizes).
type goalCurve []struct{ n, cost float64 }

// at returns the allowed cost at size n: interpolated log-log between the
// stated sizes, and scaled in proportion to n (constant cost per unit)
// beyond them; scaled is false only at a stated size (within 1 %).
func (g goalCurve) at(n float64) (cost float64, scaled bool) {
	first, last := g[0], g[len(g)-1]
	for _, s := range g {
		if math.Abs(n/s.n-1) <= 0.01 {
			return s.cost, false
		}
	}
	switch {
	case n <= first.n:
		return first.cost * n / first.n, true
	case n >= last.n:
		return last.cost * n / last.n, true
	}
	for i := 1; i < len(g); i++ {
		a, b := g[i-1], g[i]
		if n <= b.n {
			t := math.Log(n/a.n) / math.Log(b.n/a.n)
			return a.cost * math.Pow(b.cost/a.cost, t), true
		}
	}
	return last.cost, true
}

// The figures of DESIGN.md ("Figures it must reach"), on the 2-core
// machine.
var (
	// Mesh: 100,000 quality triangles in 0.25 s, 1,000,000 in 2 s (by
	// triangle count).
	goalMesh = goalCurve{{1e5, 0.25}, {1e6, 2}}
	// Linear planar solve (assembly + solve): 100,000 nodes in 0.5 s,
	// 1,000,000 in 8 s.
	goalLinear = goalCurve{{1e5, 0.5}, {1e6, 8}}
	// Nonlinear C-core to 1e-8 residual, 100,000 nodes, 2 s.
	goalNonlinear = goalCurve{{1e5, 2}}
	// 20-point excitation curve (at 100,000 nodes), 10 s.
	goalCurve20 = goalCurve{{1e5, 10}}
)

const (
	// GoalBytesPerNode is DESIGN.md's peak memory per node, the factor
	// aside: 1 KiB.
	GoalBytesPerNode = 1024
	// GoalExponent is the fastest growth of any cost with N that DESIGN.md
	// allows from 10k to 1M nodes.
	GoalExponent = 1.3
	// CurvePoints is the number of currents of the excitation-curve figure.
	CurvePoints = 20
)
