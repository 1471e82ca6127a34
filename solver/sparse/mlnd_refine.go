package sparse

// Refinement for the multilevel bisection (mlnd_bisect.go): part weights
// and gains, projection of a coarse partition to the finer level,
// boundary Fiduccia-Mattheyses moves of the edge cut under the balance
// bound, and the separator refinement that moves separator vertices into
// a part.

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
// boundary Fiduccia-Mattheyses moves under the balance bound w.maxPart, and
// returns the cut. On entry w.id and w.ed hold each vertex's edge weight
// to its own and to the other part (see gains), and pw and cut the part
// weights and the cut; w.id and w.ed are kept up to date.
func (w *mlWork) refine(g *mlGraph, where []int8, pw [2]int, cut, passes int) int {
	n := g.n
	xadj, adj, ewgt, vwgt := g.xadj, g.adj, g.ewgt, g.vwgt
	maxw := w.maxPart(g)
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
// w.maxPart(g), or does not grow if it is already beyond.
func (w *mlWork) nodeRefine(g *mlGraph, where []int8, passes int) {
	n := g.n
	xadj, adj, vwgt := g.xadj, g.adj, g.vwgt
	maxw := w.maxPart(g)
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
