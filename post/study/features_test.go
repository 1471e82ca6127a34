package study_test

import (
	"fmt"
	"math"
	"slices"
	"strings"
	"testing"

	"polegap/models"
	"polegap/post/study"
)

// featureModel parses a planar model in mm with iron "steel" (a curve
// from the library), the given regions (YAML list items) and extra
// top-level text; it has no mesh section.
func featureModel(t *testing.T, name, regions, extra string) *models.Model {
	t.Helper()
	src := fmt.Sprintf(`name: %s
units: mm
depth: 100
materials:
  steel: {curve: low-carbon-steel}
regions:
%s
%s`, name, regions, extra)
	m, err := models.Parse(name+".yaml", []byte(src))
	if err != nil {
		t.Fatalf("%s: %v", name, err)
	}
	if !m.Mesh.Auto {
		t.Fatalf("%s: the model states no size but Mesh.Auto is false", name)
	}
	return m
}

// Two iron blocks 50 mm wide, faces 10 mm apart across y = 0.
const twoBlocks = `  - {name: lower, material: steel, polygon: [[0, -45], [50, -45], [50, -5], [0, -5]]}
  - {name: upper, material: steel, polygon: [[0, 5], [50, 5], [50, 45], [0, 45]]}`

func TestFindFeaturesGaps(t *testing.T) {
	type gap struct{ width, length float64 } // mm
	cases := []struct {
		name    string
		regions string
		extra   string
		want    []gap
	}{
		{"two blocks", twoBlocks, "", []gap{{10, 50}}},
		// A coil between the faces is not iron: the gap is still there.
		{"coil in the gap", twoBlocks + "\n  - {name: c, material: copper, polygon: [[10, -2], [40, -2], [40, 2], [10, 2]]}", "", []gap{{10, 50}}},
		// An air region filling the gap (as templates draw it) too.
		{"air region in the gap", twoBlocks + "\n  - {name: g, material: air, polygon: [[0, -5], [50, -5], [50, 5], [0, 5]]}", "", []gap{{10, 50}}},
		// An iron spacer splits it into two gaps of 4 mm.
		{"iron spacer", twoBlocks + "\n  - {name: s, material: steel, polygon: [[-10, -1], [60, -1], [60, 1], [-10, 1]]}", "", []gap{{4, 50}, {4, 50}}},
		// Shifted by 30 mm: the faces overlap over 20 mm.
		{"offset", `  - {name: lower, material: steel, polygon: [[0, -45], [50, -45], [50, -5], [0, -5]]}
  - {name: upper, material: steel, polygon: [[30, 5], [80, 5], [80, 45], [30, 45]]}`, "", []gap{{10, 20}}},
		// 60 mm apart with 50 mm faces: not a gap.
		{"far apart", `  - {name: lower, material: steel, polygon: [[0, -45], [50, -45], [50, -30], [0, -30]]}
  - {name: upper, material: steel, polygon: [[0, 30], [50, 30], [50, 45], [0, 45]]}`, "", nil},
		// Half of "two blocks" on a symmetry plane y = 0 (the coil sets
		// the extent): the face 5 mm above it faces its mirror image.
		{"mirror", `  - {name: upper, material: steel, polygon: [[0, 5], [50, 5], [50, 45], [0, 45]]}
  - {name: c, material: copper, polygon: [[60, 0], [80, 0], [80, 40], [60, 40]]}`,
			"boundary: {sides: {bottom: flux-normal}}\n", []gap{{10, 50}}},
	}
	for _, c := range cases {
		m := featureModel(t, strings.ReplaceAll(c.name, " ", "-"), c.regions, c.extra)
		var got []gap
		for _, g := range study.FindFeatures(m).Gaps {
			got = append(got, gap{g.Width * 1e3, g.Length * 1e3})
			// The faces are Width apart at both ends.
			for e := 0; e < 2; e++ {
				a, b := g.Faces[0][e], g.Faces[1][e]
				if d := math.Hypot(a[0]-b[0], a[1]-b[1]); math.Abs(d-g.Width) > 1e-12 {
					t.Errorf("%s: faces %v are %g m apart at end %d, width %g m", c.name, g.Faces, d, e, g.Width)
				}
			}
		}
		// Widths from differences of coordinates in metres: 1e-9 mm covers
		// their rounding.
		if len(got) != len(c.want) {
			t.Errorf("%s: gaps %v, want %v", c.name, got, c.want)
			continue
		}
		for i := range got {
			if math.Abs(got[i].width-c.want[i].width) > 1e-9 || math.Abs(got[i].length-c.want[i].length) > 1e-9 {
				t.Errorf("%s: gaps %v, want %v", c.name, got, c.want)
			}
		}
	}
}

