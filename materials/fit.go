package materials

import (
	"errors"
	"fmt"
	"math"
)

// A fit makes a full B-H curve from the few points of a supplier's sheet
// (often 5-10, from the knee to about 10 kA/m):
//
//   - between the points, a monotone cubic Hermite interpolant of
//     ln J against ln H, J = B - μ0 H the polarisation (magnetisation
//     curves are smooth on logarithmic axes, where a few points span
//     decades); slopes by the harmonic-mean rule of F. N. Fritsch and
//     J. Butland, "A method for constructing local monotone piecewise cubic
//     interpolants", SIAM J. Sci. Stat. Comput. 5(2), 1984 (with Brodlie's
//     weights for uneven spacing), which keeps the interpolant monotone;
//   - below the first point, J ∝ H^p with p the log-log slope there (at
//     least 1, so that the permeability stays finite at the origin): a
//     guess, as any curve below the data is; give points down to the
//     lowest field the design meets;
//   - beyond the last point, the Fröhlich–Kennelly law of approach to
//     saturation (O. Fröhlich, Elektrotech. Z. 2, 1881; A. E. Kennelly,
//     "Magnetic reluctance", Trans. AIEE 8, 1891), written for J:
//
//	J(H) = J_s - (J_s - J_n) (H_n + H_0) / (H + H_0),
//
//     which passes through the last point (H_n, J_n) and tends to the
//     saturation polarisation J_s, so that B → μ0 H + J_s. Kennelly found
//     the reluctivity H/J linear in H near saturation, H/J = α + β H
//     with J_s = 1/β and H_0 = α/β; FitCurve fits that line by least
//     squares through the last three points (the Kennelly plot), or takes
//     J_s as given (FitOptions.Js) and fits only the line's intercept α.
//
// The fitted curve is tabulated densely (FitPointsPerDecade) out to where
// J is within FitTailTol of J_s; past that the Curve's μ0 tail continues
// it as B = μ0 H + J_s. Curve.TableEnd is the last given point, so that
// results report how much iron ran on the extrapolation.

// Constants of the fit's tabulation.
const (
	// FitPointsPerDecade is the density of the tabulated fit.
	FitPointsPerDecade = 12
	// FitTailTol is the relative distance from J_s at which the
	// tabulated tail ends (the μ0 line takes over).
	FitTailTol = 1e-3
	// FitTrustTol is the relative spread of B between two estimates of
	// the tail within which the extrapolation is called trustworthy
	// (Fit.TrustH).
	FitTrustTol = 0.01
)

// ErrFit is wrapped by the errors of FitCurve for data it cannot fit.
var ErrFit = errors.New("cannot fit the B-H points")

// FitOptions control FitCurve. The zero value fits J_s from the data.
type FitOptions struct {
	// Js, T, is the saturation polarisation when known (a supplier's
	// figure, or about 2.0 T for 3 % silicon steel, 2.15 T for iron;
	// from memory: typical values). 0 fits it from the last points.
	Js float64
}

// Fit is a fitted B-H curve and what it rests on.
type Fit struct {
	Curve *Curve
	// H and B are the points given (without the origin).
	H, B []float64
	// Js (T) and H0 (A/m) are the Fröhlich–Kennelly tail's constants;
	// JsFitted says whether Js came from the data.
	Js, H0   float64
	JsFitted bool
	// TrustH (A/m) is the field strength up to which the extrapolation
	// is trusted: where two estimates of the tail (the Kennelly line
	// through the last three points and through the last two) differ by
	// less than FitTrustTol in B, at least the last point's H and at
	// most 10 times it. With J_s given it is 2 H_n, the range over which
	// the test reproduces a Fröhlich–Kennelly law to 1 %.
	TrustH float64
}

