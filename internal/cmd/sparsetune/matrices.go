package main

import (
	"fmt"
	"math"
	"math/rand/v2"
	"os"

	"polegap/solver/sparse"
)

// matrix is a named test matrix; nx is the grid's cells per side (0 when
// the matrix is not a square grid).
type matrix struct {
	name string
	a    *sparse.CSR
	nx   int
}

// gridSystem is the P1 Laplace matrix on a structured triangulation of the
// unit square with nx×nx cells (each cut along the same diagonal), interior
// nodes moved by up to 0.3 cell sizes (seeded), after removing the
// boundary nodes: SPD with (nx-1)² unknowns. It is the matrix of the
// package's benchmarks (solver/sparse grid_test.go), so the figures of
// solver/sparse/doc.go are reproduced here.
func gridSystem(nx int) *sparse.CSR {
	const jitter = 0.3
	rng := rand.New(rand.NewPCG(1, 1))
	n1 := nx + 1
	h := 1 / float64(nx)
	xy := make([]float64, 2*n1*n1)
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
	tri := make([]int32, 0, 6*nx*nx)
	for j := 0; j < nx; j++ {
		for i := 0; i < nx; i++ {
			a := int32(j*n1 + i)
			b, c, d := a+1, a+int32(n1), a+int32(n1)+1
			tri = append(tri, a, b, d, a, d, c)
		}
	}
	keep := make([]bool, n1*n1)
	for j := 0; j < n1; j++ {
		for i := 0; i < n1; i++ {
			keep[j*n1+i] = i > 0 && j > 0 && i < nx && j < nx
		}
	}
	a, _ := p1Stiffness(xy, tri, nil).Submatrix(keep)
	return a
}

// p1Stiffness assembles the P1 stiffness matrix ∫ ν ∇N_i·∇N_j on the
// triangles, with ν per triangle (nil: 1).
func p1Stiffness(xy []float64, tri []int32, nu []float64) *sparse.CSR {
	a := sparse.PatternFromElements(len(xy)/2, tri, 3)
	for e := 0; e < len(tri); e += 3 {
		v := [3]int32{tri[e], tri[e+1], tri[e+2]}
		var bx, by [3]float64
		for k := 0; k < 3; k++ {
			p, q := v[(k+1)%3], v[(k+2)%3]
			bx[k] = xy[2*p+1] - xy[2*q+1]
			by[k] = xy[2*q] - xy[2*p]
		}
		area := 0.5 * (bx[0]*by[1] - bx[1]*by[0])
		s := 1.0
		if nu != nil {
			s = nu[e/3]
		}
		for r := 0; r < 3; r++ {
			for c := 0; c < 3; c++ {
				a.Val[a.Index(int(v[r]), int(v[c]))] += s * (bx[r]*bx[c] + by[r]*by[c]) / (4 * area)
			}
		}
	}
	return a
}

// cCore is the P1 matrix of the solver's benchmark C-core (solver
// circuit_test.go and bench_test.go): an iron C-core 0.2 m square with
// 0.05 m limbs and a 2 mm gap, two coil sides, in an air box, meshed by a
// tensor grid graded from 5 mm/scale down to 0.25 mm/scale in the gap and
// up to 50 mm at the box; triangles cut along alternating diagonals;
// the outer boundary held at zero (its nodes removed), unknowns numbered
// row by row. The scale is chosen by bisection so that the grid has just
// under the given number of nodes. The values take relative reluctivity 1
// in air and coils and 1/1000 in iron; the orderings use only the pattern.
func cCore(nodes int) *sparse.CSR {
	count := func(scale float64) int {
		xs, ys := cCoreAxes(scale)
		return len(xs) * len(ys)
	}
	lo, hi := 0.1, 100.0
	for hi/lo > 1.001 {
		mid := math.Sqrt(lo * hi)
		if count(mid) < nodes {
			lo = mid
		} else {
			hi = mid
		}
	}
	return cCoreAt(lo)
}

// cCoreAt is the C-core matrix with grid lines cCoreAxes(scale).
func cCoreAt(scale float64) *sparse.CSR {
	xs, ys := cCoreAxes(scale)
	nx, ny := len(xs)-1, len(ys)-1
	xy := make([]float64, 0, 2*(nx+1)*(ny+1))
	for j := 0; j <= ny; j++ {
		for i := 0; i <= nx; i++ {
			xy = append(xy, xs[i], ys[j])
		}
	}
	id := func(i, j int) int32 { return int32(j*(nx+1) + i) }
	tri := make([]int32, 0, 6*nx*ny)
	nu := make([]float64, 0, 2*nx*ny)
	add := func(a, b, c int32) {
		tri = append(tri, a, b, c)
		x := (xy[2*a] + xy[2*b] + xy[2*c]) / 3
		y := (xy[2*a+1] + xy[2*b+1] + xy[2*c+1]) / 3
		nu = append(nu, cCoreNu(x, y))
	}
	for j := 0; j < ny; j++ {
		for i := 0; i < nx; i++ {
			a, b, c, d := id(i, j), id(i+1, j), id(i+1, j+1), id(i, j+1)
			if (i+j)%2 == 0 {
				add(a, b, c)
				add(a, c, d)
			} else {
				add(a, b, d)
				add(b, c, d)
			}
		}
	}
	keep := make([]bool, (nx+1)*(ny+1))
	for j := 0; j <= ny; j++ {
		for i := 0; i <= nx; i++ {
			keep[id(i, j)] = i > 0 && j > 0 && i < nx && j < ny
		}
	}
	a, _ := p1Stiffness(xy, tri, nu).Submatrix(keep)
	return a
}