func TestFindFeaturesCorners(t *testing.T) {
	type corner struct {
		x, y  float64 // mm
		kind  study.CornerKind
		angle float64 // degrees
	}
	cv, re := study.Convex, study.Reentrant
	cases := []struct {
		name, regions, extra string
		want                 []corner
	}{
		{"L", `  - {name: l, material: steel, polygon: [[0, 0], [60, 0], [60, 20], [20, 20], [20, 60], [0, 60]]}`, "",
			[]corner{{0, 0, cv, 90}, {60, 0, cv, 90}, {60, 20, cv, 90}, {20, 20, re, 270}, {20, 60, cv, 90}, {0, 60, cv, 90}}},
		// A pole on an arm: the pole's root corners lie on the arm's edge
		// and are re-entrant for the iron as a whole.
		{"pole on arm", `  - {name: arm, material: steel, polygon: [[0, 0], [100, 0], [100, 20], [0, 20]]}
  - {name: pole, material: steel, polygon: [[40, 20], [60, 20], [60, 50], [40, 50]]}`, "",
			[]corner{{0, 0, cv, 90}, {100, 0, cv, 90}, {100, 20, cv, 90}, {0, 20, cv, 90}, {40, 20, re, 270}, {60, 20, re, 270}, {60, 50, cv, 90}, {40, 50, cv, 90}}},
		// Two blocks side by side make one straight edge: no corner where
		// they meet.
		{"side by side", `  - {name: a, material: steel, polygon: [[0, 0], [10, 0], [10, 10], [0, 10]]}
  - {name: b, material: steel, polygon: [[10, 0], [20, 0], [20, 10], [10, 10]]}`, "",
			[]corner{{0, 0, cv, 90}, {0, 10, cv, 90}, {20, 0, cv, 90}, {20, 10, cv, 90}}},
		// A 45-degree chamfer: two corners of 135 degrees.
		{"chamfer", `  - {name: c, material: steel, polygon: [[0, 0], [40, 0], [40, 35], [35, 40], [0, 40]]}`, "",
			[]corner{{0, 0, cv, 90}, {40, 0, cv, 90}, {40, 35, cv, 135}, {35, 40, cv, 135}, {0, 40, cv, 90}}},
		// A rounded corner (an arc tangent to both edges) is no corner.
		{"rounded", `  - {name: r, material: steel, polygon: [[0, 0], [40, 0], {at: [40, 30], arc: 90}, [30, 40], [0, 40]]}`, "",
			[]corner{{0, 0, cv, 90}, {40, 0, cv, 90}, {0, 40, cv, 90}}},
		// A coil is not iron: its corners do not count, and the iron next
		// to it keeps its own.
		{"coil beside", `  - {name: a, material: steel, polygon: [[0, 0], [10, 0], [10, 10], [0, 10]]}
  - {name: c, material: copper, polygon: [[10, 0], [20, 0], [20, 10], [10, 10]]}`, "",
			[]corner{{0, 0, cv, 90}, {10, 0, cv, 90}, {10, 10, cv, 90}, {0, 10, cv, 90}}},
		// On a symmetry plane the iron continues in the mirror image:
		// the corners at y = 0 are straight there.
		{"on a symmetry plane", `  - {name: a, material: steel, polygon: [[0, 0], [10, 0], [10, 10], [0, 10]]}`,
			"boundary: {sides: {bottom: flux-normal}}\n",
			[]corner{{10, 10, cv, 90}, {0, 10, cv, 90}}},
	}
	for _, c := range cases {
		m := featureModel(t, strings.ReplaceAll(c.name, " ", "-"), c.regions, c.extra)
		var got []corner
		for _, k := range study.FindFeatures(m).Corners {
			got = append(got, corner{k.X * 1e3, k.Y * 1e3, k.Kind, k.Angle * 180 / math.Pi})
			// B ~ r^(π/max(α, 2π-α) - 1): Kellogg-type wedge exponent in the
			// high-permeability limit (see Corner).
			if want := math.Pi/math.Max(k.Angle, 2*math.Pi-k.Angle) - 1; math.Abs(k.Exponent-want) > 1e-12 {
				t.Errorf("%s: corner (%g, %g) exponent %g, want %g", c.name, k.X, k.Y, k.Exponent, want)
			}
		}
		near := func(a, b corner) bool {
			// 1e-9 mm and 1e-9 degrees: rounding of metres and of atan2.
			return math.Abs(a.x-b.x) < 1e-9 && math.Abs(a.y-b.y) < 1e-9 && a.kind == b.kind && math.Abs(a.angle-b.angle) < 1e-9
		}
		if len(got) != len(c.want) {
			t.Errorf("%s: corners %v, want %v", c.name, got, c.want)
			continue
		}
		for _, w := range c.want {
			if !slices.ContainsFunc(got, func(g corner) bool { return near(g, w) }) {
				t.Errorf("%s: corners %v, want %v", c.name, got, c.want)
				break
			}
		}
	}
	// Exponents: -1/3 at right angles either way, -1/5 at 135 degrees
	// (π/(5π/4) - 1).
	m := featureModel(t, "chamfer", `  - {name: c, material: steel, polygon: [[0, 0], [40, 0], [40, 35], [35, 40], [0, 40]]}`, "")
	for _, k := range study.FindFeatures(m).Corners {
		want := -1.0 / 3
		if k.X > 0.03 && k.Y > 0.03 {
			want = -0.2
		}
		if math.Abs(k.Exponent-want) > 1e-12 {
			t.Errorf("chamfer: corner (%g, %g) exponent %g, want %g", k.X, k.Y, k.Exponent, want)
		}
	}
}

