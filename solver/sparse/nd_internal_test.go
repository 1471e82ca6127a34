package sparse

import (
	"fmt"
	"testing"
	"time"
)

func TestNDVariants(t *testing.T) {
	if !testing.Verbose() || testing.Short() {
		t.Skip()
	}
	for _, m := range []int{300, 1000} {
		a := grid5(m)
		for _, it := range []int{0, 1, 2} {
			ndHintIters = it
			c0 := time.Now()
			p := Order(a, NestedDissection)
			el := time.Since(c0)
			s := analyze(a, p, 1)
			fmt.Printf("m=%d iters=%d order=%v nnzL=%d flops=%.3g\n", m, it, el, s.nnzL, s.flops)
		}
	}
	ndHintIters = 1
}

func BenchmarkOrderGrid5(b *testing.B) {
	a := grid5(1000)
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		Order(a, NestedDissection)
	}
}

func BenchmarkBFS(b *testing.B) {
	a := grid5(1000)
	g := newGraph(a)
	nd := &ndState{g: g, perm: make([]int32, g.n), vx: make([]ndVertex, g.n)}
	ws := nd.newWork()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		nd.bfs(0, 0, ws)
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(len(g.adj)), "ns/edge")
}
