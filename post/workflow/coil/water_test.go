package coil

import (
	"math"
	"testing"
)

func TestDarcyFriction(t *testing.T) {
	// Hagen–Poiseuille laminar flow f = 64/Re; Blasius (1913)
	// f = 0.3164 Re^(-1/4), so 0.03164 at Re = 10⁴ (10⁴ to the 1/4 is 10).
	// Tolerance: float rounding.
	for _, c := range []struct{ re, want float64 }{
		{1000, 0.064},
		{1e4, 0.03164},
		{1e5, 0.3164 / math.Pow(1e5, 0.25)},
	} {
		if got := darcyFriction(c.re); math.Abs(got-c.want) > 1e-15 {
			t.Errorf("Re = %g: f = %.17g, want %.17g", c.re, got, c.want)
		}
	}
	if darcyFriction(0) != 0 {
		t.Error("no flow must give no friction")
	}
}

func TestWaterPressure(t *testing.T) {
	// The worked example's 10 x 10 mm hollow bar (options_test.go): 126
	// turns, 189 m of conductor, flow 4.1260e-5 m³/s through a 6 mm bore.
	// By hand, one circuit:
	//   v = 1.4593 m/s, Re = 1.4593 × 0.006 / 0.7e-6 = 12508,
	//   f = 0.3164 × 12508^(-1/4) = 0.029918 (Blasius 1913),
	//   Δp = f (L/D) ρ v²/2 = 0.029918 × 31500 × 995 × 1.4593²/2
	//      = 9.984e5 Pa (10.0 bar; Darcy–Weisbach).
	// Two circuits of 94.5 m: v = 0.72963 m/s, Re = 6254, f = 0.035579,
	//   Δp = 0.035579 × 15750 × 995 × 0.72963²/2 = 1.4842e5 Pa.
	// Tolerance 0.05 %: the last hand-computed digit.
	s := bench()
	s.Cooling = Water
	w := HollowWires()[5:6]
	for _, c := range []struct {
		circuits int
		re, dp   float64
	}{{0, 12508, 9.984e5}, {1, 12508, 9.984e5}, {2, 6254, 1.4842e5}} {
		s.WaterCircuits = c.circuits
		o := Options(s, w)[0]
		if relErr(o.Reynolds, c.re) > 5e-4 || relErr(o.WaterPressure, c.dp) > 5e-4 {
			t.Errorf("%d circuits: Re %.1f Δp %.1f Pa, want %.0f and %.4g", c.circuits, o.Reynolds, o.WaterPressure, c.re, c.dp)
		}
	}
	// A 5 bar supply cannot drive one circuit but drives two.
	s.MaxWaterPressure = 5e5
	s.WaterCircuits = 1
	if f := Options(s, w)[0].Flags; f != OverPressure {
		t.Errorf("one circuit at 5 bar: flags %v, want water", f)
	}
	s.WaterCircuits = 2
	if f := Options(s, w)[0].Flags; f != 0 {
		t.Errorf("two circuits at 5 bar: flags %v, want ok", f)
	}
	// Round wire has no bore: flow only.
	o := Options(s, IECWires(R20, Grade2)[30:31])[0]
	if o.WaterFlow <= 0 || o.WaterSpeed != 0 || o.WaterPressure != 0 || o.Reynolds != 0 {
		t.Errorf("round wire, water: %+v", o)
	}
}
