package coil

import (
	"errors"
	"math"
	"math/rand/v2"
	"strings"
	"testing"
)

// bench is the worked example: a bench dipole needing 32,000 ampere-turns
// per coil in a window of 100 mm build by 160 mm height, mean turn 1.5 m
// (an invented scenario with realistic proportions).
func bench() Spec {
	return Spec{AmpereTurns: 32000, Window: Window{Width: 0.100, Height: 0.160, MeanTurn: 1.5}}
}

func relErr(got, want float64) float64 { return math.Abs(got-want) / math.Abs(want) }

func finite(vs ...float64) bool {
	for _, v := range vs {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return false
		}
	}
	return true
}

func allWires() []Wire {
	var ws []Wire
	ws = append(ws, IECWires(R40, Grade1)...)
	ws = append(ws, IECWires(R40, Grade2)...)
	ws = append(ws, AWGWires(Grade2)...)
	ws = append(ws, HollowWires()...)
	return ws
}

// checkIdentities asserts relations every option must satisfy, each by a
// route other than the one Options computes it by (which goes through the
// resistance R = ρ L / A): Ohm's law in its local form E = ρ J integrated
// along the wire, V = ρ J L with L = N × mean turn; Joule heating as the
// volume integral P = ρ J² V_Cu and, from the window alone,
// P = ρ (NI)² l / (fill W H) (e.g. D. B. Montgomery, Solenoid Magnet
// Design, 1969, ch. 1, the power-window relation, from memory); N I = NI;
// J = I/A;
// mass = density × V_Cu. Tolerance 1e-12 relative: a few float roundings.
func checkIdentities(t *testing.T, name string, s Spec, opts []Option) {
	t.Helper()
	d := s.withDefaults()
	rho := CopperResistivity(d.Temperature)
	const tol = 1e-12
	for i := range opts {
		o := &opts[i]
		a := o.Wire.Area()
		vcu := float64(o.Turns) * a * s.Window.MeanTurn
		if !finite(o.Current, o.CurrentDensity, o.Resistance, o.Voltage, o.Power, o.Mass,
			o.Length, o.CopperFill, o.CoolingPower, o.WaterFlow, o.WaterSpeed, o.Reynolds, o.WaterPressure) {
			t.Fatalf("%s %s: non-finite result %+v", name, o.Wire.Name, *o)
		}
		if o.Turns < 1 || o.Turns > o.MaxTurns {
			t.Errorf("%s %s: turns %d, max %d", name, o.Wire.Name, o.Turns, o.MaxTurns)
		}
		checks := []struct {
			what      string
			got, want float64
		}{
			{"N I = NI", float64(o.Turns) * o.Current, s.AmpereTurns},
			{"J = I/A", o.CurrentDensity, o.Current / a},
			{"V = ρ J N l", o.Voltage, rho * o.CurrentDensity * float64(o.Turns) * s.Window.MeanTurn},
			{"P = ρ J² V_Cu", o.Power, rho * o.CurrentDensity * o.CurrentDensity * vcu},
			{"P = ρ (NI)² l / (fill W H)", o.Power, rho * s.AmpereTurns * s.AmpereTurns * s.Window.MeanTurn / (o.CopperFill * s.Window.Area())},
			{"m = density V_Cu", o.Mass, CopperDensity * vcu},
		}
		for _, c := range checks {
			if relErr(c.got, c.want) > tol {
				t.Errorf("%s %s: %s: %.15g vs %.15g", name, o.Wire.Name, c.what, c.got, c.want)
			}
		}
	}
}

func TestOptionsIdentities(t *testing.T) {
	wires := allWires()
	for _, c := range []struct {
		name string
		edit func(*Spec)
	}{
		{"fill", func(*Spec) {}},
		{"layers", func(s *Spec) { s.Packing = ByLayers }},
		{"orthocyclic", func(s *Spec) { s.Packing = Orthocyclic }},
		{"fixed 900 turns at 80 °C", func(s *Spec) { s.Turns = 900; s.Temperature = 80 }},
		{"water", func(s *Spec) { s.Cooling = Water }},
		{"forced air, small window", func(s *Spec) {
			s.Cooling = AirForced
			s.Window = Window{Width: 0.004, Height: 0.02, MeanTurn: 0.1}
			s.AmpereTurns = 50
		}},
	} {
		s := bench()
		c.edit(&s)
		opts := Options(s, wires)
		if len(opts) == 0 {
			t.Fatalf("%s: no options", c.name)
		}
		checkIdentities(t, c.name, s, opts)
	}
}

