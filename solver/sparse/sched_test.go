package sparse

import (
	"fmt"
	"testing"
)

func TestScheduleInfo(t *testing.T) {
	if testing.Short() || !testing.Verbose() {
		t.Skip()
	}
	for _, nx := range []int{101, 317} {
		// 5-point grid: interior nodes of an nx×nx cell grid.
		m := nx - 1
		tr := NewTriplet(m*m, 5*m*m)
		for j := 0; j < m; j++ {
			for i := 0; i < m; i++ {
				k := j*m + i
				tr.Add(k, k, 4)
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
		a := tr.ToCSR()
		s := analyze(a, Order(a, DefaultOrdering), 2)
		topw := 0.0
		for _, t := range s.top {
			topw += s.work[t]
		}
		loads := []float64{}
		for _, b := range s.tasks {
			l := 0.0
			for _, r := range b {
				for t := s.first[r]; t <= r; t++ {
					l += s.work[t]
				}
			}
			loads = append(loads, l)
		}
		fmt.Printf("n=%d ns=%d flops=%.3g top=%.3g (%d supernodes) loads=%.3g\n", a.N, s.ns, s.flops, topw, len(s.top), loads)
	}
}

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
	old := parallelSuperWork
	parallelSuperWork = 0
	defer func() { parallelSuperWork = old }()
	for _, m := range []int{80, 110} {
		a := grid5(m)
		ser := &Cholesky{Options: CholeskyOptions{Workers: 1}}
		par := &Cholesky{Options: CholeskyOptions{Workers: 2}}
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
	}
}
