package scan_test

import (
	"fmt"

	"polegap/post/workflow/scan"
)

// A full grid over two parameters, the first varying slowest.
func ExampleGrid() {
	v, _ := scan.Grid([]scan.Param{
		{Name: "pole-width", Values: scan.Range(180, 220, 3)},
		{Name: "materials.yoke-steel.curve", Values: []string{"low-carbon-steel", "silicon-steel-no"}},
	})
	for _, row := range v {
		fmt.Println(row)
	}
	// Output:
	// [180 low-carbon-steel]
	// [180 silicon-steel-no]
	// [200 low-carbon-steel]
	// [200 silicon-steel-no]
	// [220 low-carbon-steel]
	// [220 silicon-steel-no]
}

// The Pareto front of power (minimised) against good-field width
// (maximised).
func ExampleFront() {
	power := []float64{900, 1200, 1500, 1300}
	width := []float64{0.030, 0.042, 0.050, 0.040}
	fmt.Println(scan.Front(power, width, false, true))
	// Output:
	// [2 1 0]
}
