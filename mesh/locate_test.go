package mesh

import (
	"math"
	"math/rand/v2"
	"sync"
	"testing"
)

// gradedMesh is an n-by-n grid on [0,1]² whose node coordinates are mapped
// by s -> s^4, so triangles near the origin are up to ~n³ times smaller
// than at the far corner; cells (i, j) with skip(i, j) are left out.
func gradedMesh(n int, skip func(i, j int) bool) *Mesh {
	m := gridMesh(n, n, 0, 0, 1/float64(n), skip, func(i, j int) int32 { return int32(i % 3) })
	for k := range m.X {
		m.X[k] = math.Pow(m.X[k], 4)
		m.Y[k] = math.Pow(m.Y[k], 4)
	}
	return m
}

// bruteFind lists every triangle that holds (x, y), by exhaustive search.
func bruteFind(m *Mesh, l *Locator, x, y float64) map[int32]bool {
	out := map[int32]bool{}
	for t := 0; t < m.NumTriangles(); t++ {
		a, b, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		if x < min(m.X[a], m.X[b], m.X[c]) || x > max(m.X[a], m.X[b], m.X[c]) ||
			y < min(m.Y[a], m.Y[b], m.Y[c]) || y > max(m.Y[a], m.Y[b], m.Y[c]) {
			continue
		}
		if l.inside(int32(t), x, y) {
			out[int32(t)] = true
		}
	}
	return out
}

func TestLocatorMatchesBruteForce(t *testing.T) {
	ring := func(n int) func(i, j int) bool {
		// a square hole in the middle and a notch cut from one side make
		// the domain non-convex and multiply connected
		return func(i, j int) bool {
			return (i > n/3 && i < 2*n/3 && j > n/3 && j < 2*n/3) || (j == n/2 && i > 2*n/3)
		}
	}
	cases := []struct {
		name string
		m    *Mesh
	}{
		{"two triangles", twoTriangles()},
		{"grid with hole", gridMesh(20, 15, -3, 1e3, 0.01, ring(15), nil)},
		{"graded", gradedMesh(40, nil)},
		{"graded with hole", gradedMesh(40, ring(40))},
		{"graded, no Nbr", func() *Mesh { m := gradedMesh(30, ring(30)); m.Nbr = nil; return m }()},
	}
	rng := rand.New(rand.NewPCG(1, 1))
	for _, c := range cases {
		m := c.m
		l := NewLocator(m)
		x0, x1, y0, y1 := l.x0, l.x1, l.y0, l.y1
		w, h := x1-x0, y1-y0
		var pts [][2]float64
		for i := 0; i < 600; i++ {
			// uniform points over a box 10% larger than the mesh, and
			// points biased towards the small triangles at the origin
			u, v := rng.Float64(), rng.Float64()
			pts = append(pts, [2]float64{x0 - 0.05*w + 1.1*w*u, y0 - 0.05*h + 1.1*h*v})
			pts = append(pts, [2]float64{x0 + w*math.Pow(u, 4), y0 + h*math.Pow(v, 4)})
		}
		// nodes and edge midpoints of every 5th triangle: points on shared
		// edges and corners
		for t := 0; t < m.NumTriangles(); t += 5 {
			for k := 0; k < 3; k++ {
				a, b := m.Tri[3*t+k], m.Tri[3*t+(k+1)%3]
				pts = append(pts, [2]float64{m.X[a], m.Y[a]}, [2]float64{0.5 * (m.X[a] + m.X[b]), 0.5 * (m.Y[a] + m.Y[b])})
			}
		}
		walks := 0
		for _, p := range pts {
			tr, b0, b1, b2, ok := l.Find(p[0], p[1])
			want := bruteFind(m, l, p[0], p[1])
			if ok != (len(want) > 0) || (ok && !want[tr]) {
				t.Fatalf("%s: Find(%g, %g) = %d, %v; brute force %v", c.name, p[0], p[1], tr, ok, want)
			}
			if !ok {
				if tr != -1 {
					t.Fatalf("%s: outside point got t = %d", c.name, tr)
				}
				continue
			}
			// Barycentric coordinates reproduce the point: x = sum bk xk,
			// to rounding (1e-12 of the mesh extent).
			a, b, cc := m.Tri[3*tr], m.Tri[3*tr+1], m.Tri[3*tr+2]
			rx := b0*m.X[a] + b1*m.X[b] + b2*m.X[cc]
			ry := b0*m.Y[a] + b1*m.Y[b] + b2*m.Y[cc]
			scale := math.Max(math.Max(math.Abs(x0), math.Abs(x1)), math.Max(math.Abs(y0), math.Abs(y1)))
			if math.Abs(rx-p[0]) > 1e-12*scale || math.Abs(ry-p[1]) > 1e-12*scale {
				t.Errorf("%s: barycentric (%g,%g,%g) gives (%g,%g) for (%g,%g)", c.name, b0, b1, b2, rx, ry, p[0], p[1])
			}
			if min(b0, b1, b2) < -1e-9 {
				t.Errorf("%s: negative barycentric (%g,%g,%g)", c.name, b0, b1, b2)
			}
			cx, cy := l.cellX(p[0]), l.cellY(p[1])
			if l.first[cy*l.nx+cx] >= 0 {
				walks++
			}
		}
		if c.name == "graded" && walks == 0 {
			t.Errorf("%s: no query walked; the walk is untested", c.name)
		}
		for _, p := range [][2]float64{{math.NaN(), 0}, {0, math.Inf(1)}, {x1 + 1, y0}} {
			if tr, _, _, _, ok := l.Find(p[0], p[1]); ok || tr != -1 {
				t.Errorf("%s: Find(%v) = %d, %v, want -1, false", c.name, p, tr, ok)
			}
		}
	}
}

