package measure

import (
	"fmt"
	"math"

	"polegap/internal/num"
)

// The ring method (IEC 60404-4, d.c. magnetic properties of soft
// materials; method as remembered, the standard was not read): a toroidal
// sample of the material carries a magnetising winding of N1 turns and a
// search winding of N2 turns read by an integrating fluxmeter. For each
// magnetising current I (reversed from +I to -I, or switched on from the
// demagnetised state) the integrator's reading R gives the change of flux
// linkage k·R, k the integrator's scale in Wb-turns per reading unit.
//
// Field strength. Inside the ring H(r) = N1 I / (2π r) falls across the
// section from the inner to the outer radius. The mean of H over the
// section's width is N1 I / l with the logarithmic mean path length
//
//	l = π (D - d) / ln(D/d)
//
// (D, d the outer and inner diameters). For a thin ring it tends to the
// arithmetic mean circumference π (D + d)/2, which is longer: for
// D/d = 1.25 the two differ by 0.4 %, for 1.4 by 0.9 %. RingPathLog
// (the default) uses the logarithmic mean, RingPathMean the arithmetic.
// Either way the steel is not uniformly magnetised across a thick ring:
// the search winding sees the section's mean B, which is B at the mean H
// only for a linear material. Reduce corrects for it (the nonuniformity
// correction, RingPoint.Nonuniform): it finds the curve whose mean over
// the section, H(r) = H l/(2π r), reproduces the measured means at every
// point, by the fixed-point iteration B_c ← B_c + (B_measured - mean of
// B_c over the section) with B_c interpolated linearly in ln H between
// the points, and reports B_c. The correction is second order in the
// spread of H (about (D - d)/(D + d)) and largest where the curve bends
// most; since it rests on the interpolation between the points, its own
// size is counted as a standard uncertainty of B (our choice, cautious).
// Rings with D/d above 1.4 get a note (the ring standards limit D/d; 1.4
// is from memory).
//
// Flux density. With A the steel's cross-section and A2 the mean area of
// one search turn (wound over the steel and its insulation),
//
//	B = k R / (s N2 A) - μ0 H (A2 - A)/A
//
// where s = 2 for a reversal and 1 for a step, and the second term removes
// the flux of the air between the steel and the search winding. A is
// h (D - d)/2 from the height h, or m / (ρ π (D + d)/2) from the mass m
// and density ρ.
//
// Uncertainties: each of H and B is a function of the inputs (current,
// mean reading, D, d, h or m and ρ, A2, k), and its standard uncertainty
// is the law of propagation for uncorrelated inputs (JCGM 100:2008,
// eq. 10), with the sensitivity coefficients found by central
// differences (JCGM 100:2008, 5.1.3 note 2). The scale k comes from a
// calibration with a mutual inductor: a current change ΔI in its primary
// gives M ΔI Wb-turns, k = M ΔI / R_cal.

// Path-length rules of a ring.
const (
	RingPathLog  = "logarithmic" // π (D - d) / ln(D/d), the default
	RingPathMean = "arithmetic"  // π (D + d) / 2
)

// Switching modes of a ring measurement.
const (
	RingReversal = "reversal" // the current reversed from +I to -I: flux change 2Φ
	RingStep     = "step"     // the current switched on from the demagnetised state: flux change Φ
)

// Ring is a ring sample, its windings and its integrator. Lengths in m,
// areas in m², mass in kg, density in kg/m³; sigmas are standard
// uncertainties in the same units, RelSigma relative ones.
type Ring struct {
	Outer, OuterSigma float64 // D
	Inner, InnerSigma float64 // d
	// Height, or Mass and Density, give the cross-section.
	Height, HeightSigma   float64
	Mass, MassSigma       float64
	Density, DensitySigma float64
	Path                  string // RingPathLog ("" too) or RingPathMean

	N1, N2 float64 // turns of the magnetising and search windings
	// SearchArea is the mean area of one search turn (m²); 0 means the
	// search winding lies on the steel (no air-flux correction).
	SearchArea, SearchAreaSigma float64

	Switching string // RingReversal ("" too) or RingStep

	// Scale is the integrator's Wb-turns per reading unit, with its
	// relative uncertainty, when given directly; Calibration, when not
	// nil, replaces it.
	Scale, ScaleRelSigma float64
	Calibration          *RingCalibration

	CurrentRelSigma float64 // relative uncertainty of the magnetising current
	CurrentSigma    float64 // absolute part, A
	// ReadingSigma is the standard uncertainty of one reading; 0
	// estimates it from the repeats (at least two then).
	ReadingSigma float64
}

