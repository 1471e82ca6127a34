package solver

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/stat"
)

// unitNu is a material with ν = 1 (m/H), for manufactured solutions.
type unitNu struct{}

func (unitNu) Nu(float64) (float64, float64) { return 1, 0 }

// fieldErrors returns the L2 norm of A_h − A and the energy norm
// (∫ |B_h − B|² dΩ)^½ (dΩ = r dr dz axisymmetric), integrated with the
// degree-6 Dunavant rule on every triangle.
func fieldErrors(s *Solution, exact func(x, y float64) (a, bx, by float64)) (l2, energy float64) {
	rule := RuleOfDegree(6)
	as := s.as
	for t := 0; t < as.m.NumTriangles(); t++ {
		x0, y0, a, b, c, d, det := as.affine(t)
		for q := range rule.W {
			xi, eta := rule.Point(q)
			x, y := x0+a*xi+b*eta, y0+c*xi+d*eta
			w := rule.W[q] * 0.5 * det
			if as.axi {
				w *= x
			}
			ah, bxh, byh := s.evalElement(t, xi, eta)
			ae, bxe, bye := exact(x, y)
			l2 += w * (ah - ae) * (ah - ae)
			energy += w * ((bxh-bxe)*(bxh-bxe) + (byh-bye)*(byh-bye))
		}
	}
	return math.Sqrt(l2), math.Sqrt(energy)
}

// slope fits log(err) = p log(h) + c by least squares and returns p.
func slope(h, e []float64) float64 {
	x, y := make([]float64, len(h)), make([]float64, len(e))
	for i := range h {
		x[i], y[i] = math.Log(h[i]), math.Log(e[i])
	}
	_, p := stat.LinearRegression(x, y, nil, false)
	return p
}

// Manufactured solutions (P. J. Roache, "Code verification by the method
// of manufactured solutions", J. Fluids Eng. 124, 2002): the source is
// computed from a chosen smooth A, and the a priori estimate for Lagrange
// elements of degree k, ‖B − B_h‖ = O(h^k) in the energy norm and
// ‖A − A_h‖ = O(h^(k+1)) in L2 (S. C. Brenner, L. R. Scott, "The
// Mathematical Theory of Finite Element Methods", 3rd ed., 2008, thm 5.4.8
// and sec. 5.7), is asserted as a fitted log-log slope within 0.2.
func TestManufacturedConvergence(t *testing.T) {
	type mcase struct {
		name   string
		form   Formulation
		exact  func(x, y float64) (a, bx, by float64)
		source func(x, y float64) float64
	}
	pi := math.Pi
	cases := []mcase{
		{
			// A = sin(πx) sin(πy) on the unit square, −ΔA = 2π² A.
			name: "planar",
			form: Planar,
			exact: func(x, y float64) (float64, float64, float64) {
				return math.Sin(pi*x) * math.Sin(pi*y), pi * math.Sin(pi*x) * math.Cos(pi*y), -pi * math.Cos(pi*x) * math.Sin(pi*y)
			},
			source: func(x, y float64) float64 { return 2 * pi * pi * math.Sin(pi*x) * math.Sin(pi*y) },
		},
		{
			// Aφ = r(1 − r²) sin(πz) on [0,1]²: Br = −∂A/∂z,
			// Bz = (1/r) ∂(rA)/∂r = (2 − 4r²) sin(πz), and
			// J = −∂²A/∂z² − ∂/∂r((1/r) ∂(rA)/∂r) = (8r + π²(r − r³)) sin(πz).
			name: "axisymmetric",
			form: Axisymmetric,
			exact: func(r, z float64) (float64, float64, float64) {
				return r * (1 - r*r) * math.Sin(pi*z), -r * (1 - r*r) * pi * math.Cos(pi*z), (2 - 4*r*r) * math.Sin(pi*z)
			},
			source: func(r, z float64) float64 { return (8*r + pi*pi*(r-r*r*r)) * math.Sin(pi*z) },
		},
	}
	for _, c := range cases {
		for order := 1; order <= 2; order++ {
			name := fmt.Sprintf("%s P%d", c.name, order)
			var hs, el2, een []float64
			for _, n := range []int{8, 16, 32} {
				m := rectMesh(n, n, 0, 1, 0, 1, order, nil)
				p := &Problem{Mesh: m, Formulation: c.form, Materials: []Material{unitNu{}}}
				s := solveWithSource(t, p, c.source)
				l2, en := fieldErrors(s, c.exact)
				hs = append(hs, 1/float64(n))
				el2 = append(el2, l2)
				een = append(een, en)
			}
			pe, pl := slope(hs, een), slope(hs, el2)
			t.Logf("%s: energy errors %.3g, slope %.3f; L2 errors %.3g, slope %.3f", name, een, pe, el2, pl)
			if math.Abs(pe-float64(order)) > 0.2 {
				t.Errorf("%s: energy-norm order %.3f, want %d ± 0.2", name, pe, order)
			}
			if math.Abs(pl-float64(order+1)) > 0.2 {
				t.Errorf("%s: L2 order %.3f, want %d ± 0.2", name, pl, order+1)
			}
			// Absolute cap: the finest energy error (h = 1/32) against
			// the interpolation estimate C h^k |A|_{k+1} with C ≈ 1.
			if cap := math.Pow(pi, float64(order+1)) * math.Pow(hs[2], float64(order)); een[2] > cap {
				t.Errorf("%s: finest energy error %.3g > cap %.3g", name, een[2], cap)
			}
		}
	}
}

