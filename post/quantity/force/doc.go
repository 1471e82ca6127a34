// Package force computes the magnetic force on a part of a solved model:
// by the Maxwell stress tensor integrated over a band of air around the
// part (Stress), and by virtual work, the derivative of the co-energy at
// constant current with the part moved and the model re-meshed
// (VirtualWork).
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
// with a weight g that is 1 on the part and 0 away from it. Stress takes
// g piecewise linear on the triangle corners: 1 on the part, falling
// linearly with the distance from the part (shortest paths along element
// edges through air) to 0 at the band width, and 0 on every node of
// another non-air region. The integrand lives only in the band of air
// elements where g varies, which averages the stress over many element
// layers instead of sampling it on one contour, and is identical to the
// virtual work of J. L. Coulomb ("A methodology for the determination of
// global electromechanical quantities from a finite element analysis and
// its application to the evaluation of magnetic forces, torques and
// stiffness", IEEE Trans. Magn. 19(6), 1983, pp. 2514-2519) with the
// virtual displacement field g spread over the band: the derivative of
// the co-energy at constant current under that local deformation.
//
// Air means a region with a linear material of ν = 1/μ0, no current
// density and no magnetisation. The part must be surrounded by air: a
// part touching another non-air region is a *ContactError (the stress in
// iron across a joint is not the force that separates the joint; model
// the joint as a thin air slit).
//
// # Virtual work
//
// VirtualWork moves the named regions of the model by ±δ, meshes and
// solves each position and returns (W'(+δ) − W'(−δ)) / (2δ), W' the
// co-energy of post/study (the force at constant current). The central
// difference has an error O(δ²); re-meshing adds a noise of the order of
// the discretisation error of W' divided by 2δ, so δ should be small
// against the part but not tiny against the elements (a few per cent of
// the gap is common practice). The outer boundary stays where the
// unmoved model puts it. With an open boundary the model's net current
// must be zero: the co-energy of a net line current in open 2D space is
// infinite (logarithmically), and its finite discrete value depends on
// the exterior mesh; use Stress then.
//
// # Panics and errors
//
// A nil solution, an empty part or a non-positive δ panics with a
// "force: ..." message. A part that is not surrounded by air is a
// *ContactError, a part without elements a *PartError; solver failures
// are returned as they are; no NaN is returned.
package force
