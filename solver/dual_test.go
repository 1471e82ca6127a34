package solver

import (
	"errors"
	"math"
	"testing"

	"polegap/mesh"
)

// squareIntegral is ∫u over the unit square for −Δu = 1, u = 0 on the
// edges: 1/12 − (16/π⁵) Σ_{m odd} tanh(mπ/2)/m⁵, the stress-function
// series of a bar of square section in torsion (Timoshenko and Goodier,
// Theory of Elasticity, 3rd ed., McGraw-Hill 1970, §109; the double sine
// series summed over one index). It is 0.0351442...
func squareIntegral() float64 {
	s := 0.0
	for m := 1; m < 200; m += 2 {
		fm := float64(m)
		s += math.Tanh(fm*math.Pi/2) / math.Pow(fm, 5)
	}
	return 1.0/12 - 16/math.Pow(math.Pi, 5)*s
}

func boundsOf(t *testing.T, p *Problem) EnergyBounds {
	t.Helper()
	s, err := Solve(p, Options{})
	checkSolution(t, s, err)
	b, err := s.EnergyBounds(Options{})
	if err != nil {
		t.Fatal(err)
	}
	if !(b.Lower <= b.Upper) {
		t.Fatalf("bounds out of order: %g > %g", b.Lower, b.Upper)
	}
	return b
}

// A uniform current in a square at A = 0 all round: the energy per metre
// is ½ μ0 J² ∫u (A = μ0 J u). Both bounds must bracket it on every mesh,
// and their gap shrink as h² (first order) or h⁴ (second order) — the
// energy error of a conforming method is the square of its energy-norm
// error, O(h^p) (Strang and Fix, An Analysis of the Finite Element Method,
// 1973, thm. 3.7). A half model with a flux-normal symmetry edge brackets
// half the energy.
func TestEnergyBoundsSquare(t *testing.T) {
	const J = 1e6
	exact := 0.5 * mu0 * J * J * squareIntegral()
	for _, order := range []int{1, 2} {
		var gaps []float64
		for _, n := range []int{4, 8, 16} {
			m := rectMesh(n, n, 0, 1, 0, 1, order, nil)
			b := boundsOf(t, &Problem{Mesh: m, Materials: []Material{linear{1}}, CurrentDensity: []float64{J}})
			if !b.Guaranteed {
				t.Errorf("P%d n=%d: straight mesh not guaranteed", order, n)
			}
			if b.Lower > exact*(1+1e-12) || b.Upper < exact*(1-1e-12) {
				t.Errorf("P%d n=%d: [%.10g, %.10g] misses %.10g", order, n, b.Lower, b.Upper, exact)
			}
			gaps = append(gaps, (b.Upper-b.Lower)/exact)
			half := rectMesh(n/2, n, 0, 0.5, 0, 1, order, nil)
			hb := boundsOf(t, &Problem{Mesh: half, Materials: []Material{linear{1}}, CurrentDensity: []float64{J},
				Boundary: map[int32]Condition{2: FluxNormal}})
			if hb.Lower > exact/2*(1+1e-12) || hb.Upper < exact/2*(1-1e-12) {
				t.Errorf("P%d n=%d half model: [%.10g, %.10g] misses %.10g", order, n, hb.Lower, hb.Upper, exact/2)
			}
		}
		t.Logf("P%d relative gaps %.3g", order, gaps)
		want := map[int]float64{1: 3, 2: 10}[order] // of 4 and 16 ideally
		for i := 1; i < len(gaps); i++ {
			if r := gaps[i-1] / gaps[i]; r < want {
				t.Errorf("P%d: gap ratio %.3g under halving < %g", order, r, want)
			}
		}
	}
}

