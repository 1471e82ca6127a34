package saturation

import (
	"math"
	"testing"

	"polegap/mesh"
)

// The area a disc shares with a triangle, against areas known in closed
// form: a disc inside a triangle (πr²), a quarter disc in a right-angled
// corner (πr²/4), a half disc on an edge (πr²/2), a triangle inside a
// disc, a disc missing the triangle, and a circular segment: the disc of
// radius r about the origin cut by the line x = d keeps r² acos(d/r) −
// d √(r² − d²) beyond it (the segment formula of any handbook, e.g. M.
// Abramowitz and I. A. Stegun, "Handbook of Mathematical Functions",
// 1964, 4.3; from memory). Each value is a sum of a few triangle and
// sector areas: 1e-15 relative is asserted.
func TestTriangleDiscArea(t *testing.T) {
	big := func(x0, y0 float64) (*[3]float64, *[3]float64) {
		return &[3]float64{x0, x0 + 10, x0}, &[3]float64{y0, y0, y0 + 10}
	}
	r := 0.3
	d := 0.1
	seg := r*r*math.Acos(d/r) - d*math.Sqrt(r*r-d*d)
	for _, c := range []struct {
		name            string
		x, y            *[3]float64
		cx, cy, r, want float64
	}{
		{"inside", &[3]float64{0, 10, 0}, &[3]float64{0, 0, 10}, 2, 2, 1, math.Pi},
		{"corner", &[3]float64{0, 10, 0}, &[3]float64{0, 0, 10}, 0, 0, 1, math.Pi / 4},
		{"edge", &[3]float64{0, 10, 0}, &[3]float64{0, 0, 10}, 3, 0, 1, math.Pi / 2},
		{"triangle inside", &[3]float64{0, 1, 0}, &[3]float64{0, 0, 1}, 0.3, 0.3, 5, 0.5},
		{"apart", &[3]float64{0, 1, 0}, &[3]float64{0, 0, 1}, 5, 5, 1, 0},
		{"segment", nil, nil, -d, 5, r, seg},
	} {
		x, y := c.x, c.y
		if x == nil {
			x, y = big(0, 0) // the edge x = 0 cuts the disc about (−d, 5)
		}
		got := triangleDiscArea(x, y, c.cx, c.cy, c.r)
		if math.Abs(got-c.want) > 1e-15*max(c.want, 1) {
			t.Errorf("%s: area %.17g, want %.17g", c.name, got, c.want)
		}
	}
}

// The peak of a field that grows linearly across a strip, |B| = a + b·x
// on [0, L] × [0, H] (given as the exact linear field of every triangle):
// the best disc is centred on the edge x = L, at least r from the ends,
// where it is a half disc whose centroid lies 4r/(3π) inside (the
// centroid of a half disc; any mechanics handbook, from memory). So the
// peak is a + b·(L − 4r/(3π)). The triangles cut by the circle are split
// in four and each quarter counts at its centroid's value, an error of
// order b·(h/4)²/r per unit area on the rim; with h = r/5 the measured
// error was 1.7e-5 relative, 1e-4 is asserted.
func TestPeakLinearField(t *testing.T) {
	const l, hgt, a, bb, r = 0.1, 0.05, 0.5, 10.0, 0.01
	reg := mesh.Polygon{X: []float64{0, l, l, 0}, Y: []float64{0, 0, hgt, hgt}, Region: 1}
	in, err := mesh.BuildInput(nil, reg, mesh.GraphOptions{})
	if err != nil {
		t.Fatal(err)
	}
	in.DefaultRegion = 1
	m, err := mesh.Triangulate(in, mesh.Options{Size: mesh.SizeField{Global: r / 5}})
	if err != nil {
		t.Fatal(err)
	}
	nt := m.NumTriangles()
	b := make([][2]float64, nt)
	lin := make([][3][2]float64, nt)
	for t := range nt {
		cx := 0.0
		for k := 0; k < 3; k++ {
			x := m.X[m.Tri[3*t+k]]
			lin[t][k] = [2]float64{0, a + bb*x}
			cx += x / 3
		}
		b[t] = [2]float64{0, a + bb*cx}
	}
	reps, err := Analyse(m, b, []Region{{Tag: 1, Knee: 1}}, Options{Radius: r, LinearB: lin})
	if err != nil {
		t.Fatal(err)
	}
	p := reps[0]
	want := a + bb*(l-4*r/(3*math.Pi))
	t.Logf("peak %.9f T at %v, want %.9f T (relative error %.2g)", p.Peak, p.PeakAt, want, p.Peak/want-1)
	if math.Abs(p.Peak/want-1) > 1e-4 || math.Abs(p.PeakAt[0]-l) > 1e-3*r {
		t.Errorf("peak %.9f T at %v, want %.9f T on x = %g", p.Peak, p.PeakAt, want, l)
	}
}
