package force

import (
	"container/heap"
	"math"
	"sort"

	"polegap/internal/compsum"
	"polegap/internal/num"
	"polegap/mesh"
	"polegap/post/study"
	"polegap/solver"
)

// Node states of the band weight.
const (
	free    uint8 = iota // air node: weight from its distance to the part
	inside               // node of the part: weight 1
	blocked              // node of another non-air region: weight 0
)

// StressOptions control Stress. The zero value picks the band width.
type StressOptions struct {
	// Band is the width (m) over which the weight falls from 1 at the
	// part to 0. Zero means 3 times the median length of the element
	// edges on the part's boundary. The weight is 0 on other non-air
	// regions whatever the width, so a wide band is always safe.
	Band float64
}

// Force is a computed force.
type Force struct {
	// F is the force (N): Fx, Fy planar (times Depth); 0, Fz
	// axisymmetric.
	F [2]float64
	// Band is the band width used (m) and Elements the number of
	// elements the stress was integrated over.
	Band     float64
	Elements int
}

// Stress returns the force on the part made of the elements whose region
// tag is in part, by the Maxwell stress over a weighted band of air (see
// the package documentation). It panics if sol is nil or part is empty.
func Stress(sol *solver.Solution, part []int32, opt StressOptions) (Force, error) {
	if sol == nil || sol.Problem == nil || sol.Problem.Mesh == nil {
		panic(errNilSolution)
	}
	if len(part) == 0 {
		panic(errEmptyPart)
	}
	p := sol.Problem
	m := p.Mesh
	nt := m.NumTriangles()
	inPart := make([]bool, len(p.Materials))
	for _, tg := range part {
		if tg >= 0 && int(tg) < len(inPart) {
			inPart[tg] = true
		}
	}
	air := airTags(p)
	nv := m.NumVertices
	state := make([]uint8, nv)
	npart := 0
	for t := 0; t < nt; t++ {
		if inPart[m.Region[t]] {
			npart++
			for k := 0; k < 3; k++ {
				state[m.Tri[3*t+k]] = inside
			}
		}
	}
	if npart == 0 {
		return Force{}, &PartError{Tags: append([]int32(nil), part...)}
	}
	for t := 0; t < nt; t++ {
		r := m.Region[t]
		if inPart[r] || air[r] {
			continue
		}
		for k := 0; k < 3; k++ {
			v := m.Tri[3*t+k]
			if state[v] == inside {
				return Force{}, &ContactError{Tag: r, X: m.X[v], Y: m.Y[v]}
			}
			state[v] = blocked
		}
	}
	band := opt.Band
	if !(band > 0) {
		band = 3 * medianBoundaryEdge(m, inPart)
	}
	g := weights(m, air, state, band)

	deg := study.QuadDegree(m.Order(), p.Formulation)
	if p.Formulation == solver.Axisymmetric || m.Order() == 2 {
		deg = 4 // the stress is quadratic in B; axisymmetric B carries A/r
	}
	f := study.NewQuadField(sol, deg)
	nq := f.NumPoints()
	var fx, fy compsum.Sum
	count := 0
	for t := 0; t < nt; t++ {
		i0, i1, i2 := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		g0, g1, g2 := g[i0], g[i1], g[i2]
		if g0 == g1 && g1 == g2 {
			continue
		}
		count++
		// ∇g of the linear weight on the triangle.
		x0, y0 := m.X[i0], m.Y[i0]
		ja, jb := m.X[i1]-x0, m.X[i2]-x0
		jc, jd := m.Y[i1]-y0, m.Y[i2]-y0
		det := ja*jd - jb*jc
		d1, d2 := g1-g0, g2-g0
		gx := (jd*d1 - jc*d2) / det
		gy := (-jb*d1 + ja*d2) / det
		mat := p.Materials[m.Region[t]]
		curved := m.IsCurved(t)
		var ex, ey float64
		for q := 0; q < nq; q++ {
			pt := f.At(t, q)
			if curved {
				gx, gy = f.LinearGrad(t, q, g0, g1, g2)
			}
			b2 := pt.Bx*pt.Bx + pt.By*pt.By
			nu, _ := mat.Nu(b2)
			_, wco := study.EnergyDensity(mat, b2)
			hx, hy := nu*pt.Bx, nu*pt.By
			hg := hx*gx + hy*gy
			// −T·∇g with T = B⊗H − w' I.
			ex += pt.W * (wco*gx - pt.Bx*hg)
			ey += pt.W * (wco*gy - pt.By*hg)
		}
		fx.Add(ex)
		fy.Add(ey)
	}
	out := Force{Band: band, Elements: count}
	if p.Formulation == solver.Axisymmetric {
		out.F = [2]float64{0, fy.Value()}
	} else {
		out.F = [2]float64{fx.Value() * p.Depth, fy.Value() * p.Depth}
	}
	if !num.Finite(out.F[0]) || !num.Finite(out.F[1]) {
		return Force{}, &NotFiniteError{Value: out.F}
	}
	return out, nil
}

