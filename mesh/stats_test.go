package mesh

import (
	"math"
	"testing"
)

func TestStatsExactAngles(t *testing.T) {
	s3 := math.Sqrt(3)
	single := func(ax, ay, bx, by, cx, cy float64) *Mesh {
		m := &Mesh{X: []float64{ax, bx, cx}, Y: []float64{ay, by, cy}, NumVertices: 3, Tri: []int32{0, 1, 2}, Region: []int32{7}}
		linkNbr(m)
		return m
	}
	// Exact angles from elementary geometry (Euclid, Elements I.32: the
	// angles sum to 180 degrees); aspect ratios from the inradius formula
	// r = 2A/perimeter. Tolerance 1e-12: a few roundings of atan2/hypot.
	cases := []struct {
		name              string
		m                 *Mesh
		minAngle, meanMin float64
		aspect, area      float64
	}{
		{"equilateral", single(0, 0, 1, 0, 0.5, s3/2), 60, 60, 1, s3 / 4},
		{"30-60-90", single(0, 0, s3, 0, 0, 1), 30, 30, 2 / (2 * s3 * (s3 + 1 - 2) / 2), s3 / 2},
		{"right isosceles pair", twoTriangles(), 45, 45, (1 + math.Sqrt2) / s3, 1},
		{"120-30-30", single(0, 0, s3, 0, s3/2, 0.5), 30, 30, 0, s3 / 4},
	}
	// 30-60-90 with legs sqrt3 and 1, hypotenuse 2: r = (a+b-c)/2 for a
	// right triangle = (sqrt3+1-2)/2, so aspect = 2/(2*sqrt3*r).
	// 120-30-30 with sides 1, 1, sqrt3: area sqrt3/4, perimeter 2+sqrt3,
	// r = sqrt3/(2(2+sqrt3)), aspect = sqrt3/(2 sqrt3 r) = (2+sqrt3)/sqrt3.
	cases[3].aspect = (2 + s3) / s3
	for _, c := range cases {
		s := c.m.Stats()
		if math.Abs(s.MinAngle-c.minAngle) > 1e-12 || math.Abs(s.MeanAngle-c.meanMin) > 1e-12 {
			t.Errorf("%s: min angle %.15g mean %.15g, want %g %g", c.name, s.MinAngle, s.MeanAngle, c.minAngle, c.meanMin)
		}
		if math.Abs(s.WorstAspect-c.aspect) > 1e-12*c.aspect {
			t.Errorf("%s: worst aspect %.15g, want %.15g", c.name, s.WorstAspect, c.aspect)
		}
		if math.Abs(s.Area-c.area) > 1e-15 {
			t.Errorf("%s: area %.17g, want %.17g", c.name, s.Area, c.area)
		}
		if s.Triangles != c.m.NumTriangles() || s.Vertices != c.m.NumVertices || s.Nodes != c.m.NumNodes() {
			t.Errorf("%s: counts %+v", c.name, s)
		}
	}
}

func TestStatsRegionsAndDegenerate(t *testing.T) {
	// 10 x 6 cells of side 0.1 (not exact in binary): region 1 in the left
	// 4 columns, region 2 elsewhere, one cell left out.
	m := gridMesh(10, 6, 0, 0, 0.1, func(i, j int) bool { return i == 9 && j == 5 }, func(i, j int) int32 {
		if i < 4 {
			return 1
		}
		return 2
	})
	s := m.Stats()
	h2 := 0.1 * 0.1
	want := map[int32]float64{1: 24 * h2, 2: 35 * h2}
	// The compensated sum of n equal terms is within a few ulps of n*a,
	// and the terms themselves carry the rounding of 0.1: 1e-14 relative.
	if len(s.PerRegion) != 2 || s.PerRegion[0].Region != 1 || s.PerRegion[1].Region != 2 {
		t.Fatalf("per region %+v", s.PerRegion)
	}
	for _, r := range s.PerRegion {
		if math.Abs(r.Area-want[r.Region]) > 1e-14*want[r.Region] {
			t.Errorf("region %d area %.17g want %.17g", r.Region, r.Area, want[r.Region])
		}
	}
	if s.PerRegion[0].Triangles != 48 || s.PerRegion[1].Triangles != 70 {
		t.Errorf("triangles per region %+v", s.PerRegion)
	}
	ra := m.RegionAreas()
	for r, a := range want {
		if math.Abs(ra[r]-a) > 1e-14*a {
			t.Errorf("RegionAreas[%d] = %.17g want %.17g", r, ra[r], a)
		}
	}
	if math.Abs(s.Area-59*h2) > 1e-14 {
		t.Errorf("area %.17g want %.17g", s.Area, 59*h2)
	}
	if math.Abs(s.MinAngle-45) > 1e-12 {
		t.Errorf("grid min angle %g", s.MinAngle)
	}

	// A flat triangle: zero angle, infinite aspect, never NaN.
	flat := &Mesh{X: []float64{0, 1, 2}, Y: []float64{0, 0, 0}, NumVertices: 3, Tri: []int32{0, 1, 2}}
	fs := flat.Stats()
	if fs.MinAngle != 0 || !math.IsInf(fs.WorstAspect, 1) || fs.Area != 0 || len(fs.PerRegion) != 1 {
		t.Errorf("flat triangle stats %+v", fs)
	}
	if z := (&Mesh{}).Stats(); z.Triangles != 0 || z.MinAngle != 0 || z.PerRegion != nil {
		t.Errorf("empty mesh stats %+v", z)
	}
}