// An iron block beside a coil in a box, planar and axisymmetric: the
// bounds of a coarse mesh bracket the energy of a mesh four times finer
// (which lies between them up to its own, much smaller, error).
func TestEnergyBoundsIron(t *testing.T) {
	region := func(x, y float64) int32 {
		switch {
		case x > 0.25 && x < 0.5 && y > 0.25 && y < 0.75:
			return 1 // coil
		case x > 0.5 && x < 0.75 && y > 0.125 && y < 0.875:
			return 2 // iron
		}
		return 0
	}
	for _, c := range []struct {
		f    Formulation
		iron Material
		j    float64
	}{
		{Planar, linear{1000}, 1e6},
		{Axisymmetric, linear{1000}, 1e6},
		{Planar, saturating{MuI: 1000, Bs: 1.6}, 2e7}, // driven to about 2 T
		{Axisymmetric, saturating{MuI: 1000, Bs: 1.6}, 2e7},
	} {
		f := c.f
		prob := func(n int) *Problem {
			return &Problem{Mesh: rectMesh(n, n, 0, 1, 0, 1, 2, region), Formulation: f,
				Materials: []Material{linear{1}, linear{1}, c.iron}, CurrentDensity: []float64{0, c.j, 0},
				Boundary: map[int32]Condition{4: FluxNormal}}
		}
		coarse := boundsOf(t, prob(8))
		if _, nonlinear := c.iron.(saturating); nonlinear == coarse.Guaranteed {
			t.Errorf("%v %T: guaranteed %v", f, c.iron, coarse.Guaranteed)
		}
		fine := boundsOf(t, prob(32))
		t.Logf("%v %T: coarse [%.8g, %.8g] (gap %.2g), fine [%.8g, %.8g] (gap %.2g)", f, c.iron, coarse.Lower, coarse.Upper,
			(coarse.Upper-coarse.Lower)/coarse.Lower, fine.Lower, fine.Upper, (fine.Upper-fine.Lower)/fine.Lower)
		t.Logf("Newton steps of the complementary solve: coarse %d, fine %d", coarse.Steps, fine.Steps)
		// Started from the vector potential's field, Newton's method
		// needs a few steps (from zero it needs 8-15).
		if fine.Steps > 5 {
			t.Errorf("%v %T: %d Newton steps from the warm start", f, c.iron, fine.Steps)
		}
		if fine.Lower < coarse.Lower || fine.Lower > coarse.Upper || fine.Upper > coarse.Upper {
			t.Errorf("%v: fine [%g, %g] not inside coarse [%g, %g]", f, fine.Lower, fine.Upper, coarse.Lower, coarse.Upper)
		}
		if (fine.Upper-fine.Lower)*5 > coarse.Upper-coarse.Lower { // the iron corners' singularities slow the rate below h⁴
			t.Errorf("%v: gap shrank by less than 5 under h/4", f)
		}
	}
}

// Two round conductors carrying ±I in unbounded air (Kelvin open
// boundary): L = (μ0/π)(ln(d/a) + 1/4) per metre, exact for uniform
// currents in round wires (the outside field is that of line currents;
// e.g. Ramo, Whinnery and Van Duzer, Fields and Waves in Communication
// Electronics, 3rd ed. 1994, §4.8 with the internal term of §4.9). The
// polygonal wires differ from round ones by the chord tolerance, far below
// the gap checked here.
func TestEnergyBoundsKelvinPair(t *testing.T) {
	const I, R, a, d = 100.0, 1.0, 0.05, 0.5
	circle := func(cx, cy, r float64, reg, marker int32) mesh.Polygon {
		return mesh.Polygon{X: []float64{cx + r, cx, cx - r, cx}, Y: []float64{cy, cy + r, cy, cy - r},
			Sweep: []float64{math.Pi / 2, math.Pi / 2, math.Pi / 2, math.Pi / 2}, Region: reg, Marker: marker}
	}
	in, err := mesh.BuildInput([]mesh.Polygon{circle(-d/2, 0, a, 1, 2), circle(d/2, 0, a, 2, 2)}, circle(0, 0, R, 0, 5),
		mesh.GraphOptions{MaxArcAngle: 2 * math.Pi / 180, ChordTol: 1e-6})
	if err != nil {
		t.Fatal(err)
	}
	m, err := mesh.Triangulate(in, mesh.Options{Size: mesh.SizeField{Global: 0.08, Grading: 0.08,
		Points: []mesh.SizePoint{{X: -d / 2, Size: a / 4}, {X: d / 2, Size: a / 4}}}})
	if err != nil {
		t.Fatal(err)
	}
	ext, err := mesh.AddKelvinDisk(m, 5, 0, 0, R, 0)
	if err != nil {
		t.Fatal(err)
	}
	ext.ElevateKelvin()
	m = ext.Mesh
	m.Curved = nil // straight P2: the bounds are guaranteed
	area := make([]float64, 3)
	for e := 0; e < m.NumTriangles(); e++ {
		i0, i1, i2 := m.Tri[3*e], m.Tri[3*e+1], m.Tri[3*e+2]
		area[m.Region[e]] += 0.5 * ((m.X[i1]-m.X[i0])*(m.Y[i2]-m.Y[i0]) - (m.X[i2]-m.X[i0])*(m.Y[i1]-m.Y[i0]))
	}
	p := &Problem{Mesh: m, Materials: []Material{linear{1}, linear{1}, linear{1}},
		CurrentDensity: []float64{0, I / area[1], -I / area[2]},
		Boundary:       map[int32]Condition{5: FluxNormal}, Identify: ext.Pairs,
		Fixed: []NodeValue{{Node: ext.Infinity, A: 0}}}
	b := boundsOf(t, p)
	exact := 0.5 * mu0 / math.Pi * (math.Log(d/a) + 0.25) * I * I
	t.Logf("[%.8g, %.8g], formula %.8g, gap %.2g", b.Lower, b.Upper, exact, (b.Upper-b.Lower)/exact)
	if !b.Guaranteed || b.Lower > exact*(1+1e-4) || b.Upper < exact*(1-1e-4) || b.Upper-b.Lower > 0.02*exact {
		t.Errorf("bounds [%g, %g] (guaranteed %v) vs formula %g", b.Lower, b.Upper, b.Guaranteed, exact)
	}
	// One conductor alone: the net current has nowhere to return in a
	// closed (Kelvin) domain, and no complementary field exists.
	p.CurrentDensity = []float64{0, I / area[1], 0}
	s, err := Solve(p, Options{})
	checkSolution(t, s, err)
	var be *BoundsError
	if _, err := s.EnergyBounds(Options{}); !errors.As(err, &be) {
		t.Errorf("net current in a closed domain: got %v, want a *BoundsError", err)
	}
}

