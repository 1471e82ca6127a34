package sparse

import (
	"slices"
	"sort"
)

// symbolic is the pattern-only part of a supernodal Cholesky factorization
// of P A P^T = L L^T. Columns are numbered in the permuted order; supernode
// s owns columns [super[s], super[s+1]) and stores an m×nc column-major
// block of L whose row indices are rows[rowPtr[s]:rowPtr[s+1]] (the first nc
// of them are the supernode's own columns).
type symbolic struct {
	n      int
	nnzA   int
	perm   []int32 // perm[k]: original index of permuted column k
	inv    []int32 // inv[perm[k]] = k
	parent []int32 // elimination tree (column level)

	ns       int
	super    []int32 // len ns+1
	colSuper []int32 // supernode of each column
	sparent  []int32 // supernodal elimination tree, -1 at roots
	rowPtr   []int   // len ns+1
	rows     []int32
	valPtr   []int // len ns+1, offsets into the factor values

	// Scatter map of A's lower triangle into the factor, per supernode.
	aPtr []int
	aSrc []int
	aDst []int

	// Update lists: descendant supernode updSrc[k] with its first row at
	// position updPos[k] (relative to its row list) updates supernode t for
	// updPtr[t] <= k < updPtr[t+1].
	updPtr []int
	updSrc []int32
	updPos []int32
	maxC   int

	nnzL  int     // stored entries of L including relaxed zeros
	flops float64 // multiply-adds of the numeric factorization
	work  []float64

	// Parallel schedule: worker w factors the subtrees rooted at
	// tasks[w]; the remaining supernodes (top) follow in order.
	tasks [][]int32
	first []int32 // first supernode of each supernode's subtree
	top   []int32
}

// analyze builds the symbolic factorization of the symmetric pattern of a
// under the permutation perm, amalgamating supernodes as sn asks.
//
// Elimination tree: J. W. H. Liu, "The role of elimination trees in sparse
// factorization", SIAM J. Matrix Anal. Appl. 11 (1990), algorithm with path
// compression. Supernodes and relaxed amalgamation: C. Ashcraft and R.
// Grimes, "The influence of relaxed supernode partitions on the
// multifrontal method", ACM TOMS 15 (1989). Left-looking supernodal update
// lists: E. Ng and B. Peyton, "Block sparse Cholesky algorithms on advanced
// uniprocessor computers", SIAM J. Sci. Comput. 14 (1993).
func analyze(a *CSR, perm []int32, workers int, sn SupernodeOptions) *symbolic {
	n := a.N
	s := &symbolic{n: n, nnzA: a.NNZ(), perm: perm}
	s.inv = make([]int32, n)
	for k, o := range perm {
		s.inv[o] = int32(k)
	}
	parent := s.etree(a)
	// Postorder the tree and compose it with perm so that every subtree
	// (and so every supernode) is a contiguous range of columns.
	post := postorder(parent)
	perm2 := make([]int32, n)
	for k, v := range post {
		perm2[k] = perm[v]
	}
	s.perm = perm2
	for k, o := range perm2 {
		s.inv[o] = int32(k)
	}
	// Relabel the tree rather than recompute it.
	ipost := make([]int32, n)
	for k, v := range post {
		ipost[v] = int32(k)
	}
	s.parent = make([]int32, n)
	for k, v := range post {
		s.parent[k] = -1
		if p := parent[v]; p >= 0 {
			s.parent[k] = ipost[p]
		}
	}

	cc := s.colCountsGNP(a)
	s.supernodes(cc, sn.params())
	s.structure(a)
	s.scatterMap(a)
	s.updates()
	s.schedule(workers)
	return s
}

func (s *symbolic) etree(a *CSR) []int32 {
	n := s.n
	parent := make([]int32, n)
	anc := make([]int32, n)
	for k := 0; k < n; k++ {
		parent[k], anc[k] = -1, -1
		o := s.perm[k]
		for p := a.RowPtr[o]; p < a.RowPtr[o+1]; p++ {
			i := s.inv[a.Col[p]]
			for i != -1 && i < int32(k) {
				next := anc[i]
				anc[i] = int32(k)
				if next == -1 {
					parent[i] = int32(k)
				}
				i = next
			}
		}
	}
	return parent
}

