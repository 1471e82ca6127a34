package sparse

import (
	"runtime"
	"testing"
	"time"
)

func grid5(m int) *CSR {
	tr := NewTriplet(m*m, 5*m*m)
	for j := 0; j < m; j++ {
		for i := 0; i < m; i++ {
			k := j*m + i
			tr.Add(k, k, 4.01)
			if i > 0 {
				tr.Add(k, k-1, -1)
			}
			if i < m-1 {
				tr.Add(k, k+1, -1)
			}
			if j > 0 {
				tr.Add(k, k-m, -1)
			}
			if j < m-1 {
				tr.Add(k, k+m, -1)
			}
		}
	}
	return tr.ToCSR()
}

// TestParallelTopSplit forces the two-way column split on every top
// supernode and compares the factor with the serial one: the same
// products summed in the same order per entry, so equal to rounding.
func TestParallelTopSplit(t *testing.T) {
	for _, m := range []int{80, 110} {
		a := grid5(m)
		ser := &Cholesky{Options: CholeskyOptions{Workers: 1}}
		par := &Cholesky{Options: CholeskyOptions{Workers: 2, SplitWork: -1}}
		for _, c := range []*Cholesky{ser, par} {
			c.Analyze(a)
			if err := c.Factor(a); err != nil {
				t.Fatal(err)
			}
		}
		if len(par.sym.tasks) == 0 || len(par.sym.top) == 0 {
			t.Fatalf("m=%d: no parallel schedule (flops %.3g)", m, par.sym.flops)
		}
		// Both factor P A P^T = L L^T with the same P, so L is unique.
		if len(ser.lx) != len(par.lx) {
			t.Fatalf("m=%d: factor sizes differ", m)
		}
		for k := range ser.lx {
			if d := ser.lx[k] - par.lx[k]; d > 1e-12 || d < -1e-12 {
				t.Fatalf("m=%d: factor entry %d: serial %v parallel %v", m, k, ser.lx[k], par.lx[k])
			}
		}
		// The parallel triangular solves sum the same terms in another
		// order: solutions agree to rounding, relative 1e-12 for this
		// well-conditioned (shifted) Laplacian.
		b := make([]float64, a.N)
		for i := range b {
			b[i] = float64(i%13) - 6
		}
		xs := make([]float64, a.N)
		xp := make([]float64, a.N)
		rs, err1 := ser.SolveTo(xs, b)
		rp, err2 := par.SolveTo(xp, b)
		if err1 != nil || err2 != nil || rs.Residual > 1e-12 || rp.Residual > 1e-12 {
			t.Fatalf("m=%d: residuals %g %g, errors %v %v", m, rs.Residual, rp.Residual, err1, err2)
		}
		num, den := 0.0, 0.0
		for i := range xs {
			num += (xs[i] - xp[i]) * (xs[i] - xp[i])
			den += xs[i] * xs[i]
		}
		if num > 1e-24*den {
			t.Fatalf("m=%d: parallel solve differs: relative %g", m, num/den)
		}
		if n := testing.AllocsPerRun(5, func() { par.SolveTo(xp, b) }); n != 0 {
			t.Errorf("m=%d: parallel SolveTo allocates %v times", m, n)
		}
	}
}

// TestColCountsGNP compares the nearly-linear column counts with the
// direct row-subtree walk on grids, random matrices and a disconnected
// matrix.
func TestColCountsGNP(t *testing.T) {
	mats := []*CSR{grid5(1), grid5(7), grid5(40)}
	tr := NewTriplet(300, 0)
	for i := 0; i < 300; i++ {
		tr.Add(i, i, 1)
		j := (i * 7919) % 300
		if j != i && i%5 != 0 {
			tr.Add(i, j, 1)
			tr.Add(j, i, 1)
		}
	}
	mats = append(mats, tr.ToCSR())
	for k, a := range mats {
		for _, o := range []Ordering{Natural, NestedDissection, AMD} {
			s := analyze(a, Order(a, o), 1, SupernodeOptions{})
			want := s.colCountsNaive(a)
			got := s.colCountsGNP(a)
			for j := range want {
				if got[j] != want[j] {
					t.Fatalf("matrix %d %v: count of column %d = %d, want %d", k, o, j, got[j], want[j])
				}
			}
		}
	}
}

// TestParallelFactorAllocs checks that a parallel refactor, with worker
// subtrees and top supernode splits, allocates nothing (the goroutines
// come from the solver's pool).
func TestParallelFactorAllocs(t *testing.T) {
	a := grid5(90)
	c := &Cholesky{Options: CholeskyOptions{Workers: 2, SplitWork: -1}}
	c.Analyze(a)
	if len(c.sym.tasks) == 0 {
		t.Fatal("no parallel schedule")
	}
	c.Factor(a)
	if n := testing.AllocsPerRun(10, func() { c.Factor(a) }); n != 0 {
		t.Errorf("parallel Factor allocates %v times per run", n)
	}
}

// TestPoolCleanup drops solvers with pools and checks that their
// goroutines end.
func TestPoolCleanup(t *testing.T) {
	a := grid5(90)
	before := runtime.NumGoroutine()
	for k := 0; k < 20; k++ {
		c := &Cholesky{Options: CholeskyOptions{Workers: 2}}
		c.Analyze(a)
		c.Factor(a)
	}
	for try := 0; try < 100; try++ {
		runtime.GC()
		time.Sleep(10 * time.Millisecond)
		if runtime.NumGoroutine() <= before+2 {
			return
		}
	}
	t.Errorf("goroutines: %d before, %d after dropping 20 solvers", before, runtime.NumGoroutine())
}

// TestCheckCatches corrupts a symbolic factor and expects Check to object.
func TestCheckCatches(t *testing.T) {
	a := grid5(12)
	for name, corrupt := range map[string]func(s *symbolic){
		"perm":   func(s *symbolic) { s.perm[0] = s.perm[1] },
		"parent": func(s *symbolic) { s.parent[3] = 1 },
		"rows": func(s *symbolic) {
			t := s.ns - 2
			rs := s.rows[s.rowPtr[t]:s.rowPtr[t+1]]
			rs[len(rs)-1] = rs[0]
		},
	} {
		c := &Cholesky{}
		c.Analyze(a)
		if err := c.Check(); err != nil {
			t.Fatalf("%s: fresh factor fails Check: %v", name, err)
		}
		corrupt(c.sym)
		if c.Check() == nil {
			t.Errorf("%s: Check missed the corruption", name)
		}
	}
}
