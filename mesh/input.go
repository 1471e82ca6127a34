package mesh

// Input is a planar straight-line graph with region seeds, the input of
// Triangulate. Coordinates are metres.
type Input struct {
	X, Y     []float64 // vertices, metres
	Segments []int32   // 2 vertex indices per constrained segment
	Markers  []int32   // one marker (>= 1) per segment, copied to Mesh.EdgeMarker
	// Arcs are circles that segments may lie on, and SegmentArc, when not
	// nil, gives each segment the index in Arcs of the arc it is a chord
	// of, or -1 for a straight segment. Refinement splits such a segment at
	// a point on its arc, and Elevate places the midside node of its edges
	// on the arc (see Mesh.EdgeArc, Mesh.Curved). BuildInput fills both
	// from the polygons' arcs.
	Arcs       []Arc
	SegmentArc []int32
	// Seeds claim regions: every triangle reachable from a seed without
	// crossing a segment gets Seed.Region. A seed with a negative Region
	// marks a hole: its triangles are removed. When two seeds reach the same
	// area the first wins; seeds outside the outer boundary are ignored; a
	// seed exactly on a segment claims one of its sides.
	Seeds []Seed
	// DefaultRegion is the region of triangles inside the outer boundary
	// that no seed reaches.
	DefaultRegion int32
}

// Seed is a point that claims the segment-bounded area around it for Region.
type Seed struct {
	X, Y   float64
	Region int32
}

// Options control Triangulate. The zero value asks for a quality mesh
// (minimum angle 28 degrees) without a size limit, first order.
//
// Triangles outside the outermost segments (reachable from the convex hull
// without crossing a segment) are removed. When Input has no segments, the
// convex hull of the vertices becomes the boundary, with marker 1.
type Options struct {
	// MinAngle is the minimum angle in degrees; 0 means the default 28;
	// a negative value disables quality refinement. Values above 33 are
	// lowered to 33: Delaunay refinement is proven to terminate up to 20.7
	// degrees and in practice stops up to about 33 (Shewchuk 2002, section
	// 4); our random polygon stress runs at 34 mostly ran into MaxTriangles.
	MinAngle float64
	// Size is the target edge length field; the zero value means no limit.
	Size SizeField
	// MaxTriangles makes Triangulate fail with *TooManyTrianglesError when the
	// mesh would exceed it; 0 means 20,000,000.
	MaxTriangles int
	// Order is 1 or 2; 0 means 1.
	Order int
	// Frozen lists segment markers whose segments refinement never splits:
	// their vertices stay exactly the input vertices. Encroachment of a frozen
	// segment is tolerated, and the triangles next to it may stay below
	// MinAngle (see CheckOptions.Frozen) or above the size field when the
	// frozen edges themselves are longer than it.
	Frozen []int32
}

const (
	// DefaultMinAngle is the quality bound used when Options.MinAngle is 0,
	// in degrees.
	DefaultMinAngle = 28.0
	// maxMinAngle caps Options.MinAngle, in degrees.
	maxMinAngle = 33.0
	// DefaultMaxTriangles is used when Options.MaxTriangles is 0.
	DefaultMaxTriangles = 20_000_000
	// DefaultGrading is used when SizeField.Grading is 0.
	DefaultGrading = 0.3
)

// SizeField is a target edge length that varies over the domain. The size at
// a point is the smallest of the global size, the size of the region and the
// point and line sources, each grown by Grading times the distance from it.
//
// Refinement splits every triangle with an edge longer than the size at its
// centroid, and every boundary or interface edge longer than the size at its
// midpoint, so no edge ends up longer than the size; most end up between
// about half and the full size (about 5 triangles per size squared of area
// in the interior).
type SizeField struct {
	Global  float64           // metres, 0 = none
	Region  map[int32]float64 // per region tag, 0 or missing = none
	Points  []SizePoint       // size at a point, growing away from it
	Lines   []SizeLine        // size along a segment, growing away from it
	Grading float64           // growth per metre away from a source; 0 means 0.3
	// Func, if set, is one more size in metres (+Inf or <= 0 for none) at
	// (x, y) in region, for example from an error estimate on a previous
	// solution (adaptive refinement). It must be safe to call repeatedly and
	// should not decrease by more than Grading per metre, or refinement will
	// grade poorly around its minima.
	Func func(x, y float64, region int32) float64
}

// SizePoint asks for edge length Size at (X, Y).
type SizePoint struct{ X, Y, Size float64 }

// SizeLine asks for edge length Size along the segment (X0, Y0)-(X1, Y1).
type SizeLine struct{ X0, Y0, X1, Y1, Size float64 }
