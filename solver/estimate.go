package solver

import (
	"math"
	"sort"
)

// ErrorIndicatorTo writes a Zienkiewicz-Zhu error indicator per triangle
// into dst and returns it with the global estimate
// (O. C. Zienkiewicz, J. Z. Zhu, "A simple error estimator and adaptive
// procedure for practical engineering analysis", IJNME 24, 1987):
//
//	η_T² = ∫_T ν |B* − B_h|² dΩ,   estimate = (Σ η_T²)^½,
//
// where B_h is the solution's flux density and B* the recovered one: the
// area-weighted average of the element values at each node, interpolated
// with the element's basis. The averaging runs per region, so that the
// jump of B across a material interface is not counted as error. ν is
// taken at |B_h|² (the secant reluctivity for a nonlinear material). η² is
// an energy (J per metre of depth, or J for the full revolution when
// axisymmetric), the same norm as Energy. A nil dst is allocated;
// otherwise it must have one entry per triangle.
func (s *Solution) ErrorIndicatorTo(dst []float64) ([]float64, float64) {
	as := s.as
	m := as.m
	nt := m.NumTriangles()
	if dst == nil {
		dst = make([]float64, nt)
	}
	if len(dst) != nt {
		panic(errDstLen)
	}
	// Elements grouped by region.
	order := make([]int32, nt)
	for t := range order {
		order[t] = int32(t)
	}
	sort.SliceStable(order, func(i, j int) bool { return m.Region[order[i]] < m.Region[order[j]] })
	nn := m.NumNodes()
	rec := make([][2]float64, nn)
	wsum := make([]float64, nn)
	var nodes [MaxNodes]int32
	var val [MaxNodes]float64
	var rg [MaxNodes][2]float64
	var total float64
	for lo := 0; lo < nt; {
		reg := m.Region[order[lo]]
		hi := lo
		for hi < nt && m.Region[order[hi]] == reg {
			hi++
		}
		group := order[lo:hi]
		// Recover: average element values at the nodes of this region.
		for _, t32 := range group {
			t := int(t32)
			k := elementNodes(m, t, &nodes)
			_, _, _, _, _, _, det := as.affine(t)
			if m.IsCurved(t) {
				det = 2 * m.TriangleArea(t)
			}
			for i := 0; i < k; i++ {
				xi, eta := as.el.RefNode(i)
				_, bx, by := s.evalElement(t, xi, eta)
				v := nodes[i]
				rec[v][0] += 0.5 * det * bx
				rec[v][1] += 0.5 * det * by
				wsum[v] += 0.5 * det
			}
		}
		for _, t32 := range group {
			k := elementNodes(m, int(t32), &nodes)
			for _, v := range nodes[:k] {
				if wsum[v] > 0 {
					rec[v][0] /= wsum[v]
					rec[v][1] /= wsum[v]
					wsum[v] = -1 // done
				}
			}
		}
		// Integrate ν |B* − B_h|² with the element's rule, two degrees up.
		rule := RuleOfDegree(min(2*as.el.Degree()+2, MaxRuleDegree))
		mat := s.Problem.Materials[reg]
		ext, isExt := as.ext[reg]
		for _, t32 := range group {
			t := int(t32)
			k := elementNodes(m, t, &nodes)
			x0, y0, a, b, c, d, det := as.affine(t)
			curved := m.IsCurved(t)
			var e2 float64
			for q := range rule.W {
				xi, eta := rule.Point(q)
				if curved {
					as.el.EvalTo(val[:], rg[:], xi, eta)
				} else {
					as.el.EvalTo(val[:], nil, xi, eta)
				}
				var rx, ry float64
				for i := 0; i < k; i++ {
					rx += val[i] * rec[nodes[i]][0]
					ry += val[i] * rec[nodes[i]][1]
				}
				_, bx, by := s.evalElement(t, xi, eta)
				nu, _ := mat.Nu(bx*bx + by*by)
				w := rule.W[q] * 0.5 * det
				x, y := x0+a*xi+b*eta, y0+c*xi+d*eta
				if curved {
					var dq float64
					x, y, _, _, _, _, dq = isoAt(m, &nodes, &val, &rg)
					w = rule.W[q] * 0.5 * dq
				}
				if as.axi {
					w *= 2 * math.Pi * x
				}
				if isExt {
					w *= ((x-ext.CX)*(x-ext.CX) + (y-ext.CY)*(y-ext.CY)) / (ext.Radius * ext.Radius)
				}
				e2 += w * nu * ((rx-bx)*(rx-bx) + (ry-by)*(ry-by))
			}
			dst[t] = math.Sqrt(e2)
			total += e2
		}
		// Reset the accumulators touched by this region.
		for _, t32 := range group {
			k := elementNodes(m, int(t32), &nodes)
			for _, v := range nodes[:k] {
				rec[v] = [2]float64{}
				wsum[v] = 0
			}
		}
		lo = hi
	}
	return dst, math.Sqrt(total)
}
