package measure

import (
	"fmt"
	"math"
	"sort"
)

// StandardGravity is the standard acceleration of gravity, 9.80665 m/s²,
// exact by definition (3rd CGPM, 1901).
const StandardGravity = 9.80665

// BalanceReading is one current-balance reading at a fixed magnet current:
// the conductor current i (A) and the balance mass m (kg) that restores
// balance, read as the mass added to the pan (≥ 0).
type BalanceReading struct {
	Current float64 // conductor current i, A
	Mass    float64 // balance mass m, kg
}

// Balance describes a current balance: a straight conductor of length L
// across the gap field B carries a current i; the vertical force B L i on
// it is balanced by a mass m, so m g = B L i (+ a tare).
//
// The zero value is not usable: Length must be set. Zero G means
// StandardGravity with no uncertainty; zero sigmas mean not stated.
type Balance struct {
	Length, LengthSigma float64 // conductor length in the field and its uncertainty, m
	G, GSigma           float64 // local acceleration of gravity, m/s²
	// MassSigma is the standard uncertainty of one balance reading (kg).
	// When zero, and CurrentSigma is zero too, the uncertainty of the
	// slope comes from the scatter of the readings about the line (Type
	// A); otherwise from the stated values (Type B) and the fit is also
	// χ²-tested against them.
	MassSigma float64
	// CurrentSigma is the standard uncertainty of one conductor-current
	// reading (A). It is carried into the mass direction by the effective
	// variance σ² = σm² + (b σi)² with b the slope (J. Orear, Least squares
	// when both variables have uncertainties, Am. J. Phys. 50, 912, 1982).
	CurrentSigma float64
	Fit          FitMode // WithIntercept (default) absorbs a tare offset
	Alpha        float64 // rejection level of the line tests; 0 means DefaultAlpha
}

// BalanceResult is the field found from one set of balance readings.
//
// Field = Slope·g/L, with Slope the fitted dm/di (kg/A). FieldSigma is its
// combined standard uncertainty by the GUM law of propagation for
// uncorrelated inputs (JCGM 100:2008, eq. 10), whose relative form for a
// product of powers is
//
//	(u(B)/B)² = (u(b)/b)² + (u(g)/g)² + (u(L)/L)²
//
// and SigmaFit, SigmaG and SigmaLength are the three terms in tesla.
type BalanceResult struct {
	Field, FieldSigma             float64
	SigmaFit, SigmaG, SigmaLength float64
	Fit                           LineFit // mass (kg) against conductor current (A)
}

func (c Balance) validate() error {
	bad := func(msg string) error { return &ReadingsError{Method: "current-balance", Index: -1, Msg: msg} }
	switch {
	case !(c.Length > 0) || math.IsInf(c.Length, 0):
		return bad(fmt.Sprintf("conductor length %g m must be finite and > 0", c.Length))
	case !(c.G >= 0) || math.IsInf(c.G, 0):
		return bad(fmt.Sprintf("g = %g m/s² must be finite and > 0 (or omitted for standard gravity)", c.G))
	}
	for _, s := range [...]struct {
		name string
		v    float64
	}{{"length", c.LengthSigma}, {"g", c.GSigma}, {"mass", c.MassSigma}, {"current", c.CurrentSigma}, {"reject level", c.Alpha}} {
		if !(s.v >= 0) || math.IsInf(s.v, 0) {
			return bad(fmt.Sprintf("%s uncertainty %g must be finite and >= 0", s.name, s.v))
		}
	}
	if c.Alpha >= 1 {
		return bad(fmt.Sprintf("reject level %g must be below 1", c.Alpha))
	}
	if c.Fit != WithIntercept && c.Fit != ThroughOrigin {
		return bad(fmt.Sprintf("unknown fit mode %d", int(c.Fit)))
	}
	return nil
}