// postorder returns the nodes of the forest in depth-first postorder.
func postorder(parent []int32) []int32 {
	n := len(parent)
	head := make([]int32, n)
	next := make([]int32, n)
	for i := range head {
		head[i] = -1
	}
	for j := n - 1; j >= 0; j-- {
		if p := parent[j]; p >= 0 {
			next[j] = head[p]
			head[p] = int32(j)
		}
	}
	post := make([]int32, 0, n)
	stack := make([]int32, 0, 64)
	for r := 0; r < n; r++ {
		if parent[r] != -1 {
			continue
		}
		stack = append(stack, int32(r))
		for len(stack) > 0 {
			v := stack[len(stack)-1]
			if c := head[v]; c != -1 {
				head[v] = next[c]
				stack = append(stack, c)
			} else {
				stack = stack[:len(stack)-1]
				post = append(post, v)
			}
		}
	}
	return post
}

// colCountsNaive returns the number of entries (diagonal included) of
// each column of L by walking the row subtrees of the elimination tree; the
// cost is proportional to nnz(L). Tests use it to check colCountsGNP.
func (s *symbolic) colCountsNaive(a *CSR) []int32 {
	n := s.n
	cc := make([]int32, n)
	mark := make([]int32, n)
	for i := range mark {
		mark[i] = -1
	}
	for i := 0; i < n; i++ {
		cc[i]++
		mark[i] = int32(i)
		o := s.perm[i]
		for p := a.RowPtr[o]; p < a.RowPtr[o+1]; p++ {
			j := s.inv[a.Col[p]]
			for j < int32(i) && mark[j] != int32(i) {
				mark[j] = int32(i)
				cc[j]++
				j = s.parent[j]
			}
		}
	}
	return cc
}

// supernodes partitions the columns into fundamental supernodes and then
// merges a child into its parent when the explicit zeros this adds stay
// small (relaxed amalgamation, under r).
func (s *symbolic) supernodes(cc []int32, r SupernodeOptions) {
	n := s.n
	nchild := make([]int32, n)
	for _, p := range s.parent {
		if p >= 0 {
			nchild[p]++
		}
	}
	type sn struct {
		f, l  int32 // columns [f,l)
		below int   // rows below the last column
		nz    int   // true nonzeros
	}
	stack := make([]sn, 0, 64)
	for j := 0; j < n; {
		// Fundamental supernode starting at j.
		l := j + 1
		for l < n && s.parent[l-1] == int32(l) && cc[l-1] == cc[l]+1 && nchild[l] == 1 {
			l++
		}
		cur := sn{f: int32(j), l: int32(l), below: int(cc[l-1]) - 1}
		for c := j; c < l; c++ {
			cur.nz += int(cc[c])
		}
		for len(stack) > 0 {
			top := stack[len(stack)-1]
			pc := s.parent[top.l-1]
			if top.l != cur.f || pc < cur.f || pc >= cur.l {
				break
			}
			nc := int(cur.l - top.f)
			m := nc + cur.below
			stored := nc*m - nc*(nc-1)/2
			z := float64(stored-top.nz-cur.nz) / float64(stored)
			if !r.merge(nc, z) {
				break
			}
			stack = stack[:len(stack)-1]
			cur = sn{f: top.f, l: cur.l, below: cur.below, nz: top.nz + cur.nz}
		}
		stack = append(stack, cur)
		j = l
	}
	s.ns = len(stack)
	s.super = make([]int32, s.ns+1)
	s.colSuper = make([]int32, n)
	for k, t := range stack {
		s.super[k] = t.f
		for c := t.f; c < t.l; c++ {
			s.colSuper[c] = int32(k)
		}
	}
	s.super[s.ns] = int32(n)
	s.sparent = make([]int32, s.ns)
	for k := 0; k < s.ns; k++ {
		s.sparent[k] = -1
		if p := s.parent[s.super[k+1]-1]; p >= 0 {
			s.sparent[k] = s.colSuper[p]
		}
	}
}

