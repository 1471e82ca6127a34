package measure_test

import (
	"fmt"
	"strings"

	"polegap/materials"
	"polegap/post/measure"
)

func ExampleReadCSV() {
	data := `# magnet: bench-dipole
I (A),B (mT),u(B) (mT)
10,99.1,2
20,194.4,2
`
	c, err := measure.ReadCSV(strings.NewReader(data), "hall.csv")
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, p := range c.Points {
		fmt.Printf("%g A: %.4f ± %.4f T (row %d)\n", p.Current, p.Field, p.FieldSigma, p.Row)
	}
	fmt.Println(c.Meta["magnet"], c.Kind)
	// Output:
	// 10 A: 0.0991 ± 0.0020 T (row 3)
	// 20 A: 0.1944 ± 0.0020 T (row 4)
	// bench-dipole field
}

func ExampleReadCSV_errors() {
	data := "current_A,field_T\n10,0.1\n20,\n10,0.2\n"
	_, err := measure.ReadCSV(strings.NewReader(data), "hall.csv")
	fmt.Println(err)
	// Output:
	// hall.csv:3:4: field_T: is empty; give the field
	// hall.csv:4: current_A: current 10 A repeats row 2; keep one reading per current (average repeats, or list rising and falling branches in separate files)
}

// A 50 mm conductor in the gap; the balance is tared at zero conductor
// current and the intercept fit absorbs what is left of the tare.
func ExampleBalance_Reduce() {
	bal := measure.Balance{Length: 0.050, LengthSigma: 0.0001, MassSigma: 1e-6}
	res, err := bal.Reduce([]measure.BalanceReading{
		{Current: 0, Mass: 0.0020009},
		{Current: 1, Mass: 0.0070963},
		{Current: 2, Mass: 0.0121909},
		{Current: 3, Mass: 0.0172867},
		{Current: 4, Mass: 0.0223847},
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("B = %.4f ± %.4f T (fit %.1e T, length %.1e T)\n", res.Field, res.FieldSigma, res.SigmaFit, res.SigmaLength)
	// Output:
	// B = 0.9995 ± 0.0020 T (fit 6.2e-05 T, length 2.0e-03 T)
}

// A 200-turn search coil calibrated at the centre of a 1000-turn solenoid,
// then pulled three times out of the gap.
func ExampleSearchCoil_Field() {
	sc := measure.SearchCoil{
		Integrator:   measure.Integrator{TimeConstant: 0.1, Gain: 10},
		ReadingSigma: 0.002,
		Calibration: &measure.Calibration{
			Solenoid:     measure.Solenoid{Turns: 1000, Length: 0.5, Radius: 0.02, LengthSigma: 5e-4},
			ReadingSigma: 2e-5,
			Readings: []measure.CalReading{
				{Current: 2, Reading: 0.00982}, {Current: 4, Reading: 0.01964},
				{Current: 6, Reading: 0.02946}, {Current: 8, Reading: 0.03928},
			},
		},
	}
	k, err := sc.Calibrate()
	if err != nil {
		fmt.Println(err)
		return
	}
	res, err := sc.Field(k, []float64{1.5684, 1.5701, 1.5679})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("NAeff = %.5f m², u = %.1e m²\n", k.TurnsArea, k.Sigma)
	fmt.Printf("B = %.4f ± %.4f T\n", res.Field, res.FieldSigma)
	// Output:
	// NAeff = 0.01960 m², u = 2.1e-05 m²
	// B = 0.8005 ± 0.0010 T
}

func ExampleSolenoid_CentreField() {
	s := measure.Solenoid{Turns: 1000, Length: 0.5, Radius: 0.02}
	fmt.Printf("centre %.4f mT, long-solenoid value %.4f mT\n", 1e3*s.CentreField(1), 1e3*materials.Mu0*1000/0.5)
	// Output:
	// centre 2.5053 mT, long-solenoid value 2.5133 mT
}

func ExampleParse() {
	file := `format: polegap-measured/1
magnet: bench-dipole
method: direct
probe: {sigma: 0.002}
readings:
  - {current: 10, field: [0.0991, 0.0995]}
  - {current: 20, field: 0.1944}
`
	c, err := measure.Parse("hall.yaml", []byte(file))
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, p := range c.Points {
		fmt.Printf("%g A: %.4f ± %.4f T\n", p.Current, p.Field, p.FieldSigma)
	}
	// Output:
	// 10 A: 0.0993 ± 0.0014 T
	// 20 A: 0.1944 ± 0.0020 T
}
