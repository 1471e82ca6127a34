package sparse

import (
	"runtime"
	"slices"
	"sync"
)

// Triplet is a square matrix in coordinate (COO) form, the easy way to
// build a small matrix entry by entry. Duplicate entries are summed by
// ToCSR. For finite-element assembly prefer PatternFromElements followed by
// adding into CSR.Val through CSR.Index.
type Triplet struct {
	N int
	I []int32
	J []int32
	V []float64
}

// NewTriplet returns an empty n×n triplet matrix with room for nnz entries.
func NewTriplet(n, nnz int) *Triplet {
	return &Triplet{N: n, I: make([]int32, 0, nnz), J: make([]int32, 0, nnz), V: make([]float64, 0, nnz)}
}

// Add appends entry (i, j) with value v. It panics if i or j is out of range.
func (t *Triplet) Add(i, j int, v float64) {
	if uint(i) >= uint(t.N) || uint(j) >= uint(t.N) {
		panic(errIndex)
	}
	t.I = append(t.I, int32(i))
	t.J = append(t.J, int32(j))
	t.V = append(t.V, v)
}

// ToCSR returns the matrix in CSR form with sorted columns and duplicate
// entries summed. Entries whose sum is zero stay in the pattern.
func (t *Triplet) ToCSR() *CSR {
	n := t.N
	a := &CSR{N: n, RowPtr: make([]int, n+1)}
	for _, i := range t.I {
		a.RowPtr[i+1]++
	}
	for i := 0; i < n; i++ {
		a.RowPtr[i+1] += a.RowPtr[i]
	}
	col := make([]int32, len(t.I))
	val := make([]float64, len(t.I))
	next := append([]int(nil), a.RowPtr[:n]...)
	for k, i := range t.I {
		p := next[i]
		col[p] = t.J[k]
		val[p] = t.V[k]
		next[i]++
	}
	// Sort each row by column and merge duplicates in place.
	out := 0
	start := 0
	for i := 0; i < n; i++ {
		lo, hi := start, a.RowPtr[i+1]
		start = hi
		insertionSortPairs(col[lo:hi], val[lo:hi])
		a.RowPtr[i] = out
		for k := lo; k < hi; k++ {
			if out > a.RowPtr[i] && col[out-1] == col[k] {
				val[out-1] += val[k]
				continue
			}
			col[out] = col[k]
			val[out] = val[k]
			out++
		}
	}
	a.RowPtr[n] = out
	a.Col = slices.Clip(col[:out])
	a.Val = slices.Clip(val[:out])
	return a
}

// insertionSortPairs sorts c ascending and permutes v alongside; rows of a
// finite-element matrix are short, so insertion sort wins.
func insertionSortPairs(c []int32, v []float64) {
	if len(c) > 64 {
		idx := make([]int, len(c))
		for k := range idx {
			idx[k] = k
		}
		slices.SortStableFunc(idx, func(x, y int) int { return int(c[x]) - int(c[y]) })
		c2 := make([]int32, len(c))
		v2 := make([]float64, len(v))
		for k, p := range idx {
			c2[k], v2[k] = c[p], v[p]
		}
		copy(c, c2)
		copy(v, v2)
		return
	}
	for k := 1; k < len(c); k++ {
		ck, vk := c[k], v[k]
		m := k - 1
		for m >= 0 && c[m] > ck {
			c[m+1], v[m+1] = c[m], v[m]
			m--
		}
		c[m+1], v[m+1] = ck, vk
	}
}

func insertionSort32(c []int32) {
	if len(c) > 64 {
		slices.Sort(c)
		return
	}
	for k := 1; k < len(c); k++ {
		ck := c[k]
		m := k - 1
		for m >= 0 && c[m] > ck {
			c[m+1] = c[m]
			m--
		}
		c[m+1] = ck
	}
}

// PatternFromElements returns the n×n pattern coupling every pair of nodes
// that share an element, with the full diagonal, sorted columns and zero
// values. elems lists nodesPerElem node indices per element (e.g. 3 for P1
// and 6 for P2 triangles). Nodes that belong to no element get a diagonal
// entry only. Two counting passes over a node-to-element map keep the
// memory near the size of the result; large meshes use all cores.
func PatternFromElements(n int, elems []int32, nodesPerElem int) *CSR {
	if nodesPerElem <= 0 || len(elems)%nodesPerElem != 0 {
		panic(errNodes)
	}
	ne := len(elems) / nodesPerElem
	// Node-to-element map in CSR form.
	nePtr := make([]int32, n+1)
	for _, v := range elems {
		if v < 0 || int(v) >= n {
			panic(errIndex)
		}
		nePtr[v+1]++
	}
	for i := 0; i < n; i++ {
		nePtr[i+1] += nePtr[i]
	}
	neIdx := make([]int32, len(elems))
	fill := append([]int32(nil), nePtr[:n]...)
	for e := 0; e < ne; e++ {
		for _, v := range elems[e*nodesPerElem : (e+1)*nodesPerElem] {
			neIdx[fill[v]] = int32(e)
			fill[v]++
		}
	}
	fill = nil

	a := &CSR{N: n, RowPtr: make([]int, n+1)}
	workers := runtime.GOMAXPROCS(0)
	if n < 20000 || workers < 2 {
		workers = 1
	}
	if workers > 8 {
		workers = 8
	}
	chunk := (n + workers - 1) / workers
	run := func(pass func(lo, hi int, mark []int32)) {
		var wg sync.WaitGroup
		for w := 0; w < workers; w++ {
			lo, hi := w*chunk, min((w+1)*chunk, n)
			if lo >= hi {
				continue
			}
			wg.Add(1)
			go func() {
				defer wg.Done()
				mark := make([]int32, n)
				for k := range mark {
					mark[k] = -1
				}
				pass(lo, hi, mark)
			}()
		}
		wg.Wait()
	}
	// Pass 1: count distinct neighbours of each node.
	run(func(lo, hi int, mark []int32) {
		for i := lo; i < hi; i++ {
			cnt := 1
			mark[i] = int32(i)
			for _, e := range neIdx[nePtr[i]:nePtr[i+1]] {
				for _, v := range elems[int(e)*nodesPerElem : (int(e)+1)*nodesPerElem] {
					if mark[v] != int32(i) {
						mark[v] = int32(i)
						cnt++
					}
				}
			}
			a.RowPtr[i+1] = cnt
		}
	})
	for i := 0; i < n; i++ {
		a.RowPtr[i+1] += a.RowPtr[i]
	}
	a.Col = make([]int32, a.RowPtr[n])
	a.Val = make([]float64, a.RowPtr[n])
	// Pass 2: fill and sort.
	run(func(lo, hi int, mark []int32) {
		for i := lo; i < hi; i++ {
			p := a.RowPtr[i]
			a.Col[p] = int32(i)
			p++
			mark[i] = int32(i)
			for _, e := range neIdx[nePtr[i]:nePtr[i+1]] {
				for _, v := range elems[int(e)*nodesPerElem : (int(e)+1)*nodesPerElem] {
					if mark[v] != int32(i) {
						mark[v] = int32(i)
						a.Col[p] = v
						p++
					}
				}
			}
			insertionSort32(a.Col[a.RowPtr[i]:p])
		}
	})
	return a
}
