package saturation

import (
	"errors"
	"math"
	"strings"
	"testing"

	"polegap/mesh"
)

// frohlich is the Fröhlich curve B = Bs H/(a + H), i.e. H = a B/(Bs − B)
// (a standard analytic saturation model; e.g. R. M. Bozorth,
// "Ferromagnetism", 1951, from memory), infinite from B = Bs on.
type frohlich struct{ a, bs float64 }

func (f frohlich) H(b float64) float64 {
	if b >= f.bs {
		return math.Inf(1)
	}
	return f.a * b / (f.bs - b)
}

// linearCurve is H = B/μ.
type linearCurve float64

func (l linearCurve) H(b float64) float64 { return b / float64(l) }

// The knee of the Fröhlich curve: H(1.1B)/H(B) = 1.1 (Bs − B)/(Bs − 1.1B)
// = 1.5 gives B_k = (8/11) Bs exactly (algebra on the curve above).
// Bisection stops at 1e-10 T; 1e-9 T is asserted.
func TestKneeFrohlich(t *testing.T) {
	for _, c := range []frohlich{{a: 100, bs: 2}, {a: 5000, bs: 1.6}, {a: 20, bs: 0.45}} {
		got, err := Knee(c)
		want := 8.0 / 11 * c.bs
		if err != nil || math.Abs(got-want) > 1e-9 {
			t.Errorf("%+v: knee %v (%v), want %v", c, got, err, want)
		}
	}
}

func TestKneeErrors(t *testing.T) {
	var ne *NoKneeError
	if _, err := Knee(linearCurve(1e-3)); !errors.As(err, &ne) || math.Abs(ne.MaxRatio-1.1) > 1e-12 {
		t.Errorf("linear curve: %v", err)
	}
	var nf *NonFiniteError
	nan := frohlich{a: math.NaN(), bs: 2}
	if _, err := Knee(nan); !errors.As(err, &nf) {
		t.Errorf("NaN curve: %v", err)
	}
}

// handMesh is a hand-built mesh: vertices (0,0), (1,0), (3,0), (0,1),
// (3,1); triangle 0 = (0,1,3) area 0.5 and triangle 1 = (1,2,3) area 1 in
// region 1, triangle 2 = (2,4,3) area 1.5 in region 2.
func handMesh() *mesh.Mesh {
	return &mesh.Mesh{
		X:           []float64{0, 1, 3, 0, 3},
		Y:           []float64{0, 0, 0, 1, 1},
		NumVertices: 5,
		Tri:         []int32{0, 1, 3, 1, 2, 3, 2, 4, 3},
		Region:      []int32{1, 1, 2},
	}
}

// Area fractions on the hand-built mesh are sums of exact triangle areas.
func TestAreaFractionHandMesh(t *testing.T) {
	m := handMesh()
	b := [][2]float64{{0.6, 0.8}, {0, 1.7}, {2, 0}} // |B| = 1, 1.7, 2
	regs := []Region{{Tag: 1, Name: "pole", Knee: 1.5, Limit: 1.8, TableEnd: 1.6}, {Tag: 2, Name: "yoke", Knee: 1.5, Limit: 1.9}}
	reps, err := Analyse(m, b, regs, Options{Levels: []float64{0.5, 1.2, 3}})
	if err != nil {
		t.Fatal(err)
	}
	p, y := reps[0], reps[1]
	exact := func(what string, got, want float64) {
		t.Helper()
		if math.Abs(got-want) > 1e-15 {
			t.Errorf("%s = %.17g, want %.17g", what, got, want)
		}
	}
	exact("pole area", p.Area, 1.5)
	exact("pole mean", p.Mean, (0.5*1+1*1.7)/1.5)
	exact("pole above knee", p.AboveKnee, 1/1.5)
	exact("pole level 0.5", p.Levels[0].Fraction, 1)
	exact("pole level 1.2", p.Levels[1].Fraction, 1/1.5)
	exact("pole level 3", p.Levels[2].Fraction, 0)
	exact("pole max", p.Max, 1.7)
	exact("pole beyond table", p.BeyondTable, 1/1.5)
	exact("yoke beyond table (not reported)", y.BeyondTable, 0)
	if p.MaxTriangle != 1 || p.MaxAt != [2]float64{4.0 / 3, 1.0 / 3} || p.MaxAtCorner || !p.Pass || p.Triangles != 2 {
		t.Errorf("pole: %+v", p)
	}
	exact("yoke area", y.Area, 1.5)
	exact("yoke above knee", y.AboveKnee, 1)
	if y.Pass || y.Peak != 2 {
		t.Errorf("yoke over its limit: %+v", y)
	}
	// A corner at (0, 0) and a high field in triangle 0: its centroid
	// (1/3, 1/3) lies 0.47 from the corner, within a radius of 0.5 but
	// not of 0.2. The quarter disc about the corner (a seed of the
	// search) lies wholly in triangle 0 for either radius (it reaches
	// x + y = r√2 < 1), so the peak is that triangle's 5 T.
	regs[0].Corners = [][2]float64{{0, 0}}
	b[0] = [2]float64{0, 5}
	for _, c := range []struct {
		radius float64
		near   bool
	}{{0.5, true}, {0.2, false}} {
		reps, _ = Analyse(m, b, regs[:1], Options{Radius: c.radius})
		p = reps[0]
		if p.Max != 5 || p.MaxAtCorner != c.near || math.Abs(p.Peak-5) > 1e-14 || p.Pass || p.Radius != c.radius {
			t.Errorf("corner peak, radius %g: %+v", c.radius, p)
		}
	}
}

