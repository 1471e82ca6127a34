package mesh

import (
	"math"
	"math/big"
	"math/rand/v2"
	"strings"
	"testing"
)

// Oracles in math/big: float64 inputs are exact binary fractions and
// big.Rat arithmetic is exact, so these are the true answers.

func rat(x float64) *big.Rat { return new(big.Rat).SetFloat64(x) }

func ratSub(a, b *big.Rat) *big.Rat { return new(big.Rat).Sub(a, b) }
func ratMul(a, b *big.Rat) *big.Rat { return new(big.Rat).Mul(a, b) }
func ratAdd(a, b *big.Rat) *big.Rat { return new(big.Rat).Add(a, b) }

// bigNearPoint decides |b-a|^2 <= d^2.
func bigNearPoint(ax, ay, bx, by, d float64) bool {
	dx, dy := ratSub(rat(bx), rat(ax)), ratSub(rat(by), rat(ay))
	s := ratAdd(ratMul(dx, dx), ratMul(dy, dy))
	return s.Cmp(ratMul(rat(d), rat(d))) <= 0
}

// bigNearSegment decides dist(p, [a, b]) <= d.
func bigNearSegment(px, py, ax, ay, bx, by, d float64) bool {
	ux, uy := ratSub(rat(bx), rat(ax)), ratSub(rat(by), rat(ay))
	wx, wy := ratSub(rat(px), rat(ax)), ratSub(rat(py), rat(ay))
	if ratAdd(ratMul(wx, ux), ratMul(wy, uy)).Sign() <= 0 {
		return bigNearPoint(px, py, ax, ay, d)
	}
	vx, vy := ratSub(rat(px), rat(bx)), ratSub(rat(py), rat(by))
	if ratAdd(ratMul(vx, ux), ratMul(vy, uy)).Sign() >= 0 {
		return bigNearPoint(px, py, bx, by, d)
	}
	c := ratSub(ratMul(ux, wy), ratMul(uy, wx))
	l2 := ratAdd(ratMul(ux, ux), ratMul(uy, uy))
	return ratMul(c, c).Cmp(ratMul(ratMul(rat(d), rat(d)), l2)) <= 0
}

// naiveNearSegment is the plain floating-point distance test the exact one
// replaces (projection, clamp, hypot).
func naiveNearSegment(px, py, ax, ay, bx, by, d float64) bool {
	ex, ey := bx-ax, by-ay
	t := 0.0
	if l2 := ex*ex + ey*ey; l2 > 0 {
		t = math.Min(math.Max(((px-ax)*ex+(py-ay)*ey)/l2, 0), 1)
	}
	return math.Hypot(ax+t*ex-px, ay+t*ey-py) <= d
}

// nudge moves x by k ulps (k may be negative).
func nudge(x float64, k int) float64 {
	for ; k > 0; k-- {
		x = math.Nextafter(x, math.Inf(1))
	}
	for ; k < 0; k++ {
		x = math.Nextafter(x, math.Inf(-1))
	}
	return x
}

// TestNearSegmentAtTheResolution puts p at distance d from a segment, up to
// rounding (off its interior, and off an end), then a few ulps either way,
// at scales 1e-9..1e9, and compares with exact arithmetic. These are the
// inputs on which a float distance test and the exact one disagree.
func TestNearSegmentAtTheResolution(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 4))
	naiveWrong := 0
	for _, s := range predicateScales {
		d := 1e-9 * s
		for n := 0; n < 2000; n++ {
			ax, ay := s*rng.Float64(), s*rng.Float64()
			bx, by := s*rng.Float64(), s*rng.Float64()
			l := math.Hypot(bx-ax, by-ay)
			var px, py float64
			if n%4 == 0 {
				// Beyond end b, at distance d along the direction a->b.
				px, py = bx+d*(bx-ax)/l, by+d*(by-ay)/l
			} else {
				u := rng.Float64()
				sg := float64(2*rng.IntN(2) - 1)
				px = ax + u*(bx-ax) - sg*d*(by-ay)/l
				py = ay + u*(by-ay) + sg*d*(bx-ax)/l
			}
			px, py = nudge(px, rng.IntN(5)-2), nudge(py, rng.IntN(5)-2)
			got := NearSegment(px, py, ax, ay, bx, by, d)
			want := bigNearSegment(px, py, ax, ay, bx, by, d)
			if got != want {
				t.Fatalf("scale %g: NearSegment(%v, %v; %v, %v, %v, %v; %v) = %v, exact %v", s, px, py, ax, ay, bx, by, d, got, want)
			}
			if naiveNearSegment(px, py, ax, ay, bx, by, d) != want {
				naiveWrong++
			}
			if got := NearPoint(px, py, bx, by, d); got != bigNearPoint(px, py, bx, by, d) {
				t.Fatalf("scale %g: NearPoint(%v, %v, %v, %v, %v) = %v", s, px, py, bx, by, d, got)
			}
		}
	}
	// The cases must be hard: the float test gets some of them wrong.
	if naiveWrong == 0 {
		t.Error("cases too easy: the floating-point distance test never fails")
	}
	t.Logf("floating-point distance test wrong on %d of %d cases", naiveWrong, 2000*len(predicateScales))
}

