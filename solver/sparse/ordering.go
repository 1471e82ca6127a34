package sparse

import (
	"fmt"
	"sync"
	"sync/atomic"
)

// Ordering selects the fill-reducing symmetric permutation used by
// Cholesky.
type Ordering int

const (
	// DefaultOrdering picks the ordering measured best on 2D
	// finite-element matrices: AMD below defaultAMDBelow unknowns,
	// NestedDissection above (see doc.go for the figures).
	DefaultOrdering Ordering = iota
	// Natural keeps the caller's numbering.
	Natural
	// NestedDissection recursively removes vertex separators found from
	// breadth-first level structures (George 1973).
	NestedDissection
	// AMD is approximate minimum degree (Amestoy, Davis, Duff 1996).
	AMD
)

func (o Ordering) String() string {
	switch o {
	case DefaultOrdering:
		return "default"
	case Natural:
		return "natural"
	case NestedDissection:
		return "nested-dissection"
	case AMD:
		return "amd"
	}
	return fmt.Sprintf("Ordering(%d)", int(o))
}

// Order returns a fill-reducing permutation of the symmetric pattern of a:
// perm[k] is the original index of the row and column placed k-th. Values
// are ignored. It panics on an unknown ordering.
func Order(a *CSR, o Ordering) []int32 {
	if o == DefaultOrdering {
		o = NestedDissection
		if a.N < defaultAMDBelow {
			o = AMD
		}
	}
	switch o {
	case Natural:
		p := make([]int32, a.N)
		for i := range p {
			p[i] = int32(i)
		}
		return p
	case NestedDissection:
		return multilevelND(newGraph(a))
	case AMD:
		return amdOrder(newGraph(a))
	}
	panic("sparse: unknown ordering")
}

// IsPermutation reports whether p holds each of 0..len(p)-1 exactly once.
func IsPermutation(p []int32) bool {
	seen := make([]bool, len(p))
	for _, v := range p {
		if v < 0 || int(v) >= len(p) || seen[v] {
			return false
		}
		seen[v] = true
	}
	return true
}

// graph is an undirected adjacency structure without self loops.
type graph struct {
	n   int
	ptr []int
	adj []int32
}

// newGraph returns the adjacency of the symmetric pattern of a (the union
// of the pattern and its transpose), without the diagonal.
func newGraph(a *CSR) *graph {
	n := a.N
	g := &graph{n: n, ptr: make([]int, n+1)}
	// Use the pattern directly when it is structurally symmetric,
	// otherwise the union of the pattern and its transpose.
	sym := a.IsStructurallySymmetric()
	if !sym {
		t := NewTriplet(n, 2*a.NNZ())
		for i := 0; i < n; i++ {
			for k := a.RowPtr[i]; k < a.RowPtr[i+1]; k++ {
				t.Add(i, int(a.Col[k]), 0)
				t.Add(int(a.Col[k]), i, 0)
			}
		}
		a = t.ToCSR()
	}
	for i := 0; i < n; i++ {
		c := 0
		for k := a.RowPtr[i]; k < a.RowPtr[i+1]; k++ {
			if int(a.Col[k]) != i {
				c++
			}
		}
		g.ptr[i+1] = g.ptr[i] + c
	}
	g.adj = make([]int32, g.ptr[n])
	p := 0
	for i := 0; i < n; i++ {
		for k := a.RowPtr[i]; k < a.RowPtr[i+1]; k++ {
			if int(a.Col[k]) != i {
				g.adj[p] = a.Col[k]
				p++
			}
		}
	}
	return g
}

// defaultAMDBelow is the size under which DefaultOrdering is AMD. On the
// jittered P1 grids of bench_test.go AMD needs fewer flops at 10k unknowns
// (1.54e7 against 1.91e7) and nested dissection fewer at 100k (5.3e8
// against 6.7e8) and 1M (1.63e10 against 2.18e10).
const defaultAMDBelow = 30000

// ndLeaf is the subgraph size below which nested dissection stops and
// orders the piece by reverse breadth-first search.
const ndLeaf = 16

// ndHintIters is the number of pseudo-peripheral iterations on a half,
// whose start vertex is already far from the separator.
var ndHintIters = 1

// ndCheapBelow is the subgraph size below which the start vertex handed
// down from the parent is used without further pseudo-peripheral search.
var ndCheapBelow = 5000

// ndParallel is the subgraph size above which the two halves of a
// dissection are ordered concurrently.
const ndParallel = 50000

