package gap

import (
	"math"

	"polegap/internal/num"
)

// DefaultEndFraction is the field at the ends of a fringing line, as a
// fraction of B0, above which Fringing marks its result Truncated: 1 %
// (common practice for deciding that the fringe field has died away).
const DefaultEndFraction = 0.01

// FringeOptions describe the gap that a fringing line crosses.
type FringeOptions struct {
	// Gap is the gap length g between the pole faces, m (required).
	Gap float64
	// PoleWidth is the pole width w along the line, m (required): the
	// width over which an ideal gap carries B0.
	PoleWidth float64
	// Edges is the number of pole edges the line runs past; 0 means 2
	// (a line across the whole gap). Use 1 for a line from the middle of
	// a symmetric gap (P) outwards past one edge (Q).
	Edges int
	// AmpereTurns is the magnetomotive force across the gap, A (N I of
	// the coil when the iron takes none of it); 0 leaves GapEff unset.
	AmpereTurns float64
	// EndFraction is the limit on |Bn|/|B0| at the line's ends above
	// which the result is Truncated; 0 means DefaultEndFraction.
	EndFraction float64
}

// Fringe is the fringing of a gap read off the flux crossing its
// mid-plane.
type Fringe struct {
	// Flux is the flux per metre of depth across the line, A(P) − A(Q),
	// Wb/m (positive along the line's left normal).
	Flux float64
	// B0 is the reference field (normal component at the gap centre), T.
	B0 float64
	// Factor is Flux / (B0 w): 1 for an ideal gap without fringing.
	Factor float64
	// WidthEff is the effective pole width Flux / B0 = w + K g, m.
	WidthEff float64
	// K is (WidthEff − w) / g for all edges together, and KPerEdge is K
	// divided by the number of edges: w_eff = w + Edges·KPerEdge·g.
	K, KPerEdge float64
	// GapEff is the effective gap length μ0 NI / B0 (m) when AmpereTurns
	// is given, else 0. It exceeds g by the iron's share of NI.
	GapEff float64
	// EndRatio is max |Bn| at the line's two ends over |B0| (at Q alone
	// when Edges is 1: that line starts in the gap).
	EndRatio float64
	// Truncated is true when EndRatio exceeds the end fraction: the line
	// stops before the fringe field has died away, and Flux, Factor,
	// WidthEff and K are lower bounds. Lengthen the line.
	Truncated bool
}

// Fringing returns the fringing of the gap crossed by the segment p→q,
// laid along the gap's mid-plane and extended well beyond the pole edges
// (to where the field has fallen below about 1 % of b0). b0 is the normal
// component of B at the gap centre (T; the sign of the flux must agree).
// The flux is exact from the potential difference (see Flux). It returns
// an *OutsideError if p or q lie outside the mesh and a *ZeroFieldError if
// b0 is zero or not finite. It panics on a non-positive gap or pole width.
func Fringing(f Field, p, q [2]float64, b0 float64, opt FringeOptions) (Fringe, error) {
	if !(opt.Gap > 0) || !(opt.PoleWidth > 0) || !num.Finite(opt.Gap) || !num.Finite(opt.PoleWidth) {
		panic(errBadGap)
	}
	if opt.Edges < 0 {
		panic(errBadEdges)
	}
	if opt.Edges == 0 {
		opt.Edges = 2
	}
	frac := opt.EndFraction
	if frac == 0 {
		frac = DefaultEndFraction
	}
	if !(frac > 0 && frac < 1) {
		panic(errBadFrac)
	}
	fr := Fringe{B0: b0}
	if b0 == 0 || !num.Finite(b0) {
		return fr, &ZeroFieldError{B0: b0}
	}
	phi, err := Flux(f, p, q)
	if err != nil {
		return fr, err
	}
	l := math.Hypot(q[0]-p[0], q[1]-p[1])
	nx, ny := -(q[1]-p[1])/l, (q[0]-p[0])/l
	ends := [][2]float64{p, q}
	if opt.Edges == 1 {
		ends = ends[1:] // the line starts inside the gap
	}
	for _, pt := range ends {
		_, bx, by, _ := f.At(pt[0], pt[1]) // inside: Flux succeeded
		fr.EndRatio = math.Max(fr.EndRatio, math.Abs(bx*nx+by*ny)/math.Abs(b0))
	}
	fr.Flux = phi
	fr.WidthEff = phi / b0
	fr.Factor = fr.WidthEff / opt.PoleWidth
	fr.K = (fr.WidthEff - opt.PoleWidth) / opt.Gap
	fr.KPerEdge = fr.K / float64(opt.Edges)
	if opt.AmpereTurns != 0 && num.Finite(opt.AmpereTurns) {
		fr.GapEff = num.Mu0 * math.Abs(opt.AmpereTurns) / math.Abs(b0)
	}
	fr.Truncated = fr.EndRatio > frac
	return fr, nil
}

// Reach walks from the point from along the direction dir (any length) in
// steps of step metres, up to limit metres, and returns the first distance
// at which the component of B along n (a unit vector is not needed; n is
// normalised) has fallen below frac·|b0|, interpolated between steps:
// where to end a fringing line. ok is false when the limit or the mesh
// boundary came first; the distance returned is then the last one reached
// inside the mesh. It panics if dir or n is zero, step is not positive or
// frac is not in (0, 1).
func Reach(f Field, from, dir, n [2]float64, b0, frac, step, limit float64) (dist float64, ok bool) {
	if f == nil {
		panic(errNilField)
	}
	dl, nl := math.Hypot(dir[0], dir[1]), math.Hypot(n[0], n[1])
	if !(dl > 0) || !(nl > 0) {
		panic(errSamePoints)
	}
	if !(step > 0) || !(frac > 0 && frac < 1) {
		panic(errBadFrac)
	}
	ux, uy := dir[0]/dl, dir[1]/dl
	nx, ny := n[0]/nl, n[1]/nl
	lim := frac * math.Abs(b0)
	var prevS, prevV float64
	first := true
	for s := 0.0; s <= limit+0.5*step; s += step {
		_, bx, by, in := f.At(from[0]+s*ux, from[1]+s*uy)
		if !in || !num.Finite(bx) || !num.Finite(by) {
			return prevS, false
		}
		v := math.Abs(bx*nx + by*ny)
		if v < lim {
			if first {
				return 0, true
			}
			return prevS + (prevV-lim)/(prevV-v)*(s-prevS), true
		}
		prevS, prevV, first = s, v, false
	}
	return prevS, false
}
