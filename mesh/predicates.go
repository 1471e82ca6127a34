package mesh

// Robust geometric predicates.
//
// Orient2D and InCircle follow J. R. Shewchuk, "Adaptive Precision
// Floating-Point Arithmetic and Fast Robust Geometric Predicates", Discrete &
// Computational Geometry 18 (1997) 305-363: a floating-point evaluation with a
// forward error bound (the paper's ccwerrboundA and iccerrboundA) decides
// almost every call; for InCircle the paper's intermediate stages B and C
// (exact determinant of the rounded differences, then a first-order
// correction for their rounding) settle most of the rest; when no bound can
// certify the sign, the determinant is evaluated exactly with floating-point
// expansions (Two-Sum, Two-Product,
// Fast-Expansion-Sum, Scale-Expansion of the paper's section 2). The exact stage
// represents every coordinate difference as a two-term expansion, so when the
// differences are exact (the common case for nearly degenerate inputs) the
// expansions stay short and the fallback is cheap.
//
// Two-Product uses math.FMA, which rounds once, so the low half of a product
// is exact without Dekker's splitting.
//
// Range: the results are exact as long as no product of four coordinate
// differences, nor its rounding error, overflows or underflows: coordinates
// up to about 1e70 in magnitude and nonzero coordinate differences above
// about 1e-60. Triangulate rejects larger coordinates.
//
// NearPoint and NearSegment compare a distance with a resolution d exactly,
// with a floating-point filter and the same expansions behind it.
//
// Every geometric decision in this package, and in the model validation of
// package models, goes through this file (polygon.go composes these
// predicates into the polygon checks).

import (
	"math"
	"sync"
)

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
	// The B and C bounds cover stages B and C of orient2dadapt and
	// incircleadapt, resultErrBound the rounding of an expansion's estimate
	// (sections 4.2 and 4.3).
	ccwErrBoundB   = (2 + 12*epsilon) * epsilon
	ccwErrBoundC   = (9 + 64*epsilon) * epsilon * epsilon
	iccErrBoundB   = (4 + 48*epsilon) * epsilon
	iccErrBoundC   = (44 + 576*epsilon) * epsilon * epsilon
	resultErrBound = (3 + 8*epsilon) * epsilon
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
	return orient2DAdapt(ax, ay, bx, by, cx, cy, detSum)
}