// nestedDissection orders g by recursive vertex separators taken from the
// middle of a breadth-first level structure rooted at a pseudo-peripheral
// vertex. Separator vertices are numbered after both halves.
//
// A. George, "Nested dissection of a regular finite element mesh", SIAM J.
// Numer. Anal. 10 (1973); the level-structure separator and the
// pseudo-peripheral vertex search follow A. George and J. W. H. Liu,
// "Computer Solution of Large Sparse Positive Definite Systems", 1981,
// chapters 4 and 8.
func nestedDissection(g *graph) []int32 {
	n := g.n
	perm := make([]int32, n)
	verts := make([]int32, n)
	for i := range verts {
		verts[i] = int32(i)
	}
	nd := &ndState{g: g, perm: perm, vx: make([]ndVertex, n)}
	nd.nextID.Store(0)
	ws := nd.newWork()
	if n > 0 {
		nd.dissect(verts, 0, 2, 0, n, nd.newID(verts), ws)
	}
	return perm
}

type ndState struct {
	g        *graph
	perm     []int32
	vx       []ndVertex
	nextID   atomic.Int32
	nextMark atomic.Int32
}

// ndVertex keeps a vertex's search state in one place (one cache line
// touched per visit): the label of the subgraph it belongs to (0 once
// numbered), the mark of the last search that reached it, and its level in
// that search. Concurrent dissections own disjoint vertex sets and draw
// unique marks from nextMark.
type ndVertex struct {
	part, stamp, level int32
}

// ndWork is per-goroutine scratch: the current search mark and queue.
type ndWork struct {
	mark  int32
	queue []int32
}

func (nd *ndState) newWork() *ndWork {
	return &ndWork{}
}

func (nd *ndState) newID(verts []int32) int32 {
	id := nd.nextID.Add(1)
	for _, v := range verts {
		nd.vx[v].part = id
	}
	return id
}

// bfs runs a breadth-first search inside subgraph id from root and returns
// the visit order (in ws.queue) and the number of levels.
func (nd *ndState) bfs(root, id int32, ws *ndWork) ([]int32, int) {
	ws.mark = nd.nextMark.Add(1)
	g := nd.g
	q := ws.queue[:0]
	q = append(q, root)
	nd.vx[root].stamp = ws.mark
	nd.vx[root].level = 0
	depth := int32(0)
	for h := 0; h < len(q); h++ {
		v := q[h]
		lv := nd.vx[v].level
		depth = lv
		for _, u := range g.adj[g.ptr[v]:g.ptr[v+1]] {
			if nd.vx[u].part == id && nd.vx[u].stamp != ws.mark {
				nd.vx[u].stamp = ws.mark
				nd.vx[u].level = lv + 1
				q = append(q, u)
			}
		}
	}
	ws.queue = q
	return q, int(depth) + 1
}

// pseudoPeripheral returns a vertex of large eccentricity in subgraph id
// (George and Liu 1979 iteration, minimum-degree vertex of the last level).
func (nd *ndState) pseudoPeripheral(start int32, iters int, id int32, ws *ndWork) int32 {
	g := nd.g
	root := start
	_, depth := nd.bfs(root, id, ws)
	for it := 0; it < iters; it++ {
		q := ws.queue
		// Pick the minimum-degree vertex of the deepest level.
		best, bestDeg := int32(-1), 1<<30
		for k := len(q) - 1; k >= 0 && nd.vx[q[k]].level == int32(depth-1); k-- {
			v := q[k]
			if d := g.ptr[v+1] - g.ptr[v]; d < bestDeg {
				best, bestDeg = v, d
			}
		}
		_, d2 := nd.bfs(best, id, ws)
		if d2 <= depth {
			return best // as eccentric as root; ws holds its levels
		}
		root, depth = best, d2
	}
	return root
}

