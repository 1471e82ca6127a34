package solver

import (
	"fmt"
	"math"
	"testing"
)

// Element tests follow the usual checks of a Lagrange basis (e.g. O. C.
// Zienkiewicz, R. L. Taylor, "The Finite Element Method", vol. 1, ch. 8):
// nodality N_i(x_j) = δ_ij, partition of unity Σ N_i = 1 (so Σ ∇N_i = 0),
// and gradients equal to finite differences of the values.
func TestElements(t *testing.T) {
	for _, e := range []Element{P1{}, P2{}} {
		name := fmt.Sprintf("P%d", e.Degree())
		n := e.NumNodes()
		var val [MaxNodes]float64
		var grad [MaxNodes][2]float64
		// Nodality, exact in floating point for these node sets (tolerance 1e-15).
		for j := 0; j < n; j++ {
			x, y := e.RefNode(j)
			e.EvalTo(val[:], grad[:], x, y)
			for i := 0; i < n; i++ {
				want := 0.0
				if i == j {
					want = 1
				}
				if math.Abs(val[i]-want) > 1e-15 {
					t.Errorf("%s: N_%d at node %d = %g, want %g", name, i, j, val[i], want)
				}
			}
		}
		pts := [][2]float64{{0.2, 0.3}, {0.1, 0.1}, {0.7, 0.05}, {1.0 / 3, 1.0 / 3}, {0, 0.9}}
		for _, p := range pts {
			e.EvalTo(val[:], grad[:], p[0], p[1])
			var s float64
			var gs [2]float64
			for i := 0; i < n; i++ {
				s += val[i]
				gs[0] += grad[i][0]
				gs[1] += grad[i][1]
			}
			// Partition of unity: rounding of a few terms, 1e-14.
			if math.Abs(s-1) > 1e-14 || math.Abs(gs[0]) > 1e-14 || math.Abs(gs[1]) > 1e-14 {
				t.Errorf("%s at %v: ΣN = %g, Σ∇N = %v", name, p, s, gs)
			}
			// Central differences with h = 1e-6 on a quadratic are exact up
			// to rounding, ~1e-16/1e-6 = 1e-10; tolerance 1e-8.
			const h = 1e-6
			var vp, vm [MaxNodes]float64
			for d := 0; d < 2; d++ {
				x, y := p[0], p[1]
				if d == 0 {
					e.EvalTo(vp[:], nil, x+h, y)
					e.EvalTo(vm[:], nil, x-h, y)
				} else {
					e.EvalTo(vp[:], nil, x, y+h)
					e.EvalTo(vm[:], nil, x, y-h)
				}
				for i := 0; i < n; i++ {
					fd := (vp[i] - vm[i]) / (2 * h)
					if math.Abs(fd-grad[i][d]) > 1e-8 {
						t.Errorf("%s at %v: dN_%d/d%d = %g, finite difference %g", name, p, i, d, grad[i][d], fd)
					}
				}
			}
		}
	}
}

// Exact monomial integrals on the reference triangle:
// ∫ ξ^i η^j dξ dη = i! j! / (i+j+2)! (e.g. Zienkiewicz-Taylor, vol. 1,
// eq. for area coordinates; also Dunavant 1985, eq. 2).
func TestRuleExactness(t *testing.T) {
	fact := func(n int) float64 {
		f := 1.0
		for k := 2; k <= n; k++ {
			f *= float64(k)
		}
		return f
	}
	for deg := 1; deg <= MaxRuleDegree; deg++ {
		r := RuleOfDegree(deg)
		if r.Degree < deg {
			t.Fatalf("degree %d: rule has degree %d", deg, r.Degree)
		}
		var ws float64
		for _, w := range r.W {
			ws += w
		}
		for _, l := range r.L {
			if math.Abs(l[0]+l[1]+l[2]-1) > 1e-14 {
				t.Errorf("degree %d: barycentrics %v do not sum to 1", deg, l)
			}
		}
		for i := 0; i <= deg; i++ {
			for j := 0; i+j <= deg; j++ {
				var got float64
				for q := range r.W {
					x, y := r.Point(q)
					got += r.W[q] * math.Pow(x, float64(i)) * math.Pow(y, float64(j))
				}
				got *= 0.5 // area of the reference triangle
				want := fact(i) * fact(j) / fact(i+j+2)
				// The tabulated values carry 15 significant digits: 1e-14
				// relative.
				if math.Abs(got-want) > 1e-14*want {
					t.Errorf("degree %d rule, ξ^%d η^%d: got %.17g want %.17g (rel %.2g)", deg, i, j, got, want, (got-want)/want)
				}
			}
		}
	}
}
