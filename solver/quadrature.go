package solver

import "fmt"

// Rule is a quadrature rule on the reference triangle (0,0), (1,0), (0,1).
// Points are barycentric triples; the weights sum to 1, so that the
// integral over a triangle of area S is S·Σ w_q f(p_q).
type Rule struct {
	Degree int          // exact for polynomials of total degree <= Degree
	L      [][3]float64 // barycentric coordinates (L0, L1, L2) of each point
	W      []float64    // weights, summing to 1
}

// NumPoints returns the number of points of the rule.
func (r *Rule) NumPoints() int { return len(r.W) }

// Point returns the reference coordinates (ξ, η) = (L1, L2) of point q.
func (r *Rule) Point(q int) (xi, eta float64) { return r.L[q][1], r.L[q][2] }

// MaxRuleDegree is the highest degree for which RuleOfDegree has a rule.
const MaxRuleDegree = 6

// RuleOfDegree returns the Dunavant rule with the fewest points that
// integrates every polynomial of total degree <= deg exactly
// (D. A. Dunavant, "High degree efficient symmetrical Gaussian quadrature
// rules for the triangle", IJNME 21, 1985, pp. 1129-1148). The returned rule
// is shared and must not be modified. It panics if deg is outside
// [0, MaxRuleDegree].
func RuleOfDegree(deg int) *Rule {
	if deg < 0 || deg > MaxRuleDegree {
		panic(fmt.Sprintf("solver: no quadrature rule of degree %d", deg))
	}
	if deg == 0 {
		deg = 1
	}
	return &rules[deg]
}

// expand builds the points of one symmetry orbit of a Dunavant rule.
// An orbit given as (a, b, b) has 3 points, (a, b, c) with distinct entries 6,
// and (1/3, 1/3, 1/3) one.
func expand(orbits []orbit, deg int) Rule {
	var r Rule
	r.Degree = deg
	for _, o := range orbits {
		a, b, c := o.l[0], o.l[1], o.l[2]
		var pts [][3]float64
		switch {
		case a == b && b == c:
			pts = [][3]float64{{a, a, a}}
		case b == c:
			pts = [][3]float64{{a, b, b}, {b, a, b}, {b, b, a}}
		default:
			pts = [][3]float64{{a, b, c}, {a, c, b}, {b, a, c}, {b, c, a}, {c, a, b}, {c, b, a}}
		}
		for _, p := range pts {
			r.L = append(r.L, p)
			r.W = append(r.W, o.w)
		}
	}
	return r
}

type orbit struct {
	l [3]float64
	w float64
}

var rules [MaxRuleDegree + 1]Rule

func init() {
	for d := 1; d <= MaxRuleDegree; d++ {
		rules[d] = expand(dunavant[d], d)
	}
}