// RingCalibration is the integrator's calibration by a mutual inductor:
// each reading is of the change of flux linkage M·CurrentChange.
type RingCalibration struct {
	Mutual, MutualRelSigma               float64 // H
	CurrentChange, CurrentChangeRelSigma float64 // A
	Readings                             []float64
	ReadingSigma                         float64 // one reading; 0: from the scatter
}

// RingReading is one magnetising current and its integrator readings.
type RingReading struct {
	Current  float64 // A, the magnitude switched
	Readings []float64
}

// RingPoint is one reduced point.
type RingPoint struct {
	Current       float64
	H, HSigma     float64 // A/m
	B, BSigma     float64 // T
	AirCorrection float64 // T, the air flux subtracted
	// Nonuniform (T) is the nonuniformity correction added to the
	// section's mean B (see Ring); it is included in BSigma.
	Nonuniform      float64
	Reading, RSigma float64 // mean reading and its standard uncertainty
}

// RingResult is a reduced ring measurement.
type RingResult struct {
	Points []RingPoint
	// Path (m) is the mean path length used and PathRule its rule;
	// PathMean is the arithmetic mean circumference, for comparison.
	Path, PathMean float64
	PathRule       string
	Area           float64 // m², the steel's cross-section
	Scale          float64 // Wb-turns per reading unit
	ScaleRelSigma  float64
	RatioDd        float64 // D/d
	Iterations     int     // of the nonuniformity correction
	Notes          []string
}

// RingMaxRatio is the largest D/d reduced without a note: thicker rings
// are magnetised too unevenly for a reliable curve (1.4, the limit of the
// comparable a.c. ring of IEC 60404-6; from memory).
const RingMaxRatio = 1.4

// ringInputs indexes the inputs whose uncertainties propagate.
const (
	inI = iota
	inR
	inD
	inDi
	inH
	inM
	inRho
	inA2
	inK
	nIn
)

