package sparse

import (
	"fmt"
	"math"
	"runtime"
	"sort"
	"sync"
)

// CSR is a square sparse matrix in compressed sparse row form. Both
// triangles of a symmetric matrix are stored, column indices within a row
// are strictly increasing, and explicit zeros in the pattern are allowed
// (assembly keeps the pattern fixed while values change).
type CSR struct {
	N      int
	RowPtr []int   // len N+1; row i occupies [RowPtr[i], RowPtr[i+1])
	Col    []int32 // column of each stored entry
	Val    []float64
}

// Dims returns the number of rows and columns.
func (a *CSR) Dims() (r, c int) { return a.N, a.N }

// NNZ returns the number of stored entries.
func (a *CSR) NNZ() int { return len(a.Col) }

// parallelNNZ is the stored-entry count above which MulVecTo splits rows
// over goroutines; below it the goroutine start-up costs more than it saves.
const parallelNNZ = 1 << 17

// Index returns the position of entry (i, j) in Col and Val, or -1 if the
// entry is not in the pattern. It uses binary search in row i.
func (a *CSR) Index(i, j int) int {
	if uint(i) >= uint(a.N) || uint(j) >= uint(a.N) {
		panic(errIndex)
	}
	lo, hi := a.RowPtr[i], a.RowPtr[i+1]
	c := int32(j)
	for lo < hi {
		m := int(uint(lo+hi) >> 1)
		if a.Col[m] < c {
			lo = m + 1
		} else {
			hi = m
		}
	}
	if lo < a.RowPtr[i+1] && a.Col[lo] == c {
		return lo
	}
	return -1
}

// At returns entry (i, j); entries outside the pattern are zero.
func (a *CSR) At(i, j int) float64 {
	if k := a.Index(i, j); k >= 0 {
		return a.Val[k]
	}
	return 0
}

// MulVecTo sets dst = A x. dst and x must have length N and must not
// overlap. Large matrices are multiplied on all available cores.
func (a *CSR) MulVecTo(dst, x []float64) {
	if len(dst) != a.N || len(x) != a.N {
		panic(errShape)
	}
	if a.NNZ() < parallelNNZ || runtime.GOMAXPROCS(0) < 2 {
		a.mulRows(dst, x, 0, a.N)
		return
	}
	p := runtime.GOMAXPROCS(0)
	if p > 8 {
		p = 8
	}
	var wg sync.WaitGroup
	lo := 0
	for w := 0; w < p; w++ {
		// Split rows so that each goroutine gets about the same nnz.
		target := a.RowPtr[a.N] * (w + 1) / p
		hi := sort.Search(a.N+1, func(r int) bool { return a.RowPtr[r] >= target })
		if w == p-1 {
			hi = a.N
		}
		if hi > lo {
			wg.Add(1)
			go func(lo, hi int) {
				a.mulRows(dst, x, lo, hi)
				wg.Done()
			}(lo, hi)
		}
		lo = hi
	}
	wg.Wait()
}

func (a *CSR) mulRows(dst, x []float64, lo, hi int) {
	col, val := a.Col, a.Val
	for i := lo; i < hi; i++ {
		var s float64
		for k := a.RowPtr[i]; k < a.RowPtr[i+1]; k++ {
			s += val[k] * x[col[k]]
		}
		dst[i] = s
	}
}

// Zero sets every stored value to zero and keeps the pattern.
func (a *CSR) Zero() {
	clear(a.Val)
}

// Clone returns a deep copy of a.
func (a *CSR) Clone() *CSR {
	return &CSR{
		N:      a.N,
		RowPtr: append([]int(nil), a.RowPtr...),
		Col:    append([]int32(nil), a.Col...),
		Val:    append([]float64(nil), a.Val...),
	}
}

// DiagTo copies the diagonal of a into dst and returns it; a nil or short
// dst is grown. Diagonal entries missing from the pattern are zero.
func (a *CSR) DiagTo(dst []float64) []float64 {
	if cap(dst) < a.N {
		dst = make([]float64, a.N)
	}
	dst = dst[:a.N]
	for i := 0; i < a.N; i++ {
		dst[i] = 0
		for k := a.RowPtr[i]; k < a.RowPtr[i+1]; k++ {
			if int(a.Col[k]) == i {
				dst[i] = a.Val[k]
				break
			}
		}
	}
	return dst
}

// Diag returns a new slice holding the diagonal of a.
func (a *CSR) Diag() []float64 { return a.DiagTo(nil) }

