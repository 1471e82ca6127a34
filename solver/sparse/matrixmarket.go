package sparse

import (
	"bufio"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
)

// WriteMatrixMarket writes the lower triangle of the symmetric matrix a in
// the Matrix Market coordinate format ("matrix coordinate real symmetric"),
// with 1-based indices and values printed to full float64 precision.
//
// Format: R. Boisvert, R. Pozo, K. Remington, "The Matrix Market exchange
// formats: initial design", NIST IR 5935, 1996.
func WriteMatrixMarket(w io.Writer, a *CSR) error {
	bw := bufio.NewWriter(w)
	nnz := 0
	for i := 0; i < a.N; i++ {
		for k := a.RowPtr[i]; k < a.RowPtr[i+1]; k++ {
			if int(a.Col[k]) <= i {
				nnz++
			}
		}
	}
	fmt.Fprintf(bw, "%%%%MatrixMarket matrix coordinate real symmetric\n%% written by polegap solver/sparse\n%d %d %d\n", a.N, a.N, nnz)
	buf := make([]byte, 0, 64)
	// Column-major order of the lower triangle is row-major order of the
	// upper triangle; write row-major lower (any order is allowed).
	for i := 0; i < a.N; i++ {
		for k := a.RowPtr[i]; k < a.RowPtr[i+1]; k++ {
			j := int(a.Col[k])
			if j > i {
				break
			}
			buf = buf[:0]
			buf = strconv.AppendInt(buf, int64(i+1), 10)
			buf = append(buf, ' ')
			buf = strconv.AppendInt(buf, int64(j+1), 10)
			buf = append(buf, ' ')
			buf = strconv.AppendFloat(buf, a.Val[k], 'g', -1, 64)
			buf = append(buf, '\n')
			if _, err := bw.Write(buf); err != nil {
				return err
			}
		}
	}
	return bw.Flush()
}

// ReadMatrixMarket reads a square real matrix in Matrix Market coordinate
// format, "general" or "symmetric". A symmetric file is expanded to both
// triangles. Duplicate entries are summed.
func ReadMatrixMarket(r io.Reader) (*CSR, error) {
	sc := bufio.NewScanner(r)
	sc.Buffer(make([]byte, 1<<16), 1<<20)
	line := 0
	if !sc.Scan() {
		return nil, &FormatError{Line: 1, Msg: "empty input"}
	}
	line++
	head := strings.Fields(strings.ToLower(sc.Text()))
	if len(head) != 5 || head[0] != "%%matrixmarket" || head[1] != "matrix" || head[2] != "coordinate" {
		return nil, &FormatError{Line: line, Msg: "want header %%MatrixMarket matrix coordinate ..."}
	}
	if head[3] != "real" && head[3] != "integer" {
		return nil, &FormatError{Line: line, Msg: "field " + head[3] + " not supported (want real or integer)"}
	}
	symmetric := false
	switch head[4] {
	case "symmetric":
		symmetric = true
	case "general":
	default:
		return nil, &FormatError{Line: line, Msg: "symmetry " + head[4] + " not supported"}
	}
	var t *Triplet
	want := -1
	for sc.Scan() {
		line++
		s := strings.TrimSpace(sc.Text())
		if s == "" || s[0] == '%' {
			continue
		}
		f := strings.Fields(s)
		if t == nil {
			if len(f) != 3 {
				return nil, &FormatError{Line: line, Msg: "want size line: rows cols entries"}
			}
			m, err1 := strconv.Atoi(f[0])
			n, err2 := strconv.Atoi(f[1])
			nz, err3 := strconv.Atoi(f[2])
			if err1 != nil || err2 != nil || err3 != nil || m != n || n < 0 || nz < 0 {
				return nil, &FormatError{Line: line, Msg: "bad size line (matrix must be square)"}
			}
			if n > math.MaxInt32 || nz > math.MaxInt32 {
				return nil, &FormatError{Line: line, Msg: "matrix too large for int32 indices"}
			}
			t = NewTriplet(n, min(2*nz, 1<<20)) // grows as entries arrive
			want = nz
			continue
		}
		if len(f) != 3 {
			return nil, &FormatError{Line: line, Msg: "want entry: row col value"}
		}
		i, err1 := strconv.Atoi(f[0])
		j, err2 := strconv.Atoi(f[1])
		v, err3 := strconv.ParseFloat(f[2], 64)
		if err1 != nil || err2 != nil || err3 != nil {
			return nil, &FormatError{Line: line, Msg: "cannot parse entry"}
		}
		if i < 1 || i > t.N || j < 1 || j > t.N {
			return nil, &FormatError{Line: line, Msg: "index out of range"}
		}
		if symmetric && j > i {
			return nil, &FormatError{Line: line, Msg: "symmetric file has an entry above the diagonal"}
		}
		t.Add(i-1, j-1, v)
		if symmetric && i != j {
			t.Add(j-1, i-1, v)
		}
		want--
	}
	if err := sc.Err(); err != nil {
		return nil, err
	}
	if t == nil {
		return nil, &FormatError{Line: line, Msg: "missing size line"}
	}
	if want != 0 {
		return nil, &FormatError{Line: line, Msg: fmt.Sprintf("entry count differs from the size line by %d", want)}
	}
	return t.ToCSR(), nil
}
