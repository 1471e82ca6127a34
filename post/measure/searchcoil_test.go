package measure_test

import (
	"errors"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"polegap/internal/num"
	"polegap/post/measure"
)

// TestSolenoid checks the finite-solenoid formulas (D. J. Griffiths,
// Introduction to Electrodynamics, 4th ed. 2017, Problem 5.11, on-axis
// field of a finite solenoid; problem number from memory).
func TestSolenoid(t *testing.T) {
	s := measure.Solenoid{Turns: 1000, Length: 0.5, Radius: 0.02}
	// Hand value: μ0 N I/√(L² + D²) = 4π×10⁻⁷·1000·1/√(0.25 + 0.0016)
	// = 1.2566371e-3/0.5015974 = 2.505270e-3 T; 7 figures, so 1e-6 relative.
	if got := s.CentreField(1); math.Abs(got-2.505270e-3) > 1e-6*2.505270e-3 {
		t.Errorf("centre field %.7g T, want 2.505270e-3", got)
	}
	// The exact on-axis formula at z = 0 is the centre formula (1e-14:
	// round-off of a few operations).
	for _, sol := range []measure.Solenoid{s, {Turns: 10, Length: 0.01, Radius: 0.05}} {
		if a, c := sol.AxisField(3, 0), sol.CentreField(3); math.Abs(a-c) > 1e-14*c {
			t.Errorf("%+v: axis field at centre %.15g, centre formula %.15g", sol, a, c)
		}
		// Symmetric about the centre.
		if a, b := sol.AxisField(1, 0.1), sol.AxisField(1, -0.1); math.Abs(a-b) > 1e-14*a {
			t.Errorf("%+v: B(0.1) %g != B(-0.1) %g", sol, a, b)
		}
	}
	// Long-solenoid limit μ0 N I/L (Griffiths 2017, the infinite solenoid
	// of sec. 5.3; section from memory): the centre field differs by
	// 1 − 1/√(1 + 4(R/L)²) ≈ 2(R/L)², and at the end of a long solenoid
	// the field is half the centre value: end/centre ≈ (1 + 1.5(R/L)²)/2.
	for _, r := range []float64{1e-1, 1e-2, 1e-3} {
		sol := measure.Solenoid{Turns: 500, Length: 1, Radius: r}
		long := num.Mu0 * 500 * 2 / 1
		rel := 1 - sol.CentreField(2)/long
		if want := 2 * r * r; math.Abs(rel-want) > 3*want*want+1e-15 {
			t.Errorf("R/L = %g: 1 − B/B_long = %.6g, want ≈ %.6g", r, rel, want)
		}
		end := sol.AxisField(2, 0.5) / sol.CentreField(2)
		if math.Abs(end-0.5) > r*r {
			t.Errorf("R/L = %g: end/centre = %.6g, want ≈ 0.5", r, end)
		}
	}
	// Far on the axis a solenoid is a dipole of moment m = N I π R²:
	// B = μ0 m/(2π z³) (the field of a magnetic dipole on its axis,
	// Griffiths 2017, sec. 5.4.2, from memory); at z = 100 L the
	// difference is O((L/z)²) = 1e-4, so 1e-3 relative is asserted.
	sol := measure.Solenoid{Turns: 100, Length: 0.1, Radius: 0.02}
	z := 10.0
	dip := num.Mu0 * 100 * 1 * math.Pi * 0.02 * 0.02 / (2 * math.Pi * z * z * z)
	if got := sol.AxisField(1, z); math.Abs(got-dip) > 1e-3*dip {
		t.Errorf("far field %.6g, dipole %.6g", got, dip)
	}
}

// TestSolenoidConstantSigma checks CentreConstant's relative uncertainty
// against central finite differences of ln k (JCGM 100:2008 allows
// sensitivity coefficients found numerically, 5.1.3 as remembered).
func TestSolenoidConstantSigma(t *testing.T) {
	s := measure.Solenoid{Turns: 800, TurnsSigma: 2, Length: 0.3, LengthSigma: 1e-3, Radius: 0.04, RadiusSigma: 5e-4, CurrentRelSigma: 2e-3}
	_, rel := s.CentreConstant()
	lnk := func(N, L, R float64) float64 {
		return math.Log(measure.Solenoid{Turns: N, Length: L, Radius: R}.CentreField(1))
	}
	h := 1e-6
	dN := (lnk(800*(1+h), 0.3, 0.04) - lnk(800*(1-h), 0.3, 0.04)) / (2 * h * 800) * 2
	dL := (lnk(800, 0.3*(1+h), 0.04) - lnk(800, 0.3*(1-h), 0.04)) / (2 * h * 0.3) * 1e-3
	dR := (lnk(800, 0.3, 0.04*(1+h)) - lnk(800, 0.3, 0.04*(1-h))) / (2 * h * 0.04) * 5e-4
	want := math.Sqrt(dN*dN + dL*dL + dR*dR + 2e-3*2e-3)
	// Central differences with h = 1e-6 are good to about 1e-8 relative.
	if math.Abs(rel-want) > 1e-6*want {
		t.Errorf("relative u(k) = %.9g, finite differences %.9g", rel, want)
	}
}

