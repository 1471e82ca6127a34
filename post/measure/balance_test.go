package measure_test

import (
	"errors"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"polegap/post/measure"
)

// TestBalanceWorkedExample checks the reduction and the uncertainty
// propagation against a hand computation, by the GUM law of propagation of
// uncertainty (JCGM 100:2008, eq. 10; relative form for B = b g / L).
//
// Readings i = 1..5 A, m = 0.5 g + 2 g/A · i + e, e = (−1, 2, 0, −2, 1)×10 mg.
// e is orthogonal to 1, i and the centred i², so the fit returns b = 2e-3
// kg/A and a = 5e-4 kg exactly, with residuals e and no curvature.
//
//	SSR = 10·(1e-5)² = 1e-9 kg², dof = 5 − 2 = 3, s² = SSR/3 = 3.3333e-10 kg²
//	Sxx = Σ(i − 3)² = 10 A², u(b) = √(s²/Sxx) = 5.7735e-6 kg/A (Type A)
//	B = b g/L = 2e-3 · 9.80665 / 0.05 = 0.392266 T
//	(u(B)/B)² = (5.7735e-6/2e-3)² + (2e-4/0.05)² = 8.3333e-6 + 1.6e-5 = 2.4333e-5
//	u(B) = 0.392266 · 4.93288e-3 = 1.93500e-3 T
func TestBalanceWorkedExample(t *testing.T) {
	e := []float64{-1, 2, 0, -2, 1}
	var r []measure.BalanceReading
	for k := range e {
		i := float64(k + 1)
		r = append(r, measure.BalanceReading{Current: i, Mass: 5e-4 + 2e-3*i + 1e-5*e[k]})
	}
	res, err := measure.Balance{Length: 0.05, LengthSigma: 2e-4}.Reduce(r)
	if err != nil {
		t.Fatal(err)
	}
	// Tolerances: the hand values are given to 6 figures, so 1e-5 relative.
	check := func(name string, got, want float64) {
		t.Helper()
		if math.Abs(got-want) > 1e-5*math.Abs(want) {
			t.Errorf("%s = %.7g, want %.7g", name, got, want)
		}
	}
	check("slope", res.Fit.Slope, 2e-3)
	check("intercept", res.Fit.Intercept, 5e-4)
	check("u(slope)", res.Fit.SlopeSigma, 5.7735e-6)
	check("B", res.Field, 0.392266)
	check("u(B)", res.FieldSigma, 1.93500e-3)
	check("u(B) from L", res.SigmaLength, 0.392266*4e-3)
	if res.SigmaG != 0 || res.Fit.Stated || res.Fit.Dof != 3 || res.Fit.CurvatureP < 0.99 {
		t.Errorf("SigmaG %g, Stated %v, Dof %d, curvature p %g; want 0, false, 3, ~1", res.SigmaG, res.Fit.Stated, res.Fit.Dof, res.Fit.CurvatureP)
	}
}

// TestBalanceRecovers draws many synthetic runs from a known B and checks
// that the reduction recovers it within its stated uncertainty: with
// stated (Type B) uncertainties, |B − B_true| < 3u in at least 98 % of runs
// (a normal deviate exceeds 3σ with probability 0.27 %, JCGM 100:2008
// Annex G, Table G.1), and the observed scatter of B matches u within 20 %
// (400 runs estimate a standard deviation to about 3.5 %). With Type A
// uncertainties (4 degrees of freedom) the coverage of ±3u is that of
// Student's t with 4 dof, 96 % (Table G.2), so at least 93 % is asserted.
func TestBalanceRecovers(t *testing.T) {
	const (
		bTrue = 0.5
		L     = 0.05
		runs  = 400
	)
	for _, tc := range []struct {
		name        string
		fit         measure.FitMode
		sigM, sigI  float64
		stated      bool
		minCoverage float64
		currents    []float64
		tare        float64
	}{
		{"intercept, stated mass sigma", measure.WithIntercept, 2e-6, 0, true, 0.98, []float64{0, 1, 2, 3, 4, 5}, 3e-3},
		{"intercept, stated mass and current sigma", measure.WithIntercept, 1e-6, 2e-3, true, 0.98, []float64{0, 1, 2, 3, 4, 5}, 3e-3},
		{"origin, stated", measure.ThroughOrigin, 2e-6, 0, true, 0.98, []float64{1, 2, 3, 4, 5}, 0},
		{"intercept, Type A", measure.WithIntercept, 2e-6, 0, false, 0.93, []float64{0, 1, 2, 3, 4, 5}, 3e-3},
	} {
		rng := rand.New(rand.NewPCG(1, 1))
		bal := measure.Balance{Length: L, Fit: tc.fit}
		if tc.stated {
			bal.MassSigma, bal.CurrentSigma = tc.sigM, tc.sigI
		}
		var in, rejected, n int
		var sumD2, sumU2 float64
		for run := 0; run < runs; run++ {
			r := make([]measure.BalanceReading, len(tc.currents))
			for k, i := range tc.currents {
				iTrue := i + tc.sigI*rng.NormFloat64()
				r[k] = measure.BalanceReading{Current: i, Mass: tc.tare + bTrue*L*iTrue/measure.StandardGravity + tc.sigM*rng.NormFloat64()}
			}
			res, err := bal.Reduce(r)
			if err != nil {
				var nl *measure.NotLineError
				if !errors.As(err, &nl) {
					t.Fatalf("%s: run %d: %v", tc.name, run, err)
				}
				rejected++
				continue
			}
			n++
			d := res.Field - bTrue
			sumD2 += d * d
			sumU2 += res.FieldSigma * res.FieldSigma
			if math.Abs(d) < 3*res.FieldSigma {
				in++
			}
		}
		// Two tests at level 0.001 reject about 0.2 % of good runs; allow 2 %.
		if rejected > runs/50 {
			t.Errorf("%s: %d of %d good runs rejected", tc.name, rejected, runs)
		}
		cov := float64(in) / float64(n)
		ratio := math.Sqrt(sumD2 / sumU2)
		t.Logf("%s: coverage of ±3u %.3f, scatter/u %.3f, rejected %d", tc.name, cov, ratio, rejected)
		if cov < tc.minCoverage {
			t.Errorf("%s: coverage of ±3u is %.3f, want >= %.2f", tc.name, cov, tc.minCoverage)
		}
		if ratio < 0.8 || ratio > 1.25 {
			t.Errorf("%s: observed scatter / stated u = %.3f, want 0.8..1.25", tc.name, ratio)
		}
	}
}

