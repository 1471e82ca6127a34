package caution

import (
	"encoding/json"
	"math"
	"strings"
	"testing"
)

func hazards(list []Caution) []Hazard {
	var h []Hazard
	for _, c := range list {
		h = append(h, c.Hazard)
	}
	return h
}

// TestGeneral: with no facts the five general cautions, in order, none
// with a number.
func TestGeneral(t *testing.T) {
	list := List(Facts{})
	want := []Hazard{Energy, SwitchOff, PoleForce, Heat, Codes}
	if got := hazards(list); len(got) != len(want) {
		t.Fatalf("hazards %v, want %v", got, want)
	}
	for i, c := range list {
		if c.Hazard != want[i] || c.Value != 0 || c.Text == "" {
			t.Errorf("caution %d: %+v", i, c)
		}
	}
	if !strings.Contains(list[len(list)-1].Text, "licensed practice") {
		t.Error("no pointer to codes and licensed practice")
	}
}

// TestQuantified checks each figure against its formula: the weight a
// force equals, F / g with standard gravity 9.80665 m/s² (3rd CGPM,
// 1901); the adiabatic heating rate P / (m c) with copper's specific
// heat 385 J/(kg·K) (from memory of handbook tables); L I / 1 ms for a
// circuit broken in a millisecond (Faraday's law, v = L di/dt); the
// overdrive's I² heating ratio (Joule's law).
func TestQuantified(t *testing.T) {
	f := Facts{Energy: 1330, Current: 100, Inductance: 0.272, Force: 22400, Power: 2400, CopperMass: 112,
		CoilTemperature: 40, Water: true, WaterFlow: 1.72 / 6e4, WaterPressure: 0.32e5, Rated: 100, Driven: 150}
	list := List(f)
	want := []Hazard{Energy, SwitchOff, PoleForce, Heat, Water, Overdrive, Codes}
	got := hazards(list)
	if len(got) != len(want) {
		t.Fatalf("hazards %v, want %v", got, want)
	}
	byHazard := map[Hazard]Caution{}
	for i, c := range list {
		if c.Hazard != want[i] {
			t.Errorf("caution %d is %q, want %q", i, c.Hazard, want[i])
		}
		byHazard[c.Hazard] = c
	}
	for _, c := range []struct {
		h     Hazard
		value float64
		text  []string
	}{
		{Energy, 1330, []string{"1.33 kJ", "100 A"}},
		{SwitchOff, 0.272 * 100 / 1e-3, []string{"27.2 kV"}},
		{PoleForce, 22400, []string{"22.4 kN", "2.28 t"}}, // 22400 / 9.80665 = 2284 kg
		{Heat, 2400 / (112 * 385.0), []string{"2.4 kW", "40 °C", "0.056 K per second"}},
		{Water, 1.72 / 6e4, []string{"1.72 l/min", "0.32 bar", "flow switch"}},
		{Overdrive, 150, []string{"150 A", "1.5 times", "2.2 times as fast"}},
	} {
		got := byHazard[c.h]
		if math.Abs(got.Value-c.value) > 1e-12*c.value {
			t.Errorf("%s: value %g, want %g", c.h, got.Value, c.value)
		}
		for _, s := range c.text {
			if !strings.Contains(got.Text, s) {
				t.Errorf("%s: %q lacks %q", c.h, got.Text, s)
			}
		}
	}
	// A designed discharge path replaces the 1 ms estimate.
	f.DischargePath, f.SwitchOffVoltage, f.DischargeTime = "discharge resistor", 246, 0.0883
	if c := List(f)[1]; c.Value != 246 || !strings.Contains(c.Text, "246 V") || !strings.Contains(c.Text, "88.3 ms") {
		t.Errorf("discharge path: %+v", c)
	}
}

// TestJSON: a caution encodes as its sentence.
func TestJSON(t *testing.T) {
	b, err := json.Marshal(List(Facts{})[:1])
	if err != nil {
		t.Fatal(err)
	}
	var s []string
	if err := json.Unmarshal(b, &s); err != nil || len(s) != 1 || !strings.HasPrefix(s[0], "Magnet currents") {
		t.Errorf("JSON %s: %v", b, err)
	}
}
