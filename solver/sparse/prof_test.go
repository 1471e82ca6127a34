package sparse_test

import (
	"fmt"
	"testing"
	"time"

	"polegap/solver/sparse"
)

func TestProfFactor(t *testing.T) {
	if !*timing {
		t.Skip()
	}
	a := gridSystem(1001, 0.3)
	ch := &sparse.Cholesky{}
	t0 := time.Now()
	ch.Analyze(a)
	fmt.Println("analyze", time.Since(t0))
	for k := 0; k < 2; k++ {
		t0 = time.Now()
		ch.Factor(a)
		fmt.Println("factor", time.Since(t0))
	}
}