// SupernodeOptions tune the relaxed amalgamation of Cholesky's symbolic
// analysis: a supernode is merged into its parent when the merged block
// keeps few explicit zeros, which trades stored zeros (and their
// multiply-adds) for larger dense blocks. The zero value is the tuned
// default: a field left at zero takes the default given with it (the
// constants defaultRelax*), common practice in the spirit of Ashcraft and
// Grimes (1989), tuned on the 2D grid benchmarks of this package. A
// negative value turns its rule off.
type SupernodeOptions struct {
	// Always: merges giving at most this many columns are made whatever
	// their zeros. 0 means defaultRelaxAlways.
	Always int
	// Zeros16, Zeros48 and ZerosWide: merges giving up to 16, up to 48
	// and more columns are made while the fraction of explicit zeros in
	// the merged block stays below this. 0 means defaultRelaxZeros16,
	// defaultRelaxZeros48 and defaultRelaxZerosWide.
	Zeros16, Zeros48, ZerosWide float64
}

// Defaults of SupernodeOptions.
const (
	defaultRelaxAlways    = 8
	defaultRelaxZeros16   = 0.5
	defaultRelaxZeros48   = 0.1
	defaultRelaxZerosWide = 0.02
)

// params returns o with the defaults applied.
func (o SupernodeOptions) params() SupernodeOptions {
	if o.Always == 0 {
		o.Always = defaultRelaxAlways
	}
	if o.Zeros16 == 0 {
		o.Zeros16 = defaultRelaxZeros16
	}
	if o.Zeros48 == 0 {
		o.Zeros48 = defaultRelaxZeros48
	}
	if o.ZerosWide == 0 {
		o.ZerosWide = defaultRelaxZerosWide
	}
	return o
}

// merge decides whether a merged supernode of nc columns with a fraction
// z of explicit zeros is worth it; r has the defaults applied (a negative
// threshold is never met).
func (r *SupernodeOptions) merge(nc int, z float64) bool {
	switch {
	case nc <= r.Always:
		return true
	case nc <= 16:
		return z < r.Zeros16
	case nc <= 48:
		return z < r.Zeros48
	default:
		return z < r.ZerosWide
	}
}

// structure computes the row list of every supernode: its own columns, the
// rows of A below them and the rows of its children below it.
func (s *symbolic) structure(a *CSR) {
	n := s.n
	mark := make([]int32, n)
	for i := range mark {
		mark[i] = -1
	}
	head := make([]int32, s.ns)
	next := make([]int32, s.ns)
	for i := range head {
		head[i] = -1
	}
	for c := s.ns - 1; c >= 0; c-- {
		if p := s.sparent[c]; p >= 0 {
			next[c] = head[p]
			head[p] = int32(c)
		}
	}
	s.rowPtr = make([]int, s.ns+1)
	rows := make([]int32, 0, 4*n)
	for t := 0; t < s.ns; t++ {
		f, l := s.super[t], s.super[t+1]
		start := len(rows)
		for c := f; c < l; c++ {
			rows = append(rows, c)
			mark[c] = int32(t)
		}
		for c := f; c < l; c++ {
			o := s.perm[c]
			for p := a.RowPtr[o]; p < a.RowPtr[o+1]; p++ {
				i := s.inv[a.Col[p]]
				if i >= l && mark[i] != int32(t) {
					mark[i] = int32(t)
					rows = append(rows, i)
				}
			}
		}
		for ch := head[t]; ch != -1; ch = next[ch] {
			for _, i := range rows[s.rowPtr[ch]:s.rowPtr[ch+1]] {
				if i >= l && mark[i] != int32(t) {
					mark[i] = int32(t)
					rows = append(rows, i)
				}
			}
		}
		slices.Sort(rows[start+int(l-f):])
		s.rowPtr[t+1] = len(rows)
	}
	s.rows = slices.Clip(rows)
	s.valPtr = make([]int, s.ns+1)
	for t := 0; t < s.ns; t++ {
		m := s.rowPtr[t+1] - s.rowPtr[t]
		nc := int(s.super[t+1] - s.super[t])
		s.valPtr[t+1] = s.valPtr[t] + m*nc
		s.nnzL += nc*m - nc*(nc-1)/2
	}
}

