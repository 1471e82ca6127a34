package saturation

import "fmt"

// Panic messages for programmer misuse.
const (
	errBLen       = "saturation: one flux density per triangle needed"
	errNoCurve    = "saturation: Region needs a Curve or a Knee"
	errNegative   = "saturation: negative radius, gap, limit or level"
	errNilMesh    = "saturation: nil mesh"
	errPolygonLen = "saturation: polygon needs len(x) == len(y) >= 3"
	errMinTurn    = "saturation: minimum turn must be in [0, 180) degrees"
)

// NoKneeError reports a curve on which no knee was found up to MaxB: the
// ratio H(1.1 B)/H(B) never reached 1.5 (a linear or nearly linear
// material, or a table that stops before saturation).
type NoKneeError struct {
	MaxB     float64 // the highest flux density searched, T
	MaxRatio float64 // the largest H(1.1 B)/H(B) met
}

func (e *NoKneeError) Error() string {
	return fmt.Sprintf("saturation: no knee up to %g T (largest H(1.1B)/H(B) = %.3g < 1.5); give the region a level explicitly", e.MaxB, e.MaxRatio)
}

// EmptyRegionError reports a region tag with no triangles in the mesh.
type EmptyRegionError struct {
	Tag  int32
	Name string
}

func (e *EmptyRegionError) Error() string {
	return fmt.Sprintf("saturation: region %q (tag %d) has no triangles in the mesh", e.Name, e.Tag)
}

// NonFiniteError reports a flux density (or curve value) that is NaN or
// infinite.
type NonFiniteError struct {
	What     string // "B" or "H"
	Triangle int    // triangle index, or -1
	Value    float64
}

func (e *NonFiniteError) Error() string {
	if e.Triangle >= 0 {
		return fmt.Sprintf("saturation: %s = %v at triangle %d is not finite", e.What, e.Value, e.Triangle)
	}
	return fmt.Sprintf("saturation: %s = %v is not finite", e.What, e.Value)
}