func TestOptionsRandom(t *testing.T) {
	// Random valid specs (fixed seed): every result finite and every
	// identity holds; Best's choice meets every limit.
	r := rand.New(rand.NewPCG(1, 1))
	wires := allWires()
	for k := 0; k < 200; k++ {
		s := Spec{
			AmpereTurns: math.Exp(r.Float64()*10) * 10,
			Window: Window{
				Width:    0.002 + 0.2*r.Float64(),
				Height:   0.002 + 0.3*r.Float64(),
				MeanTurn: 0.05 + 3*r.Float64(),
			},
			Packing:       Packing(r.IntN(3)),
			FillFactor:    0.3 + 0.6*r.Float64(),
			Temperature:   30 + 120*r.Float64(),
			Cooling:       Cooling(r.IntN(3)),
			SupplyVoltage: 400 * r.Float64(),
			SupplyCurrent: 200 * r.Float64(),
			WaterCircuits: r.IntN(4),
		}
		if r.IntN(3) == 0 {
			s.Turns = 1 + r.IntN(2000)
		}
		if err := s.Validate(); err != nil {
			t.Fatalf("case %d: %v", k, err)
		}
		opts := Options(s, wires)
		checkIdentities(t, "random", s, opts)
		if b, ok := Best(opts, LeastPower); ok != (Explain(opts) == nil) || (ok && !b.OK()) {
			t.Errorf("case %d: Best ok=%v but Explain %v", k, ok, Explain(opts))
		}
	}
}

func TestWorkedExample(t *testing.T) {
	// Worked by hand (IEC 60028 copper, the fill rule of Packing ByFill):
	//   wire 2.000 mm grade 2, overall 2.000 + 0.112 = 2.112 mm
	//   envelope area π/4 × 2.112² = 3.50330 mm²
	//   N = floor(0.6 × 100 × 160 / 3.50330) = floor(2740.27) = 2740
	//   I = 32000 / 2740 = 11.679 A
	//   A = π/4 × 2² = 3.14159 mm², J = 11.679 / 3.14159 = 3.7175 A/mm²
	//   ρ(60 °C) = (1/58)(1 + 0.00393 × 40) = 0.0199517 Ω·mm²/m
	//   R = 0.0199517 × 2740 × 1.5 / 3.14159 = 26.102 Ω
	//   V = 11.679 × 26.102 = 304.84 V, P = 11.679² × 26.102 = 3560.2 W
	//   m = 8890 kg/m³ × 4110 m × 3.14159e-6 m² = 114.79 kg
	//   air surface (1.5 + π 0.1) 0.16 + 2 × 1.5 × 0.1 = 0.59027 m²,
	//   still air removes 12 × 0.59027 × 40 = 283.3 W < 3560 W: too hot,
	//   and 3.72 A/mm² > 2.5: too dense; water at 20 K rise needs
	//   3560.2 / (995 × 4180 × 20) = 4.280e-5 m³/s = 2.568 l/min.
	// Tolerances: half a unit of the last hand-computed digit.
	w := []Wire{{Name: "2.000 G2", Shape: Round, Diameter: 2e-3, Overall: 2.112e-3}}
	opts := Options(bench(), w)
	if len(opts) != 1 {
		t.Fatalf("%d options, want 1", len(opts))
	}
	o := opts[0]
	for _, c := range []struct {
		what      string
		got, want float64
		tol       float64
	}{
		{"turns", float64(o.Turns), 2740, 0},
		{"current A", o.Current, 11.679, 0.0005},
		{"J A/mm²", o.CurrentDensity * 1e-6, 3.7175, 0.00005},
		{"R Ω", o.Resistance, 26.102, 0.0005},
		{"V", o.Voltage, 304.84, 0.005},
		{"P W", o.Power, 3560.2, 0.05},
		{"mass kg", o.Mass, 114.79, 0.005},
		{"cooling W", o.CoolingPower, 283.3, 0.05},
	} {
		if math.Abs(c.got-c.want) > c.tol {
			t.Errorf("%s: got %.6g, want %.6g ± %g", c.what, c.got, c.want, c.tol)
		}
	}
	if o.Flags != OverDensity|OverHeat {
		t.Errorf("flags %v, want density,heat", o.Flags)
	}
	s := bench()
	s.Cooling = Water
	o = Options(s, w)[0]
	if o.Flags != 0 || math.Abs(o.WaterFlow*6e4-2.568) > 0.0005 {
		t.Errorf("water: flags %v, flow %.4f l/min, want ok and 2.568", o.Flags, o.WaterFlow*6e4)
	}
	// The 10 x 10 mm hollow bar (6 mm bore, 1 mm corners, 11 mm
	// insulated): 9 layers of 14 = 126 turns of 70.867 mm², I = 253.97 A,
	// J = 3.5837 A/mm², R = 0.0199517 × 126 × 1.5 / 70.867 = 0.053210 Ω,
	// P = 3432.1 W, water 3432.1 / (995 × 4180 × 20) = 4.1260e-5 m³/s
	// = 2.4756 l/min, speed with all turns in one circuit through the
	// 28.274 mm² bore 4.1260e-5 / 2.8274e-5 = 1.4593 m/s.
	o = Options(s, HollowWires()[5:6])[0]
	for _, c := range []struct {
		what      string
		got, want float64
		tol       float64
	}{
		{"turns", float64(o.Turns), 126, 0},
		{"current A", o.Current, 253.97, 0.005},
		{"J A/mm²", o.CurrentDensity * 1e-6, 3.5837, 0.00005},
		{"R Ω", o.Resistance, 0.053210, 0.0000005},
		{"P W", o.Power, 3432.1, 0.05},
		{"water l/min", o.WaterFlow * 6e4, 2.4756, 0.00005},
		{"speed m/s", o.WaterSpeed, 1.4593, 0.00005},
	} {
		if math.Abs(c.got-c.want) > c.tol {
			t.Errorf("hollow %s: got %.6g, want %.6g ± %g", c.what, c.got, c.want, c.tol)
		}
	}
}

