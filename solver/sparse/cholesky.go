package sparse

import (
	"math"
	"runtime"
	"sync"
	"sync/atomic"
)

const maxFinite = math.MaxFloat64

func sqrtf(x float64) float64 { return math.Sqrt(x) }

// CholeskyOptions configure a Cholesky solver. The zero value is ready to
// use, with the tuned defaults.
//
// Analyze reads the options; changes take effect at the next Analyze.
type CholeskyOptions struct {
	// Ordering is the fill-reducing ordering; DefaultOrdering picks the
	// best measured on 2D finite-element matrices.
	Ordering Ordering
	// Perm, if not nil, is used instead of Ordering: Perm[k] is the
	// original index of the k-th pivot. It must be a permutation of 0..N-1.
	Perm []int32
	// Workers is the number of goroutines used by Factor; 0 means
	// runtime.GOMAXPROCS(0) and 1 factors serially.
	Workers int
	// ND tunes NestedDissection, whether Ordering names it or
	// DefaultOrdering picks it; the zero value is the tuned default.
	ND NDOptions
	// Supernodes tunes the relaxed supernode amalgamation; the zero
	// value is the tuned default.
	Supernodes SupernodeOptions
	// SplitWork is the estimated multiply-add count of a supernode at the
	// top of the elimination tree above which a parallel Factor splits
	// its columns between two goroutines. 0 means defaultSplitWork; a
	// negative value splits every top supernode. The factor does not
	// depend on it.
	SplitWork float64
}

// Cholesky is a supernodal left-looking sparse Cholesky solver,
// P A P^T = L L^T. Analyze computes the ordering and the symbolic factor
// once per pattern; Factor may be called again for new values on the same
// pattern and then allocates nothing; SolveTo does two triangular solves.
//
// The dense work runs in blocked kernels on the supernodes' column-major
// blocks; independent subtrees of the elimination tree are factored
// concurrently. Methods: E. Ng and B. Peyton, "Block sparse Cholesky
// algorithms on advanced uniprocessor computers", SIAM J. Sci. Comput. 14
// (1993); T. Davis, "Direct Methods for Sparse Linear Systems", SIAM 2006,
// chapter 4.
type Cholesky struct {
	Options CholeskyOptions

	sym       *symbolic
	lx        []float64
	a         *CSR // matrix of the last Factor, for the residual
	factored  bool
	work      []cholWork
	y, r, ax  []float64
	errs      []error
	failed    atomic.Bool
	wg        sync.WaitGroup
	workerFns []func()
	fwdFns    []func()
	bwdFns    []func()

	// Two-way split of one large supernode in the top of the tree.
	splitWork float64 // resolved Options.SplitWork
	inTop     bool
	job       splitJob
	helperFn  func()
	pool      *pool
}

type cholWork struct {
	rel []int32
	c   []float64
	acc []float64 // forward-solve contributions to top rows (parallel solve)
}

// Analyze orders a and computes the symbolic factorization. Only the
// pattern of a is used; both triangles must be stored (structurally
// symmetric), as CSR documents.
func (ch *Cholesky) Analyze(a *CSR) error {
	if len(a.RowPtr) != a.N+1 {
		panic(errBadCSR)
	}
	if !a.IsStructurallySymmetric() {
		panic(errUnsymmetric)
	}
	workers := ch.Options.Workers
	if workers <= 0 {
		workers = runtime.GOMAXPROCS(0)
	}
	var perm []int32
	if ch.Options.Perm != nil {
		if len(ch.Options.Perm) != a.N || !IsPermutation(ch.Options.Perm) {
			panic("sparse: Options.Perm is not a permutation of 0..N-1")
		}
		perm = append([]int32(nil), ch.Options.Perm...)
	} else {
		perm = order(a, ch.Options.Ordering, ch.Options.ND)
	}
	ch.setup(analyze(a, perm, workers, ch.Options.Supernodes))
	return nil
}

// ShareAnalysis gives ch the ordering and symbolic factorization of src,
// which must have been analysed, instead of an Analyze of its own: for
// matrices with src's pattern (the same N and entries in the same places)
// whose values differ, such as the stiffness matrix of a mesh whose nodes
// moved. The analysis is only read, so src and ch may factor and solve
// concurrently; each keeps its own numeric factor. ch's Options are
// ignored but for SplitWork. It panics if src has not been analysed.
func (ch *Cholesky) ShareAnalysis(src *Cholesky) {
	if src.sym == nil {
		panic(errNotAnalyzed)
	}
	ch.setup(src.sym)
}

