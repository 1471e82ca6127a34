// Package saturation reports how far each iron region of a solved magnet
// is driven into saturation: the largest |B| and where, the area-weighted
// mean |B|, the fraction of the region's area above its curve's knee (and
// above further levels), the largest |B| away from re-entrant corners, and
// a pass/fail check against a user limit.
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
// # Corners
//
// At a re-entrant corner of highly permeable iron (interior angle α > π
// inside the iron) the field is singular, |B| ~ r^(π/α − 1): r^(−1/3) at a
// 90° notch (α = 3π/2). Refining the mesh there raises the raw maximum
// without bound, so it says more about the mesh than about the magnet.
// The report flags a raw maximum that lies within CornerRadius of a
// corner as MaxAtCorner, and gives MaxAway: the maximum over triangles
// whose centroid is farther than CornerRadius from every listed corner.
// The limit check uses MaxAway. ReentrantCorners finds the corners of a
// region polygon. The default radius, 5 % of the square root of the
// region's area, is our choice (common practice is to ignore a small
// neighbourhood of such corners; no standard fixes its size).
//
// # Inputs, units, failures
//
// Plain inputs: the mesh, the flux density per triangle (T, as
// solver.Solution.BTo returns it: the centroid value, which for
// second-order elements is also the element mean) and a Region per iron
// region. Lengths in metres, areas in m². Each triangle counts whole, by
// its centroid value, in the area fractions. Nothing is mutated.
// Numerical outcomes are typed errors: *NoKneeError (no knee on the curve,
// e.g. a linear material), *EmptyRegionError, *NonFiniteError; no NaN is
// returned. A flux-density slice of the wrong length, a nil curve without
// a knee, or a negative radius or limit is programmer misuse and panics
// with a "saturation: ..." message.
package saturation
