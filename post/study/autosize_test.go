package study_test

import (
	"errors"
	"math"
	"slices"
	"strings"
	"testing"

	"polegap/mesh"
	"polegap/models"
	"polegap/post/study"
	"polegap/solver"
)

// TestAutoSizeFieldGap meshes two blocks with the automatic field and
// checks that no edge of a triangle in the gap is longer than the gap
// over GapElements, and that the corners get CornerFactor of the size
// around them.
func TestAutoSizeFieldGap(t *testing.T) {
	m := featureModel(t, "two-blocks", twoBlocks, "")
	d, err := study.Discretize(m)
	if err != nil {
		t.Fatal(err)
	}
	if d.Mesh.Order() != 2 {
		t.Errorf("order %d, want 2 (the default of an automatic mesh)", d.Mesh.Order())
	}
	const w = 0.010
	ms := d.Mesh
	inGap := 0
	for k := 0; k < ms.NumTriangles(); k++ {
		v := ms.Tri[3*k : 3*k+3]
		cx := (ms.X[v[0]] + ms.X[v[1]] + ms.X[v[2]]) / 3
		cy := (ms.Y[v[0]] + ms.Y[v[1]] + ms.Y[v[2]]) / 3
		if cx < 0 || cx > 0.05 || math.Abs(cy) > w/2 {
			continue
		}
		inGap++
		for e := 0; e < 3; e++ {
			a, b := v[e], v[(e+1)%3]
			// The mesher splits every edge longer than the size at the
			// triangle's centroid: 1e-9 relative covers rounding.
			if l := math.Hypot(ms.X[a]-ms.X[b], ms.Y[a]-ms.Y[b]); l > w/study.GapElements*(1+1e-9) {
				t.Fatalf("triangle %d in the gap has an edge of %g m, above %g m", k, l, w/study.GapElements)
			}
		}
	}
	if inGap == 0 {
		t.Fatal("no triangle in the gap")
	}
	f := study.AutoSizeField(m)
	ft := study.FindFeatures(m)
	isCorner := func(p mesh.SizePoint) bool {
		return slices.ContainsFunc(ft.Corners, func(c study.Corner) bool { return p.X == c.X && p.Y == c.Y })
	}
	// The size around the corners: the field without their points.
	g := f
	g.Points = slices.DeleteFunc(slices.Clone(f.Points), isCorner)
	if len(f.Points)-len(g.Points) != len(ft.Corners) || len(ft.Corners) != 8 {
		t.Fatalf("%d corners, %d corner points; want 8 of each", len(ft.Corners), len(f.Points)-len(g.Points))
	}
	for _, p := range f.Points {
		if !isCorner(p) {
			continue
		}
		c := ft.Corners[slices.IndexFunc(ft.Corners, func(c study.Corner) bool { return p.X == c.X && p.Y == c.Y })]
		around := math.Min(g.At(c.X, c.Y, study.AirTag), g.At(c.X, c.Y, study.Tag(c.Region)))
		// 1e-12 relative: one product and a power.
		if want := around * study.CornerFactor(c.Exponent); math.Abs(p.Size-want) > 1e-12*want {
			t.Errorf("corner (%g, %g): size %g, want %g", c.X, c.Y, p.Size, want)
		}
	}
	// At the faces' corners the size around is the gap's (at most w/6,
	// at least 0.9 w/6), so the corner gets w/6/8 or a little less.
	for _, c := range ft.Corners {
		if math.Abs(c.Y) == w/2 {
			h := g.At(c.X, c.Y, study.AirTag)
			if h > w/study.GapElements || h < 0.9*w/study.GapElements {
				t.Errorf("corner (%g, %g): size around %g, want between 0.9 and 1 times %g", c.X, c.Y, h, w/study.GapElements)
			}
		}
	}
}

// TestExamplesStateSizes guards the examples' results: every embedded
// example states its mesh sizes, so the automatic field never applies to
// them and their output stays as it was.
func TestExamplesStateSizes(t *testing.T) {
	for _, name := range models.Examples() {
		m, err := models.LoadExample(name)
		if err != nil {
			t.Fatal(err)
		}
		if m.Mesh.Auto {
			t.Errorf("%s: automatic mesh; the examples state their sizes", name)
		}
	}
}

// cCoreAuto is an invented C-core without a mesh section: one steel
// polygon (low-carbon steel from the library) with 50 mm wide poles and a
// 10 mm gap centred at (150, 0) mm, 50 mm thick limbs, and a coil of 1000
// turns around the back leg.
const cCoreAuto = `name: c-core-auto
units: mm
depth: 100
materials:
  steel: {curve: low-carbon-steel}
regions:
  - {name: yoke, material: steel, polygon: [[0, -105], [175, -105], [175, -5], [125, -5], [125, -55], [50, -55],
      [50, 55], [125, 55], [125, 5], [175, 5], [175, 105], [0, 105]]}
  - {name: coil-in, material: copper, polygon: [[55, -45], [95, -45], [95, 45], [55, 45]]}
  - {name: coil-out, material: copper, polygon: [[-45, -45], [-5, -45], [-5, 45], [-45, 45]]}
coils:
  - {name: main, turns: 1000, current: 10, sides: [{region: coil-in, sense: 1}, {region: coil-out, sense: -1}]}
probes:
  gap-centre: {point: [150, 0]}
`