// setup makes ch's numeric workspace for the symbolic factorization s.
func (ch *Cholesky) setup(s *symbolic) {
	ch.sym = s
	ch.splitWork = ch.Options.SplitWork
	if ch.splitWork == 0 {
		ch.splitWork = defaultSplitWork
	}
	if cap(ch.lx) < s.valPtr[s.ns] {
		ch.lx = make([]float64, s.valPtr[s.ns])
	}
	ch.lx = ch.lx[:s.valPtr[s.ns]]
	nw := max(1, len(s.tasks))
	ch.work = make([]cholWork, nw)
	for w := range ch.work {
		ch.work[w] = cholWork{rel: make([]int32, s.n), c: make([]float64, s.maxC)}
	}
	ch.errs = make([]error, nw)
	ch.helperFn = func() { ch.runJob(); ch.wg.Done() }
	if len(s.tasks) > 0 {
		ch.pool = poolFor(ch, ch.pool, len(s.tasks))
	}
	ch.workerFns = ch.workerFns[:0]
	ch.fwdFns = ch.fwdFns[:0]
	ch.bwdFns = ch.bwdFns[:0]
	for w := range s.tasks {
		ch.workerFns = append(ch.workerFns, func() { ch.runTasks(w) })
		ch.fwdFns = append(ch.fwdFns, func() { ch.solveTasks(w, true) })
		ch.bwdFns = append(ch.bwdFns, func() { ch.solveTasks(w, false) })
		ch.work[w].acc = make([]float64, s.n)
	}
	ch.y = make([]float64, s.n)
	ch.r = make([]float64, s.n)
	ch.ax = make([]float64, s.n)
	ch.factored = false
}

// Factor computes the numeric factor for the current values of a, which
// must have the pattern given to Analyze. It returns a
// *NotPositiveDefiniteError if a pivot is not positive or not finite.
func (ch *Cholesky) Factor(a *CSR) error {
	s := ch.sym
	if s == nil {
		panic(errNotAnalyzed)
	}
	if a.N != s.n || a.NNZ() != s.nnzA {
		panic(errPattern)
	}
	ch.factored = false
	ch.a = a
	ch.failed.Store(false)
	for w := range ch.errs {
		ch.errs[w] = nil
	}
	if len(s.tasks) == 0 {
		for t := 0; t < s.ns; t++ {
			if err := ch.factorSuper(t, a, &ch.work[0]); err != nil {
				return err
			}
		}
		ch.factored = true
		return nil
	}
	ch.wg.Add(len(s.tasks))
	for _, fn := range ch.workerFns {
		ch.pool.run(fn)
	}
	ch.wg.Wait()
	for _, err := range ch.errs {
		if err != nil {
			return err
		}
	}
	ch.inTop = true
	for _, t := range s.top {
		if err := ch.factorSuper(int(t), a, &ch.work[0]); err != nil {
			ch.inTop = false
			return err
		}
	}
	ch.inTop = false
	ch.factored = true
	return nil
}

func (ch *Cholesky) runTasks(w int) {
	defer ch.wg.Done()
	s, a := ch.sym, ch.a
	for _, r := range s.tasks[w] {
		for t := s.first[r]; t <= r; t++ {
			if ch.failed.Load() {
				return
			}
			if err := ch.factorSuper(int(t), a, &ch.work[w]); err != nil {
				ch.errs[w] = err
				ch.failed.Store(true)
				return
			}
		}
	}
}

// factorSuper assembles and factors supernode t: scatter A, subtract the
// updates of all descendants that touch it, then factor its trapezoid.
func (ch *Cholesky) factorSuper(t int, a *CSR, ws *cholWork) error {
	s := ch.sym
	lx := ch.lx
	f := int(s.super[t])
	nc := int(s.super[t+1]) - f
	rows := s.rows[s.rowPtr[t]:s.rowPtr[t+1]]
	m := len(rows)
	lt := lx[s.valPtr[t]:s.valPtr[t+1]]
	clear(lt)
	val := a.Val
	for k := s.aPtr[t]; k < s.aPtr[t+1]; k++ {
		lx[s.aDst[k]] = val[s.aSrc[k]]
	}
	rel := ws.rel
	for q, r := range rows {
		rel[r] = int32(q)
	}
	if ch.inTop && s.work[t] > ch.splitWork {
		return ch.factorSuperPar(t, lt, m, nc)
	}
	ch.updateCols(t, rel, ws.c, 0, nc)
	if k, piv := potrfTrapezoid(lt, m, nc); k >= 0 {
		return &NotPositiveDefiniteError{Column: int(s.perm[f+k]), Pivot: piv}
	}
	return nil
}