// TestNearSegmentEdgeCases covers d = 0, degenerate segments and points on
// the segment's line beyond its ends.
func TestNearSegmentEdgeCases(t *testing.T) {
	cases := []struct {
		name                      string
		px, py, ax, ay, bx, by, d float64
		want                      bool
	}{
		{"on the segment, d = 0", 0.5, 0.5, 0, 0, 1, 1, 0, true},
		{"1 ulp off, d = 0", 0.5, nudge(0.5, 1), 0, 0, 1, 1, 0, false},
		{"on the line beyond b", 2, 2, 0, 0, 1, 1, 1.4142135623730951, true},
		{"on the line beyond b, just too far", 2, 2, 0, 0, 1, 1, 1.414213562373095, false},
		{"a == b", 3, 4, 0, 0, 0, 0, 5, true},
		{"a == b, just too far", 3, 4, 0, 0, 0, 0, nudge(5, -1), false},
		{"at an end", 1, 1, 0, 0, 1, 1, 0, true},
		{"perpendicular distance exactly d", 0.5, 1, 0, 0, 1, 0, 1, true},
		{"perpendicular distance d + 1 ulp", 0.5, nudge(1, 1), 0, 0, 1, 0, 1, false},
	}
	for _, c := range cases {
		got := NearSegment(c.px, c.py, c.ax, c.ay, c.bx, c.by, c.d)
		if got != c.want || got != bigNearSegment(c.px, c.py, c.ax, c.ay, c.bx, c.by, c.d) {
			t.Errorf("%s: NearSegment = %v, want %v", c.name, got, c.want)
		}
	}
}

// TestNearSegmentNoAllocs checks that the exact stage takes its scratch
// space from the pool (STYLE: hot paths allocate nothing).
func TestNearSegmentNoAllocs(t *testing.T) {
	// A point 1e-9 off the middle of a segment, d equal to that distance
	// up to rounding: the filter cannot decide.
	px, py := 0.5, 0.5+1e-9
	NearSegment(px, py, 0, 0.5, 1, 0.5, 1e-9)
	if a := testing.AllocsPerRun(100, func() { NearSegment(px, py, 0, 0.5, 1, 0.5, 1e-9) }); a != 0 {
		t.Errorf("NearSegment allocates %v times per call", a)
	}
}

// TestSegmentsNear compares with the exact distance between segments (the
// smallest of the four end-to-segment distances, or 0 when they cross) on
// segments that nearly touch at scales 1e-9..1e9.
func TestSegmentsNear(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 5))
	for _, s := range predicateScales {
		d := 1e-9 * s
		for n := 0; n < 1000; n++ {
			ax, ay := s*rng.Float64(), s*rng.Float64()
			bx, by := s*rng.Float64(), s*rng.Float64()
			// c at distance 0, d/2, d or 2d from ab (up to rounding, then
			// nudged), and cd leaving ab on that side.
			u := rng.Float64()
			l := math.Hypot(bx-ax, by-ay)
			tx, ty := (bx-ax)/l, (by-ay)/l
			nx, ny := -ty, tx
			off := []float64{0, d, 0.5 * d, 2 * d}[n%4]
			cx, cy := ax+u*(bx-ax)+off*nx, ay+u*(by-ay)+off*ny
			cx, cy = nudge(cx, rng.IntN(3)-1), nudge(cy, rng.IntN(3)-1)
			v, w := s*(0.1+rng.Float64()), 0.3*s*(rng.Float64()-0.5)
			dx, dy := cx+v*nx+w*tx, cy+v*ny+w*ty
			want := bigNearSegment(cx, cy, ax, ay, bx, by, d) || bigNearSegment(dx, dy, ax, ay, bx, by, d) ||
				bigNearSegment(ax, ay, cx, cy, dx, dy, d) || bigNearSegment(bx, by, cx, cy, dx, dy, d) ||
				SegmentsCross(ax, ay, bx, by, cx, cy, dx, dy)
			if got := SegmentsNear(ax, ay, bx, by, cx, cy, dx, dy, d); got != want {
				t.Fatalf("scale %g case %d: SegmentsNear = %v, exact %v", s, n, got, want)
			}
			// Symmetric in the two segments and in their directions.
			if got := SegmentsNear(dx, dy, cx, cy, bx, by, ax, ay, d); got != want {
				t.Fatalf("scale %g case %d: swapped SegmentsNear = %v, exact %v", s, n, got, want)
			}
		}
	}
}

