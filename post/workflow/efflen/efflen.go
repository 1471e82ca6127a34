package efflen

import (
	"fmt"
	"math"

	"polegap/materials"
	"polegap/mesh"
	"polegap/models"
	"polegap/solver"
)

// Geometry is the side view: the full gap g, the iron length L along the
// beam and the height H of the iron above the pole face at the gap
// centre (pole and yoke), metres.
type Geometry struct {
	Gap, Length, Height float64
}

// FromModel reads the side view of a planar model with a gap: the gap
// length, the depth as the iron length, and the height of the iron
// regions stacked above the gap-centre probe from the pole face.
func FromModel(m *models.Model) (Geometry, error) {
	if m.Geometry != models.Planar || !(m.Gap > 0) || !(m.Depth > 0) {
		return Geometry{}, fmt.Errorf("%s: the effective length needs a planar model with a gap (gap key or a c-core or h-core template) and its depth", m.File)
	}
	cp, ok := m.CentreProbe()
	if !ok {
		return Geometry{}, fmt.Errorf("%s: no gap-centre probe to place the side view", m.File)
	}
	xc, face := cp.Point[0], cp.Point[1]+m.Gap/2
	// Climb through the iron regions whose extent spans x = xc and reaches
	// above where the last one ended, from below or at it (a shimmed
	// pole's extent starts below the face).
	tol := 1e-9 * (m.Gap + m.Depth)
	top := face
	for grew := true; grew; {
		grew = false
		for i := range m.Regions {
			r := &m.Regions[i]
			if r.Material == "air" || r.Material == "copper" {
				continue
			}
			x0, y0, x1, y1 := r.Bounds()
			if x0 <= xc && xc <= x1 && y0 <= top+tol+1e-6*m.Gap && y0 >= cp.Point[1] && y1 > top {
				top, grew = y1, true
			}
		}
	}
	if top == face {
		return Geometry{}, fmt.Errorf("%s: no iron region above the gap centre starts at the pole face (y = %g m)", m.File, face)
	}
	return Geometry{Gap: m.Gap, Length: m.Depth, Height: top - face}, nil
}

// Options control a side-view solve; the zero value is the default.
type Options struct {
	// Radius of the outer boundary (a field line, A = 0) about the
	// magnet's centre; 0 means 30 times the larger of L/2 + H and 10 g.
	Radius float64
	// Size of the elements at the pole's edge; 0 means g/40. The other
	// sizes follow from it (grading 0.25).
	Size float64
	// Reach is how far beyond each iron end the field is integrated (m);
	// 0 means 2 g. The side view's fringe falls off as 1/z (an ideal
	// edge's B/B0 ≈ 2δ/(π z) far out, δ = g/2), far slower than a real
	// magnet's, whose end field spreads sideways in three dimensions too
	// and has fallen to a few per cent of B0 two gaps beyond the iron
	// (common practice, from memory): the whole mid-plane's integral of
	// the two-dimensional view (Result.Whole) overstates the length.
	Reach float64
}

// Result is the effective length of a side view.
type Result struct {
	Geometry
	// Reach is the distance beyond each iron end integrated over (m).
	Reach float64
	// LEff is the effective length (m): ∫B dz / B0 within ±(L/2 + Reach).
	LEff float64
	// K is (LEff − L)/g, the rule's coefficient.
	K float64
	// Estimate is |LEff − LEff on a mesh twice as coarse| (m).
	Estimate float64
	// Whole is 2φ/B0, the field integral over the whole mid-plane of the
	// two-dimensional view over B0 (m): an upper bound (see Options.Reach).
	Whole float64
	// Z and Ratio are B/B0 along the mid-plane from the centre to the
	// boundary (z ≥ 0; the profile is even in z).
	Z, Ratio []float64
	Nodes    int

	sol     *solver.Solution
	phi, b0 float64
}

// Within returns ∫B dz / B0 between −z and z along the beam axis (m),
// exactly from the potential: the effective length counting the field
// within ±z of the centre only. ok is false beyond the boundary.
func (r *Result) Within(z float64) (float64, bool) {
	a, _, _, ok := r.sol.At(math.Abs(z), 0)
	if !ok {
		return 0, false
	}
	return 2 * (r.phi - a) / r.b0, true
}

// Rule returns the common-practice range of the effective length of a
// square-ended dipole: L + 1.0·g to L + 1.2·g (common practice, e.g. the
// rule of thumb quoted for normal-conducting accelerator dipoles; the
// coefficient from memory).
func Rule(g Geometry) (lo, hi float64) {
	return g.Length + 1.0*g.Gap, g.Length + 1.2*g.Gap
}

