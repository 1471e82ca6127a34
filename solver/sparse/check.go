package sparse

import "fmt"

// Check verifies the invariants of the symbolic factorization made by
// Analyze: perm and its inverse agree, the elimination tree points to
// later columns, the supernodes partition the columns, every supernode's
// row list starts with its own columns and is strictly increasing, its
// rows below lie in ancestor supernodes, and the value offsets match the
// block sizes. It returns nil before Analyze.
func (ch *Cholesky) Check() error {
	s := ch.sym
	if s == nil {
		return nil
	}
	if !IsPermutation(s.perm) || len(s.perm) != s.n {
		return fmt.Errorf("sparse: Cholesky perm is not a permutation of 0..%d", s.n-1)
	}
	for k, o := range s.perm {
		if s.inv[o] != int32(k) {
			return fmt.Errorf("sparse: Cholesky inverse permutation wrong at %d", k)
		}
	}
	for j, p := range s.parent {
		if p != -1 && int(p) <= j {
			return fmt.Errorf("sparse: elimination tree parent %d of column %d is not later", p, j)
		}
	}
	if s.super[0] != 0 || int(s.super[s.ns]) != s.n {
		return fmt.Errorf("sparse: supernodes do not cover columns 0..%d", s.n-1)
	}
	if s.valPtr[0] != 0 || len(ch.lx) != s.valPtr[s.ns] {
		return fmt.Errorf("sparse: factor holds %d values, want %d", len(ch.lx), s.valPtr[s.ns])
	}
	for t := 0; t < s.ns; t++ {
		f, l := s.super[t], s.super[t+1]
		if l <= f {
			return fmt.Errorf("sparse: supernode %d is empty", t)
		}
		rows := s.rows[s.rowPtr[t]:s.rowPtr[t+1]]
		nc := int(l - f)
		if len(rows) < nc {
			return fmt.Errorf("sparse: supernode %d has %d rows for %d columns", t, len(rows), nc)
		}
		for k := 0; k < nc; k++ {
			if rows[k] != f+int32(k) || s.colSuper[f+int32(k)] != int32(t) {
				return fmt.Errorf("sparse: supernode %d does not start with its own columns", t)
			}
		}
		for k := 1; k < len(rows); k++ {
			if rows[k] <= rows[k-1] {
				return fmt.Errorf("sparse: supernode %d rows not increasing at %d", t, k)
			}
		}
		// Rows below must belong to ancestors of t.
		for _, r := range rows[nc:] {
			a := s.sparent[t]
			for a != -1 && a != s.colSuper[r] {
				a = s.sparent[a]
			}
			if a == -1 {
				return fmt.Errorf("sparse: supernode %d has row %d outside its ancestors", t, r)
			}
		}
		if s.valPtr[t+1]-s.valPtr[t] != len(rows)*nc {
			return fmt.Errorf("sparse: supernode %d value block has wrong size", t)
		}
	}
	return nil
}