// bigTwiceArea is the exact shoelace sum.
func bigTwiceArea(x, y []float64) *big.Rat {
	a := new(big.Rat)
	for i := range x {
		j := (i + 1) % len(x)
		a = ratAdd(a, ratSub(ratMul(rat(x[i]), rat(y[j])), ratMul(rat(x[j]), rat(y[i]))))
	}
	return a
}

// TestZeroArea checks thin triangles and slivers whose area is within
// rounding of d times the perimeter, at scales 1e-9..1e9 and far from the
// origin, against the exact shoelace sum.
func TestZeroArea(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 6))
	naiveWrong := 0
	for _, s := range predicateScales {
		d := 1e-9 * s
		for n := 0; n < 500; n++ {
			ox, oy := s*rng.Float64(), s*rng.Float64()
			if n%5 == 0 {
				ox, oy = 1e3*s, -1e3*s // far from the origin: large cancelling terms
			}
			l := s * (0.5 + rng.Float64())
			// A triangle of base l and height h has 2A = l h and perimeter
			// about 2l, so h near 4d sits at the threshold.
			h := 4 * d * (1 + 1e-15*float64(rng.IntN(9)-4))
			x := []float64{ox, ox + l, ox + l*rng.Float64()}
			y := []float64{oy, oy, oy + h}
			if n%2 == 1 { // clockwise
				x[1], x[2], y[1], y[2] = x[2], x[1], y[2], y[1]
			}
			var per float64
			for i := range x {
				j := (i + 1) % len(x)
				per += math.Hypot(x[j]-x[i], y[j]-y[i])
			}
			a2 := bigTwiceArea(x, y)
			want := new(big.Rat).Abs(a2).Cmp(ratMul(rat(2*d), rat(per))) <= 0
			if got := ZeroArea(x, y, d); got != want {
				t.Fatalf("scale %g case %d: ZeroArea(%v, %v, %v) = %v, exact %v", s, n, x, y, d, got, want)
			}
			if (math.Abs(PolygonArea(x, y)) <= d*per) != want {
				naiveWrong++
			}
		}
	}
	// The cases must be hard: the compensated float area gets some wrong.
	if naiveWrong == 0 {
		t.Error("cases too easy: the floating-point area test never fails")
	}
	t.Logf("floating-point area test wrong on %d of %d cases", naiveWrong, 500*len(predicateScales))
	if !ZeroArea([]float64{0, 1, 2}, []float64{0, 1, 2}, 0) || ZeroArea([]float64{0, 1, 0}, []float64{0, 0, 1}, 0) {
		t.Error("ZeroArea at d = 0: wrong on a line or a unit triangle")
	}
}

