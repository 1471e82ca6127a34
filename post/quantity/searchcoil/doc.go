// Package searchcoil predicts what a search coil reads in a solved field:
// the flux linkage (Wb-turns) of a coil at a position, and the change of
// linkage when the coil moves or the field changes, which is what an
// integrating fluxmeter connected to the coil reads (∫ V dt = −Δλ; the
// sign depends on the wiring, so readings are usually compared in
// magnitude).
//
// # Coils
//
//   - Long: a planar coil of N turns and length L along z whose two sides
//     sit at points P and Q: λ = N L (A(P) − A(Q)), exactly (Stokes'
//     theorem; A is Az in Wb/m). P is the side whose conductors run along
//     +z; the flux counted is the one crossing P→Q along its left normal.
//   - Small: a coil of N turns and area S whose axis points along a
//     direction n at a point: λ = N S B·n. With a Width, B·n is averaged
//     over the coil's width across the axis, exactly from the potential
//     difference of the width's two ends (again Stokes).
//   - Loop: an axisymmetric coaxial loop of N turns at radius r and height
//     z: λ = N 2π r Aφ(r, z), exactly.
//   - Winding: an axisymmetric coil whose N turns fill a rectangular
//     section uniformly: the mean of 2π r Aφ over the section (Gauss-
//     Legendre quadrature) times N.
//
// Units: metres, tesla, Wb/m for A, Wb-turns for λ. Planar coils read a
// planar field, Loop and Winding an axisymmetric one; the Field carries no
// formulation, so the caller keeps them apart.
//
// # Failures
//
// A coil point outside the mesh (or a non-finite field there) gives an
// *OutsideError; no NaN is returned. A coil with non-finite or
// non-positive Turns, Length, Area or radii, a negative Width, a zero
// axis, or a nil Field is programmer misuse and panics with a
// "searchcoil: ..." message (validate user input first). Nothing is
// mutated.
package searchcoil
