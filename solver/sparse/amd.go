package sparse

// Node states of the quotient graph used by amdOrder.
const (
	amdVariable int8 = iota // principal, not yet eliminated
	amdMerged               // non-principal (inside a supervariable) or mass-eliminated
	amdElement              // eliminated; represents a clique L_e
	amdAbsorbed             // element absorbed into a newer element
)

// amdOrder returns an approximate minimum degree ordering of g.
//
// P. Amestoy, T. Davis and I. Duff, "An approximate minimum degree ordering
// algorithm", SIAM J. Matrix Anal. Appl. 17 (1996) 886-905: the quotient
// graph of variables and elements, element absorption (including the
// aggressive kind), supervariables found by hashing, mass elimination, and
// the approximate external degree bound of their eq. (4),
//
//	d_i = min( n_left - |i|,  d_i_old + |L_p \ i|,
//	           |A_i \ i| + |L_p \ i| + sum_{e in E_i \ p} |L_e \ L_p| ),
//
// with |L_e \ L_p| computed for all e at once by one scan of L_p. Sizes are
// weighted by supervariable size. This is an implementation from the
// paper's description; it does not treat dense rows specially, which 2D
// finite-element matrices do not have.
func amdOrder(g *graph) []int32 {
	n := g.n
	order := make([]int32, 0, n)
	if n == 0 {
		return order
	}
	store := append([]int32(nil), g.adj...)
	adj := make([][]int32, n) // variable: E_i then A_i; element: L_e
	elen := make([]int32, n)  // number of elements at the front of a variable's list
	nv := make([]int32, n)    // supervariable weight
	deg := make([]int32, n)   // approximate external degree (variables), |L_e| (elements)
	state := make([]int8, n)
	head := make([]int32, n+1)
	next := make([]int32, n)
	prev := make([]int32, n)
	mark := make([]int32, n)
	wstamp := make([]int32, n)
	w := make([]int32, n)
	hash := make([]int64, n)
	hhead := make([]int32, n)
	hnext := make([]int32, n)
	chainNext := make([]int32, n)
	chainTail := make([]int32, n)
	for i := range head {
		head[i] = -1
	}
	insert := func(i int32) {
		d := deg[i]
		prev[i] = -1
		next[i] = head[d]
		if head[d] >= 0 {
			prev[head[d]] = i
		}
		head[d] = i
	}
	remove := func(i int32) {
		if prev[i] >= 0 {
			next[prev[i]] = next[i]
		} else {
			head[deg[i]] = next[i]
		}
		if next[i] >= 0 {
			prev[next[i]] = prev[i]
		}
	}
	for i := 0; i < n; i++ {
		adj[i] = store[g.ptr[i]:g.ptr[i+1]:g.ptr[i+1]]
		nv[i] = 1
		deg[i] = int32(len(adj[i]))
		chainNext[i] = -1
		chainTail[i] = int32(i)
		hhead[i] = -1
		insert(int32(i))
	}
	appendChain := func(to, from int32) {
		chainNext[chainTail[to]] = from
		chainTail[to] = chainTail[from]
	}
	nleft := int32(n)
	mindeg := int32(0)
	stamp := int32(0)
	var arena []int32
	var tmp []int32
	for nleft > 0 {
		for head[mindeg] < 0 {
			mindeg++
		}
		p := head[mindeg]
		remove(p)

		// Form the new element L_p from p's elements and variables,
		// absorbing every element adjacent to p.
		stamp++
		mark[p] = stamp
		// L_p has at most n entries; take a new chunk when the current
		// one may not hold it (old chunks die with their elements).
		if need := min(n, int(nleft)); cap(arena)-len(arena) < need {
			arena = make([]int32, 0, max(need, len(store)+n, 1024))
		}
		start := len(arena)
		degp := int32(0)
		add := func(i int32) {
			if state[i] == amdVariable && mark[i] != stamp {
				mark[i] = stamp
				arena = append(arena, i)
				degp += nv[i]
			}
		}
		for _, e := range adj[p][:elen[p]] {
			if state[e] != amdElement {
				continue
			}
			for _, i := range adj[e] {
				add(i)
			}
			state[e] = amdAbsorbed
			adj[e] = nil
		}
		for _, i := range adj[p][elen[p]:] {
			add(i)
		}
		lp := arena[start:len(arena):len(arena)]
		nleft -= nv[p]
		state[p] = amdElement
		adj[p] = lp
		elen[p] = 0
		for _, i := range lp {
			remove(i)
		}

		// w(e) = |L_e \ L_p| for every element e adjacent to L_p.
		for _, i := range lp {
			for _, e := range adj[i][:elen[i]] {
				if state[e] != amdElement {
					continue
				}
				if wstamp[e] != stamp {
					wstamp[e] = stamp
					w[e] = deg[e]
				}
				w[e] -= nv[i]
			}
		}

		// Prune each i in L_p, put p first, and bound its degree.
		for _, i := range lp {
			list := adj[i]
			tmp = append(tmp[:0], list...)
			ne := elen[i]
			list = list[:cap(list)]
			list[0] = p
			k := 1
			ext := int32(0)
			h := int64(p)
			for _, e := range tmp[:ne] {
				if state[e] != amdElement {
					continue
				}
				if w[e] == 0 {
					state[e] = amdAbsorbed // aggressive absorption: L_e ⊆ L_p
					adj[e] = nil
					continue
				}
				list[k] = e
				k++
				ext += w[e]
				h += int64(e)
			}
			elen[i] = int32(k)
			for _, j := range tmp[ne:] {
				if state[j] == amdVariable && mark[j] != stamp {
					list[k] = j
					k++
					ext += nv[j]
					h += int64(j)
				}
			}
			adj[i] = list[:k]
			d := ext + degp - nv[i]
			d = min(d, deg[i]+degp-nv[i], nleft-nv[i])
			deg[i] = max(d, 0)
			hash[i] = h % int64(n)
		}

		// Supervariables: merge variables of L_p with identical lists.
		for _, i := range lp {
			hh := hash[i]
			hnext[i] = hhead[hh]
			hhead[hh] = i
		}
		for _, i := range lp {
			hh := hash[i]
			if hhead[hh] < 0 {
				continue
			}
			for a := hhead[hh]; a >= 0; a = hnext[a] {
				if state[a] != amdVariable {
					continue
				}
				la := adj[a]
				var marked bool
				for b := hnext[a]; b >= 0; b = hnext[b] {
					lb := adj[b]
					if state[b] != amdVariable || len(lb) != len(la) || elen[b] != elen[a] {
						continue
					}
					if !marked {
						stamp++
						for _, v := range la {
							mark[v] = stamp
						}
						marked = true
					}
					same := true
					for _, v := range lb {
						if mark[v] != stamp {
							same = false
							break
						}
					}
					if same {
						deg[a] -= nv[b]
						nv[a] += nv[b]
						nv[b] = 0
						state[b] = amdMerged
						adj[b] = nil
						appendChain(a, b)
					}
				}
			}
			hhead[hh] = -1
		}

		// Mass elimination and reinsertion; compact L_p.
		k := 0
		for _, i := range lp {
			if state[i] != amdVariable {
				continue
			}
			if deg[i] <= 0 {
				nleft -= nv[i]
				state[i] = amdMerged
				adj[i] = nil
				appendChain(p, i)
				continue
			}
			insert(i)
			mindeg = min(mindeg, deg[i])
			lp[k] = i
			k++
		}
		adj[p] = lp[:k]
		d := int32(0)
		for _, i := range adj[p] {
			d += nv[i]
		}
		deg[p] = d
		if d == 0 {
			state[p] = amdAbsorbed
			adj[p] = nil
		}
		for v := p; v >= 0; v = chainNext[v] {
			order = append(order, v)
		}
	}
	return order
}
