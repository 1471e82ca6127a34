package solver

import (
	"errors"
	"fmt"
	"math"
	"testing"

	"polegap/materials"
)

// For a linear problem with A = 0 on the boundary the three expressions of
// the stored energy agree: ½∫ν|B|² dΩ = ½ aᵀK a = ½∫A J dΩ (Galerkin
// orthogonality with K a = f; e.g. P. P. Silvester, R. L. Ferrari,
// "Finite Elements for Electrical Engineers", 3rd ed., 1996, ch. 3).
// Tolerance 1e-10 relative: rounding in sums over ~1e4 elements.
func TestEnergyIdentity(t *testing.T) {
	for _, form := range []Formulation{Planar, Axisymmetric} {
		for order := 1; order <= 2; order++ {
			name := fmt.Sprintf("%v P%d", form, order)
			m := rectMesh(24, 20, 0, 0.3, -0.2, 0.2, order, func(x, y float64) int32 {
				switch {
				case x > 0.05 && x < 0.1 && math.Abs(y) < 0.05:
					return 1 // coil
				case x > 0.12 && x < 0.2:
					return 2 // iron
				}
				return 0
			})
			p := &Problem{Mesh: m, Formulation: form, Materials: []Material{linear{1}, linear{1}, linear{500}},
				CurrentDensity: []float64{0, 1e6, 0}}
			s, err := Solve(p, Options{})
			checkSolution(t, s, err)
			if err != nil {
				t.Fatalf("%s: %v", name, err)
			}
			w := s.Energy()
			as := s.as
			// a per unknown and f = −r(0).
			a := make([]float64, as.d.n)
			for i, c := range as.d.dof {
				if c >= 0 {
					a[c] = s.A[i]
				}
			}
			f := make([]float64, as.d.n)
			if err := as.assemble(make([]float64, m.NumNodes()), f, true); err != nil {
				t.Fatal(err)
			}
			ka := make([]float64, as.d.n)
			mulVecTo(ka, as.pat.k, a)
			var aka, af float64
			for i := range a {
				aka += a[i] * ka[i]
				af -= a[i] * f[i]
			}
			scale := 1.0
			if form == Axisymmetric {
				scale = 2 * math.Pi
			}
			w2, w3 := 0.5*aka*scale, 0.5*af*scale
			t.Logf("%s: W = %.12g, ½aᵀKa = %.12g, ½∫AJ = %.12g", name, w, w2, w3)
			if math.Abs(w-w2) > 1e-10*w || math.Abs(w-w3) > 1e-10*w {
				t.Errorf("%s: energies differ: %.15g %.15g %.15g", name, w, w2, w3)
			}
		}
	}
}

