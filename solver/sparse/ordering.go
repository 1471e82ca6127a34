package sparse

import "fmt"

// Ordering selects the fill-reducing symmetric permutation used by
// Cholesky.
type Ordering int

const (
	// DefaultOrdering picks the ordering measured best on 2D
	// finite-element matrices: AMD below defaultAMDBelow (50k) unknowns,
	// NestedDissection above (see doc.go, Orderings, for the figures).
	DefaultOrdering Ordering = iota
	// Natural keeps the caller's numbering.
	Natural
	// NestedDissection recursively removes vertex separators found by
	// multilevel graph bisection (Karypis and Kumar 1998) and numbers
	// each separator after the two parts it separates; see mlnd.go.
	NestedDissection
	// AMD is approximate minimum degree (Amestoy, Davis, Duff 1996).
	AMD
)

func (o Ordering) String() string {
	switch o {
	case DefaultOrdering:
		return "default"
	case Natural:
		return "natural"
	case NestedDissection:
		return "nested-dissection"
	case AMD:
		return "amd"
	}
	return fmt.Sprintf("Ordering(%d)", int(o))
}

// Order returns a fill-reducing permutation of the symmetric pattern of a:
// perm[k] is the original index of the row and column placed k-th. Values
// are ignored. NestedDissection runs with the default NDOptions. It panics
// on an unknown ordering.
func Order(a *CSR, o Ordering) []int32 {
	return order(a, o, NDOptions{})
}

// OrderND returns the NestedDissection permutation of the symmetric
// pattern of a under the tuning opt (see Order; the zero NDOptions gives
// Order(a, NestedDissection)).
func OrderND(a *CSR, opt NDOptions) []int32 {
	return order(a, NestedDissection, opt)
}

// order is Order with the nested dissection options nd.
func order(a *CSR, o Ordering, nd NDOptions) []int32 {
	if o == DefaultOrdering {
		o = NestedDissection
		if a.N < defaultAMDBelow {
			o = AMD
		}
	}
	switch o {
	case Natural:
		p := make([]int32, a.N)
		for i := range p {
			p[i] = int32(i)
		}
		return p
	case NestedDissection:
		return multilevelND(newGraph(a), nd)
	case AMD:
		return amdOrder(newGraph(a))
	}
	panic("sparse: unknown ordering")
}

// IsPermutation reports whether p holds each of 0..len(p)-1 exactly once.
func IsPermutation(p []int32) bool {
	seen := make([]bool, len(p))
	for _, v := range p {
		if v < 0 || int(v) >= len(p) || seen[v] {
			return false
		}
		seen[v] = true
	}
	return true
}

// graph is an undirected adjacency structure without self loops.
type graph struct {
	n   int
	ptr []int
	adj []int32
}

// newGraph returns the adjacency of the symmetric pattern of a (the union
// of the pattern and its transpose), without the diagonal.
func newGraph(a *CSR) *graph {
	n := a.N
	g := &graph{n: n, ptr: make([]int, n+1)}
	// Use the pattern directly when it is structurally symmetric,
	// otherwise the union of the pattern and its transpose.
	sym := a.IsStructurallySymmetric()
	if !sym {
		t := NewTriplet(n, 2*a.NNZ())
		for i := 0; i < n; i++ {
			for k := a.RowPtr[i]; k < a.RowPtr[i+1]; k++ {
				t.Add(i, int(a.Col[k]), 0)
				t.Add(int(a.Col[k]), i, 0)
			}
		}
		a = t.ToCSR()
	}
	for i := 0; i < n; i++ {
		c := 0
		for k := a.RowPtr[i]; k < a.RowPtr[i+1]; k++ {
			if int(a.Col[k]) != i {
				c++
			}
		}
		g.ptr[i+1] = g.ptr[i] + c
	}
	g.adj = make([]int32, g.ptr[n])
	p := 0
	for i := 0; i < n; i++ {
		for k := a.RowPtr[i]; k < a.RowPtr[i+1]; k++ {
			if int(a.Col[k]) != i {
				g.adj[p] = a.Col[k]
				p++
			}
		}
	}
	return g
}

// defaultAMDBelow is the size under which DefaultOrdering is AMD. On the
// graded C-core matrices nested dissection needs 0.8x AMD's operations at
// 10k unknowns and 0.5x at 100k and 1M, but takes 2-7 times as long to
// compute; over about ten factorizations per analysis its saving passes
// its extra ordering time near 50k (doc.go, Orderings).
const defaultAMDBelow = 50000
