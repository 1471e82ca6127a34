package plot

import (
	"math"
	"os"
	"path/filepath"
	"testing"

	gplot "gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
)

// square is the unit square split into two triangles.
var (
	sqX   = []float64{0, 1, 1, 0}
	sqY   = []float64{0, 0, 1, 1}
	sqTri = []int32{0, 1, 2, 0, 2, 3}
)

// TestIsolinesOfLinearPotential: a potential linear in x, v = x, has
// straight vertical isolines x = level; on a linear triangulation they are
// reproduced exactly (to rounding), one segment per triangle crossed.
func TestIsolinesOfLinearPotential(t *testing.T) {
	l := &Isolines{X: sqX, Y: sqY, Tri: sqTri, Value: []float64{0, 1, 1, 0}, Levels: []float64{0.25, 0.5}}
	segs := l.Segments()
	if len(segs) != 4 {
		t.Fatalf("%d segments, want 4 (two levels crossing two triangles)", len(segs))
	}
	for _, s := range segs {
		if math.Abs(s[0]-s[2]) > 1e-15 || (math.Abs(s[0]-0.25) > 1e-15 && math.Abs(s[0]-0.5) > 1e-15) {
			t.Errorf("segment %v is not on x = 0.25 or x = 0.5", s)
		}
	}
}

func TestEvenLevels(t *testing.T) {
	got := EvenLevels([]float64{2, -2, 0}, 4)
	want := []float64{-1.5, -0.5, 0.5, 1.5}
	for i := range want {
		if math.Abs(got[i]-want[i]) > 1e-15 {
			t.Fatalf("EvenLevels = %v, want %v", got, want)
		}
	}
	if EvenLevels([]float64{1, 1}, 3) != nil {
		t.Error("a constant potential has no isolines")
	}
}

func TestOutlineEachEdgeOnce(t *testing.T) {
	// Markers on the diagonal (shared, edge 1 of triangle 0 is (2,0): the
	// edge opposite corner 1) and on the bottom side.
	marker := []int32{0, 1, 2, 0, 0, 0}
	nbr := []int32{-1, 1, -1, -1, -1, 0}
	marker[3+2] = 1 // the diagonal again, seen from triangle 1
	segs := Outline(sqX, sqY, sqTri, marker, nbr, func(int) bool { return true }, 1)
	if len(segs) != 2 {
		t.Fatalf("%d outline segments, want 2 (diagonal once, bottom once): %v", len(segs), segs)
	}
}

func TestFieldMapSaves(t *testing.T) {
	p, bar := FieldMap(FieldMapInput{Title: "test", X: sqX, Y: sqY, Tri: sqTri, Corner: []float64{0.5, 0.5, 0.5, 1, 1, 1},
		Potential: []float64{0, 1, 1, 0}, Levels: EvenLevels([]float64{0, 1}, 5), Top: 0.9})
	dir := t.TempDir()
	for _, name := range []string{"f.png", "f.svg"} {
		path := filepath.Join(dir, name)
		if err := SaveGridWidths([]*gplot.Plot{p, bar}, []float64{10, 2}, 8*vg.Centimeter, path); err != nil {
			t.Fatal(err)
		}
		if st, err := os.Stat(path); err != nil || st.Size() == 0 {
			t.Fatalf("%s not written: %v", name, err)
		}
	}
	if err := Save(p, 10*vg.Centimeter, 10*vg.Centimeter, filepath.Join(dir, "f.bmp")); err == nil {
		t.Error("an unknown extension should be an error")
	}
}
