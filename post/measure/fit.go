package measure

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/stat"
	"gonum.org/v1/gonum/stat/distuv"
)

// FitMode chooses the straight line fitted to readings.
type FitMode int

const (
	// WithIntercept fits y = a + b x (the default): the intercept absorbs a
	// tare or zero offset, at the cost of one degree of freedom.
	WithIntercept FitMode = iota
	// ThroughOrigin fits y = b x: for readings whose zero is known to be
	// exact (a balance tared at zero conductor current, an integrator reset
	// before each pull).
	ThroughOrigin
)

func (m FitMode) String() string {
	switch m {
	case WithIntercept:
		return "intercept"
	case ThroughOrigin:
		return "origin"
	}
	return fmt.Sprintf("FitMode(%d)", int(m))
}

// DefaultAlpha is the rejection level of the straight-line tests when none
// is given: a fit is rejected when its test statistic is as large as this
// with probability below 0.001. A low level keeps good runs from being
// rejected by chance when a file holds many magnet currents (common
// practice; 0.05 and 0.01 are also used).
const DefaultAlpha = 0.001

// LineFit is an ordinary least-squares straight line with uniform weights
// and its tests.
//
// Slope and Intercept (0 for ThroughOrigin) carry standard uncertainties
// from the readings' uncertainty SigmaY: the stated one when Stated (Type
// B), else the residual standard deviation sqrt(SSR/Dof) (Type A). The
// estimator formulas are the textbook ones: u²(b) = σ²/Sxx with Sxx the
// sum of squared x deviations (about the mean with an intercept, about 0
// without), u²(a) = σ²(1/n + x̄²/Sxx) (P. R. Bevington and D. K. Robinson,
// Data Reduction and Error Analysis for the Physical Sciences, 3rd ed.
// 2003, eqs. 6.12, 6.21-6.23, from memory).
//
// The readings are tested to lie on a line. Two rules reject a fit, each
// at the rejection level (Alpha of the reduction, DefaultAlpha if zero):
//
//  1. Curvature: add a quadratic term c x² and test whether it reduces the
//     residual sum of squares significantly, by the extra-sum-of-squares
//     F test F = ΔSSR / (SSR₂/(n−p−1)) with (1, n−p−1) degrees of freedom,
//     or, when SigmaY is stated, Δχ² = ΔSSR/σ² with 1 degree of freedom
//     (Bevington and Robinson 2003, sec. 11.4 "the F test" for an added
//     term; N. R. Draper and H. Smith, Applied Regression Analysis, 3rd ed.
//     1998, ch. 6, the extra sum of squares principle; section and chapter
//     numbers from memory). ΔSSR is computed
//     exactly from the residuals: (r·z)²/(z·z) with z the part of x²
//     orthogonal to the line's basis.
//  2. Goodness of fit, only when SigmaY is stated: χ² = SSR/σ² on Dof
//     degrees of freedom (Bevington and Robinson 2003, sec. 11.1, from
//     memory). When
//     the line fails it and a quadratic fails it too, the readings scatter
//     beyond their stated uncertainty and that is reported rather than
//     curvature.
type LineFit struct {
	Mode                      FitMode
	Slope, SlopeSigma         float64
	Intercept, InterceptSigma float64
	N, Dof                    int       // readings, and N minus the parameters fitted
	SigmaY                    float64   // standard uncertainty of one y reading used
	Stated                    bool      // SigmaY was stated, not estimated from the residuals
	Residuals                 []float64 // y − fitted, in reading order
	Chi2                      float64   // SSR/SigmaY² when Stated, else 0
	// CurvatureStat and CurvatureP are the statistic and upper-tail
	// probability of the test for a quadratic term.
	CurvatureStat, CurvatureP float64
}

// minDistinct is the fewest distinct x values a fit needs so that a
// quadratic term can be tested with one residual degree of freedom left.
func minFitPoints(mode FitMode) (n, distinct int) {
	if mode == ThroughOrigin {
		return 3, 2
	}
	return 4, 3
}

