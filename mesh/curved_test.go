package mesh

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"
)

// discInput is a disc of radius a about the origin (region 1, two half
// circles) in a square air box (region 0) of half side 2a.
func discInput(t *testing.T, a, h float64) (*Input, Options) {
	t.Helper()
	disc := Polygon{X: []float64{a, -a}, Y: []float64{0, 0}, Sweep: []float64{math.Pi, math.Pi}, Region: 1, Marker: 2}
	box := rect(-2*a, -2*a, 2*a, 2*a, 0, 1)
	size := SizeField{Global: h}
	in, err := BuildInput([]Polygon{disc}, box, GraphOptions{Size: &size})
	if err != nil {
		t.Fatal(err)
	}
	return in, Options{Size: size, Order: 2}
}

// slope fits log e = p log h + c by least squares and returns p.
func slope(h, e []float64) float64 {
	var sx, sy, sxx, sxy float64
	n := float64(len(h))
	for i := range h {
		x, y := math.Log(h[i]), math.Log(e[i])
		sx, sy, sxx, sxy = sx+x, sy+y, sxx+x*x, sxy+x*y
	}
	return (n*sxy - sx*sy) / (n*sxx - sx*sx)
}

// straighten returns a copy of the second-order mesh m with every midside
// node at its edge midpoint (the straight P2 mesh on the same corners).
func straighten(m *Mesh) *Mesh {
	s := *m
	s.X, s.Y = append([]float64(nil), m.X...), append([]float64(nil), m.Y...)
	s.Curved = nil
	for t := 0; t < m.NumTriangles(); t++ {
		for k := 0; k < 3; k++ {
			a, b, n := m.Tri[3*t+(k+1)%3], m.Tri[3*t+(k+2)%3], m.Mid[3*t+k]
			s.X[n], s.Y[n] = 0.5*(m.X[a]+m.X[b]), 0.5*(m.Y[a]+m.Y[b])
		}
	}
	return &s
}

// TestCurvedDiscAreaOrder meshes a disc at three sizes and fits the order
// at which its meshed area approaches πa², against the element size on the
// arc: the mean length h of the mesh edges along the circle. Expected
// orders, for chords spanning φ = h/a: straight sides inscribe a polygon
// whose area falls short by a fraction 1 − sin φ/φ = φ²/6 + O(φ⁴), order
// 2; a curved side is the parabola through the ends and middle of its arc,
// whose segment (2/3 c s for chord c and sagitta s: Archimedes,
// "Quadrature of the Parabola", prop. 17) falls short of the circular
// segment R²(φ − sin φ)/2 by R² φ⁵/960 + O(φ⁷) (Taylor expansion of
// both), a fraction φ⁴/480 of the disc: order 4. The fitted slopes must be
// within 0.3 of these orders (the lead's brief; the chords of an
// unstructured mesh vary in length, which the fit against their mean
// absorbs).
func TestCurvedDiscAreaOrder(t *testing.T) {
	const a = 0.01
	var hs, eCurved, eStraight []float64
	for _, h := range []float64{a / 2, a / 4, a / 8} {
		in, opt := discInput(t, a, h)
		m, err := Triangulate(in, opt)
		if err != nil {
			t.Fatal(err)
		}
		if err := m.Check(CheckOptions{MinAngle: DefaultMinAngle, Input: in}); err != nil {
			t.Fatalf("h = %g: %v", h, err)
		}
		want := math.Pi * a * a
		ec := math.Abs(m.RegionAreas()[1]-want) / want
		es := math.Abs(straighten(m).RegionAreas()[1]-want) / want
		var arcEdges int
		for _, ai := range m.EdgeArc {
			if ai >= 0 {
				arcEdges++
			}
		}
		harc := 2 * math.Pi * a / float64(arcEdges/2) // each edge is seen from both sides
		t.Logf("size a/%g: %d triangles, %d curved, %d edges on the circle, area error curved %.3g, straight %.3g",
			a/h, m.NumTriangles(), countCurved(m), arcEdges/2, ec, es)
		hs, eCurved, eStraight = append(hs, harc), append(eCurved, ec), append(eStraight, es)
	}
	t.Logf("fitted orders: curved %.2f, straight %.2f", slope(hs, eCurved), slope(hs, eStraight))
	if p := slope(hs, eCurved); math.Abs(p-4) > 0.3 {
		t.Errorf("curved P2: area error order %.2f, want 4 ± 0.3 (errors %v)", p, eCurved)
	}
	if p := slope(hs, eStraight); math.Abs(p-2) > 0.3 {
		t.Errorf("straight P2: area error order %.2f, want 2 ± 0.3 (errors %v)", p, eStraight)
	}
}

