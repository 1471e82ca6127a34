package plot

import (
	"fmt"
	"math"
	"strings"
	"testing"
)

// TestNiceTicks: major ticks sit at 1, 2 or 5 × 10ⁿ steps, 4 to 10 of them
// for N = 6 over spans of every size, all labelled with the same number of
// decimals, and the labels read back to their values.
func TestNiceTicks(t *testing.T) {
	for _, c := range []struct{ lo, hi float64 }{
		{0, 1}, {0, 1.4}, {-340, 340}, {0.25, 0.93}, {0, 64}, {-0.02, 0.031}, {1500, 9800}, {0, 2.5e-4},
	} {
		var majors []float64
		dec := -1
		for _, tk := range (NiceTicks{N: 6}).Ticks(c.lo, c.hi) {
			if tk.Label == "" {
				continue
			}
			majors = append(majors, tk.Value)
			d := 0
			if i := strings.IndexByte(tk.Label, '.'); i >= 0 {
				d = len(tk.Label) - i - 1
			}
			if dec >= 0 && d != dec {
				t.Errorf("[%g, %g]: label %q has %d decimals, others %d", c.lo, c.hi, tk.Label, d, dec)
			}
			dec = d
			var v float64
			fmt.Sscan(tk.Label, &v)
			if math.Abs(v-tk.Value) > 1e-9*math.Max(1, math.Abs(tk.Value)) {
				t.Errorf("[%g, %g]: label %q for %g", c.lo, c.hi, tk.Label, tk.Value)
			}
		}
		if len(majors) < 4 || len(majors) > 10 {
			t.Errorf("[%g, %g]: %d major ticks %v, want 4 to 10", c.lo, c.hi, len(majors), majors)
			continue
		}
		step := majors[1] - majors[0]
		m := step / math.Pow(10, math.Floor(math.Log10(step)+1e-9))
		if math.Abs(m-1) > 1e-6 && math.Abs(m-2) > 1e-6 && math.Abs(m-5) > 1e-6 {
			t.Errorf("[%g, %g]: step %g is not 1, 2 or 5 × 10ⁿ", c.lo, c.hi, step)
		}
	}
}

// TestStepLevels: flux levels at multiples of a round step, strictly inside
// the potential's range.
func TestStepLevels(t *testing.T) {
	lv, step := StepLevels([]float64{-0.031, 0.012, 0.3}, 30)
	if step != 0.01 {
		t.Errorf("step %g, want 0.01 for a span of 0.331 in about 30 lines", step)
	}
	if lv[0] != -0.03 || math.Abs(lv[len(lv)-1]-0.29) > 1e-12 || len(lv) != 33 {
		t.Errorf("levels %v", lv)
	}
}

// TestPercentileAndCornerAverage: the area-weighted percentile skips what
// is not finite, and corner averages keep a jump between regions.
func TestPercentileAndCornerAverage(t *testing.T) {
	if p := Percentile([]float64{1, 2, math.NaN(), 3, 100}, []float64{1, 1, 1, 1, 0.01}, 0.99); p != 3 {
		t.Errorf("99th percentile %g, want 3 (the 100 has 0.3 %% of the weight)", p)
	}
	// Two triangles of the unit square in regions 1 and 2 with |B| 1 and
	// 2: the shared corners take each side's own value.
	c := CornerAverage(sqX, sqY, sqTri, []int32{1, 2}, []float64{1, 2}, nil)
	for k, v := range c {
		if want := float64(1 + k/3); v != want {
			t.Errorf("corner %d: %g, want %g", k, v, want)
		}
	}
	c = CornerAverage(sqX, sqY, sqTri, []int32{1, 1}, []float64{1, 2}, nil)
	if c[0] != 1.5 || c[2] != 1.5 || c[1] != 1 {
		t.Errorf("one region: corners %v, want the shared ones averaged (1.5)", c)
	}
}

func TestToCP1252(t *testing.T) {
	if got := toCP1252("5 A × 200 turns, ΔA, μr, 2π·r, ⊙"); got != "5 A \xd7 200 turns, DA, \xb5r, 2pi\xb7r, (.)" {
		t.Errorf("toCP1252 = %q", got)
	}
}
