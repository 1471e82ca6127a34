package coil_test

import (
	"fmt"
	"os"

	"polegap/post/workflow/coil"
)

// A bench dipole needs 32,000 ampere-turns per coil; each coil fills a
// window of 100 mm radial build by 160 mm around a 200 mm × 250 mm pole,
// water-cooled, from a 20 V, 300 A supply.
func ExampleOptions() {
	w := coil.Window{Width: 0.100, Height: 0.160}
	w.MeanTurn = coil.MeanTurnRect(0.200, 0.250, w.Width, 0.005)
	s := coil.Spec{
		AmpereTurns:   32000,
		Window:        w,
		Cooling:       coil.Water,
		SupplyVoltage: 20,
		SupplyCurrent: 300,
	}
	if err := s.Validate(); err != nil {
		fmt.Println(err)
		return
	}
	opts := coil.Options(s, coil.HollowWires())
	for _, o := range opts {
		fmt.Printf("%-16s %3d turns %6.1f A %5.2f A/mm² %6.1f V %5.0f W %s\n",
			o.Wire.Name, o.Turns, o.Current, o.CurrentDensity*1e-6, o.Voltage, o.Power, o.Flags)
	}
	if b, ok := coil.Best(opts, coil.LeastPower); ok {
		fmt.Printf("best: %s, %.2f l/min of water\n", b.Wire.Name, b.WaterFlow*6e4)
	}
	// Output:
	// 5x5/3 hollow     416 turns   76.9 A  4.34 A/mm²   44.9 V  3453 W volts
	// 6x6/3.5 hollow   308 turns  103.9 A  4.02 A/mm²   30.8 V  3199 W volts
	// 7x7/4 hollow     240 turns  133.3 A  3.75 A/mm²   22.4 V  2981 W volts
	// 8x8/5 hollow     187 turns  171.1 A  3.93 A/mm²   18.3 V  3128 W ok
	// 9x9/5 hollow     135 turns  237.0 A  3.92 A/mm²   13.1 V  3115 W ok
	// 10x10/6 hollow   126 turns  254.0 A  3.58 A/mm²   11.2 V  2850 W ok
	// 12x12/7 hollow    84 turns  381.0 A  3.68 A/mm²    7.7 V  2925 W amps
	// 15x15/9 hollow    60 turns  533.3 A  3.34 A/mm²    5.0 V  2660 W amps
	// best: 10x10/6 hollow, 2.06 l/min of water
}

// With the number of turns fixed, the least power is the thickest wire
// that still fits.
func ExampleBest() {
	s := coil.Spec{
		AmpereTurns: 900,
		Window:      coil.Window{Width: 0.020, Height: 0.040, MeanTurn: coil.MeanTurnRound(0.025, 0.020)},
		Turns:       500,
	}
	opts := coil.Options(s, coil.IECWires(coil.R20, coil.Grade2))
	b, ok := coil.Best(opts, coil.LeastPower)
	fmt.Println(ok, b.Wire.Name, b.Turns, "of", b.MaxTurns, "fit")
	fmt.Printf("%.1f A, %.2f A/mm², %.2f Ω at 60 °C, %.1f W, %s\n",
		b.Current, b.CurrentDensity*1e-6, b.Resistance, b.Power, b.Flags)
	// Output:
	// true 1.000 mm G2 500 of 511 fit
	// 1.8 A, 2.29 A/mm², 2.79 Ω at 60 °C, 9.1 W, ok
}

// The bench coil of 32,000 ampere-turns cannot be cooled by still air,
// nor run from 100 V in any round enamelled wire: Explain says why.
func ExampleExplain() {
	s := coil.Spec{
		AmpereTurns:   32000,
		Window:        coil.Window{Width: 0.100, Height: 0.160, MeanTurn: 1.5},
		SupplyVoltage: 100,
	}
	opts := coil.Options(s, coil.IECWires(coil.R20, coil.Grade2))
	_, ok := coil.Best(opts, coil.LeastPower)
	fmt.Println(ok)
	fmt.Println(coil.Explain(opts))
	// Output:
	// false
	// coil: none of 35 windings meets every limit: 31 exceed the supply voltage, 35 exceed the current-density limit, 35 dissipate more than the cooling removes; consider a higher supply voltage, or stronger cooling, or a larger window
}

func ExampleAWGDiameter() {
	for _, n := range []int{-3, 10, 20, 30} {
		fmt.Printf("%-8s %.4f mm\n", coil.AWGName(n), coil.AWGDiameter(n)*1e3)
	}
	// Output:
	// AWG 4/0  11.6840 mm
	// AWG 10   2.5882 mm
	// AWG 20   0.8118 mm
	// AWG 30   0.2546 mm
}

func ExampleCopperResistance() {
	// 1 km of 1 mm² copper at 20 °C and at 80 °C (IEC 60028).
	fmt.Printf("%.3f Ω\n", coil.CopperResistance(1000, 1e-6, 20))
	fmt.Printf("%.3f Ω\n", coil.CopperResistance(1000, 1e-6, 80))
	// Output:
	// 17.241 Ω
	// 21.307 Ω
}

func ExampleMeanTurnRect() {
	// A coil of 60 mm build on a 100 mm × 150 mm core, 3 mm clearance.
	fmt.Printf("%.4f m\n", coil.MeanTurnRect(0.100, 0.150, 0.060, 0.003))
	// Output:
	// 0.7073 m
}

func ExampleWriteTable() {
	s := coil.Spec{
		AmpereTurns: 3000,
		Window:      coil.Window{Width: 0.030, Height: 0.060, MeanTurn: 0.45},
		Cooling:     coil.AirForced,
	}
	ws := coil.IECWires(coil.R20, coil.Grade2)
	coil.WriteTable(os.Stdout, coil.Options(s, ws[20:24]))
	for _, c := range coil.Cautions()[:2] {
		fmt.Println("!", c)
	}
	// Output:
	// wire  over mm  turns   I A  J A/mm²    R Ω    V V    P W  Cu kg   fill  limits
	//   1.000 mm G2    1.093   1151  2.61     3.32  13.16  34.29  89.39   3.62  0.502      ok
	//   1.120 mm G2    1.216    929  3.23     3.28  8.466  27.34  88.29   3.66  0.508      ok
	//   1.250 mm G2    1.349    755  3.97     3.24  5.524  21.95  87.21   3.71  0.515      ok
	//   1.400 mm G2    1.502    609  4.93     3.20  3.552   17.5  86.19   3.75  0.521      ok
	// ! Magnet currents and the energy stored in the field can injure or kill: treat the supply and the coil as hazardous, and disconnect and discharge them before touching the coil or its terminals.
	// ! Switching off or disconnecting a coil under current makes a high voltage across it: provide a free-wheeling path or dump resistor and ramp the current down.
}

func ExampleCautions() {
	for _, c := range coil.Cautions() {
		fmt.Println("-", c)
	}
	// Output:
	// - Magnet currents and the energy stored in the field can injure or kill: treat the supply and the coil as hazardous, and disconnect and discharge them before touching the coil or its terminals.
	// - Switching off or disconnecting a coil under current makes a high voltage across it: provide a free-wheeling path or dump resistor and ramp the current down.
	// - Iron poles attract tools and steel objects with large forces: keep them away from the gap and the yoke while the magnet is energised.
	// - Coils heat: check the temperature rise (and the cooling-water flow) before running at full current.
	// - Follow local electrical codes and licensed practice for anything built; these figures are design estimates, not a safety assessment.
}
