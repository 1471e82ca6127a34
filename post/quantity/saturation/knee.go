package saturation

import "math"

// Curve is what the knee needs of a B-H curve: the field strength H (A/m)
// at flux density b (T), increasing in b. *materials.Curve has it.
type Curve interface {
	H(b float64) float64
}

// Knee rule constants: a 10 % rise in B that takes a 50 % rise in H.
const (
	KneeRiseB = 1.1
	KneeRiseH = 1.5
)

// KneeSearchMax is the highest flux density Knee searches, T: beyond any
// steel's saturation polarisation (about 2.4 T for cobalt-iron).
const KneeSearchMax = 4.0

// Knee returns the knee of the curve c: the smallest B in (0,
// KneeSearchMax] with H(1.1 B) = 1.5 H(B) (see the package documentation),
// located by a scan in steps of 5 mT and bisection to 1e-10 T. It returns
// a *NoKneeError if the ratio never reaches 1.5 and a *NonFiniteError if
// H returns NaN. An infinite H(1.1 B) (a curve model that ends at a
// saturation value) counts as above the ratio.
func Knee(c Curve) (float64, error) {
	if c == nil {
		panic(errNoCurve)
	}
	const step = 0.005
	ratio := func(b float64) (float64, error) {
		h0, h1 := c.H(b), c.H(KneeRiseB*b)
		if math.IsNaN(h0) || math.IsInf(h0, 0) {
			return 0, &NonFiniteError{What: "H", Triangle: -1, Value: h0}
		}
		if math.IsNaN(h1) {
			return 0, &NonFiniteError{What: "H", Triangle: -1, Value: h1}
		}
		if !(h0 > 0) {
			return 0, nil
		}
		return h1 / h0, nil
	}
	maxRatio := 0.0
	lo := 0.0
	for b := step; b <= KneeSearchMax+step/2; b += step {
		r, err := ratio(b)
		if err != nil {
			return 0, err
		}
		if r >= KneeRiseH {
			hi := b
			for hi-lo > 1e-10 {
				mid := 0.5 * (lo + hi)
				rm, err := ratio(mid)
				if err != nil {
					return 0, err
				}
				if rm >= KneeRiseH {
					hi = mid
				} else {
					lo = mid
				}
			}
			return 0.5 * (lo + hi), nil
		}
		maxRatio = math.Max(maxRatio, r)
		lo = b
	}
	return 0, &NoKneeError{MaxB: KneeSearchMax, MaxRatio: maxRatio}
}
