package scan

import (
	"fmt"
	"math"
	"strconv"
	"strings"
)

// Column returns the values of a column of the rows by name: a quantity
// (Quantities), its estimate (the estimate column's name) or a numeric
// parameter. A parameter value that is not a number, or a row without
// the quantity, gives NaN.
func Column(meta Meta, rows []Row, name string) ([]float64, error) {
	out := make([]float64, len(rows))
	for k, q := range Quantities {
		if name == q || name == EstimateName(q) {
			for i, r := range rows {
				out[i] = r.Q[k]
				if name != q {
					out[i] = r.Est[k]
				}
			}
			return out, nil
		}
	}
	for j, p := range meta.Params {
		if p == name {
			for i, r := range rows {
				v, err := strconv.ParseFloat(r.Values[j], 64)
				if err != nil {
					v = math.NaN()
				}
				out[i] = v
			}
			return out, nil
		}
	}
	return nil, fmt.Errorf("scan: no column %q; the columns are %s", name, strings.Join(Header(meta.Params)[1:], ", "))
}

// Objective is one objective of a Pareto front: a column and whether it
// is maximised (else minimised).
type Objective struct {
	Column   string
	Maximise bool
}

// ParseObjective reads "max:COLUMN" or "min:COLUMN".
func ParseObjective(s string) (Objective, error) {
	dir, col, ok := strings.Cut(s, ":")
	if !ok || col == "" || (dir != "max" && dir != "min") {
		return Objective{}, fmt.Errorf("objective %q: write max:COLUMN or min:COLUMN, e.g. min:power_W", s)
	}
	return Objective{Column: col, Maximise: dir == "max"}, nil
}

// Front returns the indices (into a and b) of the points on the Pareto
// front of two objectives: those no other point beats in one objective
// without losing in the other (V. Pareto's optimality; the standard
// definition of non-domination, e.g. K. Deb, Multi-Objective Optimization
// Using Evolutionary Algorithms, Wiley 2001, §2.4). Points with a NaN are
// left out. maxA and maxB say which objectives are maximised. The indices
// are sorted by a, best last.
func Front(a, b []float64, maxA, maxB bool) []int {
	if len(a) != len(b) {
		panic("scan: Front: objectives of unequal length")
	}
	sa, sb := 1.0, 1.0 // minimise sa·a and sb·b
	if maxA {
		sa = -1
	}
	if maxB {
		sb = -1
	}
	var out []int
	for i := range a {
		if math.IsNaN(a[i]) || math.IsNaN(b[i]) {
			continue
		}
		dominated := false
		for j := range a {
			if j == i || math.IsNaN(a[j]) || math.IsNaN(b[j]) {
				continue
			}
			x, y := sa*a[j], sb*b[j]
			if x <= sa*a[i] && y <= sb*b[i] && (x < sa*a[i] || y < sb*b[i]) {
				dominated = true
				break
			}
		}
		if !dominated {
			out = append(out, i)
		}
	}
	// Sort by the first objective, worst first (insertion: fronts are short).
	for i := 1; i < len(out); i++ {
		for k := i; k > 0 && sa*a[out[k]] > sa*a[out[k-1]]; k-- {
			out[k], out[k-1] = out[k-1], out[k]
		}
	}
	return out
}
