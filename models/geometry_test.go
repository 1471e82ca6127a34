package models

import (
	"errors"
	"math"
	"strconv"
	"strings"
	"testing"

	"polegap/mesh"
)

// agreeCase is a set of straight-edged regions in units of a scale s, and
// whether they are a valid model. e is 1e-12: far below the resolution of
// validation (1e-9 of the largest coordinate), so features that small count
// as touching; 1e-6 is far above it.
type agreeCase struct {
	name    string
	regions [][][2]float64
	accept  bool
	// atRes marks features within a factor of a few of the resolution
	// itself: they are compared with mesh.BuildInput at MergeTol equal to
	// the resolution only (the pipeline's default MergeTol is 1e-9 of the
	// extent including the margin, a different resolution).
	atRes bool
}

const e12 = 1e-12

var (
	unitSquare = [][2]float64{{0, 0}, {1, 0}, {1, 1}, {0, 1}}
	// notch has vertex 3 on edge 0 when y3 = 0.
	notch = func(y3 float64) [][2]float64 { return [][2]float64{{0, 0}, {1, 0}, {1, 0.2}, {0.5, y3}, {0, 0.2}} }
	box   = func(x0, y0, x1, y1 float64) [][2]float64 {
		return [][2]float64{{x0, y0}, {x1, y0}, {x1, y1}, {x0, y1}}
	}
)

var agreeCases = []agreeCase{
	// One region.
	{name: "square", regions: [][][2]float64{unitSquare}, accept: true},
	{name: "bow tie", regions: [][][2]float64{{{0, 0}, {1, 1}, {1, 0}, {0, 1}}}},
	{name: "vertex on a non-adjacent edge", regions: [][][2]float64{notch(0)}},
	{name: "vertex 1e-12 above a non-adjacent edge", regions: [][][2]float64{notch(e12)}},
	{name: "vertex 1e-12 through a non-adjacent edge", regions: [][][2]float64{notch(-e12)}},
	{name: "vertex 1e-6 above a non-adjacent edge", regions: [][][2]float64{notch(1e-6)}, accept: true},
	{name: "fold back 1e-12 off the line", regions: [][][2]float64{{{0, 0}, {1, 0}, {0.3, e12}, {0.3, 0.5}, {0, 0.5}}}},
	{name: "straight angle 1e-12 off the line", regions: [][][2]float64{{{0, 0}, {0.5, e12}, {1, 0}, {1, 1}, {0, 1}}}, accept: true},
	{name: "spike 1e-12 wide", regions: [][][2]float64{{{0, 0}, {1, 0}, {1, 0.5}, {2, 0.5}, {1, 0.5 + e12}, {1, 1}, {0, 1}}}},
	{name: "spike 1e-6 wide", regions: [][][2]float64{{{0, 0}, {1, 0}, {1, 0.5}, {2, 0.5}, {1, 0.5 + 1e-6}, {1, 1}, {0, 1}}}, accept: true},
	{name: "pinch 1e-12 wide", regions: [][][2]float64{{{0, 0}, {1, 0}, {0.5, 0.5}, {1, 1}, {0, 1}, {0.5, 0.5 + e12}}}},
	{name: "triangle 1e-12 high", regions: [][][2]float64{{{0, 0}, {1, 0}, {0.5, e12}}}},
	{name: "triangle 1e-6 high", regions: [][][2]float64{{{0, 0}, {1, 0}, {0.5, 1e-6}}}, accept: true},
	{name: "collinear", regions: [][][2]float64{{{0, 0}, {0.5, 0}, {1, 0}}}},
	// Two regions.
	{name: "shared edge", regions: [][][2]float64{unitSquare, box(1, 0, 2, 1)}, accept: true},
	{name: "gap 1e-12", regions: [][][2]float64{unitSquare, box(1+e12, 0, 2, 1)}, accept: true},
	{name: "overlap 1e-12", regions: [][][2]float64{unitSquare, box(1-e12, 0, 2, 1)}, accept: true},
	{name: "overlap 1e-12, shorter side", regions: [][][2]float64{unitSquare, box(1-e12, 0.25, 2, 0.75)}, accept: true},
	{name: "overlap 1e-6", regions: [][][2]float64{unitSquare, box(1-1e-6, 0, 2, 1)}},
	{name: "overlap 1e-6, shorter side", regions: [][][2]float64{unitSquare, box(1-1e-6, 0.25, 2, 0.75)}},
	{name: "corner cut by 1e-12", regions: [][][2]float64{unitSquare, {{2, -e12}, {2, 2}, {-e12, 2}}}, accept: true},
	{name: "corner cut by 1e-6", regions: [][][2]float64{unitSquare, {{2, -1e-6}, {2, 2}, {-1e-6, 2}}}},
	{name: "inside", regions: [][][2]float64{unitSquare, box(0.25, 0.25, 0.75, 0.75)}},
	{name: "inside, 1e-12 from an edge", regions: [][][2]float64{unitSquare, box(e12, 0.25, 0.5, 0.75)}},
	{name: "slanted edges crossing near a vertex", regions: [][][2]float64{{{0, 0}, {1, 0.3}, {0.2, 1}}, {{1 - e12, 0.3}, {2, 0}, {2, 1}}}, accept: true},
	// At the resolution d (1e-9 for a largest coordinate of 1, 2e-9 for 2).
	{name: "vertex d/2 above a non-adjacent edge", regions: [][][2]float64{notch(0.5e-9)}, atRes: true},
	{name: "vertex 2d above a non-adjacent edge", regions: [][][2]float64{notch(2e-9)}, accept: true, atRes: true},
	{name: "triangle 3d high (area < d × perimeter)", regions: [][][2]float64{{{0, 0}, {1, 0}, {0.5, 3e-9}}}, atRes: true},
	{name: "triangle 5d high", regions: [][][2]float64{{{0, 0}, {1, 0}, {0.5, 5e-9}}}, accept: true, atRes: true},
	{name: "overlap d/2", regions: [][][2]float64{unitSquare, box(1-1e-9, 0, 2, 1)}, accept: true, atRes: true},
	{name: "overlap 5d", regions: [][][2]float64{unitSquare, box(1-1e-8, 0, 2, 1)}, atRes: true},
}