// TestSearchCoilWorkedExamples checks the search-coil reduction against
// hand computations by the GUM law of propagation (JCGM 100:2008, eq. 10,
// relative form for products of powers; Type A mean, eqs. 4-5).
func TestSearchCoilWorkedExamples(t *testing.T) {
	check := func(name string, got, want float64) {
		t.Helper()
		// Hand values to 6 figures: 1e-5 relative.
		if math.Abs(got-want) > 1e-5*math.Abs(want) {
			t.Errorf("%s = %.7g, want %.7g", name, got, want)
		}
	}
	// Uncalibrated: N = 100, A = 1e-4 ± 1e-6 m², RC = 0.1 ± 2e-4 s,
	// gain 10 ± 0.01; readings 0.500, 0.502, 0.498 V with no stated sigma:
	//	mean 0.5 V, s = 0.002 V, u(mean) = 0.002/√3 = 1.15470e-3 V (0.23094 %)
	//	λ = 0.5 · 0.1/10 = 5e-3 Wb-turns, B = λ/(N A) = 0.5 T
	//	(u(λ)/λ)² = 5.3333e-6 + (2e-3)² + (1e-3)² = 1.03333e-5 → u(λ) = 1.60728e-5
	//	(u(B)/B)² = 1.03333e-5 + (1e-2)² = 1.103333e-4 → u(B) = 5.25198e-3 T
	sc := measure.SearchCoil{Turns: 100, Area: 1e-4, AreaSigma: 1e-6,
		Integrator: measure.Integrator{TimeConstant: 0.1, TimeConstantSigma: 2e-4, Gain: 10, GainSigma: 0.01}}
	k, err := sc.Calibrate()
	if err != nil {
		t.Fatal(err)
	}
	res, err := sc.Field(k, []float64{0.500, 0.502, 0.498})
	if err != nil {
		t.Fatal(err)
	}
	check("NA", k.TurnsArea, 1e-2)
	check("u(NA)", k.Sigma, 1e-4)
	check("λ", res.Linkage, 5e-3)
	check("u(λ)", res.LinkageSigma, 1.60728e-5)
	check("B", res.Field, 0.5)
	check("u(B)", res.FieldSigma, 5.25198e-3)

	// Calibrated in a solenoid N = 1000, L = 0.5 ± 5e-4 m, R = 0.02 ± 2e-4 m,
	// current scale ± 0.1 %: k_sol = 2.505270e-3 T/A (TestSolenoid). The
	// readings are exactly 0.1 V/A at 2..10 A with a stated 2 mV:
	//	u(S) = 0.002/√Σi² = 0.002/√220 = 1.34840e-4 V/A (0.134840 %)
	//	(u(k)/k)² = (0.5/0.2516 · 5e-4)² + (4·0.02/0.2516 · 2e-4)² + (1e-3)² = 1.991366e-6
	// Gap readings 0.3, 0.3 V with a stated 2 mV: u(mean) = 1.41421e-3 V (0.471405 %).
	// The same integrator reads both, so RC and gain cancel:
	//	B = 0.3 · k_sol/0.1 = 7.515810e-3 T
	//	(u(B)/B)² = 2.222222e-5 + 1.818182e-6 + 1.991366e-6 = 2.603177e-5
	//	u(B) = 7.515810e-3 · 5.102134e-3 = 3.834667e-5 T
	sc.Calibration = &measure.Calibration{
		Solenoid:     measure.Solenoid{Turns: 1000, Length: 0.5, LengthSigma: 5e-4, Radius: 0.02, RadiusSigma: 2e-4, CurrentRelSigma: 1e-3},
		ReadingSigma: 0.002,
	}
	for _, i := range []float64{2, 4, 6, 8, 10} {
		sc.Calibration.Readings = append(sc.Calibration.Readings, measure.CalReading{Current: i, Reading: 0.1 * i})
	}
	sc.ReadingSigma = 0.002
	k, err = sc.Calibrate()
	if err != nil {
		t.Fatal(err)
	}
	res, err = sc.Field(k, []float64{0.3, 0.3})
	if err != nil {
		t.Fatal(err)
	}
	// NAeff = S k_int/k_sol = 0.1 · (0.1/10)/2.505270e-3 = 0.399159 m².
	check("NAeff", k.TurnsArea, 0.1*0.01/2.505270e-3)
	check("B", res.Field, 7.515810e-3)
	check("u(B)", res.FieldSigma, 3.834667e-5)
	if !k.Calibrated {
		t.Errorf("Calibrated false")
	}

	// The same, but calibrated at gain 200 ± 0.4 while the gap is read at
	// gain 10 ± 0.02: B = 0.3 · k_sol/0.1 · 200/10 = 0.1503162 T and the two
	// gains' relative uncertainties (0.2 % each) no longer cancel:
	//	(u(B)/B)² = 2.603177e-5 + 4e-6 + 4e-6 = 3.403177e-5
	//	u(B) = 0.1503162 · 5.833676e-3 = 8.768960e-4 T
	sc.Integrator.GainSigma = 0.02
	sc.Calibration.Gain, sc.Calibration.GainSigma = 200, 0.4
	k, err = sc.Calibrate()
	if err != nil {
		t.Fatal(err)
	}
	res, err = sc.Field(k, []float64{0.3, 0.3})
	if err != nil {
		t.Fatal(err)
	}
	check("B, separate gains", res.Field, 0.1503162)
	check("u(B), separate gains", res.FieldSigma, 8.768960e-4)
}