// cCoreNu is the relative reluctivity at (x, y) (m) of the C-core.
func cCoreNu(x, y float64) float64 {
	const t, W, H, g = 0.05, 0.2, 0.2, 0.002
	switch {
	case x > 0.055 && x < 0.075 && y > 0.06 && y < 0.14, // coil sides
		x > -0.025 && x < -0.005 && y > 0.06 && y < 0.14,
		x < 0 || x > W || y < 0 || y > H,     // air box
		x > t && x < W-t && y > t && y < H-t, // window
		x > W-t && math.Abs(y-H/2) < g/2:     // gap
		return 1
	}
	return 1.0 / 1000
}

// cCoreAxes returns the grid lines of the C-core mesh; scale refines it.
func cCoreAxes(scale float64) (xs, ys []float64) {
	const t, W, H, g = 0.05, 0.2, 0.2, 0.002
	h := 0.005 / scale
	hg := g / 8 / scale
	xs = joinAxes(graded(-0.2, -0.025, 0.05, h), graded(-0.025, -0.005, h, h), graded(-0.005, 0, h, h),
		graded(0, t, h, h), graded(t, 0.055, h, h), graded(0.055, 0.075, h, h), graded(0.075, W-t, h, h),
		graded(W-t, W, h, h), graded(W, 0.4, h, 0.05))
	ys = joinAxes(graded(-0.2, 0, 0.05, h), graded(0, t, h, h), graded(t, 0.06, h, h), graded(0.06, H/2-g/2, h, hg),
		graded(H/2-g/2, H/2+g/2, hg, hg), graded(H/2+g/2, 0.14, hg, h), graded(0.14, H-t, h, h), graded(H-t, H, h, h),
		graded(H, 0.4, h, 0.05))
	return xs, ys
}

// graded returns points from a to b whose spacing grows geometrically
// from about ha to about hb.
func graded(a, b, ha, hb float64) []float64 {
	L := b - a
	if math.Abs(ha-hb) < 1e-12*L {
		n := int(math.Ceil(L / ha))
		out := make([]float64, n+1)
		for i := range out {
			out[i] = a + L*float64(i)/float64(n)
		}
		return out
	}
	q := (L - ha) / (L - hb) // ratio of the series ha q^k summing to L
	n := int(math.Ceil(math.Log(hb/ha)/math.Log(q))) + 1
	if n < 1 {
		n = 1
	}
	e := n - 1
	if n == 1 {
		e = 1
	}
	q = math.Pow(hb/ha, 1/float64(e))
	out := []float64{a}
	var s float64
	w := make([]float64, n)
	for k := 0; k < n; k++ {
		w[k] = math.Pow(q, float64(k))
		s += w[k]
	}
	pos := a
	for k := 0; k < n; k++ {
		pos += L * w[k] / s
		out = append(out, pos)
	}
	out[n] = b
	return out
}

// joinAxes concatenates point lists that share their end points.
func joinAxes(parts ...[]float64) []float64 {
	out := append([]float64(nil), parts[0]...)
	for _, p := range parts[1:] {
		out = append(out, p[1:]...)
	}
	return out
}

// geoND orders the unknowns of gridSystem(nx) by recursive straight-line
// bisection: the ideal separators of A. George, "Nested dissection of a
// regular finite element mesh", SIAM J. Numer. Anal. 10 (1973), a
// yardstick for the graph orderings.
func geoND(nx int) []int32 {
	m := nx - 1
	perm := make([]int32, 0, m*m)
	var rec func(i0, i1, j0, j1 int)
	rec = func(i0, i1, j0, j1 int) {
		if i1 <= i0 || j1 <= j0 {
			return
		}
		if (i1-i0)*(j1-j0) <= 16 {
			for j := j0; j < j1; j++ {
				for i := i0; i < i1; i++ {
					perm = append(perm, int32(j*m+i))
				}
			}
			return
		}
		if i1-i0 >= j1-j0 {
			c := (i0 + i1) / 2
			rec(i0, c, j0, j1)
			rec(c+1, i1, j0, j1)
			for j := j0; j < j1; j++ {
				perm = append(perm, int32(j*m+c))
			}
		} else {
			c := (j0 + j1) / 2
			rec(i0, i1, j0, c)
			rec(i0, i1, c+1, j1)
			for i := i0; i < i1; i++ {
				perm = append(perm, int32(c*m+i))
			}
		}
	}
	rec(0, m, 0, m)
	return perm
}

// readMTX reads a Matrix Market file.
func readMTX(path string) (*sparse.CSR, error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	a, err := sparse.ReadMatrixMarket(f)
	if err != nil {
		return nil, fmt.Errorf("%s: %w", path, err)
	}
	return a, nil
}
