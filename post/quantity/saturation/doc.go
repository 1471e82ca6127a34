// Package saturation reports how far each iron region of a solved magnet
// is driven into saturation: the peak |B| (the largest mean |B| over a
// disc of stated radius), the raw largest |B| and where, the area-weighted
// mean |B|, the fraction of the region's area above its curve's knee (and
// above further levels), and a pass/fail check of the peak against a user
// limit.
//
// # The knee
//
// Knee defines the knee of a B-H curve as the smallest flux density B_k at
// which a further 10 % rise in B takes a 50 % rise in H:
//
//	H(1.1 B_k) = 1.5 H(B_k).
//
// This is the knee-point rule that instrument-transformer standards apply
// to a core's excitation curve (the knee-point e.m.f. of IEC 61869-2,
// whose r.m.s. voltage is proportional to B and exciting current to H for
// a uniform core; cited from memory). It marks the onset of saturation,
// where the steel stops acting as a good flux conductor: below it H grows
// barely faster than B (H(1.1B)/H(B) ≈ 1.1 on the initial part of the
// curve), above it each extra tenth of a tesla costs sharply more
// ampere-turns. Locally the rule means d ln B / d ln H ≈ ln 1.1 / ln 1.5
// ≈ 0.24. On the built-in curves it falls at 1.0 T (cast iron), 1.1-1.25 T
// (silicon steel, low-carbon steel, pure iron) and 1.76 T (cobalt-iron);
// see ExampleKnee. The rule needs only the curve, is independent of units
// and of the table's spacing, and, unlike the point of maximum
// permeability (where B/H peaks, well down the curve), sits where the
// excitation starts to cost extra. Options.Levels adds fractions above
// further levels (say 1.6 and 1.8 T) for a fuller picture.
//
// # Corners and the peak
//
// At a corner of highly permeable iron the field is singular: near a
// corner of interior angle α the potential goes as r^(π/α) and the field
// as r^(π/α − 1) (J. Meixner, "The behavior of electromagnetic fields at
// edges", IEEE Trans. Antennas Propag. 20(4), 1972; J. D. Jackson,
// "Classical Electrodynamics", 3rd ed. 1998, section 2.11, for the 2D
// wedge; from memory). Convex and re-entrant corners alike: at a 90° notch
// in the iron (α = 3π/2) and at the 90° edge of a pole face (the air
// wedge outside it is 3π/2, and the normal flux density is continuous into
// the iron) |B| grows like r^(−1/3), weakened but not removed where the
// iron saturates. Refining the mesh there raises the raw maximum without
// bound (on the embedded examples by up to 49 % over two halvings of the
// mesh), so Max says more about the mesh than about the magnet; it is
// reported, flagged MaxAtCorner when it lies within Radius of a listed
// corner, and never checked.
//
// The figure that is checked is Peak: the largest mean |B| over a disc of
// radius R centred anywhere in the region, the disc clipped to the region.
// It converges because r^(−1/3) is integrable: a corner's elements weigh
// in the disc's integral as (h/R)^(5/3). Excluding corners instead (the
// largest |B| beyond a radius R from every corner) does not converge as
// well: that maximum sits on the exclusion circle, and which element
// centroids fall just outside it moves its value by about (h/R)/3; on the
// embedded examples, at the same radius, it changed by up to 4 % over two
// halvings of the mesh where the peak changed by 0.7 % at most. Corners
// returns the corners of an outline: every vertex where it turns by more
// than DefaultMinTurn (10°), both ends of every arc, with mirror lines
// (the axis of an axisymmetric model) taken into account. The peak needs
// no corners; they seed its search and flag the raw maximum.
//
// The default radius is the larger of GapFraction (1/2) of the model's gap
// (a disc one gap across: a saturated patch much smaller than the gap
// barely changes the field the gap sees) and SizeFraction (1/20) of the
// iron's size, the longer side of the box around the regions analysed,
// which sets it for a model without a gap or with a gap small against its
// iron (two 1 mm gaps next to 30 mm legs). Both are our choice; common
// practice ignores a small neighbourhood of corners but no standard fixes
// its size. A peak at a smaller radius is sharper but needs a finer mesh
// to converge.
//
// # Inputs, units, failures
//
// Plain inputs: the mesh, the flux density per triangle (T, as
// solver.Solution.BTo returns it: the centroid value, which for
// second-order elements is also the element mean), optionally each
// triangle's own linear field at its corners (Options.LinearB, for
// second-order elements), and a Region per iron region. Lengths in
// metres, areas in m². Each triangle counts whole, by its centroid value,
// in the mean, the area fractions and the raw maximum. The mean over a
// disc is an area mean in the plane of the model, for axisymmetric models
// too. Nothing is mutated.
// Numerical outcomes are typed errors: *NoKneeError (no knee on the curve,
// e.g. a linear material), *EmptyRegionError, *NonFiniteError; no NaN is
// returned. A flux-density slice of the wrong length, a nil curve without
// a knee, a negative radius, gap or limit, or an outline of fewer than 3
// vertices is programmer misuse and panics with a "saturation: ..."
// message.
package saturation