// airTags marks the region tags whose material is air: linear with
// ν = 1/μ0 (to 1e-9), no current density, no magnetisation.
func airTags(p *solver.Problem) []bool {
	air := make([]bool, len(p.Materials))
	nu0 := 1 / num.Mu0
	for r, mat := range p.Materials {
		if mat == nil {
			continue
		}
		n0, d0 := mat.Nu(0)
		n1, d1 := mat.Nu(4)
		if d0 != 0 || d1 != 0 || math.Abs(n0-nu0) > 1e-9*nu0 || n1 != n0 {
			continue
		}
		if r < len(p.CurrentDensity) && p.CurrentDensity[r] != 0 {
			continue
		}
		if r < len(p.Magnetization) && p.Magnetization[r] != [2]float64{} {
			continue
		}
		air[r] = true
	}
	return air
}

// medianBoundaryEdge returns the median length of the edges between part
// and non-part elements.
func medianBoundaryEdge(mm *mesh.Mesh, inPart []bool) float64 {
	var ls []float64
	for t := 0; t < mm.NumTriangles(); t++ {
		if !inPart[mm.Region[t]] {
			continue
		}
		for k := 0; k < 3; k++ {
			o := mm.Nbr[3*t+k]
			if o >= 0 && inPart[mm.Region[o]] {
				continue
			}
			a, b := mm.Tri[3*t+(k+1)%3], mm.Tri[3*t+(k+2)%3]
			ls = append(ls, math.Hypot(mm.X[a]-mm.X[b], mm.Y[a]-mm.Y[b]))
		}
	}
	if len(ls) == 0 {
		return 0
	}
	sort.Float64s(ls)
	return ls[len(ls)/2]
}

// weights returns the band weight per node (corners only; midside nodes
// are not used): 1 inside the part, 1 − d/band on free nodes at edge-path
// distance d through air elements, 0 on blocked nodes and beyond the band.
func weights(m *mesh.Mesh, air []bool, state []uint8, band float64) []float64 {
	nv := m.NumVertices
	dist := make([]float64, nv)
	for i := range dist {
		dist[i] = math.Inf(1)
	}
	// Adjacency through air elements, as a list of (node, node) edges
	// per node, built once.
	start := make([]int32, nv+1)
	nt := m.NumTriangles()
	for t := 0; t < nt; t++ {
		if !air[m.Region[t]] {
			continue
		}
		for k := 0; k < 3; k++ {
			start[m.Tri[3*t+k]+1] += 2
		}
	}
	for i := 0; i < nv; i++ {
		start[i+1] += start[i]
	}
	adj := make([]int32, start[nv])
	fill := append([]int32(nil), start[:nv]...)
	for t := 0; t < nt; t++ {
		if !air[m.Region[t]] {
			continue
		}
		for k := 0; k < 3; k++ {
			v := m.Tri[3*t+k]
			adj[fill[v]] = m.Tri[3*t+(k+1)%3]
			adj[fill[v]+1] = m.Tri[3*t+(k+2)%3]
			fill[v] += 2
		}
	}
	h := &nodeHeap{}
	for v := 0; v < nv; v++ {
		if state[v] == inside {
			dist[v] = 0
			heap.Push(h, item{int32(v), 0})
		}
	}
	for h.Len() > 0 {
		it := heap.Pop(h).(item)
		if it.d > dist[it.v] || it.d >= band {
			continue
		}
		for _, u := range adj[start[it.v]:start[it.v+1]] {
			if state[u] != free {
				continue
			}
			d := it.d + math.Hypot(m.X[u]-m.X[it.v], m.Y[u]-m.Y[it.v])
			if d < dist[u] {
				dist[u] = d
				heap.Push(h, item{u, d})
			}
		}
	}
	g := make([]float64, m.NumNodes())
	for v := 0; v < nv; v++ {
		switch {
		case state[v] == inside:
			g[v] = 1
		case state[v] == free && dist[v] < band:
			g[v] = 1 - dist[v]/band
		}
	}
	return g
}

type item struct {
	v int32
	d float64
}

type nodeHeap []item

func (h nodeHeap) Len() int           { return len(h) }
func (h nodeHeap) Less(i, j int) bool { return h[i].d < h[j].d }
func (h nodeHeap) Swap(i, j int)      { h[i], h[j] = h[j], h[i] }
func (h *nodeHeap) Push(x any)        { *h = append(*h, x.(item)) }
func (h *nodeHeap) Pop() any {
	old := *h
	x := old[len(old)-1]
	*h = old[:len(old)-1]
	return x
}