// Check verifies the CSR invariants: RowPtr is non-decreasing from 0 to
// NNZ, column indices are in range and strictly increasing within each row,
// and Val has one value per stored entry. It returns nil or an error naming
// the first violation.
func (a *CSR) Check() error {
	if a.N < 0 || len(a.RowPtr) != a.N+1 {
		return fmt.Errorf("sparse: len(RowPtr)=%d, want N+1=%d", len(a.RowPtr), a.N+1)
	}
	if a.RowPtr[0] != 0 || a.RowPtr[a.N] != len(a.Col) || len(a.Val) != len(a.Col) {
		return fmt.Errorf("sparse: RowPtr[0]=%d RowPtr[N]=%d len(Col)=%d len(Val)=%d",
			a.RowPtr[0], a.RowPtr[a.N], len(a.Col), len(a.Val))
	}
	for i := 0; i < a.N; i++ {
		if a.RowPtr[i+1] < a.RowPtr[i] {
			return fmt.Errorf("sparse: RowPtr decreases at row %d", i)
		}
		prev := int32(-1)
		for k := a.RowPtr[i]; k < a.RowPtr[i+1]; k++ {
			c := a.Col[k]
			if c < 0 || int(c) >= a.N {
				return fmt.Errorf("sparse: row %d has column %d out of range", i, c)
			}
			if c <= prev {
				return fmt.Errorf("sparse: row %d columns not strictly increasing at %d", i, c)
			}
			if math.IsNaN(a.Val[k]) || math.IsInf(a.Val[k], 0) {
				return fmt.Errorf("sparse: entry (%d,%d) is %g", i, c, a.Val[k])
			}
			prev = c
		}
	}
	return nil
}

// IsSymmetric reports whether the pattern is structurally symmetric and
// |a_ij - a_ji| <= tol*max(|a_ij|,|a_ji|) for every stored entry.
func (a *CSR) IsSymmetric(tol float64) bool {
	if !a.IsStructurallySymmetric() {
		return false
	}
	for i := 0; i < a.N; i++ {
		for k := a.RowPtr[i]; k < a.RowPtr[i+1]; k++ {
			j := int(a.Col[k])
			if j <= i {
				continue
			}
			t := a.Index(j, i)
			if t < 0 {
				return false
			}
			u, v := a.Val[k], a.Val[t]
			if math.Abs(u-v) > tol*math.Max(math.Abs(u), math.Abs(v)) {
				return false
			}
		}
	}
	return true
}

// Submatrix returns the rows and columns of a marked in keep, renumbered
// consecutively, and old, the original index of each kept row. keep must
// have length N. This is the matrix left after condensing Dirichlet nodes;
// the caller moves the dropped columns to the right-hand side.
func (a *CSR) Submatrix(keep []bool) (*CSR, []int32) {
	if len(keep) != a.N {
		panic(errShape)
	}
	newIdx := make([]int32, a.N)
	var old []int32
	for i, k := range keep {
		newIdx[i] = -1
		if k {
			newIdx[i] = int32(len(old))
			old = append(old, int32(i))
		}
	}
	m := len(old)
	b := &CSR{N: m, RowPtr: make([]int, m+1)}
	for r, i := range old {
		cnt := 0
		for k := a.RowPtr[i]; k < a.RowPtr[i+1]; k++ {
			if newIdx[a.Col[k]] >= 0 {
				cnt++
			}
		}
		b.RowPtr[r+1] = b.RowPtr[r] + cnt
	}
	b.Col = make([]int32, b.RowPtr[m])
	b.Val = make([]float64, b.RowPtr[m])
	for r, i := range old {
		p := b.RowPtr[r]
		for k := a.RowPtr[i]; k < a.RowPtr[i+1]; k++ {
			if c := newIdx[a.Col[k]]; c >= 0 {
				b.Col[p] = c
				b.Val[p] = a.Val[k]
				p++
			}
		}
	}
	return b, old
}

// IsStructurallySymmetric reports whether (j,i) is in the pattern for every
// stored (i,j). It runs in O(NNZ) time with one pass and N extra ints.
func (a *CSR) IsStructurallySymmetric() bool {
	next := make([]int, a.N) // next unmatched entry of each row, left of the diagonal
	copy(next, a.RowPtr[:a.N])
	for i := 0; i < a.N; i++ {
		for k := a.RowPtr[i]; k < a.RowPtr[i+1]; k++ {
			j := int(a.Col[k])
			if j <= i {
				continue
			}
			// Row j must hold (j,i) as its next entry left of the diagonal.
			p := next[j]
			if p >= a.RowPtr[j+1] || int(a.Col[p]) != i {
				return false
			}
			next[j]++
		}
	}
	for j := 0; j < a.N; j++ {
		if p := next[j]; p < a.RowPtr[j+1] && int(a.Col[p]) < j {
			return false // (j,i) with i < j has no partner (i,j)
		}
	}
	return true
}