// cCoreCurrents drive the C-core from the linear range (3 kA-t: 0.4 T in
// the gap) into deep saturation (30 kA-t: 1.4 T where the ideal circuit
// with ideal iron gives 3.8 T).
var cCoreCurrents = []float64{3, 10, 30}

// cCoreReference is the gap-centre field (T) and co-energy (J) of the
// C-core at cCoreCurrents on the automatic field scaled by 1/3 (about
// 260 000 nodes), as TestAutoMeshCCore computes them without -short.
var cCoreReference = [][2]float64{
	{0.3674113, 4.414388},
	{1.080007, 47.61892},
	{1.399831, 258.8472},
}

// solveCCore solves s at cCoreCurrents (warm-started from the previous
// current) and returns the gap-centre field and co-energy at each.
func solveCCore(t *testing.T, s *study.Study) [][2]float64 {
	t.Helper()
	var out [][2]float64
	var prev []float64
	for k, i := range cCoreCurrents {
		var opt solver.Options
		if prev != nil {
			opt.Initial = make([]float64, len(prev))
			for n := range prev {
				opt.Initial[n] = prev[n] * i / cCoreCurrents[k-1]
			}
		}
		r, err := s.SolveAt(study.Params{Currents: []float64{i}}, opt)
		if err != nil {
			t.Fatalf("%g kA-t: %v", i, err)
		}
		p, _ := r.Probe("gap-centre")
		_, wco, err := study.Energies(r.Solution)
		if err != nil {
			t.Fatal(err)
		}
		out = append(out, [2]float64{p.Point.B(), wco})
		prev = r.Solution.A
	}
	return out
}

// TestAutoMeshCCore checks the C-core without a mesh section: on the
// automatic mesh (second order) the gap-centre field and the co-energy
// lie within 1e-3 of a converged reference, from 3 to 30 kA-t. The
// reference is the same study meshed with the automatic size field
// scaled by 1/3; it is converged when it agrees within 1e-4 with the
// field scaled by 1/2 (the errors of these meshes fall at least like the
// element size, so the finer one's error is then of order 1e-4 or
// less). With -short the reference values computed so are compared
// instead (cCoreReference).
func TestAutoMeshCCore(t *testing.T) {
	m, err := models.Parse("c-core-auto.yaml", []byte(cCoreAuto))
	if err != nil {
		t.Fatal(err)
	}
	s, err := study.Compile(m)
	if err != nil {
		t.Fatal(err)
	}
	if !m.Mesh.Auto || s.Disc.Mesh.Order() != 2 {
		t.Fatalf("automatic %t, order %d; want an automatic second-order mesh", m.Mesh.Auto, s.Disc.Mesh.Order())
	}
	got := solveCCore(t, s)
	ref := cCoreReference
	if !testing.Short() {
		f := study.AutoSizeField(m)
		scaled := func(c float64) [][2]float64 {
			sc, err := s.Refined(func(x, y float64, r int32) float64 { return c * f.At(x, y, r) })
			if err != nil {
				t.Fatal(err)
			}
			t.Logf("field × %.3g: %d nodes", c, sc.Disc.Mesh.NumNodes())
			return solveCCore(t, sc)
		}
		ref = scaled(1.0 / 3)
		half := scaled(1.0 / 2)
		for k := range ref {
			for q, name := range []string{"gap field", "co-energy"} {
				e := math.Abs(half[k][q]/ref[k][q] - 1)
				t.Logf("%g kA-t: reference %s %.7g, %.2g from the field × 1/2", cCoreCurrents[k], name, ref[k][q], e)
				if e > 1e-4 {
					t.Errorf("%g kA-t: reference %s not converged: %.7g (1/3) against %.7g (1/2), %.2g apart", cCoreCurrents[k], name, ref[k][q], half[k][q], e)
				}
			}
		}
	}
	t.Logf("automatic mesh: %d nodes", s.Disc.Mesh.NumNodes())
	for k := range ref {
		for q, name := range []string{"gap field", "co-energy"} {
			e := got[k][q]/ref[k][q] - 1
			t.Logf("%g kA-t: %s %.7g, reference %.7g, error %.2g", cCoreCurrents[k], name, got[k][q], ref[k][q], e)
			// The brief's accuracy for the default mesh: 1e-3.
			if math.Abs(e) > 1e-3 {
				t.Errorf("%g kA-t: %s %.7g on the automatic mesh, reference %.7g: error %.2g above 1e-3", cCoreCurrents[k], name, got[k][q], ref[k][q], e)
			}
		}
	}
}

// TestAutoTooLarge: a mesh the automatic sizes make too large says what
// to check rather than which stated size to enlarge.
func TestAutoTooLarge(t *testing.T) {
	m := featureModel(t, "two-blocks", twoBlocks, "")
	_, err := study.CheckFootprint(m, study.MeshOptions(m), study.Limits{MaxTriangles: 1000})
	var tl *study.TooLargeError
	if !errors.As(err, &tl) || !tl.Auto || tl.Size != 0 {
		t.Fatalf("error %v, want a *TooLargeError with Auto set and no size", err)
	}
	if msg := err.Error(); !strings.Contains(msg, "automatic sizes") || !strings.Contains(msg, "set mesh.size") {
		t.Errorf("message %q does not explain the automatic sizes", msg)
	}
}
