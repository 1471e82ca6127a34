package supply

import (
	"errors"
	"math"
	"testing"
)

// A linear coil Ψ = L I: by Kirchhoff's voltage law with Faraday's law
// for the inductor, a linear ramp needs V = L dI/dt + I R, largest at the
// top; the stored energy is ½ L I² (the energy of an inductor, e.g.
// D. J. Griffiths, Introduction to Electrodynamics, 4th ed., 2013,
// eq. 7.29); the decay through R + R_d has the time constant
// L/(R + R_d), so it falls to 1 % after ln(100) of them, and R_d takes
// R_d/(R + R_d) of the energy (Joule heating of the same current).
// Tolerance 1e-12 relative: a few float roundings.
func TestLinearCoil(t *testing.T) {
	const L, R, I, T, Rd = 0.8, 0.05, 200.0, 20.0, 1.5
	pts := []CurvePoint{{50, 50 * L}, {100, 100 * L}, {250, 250 * L}}
	s, err := New(pts, R, I, Options{RampTime: T, DischargeResistance: Rd})
	if err != nil {
		t.Fatal(err)
	}
	rel := func(got, want float64) float64 { return math.Abs(got-want) / math.Abs(want) }
	for _, c := range []struct {
		what      string
		got, want float64
	}{
		{"peak ramp voltage L dI/dt + I R", s.PeakVoltage, L*I/T + I*R},
		{"peak at the top", s.PeakAt, I},
		{"apparent L", s.Apparent, L},
		{"incremental L", s.Incremental, L},
		{"time constant L/R", s.TimeConstant, L / R},
		{"stored energy ½LI²", s.Energy, 0.5 * L * I * I},
		{"switch-off voltage I R_d", s.Discharge.PeakVoltage, I * Rd},
		{"discharge time constant", s.Discharge.TimeConstant, L / (R + Rd)},
		{"time to 1 %", s.Discharge.Time, L / (R + Rd) * math.Log(100)},
		{"energy in R_d", s.Discharge.Energy, 0.5 * L * I * I * Rd / (R + Rd)},
	} {
		if rel(c.got, c.want) > 1e-12 {
			t.Errorf("%s: %.15g, want %.15g", c.what, c.got, c.want)
		}
	}
	// The profile: V at each step is L dI/dt + I R.
	for _, p := range s.Profile {
		if want := L*I/T + p.Current*R; math.Abs(p.Voltage-want) > 1e-12*want {
			t.Errorf("t = %g s: V %.15g, want %.15g", p.Time, p.Voltage, want)
		}
	}
	if len(s.Profile) != DefaultSteps+1 || s.Profile[DefaultSteps].Current != I {
		t.Errorf("profile of %d points ending at %g A", len(s.Profile), s.Profile[len(s.Profile)-1].Current)
	}
	// All of ½LI² is dissipated in R and R_d together (energy balance).
	inR := 0.5 * L * I * I * R / (R + Rd)
	if rel(inR+s.Discharge.Energy, 0.5*L*I*I) > 1e-12 {
		t.Errorf("energy balance: %g + %g J, want ½LI² = %g J", inR, s.Discharge.Energy, 0.5*L*I*I)
	}
}

// A free-wheeling diode of drop V_d: L dI/dt = −(I R + V_d) gives
// t = (L/R) ln((I₀ R + V_d)/(I₁ R + V_d)) from I₀ to I₁ (the linear
// first-order equation solved exactly). Tolerance 1e-12 relative.
func TestDiode(t *testing.T) {
	const L, R, I, Vd = 2.0, 0.1, 50.0, 1.0
	s, err := New([]CurvePoint{{I, L * I}}, R, I, Options{})
	if err != nil {
		t.Fatal(err)
	}
	want := L / R * math.Log((I*R+Vd)/(0.01*I*R+Vd))
	if math.Abs(s.Discharge.Time-want) > 1e-12*want || s.Discharge.PeakVoltage != Vd || s.Discharge.Path != "free-wheeling diode" {
		t.Errorf("diode: %+v, want time %.15g s", s.Discharge, want)
	}
	if s.RampTime != DefaultRampTime || math.Abs(s.PeakVoltage-(L*I/DefaultRampTime+I*R)) > 1e-12 {
		t.Errorf("default ramp: %g s, peak %g V", s.RampTime, s.PeakVoltage)
	}
}

// A saturating coil: Ψ rises by L1 to I1, then by L2 < L1. The ramp
// voltage peaks just below the knee when L1 dI/dt + I1 R exceeds
// L2 dI/dt + I0 R; the stored energy is the area left of the curve,
// ½ L1 I1² + (I1 + I0)/2 · L2 (I0 − I1) by trapezoids (exact for the
// straight pieces).
func TestSaturatingCoil(t *testing.T) {
	const L1, L2, I1, I0, R, T = 1.0, 0.1, 80.0, 100.0, 0.01, 1.0
	pts := []CurvePoint{{I0, L1*I1 + L2*(I0-I1)}, {I1, L1 * I1}}
	s, err := New(pts, R, I0, Options{RampTime: T})
	if err != nil {
		t.Fatal(err)
	}
	if want := L1*I0/T + I1*R; math.Abs(s.PeakVoltage-want) > 1e-12*want || s.PeakAt != I1 {
		t.Errorf("peak %g V at %g A, want %g V at %g A", s.PeakVoltage, s.PeakAt, want, I1)
	}
	if want := 0.5*L1*I1*I1 + 0.5*(I1+I0)*L2*(I0-I1); math.Abs(s.Energy-want) > 1e-12*want {
		t.Errorf("energy %.15g J, want %.15g", s.Energy, want)
	}
	if s.Incremental != L2 || math.Abs(s.Apparent-(L1*I1+L2*(I0-I1))/I0) > 1e-15 {
		t.Errorf("inductances %g, %g", s.Incremental, s.Apparent)
	}
}

func TestBadCurve(t *testing.T) {
	for name, pts := range map[string][]CurvePoint{
		"empty":   nil,
		"falling": {{10, 1}, {20, 0.5}},
		"twice":   {{10, 1}, {10, 1}},
		"nan":     {{10, math.NaN()}},
	} {
		_, err := New(pts, 1, 10, Options{})
		var ce *CurveError
		if !errors.As(err, &ce) {
			t.Errorf("%s: error %v, want a *CurveError", name, err)
		}
	}
}