func countCurved(m *Mesh) int {
	n := 0
	for _, c := range m.Curved {
		if c {
			n++
		}
	}
	return n
}

// TestCurvedNodesOnArc checks that refinement and Elevate put every
// vertex and midside node of an arc edge on the arc (to rounding), and
// that the triangles on both sides of a curved edge are marked curved.
func TestCurvedNodesOnArc(t *testing.T) {
	const a = 0.01
	in, opt := discInput(t, a, a/5)
	m, err := Triangulate(in, opt)
	if err != nil {
		t.Fatal(err)
	}
	n := 0
	for tr := 0; tr < m.NumTriangles(); tr++ {
		for k := 0; k < 3; k++ {
			if m.EdgeArc[3*tr+k] < 0 {
				continue
			}
			n++
			for _, v := range []int32{m.Tri[3*tr+(k+1)%3], m.Tri[3*tr+(k+2)%3], m.Mid[3*tr+k]} {
				if d := math.Abs(math.Hypot(m.X[v], m.Y[v]) - a); d > 1e-15 {
					t.Errorf("triangle %d edge %d: node %d at %.3g m from the arc", tr, k, v, d)
				}
			}
			if !m.IsCurved(tr) {
				t.Errorf("triangle %d has an arc edge but is not curved", tr)
			}
		}
	}
	if n == 0 {
		t.Fatal("no edge on the arc")
	}
}

// TestCurvedMapping checks the isoparametric map of curved triangles: its
// nodes map to themselves, Reference inverts MapAt, the Jacobian agrees
// with finite differences, and TriangleArea matches a fine quadrature.
func TestCurvedMapping(t *testing.T) {
	const a = 0.01
	in, opt := discInput(t, a, a/3)
	m, err := Triangulate(in, opt)
	if err != nil {
		t.Fatal(err)
	}
	ref := [6][2]float64{{0, 0}, {1, 0}, {0, 1}, {0.5, 0.5}, {0, 0.5}, {0.5, 0}}
	checked := 0
	for tr := 0; tr < m.NumTriangles(); tr++ {
		if !m.IsCurved(tr) {
			continue
		}
		checked++
		nodes := m.nodes6(tr)
		for i, p := range ref {
			x, y, _ := m.MapAt(tr, p[0], p[1])
			// Tolerance: rounding of sums of six products of coordinates
			// of size a.
			if math.Abs(x-m.X[nodes[i]]) > 1e-15 || math.Abs(y-m.Y[nodes[i]]) > 1e-15 {
				t.Errorf("triangle %d node %d maps to (%g, %g), want (%g, %g)", tr, i, x, y, m.X[nodes[i]], m.Y[nodes[i]])
			}
		}
		for _, p := range [][2]float64{{0.2, 0.3}, {0.6, 0.1}, {0.1, 0.85}, {1.0 / 3, 1.0 / 3}} {
			x, y, j := m.MapAt(tr, p[0], p[1])
			xi, eta, ok := m.Reference(tr, x, y)
			if !ok || math.Abs(xi-p[0]) > 1e-12 || math.Abs(eta-p[1]) > 1e-12 {
				t.Errorf("triangle %d: Reference(MapAt(%v)) = (%g, %g, %v)", tr, p, xi, eta, ok)
			}
			const d = 1e-6 // central differences: error O(d²) of a quadratic map is zero up to rounding
			x1, y1, _ := m.MapAt(tr, p[0]+d, p[1])
			x0, y0, _ := m.MapAt(tr, p[0]-d, p[1])
			x3, y3, _ := m.MapAt(tr, p[0], p[1]+d)
			x2, y2, _ := m.MapAt(tr, p[0], p[1]-d)
			fd := [2][2]float64{{(x1 - x0) / (2 * d), (x3 - x2) / (2 * d)}, {(y1 - y0) / (2 * d), (y3 - y2) / (2 * d)}}
			for r := 0; r < 2; r++ {
				for c := 0; c < 2; c++ {
					if math.Abs(fd[r][c]-j[r][c]) > 1e-9*a {
						t.Errorf("triangle %d at %v: jac[%d][%d] = %g, finite difference %g", tr, p, r, c, j[r][c], fd[r][c])
					}
				}
			}
		}
		// Area by a 40 × 40 composite midpoint rule in (ξ, η) over the
		// reference triangle split into small triangles: converges as
		// O(1/n²) for the quadratic det J, so 1e-3 relative is loose.
		const n = 40
		var area float64
		for i := 0; i < n; i++ {
			for k := 0; k < n-i; k++ {
				xi, eta := (float64(i)+1.0/3)/n, (float64(k)+1.0/3)/n
				area += m.detAt(tr, xi, eta) * 0.5 / (n * n)
				if i+k < n-1 {
					xi, eta = (float64(i)+2.0/3)/n, (float64(k)+2.0/3)/n
					area += m.detAt(tr, xi, eta) * 0.5 / (n * n)
				}
			}
		}
		if got := m.TriangleArea(tr); math.Abs(got-area) > 1e-3*got {
			t.Errorf("triangle %d: TriangleArea %g, quadrature %g", tr, got, area)
		}
	}
	if checked == 0 {
		t.Fatal("no curved triangle")
	}
}

