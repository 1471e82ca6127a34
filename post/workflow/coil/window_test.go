package coil

import (
	"math"
	"testing"
)

// roundedRingArea returns the area between a rectangle a × b and the
// same rectangle grown outward by c (a rounded rectangle), computed as a
// polygon with n points on each quarter circle (shoelace formula).
func roundedRingArea(a, b, c float64, n int) float64 {
	var xs, ys []float64
	centres := [4][2]float64{{a / 2, b / 2}, {-a / 2, b / 2}, {-a / 2, -b / 2}, {a / 2, -b / 2}}
	for q, ctr := range centres {
		for k := 0; k <= n; k++ {
			th := (float64(q) + float64(k)/float64(n)) * math.Pi / 2
			xs = append(xs, ctr[0]+c*math.Cos(th))
			ys = append(ys, ctr[1]+c*math.Sin(th))
		}
	}
	s := 0.0
	for i := range xs {
		j := (i + 1) % len(xs)
		s += xs[i]*ys[j] - xs[j]*ys[i]
	}
	return s/2 - a*b
}

func TestMeanTurnRect(t *testing.T) {
	// Pappus' centroid theorem: the copper volume of a coil is its
	// cross-section times the path of its centroid, so the mean turn
	// times the build c must equal the area of the ring between the core
	// and the coil's outline seen from the end (Steiner's formula for a
	// parallel set: A(K + cB) = A(K) + P(K) c + π c², Steiner 1840).
	// The ring is computed here independently as a polygon; with 2000
	// points a quarter the chord error is below c²·(π/2/2000)²/2 per
	// arc area, so 1e-6 relative is ample.
	for _, c := range []struct{ a, b, c float64 }{
		{0.1, 0.1, 0.05}, {0.08, 0.2, 0.1}, {0.3, 0.05, 0.02},
	} {
		want := roundedRingArea(c.a, c.b, c.c, 2000)
		got := MeanTurnRect(c.a, c.b, c.c, 0) * c.c
		if math.Abs(got-want) > 1e-6*want {
			t.Errorf("core %g x %g, build %g: l c = %.9g, ring area %.9g", c.a, c.b, c.c, got, want)
		}
		// With a clearance g the winding fills the ring between the
		// outlines grown by g and by g + c (same theorem).
		g := 0.004
		want = roundedRingArea(c.a, c.b, c.c+g, 2000) - roundedRingArea(c.a, c.b, g, 2000)
		if got := MeanTurnRect(c.a, c.b, c.c, g) * c.c; math.Abs(got-want) > 1e-6*want {
			t.Errorf("core %g x %g, build %g, clearance %g: l c = %.9g, ring area %.9g", c.a, c.b, c.c, g, got, want)
		}
	}
	// Axisymmetric: l c = π ((r + c)² − r²), the annulus area (Pappus).
	r, c := 0.05, 0.03
	if got, want := MeanTurnRound(r, c)*c, math.Pi*((r+c)*(r+c)-r*r); math.Abs(got-want) > 1e-15 {
		t.Errorf("round coil: l c = %g, annulus %g", got, want)
	}
}

func TestCoolingSurface(t *testing.T) {
	// A round coil of inner radius r, build c, length h: outer cylinder
	// 2π (r + c) h plus two annular ends π ((r + c)² − r²) (geometry).
	r, c, h := 0.05, 0.03, 0.12
	w := Window{Width: c, Height: h, MeanTurn: MeanTurnRound(r, c)}
	want := 2*math.Pi*(r+c)*h + 2*math.Pi*((r+c)*(r+c)-r*r)
	if got := w.CoolingSurface(); math.Abs(got-want) > 1e-14 {
		t.Errorf("round coil surface %g, want %g", got, want)
	}
}

func TestMeanTurnPanics(t *testing.T) {
	for _, f := range []func(){
		func() { MeanTurnRect(0.1, 0.1, 0, 0) },
		func() { MeanTurnRect(-0.1, 0.1, 0.1, 0) },
		func() { MeanTurnRect(math.NaN(), 0.1, 0.1, 0) },
		func() { MeanTurnRound(0.1, -1) },
		func() { MeanTurnRound(math.Inf(1), 0.1) },
	} {
		func() {
			defer func() {
				if recover() == nil {
					t.Error("no panic")
				}
			}()
			f()
		}()
	}
}