// Reduce reduces the readings. Errors are *ReadingsError values with
// method "ring" (or "calibration") naming the offending reading.
func (r Ring) Reduce(readings []RingReading) (*RingResult, error) {
	if err := r.validate(); err != nil {
		return nil, err
	}
	if len(readings) < 2 {
		return nil, &ReadingsError{Method: "ring", Index: -1, Msg: fmt.Sprintf("%d readings; give at least two magnetising currents", len(readings))}
	}
	k, kRel, err := r.scale()
	if err != nil {
		return nil, err
	}
	res := &RingResult{Scale: k, ScaleRelSigma: kRel, RatioDd: r.Outer / r.Inner, PathRule: r.path()}
	x0 := r.nominal(k)
	res.Path, res.PathMean = r.pathLength(x0), math.Pi*(r.Outer+r.Inner)/2
	res.Area = r.area(x0)
	for i, rd := range readings {
		if !(rd.Current > 0) || math.IsInf(rd.Current, 0) {
			return nil, &ReadingsError{Method: "ring", Index: i, Msg: fmt.Sprintf("magnetising current %g A must be finite and > 0", rd.Current)}
		}
		mean, su, err := meanReading(rd.Readings, r.ReadingSigma)
		if err != nil {
			return nil, &ReadingsError{Method: "ring", Index: i, Msg: err.Error()}
		}
		if !(mean > 0) {
			return nil, &ReadingsError{Method: "ring", Index: i, Msg: "the mean reading is not positive; read the flux change of the reversal with the integrator's sign (swap the search leads)"}
		}
		x := x0
		x[inI], x[inR] = rd.Current, mean
		var u [nIn]float64
		u[inI] = math.Hypot(r.CurrentRelSigma*rd.Current, r.CurrentSigma)
		u[inR] = su
		u[inD], u[inDi] = r.OuterSigma, r.InnerSigma
		u[inH], u[inM], u[inRho] = r.HeightSigma, r.MassSigma, r.DensitySigma
		u[inA2] = r.SearchAreaSigma
		u[inK] = kRel * k
		p := RingPoint{Current: rd.Current, Reading: mean, RSigma: su}
		p.H, p.HSigma = propagate(r.fieldH, x, u)
		p.B, p.BSigma = propagate(r.fieldB, x, u)
		p.AirCorrection = r.air(x)
		if i > 0 {
			q := res.Points[i-1]
			if !(p.H > q.H) || !(p.B > q.B) {
				return nil, &ReadingsError{Method: "ring", Index: i, Msg: fmt.Sprintf("H = %.4g A/m, B = %.4g T does not rise above the previous point (%.4g A/m, %.4g T); give the currents in rising order and check the reading", p.H, p.B, q.H, q.B)}
			}
		}
		res.Points = append(res.Points, p)
	}
	res.Iterations = nonuniform(res.Points, res.Path, r.Inner/2, r.Outer/2)
	if res.RatioDd > RingMaxRatio {
		res.Notes = append(res.Notes, fmt.Sprintf("D/d = %.3g exceeds %.1f: the ring is magnetised unevenly across its section; the nonuniformity correction and its uncertainty grow with it; prefer a thinner ring", res.RatioDd, RingMaxRatio))
	}
	if r.SearchArea == 0 {
		res.Notes = append(res.Notes, "no search-area given: no correction for the air flux inside the search winding (right only for a winding lying on the steel)")
	}
	return res, nil
}

// nonuniform applies the thick ring's nonuniformity correction to the
// points (see Ring) and returns the iterations taken. path is the path
// length the points' H were computed with; ri and ro are the section's
// inner and outer radii.
func nonuniform(ps []RingPoint, path, ri, ro float64) int {
	const (
		nr      = 64 // Simpson intervals over the section's width
		maxIter = 50
		tol     = 1e-7 // T
	)
	n := len(ps)
	h := make([]float64, n)
	meas := make([]float64, n)
	bc := make([]float64, n)
	for i, p := range ps {
		h[i], meas[i], bc[i] = p.H, p.B, p.B
	}
	// The ratio H(r)/H over the section, with Simpson weights summing to
	// 1 (the mean over the width; error of order (width/nr)^4, 1e-9
	// relative or less for any ring with D/d below 2).
	ratio := make([]float64, nr+1)
	wt := make([]float64, nr+1)
	for k := range ratio {
		r := ri + float64(k)*(ro-ri)/nr
		ratio[k] = path / (2 * math.Pi * r)
		switch {
		case k == 0 || k == nr:
			wt[k] = 1.0 / (3 * nr)
		case k%2 == 1:
			wt[k] = 4.0 / (3 * nr)
		default:
			wt[k] = 2.0 / (3 * nr)
		}
	}
	it := 0
	for ; it < maxIter; it++ {
		change := 0.0
		next := make([]float64, n)
		c := newLogLog(h, bc)
		for i := range ps {
			var avg float64
			for k, q := range ratio {
				avg += wt[k] * c.at(h[i]*q)
			}
			next[i] = bc[i] + meas[i] - avg
			change = math.Max(change, math.Abs(next[i]-bc[i]))
		}
		bc = next
		if change < tol {
			break
		}
	}
	for i := 1; i < n; i++ {
		if !(bc[i] > bc[i-1]) {
			// The correction would break monotonicity: keep the section
			// means and count the would-be correction as uncertainty.
			for j := range ps {
				c := bc[j] - meas[j]
				ps[j].BSigma = math.Hypot(ps[j].BSigma, c)
			}
			return it
		}
	}
	for i := range ps {
		c := bc[i] - meas[i]
		ps[i].Nonuniform = c
		ps[i].B = bc[i]
		ps[i].BSigma = math.Hypot(ps[i].BSigma, c)
	}
	return it
}

