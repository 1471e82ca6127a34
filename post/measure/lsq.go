package measure

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"
)

// Basis says where the uncertainties of a least-squares fit come from.
type Basis int

const (
	// Stated: every point carries a stated standard uncertainty, the
	// residuals are weighted by it and the covariance is (JᵀWJ)⁻¹, scaled
	// by the Birge ratio squared when that exceeds 1.
	Stated Basis = iota
	// Scatter: at least one point has no stated uncertainty; the points
	// are weighted equally and the covariance is (JᵀJ)⁻¹ times the
	// residual variance χ²/ν (Type A).
	Scatter
)

func (b Basis) String() string {
	switch b {
	case Stated:
		return "stated"
	case Scatter:
		return "scatter"
	}
	return fmt.Sprintf("Basis(%d)", int(b))
}

// LSQOptions control FitLeastSquares. The zero value is usable.
type LSQOptions struct {
	// Step is the finite-difference step of each parameter (the same
	// unit); 0 means 1 % of |p0| (or 1e-3 when p0 is 0).
	Step []float64
	// MaxStep bounds the change of each parameter in one iteration; 0
	// means 30 % of |p0| (unbounded when p0 is 0).
	MaxStep []float64
	// Positive marks parameters that must stay above zero.
	Positive []bool
	// MaxIter is the most Gauss–Newton iterations (default 12).
	MaxIter int
	// Tol stops the iterations when every step is below Tol·Step (default
	// 1e-3 of the finite-difference step).
	Tol float64
}

// LeastSquares is a weighted nonlinear least-squares fit.
//
// Chi2 is Σ((y−f)/σ)² with the stated σ (Basis Stated) or Σ(y−f)² (Basis
// Scatter); Dof = n − p. Birge is the Birge ratio sqrt(Chi2/Dof) (R. T.
// Birge, "The calculation of errors by the method of least squares", Phys.
// Rev. 40, 207, 1932), 0 when Dof is 0. Cov is the covariance of the
// parameters from the linearised model at the solution, (JᵀWJ)⁻¹; with
// Basis Stated it is multiplied by Birge² when Birge > 1 (Scaled), so that
// stated uncertainties the residuals contradict do not make the result
// look better than the data are (GUM, JCGM 100:2008, annex H.3 and
// G.4 on Type A evaluation by least squares; section numbers from memory).
// With Basis Scatter it is always multiplied by Chi2/Dof. Sigma holds the
// square roots of Cov's diagonal and Corr the correlation coefficients
// Cov_ij/(σ_i σ_j).
type LeastSquares struct {
	Params, Sigma []float64
	Cov, Corr     [][]float64
	Chi2          float64
	Dof           int
	Birge         float64
	Scaled        bool
	Basis         Basis
	// Residuals are y − f(Params), unweighted, in point order.
	Residuals   []float64
	Iterations  int
	Evaluations int
	// Converged is false when MaxIter was reached before the steps fell
	// below the tolerance.
	Converged bool
}

// ErrNoDependence is returned when the prediction does not change with a
// parameter (or with a combination of them): it cannot be fitted.
var ErrNoDependence = errors.New("measure: the prediction does not depend on a fitted parameter (or two of them act alike): nothing to fit")

