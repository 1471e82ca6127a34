package sparse_test

import (
	"fmt"
	"testing"
	"time"

	"polegap/solver/sparse"
)

func TestProfAnalyze(t *testing.T) {
	if !*timing {
		t.Skip()
	}
	a := gridSystem(1001, 0.3)
	t0 := time.Now()
	p := sparse.Order(a, sparse.NestedDissection)
	fmt.Println("order", time.Since(t0), len(p))
	ch := &sparse.Cholesky{}
	t0 = time.Now()
	ch.Analyze(a)
	fmt.Println("analyze", time.Since(t0))
}
