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
