package sparse

import (
	"fmt"
	"math"
	"runtime"
	"sync"
)

// Multilevel nested dissection: the driver (recursion, components, leaves,
// splitting a subgraph into its parts). The bisection itself is in
// mlnd_bisect.go.
//
// Storage. Every subgraph of the recursion owns a range [lo, lo+n) of the
// permutation and the same range of vertex slots, plus a contiguous range
// of adjacency entries starting at e0, in one of two buffers. A subgraph is
// split by writing its parts, one after another, into the same ranges of
// the other buffer; the parts' ranges are disjoint and lie inside the
// parent's, so the two halves of a dissection can be ordered concurrently
// without locks and the whole recursion allocates no graph storage after
// the start. Inside a subgraph vertices are numbered 0..n-1; vmap maps a
// slot to the original vertex.

// NDOptions tune NestedDissection, the multilevel nested dissection of
// this file. The zero value is the tuned default: a field left at zero
// takes the default given with it (the constants defaultND*), measured on
// the C-core and grid matrices of doc.go (Orderings). Any setting gives a
// valid permutation, and the same one whatever the scheduling or
// GOMAXPROCS; the settings trade ordering time against the factor's
// operations.
type NDOptions struct {
	// Leaf: subgraphs of at most Leaf vertices are ordered by
	// approximate minimum degree. Values below 1 mean defaultNDLeaf.
	Leaf int
	// LeafShare: leaves may also hold up to this fraction of the whole
	// graph's vertices, which bounds the depth of the dissection (and
	// its cost) on large graphs. 0 means defaultNDLeafShare; a negative
	// value removes the bound (leaves of Leaf vertices at every size).
	LeafShare float64
	// CoarsenTo: coarsening stops at this many vertices. Values below 1
	// mean defaultNDCoarsenTo.
	CoarsenTo int
	// Balance: the largest part weight a bisection may leave, as a
	// fraction of the subgraph's weight (half the weight plus the
	// heaviest vertex is always allowed). 0 means defaultNDBalance.
	Balance float64
	// Trials: greedy-growing starts for the initial bisection of the
	// coarsest graph. Values below 1 mean defaultNDTrials.
	Trials int
	// InitPasses: refinement passes after each greedy growing. 0 means
	// defaultNDInitPasses; a negative value means none.
	InitPasses int
	// Passes: refinement passes per level while uncoarsening, and
	// separator refinement passes. 0 means defaultNDPasses; a negative
	// value means none.
	Passes int
	// Parallel: a dissection whose two parts hold at least Parallel
	// vertices together orders them concurrently (when a helper
	// goroutine is idle). 0 means defaultNDParallel; a negative value
	// orders everything on the calling goroutine. The permutation does
	// not depend on it.
	Parallel int
	// Visit is the order in which the matching of the coarsening visits
	// vertices.
	Visit MatchOrder
}

// MatchOrder is the order in which the heavy-edge matching visits the
// vertices of a graph it coarsens.
type MatchOrder int

const (
	// MatchSwapped visits in natural order after n/8 random swaps (the
	// default).
	MatchSwapped MatchOrder = iota
	// MatchNatural visits in natural order (the breadth-first numbering
	// of multilevelND).
	MatchNatural
	// MatchShuffled visits in a random order.
	MatchShuffled
)

func (o MatchOrder) String() string {
	switch o {
	case MatchSwapped:
		return "swapped"
	case MatchNatural:
		return "natural"
	case MatchShuffled:
		return "shuffled"
	}
	return fmt.Sprintf("MatchOrder(%d)", int(o))
}

