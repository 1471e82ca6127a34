// Package probes evaluates a model's named probes on a solution: the field
// at a point, along a line (sampled), and over a box or circle (sampled on
// a grid), with the statistics a magnet designer reads: mean, minimum and
// maximum of |B| and of each component.
//
// Field values are in tesla, the potential in Wb/m (Az planar, Aφ
// axisymmetric), lengths in metres. A sample point outside the mesh is
// counted in Outside and left out of the statistics; a probe with no
// sample inside the mesh reports Valid = false and zero values, never NaN.
//
// # Point probes on an interface
//
// Where materials of different permeability meet, B jumps: its normal
// component is continuous and its tangential one scales with μ (Jackson,
// Classical Electrodynamics, 3rd ed. 1998, section 5.9), so a point on
// the interface has two fields. A point probe on a Sided field (a
// solver.Solution, or a Recovered field over one) that lies within
// solver.SideTol of the mesh's extent (1e-9 of its largest coordinate,
// the model's own resolution) of an edge or corner between regions whose
// reluctivities differ by more than 1e-9 relative is on an interface:
// Result.Sides holds the field of each region there, and Point is the
// side of the lowest permeability (Reported), usually air: a probe on a
// pole face stands for the gap field, which a Hall probe or search coil,
// always in air, reads. Line, box and circle samples on an interface read
// whichever element the locator finds.
package probes
