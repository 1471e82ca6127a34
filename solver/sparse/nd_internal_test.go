package sparse

import (
	"os"
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
	if os.Getenv("POLEGAP_SPARSE_TUNING") == "" {
		t.Skip("tuning table: set POLEGAP_SPARSE_TUNING=1 and run with -v")
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

// TestNDParallelPath orders a graph large enough for the concurrent
// halves (run under -race to check the shared vertex state).
func TestNDParallelPath(t *testing.T) {
	a := grid5(240) // 57600 vertices > ndParallel
	p := Order(a, NestedDissection)
	if !IsPermutation(p) {
		t.Fatal("not a permutation")
	}
	// Same result as a second run: the dissection is deterministic even
	// though halves run concurrently.
	q := Order(a, NestedDissection)
	for k := range p {
		if p[k] != q[k] {
			t.Fatalf("orderings differ at %d", k)
		}
	}
}
