package coil

import (
	"math"
	"testing"
)

func TestCopperResistance(t *testing.T) {
	// IEC 60028:1925 (International Annealed Copper Standard): 1 m of
	// 1 mm² annealed copper has 1/58 Ω at 20 °C, so 1 km has
	// 1000/58 = 17.241 Ω. Tolerance 1e-12 relative: float rounding only.
	if got, want := CopperResistance(1000, 1e-6, 20), 1000.0/58; math.Abs(got-want) > 1e-12*want {
		t.Errorf("1 km of 1 mm² at 20 °C: got %.6f Ω, want %.6f Ω", got, want)
	}
	if got := CopperResistance(1000, 1e-6, 20); math.Abs(got-17.241) > 0.0005 {
		t.Errorf("1 km of 1 mm² at 20 °C: got %.4f Ω, want 17.241 Ω (IEC 60028, rounded)", got)
	}
	// IEC 60028 temperature coefficient 0.00393 /K at 20 °C: at 80 °C
	// R = R20 (1 + 0.00393 × 60) = 17.2414 × 1.2358 = 21.307 Ω.
	want80 := 1000.0 / 58 * (1 + 0.00393*60)
	if got := CopperResistance(1000, 1e-6, 80); math.Abs(got-want80) > 1e-12*want80 {
		t.Errorf("1 km of 1 mm² at 80 °C: got %.6f Ω, want %.6f Ω", got, want80)
	}
	if got := CopperResistance(1000, 1e-6, 80); math.Abs(got-21.307) > 0.0005 {
		t.Errorf("1 km of 1 mm² at 80 °C: got %.4f Ω, want 21.307 Ω", got)
	}
	// The linear law reaches zero near -234.5 °C (20 - 1/0.00393), the
	// "inferred absolute zero" of copper (common practice, from memory:
	// 234.5 is the figure IEC 60287 uses).
	if z := 20 - 1/CopperAlpha20; math.Abs(z+234.45) > 0.01 {
		t.Errorf("zero-resistance temperature %.3f °C, want -234.45 °C", z)
	}
}

func TestCopperPanics(t *testing.T) {
	for _, c := range []struct {
		name string
		f    func()
	}{
		{"below zero resistance", func() { CopperResistivity(-300) }},
		{"infinite temperature", func() { CopperResistivity(math.Inf(1)) }},
		{"NaN temperature", func() { CopperResistivity(math.NaN()) }},
		{"zero area", func() { CopperResistance(1, 0, 20) }},
		{"negative length", func() { CopperResistance(-1, 1e-6, 20) }},
	} {
		func() {
			defer func() {
				if recover() == nil {
					t.Errorf("%s: no panic", c.name)
				}
			}()
			c.f()
		}()
	}
}
