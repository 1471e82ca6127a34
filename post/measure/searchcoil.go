package measure

import (
	"fmt"
	"math"

	"polegap/internal/num"
)

// Integrator converts a search coil's reading into flux linkage:
//
//	λ = reading · RC / Gain   (reading in V, RC the time constant in s)
//	λ = reading / Gain        (TimeConstant zero: reading in V·s)
//
// Zero Gain means 1 with no uncertainty. Sigmas are standard
// uncertainties.
type Integrator struct {
	TimeConstant, TimeConstantSigma float64 // s
	Gain, GainSigma                 float64
}

// scale returns λ/reading and its relative uncertainty (GUM eq. 10,
// relative form for a product of powers).
func (it Integrator) scale() (k, rel float64) {
	g, rg := it.Gain, 0.0
	if g == 0 {
		g = 1
	} else {
		rg = it.GainSigma / it.Gain
	}
	k = 1 / g
	rt := 0.0
	if it.TimeConstant != 0 {
		k *= it.TimeConstant
		rt = it.TimeConstantSigma / it.TimeConstant
	}
	return k, math.Hypot(rg, rt)
}

// CalReading is one calibration reading: the solenoid current (A) switched
// on (or the coil pulled out of the solenoid) and the integrator reading
// it gave (V or V·s, as the Integrator says).
type CalReading struct {
	Current, Reading float64
}

// Calibration is a calibration run of the search coil at the centre of a
// Solenoid. Readings are fitted through the origin, reading = S·I, so that
// the coil's effective turns-area is NAeff = S·k_int/k_sol with k_int the
// integrator scale and k_sol = B/I of the solenoid.
type Calibration struct {
	Solenoid Solenoid
	Readings []CalReading
	// ReadingSigma is the standard uncertainty of one reading (V or V·s);
	// zero estimates it from the scatter about the fitted line.
	ReadingSigma float64
	// FieldPerAmpere, when > 0, is the solenoid's centre field per ampere
	// (T/A) found some other way, e.g. from an axisymmetric solve of the
	// solenoid, with its relative standard uncertainty; it replaces the
	// finite-solenoid formula and Solenoid is then not used.
	FieldPerAmpere, FieldPerAmpereRelSigma float64
	// Gain is the amplifier gain during calibration when it differs from
	// the gap readings' gain (zero: the same setting, so it cancels from
	// the field together with the time constant), with its uncertainty.
	Gain, GainSigma float64
}

// SearchCoil is a search coil read through an integrator. Its effective
// turns-area comes from the Calibration when one is given, else from the
// nominal Turns·Area (with their uncertainties).
type SearchCoil struct {
	Turns, TurnsSigma float64
	Area, AreaSigma   float64 // m², mean area of one turn
	Integrator        Integrator
	// ReadingSigma is the standard uncertainty of one gap reading (V or
	// V·s); zero estimates it from repeated pulls (at least two).
	ReadingSigma float64
	Calibration  *Calibration
	Alpha        float64 // rejection level of the calibration line tests; 0 means DefaultAlpha
}

// CoilConstant is a search coil's effective turns-area and how it was
// found.
type CoilConstant struct {
	TurnsArea, Sigma float64 // NAeff and its standard uncertainty, m²
	Calibrated       bool
	Fit              LineFit // calibration readings against solenoid current (Calibrated only)
	// fieldRel is the part of u(NAeff)/NAeff that does not cancel when the
	// same integrator reads the gap: the fit, the solenoid and any
	// separately stated calibration gain.
	fieldRel float64
	// scale is reading → λ for the calibration readings.
	scale float64
}

// SearchResult is the field found from the readings at one magnet current.
//
// Linkage is the mean flux-linkage change λ = mean reading · k_int
// (Wb-turns) with LinkageSigma from the readings and the integrator
// constants. Field = λ/NAeff with FieldSigma by GUM eq. 10; with a
// calibration by the same integrator, RC and gain cancel:
//
//	B = R̄ k_sol g_cal /(S g_gap),
//	(u(B)/B)² = (u(R̄)/R̄)² + (u(S)/S)² + (u(k_sol)/k_sol)² [+ (u(g_cal)/g_cal)² + (u(g_gap)/g_gap)²]
//
// the bracket only when a separate calibration gain is stated. Without a
// calibration,
//
//	(u(B)/B)² = (u(R̄)/R̄)² + (u(k_int)/k_int)² + (u(N)/N)² + (u(A)/A)².
type SearchResult struct {
	Field, FieldSigma     float64
	Linkage, LinkageSigma float64
}