// TestBalanceRejects covers the bad inputs and the line tests.
func TestBalanceRejects(t *testing.T) {
	line := func(b float64, is ...float64) []measure.BalanceReading {
		var r []measure.BalanceReading
		for _, i := range is {
			r = append(r, measure.BalanceReading{Current: i, Mass: 1e-3 + b*i})
		}
		return r
	}
	good := line(1e-3, 0, 1, 2, 3, 4)
	with := func(k int, i, m float64) []measure.BalanceReading {
		r := append([]measure.BalanceReading(nil), good...)
		r[k] = measure.BalanceReading{Current: i, Mass: m}
		return r
	}
	// A quadratic force law, as when the conductor's own field saturates
	// the pole (invented): the curvature test must reject it.
	var curved []measure.BalanceReading
	for _, i := range []float64{1, 2, 3, 4, 5, 6} {
		curved = append(curved, measure.BalanceReading{Current: i, Mass: 1e-3 + 1e-3*i + 4e-5*i*i + 1e-7*math.Sin(7*i)})
	}
	// Residual scatter 1e-5 kg against a stated 1e-7 kg: the χ² test must reject.
	noisy := line(1e-3, 0, 1, 2, 3, 4, 5)
	for k, e := range []float64{1, -1, 1, 1, -1, -1} {
		noisy[k].Mass += 1e-5 * e
	}
	bal := measure.Balance{Length: 0.05}
	for _, tc := range []struct {
		name string
		bal  measure.Balance
		r    []measure.BalanceReading
		want string // in the message
		line bool   // a *NotLineError
	}{
		{"too few", bal, line(1e-3, 0, 1, 2), "needs at least 4 readings", false},
		{"too few distinct", bal, line(1e-3, 0, 0, 1, 1, 1), "at 3 distinct", false},
		{"origin too few", measure.Balance{Length: 0.05, Fit: measure.ThroughOrigin}, line(1e-3, 0, 1, 1), "needs at least 3", false},
		{"zero current", bal, line(1e-3, 0, 0, 0, 0), "every conductor current is zero", false},
		{"negative mass", bal, with(2, 2, -1e-3), "negative", false},
		{"NaN mass", bal, with(1, 1, math.NaN()), "not finite", false},
		{"Inf current", bal, with(1, math.Inf(1), 1e-3), "not finite", false},
		{"non-monotone", bal, with(2, 2, 1.5e-3), "not monotone", false},
		{"flat", bal, line(0, 0, 1, 2, 3, 4), "not monotone", false},
		{"zero length", measure.Balance{}, good, "length", false},
		{"negative sigma", measure.Balance{Length: 0.05, MassSigma: -1}, good, "uncertainty", false},
		{"curved", bal, curved, "not on a straight line", true},
		{"curved, stated sigma", measure.Balance{Length: 0.05, MassSigma: 1e-7}, curved, "not on a straight line", true},
		{"scatter above stated sigma", measure.Balance{Length: 0.05, MassSigma: 1e-7}, noisy, "scatter more than", true},
	} {
		_, err := tc.bal.Reduce(tc.r)
		if err == nil {
			t.Errorf("%s: no error", tc.name)
			continue
		}
		if !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%s: error %q does not say %q", tc.name, err, tc.want)
		}
		var nl *measure.NotLineError
		var re *measure.ReadingsError
		if tc.line && !errors.As(err, &nl) || !tc.line && !errors.As(err, &re) {
			t.Errorf("%s: error type %T", tc.name, err)
		}
	}
	// The tare: a through-origin fit of offset readings is biased and, with
	// a stated sigma, rejected; the default intercept fit absorbs it.
	if _, err := (measure.Balance{Length: 0.05, MassSigma: 1e-7, Fit: measure.ThroughOrigin}).Reduce(line(1e-3, 1, 2, 3, 4)); err == nil {
		t.Errorf("origin fit of a 1 g tare: no error")
	}
	res, err := measure.Balance{Length: 0.05, MassSigma: 1e-7}.Reduce(line(1e-3, 1, 2, 3, 4))
	if err != nil || math.Abs(res.Field-1e-3*measure.StandardGravity/0.05) > 1e-12 {
		t.Errorf("intercept fit of a 1 g tare: %v, B %g", err, res.Field)
	}
}
