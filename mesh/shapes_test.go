package mesh

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"testing"
)

// shoelaceArea returns the area of a closed polygon (flat x,y list),
// positive when counter-clockwise: the surveyor's (Gauss's) area formula
// A = 1/2 sum (x_i y_{i+1} - x_{i+1} y_i), summed with Neumaier's
// compensation (ZAMM 54, 1974) so it serves as the 1e-9 reference.
func shoelaceArea(p []float64) float64 {
	n := len(p) / 2
	s, c := 0.0, 0.0
	for i := 0; i < n; i++ {
		j := (i + 1) % n
		term := 0.5 * (p[2*i]*p[2*j+1] - p[2*j]*p[2*i+1])
		x := s + term
		if math.Abs(s) >= math.Abs(term) {
			c += (s - x) + term
		} else {
			c += (term - x) + s
		}
		s = x
	}
	return s + c
}

func boxPoly(x0, y0, x1, y1 float64) []float64 { return []float64{x0, y0, x1, y0, x1, y1, x0, y1} }

func circlePoly(cx, cy, r float64, n int) []float64 {
	p := make([]float64, 0, 2*n)
	for i := 0; i < n; i++ {
		a := 2 * math.Pi * float64(i) / float64(n)
		p = append(p, cx+r*math.Cos(a), cy+r*math.Sin(a))
	}
	return p
}

func scalePoly(p []float64, s float64) []float64 {
	q := make([]float64, len(p))
	for i := range p {
		q[i] = p[i] * s
	}
	return q
}

// sizeHonoured checks that no triangle's longest edge exceeds the size
// field at its centroid: refinement splits every such triangle, so this is
// exact, not statistical.
func sizeHonoured(t *testing.T, name string, m *Mesh, f *SizeField) {
	t.Helper()
	bad := 0
	for tr := 0; tr < m.NumTriangles(); tr++ {
		a, b, c := m.Tri[3*tr], m.Tri[3*tr+1], m.Tri[3*tr+2]
		h := f.At((m.X[a]+m.X[b]+m.X[c])/3, (m.Y[a]+m.Y[b]+m.Y[c])/3, m.Region[tr])
		for _, e := range [3][2]int32{{a, b}, {b, c}, {c, a}} {
			if math.Hypot(m.X[e[0]]-m.X[e[1]], m.Y[e[0]]-m.Y[e[1]]) > h*(1+1e-12) {
				bad++
				break
			}
		}
	}
	if bad > 0 {
		t.Errorf("%s: %d triangles have an edge longer than the size field", name, bad)
	}
}

// regionAt finds a triangle containing (x, y) (interior or edge) by brute
// force with exact orientation tests and returns its region, or false.
func regionAt(m *Mesh, x, y float64) (int32, bool) {
	for t := 0; t < m.NumTriangles(); t++ {
		a, b, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		if Orient2D(m.X[a], m.Y[a], m.X[b], m.Y[b], x, y) != CW &&
			Orient2D(m.X[b], m.Y[b], m.X[c], m.Y[c], x, y) != CW &&
			Orient2D(m.X[c], m.Y[c], m.X[a], m.Y[a], x, y) != CW {
			return m.Region[t], true
		}
	}
	return 0, false
}

// cCore returns a C-shaped yoke (outer 0.2 x 0.16 m, window 0.12 x 0.08 m,
// pole gap g on the right limb), its air box and a round conductor in the
// window, scaled by s. The scenario is invented for testing.
func cCore(s, g float64) (yoke, box, wire []float64, seeds []Seed, areas map[int32]float64) {
	yoke = []float64{
		0, 0, 0.2, 0, 0.2, 0.08 - g/2, 0.16, 0.08 - g/2, 0.16, 0.04, 0.04, 0.04,
		0.04, 0.12, 0.16, 0.12, 0.16, 0.08 + g/2, 0.2, 0.08 + g/2, 0.2, 0.16, 0, 0.16,
	}
	box = boxPoly(-0.1, -0.1, 0.3, 0.26)
	wire = circlePoly(0.1, 0.08, 0.02, 48)
	yoke, box, wire = scalePoly(yoke, s), scalePoly(box, s), scalePoly(wire, s)
	seeds = []Seed{{0.02 * s, 0.08 * s, 2}, {0.1 * s, 0.08 * s, 3}, {-0.05 * s, -0.05 * s, 1}}
	areas = map[int32]float64{2: shoelaceArea(yoke), 3: shoelaceArea(wire)}
	areas[1] = shoelaceArea(box) - areas[2] - areas[3]
	return
}

