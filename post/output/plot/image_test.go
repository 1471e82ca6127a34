package plot

import (
	"bytes"
	"image"
	"image/color"
	"image/png"
	"math"
	"math/rand/v2"
	"regexp"
	"strconv"
	"testing"

	gplot "gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
)

// jitteredGrid returns a triangulated n × n grid of the unit square with
// its interior nodes moved at random (fixed seed), so that the triangle
// edges run in every direction across the pixel grid, as a real mesh's do.
func jitteredGrid(n int) (x, y []float64, tri []int32) {
	rng := rand.New(rand.NewPCG(1, 1))
	for j := 0; j <= n; j++ {
		for i := 0; i <= n; i++ {
			px, py := float64(i)/float64(n), float64(j)/float64(n)
			if i > 0 && i < n && j > 0 && j < n {
				px += 0.3 * (rng.Float64() - 0.5) / float64(n)
				py += 0.3 * (rng.Float64() - 0.5) / float64(n)
			}
			x, y = append(x, px), append(y, py)
		}
	}
	id := func(i, j int) int32 { return int32(j*(n+1) + i) }
	for j := 0; j < n; j++ {
		for i := 0; i < n; i++ {
			tri = append(tri, id(i, j), id(i+1, j), id(i+1, j+1), id(i, j), id(i+1, j+1), id(i, j+1))
		}
	}
	return x, y, tri
}

// renderMap draws a field map of corner values over the jittered grid
// (lengths in metres, so the square is 1000 mm) to PNG and returns the
// image and the rectangle of its data area (the pixels inside the axes).
func renderMap(t *testing.T, corner func(x, y float64) float64, top float64) (image.Image, image.Rectangle) {
	x, y, tri := jitteredGrid(24)
	c := make([]float64, len(tri))
	for k, n := range tri {
		c[k] = corner(x[n], y[n])
	}
	p, _ := FieldMap(FieldMapInput{Title: "uniform", X: x, Y: y, Tri: tri, Corner: c, Top: top})
	canvas, err := RenderRow([]*gplot.Plot{p}, []float64{12}, 12*vg.Centimeter, "png")
	if err != nil {
		t.Fatal(err)
	}
	var buf bytes.Buffer
	if _, err := canvas.WriteTo(&buf); err != nil {
		t.Fatal(err)
	}
	img, err := png.Decode(&buf)
	if err != nil {
		t.Fatal(err)
	}
	// The data area: the bounding box of the pixels with the scale's
	// colour at the middle of the test field, shrunk by 3 pixels to stay
	// clear of the axes' lines.
	want := tableColour(corner(0.5, 0.5) / top)
	r := image.Rectangle{Min: image.Pt(math.MaxInt, math.MaxInt)}
	b := img.Bounds()
	for j := b.Min.Y; j < b.Max.Y; j++ {
		for i := b.Min.X; i < b.Max.X; i++ {
			if near(img.At(i, j), want, 3) {
				r.Min.X, r.Min.Y = min(r.Min.X, i), min(r.Min.Y, j)
				r.Max.X, r.Max.Y = max(r.Max.X, i+1), max(r.Max.Y, j+1)
			}
		}
	}
	return img, r.Inset(3)
}

func near(c color.Color, want color.NRGBA, tol int) bool {
	n := color.NRGBAModel.Convert(c).(color.NRGBA)
	d := func(a, b uint8) int { return max(int(a)-int(b), int(b)-int(a)) }
	return d(n.R, want.R) <= tol && d(n.G, want.G) <= tol && d(n.B, want.B) <= tol
}

// TestFieldMapNoSeams: a uniform field over a mesh of 1152 jittered
// triangles renders as one colour: no pixel of the data area differs from
// it, so no row or column of pixels can stand out as a seam. The earlier
// map filled each triangle as an anti-aliased polygon and left a faint
// line along every edge.
func TestFieldMapNoSeams(t *testing.T) {
	img, r := renderMap(t, func(x, y float64) float64 { return 0.8 }, 1.6)
	if r.Dx() < 300 || r.Dy() < 300 {
		t.Fatalf("data area %v too small: the map was not found", r)
	}
	want := tableColour(0.5)
	bad := 0
	for j := r.Min.Y; j < r.Max.Y; j++ {
		for i := r.Min.X; i < r.Max.X; i++ {
			if !near(img.At(i, j), want, 0) {
				bad++
			}
		}
	}
	if bad > 0 {
		t.Errorf("%d of %d pixels differ from the field's colour %v", bad, r.Dx()*r.Dy(), want)
	}
}

