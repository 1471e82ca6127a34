package mesh

import "fmt"

// Panic messages for programmer misuse.
const (
	errNilInput       = "mesh: nil Input"
	errSegmentsOdd    = "mesh: len(Input.Segments) is odd"
	errMarkersLength  = "mesh: len(Input.Markers) != len(Input.Segments)/2"
	errCoordsLength   = "mesh: len(Input.X) != len(Input.Y)"
	errSegmentIndex   = "mesh: segment vertex index out of range"
	errBadOrder       = "mesh: Options.Order must be 0, 1 or 2"
	errMarkerNotPosit = "mesh: segment marker must be >= 1"
)

// InputError reports input that cannot be triangulated, such as a
// non-finite coordinate or fewer than three non-collinear vertices.
type InputError struct {
	Reason string
	Vertex int // offending vertex, or -1
}

func (e *InputError) Error() string {
	if e.Vertex >= 0 {
		return fmt.Sprintf("mesh: vertex %d: %s", e.Vertex, e.Reason)
	}
	return "mesh: " + e.Reason
}

// SegmentsCrossError reports two input segments that cross each other at a
// point that is not a vertex. The graph builder is expected to split them.
type SegmentsCrossError struct {
	Segment, Other int        // input segment indices (Other is -1 if unknown)
	A, B           [2]float64 // end points of Segment
	C, D           [2]float64 // end points of the crossed edge
}

func (e *SegmentsCrossError) Error() string {
	return fmt.Sprintf("mesh: segment %d (%g,%g)-(%g,%g) crosses segment %d (%g,%g)-(%g,%g); split crossing segments at their intersection",
		e.Segment, e.A[0], e.A[1], e.B[0], e.B[1], e.Other, e.C[0], e.C[1], e.D[0], e.D[1])
}

// TooManyTrianglesError reports that the mesh would exceed
// Options.MaxTriangles (typically a size field far too small for the domain,
// or tiny input features).
type TooManyTrianglesError struct {
	Limit     int
	Triangles int // triangles when refinement stopped
}

func (e *TooManyTrianglesError) Error() string {
	return fmt.Sprintf("mesh: refinement stopped at %d triangles, over the limit of %d; enlarge the mesh size or Options.MaxTriangles", e.Triangles, e.Limit)
}

// CheckError reports the first invariant a Mesh violates and how many
// violations Check found.
type CheckError struct {
	Invariant string // short name: "index", "area", "twin", "marker", "delaunay", "angle", "region-area"
	Triangle  int    // first offending triangle, or -1
	Count     int    // number of violations of this invariant
	Detail    string
}

func (e *CheckError) Error() string {
	return fmt.Sprintf("mesh: check %s failed at triangle %d (%d violations): %s", e.Invariant, e.Triangle, e.Count, e.Detail)
}

// ResolutionError reports that refinement needed a vertex closer to existing
// ones than floating-point coordinates can place it, near (X, Y): usually
// input features (vertices almost on segments, nearly overlapping segments)
// far smaller than the domain.
type ResolutionError struct{ X, Y float64 }

func (e *ResolutionError) Error() string {
	return fmt.Sprintf("mesh: refinement reached floating-point resolution near (%g, %g); remove tiny features or near-touching segments there", e.X, e.Y)
}

// StallError reports that refinement kept working without finishing: more
// steps than 8 x MaxTriangles + 10^6 (a safety net; it signals a degenerate
// input such as features at the limit of floating-point resolution).
type StallError struct {
	Steps, Triangles int
}

func (e *StallError) Error() string {
	return fmt.Sprintf("mesh: refinement stalled after %d steps at %d triangles; look for near-touching segments or tiny features", e.Steps, e.Triangles)
}