// logLog is a monotone cubic Hermite interpolant of ln B against ln H
// through the points (slopes by the weighted harmonic mean of F. N.
// Fritsch and J. Butland, SIAM J. Sci. Stat. Comput. 5(2), 1984), extended
// as a power law with the end slopes. A power law, and so a linear
// material, is reproduced exactly.
type logLog struct {
	x, y, d []float64
}

func newLogLog(h, b []float64) *logLog {
	n := len(h)
	l := &logLog{x: make([]float64, n), y: make([]float64, n), d: make([]float64, n)}
	for i := range h {
		l.x[i], l.y[i] = math.Log(h[i]), math.Log(b[i])
	}
	del := make([]float64, n-1)
	for i := range del {
		del[i] = (l.y[i+1] - l.y[i]) / (l.x[i+1] - l.x[i])
	}
	l.d[0], l.d[n-1] = del[0], del[n-2]
	for i := 1; i < n-1; i++ {
		if del[i-1]*del[i] <= 0 {
			continue
		}
		h0, h1 := l.x[i]-l.x[i-1], l.x[i+1]-l.x[i]
		w1, w2 := 2*h1+h0, h1+2*h0
		l.d[i] = (w1 + w2) / (w1/del[i-1] + w2/del[i])
	}
	return l
}

func (l *logLog) at(hv float64) float64 {
	x := math.Log(hv)
	n := len(l.x)
	switch {
	case x <= l.x[0]:
		return math.Exp(l.y[0] + l.d[0]*(x-l.x[0]))
	case x >= l.x[n-1]:
		return math.Exp(l.y[n-1] + l.d[n-1]*(x-l.x[n-1]))
	}
	i := 0
	for i < n-2 && l.x[i+1] < x {
		i++
	}
	hh := l.x[i+1] - l.x[i]
	t := (x - l.x[i]) / hh
	t2, t3 := t*t, t*t*t
	return math.Exp((2*t3-3*t2+1)*l.y[i] + (t3-2*t2+t)*hh*l.d[i] + (-2*t3+3*t2)*l.y[i+1] + (t3-t2)*hh*l.d[i+1])
}

// propagate returns f(x) and its standard uncertainty by GUM eq. 10 with
// central-difference sensitivities.
func propagate(f func([nIn]float64) float64, x, u [nIn]float64) (float64, float64) {
	v := f(x)
	var ss float64
	for i := range x {
		if u[i] == 0 {
			continue
		}
		h := 1e-4 * u[i]
		xp, xm := x, x
		xp[i] += h
		xm[i] -= h
		c := (f(xp) - f(xm)) / (2 * h)
		ss += c * c * u[i] * u[i]
	}
	return v, math.Sqrt(ss)
}

func (r Ring) nominal(k float64) [nIn]float64 {
	var x [nIn]float64
	x[inD], x[inDi], x[inH], x[inM], x[inRho], x[inA2], x[inK] = r.Outer, r.Inner, r.Height, r.Mass, r.Density, r.SearchArea, k
	return x
}

func (r Ring) path() string {
	if r.Path == "" {
		return RingPathLog
	}
	return r.Path
}

func (r Ring) pathLength(x [nIn]float64) float64 {
	if r.path() == RingPathMean {
		return math.Pi * (x[inD] + x[inDi]) / 2
	}
	return math.Pi * (x[inD] - x[inDi]) / math.Log(x[inD]/x[inDi])
}

func (r Ring) area(x [nIn]float64) float64 {
	if r.Height > 0 {
		return x[inH] * (x[inD] - x[inDi]) / 2
	}
	return x[inM] / (x[inRho] * math.Pi * (x[inD] + x[inDi]) / 2)
}

func (r Ring) fieldH(x [nIn]float64) float64 { return r.N1 * x[inI] / r.pathLength(x) }

func (r Ring) air(x [nIn]float64) float64 {
	if r.SearchArea == 0 {
		return 0
	}
	a := r.area(x)
	return num.Mu0 * r.fieldH(x) * (x[inA2] - a) / a
}

