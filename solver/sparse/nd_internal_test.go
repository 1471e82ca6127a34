package sparse

import (
	"fmt"
	"os"
	"strconv"
	"strings"
	"testing"
	"time"
)

func BenchmarkOrderGrid5(b *testing.B) {
	a := grid5(1000)
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		Order(a, NestedDissection)
	}
}

func loadMTX(t testing.TB, f string) *CSR {
	fh, err := os.Open(f)
	if err != nil {
		t.Skip(err)
	}
	defer fh.Close()
	a, err := ReadMatrixMarket(fh)
	if err != nil {
		t.Fatal(err)
	}
	return a
}

// TestMLNDCompare prints nnz(L), operations and ordering time of the
// multilevel nested dissection and AMD on the C-core matrices (set
// POLEGAP_SPARSE_TUNING=1, and ML1M=1 to include the 1M matrix).
func TestMLNDCompare(t *testing.T) {
	if os.Getenv("POLEGAP_SPARSE_TUNING") == "" {
		t.Skip("tuning table")
	}
	files := []string{"/tmp/ccore10k.mtx", "/tmp/ccore100k.mtx"}
	if os.Getenv("ML1M") != "" {
		files = append(files, "/tmp/ccore1m.mtx")
	}
	for _, f := range files {
		a := loadMTX(t, f)
		for _, name := range []string{"ml", "amd"} {
			t0 := time.Now()
			var p []int32
			switch name {
			case "ml":
				p = multilevelND(newGraph(a), NDOptions{})
			case "amd":
				p = amdOrder(newGraph(a))
			}
			dt := time.Since(t0)
			if !IsPermutation(p) {
				t.Fatal("not perm")
			}
			s := analyze(a, p, 1, SupernodeOptions{})
			t.Logf("%s n=%d %s: nnzL=%d flops=%.3g order %.3fs", f, a.N, name, s.nnzL, s.flops, dt.Seconds())
		}
	}
}

// TestMLNDKnobs orders the 100k C-core matrix (or ML_FILE) single-threaded
// under settings of the tuning knobs, e.g.
// ML_KNOBS="base;trials=2,passes=2;leaf=600", printing operations and the
// best of three ordering times (POLEGAP_SPARSE_TUNING=1).
func TestMLNDKnobs(t *testing.T) {
	if os.Getenv("POLEGAP_SPARSE_TUNING") == "" {
		t.Skip("tuning table")
	}
	a := loadMTX(t, "/tmp/ccore100k.mtx")
	if f := os.Getenv("ML_FILE"); f != "" {
		a = loadMTX(t, f)
	}
	opt := NDOptions{Parallel: -1}
	run := func(label string) {
		best, bestCPU := time.Hour, 1e9
		var p []int32
		for r := 0; r < 3; r++ {
			c0 := cpuNow()
			t0 := time.Now()
			p = multilevelND(newGraph(a), opt)
			best = min(best, time.Since(t0))
			bestCPU = min(bestCPU, cpuNow()-c0)
		}
		s := analyze(a, p, 1, SupernodeOptions{})
		fmt.Printf("%-28s nnzL=%d flops=%.3g order %.3fs cpu %.3fs\n", label, s.nnzL, s.flops, best.Seconds(), bestCPU)
	}
	type knob struct {
		name string
		p    *int
	}
	knobs := []knob{{"leaf", &opt.Leaf}, {"trials", &opt.Trials}, {"initpasses", &opt.InitPasses}, {"passes", &opt.Passes}, {"coarsento", &opt.CoarsenTo}}
	spec := os.Getenv("ML_KNOBS") // e.g. "trials=4,coarsento=80;trials=2"
	if spec == "" {
		spec = "base"
	}
	for _, set := range strings.Split(spec, ";") {
		saved := opt
		for _, kv := range strings.Split(set, ",") {
			k, v, ok := strings.Cut(kv, "=")
			if !ok {
				continue
			}
			for _, kn := range knobs {
				if kn.name == k {
					*kn.p, _ = strconv.Atoi(v)
				}
			}
		}
		run(set)
		opt = saved
	}
}

// BenchmarkMLND100k orders the 100k C-core matrix.
func BenchmarkMLND100k(b *testing.B) {
	a := loadMTX(b, "/tmp/ccore100k.mtx")
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		multilevelND(newGraph(a), NDOptions{})
	}
}
