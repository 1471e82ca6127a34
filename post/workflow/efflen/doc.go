// Package efflen computes the effective magnetic length of a dipole: a
// planar cross-section gives the field per metre of depth, but the real
// magnet ends, and a beam sees the field integral ∫B dz along its path,
// which the ends lengthen beyond the iron. The effective length is
// L_eff = ∫B dz / B0, B0 the field at the magnet's centre.
//
// The side view is the plane through the gap centre along the depth (the
// beam direction z): the iron above the gap — pole and yoke, as tall as
// the cross-section's iron stack above the gap centre — stands over the
// gap for the iron length (the model's depth), and its mirror image below.
// Side solves the air of this view with the iron ideal (infinitely
// permeable: its surfaces are flux-normal boundaries, the classical
// idealisation of fringing by conformal maps), the same idealisation as
// the conformal-map checks of post/quantity/gap. By symmetry one quarter
// is solved: the mid-plane y = 0 is flux-normal, the centre plane z = 0 a
// field line; a flux φ per metre of width enters at the centre, so that
// every field line from the upper iron crosses the mid-plane and
//
//	∫B dz over the mid-plane from −z to z = 2(φ − A(z, 0)),
//
// exactly from the potential, and L_eff = that / B0 with B0 read at the
// centre. The integral is taken to a reach beyond each iron end (two gaps
// by default, Options.Reach): the two-dimensional view's fringe falls off
// far more slowly than a real magnet's, and its whole integral 2φ/B0 is
// an upper bound. Coil ends and saturation are not in the view: the length
// is the geometric one of unsaturated iron (a saturated pole edge shortens
// it).
//
// The common rule L_eff ≈ L_iron + (1.0 … 1.2)·g for a square-ended pole
// (common practice; see Rule) is reported beside the solved value.
//
// Units: metres and tesla.
package efflen