// dissect orders verts (all labelled id) into perm[lo:hi].
func (nd *ndState) dissect(verts []int32, start int32, iters int, lo, hi int, id int32, ws *ndWork) {
	for {
		if len(verts) <= ndLeaf {
			nd.leaf(verts, lo, id, ws)
			return
		}
		if len(verts) < ndCheapBelow {
			iters = 0
		}
		nd.pseudoPeripheral(start, iters, id, ws)
		q := ws.queue
		if len(q) < len(verts) {
			// Disconnected: split off the component of root; no separator.
			comp := append([]int32(nil), q...)
			rest := make([]int32, 0, len(verts)-len(comp))
			for _, v := range verts {
				if nd.vx[v].stamp != ws.mark {
					rest = append(rest, v)
				}
			}
			idA := nd.newID(comp)
			idB := nd.newID(rest)
			nd.dissect(comp, comp[0], ndHintIters, lo, lo+len(comp), idA, ws)
			verts, start, iters, lo, id = rest, rest[0], 2, lo+len(comp), idB
			continue
		}
		depth := int(nd.vx[q[len(q)-1]].level) + 1
		if depth < 3 {
			nd.leaf(verts, lo, id, ws)
			return
		}
		// Level sizes and the level splitting the vertices most evenly
		// while keeping the separator small.
		cnt := make([]int, depth)
		for _, v := range q {
			cnt[nd.vx[v].level]++
		}
		best, bestScore := -1, 0.0
		below := 0
		nv := float64(len(q))
		for L := 0; L < depth; L++ {
			if L >= 1 && L < depth-1 {
				fa := float64(below) / nv
				fb := float64(len(q)-below-cnt[L]) / nv
				if fa >= 0.3 && fb >= 0.3 {
					// Separator size times an imbalance penalty.
					score := float64(cnt[L]) * (1 + 4*(fa-fb)*(fa-fb))
					if best < 0 || score < bestScore {
						best, bestScore = L, score
					}
				}
			}
			below += cnt[L]
		}
		if best < 0 {
			below = 0
			for L := 0; L < depth; L++ {
				if below+cnt[L] > len(q)/2 {
					best = L
					break
				}
				below += cnt[L]
			}
			if best == 0 {
				best = 1
			}
			if best >= depth-1 {
				best = depth - 2
			}
		}
		g := nd.g
		m := int32(best)
		a := make([]int32, 0, len(q)/2+cnt[best])
		b := make([]int32, 0, len(q)/2)
		s := make([]int32, 0, cnt[best])
		for _, v := range q {
			lv := nd.vx[v].level
			switch {
			case lv < m:
				a = append(a, v)
			case lv > m:
				b = append(b, v)
			default:
				// Keep only separator vertices touching the far side.
				touch := false
				for _, u := range g.adj[g.ptr[v]:g.ptr[v+1]] {
					if nd.vx[u].part == id && nd.vx[u].stamp == ws.mark && nd.vx[u].level == m+1 {
						touch = true
						break
					}
				}
				if touch {
					s = append(s, v)
				} else {
					a = append(a, v)
				}
			}
		}
		// The root (level 0) lies in a and the last vertex reached in b:
		// both are far from the separator, good starts for the halves.
		aStart, bStart := q[0], q[len(q)-1]
		// Separator last.
		sLo := hi - len(s)
		copy(nd.perm[sLo:hi], s)
		for _, v := range s {
			nd.vx[v].part = 0
		}
		idA := nd.newID(a)
		idB := nd.newID(b)
		if len(a)+len(b) >= ndParallel {
			var wg sync.WaitGroup
			wg.Add(1)
			go func() {
				defer wg.Done()
				nd.dissect(b, bStart, ndHintIters, lo+len(a), sLo, idB, nd.newWork())
			}()
			nd.dissect(a, aStart, ndHintIters, lo, lo+len(a), idA, ws)
			wg.Wait()
			return
		}
		nd.dissect(a, aStart, ndHintIters, lo, lo+len(a), idA, ws)
		verts, start, iters, lo, hi, id = b, bStart, ndHintIters, lo+len(a), sLo, idB
	}
}

// leaf numbers a small subgraph in reverse breadth-first order, which keeps
// its profile small (the reverse Cuthill-McKee idea: A. George and J. W. H.
// Liu 1981, chapter 4). Ordering leaves by minimum degree instead saved
// about 6 % of nnz(L) and 1 % of the flops on the 1M grid but cost nearly
// a second of analysis, so leaves stay cheap.
func (nd *ndState) leaf(verts []int32, lo int, id int32, ws *ndWork) {
	k := lo + len(verts)
	ws.mark = nd.nextMark.Add(1)
	mark := ws.mark
	for _, s := range verts {
		if nd.vx[s].stamp == mark {
			continue
		}
		q := ws.queue[:0]
		q = append(q, s)
		nd.vx[s].stamp = mark
		for h := 0; h < len(q); h++ {
			v := q[h]
			for _, u := range nd.g.adj[nd.g.ptr[v]:nd.g.ptr[v+1]] {
				if x := &nd.vx[u]; x.part == id && x.stamp != mark {
					x.stamp = mark
					q = append(q, u)
				}
			}
		}
		for _, v := range q {
			k--
			nd.perm[k] = v
		}
		ws.queue = q
	}
	for _, v := range verts {
		nd.vx[v].part = 0
	}
}
