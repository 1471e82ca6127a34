package coil

import (
	"bytes"
	"math"
	"strings"
	"testing"
)

// TestOverPressureNotRecommended: with one water circuit and a 2 bar
// supply the hollow windings whose Darcy–Weisbach pressure drop
// (TestWaterPressure checks it by hand) exceeds 2 bar are flagged
// "water" and Best passes them over. The thick-walled 12 x 12 mm bar
// with a 3 mm bore has the most copper, so the least power, and the
// narrowest bore, so a pressure drop far over the limit.
func TestOverPressureNotRecommended(t *testing.T) {
	s := bench()
	s.Cooling = Water
	s.WaterCircuits = 1
	s.MaxWaterPressure = 2e5
	opts := Options(s, append(HollowWires(), HollowBar("12x12/3 thick", 12e-3, 12e-3, 1e-3, 3e-3, HollowInsulation)))
	over := 0
	for i := range opts {
		o := &opts[i]
		if (o.WaterPressure > 2e5) != (o.Flags&OverPressure != 0) {
			t.Errorf("%s: Δp %.3g bar, flags %v", o.Wire.Name, o.WaterPressure*1e-5, o.Flags)
		}
		if o.Flags&OverPressure != 0 {
			over++
		}
	}
	best, ok := Best(opts, LeastPower)
	if over == 0 || !ok || best.WaterPressure > 2e5 {
		t.Fatalf("%d over the limit; best %v %+v", over, ok, best)
	}
	// The least power over all windings, flagged or not, is a flagged one:
	// the test would pass vacuously otherwise.
	least := opts[0]
	for _, o := range opts {
		if o.Power < least.Power {
			least = o
		}
	}
	if least.Flags&OverPressure == 0 {
		t.Fatalf("the least-power winding %s (%.0f W) is not over the pressure limit: pick another case", least.Wire.Name, least.Power)
	}
	var b bytes.Buffer
	bi := -1
	for i := range opts {
		if opts[i].Wire.Name == best.Wire.Name {
			bi = i
		}
	}
	if _, err := WriteReviewTable(&b, s, opts, bi); err != nil {
		t.Fatal(err)
	}
	for _, line := range strings.Split(b.String(), "\n") {
		if strings.HasSuffix(strings.TrimSpace(line), "water") && strings.HasPrefix(strings.TrimSpace(line), "*") {
			t.Errorf("a flagged row is marked recommended: %q", line)
		}
	}
}

// TestChosenCircuits: the worked example's 10 x 10 mm bar needs 9.98 bar
// in one circuit and 1.48 bar in two (TestWaterPressure, by hand): with
// a 5 bar limit the choice is two circuits, with 10 bar one.
func TestChosenCircuits(t *testing.T) {
	s := bench()
	s.Cooling = Water
	s.MaxWaterCircuits = CommonWaterCircuits
	w := HollowWires()[5:6]
	for _, c := range []struct {
		limit float64
		want  int
	}{{5e5, 2}, {10e5, 1}, {1e5, 3}} {
		s.MaxWaterPressure = c.limit
		o := Options(s, w)[0]
		if o.WaterCircuits != c.want || o.Flags != 0 {
			t.Errorf("limit %g bar: %d circuits (Δp %.3g bar, flags %v), want %d", c.limit*1e-5, o.WaterCircuits, o.WaterPressure*1e-5, o.Flags, c.want)
		}
	}
	// A speed limit below the one-circuit speed (1.4593 m/s) asks for two.
	s.MaxWaterPressure, s.MaxWaterSpeed = 0, 1.0
	if o := Options(s, w)[0]; o.WaterCircuits != 2 || o.Flags != 0 {
		t.Errorf("speed limit 1 m/s: %d circuits at %.3g m/s, flags %v", o.WaterCircuits, o.WaterSpeed, o.Flags)
	}
	// An impossible speed limit: the most circuits tried, flagged.
	s.MaxWaterSpeed = 1e-6
	if o := Options(s, w)[0]; o.WaterCircuits != CommonWaterCircuits || o.Flags&OverSpeed == 0 {
		t.Errorf("speed limit 1e-6 m/s: %d circuits, flags %v", o.WaterCircuits, o.Flags)
	}
}

