// Package models reads polegap's YAML model file: the description of an
// iron-core electromagnet (geometry, materials, coils, boundary, mesh
// controls, probes and a target field) that the mesh, solver and post
// packages turn into answers. Only this package knows the file format; the
// rest of polegap works from the plain Model value it returns.
//
// # Contract
//
// Parse and Load decode a file through yaml.Node, so that every value keeps
// its line and column, then validate everything and fill in defaults.
// YAML anchors, aliases and merge keys (<<) are allowed; merge expansion is
// bounded. A table-file must exist when the model is parsed. On
// any mistake they return a nil *Model and an ErrorList, sorted by position,
// whose entries read "file:line:col: path: what is wrong and what to do".
// They never panic and never return a NaN or an infinity, whatever the
// input (FuzzParse checks this). Model.Errorf lets later stages report
// their own findings (a B-H curve that is not monotone, a mesh that cannot
// be built) at the right place in the file.
//
// # Units
//
// Lengths in the file are in its units (mm, cm, m or in; 1 in = 25.4 mm
// exactly by the international yard and pound agreement of 1959) and are
// converted to metres on load, rounding once. Angles in the file are in
// degrees and are stored in radians. Currents are in ampere, flux densities
// in tesla, field strengths in A/m, temperatures in °C and voltages in volts.
//
// # Invariants of a returned Model
//
//   - Every region is a simple polygon of at least 3 distinct vertices,
//     counter-clockwise (clockwise input is reversed, arcs kept), with
//     non-zero area, no consecutive duplicate vertices and arcs of sweep
//     below 360° in magnitude. Region interiors do not overlap (they may
//     touch and share edges). In an axisymmetric model every region lies in
//     x = r >= 0.
//   - Every region's material is defined in Materials; Materials ends with
//     the implicit "air" and "copper" (linear, relative permeability 1).
//     Curve names are stored as given and resolved by package materials.
//   - Every coil side names an existing region, and no region is a side of
//     two coils or twice of one coil. Sense is +1 or -1; Turns > 0.
//   - Refine.Near names a region or a probe; Target.Probe names a probe.
//   - Boundary.Margins (side -> margin > 0) and Boundary.Box (lower-left
//     corner first) appear only with shape box, Box never with Margins; a
//     Box holds every region and, axisymmetric, starts at x = 0.
//   - Defaults are filled in: Boundary (box, margin 1.0, zero-potential;
//     with a template: circle, margin 1.0, open),
//     Mesh.Size (largest model dimension / 30), Order 1 (2 when
//     Mesh.Auto), MinAngle 28°, Grading 0.3, Chord 0 (arcs follow the
//     local element size: the mesher's chords stay within 1/20 of it);
//     material Stacking 1; magnet MuRecoil 1; line probes 101 samples,
//     circle probes 180. Mesh.Auto is set when the file states no element
//     size (no mesh.size, no region mesh-size, no mesh.refine list).
//
// # Templates
//
// A model may name a template (c-core, h-core, round-pole, solenoid) with
// dimensions instead of, or beside, drawing polygons. The template expands into regions, one coil
// "main", default probes, default mesh refinement and, when dimensions give
// field, a target. The user's own regions, coils and probes are added after
// the template's; one with the same name as a template entry replaces it,
// a mesh refine list replaces the template's, a target replaces its
// target and a boundary mapping replaces its open boundary. The sketches in template_*.go and REFERENCE.md define every
// dimension.
//
// # Keys
//
// REFERENCE.md documents every key of the file, with its units, default and
// allowed values. Top level: name, description, geometry, units, depth,
// template, dimensions, materials, regions, coils, boundary, mesh, probes,
// target.
//
// # Geometry
//
// Validation decides every geometric question (repeated vertices, zero
// area, self-intersection, overlap, inside or on an edge) with package
// mesh's exact predicates, at a resolution of 1e-9 times the model's
// largest coordinate: features closer than that count as touching. The
// rules are mesh's own (mesh.ZeroArea, mesh.SelfIntersection,
// mesh.PolygonsOverlap), so mesh.BuildInput with MergeTol equal to that
// resolution accepts the straight-edged models Parse accepts and refuses
// the others (TestValidationAgreesWithMesh checks this on near-degenerate
// cases at scales 1e-9 to 1e9 m; arcs are validated on 5° chords and meshed
// on the mesher's). Beyond the mesher, Parse refuses repeated consecutive
// vertices, which BuildInput would drop.
//
// # Panics
//
// Model.Errorf panics on a nil model ("models: nil model"). Examples panics
// only if the embedded files are unreadable, which cannot happen in a
// correct build.
package models