// updateCols subtracts from columns [c0,c1) of supernode t the updates of
// all descendants in its update list. Disjoint column ranges may run
// concurrently with separate ws.c buffers and a shared rel map.
func (ch *Cholesky) updateCols(t int, rel []int32, cbuf []float64, c0, c1 int) {
	s := ch.sym
	lx := ch.lx
	f := s.super[t]
	m := s.rowPtr[t+1] - s.rowPtr[t]
	lt := lx[s.valPtr[t]:s.valPtr[t+1]]
	lo, hi := f+int32(c0), f+int32(c1)
	for k := s.updPtr[t]; k < s.updPtr[t+1]; k++ {
		d := s.updSrc[k]
		p := int(s.updPos[k])
		drows := s.rows[s.rowPtr[d]:s.rowPtr[d+1]]
		md := len(drows)
		nd := int(s.super[d+1] - s.super[d])
		// Rows p+j0 .. p+j1-1 of d fall in target columns [c0,c1).
		j0 := p
		for j0 < md && drows[j0] < lo {
			j0++
		}
		j1 := j0
		for j1 < md && drows[j1] < hi {
			j1++
		}
		if j0 == j1 {
			continue
		}
		q := j1 - j0
		r := md - j0
		ld := lx[s.valPtr[d]:s.valPtr[d+1]]
		if r == m-c0 {
			// d's rows from j0 are exactly the target's rows from c0 (a
			// subset of equal size): subtract in place.
			syrkLowerSub(lt[c0*m+c0:], m, ld[j0:], md, r, q, nd)
			continue
		}
		c := cbuf[:r*q]
		clear(c)
		syrkLowerSub(c, r, ld[j0:], md, r, q, nd)
		dr := drows[j0:]
		for j := 0; j < q; j++ {
			dst := lt[int(dr[j]-f)*m:]
			cj := c[j*r : j*r+r]
			for i := j; i < r; i++ {
				dst[rel[dr[i]]] += cj[i]
			}
		}
	}
}

// SolveTo solves A x = b with the current factor. x and b must have length
// N and may be the same slice. The Result carries the relative residual
// ||b - A x|| / ||b|| computed with the matrix given to Factor; a
// non-finite solution is reported as Breakdown with an error.
func (ch *Cholesky) SolveTo(x, b []float64) (Result, error) {
	s := ch.sym
	if s == nil || !ch.factored {
		panic(errNotFactored)
	}
	if len(x) != s.n || len(b) != s.n {
		panic(errShape)
	}
	y := ch.y
	for k, o := range s.perm {
		y[k] = b[o]
	}
	ch.solvePermuted(y)
	bn := 0.0
	for _, v := range b {
		bn += v * v
	}
	bn = math.Sqrt(bn)
	// Residual in the caller's numbering, before x (maybe b) is written.
	r, ax := ch.r, ch.ax
	for k, o := range s.perm {
		r[o] = y[k]
	}
	// Serial product: a few ms even at 1M unknowns, and allocation-free.
	ch.a.mulRows(ax, r, 0, s.n)
	rn := 0.0
	for i := range ax {
		d := b[i] - ax[i]
		rn += d * d
	}
	copy(x, r)
	if bn == 0 {
		bn = 1
	}
	res := Result{Status: Converged, Residual: math.Sqrt(rn) / bn}
	if math.IsNaN(res.Residual) || math.IsInf(res.Residual, 0) {
		res.Status = Breakdown
		return res, nonFinite(b, x)
	}
	return res, nil
}