// TestNusselt compares the Gnielinski correlation with the
// Dittus–Boelter one, Nu = 0.023 Re^0.8 Pr^0.4 (F. W. Dittus and
// L. M. K. Boelter, 1930; Incropera and DeWitt, Fundamentals of Heat and
// Mass Transfer, eq. 8.60), which is stated to ±25 %: they agree within
// that over 1e4 to 1e5. Laminar flow gives 4.36 (uniform heat flux).
func TestNusselt(t *testing.T) {
	for _, re := range []float64{1e4, 3e4, 1e5} {
		db := 0.023 * math.Pow(re, 0.8) * math.Pow(waterPrandtl, 0.4)
		if g := nusselt(re, waterPrandtl); math.Abs(g-db) > 0.25*db {
			t.Errorf("Re %g: Gnielinski %.1f, Dittus–Boelter %.1f", re, g, db)
		}
	}
	if nusselt(1000, waterPrandtl) != laminarNusselt {
		t.Error("laminar Nusselt number")
	}
}

// TestHotSpot checks the hottest conductor by hand for the worked
// example's bar in one circuit: Re = 12508 (TestWaterPressure),
// Petukhov f = (0.790 ln 12508 − 1.64)^−2 = 0.029595,
// Nu = (f/8)(Re − 1000) 4.8 / (1 + 12.7 (f/8)^½ (4.8^⅔ − 1))
// = 204.34 / 2.4256 = 84.24 (Gnielinski 1976),
// h = 84.24 × 0.62 / 0.006 = 8705 W/(m²·K),
// q = 3432.1 W / (π × 0.006 m × 189 m) = 963.4 W/m², film 0.1107 K:
// 20 °C + 20 K + 0.1107 K = 40.111 °C. Tolerance 0.002 K: the hand
// figures' last digit.
func TestHotSpot(t *testing.T) {
	s := bench()
	s.Cooling = Water
	o := Options(s, HollowWires()[5:6])[0]
	if math.Abs(o.HotSpot-40.111) > 0.002 || o.WaterCircuits != 1 || o.WaterRise != 20 {
		t.Errorf("hot spot %.4f °C, %d circuits, rise %g K", o.HotSpot, o.WaterCircuits, o.WaterRise)
	}
	// A water rise that leaves the outlet above the coil's 60 °C is flagged.
	s.WaterRise = 45
	if o := Options(s, HollowWires()[5:6])[0]; o.Flags&OverTemperature == 0 {
		t.Errorf("outlet at %.1f °C not flagged: %v", o.HotSpot, o.Flags)
	}
}

// TestAbsurd: a winding above 1500 V is left out of the table and
// counted; air cooling shows the surface flux P/S.
func TestAbsurd(t *testing.T) {
	s := bench()
	opts := Options(s, IECWires(R20, Grade2))
	var b bytes.Buffer
	hid, err := WriteReviewTable(&b, s, opts, -1)
	if err != nil {
		t.Fatal(err)
	}
	n := 0
	for i := range opts {
		if opts[i].Voltage > AbsurdVoltage {
			n++
		}
		if want := opts[i].Power / s.Window.CoolingSurface(); math.Abs(opts[i].SurfaceFlux-want) > 1e-12*want {
			t.Errorf("%s: flux %g, want %g", opts[i].Wire.Name, opts[i].SurfaceFlux, want)
		}
	}
	if n == 0 || hid.Total() != n || strings.Count(b.String(), "\n") != len(opts)-n+1 {
		t.Errorf("%d above 1500 V, %d hidden, table:\n%s", n, hid.Total(), b.String())
	}
}