func TestPowerNearlyIndependentOfWire(t *testing.T) {
	// P = ρ J² V_Cu = ρ (NI)² l / (N A): with the window full, N A is the
	// copper fill times the window, so the wire size changes the power
	// only through the ratio of copper to envelope, (d/d_o)², and the
	// floor of N. For IEC grade 2 wire from 0.5 to 5 mm d/d_o runs from
	// 0.88 to 0.97 (enamel table), so the power varies by under 25 %.
	s := bench()
	var lo, hi float64
	for _, o := range Options(s, IECWires(R40, Grade2)) {
		if o.Wire.Diameter < 0.5e-3 {
			continue
		}
		if lo == 0 || o.Power < lo {
			lo = o.Power
		}
		hi = max(hi, o.Power)
	}
	if hi/lo > 1.25 {
		t.Errorf("power spread %.1f .. %.1f W (ratio %.3f), want under 1.25", lo, hi, hi/lo)
	}
}

func TestLimits(t *testing.T) {
	w := []Wire{{Name: "2.000 G2", Shape: Round, Diameter: 2e-3, Overall: 2.112e-3}}
	// The worked example draws 11.679 A at 304.84 V, 3.7175 A/mm², 3560 W.
	for _, c := range []struct {
		name string
		edit func(*Spec)
		want Flags
	}{
		{"water, no supply limit", func(s *Spec) { s.Cooling = Water }, 0},
		{"supply 300 V", func(s *Spec) { s.Cooling = Water; s.SupplyVoltage = 300 }, OverVoltage},
		{"supply 310 V", func(s *Spec) { s.Cooling = Water; s.SupplyVoltage = 310 }, 0},
		{"supply 11 A", func(s *Spec) { s.Cooling = Water; s.SupplyCurrent = 11 }, OverCurrent},
		{"supply 12 A", func(s *Spec) { s.Cooling = Water; s.SupplyCurrent = 12 }, 0},
		{"water J limit 3.5", func(s *Spec) { s.Cooling = Water; s.MaxCurrentDensity = 3.5e6 }, OverDensity},
		{"forced air", func(s *Spec) { s.Cooling = AirForced }, OverHeat},
		{"forced air, huge surface", func(s *Spec) { s.Cooling = AirForced; s.CoolingSurface = 3 }, 0},
		{"still air", func(s *Spec) {}, OverDensity | OverHeat},
		{"still air, 5 V 1 A", func(s *Spec) { s.SupplyVoltage = 5; s.SupplyCurrent = 1 }, OverVoltage | OverCurrent | OverDensity | OverHeat},
	} {
		s := bench()
		c.edit(&s)
		if got := Options(s, w)[0].Flags; got != c.want {
			t.Errorf("%s: flags %v, want %v", c.name, got, c.want)
		}
	}
	// Forced air at 40 W/(m²K) over 0.59027 m² and 40 K takes 944.4 W,
	// below 3560 W; 3 m² take 4800 W, above it.
}

