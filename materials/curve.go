package materials

import (
	"fmt"
	"math"
	"sort"

	"polegap/internal/num"
)

// Mu0 is the magnetic constant μ0 = 4π·1e-7 H/m, the value that was exact
// in the SI before its 2019 revision; it is within 1e-9 relative of the
// CODATA 2018 value 1.25663706212(19)e-6 H/m (about 5.4e-10), far below any
// B-H table's accuracy. It is polegap's one μ0: defined in internal/num
// (so that packages which do not import materials share it) and exported
// here for users of the library.
const Mu0 = num.Mu0

// Plausibility bounds of a B-H table. They reject unit mistakes and keep
// every derived quantity (b2 = B², ν, dν/db2) far from overflow.
const (
	// MaxH is the largest H accepted in a table, in A/m (μ0·MaxH ≈ 12.6 kT).
	MaxH = 1e10
	// MinH is the smallest non-zero H accepted in a table, in A/m.
	MinH = 1e-6
	// MaxB is the largest B accepted in a table, in T.
	MaxB = 1e3
	// MaxMuR bounds the relative slope ΔB/(μ0 ΔH) between rows; the most
	// permeable soft alloys stay well below it (from memory: typical values
	// reach about 1e6).
	MaxMuR = 1e7
	// MinMuR bounds the relative slope from below. A magnetisation curve
	// never rises slower than μ0 (B = μ0 (H + M) with M non-decreasing);
	// a third of μ0 is accepted so that rounded tables pass, and it is the
	// least slope for which the last piece can meet its μ0 tail monotonely
	// (Fritsch and Carlson 1980, the α, β ≤ 3 region).
	MinMuR = 1.0 / 3
)

// Curve is a B-H curve: a monotone piecewise cubic Hermite interpolant of a
// table of (H, B) points, extended past its last point with slope μ0 and to
// negative H as an odd function. It is read-only after construction and safe
// for concurrent use. See the package documentation for its invariants.
type Curve struct {
	name    string
	builtin bool // from the library (or Stacked from it): name is its entry
	// dataEnd indexes the knot of the last data point; knots after it
	// are extrapolated (FitCurve). 0 means the last knot.
	dataEnd int

	// Knots and the cubic pieces of B(H): on [h[i], h[i+1]] with t = H - h[i],
	// B = b[i] + t*(d[i] + t*(c2[i] + t*c3[i])). d[i] is dB/dH at knot i.
	// len(c2) = len(c3) = len(h)-1; c2[0] = 0 (no curvature at the origin).
	h, b, d, c2, c3 []float64

	hl, bl float64 // last knot

	nut nuTable // tabulated ν(b2) for Nu
}

// NewCurve builds a Curve from a table of field strengths h (A/m) and flux
// densities b (T) of the initial magnetisation curve. The first point may be
// the origin (0, 0); if it is not, the origin is added. Including the
// origin, at least 3 points are needed. H and B must be finite, non-negative
// and strictly increasing, within the plausibility bounds MinH, MaxH, MaxB,
// and every slope between rows must lie between MinMuR·μ0 and MaxMuR·μ0.
// A bad table gives a *TableError naming the row and what to do.
// NewCurve panics if len(h) != len(b). The inputs are not modified.
func NewCurve(h, b []float64) (*Curve, error) {
	if len(h) != len(b) {
		panic(errLengthMismatch)
	}
	if err := validateTable(h, b); err != nil {
		return nil, err
	}
	hs := make([]float64, 0, len(h)+1)
	bs := make([]float64, 0, len(b)+1)
	if h[0] != 0 {
		hs = append(hs, 0)
		bs = append(bs, 0)
	}
	hs = append(hs, h...)
	bs = append(bs, b...)
	c := &Curve{h: hs, b: bs}
	c.setSlopes()
	c.setPieces()
	if k, ok := c.build(); !ok {
		return nil, irregular(k, hs, bs, h[0] != 0)
	}
	return c, nil
}