func TestEnergyBoundsRefused(t *testing.T) {
	m := rectMesh(4, 4, 0, 1, 0, 1, 1, nil)
	for name, p := range map[string]*Problem{
		"magnet":  {Mesh: m, Materials: []Material{linear{1}}, Magnetization: [][2]float64{{1e5, 0}}},
		"applied": {Mesh: m, Materials: []Material{linear{1}}, Fixed: []NodeValue{{Node: 0, A: 1e-3}}},
		"line":    {Mesh: m, Materials: []Material{linear{1}}, PointCurrents: []PointCurrent{{Node: 12, Current: 1}}},
	} {
		s, err := Solve(p, Options{})
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		var be *BoundsError
		if _, err := s.EnergyBounds(Options{}); !errors.As(err, &be) {
			t.Errorf("%s: got %v, want a *BoundsError", name, err)
		}
	}
}

// The material seen from H: |B| = b(|H|) inverts H = ν(B²)B for any start
// (including one on the far side of the knee, where plain Newton cycles),
// and the co-energy density's derivative is |B| (w'(H) = ∫₀^H B dH', the
// Legendre transform of the energy density; e.g. Hammond, Energy
// Methods in Electromagnetism, Oxford 1981, ch. 2).
func TestHLaw(t *testing.T) {
	l := newHLaw(saturating{MuI: 1000, Bs: 1.6})
	for e := -3.0; e < 9; e += 0.05 {
		h := math.Pow(10, e)
		for _, g := range []float64{0, 1e-3, 0.5, 1.7, 3.5, 1e3} {
			mu, mud, b := l.at(h, g)
			nu, dnu := l.mat.Nu(b * b)
			if math.Abs(nu*b-h) > 1e-10*h || math.Abs(mu-b/h) > 1e-14*mu || math.Abs(mud*(nu+2*dnu*b*b)-1) > 1e-12 {
				t.Fatalf("h %g from %g: b %g gives H %g", h, g, b, nu*b)
			}
		}
		if h < 10 || h > 1e7 {
			continue
		}
		dh := 1e-5 * h
		slope := (l.coEnergyDensity(h+dh) - l.coEnergyDensity(h-dh)) / (2 * dh)
		if _, _, b := l.at(h, 0); math.Abs(slope-b) > 1e-6*b {
			t.Errorf("h %g: dw'/dH %g, |B| %g", h, slope, b)
		}
	}
}