func TestLocatorEmptyAndConcurrent(t *testing.T) {
	if tr, _, _, _, ok := NewLocator(&Mesh{}).Find(0, 0); ok || tr != -1 {
		t.Errorf("empty mesh: %d %v", tr, ok)
	}
	m := gradedMesh(50, nil)
	l := NewLocator(m)
	var wg sync.WaitGroup
	errs := make(chan string, 4)
	for g := 0; g < 4; g++ {
		wg.Add(1)
		go func(seed uint64) {
			defer wg.Done()
			rng := rand.New(rand.NewPCG(seed, 1))
			for i := 0; i < 2000; i++ {
				x, y := math.Pow(rng.Float64(), 3), math.Pow(rng.Float64(), 3)
				if _, _, _, _, ok := l.Find(x, y); !ok {
					errs <- "point inside the unit square not found"
					return
				}
			}
		}(uint64(g))
	}
	wg.Wait()
	close(errs)
	for e := range errs {
		t.Error(e)
	}
}

func BenchmarkLocatorFind(b *testing.B) {
	for _, n := range []int{30, 224} { // ~1.8k and ~100k triangles
		m := gradedMesh(n, nil)
		l := NewLocator(m)
		rng := rand.New(rand.NewPCG(1, 1))
		pts := make([][2]float64, 4096)
		for i := range pts {
			pts[i] = [2]float64{rng.Float64(), rng.Float64()}
		}
		b.Run("graded-uniform-points/"+itoa(m.NumTriangles()), func(b *testing.B) {
			b.ReportAllocs()
			for i := 0; b.Loop(); i++ {
				p := pts[i&4095]
				l.Find(p[0], p[1])
			}
			b.ReportMetric(float64(b.N)/b.Elapsed().Seconds(), "queries/s")
		})
		for i := range pts {
			pts[i] = [2]float64{math.Pow(pts[i][0], 4), math.Pow(pts[i][1], 4)}
		}
		b.Run("graded-dense-points/"+itoa(m.NumTriangles()), func(b *testing.B) {
			b.ReportAllocs()
			for i := 0; b.Loop(); i++ {
				p := pts[i&4095]
				l.Find(p[0], p[1])
			}
			b.ReportMetric(float64(b.N)/b.Elapsed().Seconds(), "queries/s")
		})
		b.Run("build/"+itoa(m.NumTriangles()), func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				NewLocator(m)
			}
		})
	}
}

func itoa(n int) string {
	if n < 10 {
		return string(rune('0' + n))
	}
	return itoa(n/10) + string(rune('0'+n%10))
}

