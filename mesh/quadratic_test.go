package mesh

import (
	"testing"
)

// Hand-built meshes shared by the tests of quadratic.go, stats.go, vtu.go
// and locate.go. They need only the Mesh struct, so these tests do not depend
// on the triangulator.

// linkNbr fills m.Nbr from Tri by matching corner pairs.
func linkNbr(m *Mesh) {
	nt := m.NumTriangles()
	m.Nbr = make([]int32, 3*nt)
	type half struct{ t, k int32 }
	seen := make(map[[2]int32]half, 3*nt)
	for t := 0; t < nt; t++ {
		for k := 0; k < 3; k++ {
			m.Nbr[3*t+k] = -1
			a := m.Tri[3*t+(k+1)%3]
			b := m.Tri[3*t+(k+2)%3]
			key := [2]int32{min(a, b), max(a, b)}
			if h, ok := seen[key]; ok {
				m.Nbr[3*t+k] = h.t
				m.Nbr[3*h.t+h.k] = int32(t)
				delete(seen, key)
				continue
			}
			seen[key] = half{int32(t), int32(k)}
		}
	}
}

// gridMesh builds an nx-by-ny grid of squares of side h with the lower left
// corner at (x0, y0), each split into two counter-clockwise triangles with
// alternating diagonals. Cells for which skip returns true are left out (a
// hole or a notch), region(i, j) tags the triangles of cell (i, j).
func gridMesh(nx, ny int, x0, y0, h float64, skip func(i, j int) bool, region func(i, j int) int32) *Mesh {
	m := &Mesh{}
	id := func(i, j int) int32 { return int32(j*(nx+1) + i) }
	for j := 0; j <= ny; j++ {
		for i := 0; i <= nx; i++ {
			m.X = append(m.X, x0+float64(i)*h)
			m.Y = append(m.Y, y0+float64(j)*h)
		}
	}
	m.NumVertices = len(m.X)
	for j := 0; j < ny; j++ {
		for i := 0; i < nx; i++ {
			if skip != nil && skip(i, j) {
				continue
			}
			a, b, c, d := id(i, j), id(i+1, j), id(i+1, j+1), id(i, j+1)
			if (i+j)%2 == 0 {
				m.Tri = append(m.Tri, a, b, c, a, c, d)
			} else {
				m.Tri = append(m.Tri, a, b, d, b, c, d)
			}
			var r int32
			if region != nil {
				r = region(i, j)
			}
			m.Region = append(m.Region, r, r)
		}
	}
	m.EdgeMarker = make([]int32, len(m.Tri))
	linkNbr(m)
	return m
}

// twoTriangles is the unit square split along its diagonal (0,0)-(1,1):
// triangle 0 in region 1, triangle 1 in region 2.
func twoTriangles() *Mesh {
	m := &Mesh{
		X:           []float64{0, 1, 1, 0},
		Y:           []float64{0, 0, 1, 1},
		NumVertices: 4,
		Tri:         []int32{0, 1, 2, 0, 2, 3},
		Region:      []int32{1, 2},
		EdgeMarker:  []int32{1, 0, 1, 1, 1, 0},
	}
	linkNbr(m)
	return m
}

func countEdges(m *Mesh) int {
	e := make(map[[2]int32]bool)
	for t := 0; t < m.NumTriangles(); t++ {
		for k := 0; k < 3; k++ {
			a, b := m.Tri[3*t+(k+1)%3], m.Tri[3*t+(k+2)%3]
			e[[2]int32{min(a, b), max(a, b)}] = true
		}
	}
	return len(e)
}

func TestElevate(t *testing.T) {
	holed := gridMesh(6, 5, -1, 2, 0.25, func(i, j int) bool { return i == 2 && j >= 1 && j <= 3 }, nil)
	cases := []struct {
		name string
		m    *Mesh
		nbr  bool
	}{
		{"two triangles", twoTriangles(), true},
		{"grid with hole", holed, true},
		{"grid without Nbr", gridMesh(4, 3, 0, 0, 1, nil, nil), false},
	}
	for _, c := range cases {
		m := c.m
		if !c.nbr {
			m.Nbr = nil
		}
		v, e := m.NumVertices, countEdges(m)
		Elevate(m)
		// Euler's count: one midside node per edge, so N = V + E.
		if m.NumNodes() != v+e || m.NumVertices != v || m.Order() != 2 {
			t.Fatalf("%s: nodes %d (want V+E = %d+%d), NumVertices %d, order %d", c.name, m.NumNodes(), v, e, m.NumVertices, m.Order())
		}
		seen := make(map[int32]int)
		for tr := 0; tr < m.NumTriangles(); tr++ {
			for k := 0; k < 3; k++ {
				n := m.Mid[3*tr+k]
				if int(n) < v || int(n) >= m.NumNodes() {
					t.Fatalf("%s: Mid[%d] = %d out of [%d, %d)", c.name, 3*tr+k, n, v, m.NumNodes())
				}
				seen[n]++
				a, b := m.Tri[3*tr+(k+1)%3], m.Tri[3*tr+(k+2)%3]
				// The midpoint is computed as 0.5*(xa+xb): exact in binary
				// floating point for these dyadic coordinates.
				if m.X[n] != 0.5*(m.X[a]+m.X[b]) || m.Y[n] != 0.5*(m.Y[a]+m.Y[b]) {
					t.Errorf("%s: Mid[%d] at (%g,%g), edge midpoint (%g,%g)", c.name, 3*tr+k, m.X[n], m.Y[n], 0.5*(m.X[a]+m.X[b]), 0.5*(m.Y[a]+m.Y[b]))
				}
			}
		}
		if len(seen) != e {
			t.Errorf("%s: %d distinct midside nodes, want %d", c.name, len(seen), e)
		}
		if c.nbr {
			for tr := 0; tr < m.NumTriangles(); tr++ {
				for k := 0; k < 3; k++ {
					u := m.Nbr[3*tr+k]
					want := 1
					if u >= 0 {
						want = 2
						j := twinEdge(m, u, m.Tri[3*tr+(k+1)%3], m.Tri[3*tr+(k+2)%3])
						if m.Mid[3*int(u)+j] != m.Mid[3*tr+k] {
							t.Errorf("%s: twin edges (%d,%d) and (%d,%d) have different midside nodes", c.name, tr, k, u, j)
						}
					}
					if seen[m.Mid[3*tr+k]] != want {
						t.Errorf("%s: midside node %d used %d times, want %d", c.name, m.Mid[3*tr+k], seen[m.Mid[3*tr+k]], want)
					}
				}
			}
		}
		// Idempotent: a second call changes nothing.
		n := m.NumNodes()
		Elevate(m)
		if m.NumNodes() != n {
			t.Errorf("%s: second Elevate changed node count %d -> %d", c.name, n, m.NumNodes())
		}
	}
}

func TestElevatePanics(t *testing.T) {
	m := twoTriangles()
	m.NumVertices = 3
	defer func() {
		if r := recover(); r == nil {
			t.Fatal("no panic for len(X) != NumVertices")
		}
	}()
	Elevate(m)
}

func BenchmarkElevate(b *testing.B) {
	base := gridMesh(224, 224, 0, 0, 1.0/224, nil, nil) // 100,352 triangles
	b.ReportAllocs()
	for b.Loop() {
		m := *base
		m.X, m.Y, m.Mid = base.X[:base.NumVertices:base.NumVertices], base.Y[:base.NumVertices:base.NumVertices], nil
		Elevate(&m)
	}
	b.ReportMetric(float64(base.NumTriangles())*float64(b.N)/b.Elapsed().Seconds(), "triangles/s")
}