func (r Ring) fieldB(x [nIn]float64) float64 {
	s := 2.0
	if r.Switching == RingStep {
		s = 1
	}
	return x[inK]*x[inR]/(s*r.N2*r.area(x)) - r.air(x)
}

// scale returns the integrator's scale and its relative uncertainty.
func (r Ring) scale() (float64, float64, error) {
	c := r.Calibration
	if c == nil {
		return r.Scale, r.ScaleRelSigma, nil
	}
	mean, su, err := meanReading(c.Readings, c.ReadingSigma)
	if err != nil {
		return 0, 0, &ReadingsError{Method: "calibration", Index: -1, Msg: err.Error()}
	}
	if !(mean > 0) {
		return 0, 0, &ReadingsError{Method: "calibration", Index: -1, Msg: "the mean calibration reading is not positive"}
	}
	k := c.Mutual * c.CurrentChange / mean
	rel := math.Sqrt(c.MutualRelSigma*c.MutualRelSigma + c.CurrentChangeRelSigma*c.CurrentChangeRelSigma + (su/mean)*(su/mean))
	return k, rel, nil
}

// meanReading returns the mean of repeated readings and its standard
// uncertainty: sigma/√n when sigma is stated, else the standard deviation
// of the mean (Type A; at least two readings).
func meanReading(rs []float64, sigma float64) (float64, float64, error) {
	n := len(rs)
	if n == 0 {
		return 0, 0, fmt.Errorf("no readings")
	}
	var s float64
	for _, v := range rs {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return 0, 0, fmt.Errorf("a reading is not finite")
		}
		s += v
	}
	mean := s / float64(n)
	if sigma > 0 {
		return mean, sigma / math.Sqrt(float64(n)), nil
	}
	if n < 2 {
		return 0, 0, fmt.Errorf("one reading and no reading-sigma; repeat the reading or state its uncertainty")
	}
	var ss float64
	for _, v := range rs {
		ss += (v - mean) * (v - mean)
	}
	return mean, math.Sqrt(ss / float64(n-1) / float64(n)), nil
}

func (r Ring) validate() error {
	bad := func(format string, a ...any) error {
		return &ReadingsError{Method: "ring", Index: -1, Msg: fmt.Sprintf(format, a...)}
	}
	fin := func(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
	if !(r.Outer > r.Inner && r.Inner > 0) || !fin(r.Outer) {
		return bad("the outer diameter %g m must exceed the inner diameter %g m > 0", r.Outer, r.Inner)
	}
	switch {
	case r.Height > 0 && r.Mass == 0 && r.Density == 0:
	case r.Height == 0 && r.Mass > 0 && r.Density > 0:
	default:
		return bad("give the ring's height, or its mass and density (not both)")
	}
	if !(r.N1 > 0 && r.N2 > 0) {
		return bad("the windings' turns (%g, %g) must be > 0", r.N1, r.N2)
	}
	if r.Path != "" && r.Path != RingPathLog && r.Path != RingPathMean {
		return bad("path %q is not %s or %s", r.Path, RingPathLog, RingPathMean)
	}
	if r.Switching != "" && r.Switching != RingReversal && r.Switching != RingStep {
		return bad("switching %q is not %s or %s", r.Switching, RingReversal, RingStep)
	}
	if r.SearchArea < 0 {
		return bad("search-area %g m² must be >= 0", r.SearchArea)
	}
	if r.Calibration == nil && !(r.Scale > 0) {
		return bad("give the integrator's scale (Wb-turns per reading unit) or a calibration")
	}
	if c := r.Calibration; c != nil && !(c.Mutual > 0 && c.CurrentChange > 0) {
		return bad("the calibration's mutual inductance %g H and current change %g A must be > 0", c.Mutual, c.CurrentChange)
	}
	for _, v := range []float64{r.OuterSigma, r.InnerSigma, r.HeightSigma, r.MassSigma, r.DensitySigma, r.SearchAreaSigma, r.ScaleRelSigma, r.CurrentRelSigma, r.CurrentSigma, r.ReadingSigma} {
		if !(v >= 0) || !fin(v) {
			return bad("every uncertainty must be finite and >= 0")
		}
	}
	return nil
}
