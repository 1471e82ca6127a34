package mesh

// Robust geometric predicates.
//
// Orient2D and InCircle follow J. R. Shewchuk, "Adaptive Precision
// Floating-Point Arithmetic and Fast Robust Geometric Predicates", Discrete &
// Computational Geometry 18 (1997) 305-363: a floating-point evaluation with a
// forward error bound (the paper's ccwerrboundA and iccerrboundA) decides
// almost every call; when the bound cannot certify the sign, the determinant
// is evaluated exactly with floating-point expansions (Two-Sum, Two-Product,
// Grow-Expansion, Scale-Expansion of the paper's section 2). The exact stage
// represents every coordinate difference as a two-term expansion, so when the
// differences are exact (the common case for nearly degenerate inputs) the
// expansions stay short and the fallback is cheap.
//
// Two-Product uses math.FMA, which rounds once, so the low half of a product
// is exact without Dekker's splitting.
//
// Every geometric decision in this package goes through this file.

import "math"

// Orientation is the turn direction of an ordered point triple.
type Orientation int8

const (
	// CW: the triple turns clockwise (negative signed area).
	CW Orientation = -1
	// Collinear: the three points lie on one line (zero area), exactly.
	Collinear Orientation = 0
	// CCW: the triple turns counter-clockwise (positive signed area).
	CCW Orientation = 1
)

// String returns "CW", "Collinear" or "CCW".
func (o Orientation) String() string {
	switch o {
	case CW:
		return "CW"
	case CCW:
		return "CCW"
	}
	return "Collinear"
}

const (
	// epsilon is half an ulp of 1: 2^-53 (Shewchuk 1997, section 2).
	epsilon = 1.0 / (1 << 53)
	// ccwErrBoundA bounds the rounding error of the plain orient2d
	// evaluation relative to its permanent (Shewchuk 1997, section 4.2).
	ccwErrBoundA = (3 + 16*epsilon) * epsilon
	// iccErrBoundA is the corresponding bound for incircle (section 4.3).
	iccErrBoundA = (10 + 96*epsilon) * epsilon
)

// Orient2D reports the orientation of the triangle (a, b, c): CCW when c lies
// to the left of the directed line a->b, CW when to the right, Collinear when
// exactly on it. The result is exact for all finite inputs.
func Orient2D(ax, ay, bx, by, cx, cy float64) Orientation {
	detLeft := float64((ax - cx) * (by - cy))
	detRight := float64((ay - cy) * (bx - cx))
	det := detLeft - detRight
	var detSum float64
	switch {
	case detLeft > 0:
		if detRight <= 0 {
			return sign(det)
		}
		detSum = detLeft + detRight
	case detLeft < 0:
		if detRight >= 0 {
			return sign(det)
		}
		detSum = -detLeft - detRight
	default:
		return sign(det)
	}
	if bound := ccwErrBoundA * detSum; det >= bound || -det >= bound {
		return sign(det)
	}
	return Orientation(orient2DExact(ax, ay, bx, by, cx, cy))
}

// Orient2DDet returns an approximation of twice the signed area of (a, b, c),
// (a-c) x (b-c). Its sign is NOT guaranteed; use Orient2D for decisions.
// It is meant for magnitudes (areas, quality measures).
func Orient2DDet(ax, ay, bx, by, cx, cy float64) float64 {
	return (ax-cx)*(by-cy) - (ay-cy)*(bx-cx)
}

