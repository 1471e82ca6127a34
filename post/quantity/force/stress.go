package force

import (
	"math"

	"polegap/internal/compsum"
	"polegap/internal/num"
	"polegap/post/study"
	"polegap/solver"
)

// StressOptions control Stress. The zero value picks the band width and
// asks for air all round the part.
type StressOptions struct {
	// Band is the width (m) over which the weight falls from 1 at the
	// part to 0. Zero means DefaultBand: BandLayers times the larger of
	// the median length of the part's boundary edges and the median size
	// of the elements around it, so that the band holds a few layers of
	// elements whatever the grading. The weight is 0 on other bodies and
	// on the outer boundary whatever the width, so a wide band is always
	// safe.
	Band float64
	// Joints lets the part touch other regions (a pole on its yoke): the
	// weight then also falls through the regions the part touches, and
	// the force includes the magnetic stress B⊗H − w' I in that iron
	// across the joint (small beside the gap's B²/(2μ0) while the iron is
	// far from saturation, and the less certain the more it saturates).
	// Without Joints such a part is a *ContactError.
	Joints bool
}

// BandLayers is the default band width in element sizes at the part.
const BandLayers = 3

// Force is a computed force.
type Force struct {
	// F is the force (N): Fx, Fy planar (times Depth); 0, Fz
	// axisymmetric.
	F [2]float64
	// Band is the band width used (m) and Elements the number of
	// elements the stress was integrated over.
	Band     float64
	Elements int
}

// Stress returns the force on the part made of the elements whose region
// tag is in part, by the Maxwell stress over a weighted band of air (see
// the package documentation). It panics if sol is nil or part is empty.
func Stress(sol *solver.Solution, part []int32, opt StressOptions) (Force, error) {
	if sol == nil || sol.Problem == nil || sol.Problem.Mesh == nil {
		panic(errNilSolution)
	}
	if len(part) == 0 {
		panic(errEmptyPart)
	}
	p := sol.Problem
	pt, err := newPart(p, part, opt.Joints)
	if err != nil {
		return Force{}, err
	}
	band := opt.Band
	if !(band > 0) {
		band = pt.defaultBand()
	}
	return pt.stress(sol, pt.band(band), band)
}

// defaultBand is the band width of StressOptions' zero value.
func (pt *part) defaultBand() float64 {
	edge, outside := pt.sizes()
	return BandLayers * math.Max(edge, outside)
}

// stress integrates −T·∇g over the elements where the weight g varies.
func (pt *part) stress(sol *solver.Solution, g []float64, band float64) (Force, error) {
	p := sol.Problem
	m := p.Mesh
	nt := m.NumTriangles()
	deg := study.QuadDegree(m.Order(), p.Formulation)
	if p.Formulation == solver.Axisymmetric || m.Order() == 2 {
		deg = 4 // the stress is quadratic in B; axisymmetric B carries A/r
	}
	f := study.NewQuadField(sol, deg)
	nq := f.NumPoints()
	var fx, fy compsum.Sum
	count := 0
	for t := 0; t < nt; t++ {
		i0, i1, i2 := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		g0, g1, g2 := g[i0], g[i1], g[i2]
		if g0 == g1 && g1 == g2 {
			continue
		}
		count++
		// ∇g of the linear weight on the triangle.
		x0, y0 := m.X[i0], m.Y[i0]
		ja, jb := m.X[i1]-x0, m.X[i2]-x0
		jc, jd := m.Y[i1]-y0, m.Y[i2]-y0
		det := ja*jd - jb*jc
		d1, d2 := g1-g0, g2-g0
		gx := (jd*d1 - jc*d2) / det
		gy := (-jb*d1 + ja*d2) / det
		mat := p.Materials[m.Region[t]]
		curved := m.IsCurved(t)
		var ex, ey float64
		for q := 0; q < nq; q++ {
			qp := f.At(t, q)
			if curved {
				gx, gy = f.LinearGrad(t, q, g0, g1, g2)
			}
			b2 := qp.Bx*qp.Bx + qp.By*qp.By
			nu, _ := mat.Nu(b2)
			_, wco := study.EnergyDensity(mat, b2)
			hx, hy := nu*qp.Bx, nu*qp.By
			hg := hx*gx + hy*gy
			// −T·∇g with T = B⊗H − w' I.
			ex += qp.W * (wco*gx - qp.Bx*hg)
			ey += qp.W * (wco*gy - qp.By*hg)
		}
		fx.Add(ex)
		fy.Add(ey)
	}
	out := Force{Band: band, Elements: count}
	if p.Formulation == solver.Axisymmetric {
		out.F = [2]float64{0, fy.Value()}
	} else {
		out.F = [2]float64{fx.Value() * p.Depth, fy.Value() * p.Depth}
	}
	if !num.Finite(out.F[0]) || !num.Finite(out.F[1]) {
		return Force{}, &NotFiniteError{Value: out.F}
	}
	return out, nil
}
