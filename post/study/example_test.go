package study_test

import (
	"fmt"

	"polegap/models"
	"polegap/post/study"
)

// A model without a mesh section gets its sizes from its features: here
// two iron blocks with a 10 mm gap between 50 mm faces.
func ExampleFindFeatures() {
	src := `name: blocks
units: mm
depth: 100
materials:
  steel: {curve: low-carbon-steel}
regions:
  - {name: lower, material: steel, polygon: [[0, -45], [50, -45], [50, -5], [0, -5]]}
  - {name: upper, material: steel, polygon: [[0, 5], [50, 5], [50, 45], [0, 45]]}
`
	m, err := models.Parse("blocks.yaml", []byte(src))
	if err != nil {
		fmt.Println(err)
		return
	}
	ft := study.FindFeatures(m)
	for _, g := range ft.Gaps {
		fmt.Printf("gap %.0f mm wide over %.0f mm: edges up to %.2f mm\n", g.Width*1e3, g.Length*1e3, g.Width*1e3/study.GapElements)
	}
	c := ft.Corners[0]
	fmt.Printf("%d corners; (%.0f, %.0f) mm is %s, B ~ r^%.3f, size × %.3f\n", len(ft.Corners), c.X*1e3, c.Y*1e3, c.Kind, c.Exponent, study.CornerFactor(c.Exponent))
	fmt.Printf("automatic %t, order %d\n", m.Mesh.Auto, m.Mesh.Order)
	// Output:
	// gap 10 mm wide over 50 mm: edges up to 1.67 mm
	// 8 corners; (0, -45) mm is convex, B ~ r^-0.333, size × 0.125
	// automatic true, order 2
}
