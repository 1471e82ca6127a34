package measure

import (
	"fmt"
	"math"
)

// Probe describes a field probe read directly in tesla.
type Probe struct {
	// Sigma is the standard uncertainty of one reading (T); zero estimates
	// it from repeated readings (at least two).
	Sigma float64
	// RelSigma is the relative standard uncertainty of the probe's
	// calibration, common to every reading.
	RelSigma float64
}

// Field returns the mean of repeated readings at one magnet current and
// its standard uncertainty, combining the reading uncertainty of the mean
// (Type A, or Sigma/√n) and the calibration scale by GUM eq. 10 (JCGM
// 100:2008): u² = u²(mean) + (RelSigma·mean)².
func (p Probe) Field(readings []float64) (field, sigma float64, err error) {
	const method = "direct"
	if !(p.Sigma >= 0) || math.IsInf(p.Sigma, 0) || !(p.RelSigma >= 0) || math.IsInf(p.RelSigma, 0) {
		return 0, 0, &ReadingsError{Method: method, Index: -1, Msg: fmt.Sprintf("probe uncertainties (%g T, %g relative) must be finite and >= 0", p.Sigma, p.RelSigma)}
	}
	if len(readings) == 0 {
		return 0, 0, &ReadingsError{Method: method, Index: -1, Msg: "no field readings; give at least one"}
	}
	m, u, err := meanSigma(method, readings, p.Sigma)
	if err != nil {
		return 0, 0, err
	}
	return m, math.Hypot(u, p.RelSigma*m), nil
}
