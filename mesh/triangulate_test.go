package mesh

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"
)

// polyInput builds an Input from closed polygons (each a flat x,y list),
// marker i+1 for polygon i.
func polyInput(polys ...[]float64) *Input {
	in := &Input{}
	for pi, p := range polys {
		base := int32(len(in.X))
		n := int32(len(p) / 2)
		for i := int32(0); i < n; i++ {
			in.X = append(in.X, p[2*i])
			in.Y = append(in.Y, p[2*i+1])
			in.Segments = append(in.Segments, base+i, base+(i+1)%n)
			in.Markers = append(in.Markers, int32(pi+1))
		}
	}
	return in
}

// mustMesh triangulates and runs Check with the given options.
func mustMesh(t *testing.T, name string, in *Input, opt Options, chk CheckOptions) *Mesh {
	t.Helper()
	m, err := Triangulate(in, opt)
	if err != nil {
		t.Fatalf("%s: Triangulate: %v", name, err)
	}
	if chk.Input == nil {
		chk.Input = in
	}
	if err := m.Check(chk); err != nil {
		t.Fatalf("%s: %v", name, err)
	}
	return m
}

// segmentsCovered checks that every input segment is a union of mesh edges
// carrying its marker: the marked mesh edges lying on the segment must sum
// to its length (to 1e-12 relative).
func segmentsCovered(t *testing.T, name string, in *Input, m *Mesh) {
	t.Helper()
	for s := 0; s < len(in.Segments)/2; s++ {
		a, b := in.Segments[2*s], in.Segments[2*s+1]
		ax, ay, bx, by := in.X[a], in.Y[a], in.X[b], in.Y[b]
		l := math.Hypot(bx-ax, by-ay)
		if l == 0 {
			continue
		}
		sum := 0.0
		for i, mk := range m.EdgeMarker {
			if mk == 0 {
				continue
			}
			tt, k := i/3, i%3
			u, v := m.Tri[3*tt+(k+1)%3], m.Tri[3*tt+(k+2)%3]
			if m.Nbr[i] >= 0 && u > v {
				continue // count interior edges once
			}
			tol := 1e-12*l + 1e-14*(math.Abs(ax)+math.Abs(ay)+math.Abs(bx)+math.Abs(by))
			if SegmentDistance(m.X[u], m.Y[u], ax, ay, bx, by) <= tol &&
				SegmentDistance(m.X[v], m.Y[v], ax, ay, bx, by) <= tol {
				sum += math.Hypot(m.X[v]-m.X[u], m.Y[v]-m.Y[u])
			}
		}
		if math.Abs(sum-l) > 1e-12*l*10 {
			t.Errorf("%s: segment %d: marked mesh edges cover %.17g of length %.17g", name, s, sum, l)
		}
	}
}

func TestTriangulateSquareCDT(t *testing.T) {
	in := polyInput([]float64{0, 0, 1, 0, 1, 1, 0, 1})
	m := mustMesh(t, "square", in, Options{MinAngle: -1}, CheckOptions{RegionAreas: map[int32]float64{0: 1}})
	if m.NumTriangles() != 2 || m.NumVertices != 4 {
		t.Errorf("square: %d triangles %d vertices, want 2 and 4", m.NumTriangles(), m.NumVertices)
	}
}

// TestTriangulateRandomPoints: Delaunay triangulations of random point sets
// (Check verifies the empty-circle property with exact InCircle).
func TestTriangulateRandomPoints(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for _, n := range []int{3, 10, 100, 2000} {
		in := &Input{}
		for i := 0; i < n; i++ {
			in.X = append(in.X, rng.Float64())
			in.Y = append(in.Y, rng.Float64())
		}
		m := mustMesh(t, "random", in, Options{MinAngle: -1}, CheckOptions{})
		// Euler's formula V - E + F = 2 gives 2n-2-h triangles for n points
		// with h hull vertices (de Berg et al., "Computational Geometry",
		// 3rd ed. 2008, Theorem 9.1; theorem number from memory). Random
		// points have no collinear hull points, so h counts boundary edges.
		h := 0
		for i := range m.Nbr {
			if m.Nbr[i] < 0 {
				h++
			}
		}
		if got, want := m.NumTriangles(), 2*n-2-h; got != want {
			t.Errorf("random %d: %d triangles, want 2n-2-h = %d", n, got, want)
		}
	}
}