// FitCurve fits a curve to the points (h, b), H in A/m and B in T, the
// origin optional; at least 3 points besides it, with J = B - μ0 H
// strictly increasing. The table rules of NewCurve apply to the points.
func FitCurve(h, b []float64, opt FitOptions) (*Fit, error) {
	if len(h) != len(b) {
		panic(errLengthMismatch)
	}
	if err := validateTable(h, b); err != nil {
		return nil, err
	}
	var hs, js, bs []float64
	for i := range h {
		if h[i] == 0 {
			continue
		}
		hs = append(hs, h[i])
		bs = append(bs, b[i])
		js = append(js, b[i]-Mu0*h[i])
	}
	n := len(hs)
	if n < 3 {
		return nil, fmt.Errorf("%w: %d points besides the origin; give at least 3", ErrFit, n)
	}
	for i := range js {
		if js[i] <= 0 || (i > 0 && js[i] <= js[i-1]) {
			return nil, fmt.Errorf("%w: the polarisation J = B - μ0 H must rise from point to point, and does not at H = %g A/m (J = %.4g T); check the row", ErrFit, hs[i], js[i])
		}
	}
	if opt.Js != 0 && !(opt.Js > js[n-1] && opt.Js < MaxB) {
		return nil, fmt.Errorf("%w: the saturation polarisation %g T must exceed the last point's J = %.4g T", ErrFit, opt.Js, js[n-1])
	}
	x, y := make([]float64, n), make([]float64, n)
	for i := range hs {
		x[i], y[i] = math.Log(hs[i]), math.Log(js[i])
	}
	d := monotoneSlopes(x, y)
	f := &Fit{H: hs, B: bs}
	hn, jn := hs[n-1], js[n-1]
	if opt.Js != 0 {
		// The Kennelly line with its slope 1/J_s fixed: the intercept
		// α = mean of H/J - H/J_s over the last three points.
		f.Js = opt.Js
		alpha := 0.0
		for i := n - 3; i < n; i++ {
			alpha += (hs[i]/js[i] - hs[i]/opt.Js) / 3
		}
		f.H0 = math.Max(alpha*opt.Js, 0)
		f.TrustH = 2 * hn
	} else {
		js3, h03, ok3 := kennelly(hs[n-3:], js[n-3:])
		js2, h02, ok2 := kennelly(hs[n-2:], js[n-2:])
		if !ok3 || !ok2 || js3 <= jn {
			return nil, fmt.Errorf("%w: the last points do not approach saturation (the reluctivity H/J is not rising linearly in H); give more points above the knee, or the saturation polarisation", ErrFit)
		}
		f.Js, f.H0, f.JsFitted = js3, h03, true
		f.TrustH = hn
		for k := 1; k <= 90; k++ { // up to 10 H_n in steps of 0.1 H_n
			hv := hn * (1 + 0.1*float64(k))
			b3 := Mu0*hv + tailJ(hv, hn, jn, js3, h03)
			b2 := Mu0*hv + tailJ(hv, hn, jn, js2, h02)
			if math.Abs(b3-b2) > FitTrustTol*b3 {
				break
			}
			f.TrustH = hv
		}
	}
	// Tabulate.
	p := math.Max(d[0], 1)
	var th, tb []float64
	add := func(hv, jv float64) {
		th = append(th, hv)
		tb = append(tb, jv+Mu0*hv)
	}
	add(0, 0)
	for _, fr := range []float64{1.0 / 8, 1.0 / 4, 1.0 / 2} {
		hv := hs[0] * fr
		add(hv, js[0]*math.Pow(fr, p))
	}
	for i := 0; i < n; i++ {
		add(hs[i], js[i])
		if i == n-1 {
			break
		}
		m := int(math.Ceil((x[i+1] - x[i]) / math.Ln10 * FitPointsPerDecade))
		for k := 1; k < m; k++ {
			t := float64(k) / float64(m)
			xv := x[i] + t*(x[i+1]-x[i])
			add(math.Exp(xv), math.Exp(hermiteAt(x[i], x[i+1], y[i], y[i+1], d[i], d[i+1], xv)))
		}
	}
	dataEnd := len(th) - 1
	// The tail: log-spaced until J is within FitTailTol of J_s.
	hEnd := (f.Js-jn)*(hn+f.H0)/(FitTailTol*f.Js) - f.H0
	hEnd = math.Min(math.Max(hEnd, 2*hn), MaxH/10)
	m := int(math.Ceil(math.Log10(hEnd/hn) * FitPointsPerDecade))
	for k := 1; k <= m; k++ {
		hv := hn * math.Pow(hEnd/hn, float64(k)/float64(m))
		add(hv, tailJ(hv, hn, jn, f.Js, f.H0))
	}
	c, err := NewCurve(th, tb)
	if err != nil {
		return nil, fmt.Errorf("%w: the fitted table: %v", ErrFit, err)
	}
	c.dataEnd = dataEnd
	f.Curve = c
	return f, nil
}

