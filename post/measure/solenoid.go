package measure

import (
	"fmt"
	"math"

	"polegap/internal/num"
)

// Solenoid is an air-core calibration solenoid treated as a thin current
// sheet: Turns wound uniformly over Length at the mean winding Radius.
// Sigmas are standard uncertainties; CurrentRelSigma is the relative
// standard uncertainty of the solenoid ammeter's scale (a shunt's
// calibration), common to every reading.
type Solenoid struct {
	Turns, TurnsSigma   float64
	Length, LengthSigma float64 // m
	Radius, RadiusSigma float64 // m
	CurrentRelSigma     float64
}

// AxisField returns the field (T) on the axis of the solenoid carrying
// current (A), at z (m) from its centre, by the exact on-axis formula for
// a finite current sheet,
//
//	B(z) = μ0 N I /(2L) · [ (z+L/2)/√((z+L/2)²+R²) − (z−L/2)/√((z−L/2)²+R²) ]
//
// (D. J. Griffiths, Introduction to Electrodynamics, 4th ed. 2017, Problem
// 5.11, B = (μ0 n I/2)(cos θ2 − cos θ1); problem number from memory).
func (s Solenoid) AxisField(current, z float64) float64 {
	h := s.Length / 2
	a, b := z+h, z-h
	return num.Mu0 * s.Turns * current / (2 * s.Length) *
		(a/math.Hypot(a, s.Radius) - b/math.Hypot(b, s.Radius))
}

// CentreField returns the field (T) at the centre of the solenoid carrying
// current (A): the on-axis formula at z = 0,
//
//	B = μ0 N I / √(L² + D²),  D = 2R,
//
// which tends to the long-solenoid value μ0 N I / L as D/L → 0.
func (s Solenoid) CentreField(current float64) float64 {
	return num.Mu0 * s.Turns * current / math.Hypot(s.Length, 2*s.Radius)
}

// CentreConstant returns k = B/I at the centre (T/A) and its relative
// standard uncertainty by GUM eq. 10 (JCGM 100:2008) from the
// uncertainties of N, L, R and the current scale:
//
//	∂ln k/∂N = 1/N,  ∂ln k/∂L = −L/(L²+4R²),  ∂ln k/∂R = −4R/(L²+4R²).
func (s Solenoid) CentreConstant() (k, rel float64) {
	k = s.CentreField(1)
	d := s.Length*s.Length + 4*s.Radius*s.Radius
	tN := s.TurnsSigma / s.Turns
	tL := s.Length / d * s.LengthSigma
	tR := 4 * s.Radius / d * s.RadiusSigma
	return k, math.Sqrt(tN*tN + tL*tL + tR*tR + s.CurrentRelSigma*s.CurrentRelSigma)
}

func (s Solenoid) validate() error {
	bad := func(format string, a ...any) error {
		return &ReadingsError{Method: "calibration", Index: -1, Msg: fmt.Sprintf(format, a...)}
	}
	for _, v := range [...]struct {
		name string
		x    float64
	}{{"turns", s.Turns}, {"length", s.Length}, {"radius", s.Radius}} {
		if !(v.x > 0) || math.IsInf(v.x, 0) {
			return bad("solenoid %s %g must be finite and > 0", v.name, v.x)
		}
	}
	for _, v := range [...]struct {
		name string
		x    float64
	}{{"turns", s.TurnsSigma}, {"length", s.LengthSigma}, {"radius", s.RadiusSigma}, {"current scale", s.CurrentRelSigma}} {
		if !(v.x >= 0) || math.IsInf(v.x, 0) {
			return bad("solenoid %s uncertainty %g must be finite and >= 0", v.name, v.x)
		}
	}
	if s.Length < 4*s.Radius {
		// Common practice: a calibration solenoid is several diameters
		// long so that its field is uniform over the search coil; the
		// centre formula itself holds for any length.
		return bad("solenoid length %g m is shorter than two diameters (%g m); the field at its centre is not uniform enough over a search coil, use a longer solenoid", s.Length, 4*s.Radius)
	}
	return nil
}