func TestFitTurns(t *testing.T) {
	d := 1e-3
	round := Wire{Name: "1 mm", Shape: Round, Diameter: 0.9e-3, Overall: d}
	for _, c := range []struct {
		name string
		s    Spec
		want int
	}{
		// Square lay: floor(10.5) × floor(20.5) = 200.
		{"layers", Spec{Packing: ByLayers, Window: Window{Width: 10.5 * d, Height: 20.5 * d}}, 200},
		// Orthocyclic: 1 + floor((W − d)/(d √3/2)) layers; W = (1 + 3 √3/2 + 0.01) d
		// gives 4; H = 10.2 d: full layers of 10, 0.2 d < d/2 left so the
		// nested layers hold 9: 10 + 9 + 10 + 9 = 38.
		{"orthocyclic short", Spec{Packing: Orthocyclic, Window: Window{Width: (1 + 3*math.Sqrt(3)/2 + 0.01) * d, Height: 10.2 * d}}, 38},
		{"orthocyclic full", Spec{Packing: Orthocyclic, Window: Window{Width: (1 + 3*math.Sqrt(3)/2 + 0.01) * d, Height: 10.6 * d}}, 40},
		// Fill 0.6 of 20 × 30 d² over π/4 d²: floor(458.37) = 458.
		{"fill", Spec{Window: Window{Width: 20 * d, Height: 30 * d}}, 458},
		// A window one wire wide: the fill count 0.9 × 1.2 × 100.2 / (π/4)
		// = 137 is capped by the single layer of 100 turns.
		{"fill capped", Spec{FillFactor: 0.9, Window: Window{Width: 1.2 * d, Height: 100.2 * d}}, 100},
		{"too narrow", Spec{Window: Window{Width: 0.99 * d, Height: 100 * d}}, 0},
	} {
		c.s.Window.MeanTurn = 1
		if got := FitTurns(c.s, &round); got != c.want {
			t.Errorf("%s: %d turns, want %d", c.name, got, c.want)
		}
	}
	// Bars always go by layers: 11 mm insulated in 100 × 160 mm: 9 × 14.
	h := HollowWires()[5]
	if got := FitTurns(bench(), &h); got != 126 {
		t.Errorf("hollow 10 mm: %d turns, want 126", got)
	}
}

func TestFixedTurns(t *testing.T) {
	// 1000 turns asked: every option has 1000 turns and 32 A; the least
	// power is the thickest wire that still holds 1000 turns, and the next
	// size up in the table does not.
	s := bench()
	s.Turns = 1000
	s.Cooling = Water
	wires := IECWires(R40, Grade2)
	opts := Options(s, wires)
	for _, o := range opts {
		if o.Turns != 1000 || o.MaxTurns < 1000 || math.Abs(o.Current-32) > 1e-12 {
			t.Errorf("%s: turns %d of %d, current %g", o.Wire.Name, o.Turns, o.MaxTurns, o.Current)
		}
	}
	b, ok := Best(opts, LeastPower)
	if !ok {
		t.Fatalf("no best: %v", Explain(opts))
	}
	if b.Wire.Name != opts[len(opts)-1].Wire.Name {
		t.Errorf("best %s, want the thickest that fits, %s", b.Wire.Name, opts[len(opts)-1].Wire.Name)
	}
	for i := range wires {
		if wires[i].Name == b.Wire.Name && i+1 < len(wires) {
			if n := FitTurns(s, &wires[i+1]); n >= 1000 {
				t.Errorf("next size %s holds %d turns", wires[i+1].Name, n)
			}
		}
	}
}

