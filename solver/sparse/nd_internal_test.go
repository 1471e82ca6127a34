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
