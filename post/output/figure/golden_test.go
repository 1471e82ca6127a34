package figure

import (
	"bytes"
	"flag"
	"image"
	"image/color"
	"image/png"
	"os"
	"path/filepath"
	"testing"

	gplot "gonum.org/v1/plot"

	"polegap/models"
	"polegap/post/output/library"
	"polegap/post/output/plot"
	"polegap/post/study"
)

var update = flag.Bool("update", false, "rewrite the golden images in testdata")

// goldenDPI keeps the golden images small (about 480 pixels wide): enough
// to see a changed colour scale, a lost label or a moved flux line.
const goldenDPI = 40

// Tolerances of the golden-image comparison (our choice): a solver or
// font change of no consequence moves single pixels at edges, so the
// comparison allows a mean absolute difference of 1.5 (of 255) per
// channel and 1 % of the pixels differing by more than 48 in a channel.
// A different colour scale moves the mean by tens; a missing label or
// outline moves several per cent of the pixels.
const (
	goldenMeanTol = 1.5
	goldenPixTol  = 48
	goldenFracTol = 0.01
)

// TestFieldMapGolden renders the field map of each example (one solve on
// the model's own mesh) and compares it with testdata/field-NAME.png
// within the tolerances above; -update rewrites the files. On failure the
// picture made is written beside the golden as field-NAME.got.png.
func TestFieldMapGolden(t *testing.T) {
	if testing.Short() {
		t.Skip("solves the five examples (about 20 s)")
	}
	for _, name := range models.Examples() {
		m, err := models.LoadExample(name)
		if err != nil {
			t.Fatal(err)
		}
		s, err := study.Run(m, study.Options{})
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		plots, widths, h := fieldLayout(s)
		c, err := plot.RenderRow(plots, widths, h, "png", plot.Options{DPI: goldenDPI})
		if err != nil {
			t.Fatal(err)
		}
		got, err := Bytes(c)
		if err != nil {
			t.Fatal(err)
		}
		compareGolden(t, filepath.Join("testdata", "field-"+name+".png"), got)
	}
}

// TestCurvesGolden does the same for the line figures that need no solve:
// the B-H and μr plots of two library steels.
func TestCurvesGolden(t *testing.T) {
	bh, mu, err := library.Figures("low-carbon-steel", "silicon-steel-no")
	if err != nil {
		t.Fatal(err)
	}
	c, err := plot.RenderGrid([][]*gplot.Plot{{bh, mu}}, CM(28), CM(11), "png", plot.Options{DPI: goldenDPI})
	if err != nil {
		t.Fatal(err)
	}
	got, err := Bytes(c)
	if err != nil {
		t.Fatal(err)
	}
	compareGolden(t, filepath.Join("testdata", "bh.png"), got)
}

func compareGolden(t *testing.T, path string, got []byte) {
	t.Helper()
	if *update {
		if err := os.WriteFile(path, got, 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	wantData, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run go test -update to create it)", err)
	}
	fail := func(format string, args ...any) {
		t.Helper()
		gotPath := path[:len(path)-len(".png")] + ".got.png"
		os.WriteFile(gotPath, got, 0o644)
		t.Errorf("%s: "+format+"; the picture made is in %s", append(append([]any{path}, args...), gotPath)...)
	}
	a, err := png.Decode(bytes.NewReader(got))
	if err != nil {
		t.Fatal(err)
	}
	b, err := png.Decode(bytes.NewReader(wantData))
	if err != nil {
		t.Fatal(err)
	}
	if a.Bounds() != b.Bounds() {
		fail("size %v, golden %v", a.Bounds().Size(), b.Bounds().Size())
		return
	}
	mean, frac := imageDiff(a, b, goldenPixTol)
	if mean > goldenMeanTol || frac > goldenFracTol {
		fail("mean channel difference %.2f (≤ %g), %.2f %% of pixels differ by more than %d (≤ %g %%)",
			mean, goldenMeanTol, 100*frac, goldenPixTol, 100*goldenFracTol)
	}
}

// imageDiff returns the mean absolute difference per 8-bit channel and the
// fraction of pixels with a channel differing by more than tol.
func imageDiff(a, b image.Image, tol int) (mean, frac float64) {
	r := a.Bounds()
	sum, bad := 0, 0
	for y := r.Min.Y; y < r.Max.Y; y++ {
		for x := r.Min.X; x < r.Max.X; x++ {
			p := color.NRGBAModel.Convert(a.At(x, y)).(color.NRGBA)
			q := color.NRGBAModel.Convert(b.At(x, y)).(color.NRGBA)
			worst := 0
			for _, d := range []int{int(p.R) - int(q.R), int(p.G) - int(q.G), int(p.B) - int(q.B)} {
				d = max(d, -d)
				sum += d
				worst = max(worst, d)
			}
			if worst > tol {
				bad++
			}
		}
	}
	n := r.Dx() * r.Dy()
	return float64(sum) / float64(3*n), float64(bad) / float64(n)
}