func TestTriangulateShapes(t *testing.T) {
	type tc struct {
		name    string
		in      *Input
		opt     Options
		areas   map[int32]float64
		samples []Seed // points and the region expected there
	}
	var cases []tc

	// Unit square with two square holes (seeds with negative region).
	sq := polyInput(boxPoly(0, 0, 1, 1), boxPoly(0.2, 0.2, 0.4, 0.4), boxPoly(0.6, 0.5, 0.8, 0.9))
	sq.Seeds = []Seed{{0.3, 0.3, -1}, {0.7, 0.7, -1}}
	sq.DefaultRegion = 5
	cases = append(cases, tc{"square-holes", sq, Options{Size: SizeField{Global: 0.05}},
		map[int32]float64{5: 1 - 0.04 - 0.08}, []Seed{{0.1, 0.1, 5}, {0.5, 0.5, 5}}})

	// L-shape, refined by the angle bound only.
	l := polyInput([]float64{0, 0, 2, 0, 2, 1, 1, 1, 1, 2, 0, 2})
	l.DefaultRegion = 1
	cases = append(cases, tc{"L-shape", l, Options{}, map[int32]float64{1: 3}, []Seed{{0.5, 1.5, 1}, {1.5, 0.5, 1}}})

	// L-shape with a point size source at the re-entrant corner.
	l2 := polyInput([]float64{0, 0, 2, 0, 2, 1, 1, 1, 1, 2, 0, 2})
	l2.DefaultRegion = 1
	cases = append(cases, tc{"L-shape-graded", l2, Options{Size: SizeField{Global: 0.3, Points: []SizePoint{{1, 1, 0.01}}}},
		map[int32]float64{1: 3}, nil})

	// C-core with a thin gap and a round conductor at three scales.
	for _, s := range []float64{1e-9, 1, 1e9} {
		yoke, box, wire, seeds, areas := cCore(s, 0.002)
		in := polyInput(box, yoke, wire)
		in.Seeds = seeds
		cases = append(cases, tc{"c-core", in, Options{Size: SizeField{Global: 0.01 * s, Region: map[int32]float64{3: 0.005 * s},
			Lines: []SizeLine{{0.16 * s, 0.08 * s, 0.2 * s, 0.08 * s, 0.0005 * s}}}}, areas,
			[]Seed{{0.18 * s, 0.08 * s, 1}, {0.18 * s, 0.02 * s, 2}, {0.1 * s, 0.09 * s, 3}, {0.25 * s, 0.2 * s, 1}}})
	}

	for _, c := range cases {
		m := mustMesh(t, c.name, c.in, c.opt, CheckOptions{MinAngle: 28, RegionAreas: c.areas})
		segmentsCovered(t, c.name, c.in, m)
		sizeHonoured(t, c.name, m, &c.opt.Size)
		for _, p := range c.samples {
			if r, ok := regionAt(m, p.X, p.Y); !ok || r != p.Region {
				t.Errorf("%s: region at (%g,%g) = %d (found %v), want %d", c.name, p.X, p.Y, r, ok, p.Region)
			}
		}
		t.Logf("%s: %d triangles, %d vertices", c.name, m.NumTriangles(), m.NumVertices)
	}
}

