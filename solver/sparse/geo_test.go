package sparse_test

import (
	"fmt"
	"testing"

	"polegap/solver/sparse"
)

// geoND orders the interior nodes of an nx×nx grid (gridSystem numbering)
// by recursive straight-line bisection: the ideal separators of George
// (1973), used to judge the graph orderings.
func geoND(nx int) []int32 {
	m := nx - 1
	perm := make([]int32, 0, m*m)
	var rec func(i0, i1, j0, j1 int)
	rec = func(i0, i1, j0, j1 int) {
		if i1 <= i0 || j1 <= j0 {
			return
		}
		if (i1-i0)*(j1-j0) <= 16 {
			for j := j0; j < j1; j++ {
				for i := i0; i < i1; i++ {
					perm = append(perm, int32(j*m+i))
				}
			}
			return
		}
		if i1-i0 >= j1-j0 {
			c := (i0 + i1) / 2
			rec(i0, c, j0, j1)
			rec(c+1, i1, j0, j1)
			for j := j0; j < j1; j++ {
				perm = append(perm, int32(j*m+c))
			}
		} else {
			c := (j0 + j1) / 2
			rec(i0, i1, j0, c)
			rec(i0, i1, c+1, j1)
			for i := i0; i < i1; i++ {
				perm = append(perm, int32(c*m+i))
			}
		}
	}
	rec(0, m, 0, m)
	return perm
}

func TestGeoCompare(t *testing.T) {
	if !*timing {
		t.Skip()
	}
	for _, nx := range []int{101, 317, 1001} {
		a := gridSystem(nx, 0.3)
		for _, c := range []struct {
			name string
			opt  sparse.CholeskyOptions
		}{
			{"geometric", sparse.CholeskyOptions{Perm: geoND(nx)}},
			{"nd", sparse.CholeskyOptions{Ordering: sparse.NestedDissection}},
			{"amd", sparse.CholeskyOptions{Ordering: sparse.AMD}},
		} {
			ch := &sparse.Cholesky{Options: c.opt}
			ch.Analyze(a)
			fmt.Printf("n=%d %-10s nnzL=%d flops=%.3g\n", a.N, c.name, ch.NNZL(), ch.Flops())
		}
	}
}
