package plot

import (
	"image"
	"strings"

	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/vgpdf"
)

// pdfCanvas mends two habits of gonum's PDF canvas (plot v0.17) so that a
// PDF looks like the PNG and SVG of the same figure: it writes text in
// code page 1252 (Windows Western) but is handed UTF-8, so "×" came out as
// "Ã—"; and it draws images upside down, which turned the field raster
// over. Text is converted with toCP1252; images are flipped before they
// are drawn.
type pdfCanvas struct{ *vgpdf.Canvas }

// FillString implements vg.Canvas.
func (c pdfCanvas) FillString(f font.Face, pt vg.Point, s string) {
	c.Canvas.FillString(f, pt, toCP1252(s))
}

// DrawImage implements vg.Canvas.
func (c pdfCanvas) DrawImage(rect vg.Rectangle, img image.Image) {
	b := img.Bounds()
	out := image.NewNRGBA(image.Rect(0, 0, b.Dx(), b.Dy()))
	for y := 0; y < b.Dy(); y++ {
		for x := 0; x < b.Dx(); x++ {
			out.Set(x, b.Dy()-1-y, img.At(b.Min.X+x, b.Min.Y+y))
		}
	}
	c.Canvas.DrawImage(rect, out)
}

// cp1252Extra are the characters of code page 1252 outside Latin-1 that
// figures use, and spellings for the Greek letters and symbols it lacks.
var cp1252Extra = map[rune]string{
	'–': "\x96", '—': "\x97", '•': "\x95", '…': "\x85", '‰': "\x89", '€': "\x80",
	'μ': "\xb5", // the micro sign, the same glyph
	'−': "-", 'Δ': "D", 'π': "pi", 'φ': "phi", 'σ': "s", 'Ω': "Ohm", '∞': "inf",
	'⊙': "(.)", '⊗': "(x)", 'ⁿ': "^n", '≤': "<=", '≥': ">=", '≈': "~",
}

// toCP1252 returns s in code page 1252: ASCII and Latin-1 as they are, a
// few other characters by cp1252Extra, anything else as "?".
func toCP1252(s string) string {
	var b strings.Builder
	for _, r := range s {
		switch {
		case r < 0x80:
			b.WriteRune(r)
		case r >= 0xA0 && r <= 0xFF:
			b.WriteByte(byte(r))
		default:
			if t, ok := cp1252Extra[r]; ok {
				b.WriteString(t)
			} else {
				b.WriteByte('?')
			}
		}
	}
	return b.String()
}
