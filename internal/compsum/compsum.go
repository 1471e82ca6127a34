package compsum

import "math"

// Sum accumulates terms with Neumaier's compensation.
type Sum struct{ s, c float64 }

// Add adds x to the sum.
func (k *Sum) Add(x float64) {
	t := k.s + x
	if math.Abs(k.s) >= math.Abs(x) {
		k.c += (k.s - t) + x
	} else {
		k.c += (x - t) + k.s
	}
	k.s = t
}

// Value returns the sum.
func (k *Sum) Value() float64 { return k.s + k.c }