// TestFieldMapSmooth: a field rising linearly in x (0.2 to 1.4 T on a 1.6 T
// scale) has no jump between neighbouring pixels larger than the scale's
// own change over one pixel plus one table step and 8-bit rounding: in
// every pixel row, every step between neighbours is within that bound,
// and along every column the colour does not change at all.
func TestFieldMapSmooth(t *testing.T) {
	img, r := renderMap(t, func(x, y float64) float64 { return 0.2 + 1.2*x }, 1.6)
	// Over the data area's width the value runs 1.2/1.6 of the scale; one
	// pixel is that over r.Dx(); one table step is 1/1023 of the scale.
	dv := 0.75/float64(r.Dx()) + 1.0/1023
	maxStep := 0.0
	for _, k := range []float64{0.25, 0.5, 0.75} {
		a, b := scaleColour(k, 1), scaleColour(k+dv, 1)
		maxStep = math.Max(maxStep, float64(max(absd(a.R, b.R), absd(a.G, b.G), absd(a.B, b.B))))
	}
	limit := int(maxStep) + 1 // + 1: 8-bit rounding
	for j := r.Min.Y; j < r.Max.Y; j++ {
		for i := r.Min.X + 1; i < r.Max.X; i++ {
			a := color.NRGBAModel.Convert(img.At(i-1, j)).(color.NRGBA)
			if !near(img.At(i, j), a, limit) {
				t.Fatalf("pixel (%d, %d) jumps from %v to %v, more than %d per channel", i, j, a, img.At(i, j), limit)
			}
			if j > r.Min.Y && !near(img.At(i, j), color.NRGBAModel.Convert(img.At(i, j-1)).(color.NRGBA), 0) {
				t.Fatalf("pixel (%d, %d) differs from the one above it in a field constant in y", i, j)
			}
		}
	}
}

func absd(a, b uint8) int { return max(int(a)-int(b), int(b)-int(a)) }

// TestScaleBarWidthSVG: the colour bar takes the same share of the figure's
// width in SVG as in PNG (within 2 %, a pixel of the PNG's bar): in SVG it
// is drawn as rectangles, not as a one-pixel image that browsers keep at
// its own aspect ratio, a hairline.
func TestScaleBarWidthSVG(t *testing.T) {
	p, bar := FieldMap(FieldMapInput{Title: "bar", X: sqX, Y: sqY, Tri: sqTri, Corner: []float64{0, 0, 0, 1, 1, 1}, Top: 1})
	widths := []float64{12, 3}
	render := func(format string) []byte {
		c, err := RenderRow([]*gplot.Plot{p, bar}, widths, 10*vg.Centimeter, format)
		if err != nil {
			t.Fatal(err)
		}
		var buf bytes.Buffer
		if _, err := c.WriteTo(&buf); err != nil {
			t.Fatal(err)
		}
		return buf.Bytes()
	}
	// SVG: the widest run of the bar's rectangles (filled paths of four
	// corners in the right-hand panel).
	svg := render("svg")
	total := 15 * vg.Centimeter.Points()
	re := regexp.MustCompile(`<path d="M([0-9.]+),[0-9.]+L([0-9.]+),[0-9.]+L[0-9.]+,[0-9.]+L[0-9.]+,[0-9.]+Z" style="fill:#`)
	svgBar := 0.0
	for _, m := range re.FindAllSubmatch(svg, -1) {
		x0, _ := strconv.ParseFloat(string(m[1]), 64)
		x1, _ := strconv.ParseFloat(string(m[2]), 64)
		if x0 > 12*vg.Centimeter.Points() && x1-x0 < 3*vg.Centimeter.Points()-1 { // in the bar's panel, not its background
			svgBar = math.Max(svgBar, x1-x0)
		}
	}
	if svgBar == 0 {
		t.Fatalf("no colour bar rectangles found in the SVG")
	}
	// PNG: the longest run of one colour, not grey, along the row in the
	// middle of the bar, in the right-hand panel.
	img, err := png.Decode(bytes.NewReader(render("png")))
	if err != nil {
		t.Fatal(err)
	}
	b := img.Bounds()
	pngBar := 0
	x12 := int(float64(b.Dx()) * 12 / 15)
	for j := b.Min.Y + b.Dy()/3; j < b.Max.Y-b.Dy()/3; j += 7 {
		run, prev := 0, color.NRGBA{}
		for i := x12; i < b.Max.X; i++ {
			c := color.NRGBAModel.Convert(img.At(i, j)).(color.NRGBA)
			if c == prev && !(c.R == c.G && c.G == c.B) {
				run++
				pngBar = max(pngBar, run+1)
			} else {
				run = 0
			}
			prev = c
		}
	}
	svgShare, pngShare := svgBar/total, float64(pngBar)/float64(b.Dx())
	if math.Abs(svgShare-pngShare) > 0.02*pngShare+1/float64(b.Dx()) {
		t.Errorf("colour bar: %.4f of the width in SVG, %.4f in PNG", svgShare, pngShare)
	}
	if pngShare < 0.05 {
		t.Errorf("colour bar only %.4f of the PNG's width", pngShare)
	}
	t.Logf("colour bar share of the width: SVG %.4f, PNG %.4f (%d px)", svgShare, pngShare, pngBar)
}
