// Package supply says what a power supply must do to drive a sized coil
// and what happens when it is switched off, from the coil's excitation
// curve (its flux linkage against its own current, found by nonlinear
// solves) and its resistance.
//
// # Method
//
// The flux linkage Ψ(I) is interpolated linearly between the solved
// points (with Ψ(0) = 0 added when absent), so the incremental inductance
// L_inc = dΨ/dI is constant on each interval. During a linear ramp from 0
// to the operating current I₀ in the time T (dI/dt = I₀/T) the supply
// must give, by Kirchhoff's voltage law with Faraday's law for the coil,
//
//	V(t) = L_inc(I) dI/dt + I R
//
// which Ramp reports as its peak and as a profile. The stored energy is
// W = ∫₀^Ψ₀ I dΨ (½ L I² for a linear coil). At switch-off the current
// flows on through a discharge resistor R_d (peak voltage I₀ R_d) or a
// free-wheeling diode of forward drop V_d, and decays by
// L_inc dI/dt = −(I (R + R_d) + V_d): on each interval of constant L_inc
// the time from I_a down to I_b is
//
//	t = L_inc/(R + R_d) · ln((I_a (R + R_d) + V_d)/(I_b (R + R_d) + V_d))
//
// (V_d = 0 with a resistor), summed down to 1 % of I₀. The resistor
// absorbs R_d/(R + R_d) of W (the current through coil and resistor is
// the same), whatever the shape of Ψ(I).
//
// The flux linkage of a planar model is per its depth: the coil's end
// turns add inductance that a 2D model does not see, so the voltages and
// energies here are lower bounds of a few to some tens of per cent.
//
// # Units
//
// SI: A, Wb, H, Ω, V, s, J.
//
// # Failures
//
// New returns a *CurveError for a curve it cannot use (fewer than one
// point above zero current, non-finite values, a current that does not
// increase, a flux linkage that falls) and panics ("supply: ...") on
// non-positive or non-finite resistance or times (programmer misuse:
// validate user input first).
package supply
