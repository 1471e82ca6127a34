package solver

import (
	"fmt"
	"math"
	"testing"

	"polegap/mesh"
)

// Open boundary by the Kelvin transformation (E. M. Freeman, D. A. Lowther,
// "A novel mapping technique for open boundary finite element solutions to
// Poisson's equation", IEEE Trans. Magn. 24(6), 1988): round conductors
// in unbounded air. The exterior of the circle r = R is the disk added by
// mesh.AddKelvinDisk, joined node for node (Identify; rim edges
// FluxNormal); the disk centre, the point at infinity, is held at A = 0.
// The exact field is the superposition of line-current fields,
// B = μ0 I/(2π r) about each conductor (Ampère's law; outside a round
// conductor its field is that of a line current), which no zero-potential
// circle reproduces for off-centre conductors.
//
// Cases: a go-and-return pair (zero net current: A → 0 at infinity and the
// field in the disk is smooth), and a single off-centre conductor, whose
// return current sits at infinity: the disk then holds a logarithmic
// singularity at its centre, which the disk mesh (quality refinement only)
// resolves coarsely; the error grows toward the rim (0.04 % mid-model,
// 0.3 % at the rim with P2 and h/r = 0.06), so that case is checked to
// 0.5 % only.
func TestKelvinOpenBoundary(t *testing.T) {
	const I, R, a = 100.0, 1.0, 0.05
	type wire struct{ x, y, i float64 }
	for _, c := range []struct {
		name  string
		order int
		wires []wire
		grade float64 // element size / distance from the nearest conductor
		tol   float64 // DESIGN.md P2 accuracy 0.1 %; see above for the single wire
	}{
		{"pair", 2, []wire{{-0.25, 0.1, I}, {0.3, -0.1, -I}}, 0.06, 1e-3},
		{"single", 2, []wire{{0.4, 0, I}}, 0.06, 5e-3},
	} {
		name := fmt.Sprintf("P%d %s", c.order, c.name)
		circle := func(cx, cy, r float64, reg, marker int32) mesh.Polygon {
			return mesh.Polygon{X: []float64{cx + r, cx, cx - r, cx}, Y: []float64{cy, cy + r, cy, cy - r},
				Sweep: []float64{math.Pi / 2, math.Pi / 2, math.Pi / 2, math.Pi / 2}, Region: reg, Marker: marker}
		}
		var regions []mesh.Polygon
		var pts []mesh.SizePoint
		for k, w := range c.wires {
			regions = append(regions, circle(w.x, w.y, a, int32(1+k), 2))
			pts = append(pts, mesh.SizePoint{X: w.x, Y: w.y, Size: a / 4})
		}
		in, err := mesh.BuildInput(regions, circle(0, 0, R, 0, 5),
			mesh.GraphOptions{MaxArcAngle: 2 * math.Pi / 180, ChordTol: 1e-5})
		if err != nil {
			t.Fatal(err)
		}
		// Element size growing in proportion to the distance from the
		// conductors (h/r about c.grade), as a line current needs.
		m, err := mesh.Triangulate(in, mesh.Options{Size: mesh.SizeField{Global: c.grade * R, Points: pts, Grading: c.grade}})
		if err != nil {
			t.Fatal(err)
		}
		ext, err := mesh.AddKelvinDisk(m, 5, 0, 0, R, 0)
		if err != nil {
			t.Fatal(err)
		}
		if c.order == 2 {
			ext.ElevateKelvin()
		}
		m = ext.Mesh
		// J from the meshed conductor areas, so that exactly ±I flows.
		area := make([]float64, len(c.wires)+1)
		for e := 0; e < m.NumTriangles(); e++ {
			i0, i1, i2 := m.Tri[3*e], m.Tri[3*e+1], m.Tri[3*e+2]
			area[m.Region[e]] += 0.5 * ((m.X[i1]-m.X[i0])*(m.Y[i2]-m.Y[i0]) - (m.X[i2]-m.X[i0])*(m.Y[i1]-m.Y[i0]))
		}
		mats := []Material{linear{1}}
		js := []float64{0}
		for k, w := range c.wires {
			mats = append(mats, linear{1})
			js = append(js, w.i/area[k+1])
		}
		p := &Problem{Mesh: m, Materials: mats, CurrentDensity: js,
			Boundary: map[int32]Condition{5: FluxNormal},
			Identify: ext.Pairs,
			Fixed:    []NodeValue{{Node: ext.Infinity, A: 0}}}
		s, err := Solve(p, Options{})
		checkSolution(t, s, err)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		var worst, scale float64
		var band [11]float64
		n := 0
		for e := 0; e < m.NumTriangles(); e++ {
			i0, i1, i2 := m.Tri[3*e], m.Tri[3*e+1], m.Tri[3*e+2]
			x, y := (m.X[i0]+m.X[i1]+m.X[i2])/3, (m.Y[i0]+m.Y[i1]+m.Y[i2])/3
			if math.Hypot(x, y) > R { // the model side only
				continue
			}
			var bx, by float64
			near := false
			for _, w := range c.wires {
				r := math.Hypot(x-w.x, y-w.y)
				near = near || r < 4*a
				f := mu0 * w.i / (2 * math.Pi * r * r)
				bx += -f * (y - w.y)
				by += f * (x - w.x)
			}
			if near {
				continue
			}
			_, gx, gy, _ := s.At(x, y)
			// Relative to the local field, floored at a tenth of the
			// field at 1 m from one conductor (the pair's field has
			// near-zeros far out).
			ref := math.Max(math.Hypot(bx, by), 0.1*mu0*I/(2*math.Pi))
			err := math.Hypot(gx-bx, gy-by) / ref
			bk := int(10 * math.Hypot(x, y))
			band[bk] = math.Max(band[bk], err)
			worst = math.Max(worst, err)
			scale = math.Max(scale, ref)
			n++
		}
		t.Logf("%s: %d nodes, %d points, worst relative error %.3g; by distance from the centre (0.1 bands): %.2g", name, m.NumNodes(), n, worst, band[:10])
		if worst > c.tol {
			t.Errorf("%s: relative field error %.3g > %g", name, worst, c.tol)
		}
	}
}
