// Package force computes the magnetic force on a part of a solved model:
// by the Maxwell stress tensor integrated over a band of air around the
// part (Stress), by virtual work, the derivative of the co-energy at
// constant current with the part moved (VirtualWork), and both with their
// difference as an estimate of the error (Estimate).
//
// # Units
//
// Newtons. A planar force is the force per metre times the problem's
// Depth (the whole magnet, ends not included); an axisymmetric force is
// the axial force on the body of revolution (the radial one is zero by
// symmetry and reported as 0). Positions and displacements in metres.
//
// # Maxwell stress over a weighted band
//
// With the stress T = B⊗H − w' I (w' the co-energy density; in air
// T = ν0 (B⊗B − ½|B|² I)) the force on everything inside a closed
// surface S in air is ∮_S T·n dS. Averaging over a family of such
// surfaces gives the volume form
//
//	F = −∫ T·∇g dV
//
// with a weight g that is 1 on the part and 0 away from it, on other
// bodies and on the outer boundary (where the integration by parts that
// gives the formula needs it). Stress takes g piecewise linear on the
// triangle corners: 1 on the part, falling linearly with the distance
// from the part (shortest paths along element edges through air) to 0
// at the band width, and 0 on every node of another non-air region or of
// the outer boundary. The integrand lives only in the band of air
// elements where g varies, which averages the stress over several
// element layers instead of sampling it on one contour, and is identical
// to the virtual work of J. L. Coulomb ("A methodology for the
// determination of global electromechanical quantities from a finite
// element analysis and its application to the evaluation of magnetic
// forces, torques and stiffness", IEEE Trans. Magn. 19(6), 1983,
// pp. 2514-2519) with the virtual displacement field g: the derivative
// of the co-energy at constant current under that local deformation.
//
// The default band is BandLayers (3) times the larger of the median
// length of the part's boundary edges and the median size of the air
// elements across them, so that it spans a few element layers where the
// mesh grows fast away from a finely divided part.
//
// Air means a region with a linear material of ν = 1/μ0, no current
// density and no magnetisation. The part must be surrounded by air: a
// part touching another non-air region is a *ContactError (the stress in
// iron across a joint is not the force that separates the joint; model
// the joint as a thin air slit), unless StressOptions.Joints lets the
// weight fall through the regions it touches (the attraction between
// the poles of a yoke, whose arm is cut from the back leg at the joint).
//
// # Virtual work
//
// VirtualWork moves the part by ±δ and returns (W'(+δ) − W'(−δ)) / (2δ),
// W' the co-energy of post/study (the force at constant current). By
// default the part moves on the solved mesh (study.Study.Deformed): its
// nodes rigidly, the air around it by the fraction d_b/(d_p + d_b) of
// the step (d_p, d_b the path distances from the part and from the
// nearest other body or the outer boundary), the topology unchanged. The
// co-energy is then smooth in δ and the central difference converges as
// δ² to Coulomb's derivative with that deformation, which spreads over
// all the air around the part where Stress's band is narrow. δ is
// DeltaFraction (a hundredth) of the median length of the part's
// boundary edges: the element size at the part, not the mesh's global
// size, which can be large against a finely divided part. Meshing each
// position afresh (VirtualWorkOptions.Remesh) adds the noise of the
// mesher's changed decisions, of the order of the co-energy's
// discretisation error over 2δ (up to 6 % measured on a wire over iron),
// and is kept only as a cross-check with a large δ; with an open
// boundary it needs zero net current (the co-energy of a net line
// current in open 2D space is infinite, and its finite discrete value
// depends on the exterior mesh, which re-meshing changes). The outer
// boundary stays where the unmoved model puts it.
//
// # Error estimate
//
// Both forces weigh the stress of the same discrete field, over a narrow
// band and over all the room around the part, and would agree for the
// exact field; Estimate reports their difference as the estimate of the
// error of either. On a wire over an iron block it was within a factor 2
// of the larger of the two actual errors on the mesher's default meshes
// (first and second order, errors from 2e-3 to 5 %). It is an estimate,
// not a bound: a field error that reaches the whole neighbourhood of the
// part alike (a coarse mesh on a distant iron face) escapes it.
//
// # Panics and errors
//
// A nil solution, an empty part, a negative δ or a zero direction panics
// with a "force: ..." message. A part that is not surrounded by air is a
// *ContactError, a part without elements a *PartError, an unknown region
// name a *RegionError, a step that folds an element a *study.FoldError;
// solver failures are returned as they are; no NaN is returned.
package force