// FitLeastSquares fits the parameters p of f, started at p0, to the values
// y with standard uncertainties sigma (nil or any zero entry: Basis
// Scatter) by Gauss–Newton with a forward-difference Jacobian, halving a
// step that raises χ² (W. H. Press et al., Numerical Recipes, 3rd ed.,
// 2007, §15.5). f returns the prediction at every point; it is called
// 1 + len(p0) times per iteration and its errors are returned as they
// are. It panics when the lengths differ or there are more parameters
// than points. Nothing passed in is mutated.
func FitLeastSquares(f func(p []float64) ([]float64, error), y, sigma, p0 []float64, opt LSQOptions) (*LeastSquares, error) {
	n, np := len(y), len(p0)
	if np == 0 || n < np || (sigma != nil && len(sigma) != n) {
		panic(errLength)
	}
	r := &LeastSquares{Basis: Stated}
	w := make([]float64, n)
	for i := range w {
		w[i] = 1
		if sigma == nil || !(sigma[i] > 0) {
			r.Basis = Scatter
		}
	}
	if r.Basis == Stated {
		for i := range w {
			w[i] = 1 / sigma[i]
		}
	}
	step := make([]float64, np)
	maxStep := make([]float64, np)
	for k, v := range p0 {
		step[k] = 0.01 * math.Abs(v)
		if step[k] == 0 {
			step[k] = 1e-3
		}
		if k < len(opt.Step) && opt.Step[k] > 0 {
			step[k] = opt.Step[k]
		}
		maxStep[k] = 0.3 * math.Abs(v)
		if maxStep[k] == 0 {
			maxStep[k] = math.Inf(1)
		}
		if k < len(opt.MaxStep) && opt.MaxStep[k] > 0 {
			maxStep[k] = opt.MaxStep[k]
		}
	}
	maxIter, tol := opt.MaxIter, opt.Tol
	if maxIter <= 0 {
		maxIter = 12
	}
	if tol <= 0 {
		tol = 1e-3
	}
	positive := func(k int) bool { return k < len(opt.Positive) && opt.Positive[k] }
	eval := func(p []float64) ([]float64, error) {
		r.Evaluations++
		v, err := f(p)
		if err == nil && len(v) != n {
			panic(errLength)
		}
		return v, err
	}
	chi2 := func(v []float64) float64 {
		var s float64
		for i := range v {
			d := (y[i] - v[i]) * w[i]
			s += d * d
		}
		return s
	}
	p := append([]float64(nil), p0...)
	cur, err := eval(p)
	if err != nil {
		return nil, err
	}
	c2 := chi2(cur)
	J := mat.NewDense(n, np, nil)
	jacobian := func() error {
		for k := range p {
			q := append([]float64(nil), p...)
			h := step[k]
			if positive(k) && q[k]-h <= 0 {
				h = math.Abs(h)
			}
			q[k] += h
			v, err := eval(q)
			if err != nil {
				return err
			}
			for i := range v {
				J.Set(i, k, (v[i]-cur[i])/h*w[i])
			}
		}
		return nil
	}
	var jtj mat.SymDense
	var inv mat.Dense
	for r.Iterations = 1; r.Iterations <= maxIter; r.Iterations++ {
		if err := jacobian(); err != nil {
			return nil, err
		}
		jtj.SymOuterK(1, J.T())
		res := mat.NewVecDense(n, nil)
		for i := range cur {
			res.SetVec(i, (y[i]-cur[i])*w[i])
		}
		var jtr mat.VecDense
		jtr.MulVec(J.T(), res)
		var dp mat.VecDense
		if err := dp.SolveVec(&jtj, &jtr); err != nil || !finite(dp.RawVector().Data) {
			return nil, ErrNoDependence
		}
		d := dp.RawVector().Data
		// Limit each step, keeping its direction.
		s := 1.0
		for k := range d {
			if a := math.Abs(d[k]); a > maxStep[k] {
				s = math.Min(s, maxStep[k]/a)
			}
		}
		// Converged when every step is below Tol·Step or below 1 % of the
		// parameter's current standard uncertainty: a finite-element
		// prediction that remeshes carries noise no smaller step removes,
		// and a change far inside the uncertainty changes no conclusion.
		u := make([]float64, np)
		if inv.Inverse(&jtj) == nil {
			sc := varianceScale(c2, n-np, r.Basis)
			for k := range u {
				u[k] = math.Sqrt(math.Max(0, sc*inv.At(k, k)))
			}
		}
		small := true
		for k := range d {
			d[k] *= s
			if math.Abs(d[k]) > math.Max(tol*step[k], 0.01*u[k]) {
				small = false
			}
		}
		// Halve the step while it raises χ² (at most 6 times).
		var next, nv []float64
		var nc2 float64
		for half := 0; ; half++ {
			next = append(next[:0], p...)
			for k := range d {
				next[k] += d[k]
				if positive(k) && next[k] <= 0 {
					next[k] = p[k] / 2
				}
			}
			if nv, err = eval(next); err != nil {
				return nil, err
			}
			nc2 = chi2(nv)
			if nc2 <= c2*(1+1e-12) || half == 6 || small {
				break
			}
			for k := range d {
				d[k] /= 2
			}
		}
		if nc2 > c2*(1+1e-12) {
			// No step along the Gauss–Newton direction lowers χ²: the
			// minimum is found to the resolution of f.
			r.Converged = true
			break
		}
		p, cur, c2 = next, nv, nc2
		if small {
			r.Converged = true
			break
		}
	}
	if r.Iterations > maxIter {
		r.Iterations = maxIter
	}
	// The covariance from the Jacobian at the solution.
	if err := jacobian(); err != nil {
		return nil, err
	}
	jtj.SymOuterK(1, J.T())
	if err := inv.Inverse(&jtj); err != nil || !finite(inv.RawMatrix().Data) {
		return nil, ErrNoDependence
	}
	r.Params, r.Chi2, r.Dof = p, c2, n-np
	r.Residuals = make([]float64, n)
	for i := range cur {
		r.Residuals[i] = y[i] - cur[i]
	}
	scale := varianceScale(c2, r.Dof, r.Basis)
	if r.Dof > 0 {
		r.Birge = math.Sqrt(c2 / float64(r.Dof))
		r.Scaled = r.Basis == Stated && r.Birge > 1
	}
	r.Cov = make([][]float64, np)
	r.Corr = make([][]float64, np)
	r.Sigma = make([]float64, np)
	for a := range np {
		r.Cov[a] = make([]float64, np)
		for b := range np {
			r.Cov[a][b] = scale * inv.At(a, b)
		}
		r.Sigma[a] = math.Sqrt(r.Cov[a][a])
	}
	for a := range np {
		r.Corr[a] = make([]float64, np)
		for b := range np {
			switch {
			case a == b:
				r.Corr[a][b] = 1
			case r.Sigma[a] > 0 && r.Sigma[b] > 0:
				r.Corr[a][b] = r.Cov[a][b] / (r.Sigma[a] * r.Sigma[b])
			}
		}
	}
	return r, nil
}

func finite(v []float64) bool {
	for _, x := range v {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return false
		}
	}
	return true
}

// varianceScale is the factor on (JᵀWJ)⁻¹ in the covariance: χ²/ν for
// Basis Scatter, max(1, χ²/ν) for Basis Stated (the Birge ratio squared
// when above 1), and 1 when ν is 0.
func varianceScale(chi2 float64, dof int, b Basis) float64 {
	if dof <= 0 {
		return 1
	}
	v := chi2 / float64(dof)
	if b == Stated {
		return math.Max(1, v)
	}
	return v
}
