// Package reference holds exact solutions that tests of several packages
// check against (test support, imported by tests only).
package reference

import "math"

// Fringing at the edge of a pole pair, against a conformal map.
//
// Two infinitely permeable poles with square edges face each other across
// a gap g = 2δ; by symmetry the mid-plane is an equipotential, so one half
// is a pole (potential V) whose face y = δ runs for x < 0 and whose side
// x = 0 rises from y = δ, opposite a plane y = 0 (potential 0). The
// Schwarz-Christoffel map of the upper half w-plane onto this region,
// with w = 0 at the far end of the channel under the pole and w = 1 at the
// corner, is
//
//	dz/dw = C √(w − 1) / w,  z = 2C (√(w − 1) − atan √(w − 1)) + iδ,  C = −iδ/π,
//
// (Schwarz-Christoffel transformation: e.g. K. J. Binns, P. J. Lawrenson,
// C. W. Trowbridge, "The Analytical and Numerical Solution of Electric and
// Magnetic Fields", Wiley 1992, chapter 3 (from memory); the same corner as
// in Carter's slot of 1900, for a slot of unlimited width). The complex
// potential is (V/π) ln w. On the plane (w = −τ, v = √(1 + τ) > 1) this
// gives, derived here,
//
//	x(v) = (2δ/π) (v − artanh(1/v)),   B/B0 = 1/v,   B0 = μ0 V/δ,
//
// and the flux per metre reaching the plane between two points is
// B0 (δ/π) Δ ln(v² − 1). Integrating B/B0 minus the ideal step (1 under
// the pole, 0 beyond) from x = −∞ to X gives the extra width per edge
//
//	Δ(X) = (δ/π) [ ln(v_X² − 1) + 2 − 2 ln 2 ],   x(v_X) = X,
//
// which grows like (g/π)(1 + ln(π X/(2g))) far out: the fringe flux of a
// square pole edge diverges logarithmically, so k of w_eff = w + k g is
// only defined together with the extent of the line. (The closed form was
// checked against numerical quadrature of 1/v(x) while writing this test.)
// We found no published table of Δ(X) to cite; the checks are against this
// derivation.

// SquareEdgeX returns x(v)/δ of the map above.
func SquareEdgeX(v float64) float64 { return 2 / math.Pi * (v - math.Atanh(1/v)) }

// SquareEdgeV solves x(v) = x (x in units of δ) by bisection (x is
// increasing in v); B/B0 = 1/v there.
func SquareEdgeV(x float64) float64 {
	lo, hi := 1+1e-15, 1e6
	for range 200 {
		m := 0.5 * (lo + hi)
		if SquareEdgeX(m) < x {
			lo = m
		} else {
			hi = m
		}
	}
	return 0.5 * (lo + hi)
}

// SquareEdgeDelta returns Δ(X)/δ, the extra width per edge out to X
// (in units of δ).
func SquareEdgeDelta(x float64) float64 {
	v := SquareEdgeV(x)
	return (math.Log(v*v-1) + 2 - 2*math.Log(2)) / math.Pi
}
