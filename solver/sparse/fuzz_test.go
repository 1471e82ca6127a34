package sparse_test

import (
	"bytes"
	"testing"

	"polegap/solver/sparse"
)

// FuzzReadMatrixMarket feeds arbitrary text to the reader: it must return
// a valid CSR or an error, never panic, and a matrix it accepts must
// survive a write/read round trip when symmetric.
func FuzzReadMatrixMarket(f *testing.F) {
	f.Add("%%MatrixMarket matrix coordinate real symmetric\n2 2 2\n1 1 4\n2 1 -1\n")
	f.Add("%%MatrixMarket matrix coordinate real general\n2 2 3\n1 1 1\n1 2 2\n2 1 2\n")
	f.Add("%%MatrixMarket matrix coordinate integer symmetric\n% c\n1 1 1\n1 1 7\n")
	f.Fuzz(func(t *testing.T, in string) {
		if len(in) > 4096 {
			return
		}
		a, err := sparse.ReadMatrixMarket(bytes.NewBufferString(in))
		if err != nil {
			return
		}
		if a.N > 1<<16 {
			return
		}
		if err := a.Check(); err != nil {
			// Values such as "inf" parse; Check rejects them.
			return
		}
		if !a.IsSymmetric(0) {
			return
		}
		var buf bytes.Buffer
		if err := sparse.WriteMatrixMarket(&buf, a); err != nil {
			t.Fatal(err)
		}
		b, err := sparse.ReadMatrixMarket(&buf)
		if err != nil {
			t.Fatalf("round trip: %v", err)
		}
		if b.N != a.N || b.NNZ() != a.NNZ() {
			t.Fatalf("round trip changed the matrix: %d/%d -> %d/%d", a.N, a.NNZ(), b.N, b.NNZ())
		}
	})
}
