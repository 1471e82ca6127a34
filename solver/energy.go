package solver

import (
	"math"
	"sort"

	"gonum.org/v1/gonum/integrate/quad"

	"polegap/internal/compsum"
)

// Energies returns the stored magnetic energy W = ∫ ∫₀^B H·dB dV and the
// co-energy W' = ∫ ∫₀^H B·dH dV = ∫ B·H dV − W of the solution: J per
// metre of depth (planar) or J for the full revolution (axisymmetric).
// The field is sampled with the quadrature rule of the stiffness, so the
// energies are those of the discrete problem that was solved: W = W' =
// ½λI of a linear model hold to rounding, W + W' = λI of one coil holds
// to the Newton tolerance, and W' equals ∫₀^I λ dI' along the discrete
// excitation curve to the accuracy of the density's rule (the co-energy
// functional is the one whose gradient the Newton residual is). The energy density at each
// point is EnergyDensity's. Magnets' −M·B term is not included; in an
// Exterior region the density carries the image factor of its
// reluctivity.
func (s *Solution) Energies() (w, wco float64) {
	as := s.as
	nt := as.m.NumTriangles()
	mats := s.Problem.Materials
	tabs := make([]energyTable, len(mats))
	for r, mat := range mats {
		if mat != nil {
			tabs[r] = newEnergyTable(mat, breaks(mat))
		}
	}
	// Fixed contiguous chunks, each summed with compensation, then added
	// in order: the same result run to run for a given worker count.
	nw := as.workers()
	part := make([][2]compsum.Sum, nw)
	parallelRange(nt, nw, func(k, t0, t1 int) {
		var ew elemWork
		sum := &part[k]
		for t := t0; t < t1; t++ {
			as.gather(t, s.A, &ew)
			x0, y0, a, b, c, d, det := as.affine(t)
			reg := as.m.Region[t]
			mat := mats[reg]
			ext, isExt := as.ext[reg]
			curved := as.m.IsCurved(t)
			var et, ct float64
			for q := range as.rule.W {
				var wt, x, y float64
				if curved {
					wt, x, y = as.curlCurved(q, &ew)
				} else {
					wt, x, y = as.curlAt(t, q, &ew, x0, y0, a, b, c, d, det)
				}
				if isExt {
					wt *= ((x-ext.CX)*(x-ext.CX) + (y-ext.CY)*(y-ext.CY)) / (ext.Radius * ext.Radius)
				}
				var bx, by float64
				for i := 0; i < as.nn; i++ {
					bx += ew.a[i] * ew.c[i][0]
					by += ew.a[i] * ew.c[i][1]
				}
				e, ce := tabs[reg].density(mat, bx*bx+by*by)
				et += wt * e
				ct += wt * ce
			}
			sum[0].Add(et)
			sum[1].Add(ct)
		}
	})
	var tw, tc compsum.Sum
	for i := range part {
		tw.Add(part[i][0].Value())
		tc.Add(part[i][1].Value())
	}
	w, wco = tw.Value(), tc.Value()
	if as.axi {
		w *= 2 * math.Pi
		wco *= 2 * math.Pi
	}
	return w, wco
}

// Energy returns the stored energy W of Energies.
func (s *Solution) Energy() float64 {
	w, _ := s.Energies()
	return w
}

// Panel width (T) of the composite Gauss–Legendre rule of EnergyDensity,
// and its 3-point nodes and weights on [0, 1], computed once by gonum's
// quad.Legendre (they agree to rounding with Abramowitz and Stegun,
// Handbook of Mathematical Functions, 1964, table 25.4: ±√(3/5), 0 with
// weights 5/9, 8/9 mapped to [0, 1]).
const panelB = 0.02

var gl3x, gl3w = legendre3()

func legendre3() (x, w [3]float64) {
	quad.Legendre{}.FixedLocations(x[:], w[:], 0, 1)
	return x, w
}

// EnergyDensity returns the energy density w = ∫₀^|B| ν(b²) b db and the
// co-energy density w' = ν(|B|²)|B|² − w (J/m³) of a material at
// b2 = |B|² (T²). For a linear material w = w' = ν b2 / 2 exactly. A
// curve that lists its points (a Table method returning H and B, as
// materials.Curve has) is integrated by 3-point Gauss–Legendre on panels
// of at most 0.02 T broken at its flux densities, where the
// interpolant's second derivative jumps; any other material on panels
// of 0.02 T from 0. A single rule over [0, |B|²] is not enough: ν(b²)
// bends sharply near 0 and at the knee.
func EnergyDensity(mat Material, b2 float64) (w, wco float64) {
	return energyDensity(mat, breaks(mat), b2)
}

// tabled is a B-H curve given by a table (materials.Curve): Table returns
// its points (A/m, T), increasing.
type tabled interface {
	Table() (h, b []float64)
}

