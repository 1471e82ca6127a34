package plot

import (
	"image/color"
	"math"
	"testing"

	"gonum.org/v1/plot/palette/moreland"
)

// labOf returns the CIE L*a*b* (D65) coordinates of an 8-bit sRGB colour:
// the sRGB decoding and matrix of IEC 61966-2-1, then L*, a*, b* per
// CIE 15:2004 (Colorimetry, 3rd ed.), §8.2.1.
func labOf(c color.Color) (l, a, b float64) {
	r, g, bl, _ := c.RGBA()
	lin := func(v uint32) float64 {
		x := float64(v) / 65535
		if x <= 0.04045 {
			return x / 12.92
		}
		return math.Pow((x+0.055)/1.055, 2.4)
	}
	R, G, B := lin(r), lin(g), lin(bl)
	x := (0.4124564*R + 0.3575761*G + 0.1804375*B) / 0.95047
	y := 0.2126729*R + 0.7151522*G + 0.0721750*B
	z := (0.0193339*R + 0.1191920*G + 0.9503041*B) / 1.08883
	f := func(t float64) float64 {
		if t > 216.0/24389 {
			return math.Cbrt(t)
		}
		return (24389.0/27*t + 16) / 116
	}
	return 116*f(y) - 16, 500 * (f(x) - f(y)), 200 * (f(y) - f(z))
}

// TestFieldScaleLightness: over 64 equal steps of the value, the scale's
// CIE L* (from its 8-bit sRGB colours, CIE 15:2004) rises at every step,
// each step within ±40 % of the mean step, and runs from 22 to 94. The
// band is 8-bit rounding: one code value moves L* by up to about 0.4
// near these colours, against a mean step of 72/64 = 1.125.
func TestFieldScaleLightness(t *testing.T) {
	s := NewFieldScale(0, 1)
	const n = 64
	var ls [n + 1]float64
	for i := range ls {
		c, err := s.At(float64(i) / n)
		if err != nil {
			t.Fatal(err)
		}
		ls[i], _, _ = labOf(c)
	}
	mean := (ls[n] - ls[0]) / n
	for i := 1; i <= n; i++ {
		d := ls[i] - ls[i-1]
		if d <= 0 {
			t.Fatalf("L* falls at %d/%d: %.3f after %.3f", i, n, ls[i], ls[i-1])
		}
		if math.Abs(d-mean) > 0.4*mean {
			t.Errorf("L* step %d/%d is %.3f, outside %.3f ± 40 %%", i, n, d, mean)
		}
	}
	// 0.5: 8-bit rounding at the ends.
	if math.Abs(ls[0]-scaleL0) > 0.5 || math.Abs(ls[n]-scaleL1) > 0.5 {
		t.Errorf("L* runs %.2f to %.2f, want %g to %g", ls[0], ls[n], scaleL0, scaleL1)
	}
	if _, err := s.At(math.NaN()); err == nil {
		t.Error("NaN should have no colour")
	}
}

// TestFieldScaleInGamut: no colour of the scale is clipped. The linear sRGB
// components (IEC 61966-2-1) of 2001 points along the path lie inside
// [0.002, 0.998], and no 8-bit channel sits at 0 or 255.
func TestFieldScaleInGamut(t *testing.T) {
	for i := 0; i <= 2000; i++ {
		tt := float64(i) / 2000
		r, g, b := labToLinear(scaleLab(tt))
		for k, v := range []float64{r, g, b} {
			if v < 0.002 || v > 0.998 {
				t.Fatalf("t = %.4f: linear channel %d = %.4f, at or beyond the sRGB gamut", tt, k, v)
			}
		}
		c := scaleColour(tt, 1)
		for _, v := range []uint8{c.R, c.G, c.B} {
			if v == 0 || v == 255 {
				t.Fatalf("t = %.4f: %v has a channel at the limit", tt, c)
			}
		}
	}
}

