package materials_test

import (
	"fmt"
	"strings"

	"polegap/materials"
)

// A four-point table of a soft steel (invented demo data): the curve passes
// through the points, and past the last one it rises with slope μ0.
func ExampleNewCurve() {
	h := []float64{0, 200, 1000, 10000} // A/m
	b := []float64{0, 1.0, 1.5, 1.8}    // T
	c, err := materials.NewCurve(h, b)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("B(1000 A/m) = %.3f T\n", c.B(1000))
	fmt.Printf("H(1.5 T) = %.1f A/m\n", c.H(1.5))
	fmt.Printf("tail slope / mu0 = %.6f\n", (c.B(2e4)-c.B(1e4))/1e4/materials.Mu0)
	fmt.Printf("initial mu_r = %.0f\n", c.MuR(0))
	// Output:
	// B(1000 A/m) = 1.500 T
	// H(1.5 T) = 1000.0 A/m
	// tail slope / mu0 = 1.000000
	// initial mu_r = 5471
}

// The solver asks for the reluctivity ν = H/B and its derivative with
// respect to b2 = |B|². At 3 T the curve is past its last point, and by hand
// H = 10000 + (3 - 1.8)/μ0 = 964930 A/m; at B = 0, ν is 1/(initial slope).
func ExampleCurve_Nu() {
	c, _ := materials.NewCurve([]float64{0, 200, 1000, 10000}, []float64{0, 1.0, 1.5, 1.8})
	for _, bv := range []float64{0, 1.5, 3} {
		nu, dnu := c.Nu(bv * bv)
		fmt.Printf("B = %.1f T: nu = %.1f m/H, H = nu B = %.0f A/m, dnu/db2 = %.4g\n", bv, nu, nu*bv, dnu)
	}
	// Output:
	// B = 0.0 T: nu = 145.5 m/H, H = nu B = 0 A/m, dnu/db2 = 20.98
	// B = 1.5 T: nu = 666.7 m/H, H = nu B = 1000 A/m, dnu/db2 = 3185
	// B = 3.0 T: nu = 321643.2 m/H, H = nu B = 964930 A/m, dnu/db2 = 2.634e+04
}

func ExampleReadCurveCSV() {
	const data = `# demo steel, invented data
H (kA/m), B (T)
0.2, 1.0
1,   1.5
10,  1.8
`
	c, err := materials.ReadCurveCSV(strings.NewReader(data), "demo.csv")
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%s: %d points, B(1000 A/m) = %.2f T\n", c.Name(), c.Len(), c.B(1000))

	_, err = materials.ReadCurveCSV(strings.NewReader("H (A/m),B (T)\n0,0\n100,1.2\n90,1.3\n"), "bad.csv")
	fmt.Println(err)
	// Output:
	// demo.csv: 4 points, B(1000 A/m) = 1.50 T
	// bad.csv:4: H is not above the previous row's H = 100 A/m; sort the table by H and remove repeated rows
}

func ExampleLookup() {
	m, e, ok := materials.Lookup("low-carbon-steel")
	if !ok {
		return
	}
	c := m.(*materials.Curve)
	fmt.Printf("%s (%s): B(1000 A/m) = %.2f T; source: %s\n", e.Name, e.Kind, c.B(1000), e.Source)
	// Output:
	// low-carbon-steel (nonlinear): B(1000 A/m) = 1.39 T; source: from memory: typical values
}

// A laminated stack with 96 % steel.
func ExampleCurve_Stacked() {
	m, _, _ := materials.Lookup("silicon-steel-no")
	sheet := m.(*materials.Curve)
	stack, err := sheet.Stacked(0.96)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("B at 5000 A/m: sheet %.3f T, stack %.3f T\n", sheet.B(5000), stack.B(5000))
	// Output:
	// B at 5000 A/m: sheet 1.616 T, stack 1.552 T
}

// A magnet on its recoil line B = μ0 μrec H + Br.
func ExampleMagnet() {
	m := materials.Magnet{Remanence: 1.2, MuRecoil: 1.05, Direction: 0}
	nu, _ := m.Nu(0)
	mx, my := m.Magnetization()
	fmt.Printf("nu = %.0f m/H, Hc = (%.0f, %.0f) kA/m\n", nu, mx/1e3, my/1e3)
	// Output:
	// nu = 757881 m/H, Hc = (909, 0) kA/m
}

func ExampleLibrary() {
	for _, e := range materials.Library() {
		fmt.Printf("%-17s %s\n", e.Name, e.Kind)
	}
	// Output:
	// pure-iron         nonlinear
	// low-carbon-steel  nonlinear
	// silicon-steel-no  nonlinear
	// cobalt-iron       nonlinear
	// cast-iron         nonlinear
	// team13-steel      nonlinear
	// air               linear
	// copper            linear
	// linear-1000       linear
	// magnet-ndfeb      magnet
	// magnet-ferrite    magnet
}

// The zero Linear is vacuum; ν = 1/(μ0 μr) and the energy density is
// B²/(2 μ0 μr): 397.9 kJ/m³ at 1 T in air.
func ExampleLinear() {
	for _, l := range []materials.Linear{{}, {MuR: 1000}} {
		nu, _ := l.Nu(1)
		fmt.Printf("mu_r %g: nu = %.1f m/H, w(1 T) = %.1f J/m³\n", l.MuR, nu, l.Energy(1))
	}
	// Output:
	// mu_r 0: nu = 795774.7 m/H, w(1 T) = 397887.4 J/m³
	// mu_r 1000: nu = 795.8 m/H, w(1 T) = 397.9 J/m³
}

// Energy and co-energy densities of the demo steel at 1.5 T; they add up
// to B H = 1.5 T × 1000 A/m = 1500 J/m³. By hand, w' = ∫ B dH over the two
// cubic pieces: 118.75 J/m³ (d0 h²/2 + c3 h⁴/4 on [0, 200]) plus 1063.1 J/m³
// (w (B_a + B_b)/2 + w² (d_a - d_b)/12 on [200, 1000]).
func ExampleCurve_Energy() {
	c, _ := materials.NewCurve([]float64{0, 200, 1000, 10000}, []float64{0, 1.0, 1.5, 1.8})
	w, wc := c.Energy(1.5*1.5), c.CoEnergy(1.5*1.5)
	fmt.Printf("w = %.1f J/m³, w' = %.1f J/m³, sum = %.1f J/m³\n", w, wc, w+wc)
	// Output:
	// w = 318.1 J/m³, w' = 1181.9 J/m³, sum = 1500.0 J/m³
}

// The solver evaluates ν for all elements of a material at once.
func ExampleNuTo() {
	m, _, _ := materials.Lookup("linear-1000")
	b2 := []float64{0, 1, 4}
	nu, dnu := materials.NuTo(nil, nil, m, b2)
	fmt.Printf("%.1f %v\n", nu, dnu)
	// Output:
	// [795.8 795.8 795.8] [0 0 0]
}
