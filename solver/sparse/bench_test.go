package sparse_test

import (
	"fmt"
	"math"
	"testing"
	"time"

	"polegap/solver/sparse"
)

// benchSizes are grid cell counts per side giving about 10k, 100k and 1M
// unknowns after removing the boundary.
var benchSizes = []int{101, 317, 1001}

func TestTimingTable(t *testing.T) {
	if testing.Short() || !*timing {
		t.Skip("timing table only with -timing")
	}
	for _, nx := range benchSizes {
		a := gridSystem(nx, 0.3)
		for _, o := range []sparse.Ordering{sparse.NestedDissection, sparse.AMD} {
			ch := &sparse.Cholesky{Options: sparse.CholeskyOptions{Ordering: o}}
			t0 := time.Now()
			ch.Analyze(a)
			t1 := time.Now()
			if err := ch.Factor(a); err != nil {
				t.Fatal(err)
			}
			t2 := time.Now()
			b := make([]float64, a.N)
			for i := range b {
				b[i] = math.Sin(float64(i))
			}
			x := make([]float64, a.N)
			res, _ := ch.SolveTo(x, b)
			t3 := time.Now()
			fmt.Printf("n=%8d %-18s nnzL=%10d flops=%.3g analyze=%v factor=%v solve=%v res=%.2g\n", a.N, o, ch.NNZL(), ch.Flops(), t1.Sub(t0), t2.Sub(t1), t3.Sub(t2), res.Residual)
		}
	}
}