// Defaults of NDOptions.
const (
	// defaultNDLeaf: on the 100k C-core matrix leaves of 100 and 400
	// give 4.05e8 and 4.14e8 multiply-adds for 0.87 and 0.64 CPU-s of
	// ordering; reverse breadth-first leaves (cheaper) give 4.43e8 and
	// 5.87e8.
	defaultNDLeaf = 400
	// defaultNDLeafShare: on the 1M C-core matrix leaves of 400, 3000
	// and 10000 vertices took 5.1, 4.0 and 3.4 s of ordering for
	// 1.08e10, 1.12e10 and 1.20e10 multiply-adds (the numeric factor
	// 1.30, 1.35 and 1.52 s); on the 100k one 0.37, 0.26 and 0.22 s for
	// 4.1e8, 4.5e8 and 5.0e8 (0.093 to 0.096 s of factor). A share of
	// 1/100 (leaves of 1000 at 100k) makes the 316x316 grid's flops
	// 0.906 of AMD's, against 0.87 with 400; 1/256 keeps 100k as it was
	// and gives 3.85 s and 1.14e10 at 1M.
	defaultNDLeafShare = 1.0 / 256
	// defaultNDCoarsenTo: vertices of the coarsest graph (Karypis and
	// Kumar 1998 coarsen to about 100).
	defaultNDCoarsenTo = 120
	// defaultNDBalance: no part above 55 % of the weight.
	defaultNDBalance = 0.55
	// defaultNDTrials: greedy-growing starts.
	defaultNDTrials = 4
	// defaultNDInitPasses: refinement passes per start.
	defaultNDInitPasses = 2
	// defaultNDPasses: refinement passes per level.
	defaultNDPasses = 4
	// defaultNDParallel: vertices of a dissection whose halves are
	// ordered concurrently.
	defaultNDParallel = 20000
)

// ndParams are NDOptions with the defaults applied: every field is the
// value used.
type ndParams struct {
	leaf       int
	leafShare  float64
	coarsenTo  int
	balance    float64
	trials     int
	initPasses int
	passes     int
	parallel   int // math.MaxInt: never
	visit      MatchOrder
}

// params resolves o's zero and negative fields.
func (o NDOptions) params() ndParams {
	p := ndParams{
		leaf: o.Leaf, leafShare: o.LeafShare, coarsenTo: o.CoarsenTo, balance: o.Balance,
		trials: o.Trials, initPasses: o.InitPasses, passes: o.Passes, parallel: o.Parallel, visit: o.Visit,
	}
	if p.leaf < 1 {
		p.leaf = defaultNDLeaf
	}
	switch {
	case p.leafShare == 0:
		p.leafShare = defaultNDLeafShare
	case p.leafShare < 0:
		p.leafShare = 0
	}
	if p.coarsenTo < 1 {
		p.coarsenTo = defaultNDCoarsenTo
	}
	if p.balance == 0 {
		p.balance = defaultNDBalance
	}
	if p.trials < 1 {
		p.trials = defaultNDTrials
	}
	switch {
	case p.initPasses == 0:
		p.initPasses = defaultNDInitPasses
	case p.initPasses < 0:
		p.initPasses = 0
	}
	switch {
	case p.passes == 0:
		p.passes = defaultNDPasses
	case p.passes < 0:
		p.passes = 0
	}
	switch {
	case p.parallel == 0:
		p.parallel = defaultNDParallel
	case p.parallel < 0:
		p.parallel = math.MaxInt
	}
	return p
}

type mlnd struct {
	p       ndParams
	leafMax int        // largest subgraph ordered by minimum degree
	adj     [2][]int32 // local neighbour indices
	xend    [2][]int32 // end of a slot's adjacency (absolute offset)
	vmap    [2][]int32 // original vertex of a slot
	perm    []int32
	// spare holds the workspaces of idle helpers: a dissection hands
	// one half to a helper when one is free and orders both itself
	// otherwise, so at most GOMAXPROCS workspaces exist.
	spare chan *mlWork
}

// mlSub describes a subgraph: vertex slots and permutation positions
// [lo, lo+n), adjacency from e0 on, in buffer buf.
type mlSub struct {
	lo, n, e0 int
	buf       int
}