// A uniform field: every number is exact. The region is the rectangle
// [0.02, 0.08] × [0.01, 0.05] meshed inside an air box, with the same
// B = (0.9, −1.2) T (|B| = 1.5 T) in every triangle.
func TestUniformExact(t *testing.T) {
	iron := mesh.Polygon{X: []float64{0.02, 0.08, 0.08, 0.02}, Y: []float64{0.01, 0.01, 0.05, 0.05}, Region: 1}
	box := mesh.Polygon{X: []float64{0, 0.1, 0.1, 0}, Y: []float64{0, 0, 0.06, 0.06}}
	in, err := mesh.BuildInput([]mesh.Polygon{iron}, box, mesh.GraphOptions{})
	if err != nil {
		t.Fatal(err)
	}
	m, err := mesh.Triangulate(in, mesh.Options{Size: mesh.SizeField{Global: 0.005}})
	if err != nil {
		t.Fatal(err)
	}
	b := make([][2]float64, m.NumTriangles())
	for i := range b {
		b[i] = [2]float64{0.9, -1.2}
	}
	for _, c := range []struct {
		knee, limit, above float64
		pass               bool
	}{{1.4, 1.6, 1, true}, {1.6, 1.4, 0, false}, {frohlichKnee, 0, 1, true}} {
		r := Region{Tag: 1, Name: "iron", Knee: c.knee, Limit: c.limit}
		if c.knee == frohlichKnee {
			r = Region{Tag: 1, Name: "iron", Curve: frohlich{a: 100, bs: 2}} // knee 16/11 T
		}
		reps, err := Analyse(m, b, []Region{r}, Options{})
		if err != nil {
			t.Fatal(err)
		}
		rp := reps[0]
		// Area and mean: compensated sums of rounded triangle areas, to a
		// few ulps (4e-16 relative asserted; the area's triangle areas
		// each carry one rounding of their own).
		if math.Abs(rp.Area-0.0024) > 4e-16*0.0024*float64(rp.Triangles) ||
			math.Abs(rp.Mean-1.5) > 4e-16*1.5 || rp.Max != 1.5 || math.Abs(rp.Peak-1.5) > 4e-16*1.5*float64(rp.Triangles) ||
			rp.AboveKnee != c.above || rp.Pass != c.pass || rp.MaxAtCorner {
			t.Errorf("knee %g limit %g: %+v", c.knee, c.limit, rp)
		}
		// The default radius: no gap, so SizeFraction of the region's
		// longer side (0.06 m); the box's corners are exact in binary
		// to within one rounding each.
		if want := SizeFraction * 0.06; math.Abs(rp.Radius-want) > 1e-16 {
			t.Errorf("default radius %g, want %g", rp.Radius, want)
		}
	}
}

const frohlichKnee = -1 // marker for the case that uses the curve

func TestMisuse(t *testing.T) {
	m := handMesh()
	for name, f := range map[string]func(){
		"short B":   func() { Analyse(m, nil, nil, Options{}) },
		"no curve":  func() { Analyse(m, make([][2]float64, 3), []Region{{Tag: 1}}, Options{}) },
		"neg limit": func() { Analyse(m, make([][2]float64, 3), []Region{{Tag: 1, Knee: 1, Limit: -1}}, Options{}) },
		"polygon":   func() { Corners(mesh.Polygon{X: []float64{0, 1}, Y: []float64{0, 1}}, CornerOptions{}) },
		"min turn": func() {
			Corners(mesh.Polygon{X: []float64{0, 1, 0}, Y: []float64{0, 0, 1}}, CornerOptions{MinTurn: 180})
		},
		"LinearB": func() {
			Analyse(m, make([][2]float64, 3), []Region{{Tag: 1, Knee: 1}}, Options{LinearB: make([][3][2]float64, 2)})
		},
		"neg gap": func() { Analyse(m, make([][2]float64, 3), []Region{{Tag: 1, Knee: 1}}, Options{Gap: -1}) },
	} {
		func() {
			defer func() {
				if r, ok := recover().(string); !ok || !strings.HasPrefix(r, "saturation: ") {
					t.Errorf("%s: recovered %v", name, r)
				}
			}()
			f()
		}()
	}
	var ee *EmptyRegionError
	if _, err := Analyse(m, make([][2]float64, 3), []Region{{Tag: 7, Knee: 1}}, Options{}); !errors.As(err, &ee) {
		t.Errorf("empty region: %v", err)
	}
	var nf *NonFiniteError
	if _, err := Analyse(m, [][2]float64{{0, 0}, {math.NaN(), 0}, {0, 0}}, []Region{{Tag: 1, Knee: 1}}, Options{}); !errors.As(err, &nf) || nf.Triangle != 1 {
		t.Errorf("NaN B: %v", err)
	}
}
