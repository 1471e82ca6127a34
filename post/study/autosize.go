package study

import (
	"math"

	"polegap/mesh"
	"polegap/models"
)

// The automatic size field.
//
// When a model file states no element size (models.MeshControls.Auto),
// SizeField derives one from the geometry instead of meshing everything
// at the default size. It starts from the field the default size gives
// (the default size, the largest model dimension / 30, in every region,
// along every region edge and at every probe, growing to the far-field
// size in the air) and refines at the features that decide a magnet's
// answers (FindFeatures):
//
//   - an air gap between iron faces of width w: sizes of at most
//     w/GapElements everywhere between the faces;
//   - a thin iron part of thickness t: at most t/ThinElements across it;
//   - a coil side or magnet of width b: at most b/CoilElements inside;
//   - an iron corner whose field grows like r^(λ-1) (Corner.Exponent):
//     a point source of the surrounding size times CornerRatio^(3(1-λ)),
//     1/8 of it at a right-angled corner (λ = 2/3), less where the
//     singularity is stronger, growing away by the field's grading.
//
// The sizes at gaps and thin parts come from line sources across the
// feature spaced so that, with the field's grading g, the size midway
// between two lines is still within the bound: lines at spacing
// δ = w/ceil(5 n g) for a bound w/n, each of size w/n - g δ/2 (at least
// 0.9 w/n).
//
// Why these numbers (measured; see autosize_test.go): on the C-core of
// the test and on the embedded examples with their mesh sections removed,
// the gap-centre field and the co-energy of the automatic mesh lie within
// 5e-5 of a reference on the same field scaled by 1/3 (C-core) or 1/2
// (examples), except the mineral separator's gap-centre field (2.7e-4:
// the point lies under a vertex of the chords that stand for its curved
// face, and its value scatters by that much between meshes of this
// size). The gap-centre field and the co-energy hardly depend on
// GapElements (2 to 6 agree within 2e-4 on the bench dipole), but the
// field uniformity over a good-field box does: on the bench dipole ΔB/B
// is 1.0739e-3 on the reference, 1.0699e-3 with 6, 1.1065e-3 with 4 and
// 1.79e-3 with 2. The corners carry the co-energy: on the C-core at 2
// kA-t its error is 5e-4 without corner refinement (ratio 1), 2e-4 with a
// ratio of 1/2, 8e-5 with 1/4 and 3e-5 with 1/8. Convex and re-entrant
// corners matter alike: refining only the re-entrant ones leaves 5e-4 in
// the co-energy at 2 kA-t (the singular field is in the air at the pole
// edges), refining only the convex ones 1.5e-4 in the gap field at 10
// kA-t (the iron saturates at the pole roots).

// Elements across the features of the automatic size field.
const (
	// GapElements: edges no longer than an air gap's width over this, so
	// at least 6 second-order elements span every gap (a line across the
	// gap passes through 19 or more on the test's C-core).
	GapElements = 6
	// ThinElements: edges no longer than a thin iron part's thickness
	// over this.
	ThinElements = 3
	// CoilElements: edges no longer than a coil side's (or magnet's)
	// width over this.
	CoilElements = 3
	// CornerRatio is the size at a right-angled iron corner relative to
	// the size around it; other corners get CornerRatio^(3(1-λ)).
	CornerRatio = 1.0 / 8
)

// facingCos is the cosine of the largest angle between the reversed
// outward normals of two faces that face each other (20 degrees).
var facingCos = math.Cos(20 * math.Pi / 180)

// AutoSizeField returns the automatic size field of m (see the comment
// at the top of autosize.go), whether or not m.Mesh.Auto is set.
// m.Mesh.Size is the base size and m.Mesh.Grading the grading; a
// template's refinements (m.Mesh.Refine) are left out, the features
// take their place.
func AutoSizeField(m *models.Model) mesh.SizeField {
	stated := *m
	stated.Mesh.Auto = false
	stated.Mesh.Refine = nil // a template's refinements: the features replace them
	f := SizeField(&stated)
	ft := FindFeatures(m)
	g := f.Grading
	if g <= 0 {
		g = mesh.DefaultGrading
	}
	for _, gp := range ft.Gaps {
		f.Lines = appendAcross(f.Lines, gp.Faces, gp.Width, GapElements, g)
	}
	for _, tp := range ft.Thin {
		f.Lines = appendAcross(f.Lines, tp.Faces, tp.Thickness, ThinElements, g)
	}
	for _, c := range ft.Sources {
		tag := Tag(c.Region)
		if s := c.Width / float64(CoilElements); s < f.Region[tag] || f.Region[tag] <= 0 {
			f.Region[tag] = s
		}
	}
	// Corners last: their sizes are relative to the field so far.
	corners := make([]mesh.SizePoint, len(ft.Corners))
	for i, c := range ft.Corners {
		h := math.Min(f.At(c.X, c.Y, AirTag), f.At(c.X, c.Y, Tag(c.Region)))
		corners[i] = mesh.SizePoint{X: c.X, Y: c.Y, Size: h * CornerFactor(c.Exponent)}
	}
	f.Points = append(f.Points, corners...)
	return f
}

// CornerFactor returns the size at an iron corner whose field goes as
// r^exponent relative to the size around it: CornerRatio^(-3 exponent),
// CornerRatio at a right-angled corner (exponent -1/3), 1 where there is
// no singularity.
func CornerFactor(exponent float64) float64 {
	return math.Pow(CornerRatio, -3*exponent)
}

// appendAcross appends line sources that keep the size at most w/n
// between the faces (two segments, corresponding ends facing each other)
// with grading g: k+1 lines from one face to the other at spacing w/k,
// each of size w/n - g w/(2k), with k = ceil(5 n g) so that the sizes
// stay between 0.9 w/n and w/n.
func appendAcross(dst []mesh.SizeLine, faces [2][2][2]float64, w float64, n int, g float64) []mesh.SizeLine {
	k := max(1, int(math.Ceil(5*float64(n)*g)))
	s := w/float64(n) - g*w/float64(2*k)
	a, b := faces[0], faces[1]
	for i := 0; i <= k; i++ {
		t := float64(i) / float64(k)
		dst = append(dst, mesh.SizeLine{
			X0: a[0][0] + t*(b[0][0]-a[0][0]), Y0: a[0][1] + t*(b[0][1]-a[0][1]),
			X1: a[1][0] + t*(b[1][0]-a[1][0]), Y1: a[1][1] + t*(b[1][1]-a[1][1]),
			Size: s,
		})
	}
	return dst
}