// BenchmarkLocatorGapModel locates points in a mesh graded like a magnet
// model: an invented C-shaped yoke with a 5 mm gap, 0.5 mm triangles in the
// gap growing to 10 mm in the air. Queries are uniform over the box and
// along the gap's centre line, where post-processing samples most.
func BenchmarkLocatorGapModel(b *testing.B) {
	yoke := Polygon{
		X:      []float64{0, 0.2, 0.2, 0.05, 0.05, 0.2, 0.2, 0},
		Y:      []float64{0, 0, 0.0975, 0.0975, 0.1025, 0.1025, 0.2, 0.2},
		Region: 1, Marker: 2,
	}
	bnd := rect(-0.2, -0.2, 0.4, 0.4, 0, 1)
	in, err := BuildInput([]Polygon{yoke}, bnd, GraphOptions{})
	if err != nil {
		b.Fatal(err)
	}
	m, err := Triangulate(in, Options{Size: SizeField{Global: 0.01, Lines: []SizeLine{{X0: 0.05, Y0: 0.1, X1: 0.2, Y1: 0.1, Size: 0.0005}}, Grading: 0.3}})
	if err != nil {
		b.Fatal(err)
	}
	l := NewLocator(m)
	rng := rand.New(rand.NewPCG(1, 1))
	uni := make([][2]float64, 4096)
	gap := make([][2]float64, 4096)
	for i := range uni {
		uni[i] = [2]float64{-0.2 + 0.6*rng.Float64(), -0.2 + 0.6*rng.Float64()}
		gap[i] = [2]float64{0.05 + 0.15*rng.Float64(), 0.0975 + 0.005*rng.Float64()}
	}
	for _, c := range []struct {
		name string
		pts  [][2]float64
	}{{"uniform", uni}, {"gap", gap}} {
		b.Run(c.name+"/"+itoa(m.NumTriangles()), func(b *testing.B) {
			b.ReportAllocs()
			for i := 0; b.Loop(); i++ {
				p := c.pts[i&4095]
				l.Find(p[0], p[1])
			}
			b.ReportMetric(float64(b.N)/b.Elapsed().Seconds(), "queries/s")
		})
	}
	b.Run("build/"+itoa(m.NumTriangles()), func(b *testing.B) {
		for b.Loop() {
			NewLocator(m)
		}
	})
}

// TestTouching: with d = 0 the triangles touching a point are exactly
// those whose closure holds it (bruteFind): one inside a triangle, two on
// an interior edge, the fan at a vertex (6 or 8 on this grid), none
// outside; a point 1e-12 off an edge is touched by both of its triangles
// only when d covers the offset.
func TestTouching(t *testing.T) {
	m := gridMesh(6, 6, 0, 0, 1.0/6, nil, nil)
	l := NewLocator(m)
	h := 1.0 / 6
	pts := [][2]float64{
		{0.3 * h, 0.1 * h},       // inside
		{2 * h, 2.5 * h},         // on a vertical edge
		{2.5 * h, 3 * h},         // on a horizontal edge
		{3 * h, 3 * h},           // vertex
		{2 * h, 3 * h},           // vertex of the other diagonal kind
		{0, 0.5 * h},             // boundary edge
		{1 + h, 0.5},             // outside
		{2.5 * h, 2.5 * h},       // on a diagonal
		{1.0 / 3, 1.0 / 6 * 3.5}, // on a vertical edge, coordinates rounded
	}
	for _, p := range pts {
		got := l.TouchingTo(nil, p[0], p[1], 0)
		want := bruteFind(m, l, p[0], p[1])
		if len(got) != len(want) {
			t.Errorf("(%g, %g): touching %v, closures holding it %v", p[0], p[1], got, want)
			continue
		}
		for _, tr := range got {
			if !want[tr] {
				t.Errorf("(%g, %g): touching %v, closures holding it %v", p[0], p[1], got, want)
			}
		}
	}
	x, y := 2*h+1e-12, 2.5*h
	if got := l.TouchingTo(nil, x, y, 0); len(got) != 1 {
		t.Errorf("1e-12 off the edge, d = 0: %v, want one triangle", got)
	}
	if got := l.TouchingTo(nil, x, y, 2e-12); len(got) != 2 {
		t.Errorf("1e-12 off the edge, d = 2e-12: %v, want two triangles", got)
	}
	if got := l.TouchingTo([]int32{99}, 1+h, 0.5, 0); len(got) != 1 || got[0] != 99 {
		t.Errorf("outside: dst changed to %v", got)
	}
}
