package mesh

import (
	"math"
	"math/big"
	"math/rand/v2"
	"testing"
)

// bigOrient evaluates orient2d exactly with math/big: float64 inputs are
// exact binary fractions, and big.Rat arithmetic is exact.
func bigOrient(ax, ay, bx, by, cx, cy float64) int {
	r := func(x float64) *big.Rat { return new(big.Rat).SetFloat64(x) }
	sub := func(a, b *big.Rat) *big.Rat { return new(big.Rat).Sub(a, b) }
	mul := func(a, b *big.Rat) *big.Rat { return new(big.Rat).Mul(a, b) }
	l := mul(sub(r(ax), r(cx)), sub(r(by), r(cy)))
	rr := mul(sub(r(ay), r(cy)), sub(r(bx), r(cx)))
	return l.Cmp(rr)
}

func bigInCircle(ax, ay, bx, by, cx, cy, dx, dy float64) int {
	r := func(x float64) *big.Rat { return new(big.Rat).SetFloat64(x) }
	sub := func(a, b *big.Rat) *big.Rat { return new(big.Rat).Sub(a, b) }
	mul := func(a, b *big.Rat) *big.Rat { return new(big.Rat).Mul(a, b) }
	add := func(a, b *big.Rat) *big.Rat { return new(big.Rat).Add(a, b) }
	adx, ady := sub(r(ax), r(dx)), sub(r(ay), r(dy))
	bdx, bdy := sub(r(bx), r(dx)), sub(r(by), r(dy))
	cdx, cdy := sub(r(cx), r(dx)), sub(r(cy), r(dy))
	al := add(mul(adx, adx), mul(ady, ady))
	bl := add(mul(bdx, bdx), mul(bdy, bdy))
	cl := add(mul(cdx, cdx), mul(cdy, cdy))
	t1 := mul(al, sub(mul(bdx, cdy), mul(cdx, bdy)))
	t2 := mul(bl, sub(mul(cdx, ady), mul(adx, cdy)))
	t3 := mul(cl, sub(mul(adx, bdy), mul(bdx, ady)))
	return add(add(t1, t2), t3).Sign()
}

var predicateScales = []float64{1e-9, 1e-3, 1, 1e3, 1e9}

// TestOrient2DNearCollinear checks exact signs on points a few ulps off a
// line, the classic failure of the naive determinant (Kettner, Mehlhorn,
// Pion, Schirra, Yap, "Classroom examples of robustness problems in geometric
// computations", CGTA 40 (2008), section 3: orient2d on a 256x256 ulp grid; we use 48x48
// around a near-collinear triple). The oracle is math/big exact arithmetic.
func TestOrient2DNearCollinear(t *testing.T) {
	naiveWrong := 0
	defer func() {
		// The grid must be hard: the plain determinant gets some signs wrong.
		if naiveWrong == 0 {
			t.Error("near-collinear grid too easy: the naive determinant never fails")
		}
		t.Logf("naive determinant wrong on %d grid points", naiveWrong)
	}()
	for _, s := range predicateScales {
		px, py := 0.5*s, 0.5*s
		qx, qy := 12*s, 12*s
		rx, ry := 24*s, 24*s
		mismatch := 0
		x := px
		for i := 0; i < 48; i++ {
			y := py
			for j := 0; j < 48; j++ {
				got := int(Orient2D(x, y, qx, qy, rx, ry))
				want := bigOrient(x, y, qx, qy, rx, ry)
				if got != want {
					mismatch++
				}
				if int(sign(Orient2DDet(x, y, qx, qy, rx, ry))) != want {
					naiveWrong++
				}
				y = math.Nextafter(y, math.Inf(1))
			}
			x = math.Nextafter(x, math.Inf(1))
		}
		if mismatch != 0 {
			t.Errorf("scale %g: %d of 2304 near-collinear orientations wrong", s, mismatch)
		}
	}
}