// fitLine fits y against x and applies the tests described at LineFit.
// sigmaY <= 0 means not stated. It returns a *ReadingsError for too few
// readings and a *NotLineError for a rejected fit.
func fitLine(method string, x, y []float64, sigmaY float64, mode FitMode, alpha float64) (LineFit, error) {
	if len(x) != len(y) {
		panic(errLength)
	}
	n := len(x)
	minN, minD := minFitPoints(mode)
	if n < minN || distinct(x, mode == ThroughOrigin) < minD {
		what := "distinct conductor currents"
		if mode == ThroughOrigin {
			what = "distinct non-zero currents"
		}
		return LineFit{}, &ReadingsError{Method: method, Index: -1, Msg: fmt.Sprintf(
			"%d readings at %d %s; a %s straight-line fit with its linearity test needs at least %d readings at %d %s",
			n, distinct(x, mode == ThroughOrigin), what, mode, minN, minD, what)}
	}
	if alpha <= 0 {
		alpha = DefaultAlpha
	}
	f := LineFit{Mode: mode, N: n}
	p := 2
	var xm, ym float64
	if mode == ThroughOrigin {
		p = 1
	} else {
		for i := range x {
			xm += x[i]
			ym += y[i]
		}
		xm /= float64(n)
		ym /= float64(n)
	}
	f.Dof = n - p
	// The estimate is written out rather than taken from gonum's
	// stat.LinearRegression: the residuals, Sxx and the curvature
	// projection below must come from one set of sums (for readings on a
	// line to 1e-8, the estimator's last bit moves the Type A uncertainty
	// by 1e-10 relative), and stat gives no parameter uncertainties.
	var sxx, sxy float64
	for i := range x {
		dx := x[i] - xm
		sxx += dx * dx
		sxy += dx * (y[i] - ym)
	}
	f.Slope = sxy / sxx
	f.Intercept = ym - f.Slope*xm
	f.Residuals = make([]float64, n)
	var ssr, yscale float64
	for i := range x {
		r := y[i] - f.Intercept - f.Slope*x[i]
		f.Residuals[i] = r
		ssr += r * r
		yscale = math.Max(yscale, math.Abs(y[i]))
	}
	if sigmaY > 0 {
		f.SigmaY, f.Stated = sigmaY, true
		f.Chi2 = ssr / (sigmaY * sigmaY)
	} else {
		f.SigmaY = math.Sqrt(ssr / float64(f.Dof))
	}
	f.SlopeSigma = f.SigmaY / math.Sqrt(sxx)
	if mode == WithIntercept {
		f.InterceptSigma = f.SigmaY * math.Sqrt(1/float64(n)+xm*xm/sxx)
	}

	// Curvature: z = (x − x̄)² made orthogonal to the line's basis.
	z := make([]float64, n)
	var zm, zx float64
	for i := range x {
		dx := x[i] - xm
		z[i] = dx * dx
		zm += z[i]
		zx += z[i] * dx
	}
	zm /= float64(n)
	if mode == ThroughOrigin {
		zm = 0
	}
	var rz, zz float64
	for i := range x {
		dx := x[i] - xm
		zi := z[i] - zm - zx/sxx*dx
		rz += f.Residuals[i] * zi
		zz += zi * zi
	}
	drop := 0.0
	if zz > 0 {
		drop = math.Min(rz*rz/zz, ssr)
	}
	exact := ssr <= float64(n)*math.Pow(1e-12*yscale, 2) // a line to round-off
	switch {
	case f.Stated:
		f.CurvatureStat = drop / (sigmaY * sigmaY)
		f.CurvatureP = distuv.ChiSquared{K: 1}.Survival(f.CurvatureStat)
	case exact:
		f.CurvatureStat, f.CurvatureP = 0, 1
	default:
		d2 := float64(f.Dof - 1)
		rest := ssr - drop
		if rest <= 0 {
			f.CurvatureStat, f.CurvatureP = math.MaxFloat64, 0
		} else {
			f.CurvatureStat = drop / (rest / d2)
			f.CurvatureP = distuv.F{D1: 1, D2: d2}.Survival(f.CurvatureStat)
		}
	}
	if f.Stated {
		// Scatter beyond the stated sigma makes any added term look
		// significant: report curvature only if the quadratic fits.
		p := distuv.ChiSquared{K: float64(f.Dof)}.Survival(f.Chi2)
		pq := distuv.ChiSquared{K: float64(f.Dof - 1)}.Survival((ssr - drop) / (sigmaY * sigmaY))
		if p < alpha && pq < alpha {
			return f, &NotLineError{Method: method, Test: "chi-squared", Stat: f.Chi2, P: p, Alpha: alpha, Fit: f}
		}
	}
	if f.CurvatureP < alpha {
		return f, &NotLineError{Method: method, Test: "curvature", Stat: f.CurvatureStat, P: f.CurvatureP, Alpha: alpha, Fit: f}
	}
	return f, nil
}

// slope returns the least-squares slope of y on x (gonum's
// stat.LinearRegression), or 0 when x has no spread.
func slope(x, y []float64, mode FitMode) float64 {
	_, b := stat.LinearRegression(x, y, nil, mode == ThroughOrigin)
	if math.IsNaN(b) {
		return 0 // 0/0: no spread in x
	}
	return b
}

// distinct counts the distinct values of x, leaving out zero if nonZero.
func distinct(x []float64, nonZero bool) int {
	seen := make(map[float64]bool, len(x))
	for _, v := range x {
		if nonZero && v == 0 {
			continue
		}
		seen[v] = true
	}
	return len(seen)
}
