package searchcoil_test

import (
	"fmt"
	"math"

	"polegap/post/quantity/searchcoil"
)

// lineField is the field of a 100 A line current along +z at the origin:
// A = −(μ0 I/2π) ln r.
type lineField struct{}

func (lineField) At(x, y float64) (a, bx, by float64, ok bool) {
	k := 4e-7 * math.Pi * 100 / (2 * math.Pi)
	r2 := x*x + y*y
	return -0.5 * k * math.Log(r2), -k * y / r2, k * x / r2, r2 > 0
}

// A long coil of 10 turns, 0.5 m long, with its sides 10 mm and 20 mm from
// a 100 A conductor links 10 · 0.5 · μ0 I/(2π) ln 2; moving its outer side
// out to 40 mm adds the same again, which is what a fluxmeter reads.
func ExampleMove() {
	f := lineField{}
	at := searchcoil.Long{P: [2]float64{0.01, 0}, Q: [2]float64{0.02, 0}, Turns: 10, Length: 0.5}
	l, _ := at.Linkage(f)
	fmt.Printf("linkage %.4g Wb-turns\n", l)
	moved := at
	moved.Q = [2]float64{0.04, 0}
	d, _ := searchcoil.Move(f, at, moved)
	fmt.Printf("fluxmeter reads %.4g Wb-turns\n", d)
	// Output:
	// linkage 6.931e-05 Wb-turns
	// fluxmeter reads 6.931e-05 Wb-turns
}

// uniformZ is the axisymmetric uniform field Bz = 0.5 T: Aφ = 0.5 r/2.
type uniformZ struct{}

func (uniformZ) At(r, z float64) (a, br, bz float64, ok bool) { return 0.25 * r, 0, 0.5, true }

// A coaxial loop of 100 turns and radius 10 mm in a uniform 0.5 T field
// links 100 · π (0.01 m)² · 0.5 T.
func ExampleLoop() {
	l, _ := searchcoil.Loop{R: 0.01, Z: 0, Turns: 100}.Linkage(uniformZ{})
	fmt.Printf("%.4f mWb-turns\n", 1e3*l)
	// Output:
	// 15.7080 mWb-turns
}

// A small coil of 200 turns and 1 cm² at a point, its axis along y.
func ExampleSmall() {
	c := searchcoil.Small{Centre: [2]float64{0.015, 0}, Axis: [2]float64{0, 1}, Turns: 200, Area: 1e-4}
	l, _ := c.Linkage(lineField{})
	fmt.Printf("point %.4g Wb-turns\n", l)
	c.Width = 0.01 // averaged over 10 mm across the axis
	l, _ = c.Linkage(lineField{})
	fmt.Printf("averaged %.4g Wb-turns\n", l)
	// Output:
	// point 2.667e-05 Wb-turns
	// averaged 2.773e-05 Wb-turns
}
