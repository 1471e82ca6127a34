package scan

import (
	"fmt"
	"math"
	"math/rand/v2"
	"strconv"
)

// Param is one scanned parameter: its name (see the package doc) and
// either a list of values as written in the model file (numbers in the
// model's units, or names) or a numeric range [Lo, Hi] for a Latin
// hypercube.
type Param struct {
	Name   string
	Values []string
	Lo, Hi float64
}

// Range returns n values evenly spaced from lo to hi inclusive, each in
// Go's shortest exact form (one value, hi, when n < 2).
func Range(lo, hi float64, n int) []string {
	if n < 2 {
		return []string{Format(hi)}
	}
	out := make([]string, n)
	for i := range out {
		out[i] = Format(lo + (hi-lo)*float64(i)/float64(n-1))
	}
	return out
}

// Format writes v in Go's shortest form that reads back to the same bits.
func Format(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }

// Grid returns every combination of the parameters' values, the first
// parameter varying slowest (row-major order).
func Grid(params []Param) ([][]string, error) {
	n := 1
	for _, p := range params {
		if len(p.Values) == 0 {
			return nil, fmt.Errorf("scan: parameter %s has no values for a grid", p.Name)
		}
		n *= len(p.Values)
		if n > MaxVariants {
			return nil, fmt.Errorf("scan: the grid has more than %d variants; use a Latin hypercube", MaxVariants)
		}
	}
	out := make([][]string, n)
	for i := range out {
		row := make([]string, len(params))
		k := i
		for j := len(params) - 1; j >= 0; j-- {
			v := params[j].Values
			row[j] = v[k%len(v)]
			k /= len(v)
		}
		out[i] = row
	}
	return out, nil
}

// MaxVariants bounds a scan's variants.
const MaxVariants = 1_000_000

// LatinHypercube returns n variants of a Latin hypercube sample (M. D.
// McKay, R. J. Beckman and W. J. Conover, "A comparison of three methods
// for selecting values of input variables in the analysis of output from
// a computer code", Technometrics 21(2), 239–245, 1979): each parameter's
// range is cut into n equal strata, every stratum is used once, the
// strata are paired at random and each value lies at a random place in its
// stratum. A parameter with a list of values instead of a range takes
// value ⌊s·len/n⌋ for stratum s, so each value appears equally often.
// The sample depends only on seed: rand.NewPCG(seed, seed).
func LatinHypercube(params []Param, n int, seed uint64) ([][]string, error) {
	if n < 1 || n > MaxVariants {
		return nil, fmt.Errorf("scan: a Latin hypercube of %d variants: give 1 to %d", n, MaxVariants)
	}
	for _, p := range params {
		if len(p.Values) == 0 && !(p.Hi > p.Lo) {
			return nil, fmt.Errorf("scan: parameter %s: give a range lo:hi with lo < hi, or a list", p.Name)
		}
		if math.IsNaN(p.Lo) || math.IsInf(p.Lo, 0) || math.IsInf(p.Hi, 0) {
			return nil, fmt.Errorf("scan: parameter %s: the range must be finite", p.Name)
		}
	}
	rng := rand.New(rand.NewPCG(seed, seed))
	out := make([][]string, n)
	for i := range out {
		out[i] = make([]string, len(params))
	}
	for j, p := range params {
		perm := rng.Perm(n)
		for i := range out {
			s := perm[i]
			if len(p.Values) > 0 {
				out[i][j] = p.Values[s*len(p.Values)/n]
				continue
			}
			u := rng.Float64()
			out[i][j] = Format(p.Lo + (p.Hi-p.Lo)*(float64(s)+u)/float64(n))
		}
	}
	return out, nil
}
