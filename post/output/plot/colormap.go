package plot

import (
	"fmt"
	"image/color"
	"math"

	"gonum.org/v1/plot/palette"
)

// The field scale is a helix in CIE L*C*h (CIE 15:2004, D65 white): the
// lightness L* rises linearly from scaleL0 to scaleL1, the hue angle turns
// linearly from scaleH0 (blue-violet) through blue, cyan and green to
// scaleH1 (yellow), and the chroma C* is held at scaleC. With L*, C* and h
// all linear or constant, the CIE 1976 colour difference ΔE*ab between
// neighbouring values is the same everywhere on the scale: equal steps in
// the field are equal steps in colour, and no band can look like an edge.
//
// The chroma is the largest that keeps every colour of the path inside
// the sRGB gamut (IEC 61966-2-1) with a margin: the narrowest point is near
// L* = 45 in the blue-cyan, where sRGB holds C* ≈ 28.8 at this hue. So no
// colour is ever clipped, which is what put a false saturated band across
// the yoke in the earlier scale (chroma 38-60 in the greens, clipped).
//
// Measured against gonum's moreland.Kindlmann (a lightness-linear rainbow;
// Kindlmann, Reinhard and Creem, IEEE Visualization 2002) over the same
// lightness range, this scale's ΔE*ab steps (16 steps, 8-bit colours)
// spread by 0.14 of their mean where Kindlmann's spread by 2.5
// (TestFieldScaleUniform): its chroma dips to 26 near L* = 40 and jumps to
// 84 by L* = 60, which reads as an edge.
const (
	scaleL0 = 22.0  // L* at the bottom of the scale
	scaleL1 = 94.0  // L* at the top
	scaleH0 = 300.0 // hue angle (degrees) at the bottom
	scaleH1 = 95.0  // hue angle at the top
	scaleC  = 27.0  // chroma C*ab, constant
)

// OverColour marks values above the top of a field scale: a saturated
// magenta-red, a hue the scale never reaches and a chroma nearly three
// times the scale's, so it cannot be read as a value on it.
var OverColour = color.NRGBA{R: 222, G: 30, B: 120, A: 255}

// FieldScale is polegap's colour scale for field magnitudes over [min,
// max]: a sequential scale of constant chroma whose CIE L* lightness rises
// linearly from 22 (deep blue-violet, no field) to 94 (pale straw, the top
// of the range) while the hue turns through blue, cyan and green to yellow.
// Equal steps in the value give equal steps in lightness and in colour
// difference (CIE 1976 ΔE*ab), so the picture reads the same in grey and
// to colour-blind eyes. No colour of the scale lies outside sRGB, so none
// is clipped. Values above max take OverColour where the caller asks for
// it (the field raster); At itself holds them at the top colour, as
// gonum's colour bars expect.
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

// scaleTable holds the scale at 1024 evenly spaced points, so that the
// raster's hot loop does no colour arithmetic.
var scaleTable = func() (tab [1024]color.NRGBA) {
	for i := range tab {
		tab[i] = scaleColour(float64(i)/float64(len(tab)-1), 1)
	}
	return tab
}()

// tableColour returns the scale's colour at t in [0, 1] from scaleTable.
func tableColour(t float64) color.NRGBA {
	i := int(math.Round(t * float64(len(scaleTable)-1)))
	return scaleTable[max(0, min(len(scaleTable)-1, i))]
}

// scaleLab returns the scale's CIE L*a*b* coordinates at t in [0, 1].
func scaleLab(t float64) (l, a, b float64) {
	l = scaleL0 + (scaleL1-scaleL0)*t
	h := (scaleH0 + (scaleH1-scaleH0)*t) * math.Pi / 180
	return l, scaleC * math.Cos(h), scaleC * math.Sin(h)
}

// scaleColour returns the scale's colour at t in [0, 1].
func scaleColour(t, alpha float64) color.NRGBA {
	r, g, b := labToLinear(scaleLab(t))
	return color.NRGBA{R: encodeSRGB(r), G: encodeSRGB(g), B: encodeSRGB(b), A: uint8(math.Round(255 * alpha))}
}

// labToLinear converts CIE L*a*b* (D65) to linear sRGB components, not
// clipped (CIE 15:2004 §8.2.1 inverted; IEC 61966-2-1 matrix).
func labToLinear(l, a, b float64) (float64, float64, float64) {
	fy := (l + 16) / 116
	fx := fy + a/500
	fz := fy - b/200
	finv := func(f float64) float64 {
		if f > 6.0/29 {
			return f * f * f
		}
		return 3 * (6.0 / 29) * (6.0 / 29) * (f - 4.0/29)
	}
	x, y, z := 0.95047*finv(fx), finv(fy), 1.08883*finv(fz)
	return 3.2404542*x - 1.5371385*y - 0.4985314*z,
		-0.9692660*x + 1.8760108*y + 0.0415560*z,
		0.0556434*x - 0.2040259*y + 1.0572252*z
}

// encodeSRGB applies the sRGB transfer function (IEC 61966-2-1) to a linear
// component in [0, 1] and rounds it to 8 bits.
func encodeSRGB(c float64) uint8 {
	c = math.Max(0, math.Min(1, c)) // the scale never needs this (TestFieldScaleInGamut)
	if c <= 0.0031308 {
		c *= 12.92
	} else {
		c = 1.055*math.Pow(c, 1/2.4) - 0.055
	}
	return uint8(math.Round(255 * c))
}