// orient2DAdapt is Shewchuk's orient2dadapt (1997, section 4.2): stage B
// evaluates the determinant of the rounded differences exactly, stage C adds
// the first-order effect of their rounding errors, and only then the fully
// exact evaluation runs.
func orient2DAdapt(ax, ay, bx, by, cx, cy, detSum float64) Orientation {
	acx, bcx := ax-cx, bx-cx
	acy, bcy := ay-cy, by-cy
	var bb [4]float64
	fin := crossTo(bb[:0], acx, bcy, acy, bcx)
	det := estimate(fin)
	if bound := ccwErrBoundB * detSum; det >= bound || -det >= bound {
		return sign(det)
	}
	acxt, bcxt := diffTail(ax, cx, acx), diffTail(bx, cx, bcx)
	acyt, bcyt := diffTail(ay, cy, acy), diffTail(by, cy, bcy)
	if acxt == 0 && acyt == 0 && bcxt == 0 && bcyt == 0 {
		return sign(fin[len(fin)-1]) // the differences were exact
	}
	bound := ccwErrBoundC*detSum + resultErrBound*math.Abs(det)
	det += (acx*bcyt + bcy*acxt) - (acy*bcxt + bcx*acyt)
	if det >= bound || -det >= bound {
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
	return inCircleAdapt(ax, ay, bx, by, cx, cy, dx, dy, permanent)
}

// inCircleAdapt is Shewchuk's incircleadapt (1997, section 4.3): stage B
// evaluates the determinant of the rounded differences exactly; stage C adds
// the first-order effect of the differences' rounding errors under a
// tighter bound; only then the fully exact evaluation runs. Near-cocircular
// points from a discretised arc are typically settled by stage C.
func inCircleAdapt(ax, ay, bx, by, cx, cy, dx, dy, permanent float64) int {
	adx, ady := ax-dx, ay-dy
	bdx, bdy := bx-dx, by-dy
	cdx, cdy := cx-dx, cy-dy
	// Stage B on fixed-size stack buffers: cross products have at most 4
	// terms, lifted terms 32, the sum 96.
	var bc, ca, ab [4]float64
	var la, lb, lc [32]float64
	var lab [64]float64
	var finBuf [96]float64
	fin := sumTo(finBuf[:0],
		sumTo(lab[:0], liftedTo(la[:0], adx, ady, crossTo(bc[:0], bdx, cdy, cdx, bdy)),
			liftedTo(lb[:0], bdx, bdy, crossTo(ca[:0], cdx, ady, adx, cdy))),
		liftedTo(lc[:0], cdx, cdy, crossTo(ab[:0], adx, bdy, bdx, ady)))
	det := estimate(fin)
	if bound := iccErrBoundB * permanent; det >= bound || -det >= bound {
		return int(sign(det))
	}
	adxt, adyt := diffTail(ax, dx, adx), diffTail(ay, dy, ady)
	bdxt, bdyt := diffTail(bx, dx, bdx), diffTail(by, dy, bdy)
	cdxt, cdyt := diffTail(cx, dx, cdx), diffTail(cy, dy, cdy)
	if adxt == 0 && adyt == 0 && bdxt == 0 && bdyt == 0 && cdxt == 0 && cdyt == 0 {
		return int(sign(fin[len(fin)-1])) // the differences were exact
	}
	bound := iccErrBoundC*permanent + resultErrBound*math.Abs(det)
	det += ((adx*adx+ady*ady)*((bdx*cdyt+cdy*bdxt)-(bdy*cdxt+cdx*bdyt)) +
		2*(adx*adxt+ady*adyt)*(bdx*cdy-bdy*cdx)) +
		((bdx*bdx+bdy*bdy)*((cdx*adyt+ady*cdxt)-(cdy*adxt+adx*cdyt)) +
			2*(bdx*bdxt+bdy*bdyt)*(cdx*ady-cdy*adx)) +
		((cdx*cdx+cdy*cdy)*((adx*bdyt+bdy*adxt)-(ady*bdxt+bdx*adyt)) +
			2*(cdx*cdxt+cdy*cdyt)*(adx*bdy-ady*bdx))
	if det >= bound || -det >= bound {
		return int(sign(det))
	}
	return inCircleExact(ax, ay, bx, by, cx, cy, dx, dy)
}

// crossTo writes p1*q1 - p2*q2 exactly into dst (capacity >= 4)
// (Two-Product twice, then Two-Two-Diff as an expansion sum).
func crossTo(dst []float64, p1, q1, p2, q2 float64) []float64 {
	x1, y1 := twoProduct(p1, q1)
	x2, y2 := twoProduct(p2, q2)
	e := [2]float64{y1, x1}
	f := [2]float64{-y2, -x2}
	return sumTo(dst, zeroElim(e[:]), zeroElim(f[:]))
}

// zeroElim drops zero terms of a two-term expansion, keeping at least one.
func zeroElim(e []float64) []float64 {
	if e[0] == 0 {
		return e[1:]
	}
	return e
}

// liftedTo writes (x^2 + y^2) * c exactly into dst (capacity >= 16 len(c)/2
// ... at most 32 for a 4-term c).
func liftedTo(dst []float64, x, y float64, c []float64) []float64 {
	var t1, t2 [8]float64
	var t3, t4 [16]float64
	xx := scaleTo(t3[:0], scaleTo(t1[:0], c, x), x)
	yy := scaleTo(t4[:0], scaleTo(t2[:0], c, y), y)
	return sumTo(dst, xx, yy)
}

// diffTail returns the rounding error of x = fl(a-b): a-b = x + tail.
func diffTail(a, b, x float64) float64 {
	bv := a - x
	av := x + bv
	return (a - av) + (bv - b)
}

// estimate approximates the value of an expansion by summing its terms.
func estimate(e []float64) float64 {
	s := 0.0
	for _, v := range e {
		s += v
	}
	return s
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
	return dotSign(px, py, ax, ay, bx, by) < 0
}

// dotSign returns the sign of (p-v)·(q-v), exactly. The rounded dot product
// of rounded differences has the error bound of orient2d (a sum of two
// products instead of a difference), ccwErrBoundA times its permanent.
func dotSign(vx, vy, px, py, qx, qy float64) Orientation {
	ux, uy := px-vx, py-vy
	wx, wy := qx-vx, qy-vy
	d := float64(ux*wx) + float64(uy*wy)
	perm := math.Abs(ux*wx) + math.Abs(uy*wy)
	if bound := ccwErrBoundA * perm; d > bound || -d > bound {
		return sign(d)
	}
	a := getArena()
	defer putArena(a)
	s := a.sum(a.mul(a.diff(px, vx), a.diff(qx, vx)), a.mul(a.diff(py, vy), a.diff(qy, vy)))
	return sign(s[len(s)-1])
}

// Distance predicates at a resolution d.
//
// A tolerance is a statement of intent ("closer than d counts as touching"),
// not a remedy for rounding: NearPoint and NearSegment compare a distance
// with d exactly, so the answer depends only on the inputs and d. Squares
// keep them polynomial: |p-a|^2 <= d^2, and for the interior of a segment
// ((b-a) x (p-a))^2 <= d^2 |b-a|^2, a degree-4 polynomial in coordinate
// differences, in the range stated above for Orient2D (d itself above about
// 1e-60, so that d^2 stays a normal number).

// nearSlack is the relative error allowed for the rounded squares and
// products in the distance filters: a few ε per operation, taken generously
// (64ε); anything closer goes to the exact stage.
const nearSlack = 64 * epsilon

// NearPoint reports whether the distance between a and b is at most d
// (d >= 0; d = 0 tests equality), deciding |b-a|^2 <= d^2 exactly.
func NearPoint(ax, ay, bx, by, d float64) bool {
	dx, dy := bx-ax, by-ay
	s := dx*dx + dy*dy
	dd := d * d
	if bound := nearSlack * (s + dd); s-dd > bound {
		return false
	} else if dd-s > bound {
		return true
	}
	a := getArena()
	defer putArena(a)
	ex, ey := a.diff(bx, ax), a.diff(by, ay)
	return atMost(a, a.sum(a.mul(ex, ex), a.mul(ey, ey)), a.square(d))
}

// NearSegment reports whether the distance from p to the closed segment ab
// is at most d (d >= 0; a == b is allowed and tests the point). With d = 0
// it reports whether p lies on the segment. The decision is exact: the
// closest point is a when (p-a)·(b-a) <= 0, b when (p-b)·(a-b) <= 0 (both
// signs from exact dot products), else the foot of the perpendicular.
func NearSegment(px, py, ax, ay, bx, by, d float64) bool {
	// Cheap rejection outside the segment's box grown by 2d: rounding the
	// grown edge moves it by at most d, so p is farther than d.
	if px < math.Min(ax, bx)-2*d || px > math.Max(ax, bx)+2*d ||
		py < math.Min(ay, by)-2*d || py > math.Max(ay, by)+2*d {
		return false
	}
	if dotSign(ax, ay, px, py, bx, by) != CCW {
		return NearPoint(px, py, ax, ay, d)
	}
	if dotSign(bx, by, px, py, ax, ay) != CCW {
		return NearPoint(px, py, bx, by, d)
	}
	// The foot lies strictly inside ab: compare c^2 with d^2 l^2, where
	// c = (a-p) x (b-p) is twice the area of (a, b, p) and l = |b-a|.
	detLeft := (ax - px) * (by - py)
	detRight := (ay - py) * (bx - px)
	c := math.Abs(detLeft - detRight)
	errc := ccwErrBoundA * (math.Abs(detLeft) + math.Abs(detRight))
	ux, uy := bx-ax, by-ay
	r := d * d * (ux*ux + uy*uy)
	if lo := c - errc; lo > 0 && lo*lo > r*(1+nearSlack) {
		return false
	}
	if hi := c + errc; hi*hi*(1+nearSlack) < r {
		return true
	}
	a := getArena()
	defer putArena(a)
	cross := a.sum(a.mul(a.diff(ax, px), a.diff(by, py)), negate(a.mul(a.diff(ay, py), a.diff(bx, px))))
	ex, ey := a.diff(bx, ax), a.diff(by, ay)
	l2 := a.sum(a.mul(ex, ex), a.mul(ey, ey))
	return atMost(a, a.mul(cross, cross), a.mul(l2, a.square(d)))
}

// square returns d*d exactly (Two-Product) as an expansion.
func (ar *arena) square(d float64) []float64 {
	x, y := twoProduct(d, d)
	h := ar.get(2)
	if y != 0 {
		h = append(h, y)
	}
	return append(h, x)
}

// atMost reports whether the expansion e is at most the expansion f.
func atMost(ar *arena, e, f []float64) bool {
	g := ar.get(len(f))
	for _, v := range f {
		g = append(g, -v)
	}
	s := ar.sum(e, g)
	return s[len(s)-1] <= 0
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
	a := getArena()
	defer putArena(a)
	left := a.mul(a.diff(ax, cx), a.diff(by, cy))
	right := a.mul(a.diff(ay, cy), a.diff(bx, cx))
	d := a.sum(left, negate(right))
	return int(sign(d[len(d)-1]))
}

// inCircleExact evaluates the incircle determinant exactly and returns its
// sign.
func inCircleExact(ax, ay, bx, by, cx, cy, dx, dy float64) int {
	a := getArena()
	defer putArena(a)
	adx, ady := a.diff(ax, dx), a.diff(ay, dy)
	bdx, bdy := a.diff(bx, dx), a.diff(by, dy)
	cdx, cdy := a.diff(cx, dx), a.diff(cy, dy)
	lift := func(x, y []float64) []float64 { return a.sum(a.mul(x, x), a.mul(y, y)) }
	cross := func(x1, y2, x2, y1 []float64) []float64 {
		return a.sum(a.mul(x1, y2), negate(a.mul(x2, y1)))
	}
	ta := a.mul(lift(adx, ady), cross(bdx, cdy, cdx, bdy))
	tb := a.mul(lift(bdx, bdy), cross(cdx, ady, adx, cdy))
	tc := a.mul(lift(cdx, cdy), cross(adx, bdy, bdx, ady))
	d := a.sum(a.sum(ta, tb), tc)
	return int(sign(d[len(d)-1]))
}

// arena hands out expansion buffers from one block, so the exact stages do
// not allocate once the pool is warm. Expansions are nonoverlapping, in
// increasing magnitude, zero-eliminated, and never empty.
type arena struct {
	buf []float64
	off int
}

var arenaPool = sync.Pool{New: func() any { return &arena{buf: make([]float64, 1<<15)} }}

func getArena() *arena  { return arenaPool.Get().(*arena) }
func putArena(a *arena) { a.off = 0; arenaPool.Put(a) }

// get returns an empty slice with capacity n.
func (a *arena) get(n int) []float64 {
	if a.off+n > len(a.buf) {
		return make([]float64, 0, n)
	}
	s := a.buf[a.off : a.off : a.off+n]
	a.off += n
	return s
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

// diff returns the exact difference a-b as an expansion (Two-Diff).
func (ar *arena) diff(a, b float64) []float64 {
	h := ar.get(2)
	x := a - b
	bv := a - x
	av := x + bv
	y := (a - av) + (bv - b)
	if y != 0 {
		h = append(h, y)
	}
	return append(h, x)
}

// sum returns e+f in a new arena buffer.
func (ar *arena) sum(e, f []float64) []float64 { return sumTo(ar.get(len(e)+len(f)), e, f) }

// sumTo writes e+f into dst[:0], which needs capacity len(e)+len(f)
// (Shewchuk 1997, Fast-Expansion-Sum with zero elimination, Theorem 13).
func sumTo(h, e, f []float64) []float64 {
	h = h[:0]
	ei, fi := 0, 0
	var q float64
	if smaller(e[0], f[0]) {
		q, ei = e[0], 1
	} else {
		q, fi = f[0], 1
	}
	if ei < len(e) && fi < len(f) {
		var hh float64
		if smaller(e[ei], f[fi]) {
			q, hh = fastTwoSum(e[ei], q)
			ei++
		} else {
			q, hh = fastTwoSum(f[fi], q)
			fi++
		}
		if hh != 0 {
			h = append(h, hh)
		}
		for ei < len(e) && fi < len(f) {
			if smaller(e[ei], f[fi]) {
				q, hh = twoSum(q, e[ei])
				ei++
			} else {
				q, hh = twoSum(q, f[fi])
				fi++
			}
			if hh != 0 {
				h = append(h, hh)
			}
		}
	}
	for ; ei < len(e); ei++ {
		var hh float64
		q, hh = twoSum(q, e[ei])
		if hh != 0 {
			h = append(h, hh)
		}
	}
	for ; fi < len(f); fi++ {
		var hh float64
		q, hh = twoSum(q, f[fi])
		if hh != 0 {
			h = append(h, hh)
		}
	}
	if q != 0 || len(h) == 0 {
		h = append(h, q)
	}
	return h
}

// smaller reports |e| < |f| in Shewchuk's tie-breaking form
// ((f > e) == (f > -e)).
func smaller(e, f float64) bool { return (f > e) == (f > -e) }

// scale returns e*b in a new arena buffer.
func (ar *arena) scale(e []float64, b float64) []float64 { return scaleTo(ar.get(2*len(e)), e, b) }

// scaleTo writes e*b into dst[:0], which needs capacity 2 len(e)
// (Shewchuk 1997, Scale-Expansion with zero elimination, Theorem 19).
func scaleTo(h, e []float64, b float64) []float64 {
	h = h[:0]
	q, hh := twoProduct(e[0], b)
	if hh != 0 {
		h = append(h, hh)
	}
	for _, ei := range e[1:] {
		p1, p0 := twoProduct(ei, b)
		var s float64
		s, hh = twoSum(q, p0)
		if hh != 0 {
			h = append(h, hh)
		}
		q, hh = fastTwoSum(p1, s)
		if hh != 0 {
			h = append(h, hh)
		}
	}
	if q != 0 || len(h) == 0 {
		h = append(h, q)
	}
	return h
}

// mul returns the exact product e*f: the sum of e scaled by each term of f.
func (ar *arena) mul(e, f []float64) []float64 {
	h := ar.scale(e, f[0])
	for _, fi := range f[1:] {
		h = ar.sum(h, ar.scale(e, fi))
	}
	return h
}

func negate(e []float64) []float64 {
	for i := range e {
		e[i] = -e[i]
	}
	return e
}
