package sparse_test

import (
	"math"
	"testing"

	"polegap/solver/sparse"
)

// TestRefactorAllocs checks that numeric refactorization and solves reuse
// the symbolic analysis and the work buffers (STYLE habit 6).
func TestRefactorAllocs(t *testing.T) {
	a := gridSystem(60, 0.3)
	b := make([]float64, a.N)
	for i := range b {
		b[i] = math.Cos(float64(i))
	}
	x := make([]float64, a.N)
	for _, w := range []int{1, 2} {
		ch := &sparse.Cholesky{Options: sparse.CholeskyOptions{Workers: w}}
		ch.Analyze(a)
		ch.Factor(a)
		if n := testing.AllocsPerRun(5, func() { ch.Factor(a) }); n != 0 {
			t.Errorf("workers=%d: Factor allocates %v times per run", w, n)
		}
		if n := testing.AllocsPerRun(5, func() { ch.SolveTo(x, b) }); n != 0 {
			t.Errorf("workers=%d: SolveTo allocates %v times per run", w, n)
		}
	}
	p := &sparse.PCG{}
	p.Analyze(a)
	p.Factor(a)
	if n := testing.AllocsPerRun(5, func() { p.Factor(a) }); n != 0 {
		t.Errorf("PCG Factor allocates %v times per run", n)
	}
}

func TestMisusePanics(t *testing.T) {
	a := gridSystem(5, 0)
	cases := map[string]func(){
		"factor before analyze": func() { (&sparse.Cholesky{}).Factor(a) },
		"solve before factor": func() {
			c := &sparse.Cholesky{}
			c.Analyze(a)
			c.SolveTo(make([]float64, a.N), make([]float64, a.N))
		},
		"short x": func() {
			c := &sparse.Cholesky{}
			c.Analyze(a)
			c.Factor(a)
			c.SolveTo(make([]float64, 1), make([]float64, a.N))
		},
		"pattern changed": func() {
			c := &sparse.PCG{}
			c.Analyze(a)
			c.Factor(gridSystem(6, 0))
		},
		"mulvec shape": func() { a.MulVecTo(make([]float64, 2), make([]float64, a.N)) },
		"index range":  func() { a.Index(-1, 0) },
		"triplet add":  func() { sparse.NewTriplet(2, 0).Add(2, 0, 1) },
		"elements":     func() { sparse.PatternFromElements(4, []int32{0, 1}, 3) },
		"kind":         func() { sparse.New(sparse.Kind(99), 3) },
		"unsymmetric": func() {
			t := sparse.NewTriplet(2, 3)
			t.Add(0, 0, 1)
			t.Add(1, 1, 1)
			t.Add(0, 1, 1)
			(&sparse.Cholesky{}).Analyze(t.ToCSR())
		},
	}
	for name, f := range cases {
		func() {
			defer func() {
				r := recover()
				if s, ok := r.(string); !ok || len(s) < 8 || s[:8] != "sparse: " {
					t.Errorf("%s: recovered %v, want a \"sparse: ...\" panic", name, r)
				}
			}()
			f()
		}()
	}
}
