package sparse

// Multilevel vertex-separator bisection for multilevelND (mlnd.go):
// heavy-edge coarsening, greedy growing on the coarsest graph, boundary
// Fiduccia-Mattheyses refinement of the edge cut while uncoarsening, then
// a minimum vertex cover of the cut edges and a separator refinement pass.

// mlGraph is one level of the multilevel hierarchy, in local numbering.
type mlGraph struct {
	n    int
	xadj []int32 // len n+1
	adj  []int32
	ewgt []int32 // edge weights, parallel to adj
	vwgt []int32 // vertex weights
	tvw  int     // total vertex weight (the same on every level)
	unit bool    // all weights are 1 (the finest level)
	wsum []int32 // edge weight at each vertex (unset when unit)
}

// mlLevel is a coarse graph with the map from the vertices of the next
// finer graph to its own, and its part labels.
type mlLevel struct {
	g     mlGraph
	cmap  []int32
	where []int8
}

// mlWork is one goroutine's scratch; buffers grow and are reused.
type mlWork struct {
	p      ndParams
	rng    uint64
	g0     mlGraph
	xadj0  []int32
	one    []int32
	lv     []*mlLevel
	where0 []int8
	best   []int8

	label, idx, queue []int32
	match, order      []int32
	htab              []int32
	id, ed, id2, ed2  []int32
	pos, pos2, lock   []int32 // pos, pos2 are -1 outside heaps
	bnd               []int32 // boundary candidates (see refine)
	inb               []int8  // 1 when in bnd
	stamp             int32
	moves, pulled     []int32
	mend              []int32
	heap              [2]mlHeap
}

// seed makes the random stream depend only on the subgraph's position,
// so the ordering is the same whatever the scheduling.
func (w *mlWork) seed(a, b uint64) {
	z := a*0x9e3779b97f4a7c15 + b*0xbf58476d1ce4e5b9 + 0x94d049bb133111eb
	z = (z ^ (z >> 30)) * 0xbf58476d1ce4e5b9
	z = (z ^ (z >> 27)) * 0x94d049bb133111eb
	w.rng = z ^ (z >> 31) | 1
}

// intn returns a pseudo-random number in [0, n) (xorshift64*).
func (w *mlWork) intn(n int) int {
	x := w.rng
	x ^= x >> 12
	x ^= x << 25
	x ^= x >> 27
	w.rng = x
	r := (x * 0x2545f4914f6cdd1d) >> 32
	return int((r * uint64(n)) >> 32)
}

// ones returns a slice of n ones.
func (w *mlWork) ones(n int) []int32 {
	if len(w.one) < n {
		w.one = make([]int32, n+n/4)
		for i := range w.one {
			w.one[i] = 1
		}
	}
	return w.one[:n]
}

func (w *mlWork) level(d int) *mlLevel {
	for len(w.lv) <= d {
		w.lv = append(w.lv, new(mlLevel))
	}
	return w.lv[d]
}

func (w *mlWork) nextStamp() int32 {
	w.stamp++
	return w.stamp
}

// bisect returns a vertex separator of the connected graph g: where[v] is
// 0 or 1 for the two parts and 2 for the separator.
func (w *mlWork) bisect(g *mlGraph) []int8 {
	depth := 0
	cur := g
	for cur.n > w.p.coarsenTo && depth < 50 {
		L := w.level(depth)
		w.coarsen(cur, L)
		depth++
		shrunk := L.g.n < cur.n*9/10
		cur = &L.g
		if !shrunk {
			break
		}
	}
	w.where0 = grow8(w.where0, g.n)
	where := w.where0
	if depth > 0 {
		L := w.lv[depth-1]
		L.where = grow8(L.where, L.g.n)
		where = L.where
	}
	w.initBisect(cur, where)
	for d := depth - 1; d >= 0; d-- {
		L := w.lv[d]
		fine, fw := g, w.where0
		if d > 0 {
			F := w.lv[d-1]
			F.where = grow8(F.where, F.g.n)
			fine, fw = &F.g, F.where
		}
		pw, cut := w.project(fine, fw, L)
		w.refine(fine, fw, pw, cut, w.p.passes)
	}
	w.cover(g, w.where0)
	w.nodeRefine(g, w.where0, w.p.passes)
	return w.where0
}

// maxPart is the largest part weight a bisection of g may leave.
func (w *mlWork) maxPart(g *mlGraph) int {
	mv := int32(0)
	for _, x := range g.vwgt[:g.n] {
		mv = max(mv, x)
	}
	return max(int(w.p.balance*float64(g.tvw)), (g.tvw+1)/2+int(mv))
}