// irregular reports a table whose reluctivity cannot be tabulated; knot k
// indexes hs, bs (which include the origin; added says whether NewCurve
// added it).
func irregular(k int, hs, bs []float64, added bool) error {
	row := k + 1 // knot k is user row k+1 when the table held the origin
	if added {
		row = k
	}
	return &TableError{Row: row, H: hs[k], B: bs[k], Err: ErrSlope,
		Reason: "the slope of the curve changes too abruptly near this row for a smooth, monotone reluctivity; smooth the table (add rows between, or remove an outlier)"}
}

// validateTable checks the raw user table; rows are reported 1-based.
func validateTable(h, b []float64) error {
	n := len(h)
	if n == 0 {
		return &TableError{Reason: "the table is empty; give at least two (H, B) points besides the origin", Err: ErrEmpty}
	}
	row := func(i int, err error, format string, args ...any) error {
		return &TableError{Row: i + 1, H: h[i], B: b[i], Reason: fmt.Sprintf(format, args...), Err: err}
	}
	for i := 0; i < n; i++ {
		switch {
		case math.IsNaN(h[i]) || math.IsInf(h[i], 0):
			return row(i, ErrNotFinite, "H is not a finite number; every value must be finite")
		case math.IsNaN(b[i]) || math.IsInf(b[i], 0):
			return row(i, ErrNotFinite, "B is not a finite number; every value must be finite")
		case h[i] < 0 || b[i] < 0:
			return row(i, ErrNegative, "negative value; give the initial magnetisation curve in the first quadrant (H >= 0, B >= 0)")
		case h[i] > MaxH:
			return row(i, ErrOutOfRange, "H is above %g A/m; check the units (H in A/m)", float64(MaxH))
		case h[i] != 0 && h[i] < MinH:
			return row(i, ErrOutOfRange, "H is below %g A/m but not zero; check the units (H in A/m)", float64(MinH))
		case b[i] > MaxB:
			return row(i, ErrOutOfRange, "B is above %g T; check the units (B in T, not mT or gauss)", float64(MaxB))
		}
		if i == 0 {
			if h[0] == 0 && b[0] != 0 {
				return row(0, ErrOrigin, "B is not zero at H = 0; a B-H curve starts at the origin (model remanence with a Magnet)")
			}
			if h[0] != 0 && b[0] == 0 {
				return row(0, ErrBNotIncreasing, "B is zero at H > 0; the curve must rise from the origin: remove the row")
			}
			continue
		}
		if !(h[i] > h[i-1]) {
			return row(i, ErrHNotIncreasing, "H is not above the previous row's H = %g A/m; sort the table by H and remove repeated rows", h[i-1])
		}
		if !(b[i] > b[i-1]) {
			return row(i, ErrBNotIncreasing, "B is not above the previous row's B = %g T; B must rise with H: correct or remove the row", b[i-1])
		}
	}
	total := n
	if h[0] != 0 {
		total++
	}
	if total < 3 {
		plural := "s"
		if total == 1 {
			plural = ""
		}
		return &TableError{Reason: fmt.Sprintf("the table has %d point%s counting the origin; at least 3 are needed (the origin and two more)", total, plural), Err: ErrTooFewPoints}
	}
	// Slopes between rows, including the segment from the origin.
	ph, pb := 0.0, 0.0
	for i := 0; i < n; i++ {
		if h[i] == 0 {
			continue
		}
		mur := (b[i] - pb) / (h[i] - ph) / Mu0
		if mur < MinMuR {
			return row(i, ErrSlope, "B rises from the previous point at %.3g μ0, slower than a third of μ0; a magnetisation curve never rises slower than μ0: check the units or the row", mur)
		}
		if mur > MaxMuR {
			return row(i, ErrSlope, "B rises from the previous point at %.3g μ0, steeper than %g μ0; check the units (H in A/m, B in T)", mur, float64(MaxMuR))
		}
		ph, pb = h[i], b[i]
	}
	return nil
}