func TestFindFeaturesThinAndSources(t *testing.T) {
	m := featureModel(t, "sheet", `  - {name: sheet, material: steel, polygon: [[0, 0], [100, 0], [100, 2], [0, 2]]}
  - {name: c, material: copper, polygon: [[0, 10], [40, 10], [40, 100], [0, 100]]}`, "")
	ft := study.FindFeatures(m)
	if len(ft.Thin) != 1 || math.Abs(ft.Thin[0].Thickness-0.002) > 1e-12 || math.Abs(ft.Thin[0].Length-0.1) > 1e-12 {
		t.Errorf("thin parts %+v, want one 2 mm thick and 100 mm long", ft.Thin)
	}
	if len(ft.Gaps) != 0 {
		t.Errorf("gaps %+v, want none", ft.Gaps)
	}
	// The coil is 40 mm × 90 mm: the rectangle of its area and perimeter.
	if len(ft.Sources) != 1 || ft.Sources[0].Region != 1 || math.Abs(ft.Sources[0].Width-0.04) > 1e-12 {
		t.Errorf("sources %+v, want region 1, 40 mm wide", ft.Sources)
	}
}

// FuzzFindFeatures runs feature detection and the automatic size field on
// every model Parse accepts: no panic, and every feature and size is
// finite and positive (corner exponents in [-1/2, -0.05]).
func FuzzFindFeatures(f *testing.F) {
	for _, n := range models.Examples() {
		data, err := models.Example(n)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(data)
	}
	for _, regions := range []string{twoBlocks,
		`  - {name: r, material: steel, polygon: [[0, 0], [40, 0], {at: [40, 30], arc: 90}, [30, 40], [0, 40]]}`,
		`  - {name: arm, material: steel, polygon: [[0, 0], [100, 0], [100, 20], [0, 20]]}
  - {name: pole, material: steel, polygon: [[40, 20], [60, 20], [60, 50], [40, 50]]}`} {
		f.Add([]byte("units: mm\ndepth: 100\nmaterials:\n  steel: {curve: low-carbon-steel}\nregions:\n" + regions + "\nboundary: {sides: {bottom: flux-normal}}\n"))
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		m, err := models.Parse("f.yaml", data)
		if err != nil {
			return
		}
		checkFeatures(t, m)
	})
}