// multilevelND returns a nested dissection ordering of g with separators
// from multilevel graph bisection.
//
// G. Karypis and V. Kumar, "A fast and high quality multilevel scheme for
// partitioning irregular graphs", SIAM J. Sci. Comput. 20 (1998) 359-392:
// heavy-edge matching, greedy graph growing, boundary refinement after
// C. M. Fiduccia and R. M. Mattheyses, "A linear-time heuristic for
// improving network partitions", 19th Design Automation Conference (1982);
// vertex separators from the edge separator by a minimum vertex cover of
// the cut edges (A. Pothen and C.-J. Fan, "Computing the block triangular
// form of a sparse matrix", ACM TOMS 16 (1990)) refined by moving separator
// vertices into a part when that shrinks the separator.
func multilevelND(g *graph, o NDOptions) []int32 {
	n := g.n
	perm := make([]int32, n)
	if n == 0 {
		return perm
	}
	p := o.params()
	m := &mlnd{p: p, perm: perm, leafMax: max(p.leaf, int(p.leafShare*float64(n)))}
	for b := 0; b < 2; b++ {
		m.adj[b] = make([]int32, len(g.adj))
		m.xend[b] = make([]int32, n)
		m.vmap[b] = make([]int32, n)
	}
	// Renumber in breadth-first order: neighbours then sit close in
	// memory, on every level and in every subgraph (the split keeps the
	// relative order), which halves the time on meshes numbered at random.
	order, inv := m.vmap[0], m.xend[1]
	for i := range inv {
		inv[i] = -1
	}
	t := 0
	for r := 0; r < n; r++ {
		if inv[r] >= 0 {
			continue
		}
		inv[r] = int32(t)
		order[t] = int32(r)
		t++
		for h := t - 1; h < t; h++ {
			for _, u := range g.adj[g.ptr[order[h]]:g.ptr[order[h]+1]] {
				if inv[u] < 0 {
					inv[u] = int32(t)
					order[t] = u
					t++
				}
			}
		}
	}
	e := int32(0)
	for i, v := range order {
		for _, u := range g.adj[g.ptr[v]:g.ptr[v+1]] {
			m.adj[0][e] = inv[u]
			e++
		}
		m.xend[0][i] = e
	}
	helpers := runtime.GOMAXPROCS(0) - 1
	m.spare = make(chan *mlWork, helpers)
	for i := 0; i < helpers; i++ {
		m.spare <- &mlWork{p: p}
	}
	m.dissect(mlSub{lo: 0, n: n, e0: 0, buf: 0}, &mlWork{p: p})
	return perm
}

// view makes the subgraph s the current graph of w.
func (w *mlWork) view(m *mlnd, s mlSub) *mlGraph {
	w.xadj0 = grow32(w.xadj0, s.n+1)
	x := w.xadj0
	base := int32(s.e0)
	x[0] = 0
	for i, e := range m.xend[s.buf][s.lo : s.lo+s.n] {
		x[i+1] = e - base
	}
	ne := int(x[s.n])
	w.g0 = mlGraph{
		n: s.n, xadj: x, adj: m.adj[s.buf][s.e0 : s.e0+ne],
		ewgt: w.ones(ne), vwgt: w.ones(s.n), tvw: s.n, unit: true,
	}
	return &w.g0
}