// scatterMap records, for each lower-triangle entry of P A P^T, where its
// value goes in the factor's value array.
func (s *symbolic) scatterMap(a *CSR) {
	rel := make([]int32, s.n)
	s.aPtr = make([]int, s.ns+1)
	cnt := 0
	for t := 0; t < s.ns; t++ {
		for c := s.super[t]; c < s.super[t+1]; c++ {
			o := s.perm[c]
			for p := a.RowPtr[o]; p < a.RowPtr[o+1]; p++ {
				if s.inv[a.Col[p]] >= c {
					cnt++
				}
			}
		}
		s.aPtr[t+1] = cnt
	}
	s.aSrc = make([]int, cnt)
	s.aDst = make([]int, cnt)
	k := 0
	for t := 0; t < s.ns; t++ {
		rows := s.rows[s.rowPtr[t]:s.rowPtr[t+1]]
		for q, r := range rows {
			rel[r] = int32(q)
		}
		m := len(rows)
		f := s.super[t]
		for c := f; c < s.super[t+1]; c++ {
			o := s.perm[c]
			for p := a.RowPtr[o]; p < a.RowPtr[o+1]; p++ {
				if i := s.inv[a.Col[p]]; i >= c {
					s.aSrc[k] = p
					s.aDst[k] = s.valPtr[t] + int(c-f)*m + int(rel[i])
					k++
				}
			}
		}
	}
}

// updates builds the static left-looking update lists and estimates the
// work of each supernode.
func (s *symbolic) updates() {
	cnt := make([]int, s.ns+1)
	forGroups := func(d int, fn func(t int32, pos, q int)) {
		rows := s.rows[s.rowPtr[d]:s.rowPtr[d+1]]
		nc := int(s.super[d+1] - s.super[d])
		for p := nc; p < len(rows); {
			t := s.colSuper[rows[p]]
			q := p + 1
			for q < len(rows) && s.colSuper[rows[q]] == t {
				q++
			}
			fn(t, p, q-p)
			p = q
		}
	}
	for d := 0; d < s.ns; d++ {
		forGroups(d, func(t int32, _, _ int) { cnt[t+1]++ })
	}
	for t := 0; t < s.ns; t++ {
		cnt[t+1] += cnt[t]
	}
	s.updPtr = append([]int(nil), cnt...)
	s.updSrc = make([]int32, cnt[s.ns])
	s.updPos = make([]int32, cnt[s.ns])
	s.work = make([]float64, s.ns)
	for t := 0; t < s.ns; t++ {
		m := float64(s.rowPtr[t+1] - s.rowPtr[t])
		nc := float64(s.super[t+1] - s.super[t])
		s.work[t] = nc * nc * (m - nc/3) / 1
	}
	for d := 0; d < s.ns; d++ {
		md := s.rowPtr[d+1] - s.rowPtr[d]
		nd := float64(s.super[d+1] - s.super[d])
		forGroups(d, func(t int32, pos, q int) {
			k := cnt[t]
			cnt[t]++
			s.updSrc[k] = int32(d)
			s.updPos[k] = int32(pos)
			r := md - pos
			if r*q > s.maxC {
				s.maxC = r * q
			}
			s.work[t] += nd * float64(q) * (float64(r) - float64(q)/2)
		})
	}
	for _, w := range s.work {
		s.flops += w
	}
}