// FuzzFeatureBlocks runs feature detection on two iron quadrilaterals
// (a block and a skewed block, in mm) placed anywhere, touching,
// overlapping (rejected by Parse) or nearly aligned, optionally on a
// symmetry side: the invariants of FuzzFindFeatures hold.
func FuzzFeatureBlocks(f *testing.F) {
	f.Add(0.0, -45.0, 50.0, 40.0, 0.0, 5.0, 50.0, 40.0, 0.0, uint8(0))
	f.Add(0.0, 0.0, 100.0, 20.0, 40.0, 20.0, 20.0, 30.0, 0.0, uint8(1))
	f.Add(0.0, 0.0, 10.0, 10.0, 10.0, 0.0, 10.0, 10.0, 1e-7, uint8(2))
	f.Add(0.0, 0.0, 10.0, 10.0, 10.000001, 0.0, 10.0, 10.0, 3.0, uint8(3))
	f.Fuzz(func(t *testing.T, ax, ay, aw, ah, bx, by, bw, bh, skew float64, side uint8) {
		for _, v := range []float64{ax, ay, aw, ah, bx, by, bw, bh, skew} {
			if math.IsNaN(v) || math.Abs(v) > 1e4 {
				return
			}
		}
		sides := []string{"", "boundary: {sides: {bottom: flux-normal}}\n", "boundary: {sides: {left: zero-potential}}\n", "geometry: axisymmetric\n"}
		extra := sides[int(side)%len(sides)]
		depth := "depth: 100\n"
		if strings.HasPrefix(extra, "geometry") {
			depth = ""
		}
		src := fmt.Sprintf("units: mm\n%s%smaterials:\n  steel: {mu-r: 1000}\nregions:\n"+
			"  - {name: a, material: steel, polygon: [[%g, %g], [%g, %g], [%g, %g], [%g, %g]]}\n"+
			"  - {name: b, material: steel, polygon: [[%g, %g], [%g, %g], [%g, %g], [%g, %g]]}\n",
			depth, extra, ax, ay, ax+aw, ay, ax+aw, ay+ah, ax, ay+ah,
			bx, by, bx+bw, by+skew, bx+bw, by+bh, bx+skew, by+bh)
		m, err := models.Parse("f.yaml", []byte(src))
		if err != nil {
			return
		}
		checkFeatures(t, m)
	})
}

// checkFeatures asserts the invariants of m's features and automatic
// size field.
func checkFeatures(t *testing.T, m *models.Model) {
	t.Helper()
	ft := study.FindFeatures(m)
	ok := func(x float64) bool { return x > 0 && !math.IsInf(x, 0) }
	for _, g := range ft.Gaps {
		if !ok(g.Width) || !ok(g.Length) {
			t.Fatalf("gap %+v", g)
		}
	}
	for _, p := range ft.Thin {
		if !ok(p.Thickness) || !ok(p.Length) {
			t.Fatalf("thin part %+v", p)
		}
	}
	for _, c := range ft.Corners {
		if !(c.Exponent >= -0.5 && c.Exponent <= -0.05) || !(c.Angle > 0 && c.Angle < 2*math.Pi) {
			t.Fatalf("corner %+v", c)
		}
	}
	for _, s := range ft.Sources {
		if !ok(s.Width) {
			t.Fatalf("source %+v", s)
		}
	}
	sf := study.AutoSizeField(m)
	for _, l := range sf.Lines {
		if !ok(l.Size) {
			t.Fatalf("size line %+v", l)
		}
	}
	for _, p := range sf.Points {
		if !ok(p.Size) {
			t.Fatalf("size point %+v", p)
		}
	}
}