// dissect orders subgraph s into perm[s.lo : s.lo+s.n].
func (m *mlnd) dissect(s mlSub, w *mlWork) {
	for s.n > 0 {
		g := w.view(m, s)
		vm := m.vmap[s.buf][s.lo : s.lo+s.n]
		if s.n <= m.leafMax {
			m.leaf(g, vm, s.lo)
			return
		}
		if nc := w.components(g); nc > 1 {
			m.components(s, g, vm, nc, w)
			return
		}
		w.seed(uint64(s.lo), uint64(s.n))
		where := w.bisect(g)
		label := grow32(w.label, s.n)
		w.label = label
		var cnt [3]int
		for v, p := range where {
			cnt[p]++
			label[v] = int32(p)
		}
		if cnt[0] == 0 || cnt[1] == 0 {
			// No useful separator (a dense graph): minimum degree.
			m.leaf(g, vm, s.lo)
			return
		}
		k := s.lo + cnt[0] + cnt[1]
		for v, p := range where {
			if p == 2 {
				m.perm[k] = vm[v]
				k++
				label[v] = -1
			}
		}
		parts := m.split(s, g, label, 2, w)
		a, b := parts[0], parts[1]
		if a.n+b.n >= m.p.parallel {
			select {
			case w2 := <-m.spare:
				var wg sync.WaitGroup
				wg.Add(1)
				go func() {
					defer wg.Done()
					m.dissect(b, w2)
					m.spare <- w2
				}()
				m.dissect(a, w)
				wg.Wait()
				return
			default:
			}
		}
		m.dissect(a, w)
		s = b
	}
}

// components orders a disconnected subgraph: components of more than
// m.leafMax vertices are dissected one by one, the small ones together by
// minimum degree. w.label holds the component of each vertex.
func (m *mlnd) components(s mlSub, g *mlGraph, vm []int32, nc int, w *mlWork) {
	size := make([]int, nc)
	for _, c := range w.label[:g.n] {
		size[c]++
	}
	id := make([]int32, nc)
	np := int32(0)
	small := int32(-1)
	for c, sz := range size {
		if sz > m.leafMax {
			id[c] = np
			np++
		} else {
			if small < 0 {
				small = np
				np++
			}
			id[c] = small
		}
	}
	label := w.label[:g.n]
	for v, c := range label {
		label[v] = id[c]
	}
	parts := m.split(s, g, label, int(np), w)
	for p, sub := range parts {
		if int32(p) == small {
			g := w.view(m, sub)
			m.leaf(g, m.vmap[sub.buf][sub.lo:sub.lo+sub.n], sub.lo)
			continue
		}
		m.dissect(sub, w)
	}
}

// leaf orders a small subgraph by approximate minimum degree.
func (m *mlnd) leaf(g *mlGraph, vm []int32, lo int) {
	h := &graph{n: g.n, ptr: make([]int, g.n+1), adj: g.adj}
	for i, x := range g.xadj[:g.n+1] {
		h.ptr[i] = int(x)
	}
	for k, v := range amdOrder(h) {
		m.perm[lo+k] = vm[v]
	}
}

// split writes the parts of subgraph s (label[v] in 0..np-1, or -1 for a
// vertex already numbered) into the other buffer, part after part in the
// order of their labels, each keeping the relative order of its vertices,
// and returns the parts.
func (m *mlnd) split(s mlSub, g *mlGraph, label []int32, np int, w *mlWork) []mlSub {
	n := g.n
	cnt := make([]int32, np)
	ecnt := make([]int, np)
	idx := grow32(w.idx, n)
	w.idx = idx
	xadj, adj := g.xadj, g.adj
	for v := 0; v < n; v++ {
		p := label[v]
		if p < 0 {
			continue
		}
		idx[v] = cnt[p]
		cnt[p]++
		d := 0
		for _, u := range adj[xadj[v]:xadj[v+1]] {
			if label[u] == p {
				d++
			}
		}
		ecnt[p] += d
	}
	parts := make([]mlSub, np)
	ep := make([]int32, np)
	lo, e0 := s.lo, s.e0
	for p := range parts {
		parts[p] = mlSub{lo: lo, n: int(cnt[p]), e0: e0, buf: 1 - s.buf}
		ep[p] = int32(e0)
		lo += int(cnt[p])
		e0 += ecnt[p]
	}
	dadj, dxend, dvmap := m.adj[1-s.buf], m.xend[1-s.buf], m.vmap[1-s.buf]
	vm := m.vmap[s.buf][s.lo : s.lo+n]
	for v := 0; v < n; v++ {
		p := label[v]
		if p < 0 {
			continue
		}
		e := ep[p]
		for _, u := range adj[xadj[v]:xadj[v+1]] {
			if label[u] == p {
				dadj[e] = idx[u]
				e++
			}
		}
		ep[p] = e
		slot := parts[p].lo + int(idx[v])
		dxend[slot] = e
		dvmap[slot] = vm[v]
	}
	return parts
}