// setSlopes sets the knot slopes d: Steffen's limited slopes at interior
// knots (M. Steffen, "A simple method for monotonic interpolation in one
// dimension", Astron. Astrophys. 239, 1990), μ0 at the last knot, and at the
// origin the slope that gives the first piece zero curvature there.
func (c *Curve) setSlopes() {
	h, b := c.h, c.b
	n := len(h)
	d := make([]float64, n)
	for i := 1; i < n-1; i++ {
		w0, w1 := h[i]-h[i-1], h[i+1]-h[i]
		s0, s1 := (b[i]-b[i-1])/w0, (b[i+1]-b[i])/w1
		p := (s0*w1 + s1*w0) / (w0 + w1)
		d[i] = math.Min(math.Min(2*s0, 2*s1), p)
	}
	// First piece: B = d0 t + c3 t³ through (h1, b1) with slope d1 there
	// gives d0 = (3 s0 - d1)/2, and d1 <= 2 s0 makes d0 >= s0/2 > 0.
	s0 := (b[1] - b[0]) / (h[1] - h[0])
	d[0] = (3*s0 - d[1]) / 2
	d[n-1] = Mu0
	c.d = d
}

// setPieces computes the cubic coefficients of each piece from the knot
// values and slopes (cubic Hermite form, e.g. C. de Boor, "A Practical Guide
// to Splines", 1978, ch. IV).
func (c *Curve) setPieces() {
	n := len(c.h)
	c.c2 = make([]float64, n-1)
	c.c3 = make([]float64, n-1)
	for i := 0; i < n-1; i++ {
		w := c.h[i+1] - c.h[i]
		s := (c.b[i+1] - c.b[i]) / w
		c.c2[i] = (3*s - 2*c.d[i] - c.d[i+1]) / w
		c.c3[i] = (c.d[i] + c.d[i+1] - 2*s) / (w * w)
	}
	c.c2[0] = 0 // exact zero curvature at the origin (see setSlopes)
	c.hl, c.bl = c.h[n-1], c.b[n-1]
}

// Name returns the curve's name: the library entry or CSV name, or "".
func (c *Curve) Name() string { return c.name }

// Table returns copies of the curve's knots (H in A/m, B in T), starting
// at the origin.
func (c *Curve) Table() (h, b []float64) {
	return append([]float64(nil), c.h...), append([]float64(nil), c.b...)
}

// TableEnd returns the last point of the data the curve was made from: the
// last knot, or for a FitCurve the last point given, past which the curve
// is extrapolated. Results report how much of the iron ran beyond it.
func (c *Curve) TableEnd() (h, b float64) {
	i := len(c.h) - 1
	if c.dataEnd > 0 {
		i = c.dataEnd
	}
	return c.h[i], c.b[i]
}

// Len returns the number of knots, including the origin.
func (c *Curve) Len() int { return len(c.h) }

// pieceH returns the index i of the piece with h[i] <= H < h[i+1], for
// 0 <= H < hl (binary search; not on the solver's hot path).
func (c *Curve) pieceH(h float64) int {
	lo, hi := 0, len(c.h)-1 // invariant: c.h[lo] <= h < c.h[hi]
	for hi-lo > 1 {
		m := int(uint(lo+hi) >> 1)
		if c.h[m] <= h {
			lo = m
		} else {
			hi = m
		}
	}
	return lo
}

// evalB returns B and dB/dH for 0 <= h.
func (c *Curve) evalB(h float64) (bv, slope float64) {
	if h >= c.hl {
		return c.bl + Mu0*(h-c.hl), Mu0
	}
	i := c.pieceH(h)
	t := h - c.h[i]
	d, c2, c3 := c.d[i], c.c2[i], c.c3[i]
	return c.b[i] + t*(d+t*(c2+t*c3)), d + t*(2*c2+3*t*c3)
}

// B returns the flux density in T at field strength h in A/m. It is odd in
// h and continues with slope μ0 past the last table point.
func (c *Curve) B(h float64) float64 {
	if math.IsNaN(h) {
		panic(errNaNArgument)
	}
	if h < 0 {
		return -c.B(-h)
	}
	bv, _ := c.evalB(h)
	return bv
}

// Slope returns the differential permeability dB/dH in H/m at field
// strength h in A/m (μ0 past the last table point).
func (c *Curve) Slope(h float64) float64 {
	if math.IsNaN(h) {
		panic(errNaNArgument)
	}
	_, s := c.evalB(math.Abs(h))
	return s
}