func TestTriangulateQualitySquare(t *testing.T) {
	in := polyInput([]float64{0, 0, 1, 0, 1, 1, 0, 1})
	m := mustMesh(t, "square", in, Options{Size: SizeField{Global: 0.05}}, CheckOptions{MinAngle: 28, RegionAreas: map[int32]float64{0: 1}})
	segmentsCovered(t, "square", in, m)
	t.Logf("square h=0.05: %d triangles", m.NumTriangles())
}

func TestTriangulateCrossing(t *testing.T) {
	in := &Input{X: []float64{0, 1, 0, 1}, Y: []float64{0, 1, 1, 0}, Segments: []int32{0, 1, 2, 3}, Markers: []int32{1, 2}}
	_, err := Triangulate(in, Options{})
	var ce *SegmentsCrossError
	if !errors.As(err, &ce) {
		t.Fatalf("crossing segments: got %v, want *SegmentsCrossError", err)
	}
	if ce.Segment != 1 || ce.Other != 0 {
		t.Errorf("crossing segments: reported %d and %d, want 1 and 0", ce.Segment, ce.Other)
	}
}

// TestTriangulateAllocations: refinement inserts ~5,000 vertices here; the
// allocation count must not grow with them (hot loops allocate nothing, only
// array growth and setup allocate). 400 is about 4x what we measure.
func TestTriangulateAllocations(t *testing.T) {
	in := polyInput([]float64{0, 0, 1, 0, 1, 1, 0, 1})
	opt := Options{Size: SizeField{Global: 0.0224}}
	var nt int
	allocs := testing.AllocsPerRun(1, func() {
		m, err := Triangulate(in, opt)
		if err != nil {
			t.Fatal(err)
		}
		nt = m.NumTriangles()
	})
	if allocs > 400 {
		t.Errorf("%d triangles took %.0f allocations, want <= 400", nt, allocs)
	}
}

// TestTriangulateOpenBoundary: an outer polyline that does not close leaves
// no inside; that is an *InputError, not an empty mesh.
func TestTriangulateOpenBoundary(t *testing.T) {
	in := &Input{X: []float64{0, 1, 1, 0}, Y: []float64{0, 0, 1, 1}, Segments: []int32{0, 1, 1, 2, 2, 3}, Markers: []int32{1, 1, 1}}
	var ie *InputError
	if _, err := Triangulate(in, Options{}); !errors.As(err, &ie) {
		t.Fatalf("open boundary: got %v, want *InputError", err)
	}
}

// TestTriangulateConcurrent: Triangulate keeps no shared state (the exact
// predicates' scratch comes from a sync.Pool), so concurrent calls on
// different inputs are safe; run with -race to check.
func TestTriangulateConcurrent(t *testing.T) {
	done := make(chan error, 4)
	for g := 0; g < 4; g++ {
		go func(g int) {
			in := polyInput(circlePoly(0, 0, 1+float64(g), 40))
			m, err := Triangulate(in, Options{Size: SizeField{Global: 0.2 * (1 + float64(g))}})
			if err == nil {
				err = m.Check(CheckOptions{MinAngle: 28, Input: in})
			}
			done <- err
		}(g)
	}
	for g := 0; g < 4; g++ {
		if err := <-done; err != nil {
			t.Error(err)
		}
	}
}

// TestTriangulateDeterministic: two runs give identical meshes.
func TestTriangulateDeterministic(t *testing.T) {
	yoke, box, wire, seeds, _ := cCore(1, 0.002)
	in := polyInput(box, yoke, wire)
	in.Seeds = seeds
	opt := Options{Size: SizeField{Global: 0.01}}
	m1, err1 := Triangulate(in, opt)
	m2, err2 := Triangulate(in, opt)
	if err1 != nil || err2 != nil {
		t.Fatal(err1, err2)
	}
	same := len(m1.X) == len(m2.X) && len(m1.Tri) == len(m2.Tri)
	for i := 0; same && i < len(m1.X); i++ {
		same = m1.X[i] == m2.X[i] && m1.Y[i] == m2.Y[i]
	}
	for i := 0; same && i < len(m1.Tri); i++ {
		same = m1.Tri[i] == m2.Tri[i] && m1.Nbr[i] == m2.Nbr[i] && m1.EdgeMarker[i] == m2.EdgeMarker[i]
	}
	if !same {
		t.Error("two runs differ")
	}
}