// components labels the connected components of g in w.label and returns
// their number.
func (w *mlWork) components(g *mlGraph) int {
	n := g.n
	label := grow32(w.label, n)
	w.label = label
	for i := range label {
		label[i] = -1
	}
	q := grow32(w.queue, n)
	w.queue = q
	nc := int32(0)
	for r := 0; r < n; r++ {
		if label[r] >= 0 {
			continue
		}
		label[r] = nc
		q[0] = int32(r)
		t := 1
		for h := 0; h < t; h++ {
			v := q[h]
			for _, u := range g.adj[g.xadj[v]:g.xadj[v+1]] {
				if label[u] < 0 {
					label[u] = nc
					q[t] = u
					t++
				}
			}
		}
		nc++
	}
	return int(nc)
}

// grow32 returns s resized to n, reallocated (zeroed) when too small.
func grow32(s []int32, n int) []int32 {
	if cap(s) < n {
		return make([]int32, n, n+n/4)
	}
	return s[:n]
}

func grow8(s []int8, n int) []int8 {
	if cap(s) < n {
		return make([]int8, n, n+n/4)
	}
	return s[:n]
}

// mlHeap is a binary max-heap of vertices keyed by gain; pos[v] is v's
// index in the heap or -1 (pos is owned by the caller, shared by heaps
// that never hold the same vertex).
type mlHeap struct {
	key []int32
	vtx []int32
}

func (h *mlHeap) reset() {
	h.key = h.key[:0]
	h.vtx = h.vtx[:0]
}

func (h *mlHeap) push(v, k int32, pos []int32) {
	h.key = append(h.key, k)
	h.vtx = append(h.vtx, v)
	i := int32(len(h.vtx) - 1)
	pos[v] = i
	h.up(i, pos)
}

func (h *mlHeap) pop(pos []int32) int32 {
	v := h.vtx[0]
	h.remove(v, pos)
	return v
}

func (h *mlHeap) remove(v int32, pos []int32) {
	i := pos[v]
	last := int32(len(h.vtx) - 1)
	pos[v] = -1
	if i != last {
		h.key[i], h.vtx[i] = h.key[last], h.vtx[last]
		pos[h.vtx[i]] = i
	}
	h.key = h.key[:last]
	h.vtx = h.vtx[:last]
	if i != last {
		h.up(i, pos)
		h.down(pos[h.vtx[i]], pos)
	}
}

func (h *mlHeap) update(v, k int32, pos []int32) {
	i := pos[v]
	old := h.key[i]
	h.key[i] = k
	if k > old {
		h.up(i, pos)
	} else {
		h.down(i, pos)
	}
}

func (h *mlHeap) up(i int32, pos []int32) {
	k, v := h.key[i], h.vtx[i]
	for i > 0 {
		p := (i - 1) / 2
		if h.key[p] >= k {
			break
		}
		h.key[i], h.vtx[i] = h.key[p], h.vtx[p]
		pos[h.vtx[i]] = i
		i = p
	}
	h.key[i], h.vtx[i] = k, v
	pos[v] = i
}

func (h *mlHeap) down(i int32, pos []int32) {
	n := int32(len(h.vtx))
	k, v := h.key[i], h.vtx[i]
	for {
		c := 2*i + 1
		if c >= n {
			break
		}
		if c+1 < n && h.key[c+1] > h.key[c] {
			c++
		}
		if h.key[c] <= k {
			break
		}
		h.key[i], h.vtx[i] = h.key[c], h.vtx[c]
		pos[h.vtx[i]] = i
		i = c
	}
	h.key[i], h.vtx[i] = k, v
	pos[v] = i
}

