// Package export writes a solved field for outside viewers: the mesh and
// the solution as a VTK XML unstructured grid (.vtu, the open VTK file
// format, ASCII), through mesh.WriteVTU.
//
// # Arrays written
//
//	A       per node      vector potential, Wb/m (Az planar, Aφ axisymmetric)
//	B       per triangle  flux density at the centroid, 2 components, T
//	                      (Bx, By planar; Br, Bz axisymmetric)
//	B_abs   per triangle  |B|, T
//	H       per triangle  field strength ν(|B|²) B − M, 2 components, A/m
//	mu_r    per triangle  relative permeability 1/(μ0 ν(|B|²)) at the
//	                      triangle's B: B/(μ0 H) for a soft material, 1 in
//	                      air; for a magnet its recoil permeability
//	J       per triangle  source current density of the region, A/m²
//	region  per triangle  region tag (always, written by mesh.WriteVTU)
//
// With Options.NodalB, a smoothed nodal flux density "B_nodal" (per node,
// 2 components) is added for smooth colouring.
//
// # Contract
//
// Nothing is mutated. Writing to a temporary file and renaming it (atomic
// output) is the caller's business. A non-finite value makes WriteVTU
// return mesh's *NonFiniteError before anything is written; a material
// whose reluctivity is not finite and positive gives a *MaterialError. A
// nil solution, problem or mesh is programmer misuse and panics with an
// "export: ..." message.
package vtu