// TestPointInPolygonNearBoundary compares with exact answers for points a
// few ulps from an edge of a slanted quadrilateral at scales 1e-9..1e9:
// d = 0 asks for the exact side, d > 0 makes the near ones OnBoundary.
func TestPointInPolygonNearBoundary(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 7))
	for _, s := range predicateScales {
		x := []float64{0.1 * s, 0.9 * s, 0.7 * s, 0.2 * s}
		y := []float64{0.2 * s, 0.1 * s, 0.8 * s, 0.6 * s}
		for n := 0; n < 1000; n++ {
			e := rng.IntN(4)
			f := (e + 1) % 4
			u := rng.Float64()
			px, py := x[e]+u*(x[f]-x[e]), y[e]+u*(y[f]-y[e])
			px, py = nudge(px, rng.IntN(7)-3), nudge(py, rng.IntN(7)-3)
			// Exact side of the slanted edge e (the polygon is convex and
			// counter-clockwise, and p is far from the other edges).
			o := bigOrient(x[e], y[e], x[f], y[f], px, py)
			want := Side(o)
			if o == 0 && !between(x[e], y[e], x[f], y[f], px, py) {
				want = Outside
			}
			if got := PointInPolygon(x, y, px, py, 0); got != want {
				t.Fatalf("scale %g: PointInPolygon(%v, %v, d = 0) = %v, exact %v", s, px, py, got, want)
			}
			if got := PointInPolygon(x, y, px, py, 1e-9*s); got != OnBoundary {
				t.Fatalf("scale %g: PointInPolygon(%v, %v, d = 1e-9 s) = %v, want OnBoundary", s, px, py, got)
			}
		}
		if got := PointInPolygon(x, y, 0.5*s, 0.5*s, 1e-9*s); got != Inside {
			t.Errorf("scale %g: centre is %v", s, got)
		}
		if got := PointInPolygon(x, y, 0.95*s, 0.95*s, 1e-9*s); got != Outside {
			t.Errorf("scale %g: far corner is %v", s, got)
		}
	}
}

// TestSelfIntersection runs near-degenerate polygons at scales 1e-9..1e9
// (coordinates in units of the scale s; d = 1e-9 s): features at 1e-12 s
// are below the resolution and count as touching, features at 1e-6 s
// do not.
func TestSelfIntersection(t *testing.T) {
	const e = 1e-12
	cases := []struct {
		name   string
		x, y   []float64
		i, j   int
		wantOK bool
	}{
		{"square", []float64{0, 1, 1, 0}, []float64{0, 0, 1, 1}, -1, -1, false},
		{"bow tie", []float64{0, 1, 1, 0}, []float64{0, 1, 0, 1}, 0, 2, true},
		{"vertex on an edge", []float64{0, 1, 1, 0.5, 0}, []float64{0, 0, 0.2, 0, 0.2}, 0, 2, true},
		{"vertex 1e-12 above an edge", []float64{0, 1, 1, 0.5, 0}, []float64{0, 0, 0.2, e, 0.2}, 0, 2, true},
		{"vertex 1e-12 through an edge", []float64{0, 1, 1, 0.5, 0}, []float64{0, 0, 0.2, -e, 0.2}, 0, 2, true},
		{"vertex 1e-6 above an edge", []float64{0, 1, 1, 0.5, 0}, []float64{0, 0, 0.2, 1e-6, 0.2}, -1, -1, false},
		{"fold back", []float64{0, 2, 1, 1}, []float64{0, 0, 0, 1}, 0, 1, true},
		{"fold back 1e-12 off the line", []float64{0, 1, 0.3, 0.3, 0}, []float64{0, 0, e, 0.5, 0.5}, 0, 1, true},
		{"straight angle 1e-12 off the line", []float64{0, 0.5, 1, 1, 0}, []float64{0, e, 0, 1, 1}, -1, -1, false},
		{"pinch 1e-12 wide", []float64{0, 1, 0.5, 1, 0, 0.5}, []float64{0, 0, 0.5, 1, 1, 0.5 + e}, 1, 4, true},
		{"triangle 1e-12 high", []float64{0, 1, 0.5}, []float64{0, 0, e}, 0, 1, true},
	}
	for _, s := range predicateScales {
		for _, c := range cases {
			x, y := make([]float64, len(c.x)), make([]float64, len(c.y))
			for k := range c.x {
				x[k], y[k] = c.x[k]*s, c.y[k]*s
			}
			i, j, ok := SelfIntersection(x, y, 1e-9*s)
			if ok != c.wantOK || (ok && (i != c.i || j != c.j)) {
				t.Errorf("scale %g, %s: got edges %d, %d, %v; want %d, %d, %v", s, c.name, i, j, ok, c.i, c.j, c.wantOK)
			}
		}
	}
}