func (c SearchCoil) validate() error {
	bad := func(format string, a ...any) error {
		return &ReadingsError{Method: "search-coil", Index: -1, Msg: fmt.Sprintf(format, a...)}
	}
	nonNeg := [...]struct {
		name string
		x    float64
	}{
		{"turns uncertainty", c.TurnsSigma}, {"area uncertainty", c.AreaSigma},
		{"time constant", c.Integrator.TimeConstant}, {"time-constant uncertainty", c.Integrator.TimeConstantSigma},
		{"gain", c.Integrator.Gain}, {"gain uncertainty", c.Integrator.GainSigma},
		{"reading uncertainty", c.ReadingSigma}, {"reject level", c.Alpha},
	}
	for _, v := range nonNeg {
		if !(v.x >= 0) || math.IsInf(v.x, 0) {
			return bad("%s %g must be finite and >= 0", v.name, v.x)
		}
	}
	if c.Alpha >= 1 {
		return bad("reject level %g must be below 1", c.Alpha)
	}
	if c.Calibration == nil {
		if !(c.Turns > 0) || !(c.Area > 0) || math.IsInf(c.Turns, 0) || math.IsInf(c.Area, 0) {
			return bad("without a calibration the coil's turns (%g) and area (%g m²) must be finite and > 0", c.Turns, c.Area)
		}
		return nil
	}
	cal := c.Calibration
	if !(cal.ReadingSigma >= 0) || math.IsInf(cal.ReadingSigma, 0) || !(cal.Gain >= 0) || math.IsInf(cal.Gain, 0) ||
		!(cal.GainSigma >= 0) || math.IsInf(cal.GainSigma, 0) {
		return &ReadingsError{Method: "calibration", Index: -1, Msg: "reading uncertainty, gain and gain uncertainty must be finite and >= 0"}
	}
	if cal.FieldPerAmpere != 0 || cal.FieldPerAmpereRelSigma != 0 {
		if !(cal.FieldPerAmpere > 0) || math.IsInf(cal.FieldPerAmpere, 0) || !(cal.FieldPerAmpereRelSigma >= 0) || math.IsInf(cal.FieldPerAmpereRelSigma, 0) {
			return &ReadingsError{Method: "calibration", Index: -1, Msg: fmt.Sprintf("field per ampere %g T/A must be finite and > 0, its relative uncertainty finite and >= 0", cal.FieldPerAmpere)}
		}
		return nil
	}
	return cal.Solenoid.validate()
}

// Calibrate returns the coil's effective turns-area: from the calibration
// run when there is one, else Turns·Area. Errors: *ReadingsError for bad
// constants or readings (non-finite, all currents zero, too few: 3 at 2
// distinct non-zero currents), *NotLineError when the calibration readings
// are not on a line through the origin.
func (c SearchCoil) Calibrate() (CoilConstant, error) {
	if err := c.validate(); err != nil {
		return CoilConstant{}, err
	}
	kInt, relInt := c.Integrator.scale()
	if c.Calibration == nil {
		na := c.Turns * c.Area
		rel := math.Hypot(c.TurnsSigma/c.Turns, c.AreaSigma/c.Area)
		return CoilConstant{TurnsArea: na, Sigma: na * rel, fieldRel: math.Hypot(rel, relInt), scale: kInt}, nil
	}
	cal := c.Calibration
	const method = "calibration"
	x := make([]float64, len(cal.Readings))
	y := make([]float64, len(cal.Readings))
	allZero := true
	for i, r := range cal.Readings {
		if math.IsNaN(r.Current) || math.IsInf(r.Current, 0) || math.IsNaN(r.Reading) || math.IsInf(r.Reading, 0) {
			return CoilConstant{}, &ReadingsError{Method: method, Index: i, Msg: fmt.Sprintf("(%g A, %g) is not finite; remove it or give the value read", r.Current, r.Reading)}
		}
		allZero = allZero && r.Current == 0
		x[i], y[i] = r.Current, r.Reading
	}
	if len(x) > 0 && allZero {
		return CoilConstant{}, &ReadingsError{Method: method, Index: -1, Msg: "every solenoid current is zero; calibrate at several non-zero currents"}
	}
	fit, err := fitLine(method, x, y, cal.ReadingSigma, ThroughOrigin, c.Alpha)
	if err != nil {
		return CoilConstant{}, err
	}
	if fit.Slope == 0 {
		return CoilConstant{}, &ReadingsError{Method: method, Index: -1, Msg: "the readings do not change with the solenoid current; check the coil and integrator connections"}
	}
	kSol, relSol := cal.FieldPerAmpere, cal.FieldPerAmpereRelSigma
	if kSol == 0 {
		kSol, relSol = cal.Solenoid.CentreConstant()
	}
	kCal, relCal := kInt, relInt
	gainRel := 0.0
	if cal.Gain > 0 {
		it := c.Integrator
		it.Gain, it.GainSigma = cal.Gain, cal.GainSigma
		kCal, relCal = it.scale()
		_, gGap := Integrator{Gain: c.Integrator.Gain, GainSigma: c.Integrator.GainSigma}.scale()
		gainRel = math.Hypot(cal.GainSigma/cal.Gain, gGap)
	}
	relFit := fit.SlopeSigma / math.Abs(fit.Slope)
	na := fit.Slope * kCal / kSol
	rel := math.Sqrt(relFit*relFit + relSol*relSol + relCal*relCal)
	k := CoilConstant{
		TurnsArea: na, Sigma: math.Abs(na) * rel, Calibrated: true, Fit: fit,
		fieldRel: math.Sqrt(relFit*relFit + relSol*relSol + gainRel*gainRel),
		scale:    kInt,
	}
	if math.IsNaN(na) || math.IsInf(na, 0) || math.IsNaN(k.Sigma) || math.IsInf(k.Sigma, 0) {
		return CoilConstant{}, &ReadingsError{Method: method, Index: -1, Msg: "the calibration gives no finite turns-area; check the units of the readings"}
	}
	return k, nil
}

