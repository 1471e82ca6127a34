package efflen_test

import (
	"fmt"

	"polegap/post/workflow/efflen"
)

// The effective length of a 300 mm long dipole with a 40 mm gap and
// 260 mm of iron above the pole face, beside the common rule.
func ExampleSide() {
	geo := efflen.Geometry{Gap: 0.04, Length: 0.3, Height: 0.26}
	r, err := efflen.Side(geo, efflen.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	lo, hi := efflen.Rule(geo)
	fmt.Printf("L_eff = %.1f mm (L + %.2f g); rule %.0f to %.0f mm\n", 1e3*r.LEff, r.K, 1e3*lo, 1e3*hi)
	// Output:
	// L_eff = 354.6 mm (L + 1.36 g); rule 340 to 348 mm
}