// solvePermuted overwrites y with (L L^T)^{-1} y in the permuted numbering.
// With a parallel schedule the worker subtrees are solved concurrently:
// forward contributions to rows of the top supernodes go to per-worker
// buffers summed before the top is solved; the backward solve of a subtree
// only reads rows of its own subtree and of the (already solved) top.
func (ch *Cholesky) solvePermuted(y []float64) {
	s := ch.sym
	if len(s.tasks) == 0 {
		for t := 0; t < s.ns; t++ {
			ch.forwardSuper(t, y, nil, int32(s.n))
		}
		for t := s.ns - 1; t >= 0; t-- {
			ch.backwardSuper(t, y)
		}
		return
	}
	ch.wg.Add(len(s.tasks))
	for _, fn := range ch.fwdFns {
		ch.pool.run(fn)
	}
	ch.wg.Wait()
	for _, ws := range ch.work {
		acc := ws.acc
		for _, t := range s.top {
			for r := s.super[t]; r < s.super[t+1]; r++ {
				y[r] -= acc[r]
				acc[r] = 0
			}
		}
	}
	for _, t := range s.top {
		ch.forwardSuper(int(t), y, nil, int32(s.n))
	}
	for k := len(s.top) - 1; k >= 0; k-- {
		ch.backwardSuper(int(s.top[k]), y)
	}
	ch.wg.Add(len(s.tasks))
	for _, fn := range ch.bwdFns {
		ch.pool.run(fn)
	}
	ch.wg.Wait()
}

// solveTasks runs worker w's subtrees forward (into its accumulator for
// rows at or beyond each subtree's end) or backward.
func (ch *Cholesky) solveTasks(w int, forward bool) {
	defer ch.wg.Done()
	s := ch.sym
	y := ch.y
	for _, r := range s.tasks[w] {
		if forward {
			lim := s.super[r+1]
			for t := s.first[r]; t <= r; t++ {
				ch.forwardSuper(int(t), y, ch.work[w].acc, lim)
			}
		} else {
			for t := r; t >= s.first[r]; t-- {
				ch.backwardSuper(int(t), y)
			}
		}
	}
}

// forwardSuper solves the diagonal block of supernode t and subtracts its
// contributions from the rows below: rows below lim go to y, rows at or
// beyond lim (top supernodes) are added to acc.
func (ch *Cholesky) forwardSuper(t int, y, acc []float64, lim int32) {
	s := ch.sym
	f := int(s.super[t])
	nc := int(s.super[t+1]) - f
	rows := s.rows[s.rowPtr[t]:s.rowPtr[t+1]]
	m := len(rows)
	lt := ch.lx[s.valPtr[t]:s.valPtr[t+1]]
	split := m
	if acc != nil {
		for split > nc && rows[split-1] >= lim {
			split--
		}
	}
	for k := 0; k < nc; k++ {
		col := lt[k*m : k*m+m]
		v := y[f+k] / col[k]
		y[f+k] = v
		if v == 0 {
			continue
		}
		for i := k + 1; i < nc; i++ {
			y[f+i] -= col[i] * v
		}
		for i := nc; i < split; i++ {
			y[rows[i]] -= col[i] * v
		}
		for i := split; i < m; i++ {
			acc[rows[i]] += col[i] * v
		}
	}
}

// backwardSuper solves supernode t's block of L^T x = y given the solved
// rows below it.
func (ch *Cholesky) backwardSuper(t int, y []float64) {
	s := ch.sym
	f := int(s.super[t])
	nc := int(s.super[t+1]) - f
	rows := s.rows[s.rowPtr[t]:s.rowPtr[t+1]]
	m := len(rows)
	lt := ch.lx[s.valPtr[t]:s.valPtr[t+1]]
	for k := nc - 1; k >= 0; k-- {
		col := lt[k*m : k*m+m]
		v := y[f+k]
		for i := k + 1; i < nc; i++ {
			v -= col[i] * y[f+i]
		}
		for i := nc; i < m; i++ {
			v -= col[i] * y[rows[i]]
		}
		y[f+k] = v / col[k]
	}
}

// NNZL returns the number of stored entries of the factor L (diagonal and
// relaxed-supernode zeros included) after Analyze.
func (ch *Cholesky) NNZL() int {
	if ch.sym == nil {
		return 0
	}
	return ch.sym.nnzL
}

// Flops returns the estimated multiply-add count of one Factor.
func (ch *Cholesky) Flops() float64 {
	if ch.sym == nil {
		return 0
	}
	return ch.sym.flops
}

// Perm returns the permutation in use (perm[k] is the original index of
// the k-th pivot), or nil before Analyze. The caller must not modify it.
func (ch *Cholesky) Perm() []int32 {
	if ch.sym == nil {
		return nil
	}
	return ch.sym.perm
}

// nonFinite names the first non-finite entry of b, else of x.
func nonFinite(b, x []float64) error {
	for i, v := range b {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return &NonFiniteError{Vector: "right-hand side", Index: i}
		}
	}
	for i, v := range x {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return &NonFiniteError{Vector: "solution", Index: i}
		}
	}
	return &NonFiniteError{Vector: "residual", Index: -1}
}