// TestTriangulateDegenerate covers duplicate vertices, vertices lying on
// segments, repeated segments, zero-length segments and nearly collinear
// chains; none may crash and the result must pass Check.
func TestTriangulateDegenerate(t *testing.T) {
	// Square whose bottom edge passes through an extra input vertex, with a
	// duplicate corner, a repeated segment and a zero-length segment.
	in := &Input{
		X:        []float64{0, 1, 1, 0, 0.5, 1, 0.25},
		Y:        []float64{0, 0, 1, 1, 0, 0, 0.5},
		Segments: []int32{0, 1, 1, 2, 2, 3, 3, 0, 5, 2, 0, 0, 0, 1},
		Markers:  []int32{1, 2, 3, 4, 5, 6, 7},
	}
	mustMesh(t, "duplicates", in, Options{}, CheckOptions{MinAngle: 28, RegionAreas: map[int32]float64{0: 1}})

	// A chain of nearly collinear vertices: y offsets of a few ulps.
	var xs, ys []float64
	n := 200
	for i := 0; i <= n; i++ {
		xs = append(xs, float64(i)/float64(n))
		y := 0.0
		if i%3 == 1 {
			y = 1e-17 * float64(i%7)
		}
		ys = append(ys, y)
	}
	xs = append(xs, 1, 0)
	ys = append(ys, 1, 1)
	var segs, marks []int32
	for i := 0; i < len(xs); i++ {
		segs = append(segs, int32(i), int32((i+1)%len(xs)))
		marks = append(marks, 1)
	}
	chain := &Input{X: xs, Y: ys, Segments: segs, Markers: marks}
	mustMesh(t, "near-collinear", chain, Options{}, CheckOptions{MinAngle: 28})

	// Points only, on a lattice: many exactly cocircular quadruples.
	lat := &Input{}
	for i := 0; i < 20; i++ {
		for j := 0; j < 20; j++ {
			lat.X = append(lat.X, float64(i))
			lat.Y = append(lat.Y, float64(j))
		}
	}
	mustMesh(t, "lattice", lat, Options{MinAngle: -1}, CheckOptions{RegionAreas: map[int32]float64{0: 361}})

	// All collinear: an input error, not a crash.
	col := &Input{X: []float64{0, 1, 2}, Y: []float64{0, 1, 2}}
	var ie *InputError
	if _, err := Triangulate(col, Options{}); !errors.As(err, &ie) {
		t.Errorf("collinear: got %v, want *InputError", err)
	}
	nan := &Input{X: []float64{0, 1, math.NaN()}, Y: []float64{0, 1, 2}}
	if _, err := Triangulate(nan, Options{}); !errors.As(err, &ie) {
		t.Errorf("NaN: got %v, want *InputError", err)
	}
	nanSeed := polyInput(boxPoly(0, 0, 1, 1))
	nanSeed.Seeds = []Seed{{math.Inf(1), 0, 1}}
	if _, err := Triangulate(nanSeed, Options{}); !errors.As(err, &ie) {
		t.Errorf("infinite seed: got %v, want *InputError", err)
	}
}

// TestTriangulateSmallAngles meshes wedges with input angles from 5 to 60
// degrees; the refinement must terminate and every triangle must meet 28
// degrees except the documented small-input-angle exceptions.
func TestTriangulateSmallAngles(t *testing.T) {
	for _, deg := range []float64{5, 15, 25, 45, 60} {
		a := deg * math.Pi / 180
		p := []float64{0, 0, 1, 0, math.Cos(a), math.Sin(a)}
		in := polyInput(p)
		mustMesh(t, "wedge", in, Options{Size: SizeField{Global: 0.1}}, CheckOptions{MinAngle: 28, RegionAreas: map[int32]float64{0: shoelaceArea(p)}})
	}
	// A star of segments meeting at one vertex at 10 degree spacing, inside a box.
	in := polyInput(boxPoly(-1, -1, 1, 1))
	c := int32(len(in.X))
	in.X = append(in.X, 0)
	in.Y = append(in.Y, 0)
	for i := 0; i < 4; i++ {
		a := float64(i) * 10 * math.Pi / 180
		in.X = append(in.X, 0.8*math.Cos(a))
		in.Y = append(in.Y, 0.8*math.Sin(a))
		in.Segments = append(in.Segments, c, int32(len(in.X)-1))
		in.Markers = append(in.Markers, 7)
	}
	mustMesh(t, "star", in, Options{}, CheckOptions{MinAngle: 28, RegionAreas: map[int32]float64{0: 4}})
}