// schedule splits the supernodal tree into independent subtrees for the
// workers (longest-processing-time assignment) and a top part factored
// after them, choosing the split with the smallest estimated makespan.
func (s *symbolic) schedule(workers int) {
	s.first = make([]int32, s.ns)
	sub := make([]float64, s.ns)
	for t := 0; t < s.ns; t++ {
		s.first[t] = int32(t)
	}
	for t := 0; t < s.ns; t++ {
		sub[t] += s.work[t]
		if p := s.sparent[t]; p >= 0 {
			s.first[p] = min(s.first[p], s.first[t])
			sub[p] += sub[t]
		}
	}
	s.tasks = nil
	s.top = nil
	if workers < 2 || s.flops < 2e6 {
		return
	}
	children := make([][]int32, s.ns)
	var set []int32
	for t := 0; t < s.ns; t++ {
		if p := s.sparent[t]; p >= 0 {
			children[p] = append(children[p], int32(t))
		} else {
			set = append(set, int32(t))
		}
	}
	assign := func(set []int32) ([][]int32, float64) {
		order := append([]int32(nil), set...)
		sort.Slice(order, func(i, j int) bool { return sub[order[i]] > sub[order[j]] })
		bins := make([][]int32, workers)
		load := make([]float64, workers)
		for _, r := range order {
			w := 0
			for k := 1; k < workers; k++ {
				if load[k] < load[w] {
					w = k
				}
			}
			bins[w] = append(bins[w], r)
			load[w] += sub[r]
		}
		return bins, slices.Max(load)
	}
	topWork := 0.0
	bestBins, span := assign(set)
	best := span
	var bestTop []int32
	var top []int32
	for it := 0; it < 64 && len(set) > 0; it++ {
		// Split the heaviest subtree.
		h := 0
		for k := range set {
			if sub[set[k]] > sub[set[h]] {
				h = k
			}
		}
		r := set[h]
		set = append(set[:h], set[h+1:]...)
		set = append(set, children[r]...)
		top = append(top, r)
		topWork += s.work[r]
		bins, span := assign(set)
		if span+topWork < best {
			best = span + topWork
			bestBins = bins
			bestTop = append([]int32(nil), top...)
		}
	}
	if total := sub0(sub, s.sparent); best >= 0.95*total {
		return // one worker is as good
	}
	s.tasks = bestBins
	slices.Sort(bestTop)
	// The top part is every supernode outside the chosen subtrees.
	in := make([]bool, s.ns)
	for _, b := range bestBins {
		for _, r := range b {
			for t := s.first[r]; t <= r; t++ {
				in[t] = true
			}
		}
	}
	for t := 0; t < s.ns; t++ {
		if !in[t] {
			s.top = append(s.top, int32(t))
		}
	}
}

// sub0 is the total work of the forest.
func sub0(sub []float64, sparent []int32) float64 {
	t := 0.0
	for k, p := range sparent {
		if p < 0 {
			t += sub[k]
		}
	}
	return t
}

// colCountsGNP returns the column counts of L (diagonal included) in time
// nearly linear in nnz(A), for a postordered elimination tree: each column
// j gets +1 if it is a leaf of the tree, +1 for every row subtree it is a
// leaf of, -1 at its parent, and -1 at the least common ancestor of
// consecutive leaves of a row subtree; the count of j is the sum over its
// subtree.
//
// J. Gilbert, E. Ng and B. Peyton, "An efficient algorithm to compute row
// and column counts for sparse Cholesky factorization", SIAM J. Matrix
// Anal. Appl. 15 (1994); the skeleton-leaf test and the disjoint-set least
// common ancestor as presented in T. Davis, "Direct Methods for Sparse
// Linear Systems", SIAM 2006, section 4.5.
func (s *symbolic) colCountsGNP(a *CSR) []int32 {
	n := s.n
	parent := s.parent
	delta := make([]int32, n)
	first := make([]int32, n)
	maxfirst := make([]int32, n)
	prevleaf := make([]int32, n)
	anc := make([]int32, n)
	for i := 0; i < n; i++ {
		first[i], maxfirst[i], prevleaf[i], anc[i] = -1, -1, -1, int32(i)
	}
	// Columns are in postorder: first[j] is the first column of j's
	// subtree; leaves have first[j] == j.
	for k := 0; k < n; k++ {
		j := int32(k)
		if first[j] == -1 {
			delta[j] = 1
		}
		for ; j != -1 && first[j] == -1; j = parent[j] {
			first[j] = int32(k)
		}
	}
	for j := int32(0); int(j) < n; j++ {
		if p := parent[j]; p != -1 {
			delta[p]--
		}
		o := s.perm[j]
		for p := a.RowPtr[o]; p < a.RowPtr[o+1]; p++ {
			i := s.inv[a.Col[p]]
			// Is j a leaf of the row subtree of i?
			if i <= j || first[j] <= maxfirst[i] {
				continue
			}
			maxfirst[i] = first[j]
			jprev := prevleaf[i]
			prevleaf[i] = j
			delta[j]++
			if jprev == -1 {
				continue // first leaf of row subtree i
			}
			// Least common ancestor of jprev and j: the root of jprev's
			// set, with path compression.
			q := jprev
			for q != anc[q] {
				q = anc[q]
			}
			for v := jprev; v != q; {
				next := anc[v]
				anc[v] = q
				v = next
			}
			delta[q]--
		}
		if p := parent[j]; p != -1 {
			anc[j] = p
		}
	}
	for j := 0; j < n; j++ {
		if p := parent[j]; p != -1 {
			delta[p] += delta[j]
		}
	}
	return delta
}
