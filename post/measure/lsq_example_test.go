package measure_test

import (
	"fmt"

	"polegap/post/measure"
)

// A straight line B = k·I + B0 fitted to four points whose scatter (about
// 3 mT) exceeds their stated 1 mT: χ²/ν > 1, so the uncertainties are
// scaled by the Birge ratio. By hand: k = Sxy/Sxx = 4.93/500, B0 = ȳ − k x̄,
// residuals (0.9, −3.7, 4.7, −1.9) mT, χ² = 40.2; u(k) = 4.48 × 1 mT/√500
// = 0.00020 T/A.
func ExampleFitLeastSquares() {
	currents := []float64{10, 20, 30, 40}
	field := []float64{0.103, 0.197, 0.304, 0.396} // T
	sigma := []float64{1e-3, 1e-3, 1e-3, 1e-3}
	line := func(p []float64) ([]float64, error) {
		out := make([]float64, len(currents))
		for i, I := range currents {
			out[i] = p[0]*I + p[1]
		}
		return out, nil
	}
	r, err := measure.FitLeastSquares(line, field, sigma, []float64{0.01, 0}, measure.LSQOptions{})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("k = %.5f ± %.5f T/A, B0 = %.4f ± %.4f T, ρ = %.2f\n", r.Params[0], r.Sigma[0], r.Params[1], r.Sigma[1], r.Corr[0][1])
	fmt.Printf("χ² = %.1f, ν = %d, Birge ratio %.2f, scaled %v\n", r.Chi2, r.Dof, r.Birge, r.Scaled)
	// Output:
	// k = 0.00986 ± 0.00020 T/A, B0 = 0.0035 ± 0.0055 T, ρ = -0.91
	// χ² = 40.2, ν = 2, Birge ratio 4.48, scaled true
}
