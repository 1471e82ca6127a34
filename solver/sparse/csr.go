package sparse

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