// TestOrient2DRandom compares with exact arithmetic on random and randomly
// perturbed degenerate inputs at scales 1e-9..1e9.
func TestOrient2DRandom(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for _, s := range predicateScales {
		for n := 0; n < 3000; n++ {
			ax, ay := s*rng.Float64(), s*rng.Float64()
			bx, by := s*rng.Float64(), s*rng.Float64()
			// c on the line ab, rounded, then nudged by a few ulps.
			u := rng.Float64()*3 - 1
			cx, cy := ax+u*(bx-ax), ay+u*(by-ay)
			for k := rng.IntN(4); k > 0; k-- {
				cx = math.Nextafter(cx, math.Inf(2*rng.IntN(2)-1))
			}
			if n%10 == 0 {
				cx, cy = s*rng.Float64(), s*rng.Float64()
			}
			got := int(Orient2D(ax, ay, bx, by, cx, cy))
			if want := bigOrient(ax, ay, bx, by, cx, cy); got != want {
				t.Fatalf("scale %g: Orient2D(%v,%v,%v,%v,%v,%v) = %d, exact %d", s, ax, ay, bx, by, cx, cy, got, want)
			}
			// Antisymmetry and cyclic invariance are exact properties.
			if o := int(Orient2D(bx, by, ax, ay, cx, cy)); o != -got {
				t.Fatalf("scale %g: swap gives %d, want %d", s, o, -got)
			}
			if o := int(Orient2D(bx, by, cx, cy, ax, ay)); o != got {
				t.Fatalf("scale %g: rotation gives %d, want %d", s, o, got)
			}
		}
	}
}

// TestInCircleNearCocircular puts d on the circle through a, b, c up to
// rounding (points on a circle of radius s, then nudged by ulps) and on
// exactly cocircular lattice squares, comparing with exact arithmetic.
func TestInCircleNearCocircular(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	for _, s := range predicateScales {
		// Exactly cocircular: corners of an axis-aligned rectangle.
		x0, y0 := 0.3*s, 0.7*s
		w, h := 0.25*s, 0.5*s
		if got := InCircle(x0, y0, x0+w, y0, x0+w, y0+h, x0, y0+h); got != bigInCircle(x0, y0, x0+w, y0, x0+w, y0+h, x0, y0+h) {
			t.Errorf("scale %g: rectangle corners: got %d", s, got)
		}
		for n := 0; n < 2000; n++ {
			cx, cy := s*(rng.Float64()-0.5), s*(rng.Float64()-0.5)
			pt := func() (float64, float64) {
				a := 2 * math.Pi * rng.Float64()
				return cx + s*math.Cos(a), cy + s*math.Sin(a)
			}
			ax, ay := pt()
			bx, by := pt()
			qx, qy := pt()
			dx, dy := pt()
			for k := rng.IntN(3); k > 0; k-- {
				dy = math.Nextafter(dy, math.Inf(2*rng.IntN(2)-1))
			}
			got := InCircle(ax, ay, bx, by, qx, qy, dx, dy)
			if want := bigInCircle(ax, ay, bx, by, qx, qy, dx, dy); got != want {
				t.Fatalf("scale %g: InCircle = %d, exact %d", s, got, want)
			}
		}
	}
}

// TestInCircleLattice checks all 4-subsets of small integer lattices scaled
// by powers of ten, where many quadruples are exactly cocircular.
func TestInCircleLattice(t *testing.T) {
	for _, s := range predicateScales {
		var xs, ys []float64
		for i := 0; i < 4; i++ {
			for j := 0; j < 3; j++ {
				xs = append(xs, float64(i)*s*0.1+s)
				ys = append(ys, float64(j)*s*0.1-s)
			}
		}
		n := len(xs)
		bad := 0
		for a := 0; a < n; a++ {
			for b := a + 1; b < n; b++ {
				for c := b + 1; c < n; c++ {
					for d := 0; d < n; d++ {
						got := InCircle(xs[a], ys[a], xs[b], ys[b], xs[c], ys[c], xs[d], ys[d])
						if got != bigInCircle(xs[a], ys[a], xs[b], ys[b], xs[c], ys[c], xs[d], ys[d]) {
							bad++
						}
					}
				}
			}
		}
		if bad != 0 {
			t.Errorf("scale %g: %d lattice incircle signs wrong", s, bad)
		}
	}
}

