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
	for cur.n > mlCoarsenTo && depth < 50 {
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
		w.refine(fine, fw, pw, cut, mlPasses)
	}
	w.cover(g, w.where0)
	w.nodeRefine(g, w.where0, mlPasses)
	return w.where0
}

// maxPart is the largest part weight a bisection of g may leave.
func maxPart(g *mlGraph) int {
	mv := int32(0)
	for _, x := range g.vwgt[:g.n] {
		mv = max(mv, x)
	}
	return max(int(mlBalance*float64(g.tvw)), (g.tvw+1)/2+int(mv))
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
	switch mlShuffle {
	case 1:
		for i := n - 1; i > 0; i-- {
			j := w.intn(i + 1)
			order[i], order[j] = order[j], order[i]
		}
	case 2:
		for k := n / 8; k > 0; k-- {
			i, j := w.intn(n), w.intn(n)
			order[i], order[j] = order[j], order[i]
		}
	}
	maxvw := int32(max(2, 3*g.tvw/(2*mlCoarsenTo)))
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
// mlTrials random starts, each refined, keeping the smallest cut.
func (w *mlWork) initBisect(g *mlGraph, where []int8) {
	n := g.n
	maxw := maxPart(g)
	w.best = grow8(w.best, n)
	w.id = grow32(w.id, n)
	w.ed = grow32(w.ed, n)
	w.pos = growNeg(w.pos, n)
	id, ed, pos := w.id, w.ed, w.pos
	best := -1
	for t := 0; t < mlTrials; t++ {
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
		cut = w.refine(g, where, pw, cut, mlInitPasses)
		if best < 0 || cut < best {
			best = cut
			copy(w.best, where[:n])
		}
	}
	copy(where[:n], w.best)
	w.gains(g, where)
}

// gains sets w.id and w.ed, each vertex's edge weight to its own and to
// the other part, and returns the part weights and the cut.
func (w *mlWork) gains(g *mlGraph, where []int8) (pw [2]int, cut int) {
	n := g.n
	xadj, adj, ewgt, vwgt := g.xadj, g.adj, g.ewgt, g.vwgt
	w.id = grow32(w.id, n)
	w.ed = grow32(w.ed, n)
	id, ed := w.id, w.ed
	for v := 0; v < n; v++ {
		me := where[v]
		a, b := int32(0), int32(0)
		for k := xadj[v]; k < xadj[v+1]; k++ {
			if where[adj[k]] == me {
				a += ewgt[k]
			} else {
				b += ewgt[k]
			}
		}
		id[v], ed[v] = a, b
		cut += int(b)
		pw[me] += int(vwgt[v])
	}
	w.setBoundary(n)
	return pw, cut / 2
}

// setBoundary makes w.bnd the vertices of 0..n-1 with w.ed > 0.
func (w *mlWork) setBoundary(n int) {
	w.inb = grow8(w.inb, n)
	w.bnd = w.bnd[:0]
	for v, e := range w.ed[:n] {
		w.inb[v] = 0
		if e > 0 {
			w.inb[v] = 1
			w.bnd = append(w.bnd, int32(v))
		}
	}
}

// project carries the bisection of the coarse graph L.g (with w.id and
// w.ed set for it) to the finer graph fine, setting w.id and w.ed for
// fine: a vertex whose coarse vertex had no edge to the other part has
// none either, so only the coarse boundary is scanned. The part weights
// and the cut are those of the coarse bisection.
func (w *mlWork) project(fine *mlGraph, fw []int8, L *mlLevel) (pw [2]int, cut int) {
	n := fine.n
	xadj, adj, ewgt, vwgt := fine.xadj, fine.adj, fine.ewgt, fine.vwgt
	ced := w.ed
	w.id2 = grow32(w.id2, n)
	w.ed2 = grow32(w.ed2, n)
	id, ed := w.id2, w.ed2
	cw := L.where
	for v, c := range L.cmap[:n] {
		me := cw[c]
		fw[v] = me
		pw[me] += int(vwgt[v])
		if ced[c] == 0 {
			ed[v] = 0
			if fine.unit {
				id[v] = xadj[v+1] - xadj[v]
			} else {
				id[v] = fine.wsum[v]
			}
			continue
		}
		a, b := int32(0), int32(0)
		for k := xadj[v]; k < xadj[v+1]; k++ {
			if cw[L.cmap[adj[k]]] == me {
				a += ewgt[k]
			} else {
				b += ewgt[k]
			}
		}
		id[v], ed[v] = a, b
		cut += int(b)
	}
	w.id, w.id2 = w.id2, w.id
	w.ed, w.ed2 = w.ed2, w.ed
	w.setBoundary(n)
	return pw, cut / 2
}

// refine improves the edge cut of the bisection where of g by passes of
// boundary Fiduccia-Mattheyses moves under the balance bound maxPart, and
// returns the cut. On entry w.id and w.ed hold each vertex's edge weight
// to its own and to the other part (see gains), and pw and cut the part
// weights and the cut; w.id and w.ed are kept up to date.
func (w *mlWork) refine(g *mlGraph, where []int8, pw [2]int, cut, passes int) int {
	n := g.n
	xadj, adj, ewgt, vwgt := g.xadj, g.adj, g.ewgt, g.vwgt
	maxw := maxPart(g)
	w.pos = growNeg(w.pos, n)
	w.lock = grow32(w.lock, n)
	id, ed, pos, lock := w.id, w.ed, w.pos, w.lock
	inb := w.inb
	limit := min(max(n/100, 20), 150)
	for pass := 0; pass < passes; pass++ {
		stamp := w.nextStamp()
		h := &w.heap
		h[0].reset()
		h[1].reset()
		// w.bnd holds every vertex with an external edge (and maybe
		// others, dropped here), each once.
		k := 0
		for _, v := range w.bnd {
			if ed[v] > 0 {
				w.bnd[k] = v
				k++
				h[where[v]].push(v, ed[v]-id[v], pos)
			} else {
				inb[v] = 0
			}
		}
		w.bnd = w.bnd[:k]
		moves := w.moves[:0]
		startCut := cut
		bestCut, bestLen := cut, 0
		bestOver, bestDiff := over2(pw, maxw)
		for {
			from := -1
			var gain int32
			for side := 0; side < 2; side++ {
				hs := &h[side]
				if len(hs.vtx) == 0 {
					continue
				}
				v := hs.vtx[0]
				to := 1 - side
				vw := int(vwgt[v])
				if pw[to]+vw > maxw && !(pw[side] > maxw && pw[to]+vw < pw[side]) {
					continue
				}
				k := hs.key[0]
				if from < 0 || k > gain || (k == gain && pw[side] > pw[from]) {
					from, gain = side, k
				}
			}
			if from < 0 {
				break
			}
			v := h[from].pop(pos)
			to := int8(1 - from)
			cut -= int(gain)
			pw[from] -= int(vwgt[v])
			pw[to] += int(vwgt[v])
			where[v] = to
			id[v], ed[v] = ed[v], id[v]
			lock[v] = stamp
			if inb[v] == 0 {
				inb[v] = 1
				w.bnd = append(w.bnd, v)
			}
			for k := xadj[v]; k < xadj[v+1]; k++ {
				u := adj[k]
				if where[u] == to {
					id[u] += ewgt[k]
					ed[u] -= ewgt[k]
				} else {
					id[u] -= ewgt[k]
					ed[u] += ewgt[k]
					if inb[u] == 0 {
						inb[u] = 1
						w.bnd = append(w.bnd, u)
					}
				}
				if lock[u] == stamp {
					continue
				}
				hu := &h[where[u]]
				switch {
				case pos[u] >= 0 && ed[u] > 0:
					hu.update(u, ed[u]-id[u], pos)
				case pos[u] >= 0:
					hu.remove(u, pos)
				case ed[u] > 0:
					hu.push(u, ed[u]-id[u], pos)
				}
			}
			moves = append(moves, v)
			o, d := over2(pw, maxw)
			if o < bestOver || (o == bestOver && (cut < bestCut || (cut == bestCut && d < bestDiff))) {
				bestOver, bestCut, bestDiff, bestLen = o, cut, d, len(moves)
			} else if len(moves)-bestLen > limit {
				break
			}
		}
		for s := 0; s < 2; s++ {
			for _, v := range h[s].vtx {
				pos[v] = -1
			}
			h[s].reset()
		}
		for i := len(moves) - 1; i >= bestLen; i-- {
			v := moves[i]
			to := 1 - where[v]
			pw[1-to] -= int(vwgt[v])
			pw[to] += int(vwgt[v])
			cut -= int(ed[v] - id[v])
			where[v] = to
			id[v], ed[v] = ed[v], id[v]
			for k := xadj[v]; k < xadj[v+1]; k++ {
				if u := adj[k]; where[u] == to {
					id[u] += ewgt[k]
					ed[u] -= ewgt[k]
				} else {
					id[u] -= ewgt[k]
					ed[u] += ewgt[k]
					if inb[u] == 0 {
						inb[u] = 1
						w.bnd = append(w.bnd, u)
					}
				}
			}
		}
		w.moves = moves
		if cut >= startCut && bestLen == 0 {
			break
		}
	}
	return cut
}

// over2 returns how far the heavier part exceeds maxw (0 when within) and
// the weight difference of the parts.
func over2(pw [2]int, maxw int) (int, int) {
	hi, lo := max(pw[0], pw[1]), min(pw[0], pw[1])
	return max(0, hi-maxw), hi - lo
}

// nodeRefine improves the vertex separator (label 2) of where by passes of
// Fiduccia-Mattheyses moves of separator vertices into a part: moving s
// into part X pulls its neighbours in the other part into the separator,
// so the gain is w(s) minus their weight. The largest part stays within
// maxPart(g), or does not grow if it is already beyond.
func (w *mlWork) nodeRefine(g *mlGraph, where []int8, passes int) {
	n := g.n
	xadj, adj, vwgt := g.xadj, g.adj, g.vwgt
	maxw := maxPart(g)
	w.id = grow32(w.id, n)
	w.ed = grow32(w.ed, n)
	w.pos = growNeg(w.pos, n)
	w.pos2 = growNeg(w.pos2, n)
	w.lock = grow32(w.lock, n)
	gain := [2][]int32{w.id, w.ed}
	pos := [2][]int32{w.pos, w.pos2}
	lock := w.lock
	var pw [3]int
	for v := 0; v < n; v++ {
		pw[where[v]] += int(vwgt[v])
		pos[0][v], pos[1][v] = -1, -1
	}
	limit := min(max(n/100, 20), 150)
	h := &w.heap
	for pass := 0; pass < passes; pass++ {
		stamp := w.nextStamp()
		h[0].reset()
		h[1].reset()
		for s := int32(0); s < int32(n); s++ {
			if where[s] != 2 {
				continue
			}
			g0, g1 := vwgt[s], vwgt[s]
			for _, u := range adj[xadj[s]:xadj[s+1]] {
				switch where[u] {
				case 1:
					g0 -= vwgt[u]
				case 0:
					g1 -= vwgt[u]
				}
			}
			gain[0][s], gain[1][s] = g0, g1
			h[0].push(s, g0, pos[0])
			h[1].push(s, g1, pos[1])
		}
		moves, pulled, mend := w.moves[:0], w.pulled[:0], w.mend[:0]
		startSep := pw[2]
		bestSep, bestLen := pw[2], 0
		bestOver, bestDiff := over2([2]int{pw[0], pw[1]}, maxw)
		for {
			x := -1
			var gx int32
			for side := 0; side < 2; side++ {
				hs := &h[side]
				if len(hs.vtx) == 0 {
					continue
				}
				s := hs.vtx[0]
				if pw[side]+int(vwgt[s]) > maxw && pw[side] >= pw[1-side] {
					continue
				}
				k := hs.key[0]
				if x < 0 || k > gx || (k == gx && pw[side] < pw[x]) {
					x, gx = side, k
				}
			}
			if x < 0 {
				break
			}
			s := h[x].pop(pos[x])
			h[1-x].remove(s, pos[1-x])
			X, Y := int8(x), int8(1-x)
			where[s] = X
			pw[2] -= int(vwgt[s])
			pw[X] += int(vwgt[s])
			lock[s] = stamp
			for _, u := range adj[xadj[s]:xadj[s+1]] {
				if where[u] == 2 && lock[u] != stamp {
					gain[Y][u] -= vwgt[s]
					h[Y].update(u, gain[Y][u], pos[Y])
				}
			}
			for _, u := range adj[xadj[s]:xadj[s+1]] {
				if where[u] != Y {
					continue
				}
				where[u] = 2
				pw[Y] -= int(vwgt[u])
				pw[2] += int(vwgt[u])
				pulled = append(pulled, u)
				gX, gY := vwgt[u], vwgt[u]
				for _, y := range adj[xadj[u]:xadj[u+1]] {
					switch where[y] {
					case Y:
						gX -= vwgt[y]
					case X:
						gY -= vwgt[y]
					case 2:
						if lock[y] != stamp && pos[X][y] >= 0 {
							gain[X][y] += vwgt[u]
							h[X].update(y, gain[X][y], pos[X])
						}
					}
				}
				gain[X][u], gain[Y][u] = gX, gY
				if lock[u] != stamp {
					h[X].push(u, gX, pos[X])
					h[Y].push(u, gY, pos[Y])
				}
			}
			moves = append(moves, s)
			mend = append(mend, int32(len(pulled)))
			o, d := over2([2]int{pw[0], pw[1]}, maxw)
			if o < bestOver || (o == bestOver && (pw[2] < bestSep || (pw[2] == bestSep && d < bestDiff))) {
				bestOver, bestSep, bestDiff, bestLen = o, pw[2], d, len(moves)
			} else if len(moves)-bestLen > limit {
				break
			}
		}
		for side := 0; side < 2; side++ {
			for _, v := range h[side].vtx {
				pos[side][v] = -1
			}
			h[side].reset()
		}
		for i := len(moves) - 1; i >= bestLen; i-- {
			s := moves[i]
			X := where[s]
			p0 := int32(0)
			if i > 0 {
				p0 = mend[i-1]
			}
			for _, u := range pulled[p0:mend[i]] {
				where[u] = 1 - X
				pw[2] -= int(vwgt[u])
				pw[1-X] += int(vwgt[u])
			}
			where[s] = 2
			pw[X] -= int(vwgt[s])
			pw[2] += int(vwgt[s])
		}
		w.moves, w.pulled, w.mend = moves, pulled, mend
		if bestLen == 0 || pw[2] >= startSep {
			break
		}
	}
}

// growNeg returns s resized to n, reallocated and filled with -1 when too
// small (the callers keep every entry -1 between uses).
func growNeg(s []int32, n int) []int32 {
	if cap(s) < n {
		s = make([]int32, n, n+n/4)
		for i := range s[:cap(s)] {
			s[:cap(s)][i] = -1
		}
	}
	return s[:n]
}
