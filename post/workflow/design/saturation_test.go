package design

import (
	"fmt"
	"math"
	"testing"

	"polegap/models"
	"polegap/post/study"
)

// refined returns a copy of m with every element size (mesh.size, each
// region's mesh-size, each refine entry) divided by 2^k: k uniform
// refinements of the model's own mesh. The order stays the model's.
func refined(m *models.Model, k int) *models.Model {
	c := m.Clone()
	f := math.Ldexp(1, -k)
	c.Mesh.Size *= f
	for i := range c.Mesh.Refine {
		c.Mesh.Refine[i].Size *= f
	}
	for i := range c.Regions {
		c.Regions[i].MeshSize *= f
	}
	return c
}

// On every embedded example the saturation peak of each iron region (the
// largest mean |B| over a disc of the default radius) changes by less
// than 1 % over two uniform refinements of the model's mesh, while the
// raw maximum keeps growing. The raw maximum sits at a corner, where the
// field of highly permeable iron goes as r^(π/α − 1) for a corner of
// interior angle α, r^(−1/3) at a 90° corner on either side of the
// iron-air boundary (J. Meixner, "The behavior of electromagnetic fields
// at edges", IEEE Trans. Antennas Propag. 20(4), 1972, pp. 442-446; J. D.
// Jackson, "Classical Electrodynamics", 3rd ed. 1998, section 2.11, for
// the 2D wedge; both from memory): each halving of the elements there
// raises it (by 4^(1/3) − 1 = 59 % over two halvings in linear iron,
// less where the corner saturates; measured 0.4 % on the holding magnet's
// plate, whose corners see little flux, to 49 % on the relaxometry
// magnet's return yoke),
// whereas |B| averaged over a disc converges: r^(−1/3) is integrable, the
// corner elements' share of the disc's integral falls as (h/R)^(5/3).
// Measured changes of the peak: at most 0.69 % (the bench dipole's upper
// pole); the 1 % of the requirement is asserted.
func TestSaturationPeakConverges(t *testing.T) {
	if testing.Short() {
		t.Skip("solves every example on meshes 4 and 16 times finer (about a minute)")
	}
	for _, name := range models.Examples() {
		m0, err := models.LoadExample(name)
		if err != nil {
			t.Fatal(err)
		}
		var sat [3][]SatReport
		for k := range sat {
			s, err := study.Run(refined(m0, k), study.Options{})
			if err != nil {
				t.Fatalf("%s refined %d times: %v", name, k, err)
			}
			d := NewDesign(s, DesignOptions{})
			if len(d.Saturation) == 0 {
				t.Fatalf("%s: no iron region reported (notes %v)", name, d.Notes)
			}
			sat[k] = d.Saturation
		}
		for i, r0 := range sat[0] {
			r1, r2 := sat[1][i], sat[2][i]
			line := fmt.Sprintf("%s %s: peak %.4f %.4f %.4f T (radius %.1f mm), raw %.4f %.4f %.4f T",
				name, r0.Region, r0.Peak, r1.Peak, r2.Peak, r0.Radius*1e3, r0.Max, r1.Max, r2.Max)
			t.Log(line)
			if d := math.Abs(r2.Peak/r0.Peak - 1); d >= 0.01 {
				t.Errorf("%s: the peak changed by %.2f %%, want < 1 %%", line, 100*d)
			}
			if !(r0.Max < r1.Max && r1.Max < r2.Max) {
				t.Errorf("%s: the raw maximum does not grow with each refinement", line)
			}
			if r0.Radius != r2.Radius {
				t.Errorf("%s: the radius changed with the mesh: %g m, %g m", line, r0.Radius, r2.Radius)
			}
		}
	}
}

// The corner values of a second-order solution's linear B, interpolated
// back, give the element's own B at the points of another rule (degree
// 4, 6 points): B of a straight P2 element is linear, so to rounding
// (1e-12 relative to the largest |B| asserted). Curved elements (along
// arcs, here the open boundary's circle) map their field through a
// quadratic geometry and are left out.
func TestLinearB(t *testing.T) {
	m, err := models.LoadExample("bench-dipole")
	if err != nil {
		t.Fatal(err)
	}
	s, err := study.Run(m, study.Options{})
	if err != nil {
		t.Fatal(err)
	}
	lin := linearB(s.Solution)
	if len(lin) != s.Disc.Mesh.NumTriangles() {
		t.Fatalf("%d corner triples for %d triangles", len(lin), s.Disc.Mesh.NumTriangles())
	}
	qf := study.NewQuadField(s.Solution, 4)
	var worst, bmax float64
	for tr := range lin {
		if s.Disc.Mesh.IsCurved(tr) {
			continue
		}
		for q := range qf.NumPoints() {
			p := qf.At(tr, q)
			l := qf.Rule.L[q]
			for c := 0; c < 2; c++ {
				v := l[0]*lin[tr][0][c] + l[1]*lin[tr][1][c] + l[2]*lin[tr][2][c]
				want := [2]float64{p.Bx, p.By}[c]
				worst = max(worst, math.Abs(v-want))
				bmax = max(bmax, math.Abs(want))
			}
		}
	}
	if worst > 1e-12*bmax {
		t.Errorf("interpolated corner values miss the element's B by %.3g T (largest |B| %.3g T)", worst, bmax)
	}
}