// TestSearchCoilRecovers draws calibration and gap readings with random
// noise only and checks coverage of ±3u (at least 98 %; normal 99.73 %,
// JCGM 100:2008 Table G.1) and that the scatter of B matches u within 20 %
// over 400 runs (about 3.5 % sampling error).
func TestSearchCoilRecovers(t *testing.T) {
	const (
		na    = 0.0196
		rc    = 0.1
		gain  = 10.0
		gainC = 200.0
		sig   = 2e-3
		runs  = 400
		bTrue = 0.6
	)
	sol := measure.Solenoid{Turns: 1000, Length: 0.5, Radius: 0.02}
	rng := rand.New(rand.NewPCG(1, 1))
	var in, n int
	var sumD2, sumU2 float64
	for run := 0; run < runs; run++ {
		cal := &measure.Calibration{Solenoid: sol, ReadingSigma: sig, Gain: gainC}
		for _, i := range []float64{2, 4, 6, 8, 10} {
			cal.Readings = append(cal.Readings, measure.CalReading{Current: i, Reading: na*sol.CentreField(i)*gainC/rc + sig*rng.NormFloat64()})
		}
		sc := measure.SearchCoil{Integrator: measure.Integrator{TimeConstant: rc, Gain: gain}, ReadingSigma: sig, Calibration: cal}
		k, err := sc.Calibrate()
		if err != nil {
			var nl *measure.NotLineError
			if errors.As(err, &nl) {
				continue
			}
			t.Fatal(err)
		}
		var rd []float64
		for p := 0; p < 3; p++ {
			rd = append(rd, na*bTrue*gain/rc+sig*rng.NormFloat64())
		}
		res, err := sc.Field(k, rd)
		if err != nil {
			t.Fatal(err)
		}
		n++
		d := res.Field - bTrue
		sumD2 += d * d
		sumU2 += res.FieldSigma * res.FieldSigma
		if math.Abs(d) < 3*res.FieldSigma {
			in++
		}
	}
	if n < runs*49/50 {
		t.Errorf("%d of %d good calibrations rejected", runs-n, runs)
	}
	cov, ratio := float64(in)/float64(n), math.Sqrt(sumD2/sumU2)
	t.Logf("coverage %.3f, scatter/u %.3f", cov, ratio)
	if cov < 0.98 || ratio < 0.8 || ratio > 1.25 {
		t.Errorf("coverage of ±3u %.3f (want >= 0.98), scatter/u %.3f (want 0.8..1.25)", cov, ratio)
	}
}