// solveWithSource solves p with a space-dependent current density added
// through the assembler's test hook.
func solveWithSource(t *testing.T, p *Problem, src func(x, y float64) float64) *Solution {
	t.Helper()
	if err := p.validate(); err != nil {
		t.Fatal(err)
	}
	opt := Options{}.withDefaults()
	d, err := buildDofMap(p)
	if err != nil {
		t.Fatal(err)
	}
	as := newAssembler(p, d, opt.Workers, nil)
	as.source = src
	s := &Solution{Problem: p, NumUnknowns: d.n, as: as}
	if err := newton(as, opt, s, opt.linearSolver(d.n), false); err != nil {
		t.Fatal(err)
	}
	return s
}

// Patch test (B. M. Irons, A. Razzaque, 1972; O. C. Zienkiewicz,
// R. L. Taylor, "The Finite Element Method", vol. 1, ch. 10): on a
// distorted mesh with the boundary held at a linear potential, the
// solution reproduces it exactly (tolerance 1e-10, rounding only).
// The quadratic element also reproduces a harmonic quadratic, x² − y².
func TestPatch(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for order := 1; order <= 2; order++ {
		for _, f := range []struct {
			name string
			fn   func(x, y float64) float64
			deg  int
		}{
			{"linear", func(x, y float64) float64 { return 1 + 2*x - 3*y }, 1},
			{"harmonic quadratic", func(x, y float64) float64 { return x*x - y*y + x*y }, 2},
		} {
			if f.deg > order {
				continue
			}
			name := fmt.Sprintf("P%d %s", order, f.name)
			m := rectMesh(6, 5, 0, 2, 0, 1, 1, nil)
			// Distort the interior vertices by up to 0.3 h.
			for i := range m.X {
				if m.X[i] > 1e-9 && m.X[i] < 2-1e-9 && m.Y[i] > 1e-9 && m.Y[i] < 1-1e-9 {
					m.X[i] += 0.3 * (2*rng.Float64() - 1) / 3
					m.Y[i] += 0.3 * (2*rng.Float64() - 1) / 5
				}
			}
			m = finishMesh(m.X, m.Y, m.Tri, m.Region, func(x, y float64) int32 { return 1 }, order)
			var fixed []NodeValue
			for i := range m.X {
				if math.Abs(m.X[i]) < 1e-9 || math.Abs(m.X[i]-2) < 1e-9 || math.Abs(m.Y[i]) < 1e-9 || math.Abs(m.Y[i]-1) < 1e-9 {
					fixed = append(fixed, NodeValue{Node: int32(i), A: f.fn(m.X[i], m.Y[i])})
				}
			}
			p := &Problem{Mesh: m, Materials: []Material{linear{1}}, Fixed: fixed}
			s, err := Solve(p, Options{})
			checkSolution(t, s, err)
			if err != nil {
				t.Fatalf("%s: %v", name, err)
			}
			var worst float64
			for i := range m.X {
				worst = math.Max(worst, math.Abs(s.A[i]-f.fn(m.X[i], m.Y[i])))
			}
			if worst > 1e-10 {
				t.Errorf("%s: largest nodal error %g > 1e-10", name, worst)
			}
		}
	}
}
