package shim_test

import (
	"fmt"

	"polegap/post/workflow/shim"
)

// The starting shim for a 40 mm gap, and for a workshop that cannot
// machine steps below 1 mm.
func ExampleRose() {
	for _, min := range []float64{0, 1e-3} {
		s := shim.Rose(0.04, min)
		fmt.Printf("%.2f mm high, %.1f mm wide\n", 1e3*s.Height, 1e3*s.Width)
	}
	// Output:
	// 0.80 mm high, 14.0 mm wide
	// 1.00 mm high, 14.0 mm wide
}