// TestLocatorCurved locates random points of a disc mesh whose circle is
// curved: each is found in the disc's region when it lies inside the
// circle and in the air outside it (the parabolic sides stay within
// a φ⁴/512 ≈ 1e-6 a of the circle for these chords, so points nearer the
// circle than 1e-5 a are not judged), and the curved map of the triangle
// found takes its reference coordinates back to the point.
func TestLocatorCurved(t *testing.T) {
	const a = 0.01
	in, opt := discInput(t, a, a/3)
	m, err := Triangulate(in, opt)
	if err != nil {
		t.Fatal(err)
	}
	loc := NewLocator(m)
	rnd := rand.New(rand.NewPCG(1, 1))
	wrongStraight := 0
	straight := NewLocator(straighten(m))
	for i := 0; i < 20000; i++ {
		// Half the points in a thin ring around the circle, where the
		// chords and the arc disagree.
		var x, y float64
		if i%2 == 0 {
			r, th := a*(1+0.02*(2*rnd.Float64()-1)), 2*math.Pi*rnd.Float64()
			x, y = r*math.Cos(th), r*math.Sin(th)
		} else {
			x, y = 4*a*(rnd.Float64()-0.5), 4*a*(rnd.Float64()-0.5)
		}
		r := math.Hypot(x, y)
		tr, _, b1, b2, ok := loc.Find(x, y)
		if !ok {
			t.Fatalf("(%g, %g) not found", x, y)
		}
		px, py, _ := m.MapAt(int(tr), b1, b2)
		if math.Abs(px-x) > 1e-15 || math.Abs(py-y) > 1e-15 {
			t.Errorf("(%g, %g): triangle %d maps (%g, %g) to (%g, %g)", x, y, tr, b1, b2, px, py)
		}
		if math.Abs(r-a) < 1e-5*a {
			continue
		}
		want := int32(0)
		if r < a {
			want = 1
		}
		if m.Region[tr] != want {
			t.Errorf("(%g, %g) at r = %.9g a: region %d, want %d", x, y, r/a, m.Region[tr], want)
		}
		if s, _, _, _, _ := straight.Find(x, y); m.Region[s] != want {
			wrongStraight++
		}
	}
	// Sanity of the test: the straight mesh puts points between chord
	// and arc in the wrong region.
	if wrongStraight == 0 {
		t.Error("no point between the chords and the arc")
	}
	t.Logf("%d points in the wrong region of the straight mesh", wrongStraight)
}

// TestKelvinDiskCurved: the Kelvin disk of a curved circular boundary is
// curved too, and after ElevateKelvin every pair of joined nodes (corners
// and midside nodes) sits at the same angle on the two circles (to
// rounding), so the identified unknowns describe the same point.
func TestKelvinDiskCurved(t *testing.T) {
	const r = 0.1
	circle := Polygon{Marker: 5}
	for k := 0; k < 4; k++ {
		a := float64(k) * math.Pi / 2
		circle.X, circle.Y = append(circle.X, r*math.Cos(a)), append(circle.Y, r*math.Sin(a))
		circle.Sweep = append(circle.Sweep, math.Pi/2)
	}
	size := SizeField{Global: r / 6}
	in, err := BuildInput(nil, circle, GraphOptions{Size: &size})
	if err != nil {
		t.Fatal(err)
	}
	m, err := Triangulate(in, Options{Size: size})
	if err != nil {
		t.Fatal(err)
	}
	k, err := AddKelvinDisk(m, 5, 0, 0, r, 1)
	if err != nil {
		t.Fatal(err)
	}
	k.ElevateKelvin()
	km := k.Mesh
	if err := km.checkCurved(); err != nil {
		t.Fatal(err)
	}
	mids := 0
	for _, p := range k.Pairs {
		a, b := p[0], p[1]
		if int(a) >= km.NumVertices {
			mids++
		}
		ta := math.Atan2(km.Y[a], km.X[a])
		tb := math.Atan2(km.Y[b]-k.CY, km.X[b]-k.CX)
		ra, rb := math.Hypot(km.X[a], km.Y[a]), math.Hypot(km.X[b]-k.CX, km.Y[b]-k.CY)
		if math.Abs(ta-tb) > 1e-12 || math.Abs(ra-r) > 1e-15 || math.Abs(rb-r) > 1e-15 {
			t.Errorf("pair %v: angles %.15g, %.15g, radii %.15g, %.15g", p, ta, tb, ra, rb)
		}
	}
	if mids == 0 || km.Curved == nil {
		t.Errorf("%d midside pairs, curved %v", mids, km.Curved != nil)
	}
}