// cover turns the edge bisection where of g (unit vertex weights) into a
// vertex separator: a minimum vertex cover of the bipartite graph of cut
// edges (maximum matching by Hopcroft-Karp, cover by Konig's theorem)
// gets label 2. J. E. Hopcroft and R. M. Karp, "An n^5/2 algorithm for
// maximum matchings in bipartite graphs", SIAM J. Comput. 2 (1973).
func (w *mlWork) cover(g *mlGraph, where []int8) {
	n := g.n
	xadj, adj := g.xadj, g.adj
	// Left: boundary vertices of part 0; mate and dist per vertex.
	left := w.moves[:0]
	nb := [2]int{}
	for v := int32(0); v < int32(n); v++ {
		me := where[v]
		for _, u := range adj[xadj[v]:xadj[v+1]] {
			if where[u] != me {
				nb[me]++
				if me == 0 {
					left = append(left, v)
				}
				break
			}
		}
	}
	w.moves = left
	if len(left) == 0 {
		return
	}
	mate := grow32(w.match, n)
	w.match = mate
	dist := grow32(w.order, n)
	w.order = dist
	for i := range mate {
		mate[i] = -1
	}
	const inf = int32(1 << 30)
	q := grow32(w.queue, n)
	w.queue = q
	// Greedy start, then phases of shortest augmenting paths.
	for _, v := range left {
		for _, u := range adj[xadj[v]:xadj[v+1]] {
			if where[u] == 1 && mate[u] < 0 {
				mate[u], mate[v] = v, u
				break
			}
		}
	}
	var dfs func(v int32) bool
	dfs = func(v int32) bool {
		for _, u := range adj[xadj[v]:xadj[v+1]] {
			if where[u] != 1 {
				continue
			}
			m := mate[u]
			if m < 0 || (dist[m] == dist[v]+1 && dfs(m)) {
				mate[u], mate[v] = v, u
				return true
			}
		}
		dist[v] = inf
		return false
	}
	for {
		t := 0
		for _, v := range left {
			if mate[v] < 0 {
				dist[v] = 0
				q[t] = v
				t++
			} else {
				dist[v] = inf
			}
		}
		found := false
		for h := 0; h < t; h++ {
			v := q[h]
			for _, u := range adj[xadj[v]:xadj[v+1]] {
				if where[u] != 1 {
					continue
				}
				m := mate[u]
				if m < 0 {
					found = true
				} else if dist[m] == inf {
					dist[m] = dist[v] + 1
					q[t] = m
					t++
				}
			}
		}
		if !found {
			break
		}
		aug := false
		for _, v := range left {
			if mate[v] < 0 && dfs(v) {
				aug = true
			}
		}
		if !aug {
			break
		}
	}
	// Konig: Z = vertices reachable from free left vertices by alternating
	// paths; the cover is (left \ Z) + (right ∩ Z). dist marks Z with -1.
	t := 0
	for _, v := range left {
		for _, u := range adj[xadj[v]:xadj[v+1]] {
			dist[u] = 0
		}
	}
	for _, v := range left {
		dist[v] = 0
		if mate[v] < 0 {
			dist[v] = -1
			q[t] = v
			t++
		}
	}
	for h := 0; h < t; h++ {
		v := q[h]
		for _, u := range adj[xadj[v]:xadj[v+1]] {
			if where[u] != 1 || dist[u] == -1 {
				continue
			}
			dist[u] = -1
			if m := mate[u]; m >= 0 && dist[m] != -1 {
				dist[m] = -1
				q[t] = m
				t++
			}
		}
	}
	for _, v := range left {
		for _, u := range adj[xadj[v]:xadj[v+1]] {
			if where[u] == 1 && dist[u] == -1 {
				where[u] = 3 // right ∩ Z, marked apart until left is done
			}
		}
	}
	for _, v := range left {
		if dist[v] != -1 {
			where[v] = 2
		}
	}
	for v := range where[:n] {
		if where[v] == 3 {
			where[v] = 2
		}
	}
}
