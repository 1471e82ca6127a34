// Package probes evaluates a model's named probes on a solution: the field
// at a point, along a line (sampled), and over a box or circle (sampled on
// a grid), with the statistics a magnet designer reads: mean, minimum and
// maximum of |B| and of each component.
//
// Field values are in tesla, the potential in Wb/m (Az planar, Aφ
// axisymmetric), lengths in metres. A sample point outside the mesh is
// counted in Outside and left out of the statistics; a probe with no
// sample inside the mesh reports Valid = false and zero values, never NaN.
package probes
