package supply_test

import (
	"fmt"

	"polegap/post/workflow/supply"
)

// A linear 0.8 H coil of 0.05 Ω driven to 200 A in 20 s, switched off
// into a 1.5 Ω resistor.
func ExampleNew() {
	curve := []supply.CurvePoint{{Current: 100, Linkage: 80}, {Current: 250, Linkage: 200}}
	s, err := supply.New(curve, 0.05, 200, supply.Options{RampTime: 20, DischargeResistance: 1.5})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("ramp: peak %.1f V (L dI/dt + I R = 0.8 × 10 + 200 × 0.05), τ = L/R = %.0f s\n", s.PeakVoltage, s.TimeConstant)
	fmt.Printf("stored %.0f J (½ L I²)\n", s.Energy)
	d := s.Discharge
	fmt.Printf("switch-off: %.0f V, %.2f s to 1 %%, %.0f J in the resistor\n", d.PeakVoltage, d.Time, d.Energy)
	// Output:
	// ramp: peak 18.0 V (L dI/dt + I R = 0.8 × 10 + 200 × 0.05), τ = L/R = 16 s
	// stored 16000 J (½ L I²)
	// switch-off: 300 V, 2.38 s to 1 %, 15484 J in the resistor
}
