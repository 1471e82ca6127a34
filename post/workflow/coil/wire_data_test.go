package coil

import (
	"math"
	"testing"
)

func TestAWGDiameter(t *testing.T) {
	for _, c := range []struct {
		n    int
		want float64 // mm
		tol  float64 // mm
		src  string
	}{
		// The defining end points of ASTM B258: 0000 is 0.4600 in and 36 is
		// 0.0050 in exactly. Tolerance: float rounding.
		{-3, 0.46 * 25.4, 1e-9, "ASTM B258 definition, 0000 = 0.4600 in"},
		{36, 0.005 * 25.4, 1e-12, "ASTM B258 definition, 36 = 0.0050 in"},
		// Table values from memory of the ASTM B258 table (inches rounded
		// to 4 figures: 0.1019, 0.0320, 0.0100 in); tolerance 0.5 µm for
		// the table's rounding to 3 decimals in mm.
		{10, 2.588, 0.0005, "ASTM B258 table, from memory"},
		{20, 0.812, 0.0005, "ASTM B258 table, from memory"},
		{30, 0.255, 0.0005, "ASTM B258 table, from memory"},
	} {
		if got := AWGDiameter(c.n) * 1e3; math.Abs(got-c.want) > c.tol {
			t.Errorf("%s: d = %.6f mm, want %.6f ± %g mm (%s)", AWGName(c.n), got, c.want, c.tol, c.src)
		}
	}
	// Common practice rule: six gauges halve the diameter (92^(6/39) =
	// 2.0062), three gauges halve the area. Checked to 0.5 %.
	for n := -3; n <= 34; n++ {
		if r := AWGDiameter(n) / AWGDiameter(n+6); math.Abs(r-2) > 0.01 {
			t.Errorf("AWG %d/%d diameter ratio %.4f, want about 2", n, n+6, r)
		}
	}
	if AWGName(-3) != "AWG 4/0" || AWGName(0) != "AWG 1/0" || AWGName(12) != "AWG 12" {
		t.Errorf("AWG names: %q %q %q", AWGName(-3), AWGName(0), AWGName(12))
	}
}

func TestRenardSeries(t *testing.T) {
	// ISO 3:1973: R40 values are 10^(k/40) rounded to 3 figures, with a
	// few historic roundings further off (1.70 against 1.6788, +1.26 %,
	// is the largest; 1.32 against 1.3335, -1.01 %, the most negative);
	// 1.3 % bounds them all. Strictly increasing.
	for k, v := range r40 {
		th := math.Pow(10, float64(k)/40)
		if math.Abs(v/th-1) > 0.013 {
			t.Errorf("R40[%d] = %.2f, theoretical %.4f: off by %.2f %%", k, v, th, 100*(v/th-1))
		}
		if k > 0 && !(v > r40[k-1]) {
			t.Errorf("R40[%d] = %.2f not above R40[%d] = %.2f", k, v, k-1, r40[k-1])
		}
	}
	r20, r40d := IECDiameters(R20), IECDiameters(R40)
	// 0.100 .. 0.950 and 1.00 .. 5.00: 20 + 15 R20 values, 40 + 29 R40.
	if len(r20) != 35 || len(r40d) != 69 {
		t.Fatalf("series lengths: R20 %d (want 35), R40 %d (want 69)", len(r20), len(r40d))
	}
	for i, d := range r20 {
		if d != r40d[2*i] {
			t.Errorf("R20[%d] = %g is not R40[%d] = %g", i, d, 2*i, r40d[2*i])
		}
	}
	if r20[0] != 0.1e-3 || r20[len(r20)-1] != 5e-3 {
		t.Errorf("R20 spans %g .. %g m, want 0.1 mm .. 5 mm", r20[0], r20[len(r20)-1])
	}
}

func TestEnamelBuild(t *testing.T) {
	// The table rows are returned exactly, the build grows with the
	// diameter, grade 2 is thicker than grade 1, and the build is a few
	// percent of the diameter for thick wire (IEC 60317-0-1 typical,
	// from memory).
	for _, row := range enamelBuild {
		if g := EnamelBuild(row.d*1e-3, Grade1); math.Abs(g-row.g1*1e-3) > 1e-15 {
			t.Errorf("d = %g mm grade 1: %g, want %g", row.d, g, row.g1*1e-3)
		}
		if g := EnamelBuild(row.d*1e-3, Grade2); math.Abs(g-row.g2*1e-3) > 1e-15 {
			t.Errorf("d = %g mm grade 2: %g, want %g", row.d, g, row.g2*1e-3)
		}
	}
	prev1, prev2 := 0.0, 0.0
	for _, d := range IECDiameters(R40) {
		g1, g2 := EnamelBuild(d, Grade1), EnamelBuild(d, Grade2)
		if !(g1 >= prev1) || !(g2 >= prev2) || !(g2 > g1) {
			t.Errorf("d = %g mm: builds %g, %g not increasing or grade 2 not thicker", d*1e3, g1, g2)
		}
		prev1, prev2 = g1, g2
	}
}