// TestFieldScaleUniform: the CIE 1976 colour difference ΔE*ab
// (CIE 15:2004 §8.3.1) between neighbours of 16 equal value steps is the
// same within ±15 % (8-bit rounding moves a 7.5-unit step by up to about
// 1) and its spread is smaller than that of gonum's moreland.Kindlmann
// over the same lightness range, the perceptual map the issue names.
func TestFieldScaleUniform(t *testing.T) {
	spread := func(at func(float64) color.Color, lo, hi float64) (float64, float64) {
		const n = 16
		var steps []float64
		l0, a0, b0 := labOf(at(lo))
		for i := 1; i <= n; i++ {
			l1, a1, b1 := labOf(at(lo + (hi-lo)*float64(i)/n))
			steps = append(steps, math.Sqrt((l1-l0)*(l1-l0)+(a1-a0)*(a1-a0)+(b1-b0)*(b1-b0)))
			l0, a0, b0 = l1, a1, b1
		}
		mn, mx, sum := math.Inf(1), 0.0, 0.0
		for _, d := range steps {
			mn, mx, sum = math.Min(mn, d), math.Max(mx, d), sum+d
		}
		mean := sum / n
		return (mx - mn) / mean, math.Max(mx/mean-1, 1-mn/mean)
	}
	ours := NewFieldScale(0, 1)
	oursSpread, oursDev := spread(func(v float64) color.Color { c, _ := ours.At(v); return c }, 0, 1)
	if oursDev > 0.15 {
		t.Errorf("ΔE*ab steps deviate by %.0f %% from their mean, want ≤ 15 %%", 100*oursDev)
	}
	k := moreland.Kindlmann()
	k.SetMin(0)
	k.SetMax(100) // Kindlmann's value is its L*
	kSpread, _ := spread(func(v float64) color.Color { c, _ := k.At(v); return c }, scaleL0, scaleL1)
	if !(oursSpread < kSpread) {
		t.Errorf("ΔE*ab spread (max-min)/mean: ours %.3f, Kindlmann %.3f; ours should be smaller", oursSpread, kSpread)
	}
	t.Logf("ΔE*ab step spread (max-min)/mean over L* %g-%g: ours %.3f, moreland.Kindlmann %.3f", scaleL0, scaleL1, oursSpread, kSpread)
}

// TestHaloContrast: region outlines stand out on every colour of the
// scale. The contrast ratio (L1 + 0.05)/(L2 + 0.05) of relative luminances
// (W3C, Web Content Accessibility Guidelines 2.1, 2018, definitions of
// "contrast ratio" and "relative luminance") between the background and
// the better of the halo's two strokes is at least 3, the level WCAG asks
// of graphics (SC 1.4.11); measured: 4.39, at mid-lightness.
func TestHaloContrast(t *testing.T) {
	lum := func(c color.Color) float64 {
		r, g, b, _ := c.RGBA()
		lin := func(v uint32) float64 {
			x := float64(v) / 65535
			if x <= 0.04045 {
				return x / 12.92
			}
			return math.Pow((x+0.055)/1.055, 2.4)
		}
		return 0.2126*lin(r) + 0.7152*lin(g) + 0.0722*lin(b)
	}
	ratio := func(a, b float64) float64 { return (math.Max(a, b) + 0.05) / (math.Min(a, b) + 0.05) }
	dark, light := lum(haloDark), lum(haloLight)
	worst := math.Inf(1)
	bgs := []color.Color{OverColour}
	for i := 0; i <= 100; i++ {
		bgs = append(bgs, scaleColour(float64(i)/100, 1))
	}
	for _, bg := range bgs {
		l := lum(bg)
		worst = math.Min(worst, math.Max(ratio(l, dark), ratio(l, light)))
	}
	if worst < 3 {
		t.Errorf("worst contrast of the outline halo against the scale: %.2f, want ≥ 3", worst)
	}
	t.Logf("worst contrast of the outline halo against the scale: %.2f", worst)
}