func TestTriangulateFrozen(t *testing.T) {
	// A disk whose 64 boundary vertices must stay exactly as given.
	p := circlePoly(0, 0, 1, 64)
	in := polyInput(p)
	m := mustMesh(t, "frozen-disk", in, Options{Frozen: []int32{1}, Size: SizeField{Global: 0.05}},
		CheckOptions{MinAngle: 28, Frozen: []int32{1}, RegionAreas: map[int32]float64{0: shoelaceArea(p)}})
	nb := 0
	for i, n := range m.Nbr {
		if n < 0 {
			nb++
			if m.EdgeMarker[i] != 1 {
				t.Errorf("frozen-disk: boundary edge marker %d", m.EdgeMarker[i])
			}
		}
	}
	if nb != 64 {
		t.Errorf("frozen-disk: %d boundary edges, want the 64 input edges", nb)
	}
	// Input vertices keep their index and exact coordinates.
	for i := range in.X {
		if m.X[i] != in.X[i] || m.Y[i] != in.Y[i] {
			t.Fatalf("frozen-disk: vertex %d moved", i)
		}
	}
}

func TestTriangulateMaxTriangles(t *testing.T) {
	in := polyInput(boxPoly(0, 0, 1, 1))
	_, err := Triangulate(in, Options{Size: SizeField{Global: 0.001}, MaxTriangles: 1000})
	var te *TooManyTrianglesError
	if !errors.As(err, &te) || te.Limit != 1000 {
		t.Fatalf("got %v, want *TooManyTrianglesError with limit 1000", err)
	}
}

// TestTriangulateRandomPolygons meshes sets of random star-shaped polygons,
// one per cell of a 4x4 grid so they never overlap, inside a box. Angular
// gaps stay below pi, so each cell centre is inside its polygon.
func TestTriangulateRandomPolygons(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for trial := 0; trial < 10; trial++ {
		polys := [][]float64{boxPoly(0, 0, 4, 4)}
		areas := map[int32]float64{}
		var seeds []Seed
		total := 16.0
		for i := 0; i < 4; i++ {
			for j := 0; j < 4; j++ {
				if rng.IntN(3) == 0 {
					continue
				}
				cx, cy := float64(i)+0.5, float64(j)+0.5
				n := 3 + rng.IntN(12)
				var p []float64
				for k := 0; k < n; k++ {
					a := 2 * math.Pi * (float64(k) + 0.4*rng.Float64()) / float64(n)
					r := 0.1 + 0.38*rng.Float64()
					p = append(p, cx+r*math.Cos(a), cy+r*math.Sin(a))
				}
				reg := int32(10 + len(polys))
				polys = append(polys, p)
				seeds = append(seeds, Seed{cx, cy, reg})
				areas[reg] = shoelaceArea(p)
				total -= areas[reg]
			}
		}
		areas[1] = total
		in := polyInput(polys...)
		in.Seeds = seeds
		in.DefaultRegion = 1
		m := mustMesh(t, "random-polygons", in, Options{Size: SizeField{Global: 0.2}}, CheckOptions{MinAngle: 28, RegionAreas: areas})
		segmentsCovered(t, "random-polygons", in, m)
	}
}

// TestTriangulateStrictAngles: inputs without angles below 90 degrees need
// no angle exception at all (Ruppert 1995, Theorem 1 covers input angles of
// 90 degrees and more for bounds up to about 20.7 degrees; 28 degrees holds
// in practice). Also checks that the Input is not modified.
func TestTriangulateStrictAngles(t *testing.T) {
	for _, p := range [][]float64{
		boxPoly(0, 0, 3, 1),
		{0, 0, 2, 0, 2, 1, 1, 1, 1, 2, 0, 2},
		{0, 0, 4, 0, 4, 3, 3, 3, 3, 1, 1, 1, 1, 3, 0, 3},
	} {
		in := polyInput(p)
		x0 := append([]float64(nil), in.X...)
		s0 := append([]int32(nil), in.Segments...)
		m := mustMesh(t, "strict", in, Options{Size: SizeField{Global: 0.2}}, CheckOptions{RegionAreas: map[int32]float64{0: shoelaceArea(p)}})
		for tr := 0; tr < m.NumTriangles(); tr++ {
			if a, _ := m.minAngle(tr); a < 28-1e-9 {
				t.Fatalf("strict: triangle %d has angle %g < 28", tr, a)
			}
		}
		for i := range x0 {
			if in.X[i] != x0[i] {
				t.Fatal("strict: Input.X modified")
			}
		}
		for i := range s0 {
			if in.Segments[i] != s0[i] {
				t.Fatal("strict: Input.Segments modified")
			}
		}
	}
}

