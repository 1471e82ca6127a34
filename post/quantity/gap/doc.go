// Package gap reads the design quantities of a magnet's air gap off a
// solved planar field: the field profile along a line (and its CSV form),
// the flux crossing a segment and the mean normal field over a pole face,
// the field uniformity over a good-field region and the half-width within
// a tolerance, and the fringing of the gap (fringing factor, effective pole
// width w + k g, effective gap length μ0 NI / B0).
//
// # Inputs and units
//
// Everything reads a Field: the vector potential A (Wb/m) and the flux
// density (Bx, By) (T) at a point, ok = false outside the mesh. A solved
// study's Field() and a *solver.Solution both qualify. Lengths are metres,
// points are [2]float64{x, y}.
//
// # Flux from the potential
//
// In the planar formulation B = curl(A ẑ) = (∂A/∂y, −∂A/∂x), so along a
// segment from P to Q with unit tangent t the component of B along the
// left normal n = (−t_y, t_x) is B·n = −dA/ds, and the flux per metre of
// depth crossing the segment is exactly
//
//	Φ = ∫ B·n ds = A(P) − A(Q)        (Wb/m)
//
// (Stokes' theorem; it holds for the finite-element field too, because the
// discrete A is continuous and B is its curl element by element). Flux,
// MeanNormal and Fringing use this identity; no sampling is involved.
// AxialFlux is the axisymmetric counterpart, 2π r Aφ(r, z) through the disc
// of radius r.
//
// # Failures
//
// A point outside the mesh is an *OutsideError; a centre field of zero (an
// unexcited magnet) is a *ZeroFieldError; too few samples inside the mesh
// are an *EmptyError. No function returns NaN: a field value that is not
// finite counts as outside. Programmer misuse panics with a "gap: ..."
// message: a nil Field, fewer than 2 profile points, a non-positive
// tolerance, gap length or pole width.
//
// Nothing here mutates its inputs; ProfileTo writes into the caller's
// slice (nil or short is grown).
package gap