// InCircle returns +1 if d lies strictly inside the circle through a, b, c,
// -1 if strictly outside and 0 if exactly on it, provided (a, b, c) is
// counter-clockwise; the sign is reversed for a clockwise triple. The result is
// exact for all finite inputs.
func InCircle(ax, ay, bx, by, cx, cy, dx, dy float64) int {
	adx, ady := ax-dx, ay-dy
	bdx, bdy := bx-dx, by-dy
	cdx, cdy := cx-dx, cy-dy

	bdxcdy := float64(bdx * cdy)
	cdxbdy := float64(cdx * bdy)
	alift := float64(adx*adx) + float64(ady*ady)

	cdxady := float64(cdx * ady)
	adxcdy := float64(adx * cdy)
	blift := float64(bdx*bdx) + float64(bdy*bdy)

	adxbdy := float64(adx * bdy)
	bdxady := float64(bdx * ady)
	clift := float64(cdx*cdx) + float64(cdy*cdy)

	det := alift*(bdxcdy-cdxbdy) + blift*(cdxady-adxcdy) + clift*(adxbdy-bdxady)
	permanent := (math.Abs(bdxcdy)+math.Abs(cdxbdy))*alift +
		(math.Abs(cdxady)+math.Abs(adxcdy))*blift +
		(math.Abs(adxbdy)+math.Abs(bdxady))*clift
	if bound := iccErrBoundA * permanent; det > bound || -det > bound {
		return int(sign(det))
	}
	return inCircleExact(ax, ay, bx, by, cx, cy, dx, dy)
}

// InCircleDet returns an approximation of the incircle determinant (positive
// when d is inside the circle through counter-clockwise a, b, c). Its sign is
// NOT guaranteed; use InCircle for decisions.
func InCircleDet(ax, ay, bx, by, cx, cy, dx, dy float64) float64 {
	adx, ady := ax-dx, ay-dy
	bdx, bdy := bx-dx, by-dy
	cdx, cdy := cx-dx, cy-dy
	return (adx*adx+ady*ady)*(bdx*cdy-cdx*bdy) +
		(bdx*bdx+bdy*bdy)*(cdx*ady-adx*cdy) +
		(cdx*cdx+cdy*cdy)*(adx*bdy-bdx*ady)
}

// InDiametralCircle reports whether p lies strictly inside the circle whose
// diameter is the segment (a, b), that is whether the angle a-p-b exceeds 90
// degrees (Ruppert 1995, "encroachment"). The test is a dot product evaluated
// exactly with expansions when the rounded value is too small to trust.
func InDiametralCircle(ax, ay, bx, by, px, py float64) bool {
	ux, uy := ax-px, ay-py
	vx, vy := bx-px, by-py
	d := float64(ux*vx) + float64(uy*vy)
	perm := math.Abs(ux*vx) + math.Abs(uy*vy)
	if bound := ccwErrBoundA * perm; d > bound || -d > bound {
		return d < 0
	}
	var b1, b2, b3, b4 [2]float64
	ue := twoDiffExp(ax, px, b1[:0])
	ve := twoDiffExp(bx, px, b2[:0])
	ue2 := twoDiffExp(ay, py, b3[:0])
	ve2 := twoDiffExp(by, py, b4[:0])
	s := expansionSum(mulExpansion(ue, ve), mulExpansion(ue2, ve2))
	return s[len(s)-1] < 0
}

func sign(x float64) Orientation {
	switch {
	case x > 0:
		return CCW
	case x < 0:
		return CW
	}
	return Collinear
}

// orient2DExact evaluates (ax-cx)(by-cy) - (ay-cy)(bx-cx) exactly and returns
// its sign.
func orient2DExact(ax, ay, bx, by, cx, cy float64) int {
	var b1, b2, b3, b4 [2]float64
	acx := twoDiffExp(ax, cx, b1[:0])
	bcy := twoDiffExp(by, cy, b2[:0])
	acy := twoDiffExp(ay, cy, b3[:0])
	bcx := twoDiffExp(bx, cx, b4[:0])
	left := mulExpansion(acx, bcy)
	right := mulExpansion(acy, bcx)
	d := expansionSum(left, negate(right))
	return int(sign(d[len(d)-1]))
}

