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
	regs := []Region{{Tag: 1, Name: "pole", Knee: 1.5, Limit: 1.8}, {Tag: 2, Name: "yoke", Knee: 1.5, Limit: 1.9}}
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
	if p.MaxTriangle != 1 || p.MaxAt != [2]float64{4.0 / 3, 1.0 / 3} || p.MaxAtCorner || !p.Pass || p.Triangles != 2 {
		t.Errorf("pole: %+v", p)
	}
	exact("yoke area", y.Area, 1.5)
	exact("yoke above knee", y.AboveKnee, 1)
	if y.Pass || y.MaxAway != 2 {
		t.Errorf("yoke over its limit: %+v", y)
	}
	// A corner at (0, 0): triangle 0's centroid (1/3, 1/3) lies within
	// 0.5 of it, triangle 1's (4/3, 1/3) does not.
	regs[0].Corners = [][2]float64{{0, 0}}
	b[0] = [2]float64{0, 5} // a corner peak
	reps, _ = Analyse(m, b, regs[:1], Options{CornerRadius: 0.5})
	p = reps[0]
	if p.Max != 5 || !p.MaxAtCorner || p.MaxAway != 1.7 || p.AwayTriangles != 1 || !p.Pass {
		t.Errorf("corner peak: %+v", p)
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
			math.Abs(rp.Mean-1.5) > 4e-16*1.5 || rp.Max != 1.5 || rp.MaxAway != 1.5 ||
			rp.AboveKnee != c.above || rp.Pass != c.pass || rp.MaxAtCorner {
			t.Errorf("knee %g limit %g: %+v", c.knee, c.limit, rp)
		}
		if want := DefaultCornerFraction * math.Sqrt(rp.Area); rp.CornerRadius != want {
			t.Errorf("default corner radius %g, want %g", rp.CornerRadius, want)
		}
	}
}

const frohlichKnee = -1 // marker for the case that uses the curve

// The re-entrant corners of an L-shaped polygon, either orientation, and
// the chords of a concave arc (turns of 5°) are not corners.
func TestReentrantCorners(t *testing.T) {
	x := []float64{0, 2, 2, 1, 1, 0}
	y := []float64{0, 0, 1, 1, 2, 2}
	got := ReentrantCorners(x, y, 0)
	if len(got) != 1 || got[0] != [2]float64{1, 1} {
		t.Errorf("L, counter-clockwise: %v, want [[1 1]]", got)
	}
	rx, ry := make([]float64, len(x)), make([]float64, len(y))
	for i := range x {
		rx[len(x)-1-i], ry[len(y)-1-i] = x[i], y[i]
	}
	if got := ReentrantCorners(rx, ry, 0); len(got) != 1 || got[0] != [2]float64{1, 1} {
		t.Errorf("L, clockwise: %v, want [[1 1]]", got)
	}
	// A square with a concave quarter-circle bite of 18 chords (5° turns).
	px, py := []float64{0, 2, 2}, []float64{0, 0, 1}
	for k := 1; k <= 18; k++ {
		a := math.Pi / 2 * float64(k) / 18
		px = append(px, 2-math.Sin(a))
		py = append(py, 2-math.Cos(a))
	}
	px, py = append(px, 0), append(py, 2)
	got = ReentrantCorners(px, py, 0)
	if len(got) != 0 {
		t.Errorf("concave arc: %v, want none", got)
	}
	// With a 2° threshold the 17 inner chord joints count.
	if got := ReentrantCorners(px, py, 2); len(got) != 17 {
		t.Errorf("concave arc, 2° threshold: %d corners, want 17", len(got))
	}
}

func TestMisuse(t *testing.T) {
	m := handMesh()
	for name, f := range map[string]func(){
		"short B":   func() { Analyse(m, nil, nil, Options{}) },
		"no curve":  func() { Analyse(m, make([][2]float64, 3), []Region{{Tag: 1}}, Options{}) },
		"neg limit": func() { Analyse(m, make([][2]float64, 3), []Region{{Tag: 1, Knee: 1, Limit: -1}}, Options{}) },
		"polygon":   func() { ReentrantCorners([]float64{0, 1}, []float64{0, 1}, 0) },
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
