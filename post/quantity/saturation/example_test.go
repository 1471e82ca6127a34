package saturation_test

import (
	"fmt"

	"polegap/materials"
	"polegap/mesh"
	"polegap/post/quantity/saturation"
)

// The knee of the built-in steels: where a 10 % rise in B takes a 50 %
// rise in H.
func ExampleKnee() {
	for _, name := range []string{"pure-iron", "low-carbon-steel", "silicon-steel-no", "cobalt-iron", "cast-iron"} {
		mat, _, _ := materials.Lookup(name)
		k, err := saturation.Knee(mat.(*materials.Curve))
		if err != nil {
			fmt.Println(name, err)
			continue
		}
		fmt.Printf("%-17s knee %.2f T\n", name, k)
	}
	// Output:
	// pure-iron         knee 1.23 T
	// low-carbon-steel  knee 1.18 T
	// silicon-steel-no  knee 1.13 T
	// cobalt-iron       knee 1.76 T
	// cast-iron         knee 1.02 T
}

// A saturation report for one iron region of a hand-built two-triangle
// mesh: the unit square, with 1.1 T in one half and 1.9 T in the other.
func ExampleAnalyse() {
	m := &mesh.Mesh{
		X: []float64{0, 1, 1, 0}, Y: []float64{0, 0, 1, 1}, NumVertices: 4,
		Tri: []int32{0, 1, 2, 0, 2, 3}, Region: []int32{1, 1},
	}
	b := [][2]float64{{0, 1.1}, {0, 1.9}}
	steel, _, _ := materials.Lookup("low-carbon-steel")
	reps, err := saturation.Analyse(m, b, []saturation.Region{{
		Tag: 1, Name: "yoke", Curve: steel.(*materials.Curve), Limit: 1.8,
	}}, saturation.Options{Levels: []float64{1.0}})
	if err != nil {
		fmt.Println(err)
		return
	}
	r := reps[0]
	fmt.Printf("%s: max %.2f T, mean %.2f T, knee %.2f T, above knee %.0f %%, above 1 T %.0f %%, pass %v\n",
		r.Name, r.Max, r.Mean, r.Knee, 100*r.AboveKnee, 100*r.Levels[0].Fraction, r.Pass)
	// Output:
	// yoke: max 1.90 T, mean 1.50 T, knee 1.18 T, above knee 50 %, above 1 T 100 %, pass false
}