// inCircleExact evaluates the incircle determinant exactly and returns its
// sign.
func inCircleExact(ax, ay, bx, by, cx, cy, dx, dy float64) int {
	var b [6][2]float64
	adx := twoDiffExp(ax, dx, b[0][:0])
	ady := twoDiffExp(ay, dy, b[1][:0])
	bdx := twoDiffExp(bx, dx, b[2][:0])
	bdy := twoDiffExp(by, dy, b[3][:0])
	cdx := twoDiffExp(cx, dx, b[4][:0])
	cdy := twoDiffExp(cy, dy, b[5][:0])

	lift := func(x, y []float64) []float64 {
		return expansionSum(mulExpansion(x, x), mulExpansion(y, y))
	}
	cross := func(x1, y2, x2, y1 []float64) []float64 {
		return expansionSum(mulExpansion(x1, y2), negate(mulExpansion(x2, y1)))
	}
	ta := mulExpansion(lift(adx, ady), cross(bdx, cdy, cdx, bdy))
	tb := mulExpansion(lift(bdx, bdy), cross(cdx, ady, adx, cdy))
	tc := mulExpansion(lift(cdx, cdy), cross(adx, bdy, bdx, ady))
	d := expansionSum(expansionSum(ta, tb), tc)
	return int(sign(d[len(d)-1]))
}

// twoSum returns x = fl(a+b) and the exact error y with a+b = x+y
// (Knuth; Shewchuk 1997, Theorem 7).
func twoSum(a, b float64) (x, y float64) {
	x = a + b
	bv := x - a
	av := x - bv
	y = (a - av) + (b - bv)
	return
}

// fastTwoSum requires |a| >= |b| (Dekker; Shewchuk 1997, Theorem 6).
func fastTwoSum(a, b float64) (x, y float64) {
	x = a + b
	y = b - (x - a)
	return
}

// twoProduct returns x = fl(a*b) and the exact error y with a*b = x+y.
func twoProduct(a, b float64) (x, y float64) {
	x = a * b
	y = math.FMA(a, b, -x)
	return
}

// twoDiffExp appends the exact difference a-b as a zero-eliminated expansion
// (increasing magnitude) to dst; the result always has at least one term.
func twoDiffExp(a, b float64, dst []float64) []float64 {
	x := a - b
	bv := a - x
	av := x + bv
	y := (a - av) + (bv - b)
	if y != 0 {
		dst = append(dst, y)
	}
	return append(dst, x)
}

// growExpansion adds b to the nonoverlapping expansion e (Shewchuk 1997,
// Figure 6, with zero elimination).
func growExpansion(e []float64, b float64) []float64 {
	h := make([]float64, 0, len(e)+1)
	q := b
	for _, ei := range e {
		var hh float64
		q, hh = twoSum(q, ei)
		if hh != 0 {
			h = append(h, hh)
		}
	}
	if q != 0 || len(h) == 0 {
		h = append(h, q)
	}
	return h
}

// expansionSum returns e+f (Shewchuk 1997, Expansion-Sum, Theorem 12: each
// term of f is grown into the running sum).
func expansionSum(e, f []float64) []float64 {
	h := e
	for _, fi := range f {
		h = growExpansion(h, fi)
	}
	return h
}

// scaleExpansion returns e*b (Shewchuk 1997, Figure 7, zero elimination).
func scaleExpansion(e []float64, b float64) []float64 {
	h := make([]float64, 0, 2*len(e))
	q, hh := twoProduct(e[0], b)
	if hh != 0 {
		h = append(h, hh)
	}
	for _, ei := range e[1:] {
		p1, p0 := twoProduct(ei, b)
		var sum float64
		sum, hh = twoSum(q, p0)
		if hh != 0 {
			h = append(h, hh)
		}
		q, hh = fastTwoSum(p1, sum)
		if hh != 0 {
			h = append(h, hh)
		}
	}
	if q != 0 || len(h) == 0 {
		h = append(h, q)
	}
	return h
}

// mulExpansion returns the exact product e*f as an expansion.
func mulExpansion(e, f []float64) []float64 {
	h := scaleExpansion(e, f[0])
	for _, fi := range f[1:] {
		h = expansionSum(h, scaleExpansion(e, fi))
	}
	return h
}

func negate(e []float64) []float64 {
	for i := range e {
		e[i] = -e[i]
	}
	return e
}
