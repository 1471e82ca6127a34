package plot

import (
	"fmt"
	"image/color"
	"math"

	"gonum.org/v1/plot/palette"
)

// FieldScale is polegap's colour scale for field magnitudes: a sequential
// scale whose CIE L* lightness rises linearly from 18 (deep indigo, no
// field) to 94 (pale straw, the strongest field) while the hue turns
// through blue, teal and green to yellow at moderate chroma. Equal steps
// in the value give equal steps in lightness, so the picture reads the
// same in grey and to colour-blind eyes, and no false edges appear where
// a rainbow scale would put them. Colours are computed from CIE L*C*h
// (D65 white) to sRGB (IEC 61966-2-1), out-of-gamut values clipped.
type FieldScale struct {
	min, max float64
	alpha    float64
}

// NewFieldScale returns the scale over [min, max].
func NewFieldScale(min, max float64) *FieldScale {
	return &FieldScale{min: min, max: max, alpha: 1}
}

// At implements palette.ColorMap.
func (s *FieldScale) At(v float64) (color.Color, error) {
	if !(s.max > s.min) {
		return nil, fmt.Errorf("plot: empty colour scale range [%g, %g]", s.min, s.max)
	}
	if math.IsNaN(v) {
		return nil, fmt.Errorf("plot: NaN has no colour")
	}
	t := math.Max(0, math.Min(1, (v-s.min)/(s.max-s.min)))
	return scaleColour(t, s.alpha), nil
}

func (s *FieldScale) Max() float64                  { return s.max }
func (s *FieldScale) Min() float64                  { return s.min }
func (s *FieldScale) SetMax(v float64)              { s.max = v }
func (s *FieldScale) SetMin(v float64)              { s.min = v }
func (s *FieldScale) Alpha() float64                { return s.alpha }
func (s *FieldScale) SetAlpha(a float64)            { s.alpha = a }
func (s *FieldScale) Palette(n int) palette.Palette { return scalePalette(n) }

type scalePalette int

func (p scalePalette) Colors() []color.Color {
	out := make([]color.Color, int(p))
	for i := range out {
		out[i] = scaleColour(float64(i)/math.Max(1, float64(int(p)-1)), 1)
	}
	return out
}

// scaleColour returns the scale's colour at t in [0, 1].
func scaleColour(t, alpha float64) color.Color {
	l := 18 + 76*t
	h := (290 - 200*t) * math.Pi / 180 // 290° (indigo) to 90° (yellow)
	c := 38 + 22*math.Sin(math.Pi*t)   // livelier in the middle
	a, b := c*math.Cos(h), c*math.Sin(h)
	r, g, bl := labToSRGB(l, a, b)
	return color.NRGBA{R: r, G: g, B: bl, A: uint8(math.Round(255 * alpha))}
}

// labToSRGB converts CIE L*a*b* (D65) to 8-bit sRGB.
func labToSRGB(l, a, b float64) (uint8, uint8, uint8) {
	fy := (l + 16) / 116
	fx := fy + a/500
	fz := fy - b/200
	finv := func(f float64) float64 {
		if f3 := f * f * f; f3 > 216.0/24389 {
			return f3
		}
		return (116*f - 16) / (24389.0 / 27)
	}
	// D65 reference white.
	x, y, z := 0.95047*finv(fx), finv(fy), 1.08883*finv(fz)
	rl := 3.2404542*x - 1.5371385*y - 0.4985314*z
	gl := -0.9692660*x + 1.8760108*y + 0.0415560*z
	bl := 0.0556434*x - 0.2040259*y + 1.0572252*z
	enc := func(c float64) uint8 {
		c = math.Max(0, math.Min(1, c))
		if c <= 0.0031308 {
			c *= 12.92
		} else {
			c = 1.055*math.Pow(c, 1/2.4) - 0.055
		}
		return uint8(math.Round(255 * c))
	}
	return enc(rl), enc(gl), enc(bl)
}
