package materials

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"
)

// TestEnergyIntegral checks the energy density against independent
// quadrature of the curve, w(B) = ∫0^B H dB = ∫0^H H B'(H) dH and
// w'(H) = ∫0^H B dH, by 16-point Gauss-Legendre rules on each piece between
// knots, where the integrands are polynomials of degree 4 and 3 and the rule
// (exact to degree 31) is exact. The ν table, from which Energy integrates,
// matches the curve to nuTol = 1e-9; so 1e-8 relative.
func TestEnergyIntegral(t *testing.T) {
	for name, c := range testCurves(t) {
		h, b := c.Table()
		hdb := func(x float64) float64 { return x * c.Slope(x) }
		wSum, cSum := 0.0, 0.0
		for i := 1; i < len(h); i++ {
			wSum += quad.Fixed(hdb, h[i-1], h[i], 16, quad.Legendre{}, 0)
			cSum += quad.Fixed(c.B, h[i-1], h[i], 16, quad.Legendre{}, 0)
			b2 := b[i] * b[i]
			if got := c.Energy(b2); !near(got, wSum, 1e-8) {
				t.Errorf("%s: w(%g T) = %.12g J/m³, quadrature %.12g", name, b[i], got, wSum)
			}
			if got := c.CoEnergy(b2); !near(got, cSum, 1e-8) {
				t.Errorf("%s: w'(%g T) = %.12g J/m³, quadrature %.12g", name, b[i], got, cSum)
			}
		}
		// Past the last knot: w grows by H_l ΔB + ΔB²/(2 μ0).
		n := len(h)
		for _, d := range []float64{0.1, 1, 10} {
			want := wSum + quad.Fixed(hdb, h[n-1], h[n-1]+d/Mu0, 16, quad.Legendre{}, 0)
			if got := c.Energy((b[n-1] + d) * (b[n-1] + d)); !near(got, want, 1e-8) {
				t.Errorf("%s: w(B_l + %g) = %.12g, quadrature %.12g", name, d, got, want)
			}
		}
	}
}

// TestEnergyDerivative: dw/db2 = ν/2 (dw = H dB = ν B dB), by central
// differences with δ = 1e-6 b2, to 1e-7 relative (truncation δ²w”'/6 and
// round-off ε w/δ are both below 1e-9 of ν/2 here).
func TestEnergyDerivative(t *testing.T) {
	for name, c := range testCurves(t) {
		for e := -4.0; e <= 2; e += 1.0 / 32 {
			x := math.Pow(10, e)
			d := 1e-6 * x
			fd := (c.Energy(x+d) - c.Energy(x-d)) / (2 * d)
			nu, _ := c.Nu(x)
			if !near(fd, nu/2, 1e-7) {
				t.Fatalf("%s: b2 = %g: dw/db2 = %.12g, ν/2 = %.12g", name, x, fd, nu/2)
			}
		}
		if c.Energy(0) != 0 || c.CoEnergy(0) != 0 || c.Energy(-1) != 0 {
			t.Errorf("%s: energy at B = 0 is not 0", name)
		}
		if !math.IsInf(c.Energy(math.Inf(1)), 1) || !math.IsInf(c.CoEnergy(math.Inf(1)), 1) {
			t.Errorf("%s: energy at B = Inf is not +Inf", name)
		}
	}
}

// TestLinearEnergy: w = w' = B²/(2 μ0 μr) in a linear medium (e.g. D. J.
// Griffiths, "Introduction to Electrodynamics", 3rd ed., 1999, sect. 7.2.4,
// with μ0 -> μ0 μr).
func TestLinearEnergy(t *testing.T) {
	l := Linear{MuR: 1000}
	for _, bv := range []float64{0, 0.5, 1.5} {
		want := bv * bv / (2 * Mu0 * 1000)
		if got := l.Energy(bv * bv); !near(got, want, 1e-15) || l.CoEnergy(bv*bv) != got {
			t.Errorf("Linear{1000}: w(%g T) = %g, want %g", bv, got, want)
		}
	}
	// At 1 T in air the energy density is 1/(2 μ0) ≈ 397.9 kJ/m³.
	if got := (Linear{}).Energy(1); math.Abs(got-397887) > 1 {
		t.Errorf("air at 1 T: w = %g J/m³, want 397887", got)
	}
}