func TestWireTables(t *testing.T) {
	tables := map[string][]Wire{
		"IEC R20 G1": IECWires(R20, Grade1),
		"IEC R40 G2": IECWires(R40, Grade2),
		"AWG G2":     AWGWires(Grade2),
		"hollow":     HollowWires(),
	}
	for name, ws := range tables {
		if len(ws) == 0 {
			t.Errorf("%s: empty", name)
		}
		for i := range ws {
			w := &ws[i]
			if err := w.Check(); err != nil {
				t.Errorf("%s: %v", name, err)
			}
			if w.Source == "" || w.Name == "" {
				t.Errorf("%s: wire %d has no name or source", name, i)
			}
			if i > 0 && !(w.Area() > ws[i-1].Area()) {
				t.Errorf("%s: %s not thicker than %s", name, w.Name, ws[i-1].Name)
			}
		}
	}
	// A 10 x 10 mm hollow bar with 1 mm corners and a 6 mm bore has
	// 100 - (4 - π) - 9π = 70.867 mm² of copper (geometry).
	h := HollowWires()[5]
	if want := 100 - (4 - math.Pi) - 9*math.Pi; math.Abs(h.Area()*1e6-want) > 1e-9 {
		t.Errorf("%s: area %.6f mm², want %.6f", h.Name, h.Area()*1e6, want)
	}
}

func TestWireCheck(t *testing.T) {
	good := Wire{Name: "bar", Shape: Hollow, Width: 8e-3, Height: 8e-3, Corner: 1e-3, Bore: 5e-3, OverallWidth: 9e-3, OverallHeight: 9e-3}
	for _, c := range []struct {
		name string
		edit func(*Wire)
	}{
		{"bore too large", func(w *Wire) { w.Bore = 8e-3 }},
		{"insulation negative", func(w *Wire) { w.OverallWidth = 7e-3 }},
		{"corner too large", func(w *Wire) { w.Corner = 4.5e-3 }},
		{"NaN width", func(w *Wire) { w.Width = math.NaN() }},
		{"round without overall", func(w *Wire) { *w = Wire{Name: "r", Shape: Round, Diameter: 1e-3} }},
		{"round overall thinner", func(w *Wire) { *w = Wire{Name: "r", Shape: Round, Diameter: 1e-3, Overall: 0.9e-3} }},
		{"unknown shape", func(w *Wire) { w.Shape = 9 }},
	} {
		w := good
		c.edit(&w)
		err := w.Check()
		if _, ok := err.(*WireError); !ok {
			t.Errorf("%s: got %v, want *WireError", c.name, err)
		}
	}
	if err := good.Check(); err != nil {
		t.Errorf("good wire: %v", err)
	}
}

func TestConstructors(t *testing.T) {
	// A 4 x 10 mm strip with 0.5 mm corners: 40 - (4 - π) 0.25 =
	// 39.785 mm² (geometry); 0.2 mm insulation makes 4.4 x 10.4 mm.
	b := BarWire("strip", 4e-3, 10e-3, 0.5e-3, 0.2e-3)
	if err := b.Check(); err != nil {
		t.Fatal(err)
	}
	if want := 40 - (4-math.Pi)*0.25; math.Abs(b.Area()*1e6-want) > 1e-9 {
		t.Errorf("strip area %.6f mm², want %.6f", b.Area()*1e6, want)
	}
	if w, h := b.Envelope(); math.Abs(w-4.4e-3) > 1e-15 || math.Abs(h-10.4e-3) > 1e-15 {
		t.Errorf("strip envelope %g x %g", w, h)
	}
	h := HollowBar("tube", 10e-3, 10e-3, 1e-3, 6e-3, 0.5e-3)
	if got, want := h.Area(), HollowWires()[5].Area(); math.Abs(got-want) > 1e-18 || h.Check() != nil {
		t.Errorf("hollow bar area %g, want %g (%v)", got, want, h.Check())
	}
	r := RoundWire("r", 1e-3, 1.05e-3)
	if r.Check() != nil || math.Abs(r.Area()-math.Pi/4*1e-6) > 1e-20 {
		t.Errorf("round wire: %v, area %g", r.Check(), r.Area())
	}
	// A bar in the bench window goes by layers: 100/4.4 = 22 layers of
	// 160/10.4 = 15 turns.
	if n := FitTurns(bench(), &b); n != 22*15 {
		t.Errorf("strip turns %d, want %d", n, 22*15)
	}
}