// Degenerate inputs: zero current gives an exactly zero field; a mesh
// whose potential is fixed nowhere is reported as singular, never as NaN.
func TestZeroAndSingular(t *testing.T) {
	m := rectMesh(4, 4, 0, 1, 0, 1, 1, nil)
	p := &Problem{Mesh: m, Materials: []Material{linear{1}}}
	s, err := Solve(p, Options{})
	checkSolution(t, s, err)
	if err != nil {
		t.Fatal(err)
	}
	for i, a := range s.A {
		if a != 0 {
			t.Fatalf("zero current: A[%d] = %g", i, a)
		}
	}
	if b := s.BTo(nil); b[0] != [2]float64{} {
		t.Errorf("zero current: B = %v", b[0])
	}
	if w := s.Energy(); w != 0 {
		t.Errorf("zero current: W = %g", w)
	}
	// All edges flux-normal: the constant is free.
	p = &Problem{Mesh: m, Materials: []Material{linear{1}}, CurrentDensity: []float64{1},
		Boundary: map[int32]Condition{1: FluxNormal, 2: FluxNormal, 3: FluxNormal, 4: FluxNormal}}
	_, err = Solve(p, Options{})
	var se *SingularError
	if !errors.As(err, &se) {
		t.Fatalf("all flux-normal: got %v, want *SingularError", err)
	}
	// One zero-potential edge fixes it.
	delete(p.Boundary, 3)
	if _, err := Solve(p, Options{}); err != nil {
		t.Errorf("one zero-potential edge: %v", err)
	}
	// A material returning NaN is a typed error.
	p = &Problem{Mesh: m, Materials: []Material{nanMaterial{}}, CurrentDensity: []float64{1}}
	_, err = Solve(p, Options{})
	var me *MaterialError
	if !errors.As(err, &me) {
		t.Errorf("NaN material: got %v, want *MaterialError", err)
	}
	// A non-finite warm start is a problem error, not a NaN solution.
	bad := make([]float64, m.NumNodes())
	bad[3] = math.NaN()
	if _, err := Solve(&Problem{Mesh: m, Materials: []Material{linear{1}}, CurrentDensity: []float64{1}},
		Options{Initial: bad}); !errors.As(err, new(*ProblemError)) {
		t.Errorf("NaN warm start: got %v, want *ProblemError", err)
	}
	// A clockwise triangle is a problem error.
	cw := rectMesh(2, 2, 0, 1, 0, 1, 1, nil)
	cw.Tri[1], cw.Tri[2] = cw.Tri[2], cw.Tri[1]
	if _, err := Solve(&Problem{Mesh: cw, Materials: []Material{linear{1}}}, Options{}); !errors.As(err, new(*ProblemError)) {
		t.Errorf("clockwise triangle: got %v, want *ProblemError", err)
	}
	// A region without a material is a problem error.
	p = &Problem{Mesh: m}
	var pe *ProblemError
	if _, err := Solve(p, Options{}); !errors.As(err, &pe) {
		t.Errorf("no material: got %v, want *ProblemError", err)
	}
}

type nanMaterial struct{}

func (nanMaterial) Nu(float64) (float64, float64) { return math.NaN(), 0 }

// Assembly allocates nothing per element (STYLE.md habit 6): with one
// worker a whole re-assembly allocates nothing at all.
func TestAssemblyAllocations(t *testing.T) {
	for order := 1; order <= 2; order++ {
		m := rectMesh(30, 30, 0, 1, 0, 1, order, nil)
		p := &Problem{Mesh: m, Materials: []Material{linear{1}}, CurrentDensity: []float64{1}}
		d, err := buildDofMap(p)
		if err != nil {
			t.Fatal(err)
		}
		as := newAssembler(p, d, 1, nil)
		A := make([]float64, m.NumNodes())
		r := make([]float64, d.n)
		allocs := testing.AllocsPerRun(5, func() {
			if err := as.assemble(A, r, true); err != nil {
				t.Fatal(err)
			}
		})
		if allocs != 0 {
			t.Errorf("P%d: %g allocations per assembly, want 0", order, allocs)
		}
	}
}

// The energies' break-point table gives EnergyDensity's values bit for
// bit (it sums the same panels in the same order), on a built-in B-H
// curve from zero far into saturation, exactly at its points and between
// them, and on a linear material.
func TestEnergyTableExact(t *testing.T) {
	steel, _, ok := materials.Lookup("low-carbon-steel")
	if !ok {
		t.Fatal("no low-carbon-steel in the library")
	}
	for _, mat := range []Material{steel, linear{1000}} {
		tab := newEnergyTable(mat, breaks(mat))
		bs := breaks(mat)
		if _, lin := mat.(linear); !lin && len(tab.ends) < 5 {
			t.Fatalf("the steel curve has %d break points: not a tabled curve", len(tab.ends))
		}
		var probes []float64
		for b := 0.0; b < 4; b += 0.0137 {
			probes = append(probes, b)
		}
		probes = append(probes, bs...)
		for _, b := range probes {
			w0, c0 := EnergyDensity(mat, b*b)
			w1, c1 := tab.density(mat, b*b)
			if w0 != w1 || c0 != c1 {
				t.Fatalf("%T at %g T: table (%.17g, %.17g), direct (%.17g, %.17g)", mat, b, w1, c1, w0, c0)
			}
		}
	}
}