func TestTriangulateOrder2(t *testing.T) {
	in := polyInput(boxPoly(0, 0, 1, 1))
	m, err := Triangulate(in, Options{Order: 2, Size: SizeField{Global: 0.3}})
	if err != nil {
		t.Fatal(err)
	}
	if m.Order() != 2 || len(m.Mid) != len(m.Tri) || m.NumNodes() <= m.NumVertices {
		t.Fatalf("order 2: Order %d, %d Mid, %d nodes, %d vertices", m.Order(), len(m.Mid), m.NumNodes(), m.NumVertices)
	}
	if err := m.Check(CheckOptions{MinAngle: 28, RegionAreas: map[int32]float64{0: 1}}); err != nil {
		t.Fatal(err)
	}
}

// TestTriangulatePanics: malformed slices are programmer errors.
func TestTriangulatePanics(t *testing.T) {
	for name, in := range map[string]*Input{
		"odd":     {X: []float64{0, 1, 0}, Y: []float64{0, 0, 1}, Segments: []int32{0}, Markers: nil},
		"markers": {X: []float64{0, 1, 0}, Y: []float64{0, 0, 1}, Segments: []int32{0, 1}, Markers: nil},
		"index":   {X: []float64{0, 1, 0}, Y: []float64{0, 0, 1}, Segments: []int32{0, 3}, Markers: []int32{1}},
		"marker0": {X: []float64{0, 1, 0}, Y: []float64{0, 0, 1}, Segments: []int32{0, 1}, Markers: []int32{0}},
		"xy":      {X: []float64{0, 1, 0}, Y: []float64{0, 0}},
	} {
		func() {
			defer func() {
				if r := recover(); r == nil {
					t.Errorf("%s: no panic", name)
				}
			}()
			Triangulate(in, Options{})
		}()
	}
}

// TestTriangulateOffsetStress replays a random stress run (1,000 polygon
// sets far from the origin: offsets up to 500 x their size, scales
// 1e-6..1e6, angle bounds 28 and 33 degrees, with and without a size
// field) and meshes its first cases plus the three that once failed Check:
// split points far from the origin carry rounding errors of the offset's
// magnitude, which Check's on-segment tolerance must absorb.
func TestTriangulateOffsetStress(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 7))
	keep := map[int]bool{0: true, 1: true, 2: true, 3: true, 4: true, 5: true, 705: true, 741: true, 810: true}
	for trial := 0; trial <= 810; trial++ {
		s := math.Pow(10, float64(rng.IntN(13)-6))
		ox, oy := (rng.Float64()-0.5)*1e3*s, (rng.Float64()-0.5)*1e3*s
		polys := [][]float64{boxPoly(0, 0, 4, 4)}
		for i := 0; i < 4; i++ {
			for j := 0; j < 4; j++ {
				if rng.IntN(3) == 0 {
					continue
				}
				cx, cy := float64(i)+0.5, float64(j)+0.5
				n := 3 + rng.IntN(20)
				var p []float64
				for k := 0; k < n; k++ {
					a := 2 * math.Pi * (float64(k) + 0.9*rng.Float64()) / float64(n)
					r := 0.05 + 0.4499999*rng.Float64()
					p = append(p, cx+r*math.Cos(a), cy+r*math.Sin(a))
				}
				polys = append(polys, p)
			}
		}
		for _, p := range polys {
			for i := 0; i < len(p); i += 2 {
				p[i], p[i+1] = p[i]*s+ox, p[i+1]*s+oy
			}
		}
		angles := []float64{28, 33, 34, 33}
		opt := Options{MinAngle: angles[rng.IntN(4)], MaxTriangles: 400000}
		if rng.IntN(2) == 0 {
			opt.Size.Global = s * (0.05 + 0.3*rng.Float64())
		}
		if !keep[trial] || opt.MinAngle > 33 {
			continue
		}
		in := polyInput(polys...)
		mustMesh(t, fmt.Sprintf("offset-stress %d", trial), in, opt, CheckOptions{MinAngle: opt.MinAngle})
	}
}
