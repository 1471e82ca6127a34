package saturation

import (
	"math"
	"testing"

	"polegap/mesh"
	"polegap/solver"
)

const mu0 = 4e-7 * math.Pi

type linear float64

func (l linear) Nu(float64) (float64, float64) { return 1 / (mu0 * float64(l)), 0 }

var yokeX = []float64{0, 0.2, 0.2, 0.15, 0.15, 0.05, 0.05, 0.15, 0.15, 0.2, 0.2, 0}
var yokeY = []float64{0, 0, 0.099, 0.099, 0.05, 0.05, 0.15, 0.15, 0.101, 0.101, 0.2, 0.2}

// cCoreB solves a C-core (μr 1000, 2 mm gap, 2000 ampere-turns) with the
// mesh size at the four window corners set to corner, and returns the
// mesh and the flux density per triangle.
func cCoreB(t *testing.T, corner float64) (*mesh.Mesh, [][2]float64) {
	t.Helper()
	rect := func(x0, y0, x1, y1 float64, reg int32) mesh.Polygon {
		return mesh.Polygon{X: []float64{x0, x1, x1, x0}, Y: []float64{y0, y0, y1, y1}, Region: reg}
	}
	yoke := mesh.Polygon{X: yokeX, Y: yokeY, Region: 1}
	in, err := mesh.BuildInput([]mesh.Polygon{yoke, rect(0.055, 0.06, 0.075, 0.14, 2), rect(-0.025, 0.06, -0.005, 0.14, 3)},
		rect(-0.2, -0.2, 0.4, 0.4, 0), mesh.GraphOptions{})
	if err != nil {
		t.Fatal(err)
	}
	var pts []mesh.SizePoint
	for _, c := range [][2]float64{{0.05, 0.05}, {0.15, 0.05}, {0.05, 0.15}, {0.15, 0.15}} {
		pts = append(pts, mesh.SizePoint{X: c[0], Y: c[1], Size: corner})
	}
	m, err := mesh.Triangulate(in, mesh.Options{Size: mesh.SizeField{
		Global: 0.02, Region: map[int32]float64{1: 0.006}, Points: pts,
		Lines:   []mesh.SizeLine{{X0: 0.15, Y0: 0.1, X1: 0.2, Y1: 0.1, Size: 0.001}},
		Grading: 0.3,
	}})
	if err != nil {
		t.Fatal(err)
	}
	j := 2000 / (0.02 * 0.08)
	s, err := solver.Solve(&solver.Problem{Mesh: m, Materials: []solver.Material{linear(1), linear(1000), linear(1), linear(1)},
		CurrentDensity: []float64{0, 0, j, -j}}, solver.Options{})
	if err != nil {
		t.Fatal(err)
	}
	return m, s.BTo(nil)
}

// Refining the mesh at the window's re-entrant corners eightfold raises
// the raw maximum, which sits at a corner: near a corner of interior angle
// α the potential goes as r^(π/α) and the field as r^(π/α − 1), r^(−1/3)
// at a 90° notch of highly permeable iron (α = 3π/2 on the iron side; J.
// Meixner, "The behavior of electromagnetic fields at edges", IEEE Trans.
// Antennas Propag. 20(4), 1972, pp. 442-446; J. D. Jackson, "Classical
// Electrodynamics", 3rd ed. 1998, section 2.11, for the 2D wedge; both
// from memory). The corner element's centroid sits at about h/3, so the
// maximum should grow by about 8^(1/3) = 2 (measured: 2.0); at least 1.5
// is asserted.
//
// The peak, the mean over a disc, converges: |B| ~ r^(−1/3) is
// integrable, and the corner elements' share of the disc's integral
// falls as (h/R)^(5/3) (area h² times a field of h^(−1/3), against R²
// times R^(−1/3)). With R = 10 mm (the default: 1/20 of the 0.2 m core)
// and h = 2 mm the share is about 7 %, and the first-order elements get
// a good part of it right: the peak moved by 0.11 % (measured); 1 % is
// asserted, against a raw maximum that doubles.
func TestCornerMaximumIsMeshDependent(t *testing.T) {
	corners := Corners(mesh.Polygon{X: yokeX, Y: yokeY}, CornerOptions{})
	if len(corners) != len(yokeX) {
		t.Fatalf("C-core corners: %v, want all %d vertices", corners, len(yokeX))
	}
	var reps [2]Report
	for i, h := range []float64{0.002, 0.00025} {
		m, b := cCoreB(t, h)
		r, err := Analyse(m, b, []Region{{Tag: 1, Name: "yoke", Knee: 1.5, Corners: corners}}, Options{})
		if err != nil {
			t.Fatal(err)
		}
		reps[i] = r[0]
		t.Logf("corner size %g m: max %.4f T at %v (corner %v), peak %.4f T at %v, mean %.4f T, radius %.4f m",
			h, r[0].Max, r[0].MaxAt, r[0].MaxAtCorner, r[0].Peak, r[0].PeakAt, r[0].Mean, r[0].Radius)
	}
	if !reps[0].MaxAtCorner || !reps[1].MaxAtCorner {
		t.Errorf("raw maxima not flagged at a corner: %v, %v", reps[0].MaxAtCorner, reps[1].MaxAtCorner)
	}
	if g := reps[1].Max / reps[0].Max; g < 1.5 {
		t.Errorf("raw maximum grew by %.3g under 8x corner refinement, want >= 1.5", g)
	}
	if d := math.Abs(reps[1].Peak/reps[0].Peak - 1); d > 0.01 {
		t.Errorf("peak changed by %.3g, want <= 1 %%", d)
	}
}