func TestSearchCoilRejects(t *testing.T) {
	sol := measure.Solenoid{Turns: 1000, Length: 0.5, Radius: 0.02}
	cal := func(pairs ...float64) *measure.Calibration {
		c := &measure.Calibration{Solenoid: sol}
		for k := 0; k+1 < len(pairs); k += 2 {
			c.Readings = append(c.Readings, measure.CalReading{Current: pairs[k], Reading: pairs[k+1]})
		}
		return c
	}
	good := cal(1, 0.1, 2, 0.2, 3, 0.3001, 4, 0.3999)
	it := measure.Integrator{TimeConstant: 0.1, Gain: 10}
	for _, tc := range []struct {
		name     string
		sc       measure.SearchCoil
		readings []float64
		want     string
	}{
		{"no coil", measure.SearchCoil{Integrator: it}, []float64{1, 1}, "turns"},
		{"too few calibration", measure.SearchCoil{Integrator: it, Calibration: cal(1, 0.1, 2, 0.2)}, []float64{1, 1}, "at least 3"},
		{"zero solenoid current", measure.SearchCoil{Integrator: it, Calibration: cal(0, 0.1, 0, 0.2, 0, 0.3)}, []float64{1, 1}, "every solenoid current is zero"},
		{"NaN calibration", measure.SearchCoil{Integrator: it, Calibration: cal(1, math.NaN(), 2, 0.2, 3, 0.3)}, []float64{1, 1}, "not finite"},
		{"curved calibration", measure.SearchCoil{Integrator: it, Calibration: cal(1, 0.1, 2, 0.4, 3, 0.9, 4, 1.6, 5, 2.5001)}, []float64{1, 1}, "not on a straight line"},
		{"short solenoid", measure.SearchCoil{Integrator: it, Calibration: &measure.Calibration{Solenoid: measure.Solenoid{Turns: 10, Length: 0.05, Radius: 0.02}}}, []float64{1}, "shorter than two diameters"},
		{"negative gain", measure.SearchCoil{Integrator: measure.Integrator{Gain: -1}, Calibration: good}, []float64{1, 1}, "gain"},
		{"one reading, no sigma", measure.SearchCoil{Integrator: it, Calibration: good}, []float64{1}, "one reading"},
		{"no readings", measure.SearchCoil{Integrator: it, Calibration: good}, nil, "no readings"},
		{"NaN reading", measure.SearchCoil{Integrator: it, Calibration: good}, []float64{1, math.Inf(-1)}, "not finite"},
		{"zero reading", measure.SearchCoil{Integrator: it, Calibration: good}, []float64{1, -1}, "zero"},
	} {
		k, err := tc.sc.Calibrate()
		if err == nil {
			_, err = tc.sc.Field(k, tc.readings)
		}
		if err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%s: error %v, want one saying %q", tc.name, err, tc.want)
		}
	}
}

// TestProbe checks the direct reduction against a hand value (GUM eq. 10):
// readings 0.500, 0.504 T with a stated 2 mT and a 0.5 % scale:
// u² = (0.002/√2)² + (0.005 · 0.502)² = 2e-6 + 6.3001e-6 → u = 2.88099e-3 T.
func TestProbe(t *testing.T) {
	b, u, err := measure.Probe{Sigma: 0.002, RelSigma: 0.005}.Field([]float64{0.500, 0.504})
	if err != nil || math.Abs(b-0.502) > 1e-12 || math.Abs(u-2.88099e-3) > 1e-5*2.88099e-3 {
		t.Errorf("B = %g ± %g (%v), want 0.502 ± 2.88099e-3", b, u, err)
	}
	if _, _, err := (measure.Probe{}).Field([]float64{0.5}); err == nil {
		t.Errorf("one reading without a sigma: no error")
	}
}

// TestFieldPerAmpere: a calibration given B/I directly (as from an
// axisymmetric solve) gives the same turns-area as the finite-solenoid
// formula with the same value, to round-off (1e-14).
func TestFieldPerAmpere(t *testing.T) {
	sol := measure.Solenoid{Turns: 1000, Length: 0.5, Radius: 0.02}
	var rs []measure.CalReading
	for _, i := range []float64{2, 4, 6, 8} {
		rs = append(rs, measure.CalReading{Current: i, Reading: 0.05*i + 1e-4*math.Sin(i)})
	}
	it := measure.Integrator{TimeConstant: 0.1, Gain: 10}
	a, err := measure.SearchCoil{Integrator: it, Calibration: &measure.Calibration{Solenoid: sol, Readings: rs}}.Calibrate()
	if err != nil {
		t.Fatal(err)
	}
	k, _ := sol.CentreConstant()
	b, err := measure.SearchCoil{Integrator: it, Calibration: &measure.Calibration{FieldPerAmpere: k, Readings: rs}}.Calibrate()
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(a.TurnsArea-b.TurnsArea) > 1e-14*a.TurnsArea || math.Abs(a.Sigma-b.Sigma) > 1e-12*a.Sigma {
		t.Errorf("formula %g ± %g, field per ampere %g ± %g", a.TurnsArea, a.Sigma, b.TurnsArea, b.Sigma)
	}
	if _, err := (measure.SearchCoil{Integrator: it, Calibration: &measure.Calibration{FieldPerAmpere: -1, Readings: rs}}).Calibrate(); err == nil {
		t.Errorf("negative field per ampere: no error")
	}
}