// agreeScales are the length scales of the table, metres.
var agreeScales = []float64{1e-9, 1e-3, 1, 1e3, 1e9}

// TestValidationAgreesWithMesh parses each case as a model (units m, so
// the coordinates reach validation unrounded) and builds its graph with
// mesh.BuildInput at MergeTol equal to validation's resolution: a model
// Parse accepts must be one BuildInput accepts, and the other way round.
// Cases away from the resolution are also built with BuildInput's default
// MergeTol around a box with the default margin, as the pipeline does.
func TestValidationAgreesWithMesh(t *testing.T) {
	for _, s := range agreeScales {
		for _, c := range agreeCases {
			name := c.name + " at scale " + strconv.FormatFloat(s, 'g', -1, 64)
			var src strings.Builder
			src.WriteString("units: m\ndepth: 1\nregions:\n")
			polys := make([]mesh.Polygon, len(c.regions))
			size := 0.0
			x0, y0, x1, y1 := math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
			for i, r := range c.regions {
				src.WriteString("  - {name: r" + strconv.Itoa(i) + ", material: air, polygon: [")
				p := mesh.Polygon{Region: int32(i + 1)}
				for k, v := range r {
					x, y := v[0]*s, v[1]*s
					if k > 0 {
						src.WriteString(", ")
					}
					src.WriteString("[" + strconv.FormatFloat(x, 'g', -1, 64) + ", " + strconv.FormatFloat(y, 'g', -1, 64) + "]")
					p.X, p.Y = append(p.X, x), append(p.Y, y)
					size = math.Max(size, math.Max(math.Abs(x), math.Abs(y)))
					x0, y0, x1, y1 = math.Min(x0, x), math.Min(y0, y), math.Max(x1, x), math.Max(y1, y)
				}
				src.WriteString("]}\n")
				polys[i] = p
			}
			m, err := Parse("a.yaml", []byte(src.String()))
			modelsOK := err == nil
			if err != nil {
				var list ErrorList
				if !errors.As(err, &list) {
					t.Fatalf("%s: error %v", name, err)
				}
				for _, le := range list {
					if !strings.Contains(le.Msg, "self-intersecting") && !strings.Contains(le.Msg, "zero area") && !strings.Contains(le.Msg, "overlaps") {
						t.Fatalf("%s: not a geometry error: %v", name, le)
					}
				}
			} else if got := resolution(m); got != relTol*size {
				t.Fatalf("%s: resolution %g, want %g", name, got, relTol*size)
			}
			d := 1.0 * math.Max(x1-x0, y1-y0) // the default margin
			bnd := mesh.Polygon{X: []float64{x0 - d, x1 + d, x1 + d, x0 - d}, Y: []float64{y0 - d, y0 - d, y1 + d, y1 + d}}
			_, merr := mesh.BuildInput(polys, bnd, mesh.GraphOptions{MergeTol: relTol * size})
			meshOK := merr == nil
			if modelsOK != c.accept || meshOK != c.accept {
				t.Errorf("%s: models accepts: %v (%v), mesh.BuildInput accepts: %v (%v); want %v", name, modelsOK, err, meshOK, merr, c.accept)
			}
			if c.atRes {
				continue
			}
			if _, derr := mesh.BuildInput(polys, bnd, mesh.GraphOptions{}); (derr == nil) != c.accept {
				t.Errorf("%s: mesh.BuildInput at the default MergeTol: %v; want accept %v", name, derr, c.accept)
			}
		}
	}
}
