package caution_test

import (
	"fmt"
	"strings"

	"polegap/post/workflow/caution"
)

func ExampleList() {
	for _, c := range caution.List(caution.Facts{Energy: 1330, Current: 100, Force: 22400}) {
		fmt.Println(strings.TrimSpace(fmt.Sprintf("%s: %.4g %s", c.Hazard, c.Value, c.Unit)))
	}
	// Output:
	// stored energy: 1330 J
	// switch-off voltage: 0
	// pole attraction: 2.24e+04 N
	// coil temperature: 0
	// codes and practice: 0
}