// breaks returns the flux densities of a tabled curve's points, or nil.
func breaks(mat Material) []float64 {
	if tb, ok := mat.(tabled); ok {
		_, bs := tb.Table()
		return bs
	}
	return nil
}

// energyDensity is EnergyDensity with the curve's break points given.
func energyDensity(mat Material, bs []float64, b2 float64) (w, wco float64) {
	nu, w, done := linearDensity(mat, b2)
	if done {
		return w, w
	}
	b := math.Sqrt(b2)
	lo := 0.0
	for _, bk := range bs {
		if bk <= lo {
			continue
		}
		if bk >= b {
			break
		}
		w += glPanels(mat, lo, bk)
		lo = bk
	}
	last := 0.0
	if n := len(bs); n > 0 {
		last = bs[n-1]
	}
	w += lastSegment(mat, lo, b, last)
	return w, nu*b2 - w
}

// linearDensity returns ν(b2) and, with done set, the density of a zero
// field or of a linear material (exact, no panels); otherwise the caller
// integrates.
func linearDensity(mat Material, b2 float64) (nu, w float64, done bool) {
	if !(b2 > 0) {
		return 0, 0, true
	}
	nu, dnu := mat.Nu(b2)
	if dnu == 0 {
		if nu0, _ := mat.Nu(0); nu0 == nu {
			return nu, 0.5 * nu * b2, true
		}
	}
	return nu, 0, false
}

// lastSegment integrates ν(b²) b db from the last break point lo below b
// up to b. Past the table's last point (last) the curve goes on with
// slope μ0: H is linear in B there and one 3-point panel is exact (panels
// of panelB would take 5e9 steps at an absurd 1e8 T).
func lastSegment(mat Material, lo, b, last float64) float64 {
	if lo > 0 && lo == last {
		return glPanel(mat, lo, b)
	}
	return glPanels(mat, lo, b)
}

// maxPanels bounds the panels of glPanels: at 0.02 T each they reach
// 80 T, far past any iron's saturation; beyond, the panels widen (a
// smooth ν is integrated well by fewer, and an absurd field such as 1e8 T
// ends in microseconds instead of minutes).
const maxPanels = 4096

// glPanel returns ∫ ν(b²) b db over [b0, b1] by one 3-point Gauss–Legendre
// panel.
func glPanel(mat Material, b0, b1 float64) float64 {
	h := b1 - b0
	var s float64
	for i := range gl3x {
		bi := b0 + gl3x[i]*h
		ni, _ := mat.Nu(bi * bi)
		s += gl3w[i] * ni * bi
	}
	return s * h
}

// energyTable holds ∫₀^b ν(b²) b db at the break points of a tabled
// curve, summed segment by segment exactly as energyDensity sums them, so
// that density needs only the panels of the last, partial segment and
// returns energyDensity's values bit for bit: the integral up to a point
// on a steep curve far into saturation takes a hundred panels, each
// solution's energies one such integral per quadrature point.
type energyTable struct {
	ends []float64 // the break points energyDensity integrates to, increasing
	cum  []float64 // the integral from 0 to each
}

// newEnergyTable integrates mat up to each of its break points bs.
func newEnergyTable(mat Material, bs []float64) energyTable {
	var t energyTable
	lo, w := 0.0, 0.0
	for _, bk := range bs {
		if bk <= lo {
			continue
		}
		w += glPanels(mat, lo, bk)
		lo = bk
		t.ends = append(t.ends, bk)
		t.cum = append(t.cum, w)
	}
	return t
}

// density is energyDensity(mat, bs, b2) for the table of mat and bs.
func (t energyTable) density(mat Material, b2 float64) (w, wco float64) {
	nu, w, done := linearDensity(mat, b2)
	if done {
		return w, w
	}
	b := math.Sqrt(b2)
	lo := 0.0
	if j := sort.SearchFloat64s(t.ends, b); j > 0 {
		lo, w = t.ends[j-1], t.cum[j-1]
	}
	last := 0.0
	if n := len(t.ends); n > 0 {
		last = t.ends[n-1]
	}
	w += lastSegment(mat, lo, b, last)
	return w, nu*b2 - w
}

// glPanels returns ∫ ν(b²) b db over [b0, b1] by 3-point Gauss–Legendre
// on panels of at most panelB.
func glPanels(mat Material, b0, b1 float64) float64 {
	n := int(math.Min(math.Ceil((b1-b0)/panelB), maxPanels))
	if n < 1 {
		n = 1
	}
	h := (b1 - b0) / float64(n)
	var w float64
	for k := 0; k < n; k++ {
		lo := b0 + float64(k)*h
		var s float64
		for i := range gl3x {
			bi := lo + gl3x[i]*h
			ni, _ := mat.Nu(bi * bi)
			s += gl3w[i] * ni * bi
		}
		w += s * h
	}
	return w
}