// H returns the field strength in A/m at flux density b in T, the inverse of
// B. Each cubic piece is inverted by Newton's method safeguarded by
// bisection, to machine precision.
func (c *Curve) H(b float64) float64 {
	if math.IsNaN(b) {
		panic(errNaNArgument)
	}
	if b < 0 {
		return -c.H(-b)
	}
	hv, _ := c.evalH(b)
	return hv
}

// evalH returns H and the piece index (-1 past the last knot) for b >= 0.
func (c *Curve) evalH(b float64) (float64, int) {
	if b >= c.bl {
		return c.hl + (b-c.bl)/Mu0, -1
	}
	i := sort.SearchFloat64s(c.b, b)
	if c.b[i] == b {
		return c.h[i], i
	}
	i--
	return c.h[i] + c.invertPiece(i, b-c.b[i]), i
}

// invertPiece solves b[i] + p(t) = b[i] + r for t in [0, w], 0 < r < b[i+1]-b[i].
func (c *Curve) invertPiece(i int, r float64) float64 {
	w := c.h[i+1] - c.h[i]
	d, c2, c3 := c.d[i], c.c2[i], c.c3[i]
	lo, hi := 0.0, w
	// Start from the secant guess.
	t := r / (c.b[i+1] - c.b[i]) * w
	for iter := 0; iter < 200; iter++ {
		f := t*(d+t*(c2+t*c3)) - r
		if f == 0 {
			return t
		}
		if f < 0 {
			lo = t
		} else {
			hi = t
		}
		fp := d + t*(2*c2+3*t*c3)
		tn := t - f/fp
		if !(tn > lo && tn < hi) {
			tn = 0.5 * (lo + hi)
		}
		if math.Abs(tn-t) <= 2e-16*math.Abs(tn) || hi-lo <= 2e-16*hi {
			return tn
		}
		t = tn
	}
	return t
}

// MuR returns the relative permeability B/(μ0 H) at flux density b in T.
// At b = 0 it is the initial relative permeability.
func (c *Curve) MuR(b float64) float64 {
	if math.IsNaN(b) {
		panic(errNaNArgument)
	}
	b = math.Abs(b)
	if b == 0 {
		return c.d[0] / Mu0
	}
	return b / (Mu0 * c.H(b))
}

// Stacked returns the effective curve of a laminated stack whose steel
// occupies the fraction k of the cross-section, 0 < k <= 1:
//
//	B_eff(H) = k B(H) + (1-k) μ0 H.
//
// Along the laminations the tangential H is continuous across steel and
// insulation, so the fluxes add by area fraction (common practice, the
// standard lamination mixing rule). Flux across the laminations is not
// modelled. Hermite interpolation is linear in its data, so the result is
// exactly this mixture of the interpolant, with the same knots; its slope
// past the last point is still μ0. Stacked(1) returns c itself. A k outside
// (0, 1] gives an error wrapping ErrStacking.
func (c *Curve) Stacked(k float64) (*Curve, error) {
	if !(k > 0 && k <= 1) {
		return nil, fmt.Errorf("materials: stacking factor %g: %w; give the steel fraction of the stack, 0 < k <= 1 (varnished laminations are typically 0.95-0.98, from memory: typical values)", k, ErrStacking)
	}
	if k == 1 {
		return c, nil
	}
	n := len(c.h)
	s := &Curve{
		name:    c.name,
		builtin: c.builtin,
		dataEnd: c.dataEnd,
		h:       append([]float64(nil), c.h...),
		b:       make([]float64, n),
		d:       make([]float64, n),
		c2:      make([]float64, n-1),
		c3:      make([]float64, n-1),
	}
	for i := range n {
		s.b[i] = k*c.b[i] + (1-k)*Mu0*c.h[i]
		s.d[i] = k*c.d[i] + (1-k)*Mu0
	}
	s.d[n-1] = Mu0
	for i := range n - 1 {
		s.c2[i] = k * c.c2[i]
		s.c3[i] = k * c.c3[i]
	}
	s.hl, s.bl = s.h[n-1], s.b[n-1]
	if knot, ok := s.build(); !ok {
		return nil, fmt.Errorf("materials: stacking factor %g: %w", k, irregular(knot, s.h, s.b, true))
	}
	return s, nil
}