// TestCurvedRandomDiscs meshes random groups of discs and arcs (touching,
// overlapping with the later-wins rule, near the box and each other, of
// radii from 1e-3 to 1 of the box, some cut by a straight edge that other
// arcs cross) at random sizes, to second order. Every
// mesh must pass Check (with the curved invariants), keep every node of an
// arc edge on its circle, and cover the unit box, or fail with a typed
// error.
func TestCurvedRandomDiscs(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	n := 150
	if testing.Short() {
		n = 40
	}
	for it := 0; it < n; it++ {
		box := rect(0, 0, 1, 1, 0, 1)
		var regions []Polygon
		nd := 1 + rng.IntN(4)
		for k := 0; k < nd; k++ {
			r := math.Pow(10, -3*rng.Float64())
			cx, cy := r+(1-2*r)*rng.Float64(), r+(1-2*r)*rng.Float64()
			if r > 0.45 {
				r, cx, cy = 0.45, 0.5, 0.5
			}
			// Three or four arcs, sometimes with a straight edge cut off.
			nv := 3 + rng.IntN(2)
			p := Polygon{Region: int32(k + 1), Marker: int32(k + 2)}
			a0 := 2 * math.Pi * rng.Float64()
			for v := 0; v < nv; v++ {
				a := a0 + 2*math.Pi*float64(v)/float64(nv)
				p.X, p.Y = append(p.X, cx+r*math.Cos(a)), append(p.Y, cy+r*math.Sin(a))
				s := 2 * math.Pi / float64(nv)
				if v == 0 && rng.IntN(3) == 0 {
					s = 0
				}
				p.Sweep = append(p.Sweep, s)
			}
			regions = append(regions, p)
		}
		h := math.Pow(10, -1-rng.Float64())
		size := SizeField{Global: h}
		in, err := BuildInput(regions, box, GraphOptions{Size: &size, Overlap: OverlapLaterWins})
		if err != nil {
			var ge *GraphError
			if !errors.As(err, &ge) {
				t.Fatalf("case %d: untyped error %T: %v", it, err, err)
			}
			continue
		}
		m, err := Triangulate(in, Options{Size: size, Order: 2, MaxTriangles: 400000})
		if err != nil {
			var te *TooManyTrianglesError
			var re *ResolutionError
			if !errors.As(err, &te) && !errors.As(err, &re) {
				t.Fatalf("case %d: %v", it, err)
			}
			continue
		}
		if err := m.Check(CheckOptions{MinAngle: DefaultMinAngle, Input: in}); err != nil {
			t.Errorf("case %d (%d discs, size %g): %v", it, nd, h, err)
			continue
		}
		for tr := 0; tr < m.NumTriangles(); tr++ {
			for k := 0; k < 3; k++ {
				ai := m.EdgeArc[3*tr+k]
				if ai < 0 {
					continue
				}
				arc := m.Arcs[ai]
				for _, v := range []int32{m.Tri[3*tr+(k+1)%3], m.Tri[3*tr+(k+2)%3], m.Mid[3*tr+k]} {
					// Vertices where arcs cross other edges are computed
					// on the chords (BuildInput), up to a sagitta of 1/20
					// of the size from the arc; all others lie on it.
					if d := math.Abs(math.Hypot(m.X[v]-arc.X, m.Y[v]-arc.Y) - arc.R); d > 1e-12*arc.R && d > h/20 {
						t.Fatalf("case %d: triangle %d edge %d: node %d %.3g from its arc", it, tr, k, v, d)
					}
				}
			}
		}
		var sum float64
		for _, a := range m.RegionAreas() {
			sum += a
		}
		if math.Abs(sum-1) > 1e-6 {
			t.Errorf("case %d: regions cover %.12g of the unit box", it, sum)
		}
	}
}
