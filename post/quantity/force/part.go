package force

import (
	"container/heap"
	"math"
	"sort"

	"polegap/internal/num"
	"polegap/mesh"
	"polegap/solver"
)

// Node states of the weights.
const (
	free    uint8 = iota // weight from the node's distances
	inside               // node of the part: weight 1
	blocked              // node of another body or of the outer boundary: weight 0
)

// part is a set of region tags on a mesh, with the node states and the
// element passability from which the weights of the stress band and of
// the virtual displacement are made.
type part struct {
	m      *mesh.Mesh
	inPart []bool // per region tag
	pass   []bool // per region tag: the weight may fall across its elements
	state  []uint8
}

// newPart classifies the nodes of p's mesh for the part made of the
// region tags in tags. Elements of air (a linear material of ν = 1/μ0, no
// current density, no magnetisation) are passable; with joints, so are
// those of every region that shares a node with the part (the part's
// yoke, cut from it by the weight). Nodes of the other regions and of the
// outer boundary are blocked (weight 0; the stress's integration by parts
// needs g = 0 there). Without joints a part that touches a region other
// than air is a *ContactError; a part without elements a *PartError.
func newPart(p *solver.Problem, tags []int32, joints bool) (*part, error) {
	m := p.Mesh
	nt := m.NumTriangles()
	pt := &part{m: m, inPart: make([]bool, len(p.Materials)), state: make([]uint8, m.NumVertices)}
	for _, tg := range tags {
		if tg >= 0 && int(tg) < len(pt.inPart) {
			pt.inPart[tg] = true
		}
	}
	pt.pass = airTags(p)
	npart := 0
	for t := 0; t < nt; t++ {
		if pt.inPart[m.Region[t]] {
			npart++
			for k := 0; k < 3; k++ {
				pt.state[m.Tri[3*t+k]] = inside
			}
		}
	}
	if npart == 0 {
		return nil, &PartError{Tags: append([]int32(nil), tags...)}
	}
	for r := range pt.pass {
		if pt.inPart[r] {
			pt.pass[r] = false
		}
	}
	for t := 0; t < nt; t++ {
		r := m.Region[t]
		if pt.inPart[r] || pt.pass[r] {
			continue
		}
		for k := 0; k < 3; k++ {
			if v := m.Tri[3*t+k]; pt.state[v] == inside {
				if !joints {
					return nil, &ContactError{Tag: r, X: m.X[v], Y: m.Y[v]}
				}
				pt.pass[r] = true
			}
		}
	}
	for t := 0; t < nt; t++ {
		r := m.Region[t]
		for k := 0; k < 3; k++ {
			v := m.Tri[3*t+k]
			if pt.state[v] == inside {
				continue
			}
			if !pt.inPart[r] && !pt.pass[r] {
				pt.state[v] = blocked
			}
			if m.Nbr[3*t+k] < 0 {
				a, b := m.Tri[3*t+(k+1)%3], m.Tri[3*t+(k+2)%3]
				for _, u := range [2]int32{a, b} {
					if pt.state[u] != inside {
						pt.state[u] = blocked
					}
				}
			}
		}
	}
	return pt, nil
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

// sizes returns the median length of the part's boundary edges (between
// part and non-part elements, or on the outer boundary) and the median
// size √(2·area) of the passable elements across those edges: the
// element size at the part, on its side and in the air around it.
func (pt *part) sizes() (edge, outside float64) {
	m := pt.m
	var ls, as []float64
	for t := 0; t < m.NumTriangles(); t++ {
		if !pt.inPart[m.Region[t]] {
			continue
		}
		for k := 0; k < 3; k++ {
			o := m.Nbr[3*t+k]
			if o >= 0 && pt.inPart[m.Region[o]] {
				continue
			}
			a, b := m.Tri[3*t+(k+1)%3], m.Tri[3*t+(k+2)%3]
			ls = append(ls, math.Hypot(m.X[a]-m.X[b], m.Y[a]-m.Y[b]))
			if o >= 0 && pt.pass[m.Region[o]] {
				as = append(as, math.Sqrt(2*triArea(m, o)))
			}
		}
	}
	return median(ls), median(as)
}

func triArea(m *mesh.Mesh, t int32) float64 {
	a, b, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
	return 0.5 * math.Abs((m.X[b]-m.X[a])*(m.Y[c]-m.Y[a])-(m.X[c]-m.X[a])*(m.Y[b]-m.Y[a]))
}

func median(v []float64) float64 {
	if len(v) == 0 {
		return 0
	}
	sort.Float64s(v)
	return v[len(v)/2]
}

// band returns the band weight per node (corners only; midside nodes are
// not used): 1 on the part, 1 − d/width on free nodes at edge-path
// distance d < width through passable elements, 0 elsewhere.
func (pt *part) band(width float64) []float64 {
	dist := pt.distances(inside, width)
	g := make([]float64, pt.m.NumNodes())
	for v, s := range pt.state {
		switch {
		case s == inside:
			g[v] = 1
		case s == free && dist[v] < width:
			g[v] = 1 - dist[v]/width
		}
	}
	return g
}

// fill returns the weight that fills all the passable space around the
// part: d_b/(d_p + d_b) on a free node at edge-path distance d_p from the
// part and d_b from the nearest blocked node (other bodies, the outer
// boundary), 1 on the part, 0 on blocked nodes and on free nodes the part
// cannot reach. Near the part it falls as slowly as the space allows.
func (pt *part) fill() []float64 {
	inf := math.Inf(1)
	dp := pt.distances(inside, inf)
	db := pt.distances(blocked, inf)
	g := make([]float64, pt.m.NumNodes())
	for v, s := range pt.state {
		switch {
		case s == inside:
			g[v] = 1
		case s == free && !math.IsInf(dp[v], 1):
			if math.IsInf(db[v], 1) {
				g[v] = 1 // a pocket the part encloses moves with it
			} else {
				g[v] = db[v] / (dp[v] + db[v])
			}
		}
	}
	return g
}

// distances returns the shortest edge-path distance (m) of every corner
// node from the nodes in state from, through passable elements and free
// nodes, up to limit (nodes farther away keep +Inf).
func (pt *part) distances(from uint8, limit float64) []float64 {
	m := pt.m
	nv := m.NumVertices
	dist := make([]float64, nv)
	for i := range dist {
		dist[i] = math.Inf(1)
	}
	// Adjacency through passable elements, as a list of (node, node)
	// edges per node, built once.
	start := make([]int32, nv+1)
	nt := m.NumTriangles()
	for t := 0; t < nt; t++ {
		if !pt.pass[m.Region[t]] {
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
		if !pt.pass[m.Region[t]] {
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
		if pt.state[v] == from {
			dist[v] = 0
			heap.Push(h, item{int32(v), 0})
		}
	}
	for h.Len() > 0 {
		it := heap.Pop(h).(item)
		if it.d > dist[it.v] || it.d >= limit {
			continue
		}
		for _, u := range adj[start[it.v]:start[it.v+1]] {
			if pt.state[u] != free {
				continue
			}
			d := it.d + math.Hypot(m.X[u]-m.X[it.v], m.Y[u]-m.Y[it.v])
			if d < dist[u] {
				dist[u] = d
				heap.Push(h, item{u, d})
			}
		}
	}
	return dist
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