// Reduce fits m = a + b i (or m = b i) to the readings of one magnet
// current and returns B = b g / L with its uncertainty.
//
// Errors (*ReadingsError): a non-finite reading, a negative mass, all
// conductor currents zero, too few readings for the fit and its linearity
// test (4 at 3 distinct currents with an intercept, 3 at 2 distinct
// non-zero currents through the origin), and balance masses that are not
// strictly monotone in conductor current (readings at equal currents are
// averaged first). A fit rejected by its linearity or χ² test gives a
// *NotLineError (see fitLine's rules).
func (c Balance) Reduce(r []BalanceReading) (BalanceResult, error) {
	const method = "current-balance"
	if err := c.validate(); err != nil {
		return BalanceResult{}, err
	}
	x := make([]float64, len(r))
	y := make([]float64, len(r))
	allZero := true
	for i, v := range r {
		if math.IsNaN(v.Current) || math.IsInf(v.Current, 0) || math.IsNaN(v.Mass) || math.IsInf(v.Mass, 0) {
			return BalanceResult{}, &ReadingsError{Method: method, Index: i, Msg: fmt.Sprintf("(%g A, %g kg) is not finite; remove it or give the value read", v.Current, v.Mass)}
		}
		if v.Mass < 0 {
			return BalanceResult{}, &ReadingsError{Method: method, Index: i, Msg: fmt.Sprintf("mass %g kg is negative; give the mass placed on the pan, and reverse the conductor current if the force points up", v.Mass)}
		}
		allZero = allZero && v.Current == 0
		x[i], y[i] = v.Current, v.Mass
	}
	if len(r) > 0 && allZero {
		return BalanceResult{}, &ReadingsError{Method: method, Index: -1, Msg: "every conductor current is zero; the field shows only as a force on a current, so take readings at several non-zero currents"}
	}
	if err := monotone(method, x, y); err != nil {
		return BalanceResult{}, err
	}
	// The slope, which does not depend on the (uniform) weights, sets the
	// effective variance.
	sigma := math.Hypot(c.MassSigma, slope(x, y, c.Fit)*c.CurrentSigma)
	fit, err := fitLine(method, x, y, sigma, c.Fit, c.Alpha)
	if err != nil {
		return BalanceResult{}, err
	}
	g, ug := c.G, c.GSigma
	if g == 0 {
		g, ug = StandardGravity, 0
	}
	res := BalanceResult{Fit: fit}
	res.Field = fit.Slope * g / c.Length
	// GUM eq. 10 with sensitivity coefficients ∂B/∂b = g/L, ∂B/∂g = b/L,
	// ∂B/∂L = −b g/L².
	res.SigmaFit = math.Abs(g/c.Length) * fit.SlopeSigma
	res.SigmaG = math.Abs(fit.Slope/c.Length) * ug
	res.SigmaLength = math.Abs(res.Field/c.Length) * c.LengthSigma
	res.FieldSigma = math.Sqrt(res.SigmaFit*res.SigmaFit + res.SigmaG*res.SigmaG + res.SigmaLength*res.SigmaLength)
	if math.IsNaN(res.Field) || math.IsInf(res.Field, 0) || math.IsNaN(res.FieldSigma) || math.IsInf(res.FieldSigma, 0) {
		return BalanceResult{}, &ReadingsError{Method: method, Index: -1, Msg: "the readings give no finite field; check their units (A and kg)"}
	}
	return res, nil
}

// monotone checks that y is strictly monotone in x after averaging the y
// of equal x. It names the first reading that breaks the order.
func monotone(method string, x, y []float64) error {
	idx := make([]int, len(x))
	for i := range idx {
		idx[i] = i
	}
	sort.SliceStable(idx, func(a, b int) bool { return x[idx[a]] < x[idx[b]] })
	type group struct {
		x, y  float64
		first int
	}
	var gs []group
	for k := 0; k < len(idx); {
		j, sum := k, 0.0
		for j < len(idx) && x[idx[j]] == x[idx[k]] {
			sum += y[idx[j]]
			j++
		}
		gs = append(gs, group{x[idx[k]], sum / float64(j-k), idx[k]})
		k = j
	}
	dir := 0.0
	for k := 1; k < len(gs); k++ {
		d := gs[k].y - gs[k-1].y
		if d == 0 || (dir != 0 && math.Signbit(d) != math.Signbit(dir)) {
			return &ReadingsError{Method: method, Index: gs[k].first, Msg: fmt.Sprintf(
				"balance readings are not monotone in conductor current: %g kg at %g A follows %g kg at %g A; re-take the reading, or the force is too small for the balance at this magnet current",
				gs[k].y, gs[k].x, gs[k-1].y, gs[k-1].x)}
		}
		if dir == 0 {
			dir = d
		}
	}
	return nil
}
