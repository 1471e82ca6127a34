package main

import (
	"bytes"
	"fmt"
	"strings"
	"testing"

	"polegap/solver/sparse"
)

// TestMatrices: the generated matrices are well-formed, symmetric and
// positive definite (a P1 stiffness matrix with positive coefficients and
// the potential held on the whole outer boundary of a connected mesh is
// SPD: P. G. Ciarlet, "The Finite Element Method for Elliptic Problems",
// 1978, section 2.2, from memory), with the documented sizes.
func TestMatrices(t *testing.T) {
	xs, ys := cCoreAxes(1)
	for _, c := range []struct {
		name string
		a    *sparse.CSR
		n    int
	}{
		{"grid 20", gridSystem(20), 19 * 19},
		{"c-core 2000 nodes", cCore(2000), -1},
		{"c-core scale 1", cCoreAt(1), (len(xs) - 2) * (len(ys) - 2)},
	} {
		if err := c.a.Check(); err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		if c.n >= 0 && c.a.N != c.n {
			t.Errorf("%s: %d unknowns, want %d", c.name, c.a.N, c.n)
		}
		if c.n < 0 && (c.a.N < 1000 || c.a.N > 2000) {
			t.Errorf("%s: %d unknowns, want between 1000 and the 2000 nodes", c.name, c.a.N)
		}
		// Symmetric to rounding: each entry is a sum of the same element
		// terms in both triangles.
		if !c.a.IsSymmetric(1e-12) {
			t.Errorf("%s: not symmetric", c.name)
		}
		ch := &sparse.Cholesky{}
		if err := ch.Analyze(c.a); err != nil {
			t.Fatal(err)
		}
		if err := ch.Factor(c.a); err != nil {
			t.Errorf("%s: %v", c.name, err)
		}
	}
	if p := geoND(20); !sparse.IsPermutation(p) || len(p) != 19*19 {
		t.Errorf("geoND(20) is not a permutation of the 361 unknowns")
	}
}

// TestGridFigures: the grid of 101 cells per side gives the factor sizes
// and operations of solver/sparse doc.go (Orderings, grid 10k) to the
// digits printed there.
func TestGridFigures(t *testing.T) {
	a := gridSystem(101)
	for _, c := range []struct {
		o           sparse.Ordering
		nnzL, madds string
	}{
		{sparse.NestedDissection, "0.38M", "1.9e+07"},
		{sparse.AMD, "0.35M", "1.5e+07"},
	} {
		nnzL, madds, err := symbolic(a, sparse.Order(a, c.o))
		if err != nil {
			t.Fatal(err)
		}
		gotL, gotM := fmt.Sprintf("%.2fM", float64(nnzL)/1e6), fmt.Sprintf("%.2g", madds)
		if gotL != c.nnzL || gotM != c.madds {
			t.Errorf("%v: nnz(L) %s, madds %s; doc.go has %s and %s", c.o, gotL, gotM, c.nnzL, c.madds)
		}
	}
}

// TestRun runs every command on small matrices: a header and one row per
// matrix and ordering or setting, exit status 0; command-line mistakes
// give status 2.
func TestRun(t *testing.T) {
	for _, c := range []struct {
		args []string
		rows int
	}{
		{[]string{"order", "-grid", "12,16", "-ccore", "500"}, 2*3 + 2},
		{[]string{"solve", "-grid", "12"}, 3},
		{[]string{"nd", "-ccore", "500", "-set", "base;leaf=20,passes=-1;visit=shuffled", "-repeat", "1"}, 3},
		{[]string{"relax", "-grid", "12", "-set", "base;always=-1,zeros16=-1,zeros48=-1,zeroswide=-1", "-repeat", "1"}, 2},
	} {
		var out, errs bytes.Buffer
		if code := run(c.args, &out, &errs); code != 0 {
			t.Errorf("%v: exit %d, stderr %q", c.args, code, errs.String())
			continue
		}
		lines := strings.Split(strings.TrimSpace(out.String()), "\n")
		if len(lines) != 1+c.rows || !strings.HasPrefix(lines[0], "matrix") {
			t.Errorf("%v: %d lines, want a header and %d rows:\n%s", c.args, len(lines), c.rows, out.String())
		}
	}
	for _, args := range [][]string{
		nil,
		{"nonesuch"},
		{"order", "-nonesuch"},
		{"order", "extra"},
		{"order", "-grid", "x"},
		{"order", "-grid", "", "-ccore", ""},
		{"nd", "-ccore", "500", "-set", "leaf"},
		{"nd", "-ccore", "500", "-set", "nonesuch=1"},
		{"relax", "-grid", "12", "-set", "always=x"},
	} {
		var out, errs bytes.Buffer
		if code := run(args, &out, &errs); code != 2 || errs.Len() == 0 {
			t.Errorf("%q: exit %d, stderr %q; want 2 and a message", args, code, errs.String())
		}
	}
	var out, errs bytes.Buffer
	if code := run([]string{"order", "-grid", "", "-ccore", "", "-mtx", "/nonexistent.mtx"}, &out, &errs); code != 1 {
		t.Errorf("missing file: exit %d, want 1", code)
	}
}