func TestBestAndExplain(t *testing.T) {
	opts := []Option{
		{Wire: Wire{Name: "a"}, Power: 300, Current: 5, Voltage: 60, Mass: 9},
		{Wire: Wire{Name: "b"}, Power: 200, Current: 9, Voltage: 22, Mass: 12, Flags: OverVoltage},
		{Wire: Wire{Name: "c"}, Power: 250, Current: 7, Voltage: 36, Mass: 10},
		{Wire: Wire{Name: "d"}, Power: 400, Current: 2, Voltage: 200, Mass: 7},
	}
	for _, c := range []struct {
		by   Criterion
		want string
	}{{LeastPower, "c"}, {LeastCurrent, "d"}, {LeastVoltage, "c"}, {LeastMass, "d"}} {
		if b, ok := Best(opts, c.by); !ok || b.Wire.Name != c.want {
			t.Errorf("criterion %d: got %q (ok %v), want %q", c.by, b.Wire.Name, ok, c.want)
		}
	}
	if err := Explain(opts); err != nil {
		t.Errorf("Explain with good options: %v", err)
	}
	for i := range opts {
		opts[i].Flags |= OverHeat
	}
	opts[0].Flags |= OverCurrent | OverDensity
	if _, ok := Best(opts, LeastPower); ok {
		t.Error("Best found a winding although all are flagged")
	}
	var ne *NoneError
	if err := Explain(opts); !errors.As(err, &ne) || *ne != (NoneError{Windings: 4, OverVoltage: 1, OverCurrent: 1, OverDensity: 1, OverHeat: 4}) {
		t.Errorf("Explain: %#v", err)
	} else if !strings.Contains(err.Error(), "4 dissipate more than the cooling removes") {
		t.Errorf("Explain message: %v", err)
	}
	if err := Explain(nil); !errors.As(err, &ne) || ne.Windings != 0 || !strings.Contains(err.Error(), "no wire fits") {
		t.Errorf("Explain(nil): %v", err)
	}
}

func TestValidate(t *testing.T) {
	for _, c := range []struct {
		field string
		edit  func(*Spec)
	}{
		{"AmpereTurns", func(s *Spec) { s.AmpereTurns = 0 }},
		{"AmpereTurns", func(s *Spec) { s.AmpereTurns = math.NaN() }},
		{"Window.Width", func(s *Spec) { s.Window.Width = -1 }},
		{"Window.Height", func(s *Spec) { s.Window.Height = math.Inf(1) }},
		{"Window.MeanTurn", func(s *Spec) { s.Window.MeanTurn = 0 }},
		{"Turns", func(s *Spec) { s.Turns = -3 }},
		{"Packing", func(s *Spec) { s.Packing = 7 }},
		{"FillFactor", func(s *Spec) { s.FillFactor = 0.95 }},
		{"FillFactor", func(s *Spec) { s.FillFactor = -0.1 }},
		{"Temperature", func(s *Spec) { s.Temperature = 400 }},
		{"Temperature", func(s *Spec) { s.Temperature = -250 }},
		{"Ambient", func(s *Spec) { s.Ambient = 70 }},
		{"SupplyVoltage", func(s *Spec) { s.SupplyVoltage = -1 }},
		{"SupplyCurrent", func(s *Spec) { s.SupplyCurrent = math.NaN() }},
		{"Cooling", func(s *Spec) { s.Cooling = 5 }},
		{"MaxCurrentDensity", func(s *Spec) { s.MaxCurrentDensity = -1 }},
		{"CoolingSurface", func(s *Spec) { s.CoolingSurface = -1 }},
		{"WaterRise", func(s *Spec) { s.WaterRise = math.Inf(1) }},
		{"WaterCircuits", func(s *Spec) { s.WaterCircuits = -1 }},
		{"MaxWaterPressure", func(s *Spec) { s.MaxWaterPressure = math.NaN() }},
	} {
		s := bench()
		c.edit(&s)
		var se *SpecError
		err := s.Validate()
		if !errors.As(err, &se) || se.Field != c.field {
			t.Errorf("%s: got %v", c.field, err)
			continue
		}
		func() {
			defer func() {
				if recover() == nil {
					t.Errorf("%s: Options did not panic", c.field)
				}
			}()
			Options(s, IECWires(R20, Grade1))
		}()
	}
	if err := bench().Validate(); err != nil {
		t.Errorf("bench spec: %v", err)
	}
}

func TestOptionsDoNotMutate(t *testing.T) {
	wires := IECWires(R20, Grade2)
	keep := append([]Wire(nil), wires...)
	Options(bench(), wires)
	for i := range wires {
		if wires[i] != keep[i] {
			t.Fatalf("wire %d changed", i)
		}
	}
}