// Field reduces the repeated readings of one magnet current (the coil
// pulled from the gap to a zero-field place, each pull one reading) to the
// gap field with the coil constant k from c.Calibrate. The reading's
// uncertainty is ReadingSigma/√n when stated, else the standard deviation
// of the mean of the repeats (Type A, GUM 4.2.3), which needs at least two.
func (c SearchCoil) Field(k CoilConstant, readings []float64) (SearchResult, error) {
	const method = "search-coil"
	if len(readings) == 0 {
		return SearchResult{}, &ReadingsError{Method: method, Index: -1, Msg: "no readings; give at least one integrator reading"}
	}
	if k.TurnsArea == 0 || k.scale == 0 {
		return SearchResult{}, &ReadingsError{Method: method, Index: -1, Msg: "no coil constant; call Calibrate first"}
	}
	mean, ur, err := meanSigma(method, readings, c.ReadingSigma)
	if err != nil {
		return SearchResult{}, err
	}
	if mean == 0 {
		return SearchResult{}, &ReadingsError{Method: method, Index: -1, Msg: "the mean reading is zero; no field was seen (check the integrator range and connections)"}
	}
	_, relInt := c.Integrator.scale()
	relR := ur / math.Abs(mean)
	var res SearchResult
	res.Linkage = mean * k.scale
	res.LinkageSigma = math.Abs(res.Linkage) * math.Hypot(relR, relInt)
	res.Field = res.Linkage / k.TurnsArea
	res.FieldSigma = math.Abs(res.Field) * math.Hypot(relR, k.fieldRel)
	for _, v := range [...]float64{res.Field, res.FieldSigma, res.Linkage, res.LinkageSigma} {
		if !num.Finite(v) {
			return SearchResult{}, &ReadingsError{Method: method, Index: -1, Msg: "the readings give no finite field; check their units (V or V s)"}
		}
	}
	return res, nil
}

// meanSigma returns the mean of v and its standard uncertainty: sigma/√n
// when sigma > 0, else the experimental standard deviation of the mean
// (JCGM 100:2008, eqs. 4-5), which needs two or more values.
func meanSigma(method string, v []float64, sigma float64) (mean, u float64, err error) {
	for i, x := range v {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return 0, 0, &ReadingsError{Method: method, Index: i, Msg: fmt.Sprintf("reading %g is not finite; remove it or give the value read", x)}
		}
		mean += x
	}
	n := float64(len(v))
	mean /= n
	if !num.Finite(mean) {
		return 0, 0, &ReadingsError{Method: method, Index: -1, Msg: "the readings overflow; check their units"}
	}
	if sigma > 0 {
		return mean, sigma / math.Sqrt(n), nil
	}
	if len(v) < 2 {
		return 0, 0, &ReadingsError{Method: method, Index: -1, Msg: "one reading with no stated uncertainty; repeat the reading or state the instrument's reading uncertainty"}
	}
	var ss float64
	for _, x := range v {
		ss += (x - mean) * (x - mean)
	}
	return mean, math.Sqrt(ss / (n - 1) / n), nil
}
