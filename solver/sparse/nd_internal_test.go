package sparse

import (
	"testing"
)

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

func TestNDCheap(t *testing.T) {
	if !testing.Verbose() {
		t.Skip()
	}
	for _, a := range []*CSR{grid5(1000), grid5(316)} {
		for _, c := range []int{0, 5000, 20000} {
			ndCheapBelow = c
			s := analyze(a, Order(a, NestedDissection), 1)
			t.Logf("n=%d cheap below %d: nnzL=%d flops=%.3g", a.N, c, s.nnzL, s.flops)
		}
	}
	ndCheapBelow = 5000
}