// TestInDiametralCircle compares with the exact dot product sign (Thales:
// the angle a-p-b is right exactly when p is on the circle with diameter ab).
func TestInDiametralCircle(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 3))
	for _, s := range predicateScales {
		for n := 0; n < 2000; n++ {
			ax, ay := s*rng.Float64(), s*rng.Float64()
			bx, by := s*rng.Float64(), s*rng.Float64()
			mx, my := (ax+bx)/2, (ay+by)/2
			r := math.Hypot(bx-ax, by-ay) / 2
			a := 2 * math.Pi * rng.Float64()
			px, py := mx+r*math.Cos(a), my+r*math.Sin(a)
			got := InDiametralCircle(ax, ay, bx, by, px, py)
			rt := func(x float64) *big.Rat { return new(big.Rat).SetFloat64(x) }
			ux := new(big.Rat).Sub(rt(ax), rt(px))
			uy := new(big.Rat).Sub(rt(ay), rt(py))
			vx := new(big.Rat).Sub(rt(bx), rt(px))
			vy := new(big.Rat).Sub(rt(by), rt(py))
			dot := new(big.Rat).Add(new(big.Rat).Mul(ux, vx), new(big.Rat).Mul(uy, vy))
			if want := dot.Sign() < 0; got != want {
				t.Fatalf("scale %g: InDiametralCircle = %v, exact %v", s, got, want)
			}
		}
	}
}

func BenchmarkOrient2D(b *testing.B) {
	b.ReportAllocs()
	var sum int
	for i := 0; i < b.N; i++ {
		sum += int(Orient2D(0.1, 0.2, 1.3, 0.7, float64(i&7), 0.25))
	}
	_ = sum
}

func BenchmarkInCircle(b *testing.B) {
	b.ReportAllocs()
	var sum int
	for i := 0; i < b.N; i++ {
		sum += InCircle(0, 0, 1, 0, 0, 1, float64(i&3)*0.3, 0.5)
	}
	_ = sum
}

func BenchmarkInCircleDegenerate(b *testing.B) {
	b.ReportAllocs()
	var sum int
	for i := 0; i < b.N; i++ {
		sum += InCircle(0, 0, 1, 0, 1, 1, 0, 1)
	}
	_ = sum
}

// FuzzPredicates compares Orient2D and InCircle with math/big exact
// evaluation on finite inputs inside the documented range: magnitudes up to
// 1e60 and nonzero coordinate differences of at least 1e-60, where no
// product of four differences (nor its rounding error) overflows or
// underflows.
func FuzzPredicates(f *testing.F) {
	f.Add(0.5, 0.5, 12.0, 12.0, 24.0, 24.0, 0.0, 0.0)
	f.Add(0.0, 0.0, 1.0, 0.0, 1.0, 1.0, 0.0, 1.0)
	f.Add(1e-9, 2e-9, 3e-9, 4e-9, 5e-9, 6.000000000000001e-9, 1e-9, 0.0)
	f.Fuzz(func(t *testing.T, ax, ay, bx, by, cx, cy, dx, dy float64) {
		vs := []float64{ax, ay, bx, by, cx, cy, dx, dy}
		for i, v := range vs {
			if math.IsNaN(v) || math.IsInf(v, 0) || math.Abs(v) > 1e60 {
				return
			}
			for j := i % 2; j < len(vs); j += 2 {
				if d := math.Abs(v - vs[j]); d != 0 && d < 1e-60 {
					return
				}
			}
		}
		if got, want := int(Orient2D(ax, ay, bx, by, cx, cy)), bigOrient(ax, ay, bx, by, cx, cy); got != want {
			t.Fatalf("Orient2D = %d, exact %d", got, want)
		}
		if got, want := InCircle(ax, ay, bx, by, cx, cy, dx, dy), bigInCircle(ax, ay, bx, by, cx, cy, dx, dy); got != want {
			t.Fatalf("InCircle = %d, exact %d", got, want)
		}
	})
}
