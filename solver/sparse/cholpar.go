package sparse

// defaultSplitWork is the default of CholeskyOptions.SplitWork: the
// estimated multiply-add count of a supernode in the top of the
// elimination tree above which Factor splits its columns between two
// goroutines.
const defaultSplitWork = 4e6

// splitJob is the helper goroutine's half of a two-way column split.
type splitJob struct {
	update bool // true: descendant updates; false: trailing panel update
	t      int
	c0, c1 int
	lt     []float64
	m      int
	k0, k1 int
}

func (ch *Cholesky) runJob() {
	j := &ch.job
	if j.update {
		ch.updateCols(j.t, ch.work[0].rel, ch.work[1].c, j.c0, j.c1)
		return
	}
	trailingCols(j.lt, j.m, j.k0, j.k1, j.c0, j.c1)
}

// trailingCols applies the panel [k0,k1) of an m-row trapezoid to its
// columns [c0,c1) (c0 >= k1), rows from each column's diagonal down.
func trailingCols(b []float64, m, k0, k1, c0, c1 int) {
	if c1 > c0 {
		syrkLowerSub(b[c0+c0*m:], m, b[c0+k0*m:], m, m-c0, c1-c0, k1-k0)
	}
}

// splitCols returns h in [lo,hi] such that columns [lo,h) and [h,hi) of an
// m-row lower trapezoid (column c has m-c rows) hold about equal areas.
func splitCols(m, lo, hi int) int {
	total := 0.0
	for c := lo; c < hi; c++ {
		total += float64(m - c)
	}
	acc := 0.0
	for c := lo; c < hi; c++ {
		acc += float64(m - c)
		if acc >= total/2 {
			return c + 1
		}
	}
	return hi
}

// factorSuperPar is factorSuper's update and dense factorization with the
// columns split between this goroutine and one helper.
func (ch *Cholesky) factorSuperPar(t int, lt []float64, m, nc int) error {
	s := ch.sym
	h := splitCols(m, 0, nc)
	ch.job = splitJob{update: true, t: t, c0: h, c1: nc}
	ch.wg.Add(1)
	ch.pool.run(ch.helperFn)
	ch.updateCols(t, ch.work[0].rel, ch.work[0].c, 0, h)
	ch.wg.Wait()
	for k0 := 0; k0 < nc; k0 += panelBlock {
		k1 := min(k0+panelBlock, nc)
		if k, piv := potrfPanel(lt, m, k0, k1); k >= 0 {
			return &NotPositiveDefiniteError{Column: int(s.perm[int(s.super[t])+k]), Pivot: piv}
		}
		if k1 == nc {
			break
		}
		h := splitCols(m, k1, nc)
		if nc-k1 < 2*panelBlock {
			trailingCols(lt, m, k0, k1, k1, nc)
			continue
		}
		ch.job = splitJob{t: t, lt: lt, m: m, k0: k0, k1: k1, c0: h, c1: nc}
		ch.wg.Add(1)
		ch.pool.run(ch.helperFn)
		trailingCols(lt, m, k0, k1, k1, h)
		ch.wg.Wait()
	}
	return nil
}
