package coil

import (
	"math"
	"testing"
)

// BenchmarkOptions sizes the bench coil against every built-in wire
// (IEC R40 grades 1 and 2, AWG 5-38 and hollow: 180 sizes).
func BenchmarkOptions(b *testing.B) {
	wires := allWires()
	s := bench()
	b.ReportAllocs()
	for b.Loop() {
		opts := Options(s, wires)
		if _, ok := Best(opts, LeastPower); ok {
			b.Fatal("still air should not cool 3.5 kW")
		}
	}
	b.ReportMetric(float64(len(wires)), "wires")
}

// FuzzOptions feeds arbitrary specs: an invalid one must be rejected by
// Validate (never a panic), a valid one must give finite results that
// satisfy every identity of checkIdentities.
func FuzzOptions(f *testing.F) {
	f.Add(32000.0, 0.1, 0.16, 1.5, 0, uint8(0), 0.0, 0.0, uint8(0), 0.0, 0.0)
	f.Add(50.0, 0.004, 0.02, 0.1, 0, uint8(2), 0.7, 120.0, uint8(1), 12.0, 3.0)
	f.Add(1e6, 1e-3, 1e-3, 1e-3, 7, uint8(1), 0.9, -100.0, uint8(2), 0.0, 1e9)
	wires := allWires()
	f.Fuzz(func(t *testing.T, ni, w, h, l float64, turns int, pack uint8, fill, temp float64, cool uint8, volts, amps float64) {
		s := Spec{
			AmpereTurns: ni, Window: Window{Width: w, Height: h, MeanTurn: l},
			Turns: turns, Packing: Packing(pack), FillFactor: fill, Temperature: temp,
			Cooling: Cooling(cool), SupplyVoltage: volts, SupplyCurrent: amps,
		}
		if s.Validate() != nil {
			return
		}
		// Windows so thin or so large that the counts overflow int are
		// outside the tool's purpose; skip them rather than assert.
		if w*h/(math.Pi/4*1e-8) > 1e15 || ni > 1e12 {
			return
		}
		checkIdentities(t, "fuzz", s, Options(s, wires))
	})
}
