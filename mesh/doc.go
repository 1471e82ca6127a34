// Package mesh turns a planar straight-line graph into a quality triangle
// mesh for the finite-element solver.
//
// # Provides
//
//   - Orient2D, InCircle, InDiametralCircle, NearPoint, NearSegment: exact
//     geometric predicates (Shewchuk 1997 adaptive filter with an exact
//     expansion fallback). Every geometric decision of the package goes
//     through them.
//   - SegmentsNear, SegmentsCross, PointInPolygon, ZeroArea,
//     SelfIntersection: the polygon checks at a resolution d ("closer than
//     d counts as touching"), decided exactly. BuildInput applies them at
//     GraphOptions.MergeTol and package models validates regions with them,
//     so both accept the same polygons at the same resolution.
//     CrossingPoint locates a crossing for messages and splitting.
//   - Triangulate: constrained Delaunay triangulation of an Input (vertices,
//     marked segments, region seeds), exterior and hole removal, region
//     tagging, Ruppert/Shewchuk Delaunay refinement to a minimum angle
//     (default 28 degrees) and a SizeField, optional second-order nodes.
//   - Mesh.Check: verification of every invariant below; tests and fuzz
//     targets run it on every mesh they make.
//   - BuildInput, Stats, Locator, WriteVTU, Elevate: polygons to Input,
//     quality statistics, point location, VTK export, midside nodes.
//   - AddKelvinDisk, AddKelvinHalfDisk: the exterior of a circle (planar)
//     or of a sphere (axisymmetric half disc on the axis) as a Kelvin
//     image meshed beside the model, with the node pairs joining the rims
//     (open boundaries; ElevateKelvin for second order).
//   - Curved geometry: BuildInput cuts a polygon's arcs into chords whose
//     sagitta is at most GraphOptions.ChordRatio (1/20) of the element
//     size the SizeField asks for at the arc (or an absolute ChordTol), no
//     chord spanning more than 30 degrees, and the chords remember their
//     circle (Input.Arcs, Input.SegmentArc). Refinement splits them at
//     points on the arc, so every mesh vertex on an arc lies on it, and
//     Elevate puts the midside node of each arc edge on the arc: those
//     triangles are curved (Mesh.Curved), isoparametric P2 elements with
//     the quadratic map of their six nodes (curved.go). MapAt, Reference
//     and TriangleArea give the map, its inverse and the exact area;
//     RegionAreas, Stats and the Locator use them.
//
// # Units and conventions
//
// Coordinates are metres. Triangles are counter-clockwise. Edge k of a
// triangle joins corners k+1 and k+2 (mod 3) and faces corner k; Nbr[3t+k]
// is the triangle across edge k, -1 on the boundary; EdgeMarker[3t+k] is the
// marker of the input segment the edge lies on, 0 inside a region. Region[t]
// is the tag of the seed that claimed t, or Input.DefaultRegion.
//
//	      v2
//	      /\
//	e1   /  \   e0
//	    /    \
//	  v0------v1
//	      e2
//
// # Invariants (checked by Mesh.Check)
//
//   - indices in range, array lengths consistent, coordinates finite;
//   - every triangle counter-clockwise with positive area (exact Orient2D);
//   - neighbour symmetry: Nbr[3t+k] = n means n holds the same edge,
//     reversed, and points back at t; both sides carry the same EdgeMarker;
//     every boundary edge carries a marker;
//   - constrained Delaunay: across every unmarked interior edge the
//     opposite corner is not strictly inside the circumcircle (exact
//     InCircle);
//   - minimum angle at least the bound, except angles imposed by the input:
//     an angle between two segments at one corner, the triangles refinement
//     leaves near small input angles (shortest edge joining two segments that
//     share an input vertex, at equal distances from it), and triangles next
//     to frozen segments;
//   - per-region areas equal the polygons' areas to 1e-9 relative (the
//     chorded polygons, for regions with arcs whose chords refinement has
//     not split onto the arc);
//   - EdgeArc consistent across edges, and every curved triangle's
//     Jacobian above a quarter of its corner triangle's.
//
// # Failures
//
// Malformed slices (odd Segments, Markers length, indices out of range,
// markers < 1, Order not 0-2) panic with a "mesh: ..." message. Bad geometry
// returns a typed error: *InputError (non-finite or degenerate input),
// *SegmentsCrossError (segments crossing away from a vertex),
// *TooManyTrianglesError (refinement beyond Options.MaxTriangles),
// *ResolutionError and *StallError (refinement reaching floating-point
// resolution on near-degenerate input). No NaN reaches a Mesh. Check
// returns *CheckError. Duplicate vertices are merged, vertices lying on a
// segment split it, repeated segments keep their first marker.
//
// Triangulate does not modify its Input. Mesh values are plain slices owned
// by the caller. The package keeps no mutable global state (the exact
// predicates take scratch space from a sync.Pool), so Triangulate and the
// predicates are safe for concurrent use on different data.
//
// Triangulate is deterministic: the same Input and Options give the same
// Mesh, bit for bit, on every run on one architecture (Go may fuse
// multiply-adds in Steiner point formulas differently on another).
//
// Meshes without arcs carry nil Arcs, EdgeArc and Curved and are exactly
// the meshes made before curved geometry existed.
//
// Cost: about 1 microsecond of CPU per output triangle for quality meshes
// (1,000,000 triangles in about 1 s), memory about 110 bytes per triangle.
package mesh