// FuzzNearSegment compares NearSegment and NearPoint with exact arithmetic
// inside the documented range (magnitudes up to 1e60, nonzero coordinate
// differences and d at least 1e-60).
func FuzzNearSegment(f *testing.F) {
	f.Add(0.5, 0.5+1e-9, 0.0, 0.5, 1.0, 0.5, 1e-9)
	f.Add(2.0, 2.0, 0.0, 0.0, 1.0, 1.0, 1.4142135623730951)
	f.Add(1e9+0.5, 1e9, 1e9, 1e9, 1e9+1, 1e9+1e-7, 1e-7)
	f.Fuzz(func(t *testing.T, px, py, ax, ay, bx, by, d float64) {
		vs := []float64{px, py, ax, ay, bx, by}
		for i, v := range vs {
			if math.IsNaN(v) || math.IsInf(v, 0) || math.Abs(v) > 1e60 {
				return
			}
			for j := i % 2; j < len(vs); j += 2 {
				if dd := math.Abs(v - vs[j]); dd != 0 && dd < 1e-60 {
					return
				}
			}
		}
		if !(d >= 1e-60 && d <= 1e60) {
			return
		}
		if got, want := NearSegment(px, py, ax, ay, bx, by, d), bigNearSegment(px, py, ax, ay, bx, by, d); got != want {
			t.Fatalf("NearSegment = %v, exact %v", got, want)
		}
		if got, want := NearPoint(px, py, ax, ay, d), bigNearPoint(px, py, ax, ay, d); got != want {
			t.Fatalf("NearPoint = %v, exact %v", got, want)
		}
	})
}

// TestPolygonsOverlap checks the pairwise overlap rule at scales 1e-9..1e9
// against BuildInput's verdict for the same two polygons, and that a
// reported point lies inside both.
func TestPolygonsOverlap(t *testing.T) {
	const e = 1e-12
	sq := [2][]float64{{0, 1, 1, 0}, {0, 0, 1, 1}}
	box := func(x0, y0, x1, y1 float64) [2][]float64 {
		return [2][]float64{{x0, x1, x1, x0}, {y0, y0, y1, y1}}
	}
	cases := []struct {
		name string
		b    [2][]float64
		want bool
	}{
		{"shared edge", box(1, 0, 2, 1), false},
		{"gap 1e-12", box(1+e, 0, 2, 1), false},
		{"overlap 1e-12", box(1-e, 0, 2, 1), false},
		{"overlap 1e-12, shorter side", box(1-e, 0.25, 2, 0.75), false},
		{"overlap 1e-6 along an edge", box(1-1e-6, 0, 2, 1), true},
		{"corner cut by 1e-12", [2][]float64{{2, 2, -e}, {-e, 2, 2}}, false},
		{"corner cut by 1e-6", [2][]float64{{2, 2, -1e-6}, {-1e-6, 2, 2}}, true},
		{"inside", box(0.25, 0.25, 0.75, 0.75), true},
		{"identical, clockwise", [2][]float64{{0, 0, 1, 1}, {0, 1, 1, 0}}, true},
	}
	for _, s := range predicateScales {
		scale := func(p [2][]float64) (x, y []float64) {
			for k := range p[0] {
				x, y = append(x, p[0][k]*s), append(y, p[1][k]*s)
			}
			return x, y
		}
		ax, ay := scale(sq)
		for _, c := range cases {
			bx, by := scale(c.b)
			d := 2e-9 * s // 1e-9 of the largest coordinate
			x, y, ok := PolygonsOverlap(ax, ay, bx, by, d)
			if ok != c.want {
				t.Errorf("scale %g, %s: PolygonsOverlap = %v, want %v", s, c.name, ok, c.want)
				continue
			}
			if ok && (PointInPolygon(ax, ay, x, y, 0) != Inside || PointInPolygon(bx, by, x, y, 0) != Inside) {
				t.Errorf("scale %g, %s: point (%g, %g) not inside both", s, c.name, x, y)
			}
			bnd := rect(-2*s, -2*s, 4*s, 4*s, 0, 1)
			_, err := BuildInput([]Polygon{{X: ax, Y: ay}, {X: bx, Y: by}}, bnd, GraphOptions{MergeTol: d})
			if (err != nil) != c.want {
				t.Errorf("scale %g, %s: BuildInput says %v", s, c.name, err)
			}
		}
	}
	defer func() {
		if r, _ := recover().(string); !strings.HasPrefix(r, "mesh: PolygonsOverlap") {
			t.Errorf("a bow tie: recovered %q", r)
		}
	}()
	PolygonsOverlap([]float64{0, 1, 1, 0}, []float64{0, 1, 0, 1}, []float64{0, 1, 1, 0}, []float64{0, 0, 1, 1}, 1e-9)
}