// The corners of outlines with straight edges and arcs, in either
// orientation, and with a mirror line.
func TestCorners(t *testing.T) {
	reverse := func(p mesh.Polygon) mesh.Polygon {
		n := len(p.X)
		q := mesh.Polygon{X: make([]float64, n), Y: make([]float64, n)}
		if p.Sweep != nil {
			q.Sweep = make([]float64, n)
		}
		for i := range n {
			q.X[n-1-i], q.Y[n-1-i] = p.X[i], p.Y[i]
			if p.Sweep != nil {
				// edge i (i -> i+1) becomes edge n-2-i, run the other way
				q.Sweep[(2*n-2-i)%n] = -p.Sweep[i]
			}
		}
		return q
	}
	// A square with a concave quarter-circle bite of radius 1 about
	// (2, 2), chorded in 18 steps of 5°.
	bx, by := []float64{0, 2, 2}, []float64{0, 0, 1}
	for k := 1; k <= 18; k++ {
		a := math.Pi / 2 * float64(k) / 18
		bx = append(bx, 2-math.Sin(a))
		by = append(by, 2-math.Cos(a))
	}
	bx, by = append(bx, 0), append(by, 2)
	axis := []Line{{X0: 0, Y0: -1, X1: 0, Y1: 1}}
	for _, c := range []struct {
		name string
		p    mesh.Polygon
		opt  CornerOptions
		want [][2]float64
	}{
		// Convex and re-entrant alike.
		{"L", mesh.Polygon{X: []float64{0, 2, 2, 1, 1, 0}, Y: []float64{0, 0, 1, 1, 2, 2}}, CornerOptions{},
			[][2]float64{{0, 0}, {2, 0}, {2, 1}, {1, 1}, {1, 2}, {0, 2}}},
		// A straight joint (5° and 0° turns) is no corner.
		{"joints", mesh.Polygon{X: []float64{0, 1, 2, 2 + math.Cos(5*math.Pi/180)*2, 0}, Y: []float64{0, 0, 0, math.Sin(5*math.Pi/180) * 2, 2}}, CornerOptions{},
			[][2]float64{{0, 0}, {2 + math.Cos(5*math.Pi/180)*2, math.Sin(5*math.Pi/180) * 2}, {0, 2}}},
		// The bite as an arc: its ends are corners (90° turns there).
		{"arc bite", mesh.Polygon{X: []float64{0, 2, 2, 1, 0}, Y: []float64{0, 0, 1, 2, 2}, Sweep: []float64{0, 0, -math.Pi / 2, 0, 0}}, CornerOptions{},
			[][2]float64{{0, 0}, {2, 0}, {2, 1}, {1, 2}, {0, 2}}},
		// The bite as chords: the joints turn by 5°, only the ends count.
		{"chorded bite", mesh.Polygon{X: bx, Y: by}, CornerOptions{},
			[][2]float64{{0, 0}, {2, 0}, {2, 1}, {1, 2}, {0, 2}}},
		// A rounded corner meets its edges tangentially; its ends count
		// all the same (arc ends are corners by definition).
		{"rounded", mesh.Polygon{X: []float64{0, 1, 1, 0.8, 0}, Y: []float64{0, 0, 0.8, 1, 1}, Sweep: []float64{0, 0, math.Pi / 2, 0, 0}}, CornerOptions{},
			[][2]float64{{0, 0}, {1, 0}, {1, 0.8}, {0.8, 1}, {0, 1}}},
		// A pole piece on the axis of an axisymmetric model: its face
		// meets the axis at 90°, a flat disc in the solid, no corner.
		{"on the axis", mesh.Polygon{X: []float64{0, 1, 1, 0}, Y: []float64{0, 0, 2, 2}}, CornerOptions{Mirrors: axis},
			[][2]float64{{1, 0}, {1, 2}}},
		// A cone on the axis, tip at the origin: 45° to the axis, a 90°
		// tip in the solid; its base meets the axis at 90°.
		{"cone", mesh.Polygon{X: []float64{0, 1, 0}, Y: []float64{0, 1, 1}}, CornerOptions{Mirrors: axis},
			[][2]float64{{0, 0}, {1, 1}}},
		// With a 2° threshold the 17 inner joints of the chords count.
		{"chorded bite 2°", mesh.Polygon{X: bx, Y: by}, CornerOptions{MinTurn: 2}, nil},
	} {
		for _, rev := range []bool{false, true} {
			p := c.p
			if rev {
				p = reverse(p)
			}
			got := Corners(p, c.opt)
			if c.want == nil {
				if len(got) != 22 {
					t.Errorf("%s (reversed %v): %d corners, want 22", c.name, rev, len(got))
				}
				continue
			}
			if len(got) != len(c.want) {
				t.Errorf("%s (reversed %v): %v, want %v", c.name, rev, got, c.want)
				continue
			}
			for _, w := range c.want {
				found := false
				for _, g := range got {
					found = found || g == w
				}
				if !found {
					t.Errorf("%s (reversed %v): %v lacks %v", c.name, rev, got, w)
				}
			}
		}
	}
}
