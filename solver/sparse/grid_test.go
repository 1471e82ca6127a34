package sparse_test

import (
	"math/rand/v2"

	"polegap/solver/sparse"
)

// gridMesh returns a structured triangulation of the unit square with
// nx×nx cells, each split into two triangles, and interior nodes moved by
// up to jitter cell sizes (seeded), so the P1 matrix is a general FE
// matrix rather than the 5-point stencil.
func gridMesh(nx int, jitter float64) (xy []float64, tri []int32) {
	rng := rand.New(rand.NewPCG(1, 1))
	n1 := nx + 1
	h := 1 / float64(nx)
	xy = make([]float64, 2*n1*n1)
	for j := 0; j < n1; j++ {
		for i := 0; i < n1; i++ {
			x, y := float64(i)*h, float64(j)*h
			if i > 0 && j > 0 && i < nx && j < nx {
				x += jitter * h * (rng.Float64() - 0.5)
				y += jitter * h * (rng.Float64() - 0.5)
			}
			xy[2*(j*n1+i)], xy[2*(j*n1+i)+1] = x, y
		}
	}
	tri = make([]int32, 0, 6*nx*nx)
	for j := 0; j < nx; j++ {
		for i := 0; i < nx; i++ {
			a := int32(j*n1 + i)
			b, c, d := a+1, a+int32(n1), a+int32(n1)+1
			tri = append(tri, a, b, d, a, d, c)
		}
	}
	return xy, tri
}

// p1Stiffness assembles the P1 Laplace stiffness matrix (plus mass*M
// lumped) on the mesh with PatternFromElements and CSR.Index.
func p1Stiffness(xy []float64, tri []int32, mass float64) *sparse.CSR {
	n := len(xy) / 2
	a := sparse.PatternFromElements(n, tri, 3)
	for e := 0; e < len(tri); e += 3 {
		v := [3]int32{tri[e], tri[e+1], tri[e+2]}
		var bx, by [3]float64
		for k := 0; k < 3; k++ {
			p, q := v[(k+1)%3], v[(k+2)%3]
			bx[k] = xy[2*p+1] - xy[2*q+1]
			by[k] = xy[2*q] - xy[2*p]
		}
		area := 0.5 * (bx[0]*by[1] - bx[1]*by[0])
		for r := 0; r < 3; r++ {
			for c := 0; c < 3; c++ {
				k := a.Index(int(v[r]), int(v[c]))
				a.Val[k] += (bx[r]*bx[c] + by[r]*by[c]) / (4 * area)
			}
			k := a.Index(int(v[r]), int(v[r]))
			a.Val[k] += mass * area / 3
		}
	}
	return a
}

// gridSystem is the P1 Laplace matrix on an nx×nx grid after removing the
// boundary nodes (zero Dirichlet condition): SPD with (nx-1)^2 unknowns.
func gridSystem(nx int, jitter float64) *sparse.CSR {
	xy, tri := gridMesh(nx, jitter)
	a := p1Stiffness(xy, tri, 0)
	n1 := nx + 1
	keep := make([]bool, a.N)
	for j := 0; j < n1; j++ {
		for i := 0; i < n1; i++ {
			keep[j*n1+i] = i > 0 && j > 0 && i < nx && j < nx
		}
	}
	b, _ := a.Submatrix(keep)
	return b
}

// randomSPD returns a random sparse symmetric matrix made strictly
// diagonally dominant with a positive diagonal, hence SPD (Gershgorin).
func randomSPD(n int, perRow int, rng *rand.Rand) *sparse.CSR {
	t := sparse.NewTriplet(n, n*(2*perRow+1))
	rowAbs := make([]float64, n)
	for i := 0; i < n; i++ {
		for k := 0; k < perRow; k++ {
			j := rng.IntN(n)
			if j == i {
				continue
			}
			v := rng.Float64()*2 - 1
			t.Add(i, j, v)
			t.Add(j, i, v)
			rowAbs[i] += abs(v)
			rowAbs[j] += abs(v)
		}
	}
	for i := 0; i < n; i++ {
		t.Add(i, i, rowAbs[i]+0.1+rng.Float64())
	}
	return t.ToCSR()
}

func abs(x float64) float64 {
	if x < 0 {
		return -x
	}
	return x
}

func nan() float64 { z := 0.0; return z / z }
