package solver

import (
	"fmt"
	"math"
	"testing"
)

// The scatter through the precomputed position map must equal a plain
// dense assembly of the same element matrices (tolerance 1e-12 relative:
// the same sums in another order), with Dirichlet rows and columns
// removed and identified nodes summed; the matrix must be symmetric.
func TestAssemblyMatchesDense(t *testing.T) {
	for _, form := range []Formulation{Planar, Axisymmetric} {
		for order := 1; order <= 2; order++ {
			for _, workers := range []int{1, 2} {
				name := fmt.Sprintf("%v P%d workers=%d", form, order, workers)
				m := rectMesh(40, 30, 0, 1, 0, 1, order, func(x, y float64) int32 {
					if x > 0.5 {
						return 1
					}
					return 0
				})
				// Periodic in y between bottom and top, flux-normal there.
				var pairs [][2]int32
				bottom := map[float64]int32{}
				for i := range m.X {
					if m.Y[i] == 0 {
						bottom[m.X[i]] = int32(i)
					}
				}
				for i := range m.X {
					if m.Y[i] == 1 && m.X[i] > 0 && m.X[i] < 1 {
						pairs = append(pairs, [2]int32{bottom[m.X[i]], int32(i)})
					}
				}
				p := &Problem{Mesh: m, Formulation: form, Materials: []Material{linear{1}, linear{7}},
					Boundary: map[int32]Condition{1: FluxNormal, 3: FluxNormal}, Identify: pairs}
				d, err := buildDofMap(p)
				if err != nil {
					t.Fatal(err)
				}
				as := newAssembler(p, d, workers, nil)
				if len(as.pat.parts) != workers && d.n >= 2000 {
					t.Fatalf("%s: %d parts", name, len(as.pat.parts))
				}
				A := make([]float64, m.NumNodes())
				r := make([]float64, d.n)
				if err := as.assemble(A, r, true); err != nil {
					t.Fatal(err)
				}
				dense := make(map[[2]int32]float64)
				var w elemWork
				var maxAbs float64
				for e := 0; e < m.NumTriangles(); e++ {
					as.gather(e, A, &w)
					as.element(e, &w, true)
					for i := 0; i < as.nn; i++ {
						ri := d.dof[w.nodes[i]]
						for j := 0; j < as.nn; j++ {
							cj := d.dof[w.nodes[j]]
							if ri >= 0 && cj >= 0 {
								dense[[2]int32{ri, cj}] += w.ke[i][j]
								maxAbs = math.Max(maxAbs, math.Abs(w.ke[i][j]))
							}
						}
					}
				}
				k := as.pat.k
				stored := 0
				for i := 0; i < k.N; i++ {
					for q := k.RowPtr[i]; q < k.RowPtr[i+1]; q++ {
						c := k.Col[q]
						want, ok := dense[[2]int32{int32(i), c}]
						if !ok || math.Abs(k.Val[q]-want) > 1e-12*maxAbs {
							t.Fatalf("%s: entry (%d,%d) = %g, dense %g (present %v)", name, i, c, k.Val[q], want, ok)
						}
						if math.Abs(k.Val[q]-k.At(int(c), i)) > 1e-12*maxAbs {
							t.Fatalf("%s: not symmetric at (%d,%d)", name, i, c)
						}
						stored++
					}
				}
				if stored != len(dense) {
					t.Fatalf("%s: %d stored entries, dense assembly has %d", name, stored, len(dense))
				}
			}
		}
	}
}

// The closed-form planar P1 kernel equals the generic quadrature kernel
// (1e-13 relative: rounding), linear and nonlinear, with magnetisation.
func TestP1KernelMatchesGeneric(t *testing.T) {
	m := rectMesh(6, 5, 0, 0.02, 0, 0.01, 1, nil)
	for i := range m.X { // shear so that no two triangles are alike
		m.X[i] += 0.3 * m.Y[i] * m.Y[i] / 0.01
	}
	p := &Problem{Mesh: m, Materials: []Material{saturating{1000, 1.5}}, CurrentDensity: []float64{3e6},
		Magnetization: [][2]float64{{1e5, -2e4}}}
	d, err := buildDofMap(p)
	if err != nil {
		t.Fatal(err)
	}
	fast := newAssembler(p, d, 1, nil)
	gen := newAssembler(p, d, 1, nil)
	gen.generic = true
	A := make([]float64, m.NumNodes())
	for i := range A {
		A[i] = 0.02 * math.Sin(300*m.X[i]+100*m.Y[i]) // |B| up to a few T
	}
	var wf, wg elemWork
	for e := 0; e < m.NumTriangles(); e++ {
		fast.gather(e, A, &wf)
		gen.gather(e, A, &wg)
		fast.element(e, &wf, true)
		gen.element(e, &wg, true)
		var scale float64
		for i := 0; i < 3; i++ {
			for j := 0; j < 3; j++ {
				scale = math.Max(scale, math.Abs(wg.ke[i][j]))
			}
		}
		for i := 0; i < 3; i++ {
			if math.Abs(wf.re[i]-wg.re[i]) > 1e-13*(math.Abs(wg.re[i])+scale*1e-3) {
				t.Fatalf("triangle %d: residual %d: %g vs %g", e, i, wf.re[i], wg.re[i])
			}
			for j := 0; j < 3; j++ {
				if math.Abs(wf.ke[i][j]-wg.ke[i][j]) > 1e-13*scale {
					t.Fatalf("triangle %d: k[%d][%d]: %g vs %g", e, i, j, wf.ke[i][j], wg.ke[i][j])
				}
			}
		}
	}
}
