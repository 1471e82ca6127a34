package saturation

import (
	"math"

	"polegap/mesh"
)

// DefaultMinTurn is the least turn of an outline, in degrees, that makes
// a vertex a corner for Corners (our choice): a turn of θ leaves an
// interior angle α = π ∓ θ and a field ~ r^(π/α − 1) whose exponent lies
// within about ±0.06 of 0 for θ ≤ 10°, a weak effect next to the −1/3 of a
// right-angled corner; the joints between an arc's chords turn by less.
const DefaultMinTurn = 10.0

// Line is a straight line through (X0, Y0) and (X1, Y1), metres.
type Line struct{ X0, Y0, X1, Y1 float64 }

// CornerOptions control Corners. The zero value uses the defaults.
type CornerOptions struct {
	// MinTurn, degrees, is the least turn of the outline that makes a
	// vertex a corner; 0 means DefaultMinTurn.
	MinTurn float64
	// Mirrors are lines of symmetry of the model: the axis of an
	// axisymmetric model, a box side with a symmetry condition. An edge
	// lying on one is the mirror plane, not a boundary of the iron: at its
	// ends the turn is measured against the mirror image of the other
	// edge, so a face meeting the axis at 90° is no corner.
	Mirrors []Line
}

// Corners returns the geometric corners of the outline p (either
// orientation, first vertex not repeated; arcs as in mesh.Polygon): every
// vertex where the outline turns by more than opt.MinTurn degrees, convex
// or re-entrant, and both ends of every arc. The turn at a vertex is the
// angle between the tangents of its two edges (an arc's tangent at its
// ends, not its chord), so the joints between the chords of a discretized
// arc are not vertices here and never corners. Near every corner the field
// of highly permeable iron is singular or nearly so (see the package
// documentation); the list is what Region.Corners wants. It panics if the
// outline has fewer than 3 vertices, mismatched lengths, or minTurn is
// outside [0, 180).
func Corners(p mesh.Polygon, opt CornerOptions) [][2]float64 {
	x, y, sw := p.X, p.Y, p.Sweep
	n := len(x)
	if n != len(y) || n < 3 || (sw != nil && len(sw) != n) {
		panic(errPolygonLen)
	}
	minTurn := opt.MinTurn
	if !(minTurn >= 0 && minTurn < 180) {
		panic(errMinTurn)
	}
	if minTurn == 0 {
		minTurn = DefaultMinTurn
	}
	sweep := func(i int) float64 {
		if sw == nil {
			return 0
		}
		return sw[i]
	}
	// onMirror returns the direction of the mirror line edge i lies on.
	onMirror := func(i int) (dx, dy float64, ok bool) {
		if sweep(i) != 0 {
			return 0, 0, false
		}
		j := (i + 1) % n
		for _, l := range opt.Mirrors {
			if mesh.Orient2D(l.X0, l.Y0, l.X1, l.Y1, x[i], y[i]) == mesh.Collinear &&
				mesh.Orient2D(l.X0, l.Y0, l.X1, l.Y1, x[j], y[j]) == mesh.Collinear {
				dx, dy = l.X1-l.X0, l.Y1-l.Y0
				d := math.Hypot(dx, dy)
				return dx / d, dy / d, true
			}
		}
		return 0, 0, false
	}
	// tangent returns the unit tangent of edge i at its start (end false)
	// or end (end true), in the direction of travel: the chord turned by
	// ∓ half the sweep.
	tangent := func(i int, end bool) (tx, ty float64) {
		j := (i + 1) % n
		cx, cy := x[j]-x[i], y[j]-y[i]
		a := -sweep(i) / 2
		if end {
			a = -a
		}
		s, c := math.Sincos(a)
		tx, ty = c*cx-s*cy, s*cx+c*cy
		d := math.Hypot(tx, ty)
		return tx / d, ty / d
	}
	// mirrored reflects the unit vector (vx, vy) in the line of unit
	// direction (dx, dy) and reverses it: the tangent of the mirror image
	// of an edge, traversed the other way.
	mirrored := func(vx, vy, dx, dy float64) (float64, float64) {
		dot := vx*dx + vy*dy
		return vx - 2*dot*dx, vy - 2*dot*dy
	}
	cosMax := math.Cos(minTurn * math.Pi / 180)
	var out [][2]float64
	for i := range n {
		h := (i + n - 1) % n
		if x[h] == x[i] && y[h] == y[i] || x[(i+1)%n] == x[i] && y[(i+1)%n] == y[i] {
			continue // a repeated vertex has no direction
		}
		if sweep(h) != 0 || sweep(i) != 0 {
			out = append(out, [2]float64{x[i], y[i]})
			continue
		}
		ix, iy := tangent(h, true)
		ox, oy := tangent(i, false)
		dxh, dyh, mh := onMirror(h)
		dxi, dyi, mi := onMirror(i)
		switch {
		case mh && mi:
			continue // between two mirror planes: inside the mirrored body
		case mh:
			ix, iy = mirrored(ox, oy, dxh, dyh)
		case mi:
			ox, oy = mirrored(ix, iy, dxi, dyi)
		}
		if ix*ox+iy*oy < cosMax {
			out = append(out, [2]float64{x[i], y[i]})
		}
	}
	return out
}
