package force_test

import (
	"fmt"

	"polegap/models"
	"polegap/post/quantity/force"
	"polegap/post/study"
)

// Two invented bus bars, 10 mm square, 30 mm apart centre to centre,
// each carrying 2 kA the same way: the pull on one of them, by the
// stress over an air band, against Ampère's μ0 I²/(2π d) = 26.7 N/m.
func ExampleStress() {
	src := `
name: bus-bars
units: mm
depth: 1000
regions:
  - {name: bar-a, material: copper, polygon: [[-20,-5],[-10,-5],[-10,5],[-20,5]]}
  - {name: bar-b, material: copper, polygon: [[10,-5],[20,-5],[20,5],[10,5]]}
coils:
  - {name: a, turns: 1, current: 2000, sides: [{region: bar-a, sense: 1}]}
  - {name: b, turns: 1, current: 2000, sides: [{region: bar-b, sense: 1}]}
boundary: {shape: circle, margin: 2, condition: open}
mesh: {size: 2, order: 2}
`
	m, err := models.Parse("bus-bars.yaml", []byte(src))
	if err != nil {
		fmt.Println(err)
		return
	}
	s, err := study.Run(m, study.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	f, err := force.Stress(s.Solution, []int32{1}, force.StressOptions{}) // bar-a is model region 0: tag 1
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("Fx = %.1f N, |Fy| < 0.01 N: %v\n", f.F[0], f.F[1]*f.F[1] < 1e-4)
	// Output:
	// Fx = 26.7 N, |Fy| < 0.01 N: true
}
