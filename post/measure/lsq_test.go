package measure_test

import (
	"math"
	"math/rand/v2"
	"testing"

	"polegap/post/measure"
)

// saturating is an invented excitation curve with two parameters, B(I) =
// a·tanh(I/b): a saturation field a (T) and a current scale b (A).
func saturating(currents []float64) func(p []float64) ([]float64, error) {
	return func(p []float64) ([]float64, error) {
		out := make([]float64, len(currents))
		for i, I := range currents {
			out[i] = p[0] * math.Tanh(I/p[1])
		}
		return out, nil
	}
}

// TestBirgeCoverage: synthetic curves with Gaussian noise three times the
// stated uncertainty. Fitted with the stated σ alone, the uncertainty
// covers the truth about P(|z| < 1/3) = 26 % of the time; scaled by the
// Birge ratio (Birge, Phys. Rev. 40, 207, 1932) it must cover it about
// 68 % of the time. With ν = 20 degrees of freedom the scaled uncertainty
// is itself estimated, and the exact coverage of ±1 estimated standard
// deviation is that of Student's t with 20 degrees of freedom, P(|t| < 1)
// = 0.671 (GUM, JCGM 100:2008, G.3; from memory, 0.6827 for ν → ∞).
// Accepted band over 200 seeded trials: 116 to 156 covered, the binomial
// mean 200·0.68 = 136 ± 3 standard deviations sqrt(200·0.68·0.32) = 6.6:
// a correct method falls outside with probability 0.3 %, while the
// unscaled uncertainty (about 52 of 200) fails it.
func TestBirgeCoverage(t *testing.T) {
	currents := make([]float64, 22)
	for i := range currents {
		currents[i] = 10 * float64(i+1) // 10 … 220 A
	}
	truth := []float64{1.6, 120}
	const stated, noise = 2e-3, 6e-3 // T
	f := saturating(currents)
	exact, _ := f(truth)
	rng := rand.New(rand.NewPCG(1, 1))
	const trials = 200
	var covered, coveredUnscaled [2]int
	scaledRuns := 0
	for range trials {
		y := make([]float64, len(exact))
		sig := make([]float64, len(exact))
		for i := range y {
			y[i] = exact[i] + noise*rng.NormFloat64()
			sig[i] = stated
		}
		r, err := measure.FitLeastSquares(f, y, sig, []float64{1.5, 100}, measure.LSQOptions{})
		if err != nil {
			t.Fatal(err)
		}
		if r.Dof != 20 || r.Basis != measure.Stated {
			t.Fatalf("dof %d basis %v, want 20 stated", r.Dof, r.Basis)
		}
		if r.Scaled {
			scaledRuns++
		}
		for k := range truth {
			d := math.Abs(r.Params[k] - truth[k])
			if d <= r.Sigma[k] {
				covered[k]++
			}
			unscaled := r.Sigma[k]
			if r.Scaled {
				unscaled /= r.Birge
			}
			if d <= unscaled {
				coveredUnscaled[k]++
			}
		}
	}
	t.Logf("covered by the Birge-scaled uncertainty %v of %d, by the stated one %v; scaled in %d runs", covered, trials, coveredUnscaled, scaledRuns)
	for k := range truth {
		if covered[k] < 116 || covered[k] > 156 {
			t.Errorf("parameter %d: the Birge-scaled uncertainty covers the truth in %d of %d trials, want 116-156", k, covered[k], trials)
		}
		if coveredUnscaled[k] >= 116 {
			t.Errorf("parameter %d: the unscaled uncertainty covers the truth in %d of %d: the test cannot tell", k, coveredUnscaled[k], trials)
		}
	}
	if scaledRuns < trials*9/10 {
		t.Errorf("scaled in %d of %d runs; with noise 3 × σ the ratio is near 3", scaledRuns, trials)
	}
}

// TestBirgeNotBelowOne: with noise equal to the stated uncertainty the
// uncertainties are never scaled down (Birge ratio < 1 leaves them as
// stated), and the coverage stays in the same band as above.
func TestBirgeNotBelowOne(t *testing.T) {
	currents := []float64{20, 40, 60, 80, 100, 120, 140, 160, 180, 200, 220, 240}
	truth := []float64{1.6, 120}
	f := saturating(currents)
	exact, _ := f(truth)
	rng := rand.New(rand.NewPCG(2, 2))
	covered := 0
	for range 200 {
		y := make([]float64, len(exact))
		sig := make([]float64, len(exact))
		for i := range y {
			y[i] = exact[i] + 2e-3*rng.NormFloat64()
			sig[i] = 2e-3
		}
		r, err := measure.FitLeastSquares(f, y, sig, []float64{1.5, 100}, measure.LSQOptions{})
		if err != nil {
			t.Fatal(err)
		}
		if r.Birge < 1 && r.Scaled {
			t.Fatalf("scaled with Birge ratio %g < 1", r.Birge)
		}
		if math.Abs(r.Params[0]-truth[0]) <= r.Sigma[0] {
			covered++
		}
	}
	if covered < 116 || covered > 156 {
		t.Errorf("covered in %d of 200, want 116-156 (binomial band, see TestBirgeCoverage)", covered)
	}
}

// TestFitTwoParameters: noise-free data recover both parameters to the
// step tolerance, with zero χ², and the correlation matrix is symmetric
// with unit diagonal and |ρ| < 1.
func TestFitTwoParameters(t *testing.T) {
	currents := []float64{0, 25, 50, 100, 150, 200, 300}
	f := saturating(currents)
	y, _ := f([]float64{1.45, 90})
	r, err := measure.FitLeastSquares(f, y, nil, []float64{1.2, 130}, measure.LSQOptions{})
	if err != nil {
		t.Fatal(err)
	}
	// 1e-6 relative: Gauss–Newton converges quadratically on zero
	// residuals; the stop rule is a step below 1e-3 of the 1 % FD step.
	if math.Abs(r.Params[0]-1.45) > 1e-6*1.45 || math.Abs(r.Params[1]-90) > 1e-6*90 {
		t.Errorf("fitted %v, want [1.45 90] (%d iterations)", r.Params, r.Iterations)
	}
	if !r.Converged || r.Basis != measure.Scatter {
		t.Errorf("converged %v basis %v", r.Converged, r.Basis)
	}
	if r.Corr[0][0] != 1 || r.Corr[1][1] != 1 {
		t.Errorf("correlation diagonal %v", r.Corr)
	}
	if r.Corr[0][1] != r.Corr[1][0] || math.Abs(r.Corr[0][1]) >= 1 {
		t.Errorf("correlation %v", r.Corr)
	}
}

// TestFitNoDependence: a parameter the prediction ignores is refused.
func TestFitNoDependence(t *testing.T) {
	f := func(p []float64) ([]float64, error) { return []float64{p[0], 2 * p[0], 3 * p[0]}, nil }
	if _, err := measure.FitLeastSquares(f, []float64{1, 2, 3}, nil, []float64{1, 5}, measure.LSQOptions{}); err != measure.ErrNoDependence {
		t.Errorf("err = %v, want ErrNoDependence", err)
	}
}
