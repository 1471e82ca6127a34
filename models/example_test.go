package models_test

import (
	"errors"
	"fmt"

	"polegap/models"
)

func ExampleParse() {
	src := `name: coupon
units: mm
depth: 50
materials:
  steel: {mu-r: 2000}
regions:
  - {name: bar, material: steel, polygon: [[0, 0], [80, 0], [80, 10], [0, 10]]}
probes:
  above: {point: [40, 15]}
`
	m, err := models.Parse("coupon.yaml", []byte(src))
	if err != nil {
		fmt.Println(err)
		return
	}
	bar, _ := m.Region("bar")
	fmt.Printf("%s: %s, depth %g m\n", m.Name, m.Geometry, m.Depth)
	fmt.Printf("bar: %d vertices, area %.6f m², material %s\n", len(bar.X), bar.Area(), bar.Material)
	fmt.Printf("default mesh size %.6f m, order %d, automatic %t\n", m.Mesh.Size, m.Mesh.Order, m.Mesh.Auto)
	// Output:
	// coupon: planar, depth 0.05 m
	// bar: 4 vertices, area 0.000800 m², material steel
	// default mesh size 0.002667 m, order 2, automatic true
}

func ExampleParse_errors() {
	src := `units: mm
depth: 50
regions:
  - {name: bar, material: steel, polygon: [[0, 0], [80, 0], [80, 10], [0, 10]]}
  - {name: coil, material: copper, polygon: [[0, 0], [10, 20], [10, 0], [0, 20]]}
coils:
  - {name: main, turns: 100, current: 3, sides: [{region: coils, sense: +1}]}
`
	_, err := models.Parse("bad.yaml", []byte(src))
	var list models.ErrorList
	if errors.As(err, &list) {
		for _, e := range list {
			fmt.Println(e)
		}
	}
	// Output:
	// bad.yaml:4:27: regions[0].material: material "steel" is not defined; define it under materials (air and copper are built in)
	// bad.yaml:5:46: regions[1].polygon[0]: self-intersecting polygon: edges from vertex 0 and vertex 2 of region "coil" meet near (5, 10) mm; a region must be a simple polygon, split it into two regions
	// bad.yaml:7:59: coils[0].sides[0].region: coil side names region "coils", which does not exist; add it under regions; did you mean "coil"?
}

func ExampleLoadExample() {
	m, err := models.LoadExample(models.DefaultExample)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(m.Name, "from template", m.Template)
	for _, r := range m.Regions {
		fmt.Printf("  %-10s %s\n", r.Name, r.Material)
	}
	g, _ := m.Probe("gap-centre")
	fmt.Printf("gap centre at (%.3f, %.3f) m, target %.1f T\n", g.Point[0], g.Point[1], m.Target.Field)
	// Output:
	// bench-dipole from template c-core
	//   back-leg   yoke-steel
	//   upper-arm  yoke-steel
	//   lower-arm  yoke-steel
	//   upper-pole yoke-steel
	//   lower-pole yoke-steel
	//   gap        air
	//   coil-left  copper
	//   coil-right copper
	// gap centre at (0.400, 0.000) m, target 0.9 T
}

func ExampleExamples() {
	for _, name := range models.Examples() {
		fmt.Println(name)
	}
	// Output:
	// bench-dipole
	// calibration-solenoid
	// holding-magnet
	// mineral-separator
	// relaxometry-magnet
}

func ExampleModel_Errorf() {
	m, _ := models.LoadExample("mineral-separator")
	// A later stage (here: a B-H table check) reports at the material's place.
	pole, _ := m.Material("pole-iron")
	fmt.Println(m.Errorf(pole.Pos, "B-H table is not monotone at row %d", 3))
	// Output:
	// examples/mineral-separator.yaml:22:3: materials.pole-iron: B-H table is not monotone at row 3
}
