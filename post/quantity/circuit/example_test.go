package circuit_test

import (
	"fmt"

	"polegap/models"
	"polegap/post/quantity/circuit"
	"polegap/post/study"
)

// An invented test coil: 200 turns around one limb of a linear iron
// frame (μr 2000) with a 4 mm gap; flux linkage, inductance and energy.
func Example() {
	src := `
name: example-frame
units: mm
depth: 50
materials:
  iron: {mu-r: 2000}
regions:
  - {name: frame-left, material: iron, polygon: [[0,0],[30,0],[30,150],[0,150]]}
  - {name: frame-bottom, material: iron, polygon: [[30,0],[150,0],[150,73],[120,73],[120,30],[30,30]]}
  - {name: frame-top, material: iron, polygon: [[30,120],[120,120],[120,77],[150,77],[150,150],[30,150]]}
  - {name: coil-in, material: copper, polygon: [[31,40],[41,40],[41,110],[31,110]]}
  - {name: coil-out, material: copper, polygon: [[-11,40],[-1,40],[-1,110],[-11,110]]}
coils:
  - {name: main, turns: 200, current: 5, sides: [{region: coil-in, sense: 1}, {region: coil-out, sense: -1}]}
mesh: {size: 10, order: 2, refine: [{line: [[120,75],[150,75]], size: 2}]}
`
	m, err := models.Parse("example-frame.yaml", []byte(src))
	if err != nil {
		fmt.Println(err)
		return
	}
	s, err := study.Run(m, study.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	coils := circuit.CoilsOf(m)
	lam, _ := circuit.Linkage(s.Solution, &coils[0])
	w, _, _ := study.Energies(s.Solution)
	L := circuit.Apparent(lam, coils[0].Current)
	fmt.Printf("L = %.1f mH, W = %.2f J, W/(LI²/2) = %.6f\n", L*1e3, w, w/(0.5*L*25))
	// Output:
	// L = 27.2 mH, W = 0.34 J, W/(LI²/2) = 1.000000
}