// coarsen contracts a heavy-edge matching of g into L.g.
func (w *mlWork) coarsen(g *mlGraph, L *mlLevel) {
	n := g.n
	xadj, adj, ewgt, vwgt := g.xadj, g.adj, g.ewgt, g.vwgt
	match := grow32(w.match, n)
	w.match = match
	order := grow32(w.order, n)
	w.order = order
	for i := range match {
		match[i] = -1
		order[i] = int32(i)
	}
	switch w.p.visit {
	case MatchShuffled:
		for i := n - 1; i > 0; i-- {
			j := w.intn(i + 1)
			order[i], order[j] = order[j], order[i]
		}
	case MatchSwapped:
		for k := n / 8; k > 0; k-- {
			i, j := w.intn(n), w.intn(n)
			order[i], order[j] = order[j], order[i]
		}
	}
	maxvw := int32(max(2, 3*g.tvw/(2*w.p.coarsenTo)))
	if g.unit {
		// Unit weights: random matching (every edge is heaviest).
		for _, v := range order {
			if match[v] >= 0 {
				continue
			}
			best := v
			for _, u := range adj[xadj[v]:xadj[v+1]] {
				if match[u] < 0 {
					best = u
					break
				}
			}
			match[v] = best
			match[best] = v
		}
	} else {
		for _, v := range order {
			if match[v] >= 0 {
				continue
			}
			best, bw, vv := v, int32(-1), vwgt[v]
			for k := xadj[v]; k < xadj[v+1]; k++ {
				u := adj[k]
				if match[u] < 0 && ewgt[k] > bw && vv+vwgt[u] <= maxvw {
					best, bw = u, ewgt[k]
				}
			}
			match[v] = best
			match[best] = v
		}
	}
	cmap := grow32(L.cmap, n)
	L.cmap = cmap
	nc := int32(0)
	for v := int32(0); v < int32(n); v++ {
		if u := match[v]; u >= v {
			cmap[v] = nc
			cmap[u] = nc
			nc++
		}
	}
	cg := &L.g
	cg.n = int(nc)
	cg.tvw = g.tvw
	cg.unit = false
	cg.xadj = grow32(cg.xadj, int(nc)+1)
	cg.adj = grow32(cg.adj, int(xadj[n]))
	cg.ewgt = grow32(cg.ewgt, int(xadj[n]))
	cg.vwgt = grow32(cg.vwgt, int(nc))
	cg.wsum = grow32(cg.wsum, int(nc))
	cwsum := cg.wsum
	htab := grow32(w.htab, int(nc))
	w.htab = htab
	for i := range htab {
		htab[i] = -1
	}
	cxadj, cadj, cew, cvw := cg.xadj, cg.adj, cg.ewgt, cg.vwgt
	ne := int32(0)
	c := int32(0)
	cxadj[0] = 0
	for v := int32(0); v < int32(n); v++ {
		u := match[v]
		if u < v {
			continue
		}
		start := ne
		x := v
		for {
			// htab[y] is the slot of y in the list being built when it
			// is at least start (slots only grow, so older entries are
			// stale without any reset).
			for k := xadj[x]; k < xadj[x+1]; k++ {
				y := cmap[adj[k]]
				if y == c {
					continue
				}
				if h := htab[y]; h >= start {
					cew[h] += ewgt[k]
				} else {
					htab[y] = ne
					cadj[ne] = y
					cew[ne] = ewgt[k]
					ne++
				}
			}
			if x == u {
				break
			}
			x = u
		}
		ws := int32(0)
		for _, e := range cew[start:ne] {
			ws += e
		}
		cwsum[c] = ws
		cvw[c] = vwgt[v]
		if u != v {
			cvw[c] += vwgt[u]
		}
		c++
		cxadj[c] = ne
	}
	cg.adj = cadj[:ne]
	cg.ewgt = cew[:ne]
}

// initBisect bisects the coarsest graph by greedy graph growing from
// w.p.trials random starts, each refined, keeping the smallest cut.
func (w *mlWork) initBisect(g *mlGraph, where []int8) {
	n := g.n
	maxw := w.maxPart(g)
	w.best = grow8(w.best, n)
	w.id = grow32(w.id, n)
	w.ed = grow32(w.ed, n)
	w.pos = growNeg(w.pos, n)
	id, ed, pos := w.id, w.ed, w.pos
	best := -1
	for t := 0; t < w.p.trials; t++ {
		for v := 0; v < n; v++ {
			where[v] = 1
			ed[v] = 0
			pos[v] = -1
			s := int32(0)
			for k := g.xadj[v]; k < g.xadj[v+1]; k++ {
				s += g.ewgt[k]
			}
			id[v] = s
		}
		h := &w.heap[1]
		h.reset()
		w0 := 0
		target := g.tvw / 2
		scan := 0
		h.push(int32(w.intn(n)), 0, pos)
		for w0 < target {
			var v int32
			if len(h.vtx) > 0 {
				v = h.pop(pos)
			} else {
				for scan < n && where[scan] != 1 {
					scan++
				}
				if scan == n {
					break
				}
				v = int32(scan)
			}
			if w0+int(g.vwgt[v]) > maxw {
				continue
			}
			where[v] = 0
			w0 += int(g.vwgt[v])
			id[v], ed[v] = ed[v], id[v]
			for k := g.xadj[v]; k < g.xadj[v+1]; k++ {
				u := g.adj[k]
				if where[u] != 1 {
					id[u] += g.ewgt[k]
					ed[u] -= g.ewgt[k]
					continue
				}
				id[u] -= g.ewgt[k]
				ed[u] += g.ewgt[k]
				if pos[u] >= 0 {
					h.update(u, ed[u]-id[u], pos)
				} else {
					h.push(u, ed[u]-id[u], pos)
				}
			}
		}
		for _, v := range h.vtx {
			pos[v] = -1
		}
		h.reset()
		pw, cut := w.gains(g, where)
		cut = w.refine(g, where, pw, cut, w.p.initPasses)
		if best < 0 || cut < best {
			best = cut
			copy(w.best, where[:n])
		}
	}
	copy(where[:n], w.best)
	w.gains(g, where)
}