// Side solves the side view and returns the effective length, with the
// change from the solve on a mesh twice as coarse as its estimate.
func Side(g Geometry, opt Options) (*Result, error) {
	if !(g.Gap > 0) || !(g.Length > 0) || !(g.Height > 0) {
		panic("efflen: Side needs a positive gap, length and height")
	}
	if opt.Size == 0 {
		opt.Size = g.Gap / 40
	}
	if opt.Reach == 0 {
		opt.Reach = 2 * g.Gap
	}
	fine, err := side(g, opt)
	if err != nil {
		return nil, err
	}
	c := opt
	c.Size *= 2
	coarse, err := side(g, c)
	if err != nil {
		return nil, err
	}
	fine.Estimate = math.Abs(fine.LEff - coarse.LEff)
	return fine, nil
}

// side solves the quarter side view on one mesh.
func side(g Geometry, opt Options) (*Result, error) {
	d, l2, yt := g.Gap/2, g.Length/2, g.Gap/2+g.Height
	r := opt.Radius
	if r == 0 {
		r = 30 * math.Max(l2+g.Height, 10*g.Gap)
	}
	if r <= math.Hypot(l2, yt) {
		return nil, fmt.Errorf("efflen: the boundary radius %g m must clear the iron (%g m from the centre)", r, math.Hypot(l2, yt))
	}
	const (
		normal = 2 // flux-normal: mid-plane, iron surfaces
		zero   = 3 // A = 0: the boundary arc, the centre plane above the iron
		inflow = 4 // A = φ: the centre plane under the pole
	)
	// Counter-clockwise: mid-plane, arc, centre plane above the iron,
	// iron top, iron end, pole face, centre plane under the pole.
	b := mesh.Polygon{
		X:           []float64{0, r, 0, 0, l2, l2, 0},
		Y:           []float64{0, 0, r, yt, yt, d, d},
		Sweep:       []float64{0, math.Pi / 2, 0, 0, 0, 0, 0},
		EdgeMarkers: []int32{normal, zero, zero, normal, normal, normal, inflow},
	}
	h := opt.Size
	size := mesh.SizeField{
		Global: r / 10,
		Points: []mesh.SizePoint{{X: l2, Y: d, Size: h}, {X: l2, Y: yt, Size: 4 * h}},
		Lines: []mesh.SizeLine{
			{X0: 0, Y0: 0, X1: l2 + 20*g.Gap, Y1: 0, Size: 4 * h},
			{X0: 0, Y0: d, X1: l2, Y1: d, Size: 4 * h},
		},
		Grading: 0.25,
	}
	in, err := mesh.BuildInput(nil, b, mesh.GraphOptions{ChordTol: 1e-4 * r})
	if err != nil {
		return nil, fmt.Errorf("efflen: side view: %w", err)
	}
	m, err := mesh.Triangulate(in, mesh.Options{Order: 2, Size: size})
	if err != nil {
		return nil, fmt.Errorf("efflen: side view: %w", err)
	}
	const phi = 1e-3 // Wb/m; the problem is linear, the ratio does not depend on it
	p := &solver.Problem{Mesh: m, Materials: []solver.Material{materials.Linear{MuR: 1}},
		Boundary: map[int32]solver.Condition{normal: solver.FluxNormal}}
	tol := 1e-9 * r
	for i := range m.X {
		if math.Abs(m.X[i]) < tol && m.Y[i] <= d+tol {
			p.Fixed = append(p.Fixed, solver.NodeValue{Node: int32(i), A: phi})
		}
	}
	s, err := solver.Solve(p, solver.Options{})
	if err != nil {
		return nil, fmt.Errorf("efflen: side view: %w", err)
	}
	_, _, b0, ok := s.At(0, 0)
	if !ok || !(b0 != 0) {
		return nil, fmt.Errorf("efflen: side view: no field at the centre")
	}
	b0 = math.Abs(b0)
	res := &Result{Geometry: g, Nodes: m.NumNodes(), sol: s, phi: phi, b0: b0}
	res.Whole = 2 * phi / b0
	res.Reach = opt.Reach
	if res.LEff, ok = res.Within(l2 + opt.Reach); !ok {
		return nil, fmt.Errorf("efflen: the reach %g m beyond the iron passes the boundary", opt.Reach)
	}
	res.K = (res.LEff - g.Length) / g.Gap
	// The profile: fine under the pole and beyond its end, coarser far out.
	for z := 0.0; z < r; {
		_, _, by, ok := s.At(z, 0)
		if ok {
			res.Z, res.Ratio = append(res.Z, z), append(res.Ratio, by/b0)
		}
		step := g.Gap / 20
		if z > l2+10*g.Gap {
			step = (z - l2) / 20
		}
		z += step
	}
	return res, nil
}