// tailJ is the Fröhlich–Kennelly tail through (hn, jn) tending to js.
func tailJ(h, hn, jn, js, h0 float64) float64 {
	return js - (js-jn)*(hn+h0)/(h+h0)
}

// kennelly fits H/J = α + β H by least squares and returns J_s = 1/β and
// H_0 = α/β, ok when both are positive.
func kennelly(h, j []float64) (js, h0 float64, ok bool) {
	var sx, sy, sxx, sxy float64
	n := float64(len(h))
	for i := range h {
		r := h[i] / j[i]
		sx += h[i]
		sy += r
		sxx += h[i] * h[i]
		sxy += h[i] * r
	}
	den := n*sxx - sx*sx
	if den == 0 {
		return 0, 0, false
	}
	beta := (n*sxy - sx*sy) / den
	alpha := (sy - beta*sx) / n
	if !(beta > 0 && alpha > 0) {
		return 0, 0, false
	}
	return 1 / beta, alpha / beta, true
}

// monotoneSlopes returns the slopes of the monotone cubic Hermite
// interpolant of increasing data (Fritsch and Butland 1984: a weighted
// harmonic mean of the neighbouring secants, 0 at an extremum; the end
// slopes by the one-sided three-point formula, limited to keep
// monotonicity).
func monotoneSlopes(x, y []float64) []float64 {
	n := len(x)
	d := make([]float64, n)
	h := make([]float64, n-1)
	del := make([]float64, n-1)
	for i := 0; i < n-1; i++ {
		h[i] = x[i+1] - x[i]
		del[i] = (y[i+1] - y[i]) / h[i]
	}
	for i := 1; i < n-1; i++ {
		if del[i-1]*del[i] <= 0 {
			continue
		}
		w1, w2 := 2*h[i]+h[i-1], h[i]+2*h[i-1]
		d[i] = (w1 + w2) / (w1/del[i-1] + w2/del[i])
	}
	end := func(h0, h1, d0, d1 float64) float64 {
		s := ((2*h0+h1)*d0 - h0*d1) / (h0 + h1)
		switch {
		case s*d0 <= 0:
			return 0
		case d0*d1 <= 0 && math.Abs(s) > 3*math.Abs(d0):
			return 3 * d0
		}
		return s
	}
	if n == 2 {
		d[0], d[1] = del[0], del[0]
		return d
	}
	d[0] = end(h[0], h[1], del[0], del[1])
	d[n-1] = end(h[n-2], h[n-3], del[n-2], del[n-3])
	return d
}

// hermiteAt evaluates the cubic Hermite piece on [x0, x1] at x.
func hermiteAt(x0, x1, y0, y1, d0, d1, x float64) float64 {
	hh := x1 - x0
	t := (x - x0) / hh
	t2, t3 := t*t, t*t*t
	return (2*t3-3*t2+1)*y0 + (t3-2*t2+t)*hh*d0 + (-2*t3+3*t2)*y1 + (t3-t2)*hh*d1
}
