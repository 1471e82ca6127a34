package mesh_test

import (
	"bytes"
	"fmt"
	"math"
	"strings"

	"polegap/mesh"
)

// A small invented model: a rectangular steel pole piece (region 1) with a
// rounded face, a coil block (region 2) beside it, in an air box (region 0).
func ExampleBuildInput() {
	pole := mesh.Polygon{
		X:      []float64{0, 0.04, 0.04, 0},
		Y:      []float64{0, 0, 0.06, 0.06},
		Sweep:  []float64{0, 0, 1.0, 0}, // top face: a 1-radian arc bulging up
		Region: 1, Marker: 2,
	}
	coil := mesh.Polygon{
		X:      []float64{0.04, 0.07, 0.07, 0.04},
		Y:      []float64{0.01, 0.01, 0.05, 0.05},
		Region: 2, Marker: 3,
	}
	air := mesh.Polygon{
		X:      []float64{-0.1, 0.2, 0.2, -0.1},
		Y:      []float64{-0.1, -0.1, 0.2, 0.2},
		Region: 0, Marker: 1,
	}
	opt := mesh.GraphOptions{ChordTol: 1e-5}.WithDefaults([]mesh.Polygon{pole, coil}, air)
	in, err := mesh.BuildInput([]mesh.Polygon{pole, coil}, air, opt)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%d seeds, default region %d\n", len(in.Seeds), in.DefaultRegion)

	m, err := mesh.Triangulate(in, mesh.Options{Size: mesh.SizeField{Global: 0.01}})
	if err != nil {
		fmt.Println(err)
		return
	}
	x, y := mesh.DiscretizePolygon(pole, opt)
	areas := m.RegionAreas()
	fmt.Printf("pole: meshed %.6f cm², chorded outline %.6f cm²\n", areas[1]*1e4, mesh.PolygonArea(x, y)*1e4)
	// By hand: 24 cm² of rectangle plus the circular segment R²/2 (θ - sin θ)
	// with R = 0.02/sin(0.5) and θ = 1, 1.37942 cm², less the chording loss
	// R²/2 (θ - n sin(θ/n)) = 0.00274 cm² for the n = 23 chords that
	// ChordTol asks for: 25.3767 cm².
	fmt.Printf("coil: %.6f cm²\n", areas[2]*1e4)
	fmt.Printf("min angle >= 28°: %v\n", m.Stats().MinAngle >= 28)
	// Output:
	// 2 seeds, default region 0
	// pole: meshed 25.376679 cm², chorded outline 25.376679 cm²
	// coil: 12.000000 cm²
	// min angle >= 28°: true
}

// Where is a probe point, and with what weights do the corners' values
// combine there?
func ExampleLocator() {
	// The unit square split along its diagonal from (0,0) to (1,1).
	m := &mesh.Mesh{
		X: []float64{0, 1, 1, 0}, Y: []float64{0, 0, 1, 1}, NumVertices: 4,
		Tri:        []int32{0, 1, 2, 0, 2, 3},
		Nbr:        []int32{-1, 1, -1, -1, -1, 0},
		Region:     []int32{1, 1},
		EdgeMarker: []int32{1, 0, 1, 1, 1, 0},
	}
	l := mesh.NewLocator(m)
	t, b0, b1, b2, ok := l.Find(0.75, 0.25)
	fmt.Printf("triangle %d, weights %.2f %.2f %.2f, found %v\n", t, b0, b1, b2, ok)
	// A potential linear in x and y is reproduced exactly by the weights.
	a := func(x, y float64) float64 { return 2*x - y }
	v := b0*a(0, 0) + b1*a(1, 0) + b2*a(1, 1)
	fmt.Printf("interpolated %.2f, exact %.2f\n", v, a(0.75, 0.25))
	_, _, _, _, ok = l.Find(1.5, 0.5)
	fmt.Println("outside found:", ok)
	// Output:
	// triangle 0, weights 0.25 0.50 0.25, found true
	// interpolated 1.25, exact 1.25
	// outside found: false
}

func ExampleElevate() {
	m := &mesh.Mesh{
		X: []float64{0, 1, 1, 0}, Y: []float64{0, 0, 1, 1}, NumVertices: 4,
		Tri: []int32{0, 1, 2, 0, 2, 3},
		Nbr: []int32{-1, 1, -1, -1, -1, 0},
	}
	mesh.Elevate(m)
	// 4 corners + 5 edges; the diagonal's midside node is shared.
	fmt.Println("nodes:", m.NumNodes(), "order:", m.Order())
	d := m.Mid[3*0+1] // triangle 0, edge 1: from corner 2 to corner 0
	fmt.Printf("diagonal midpoint (%g, %g), shared: %v\n", m.X[d], m.Y[d], m.Mid[3*1+2] == d)
	// Output:
	// nodes: 9 order: 2
	// diagonal midpoint (0.5, 0.5), shared: true
}

func ExampleMesh_Stats() {
	// An equilateral triangle and a right isosceles one.
	h := math.Sqrt(3) / 2
	m := &mesh.Mesh{
		X: []float64{0, 1, 0.5, 1, 2}, Y: []float64{0, 0, h, 1, 0}, NumVertices: 5,
		Tri:    []int32{0, 1, 2, 1, 4, 3},
		Region: []int32{1, 2},
	}
	s := m.Stats()
	fmt.Printf("min angle %.1f°, mean smallest angle %.1f°, worst aspect %.3f\n", s.MinAngle, s.MeanAngle, s.WorstAspect)
	for _, r := range s.PerRegion {
		fmt.Printf("region %d: %d triangle, %.4f m²\n", r.Region, r.Triangles, r.Area)
	}
	// Output:
	// min angle 45.0°, mean smallest angle 52.5°, worst aspect 1.394
	// region 1: 1 triangle, 0.4330 m²
	// region 2: 1 triangle, 0.5000 m²
}

func ExampleWriteVTU() {
	m := &mesh.Mesh{
		X: []float64{0, 1, 0}, Y: []float64{0, 0, 1}, NumVertices: 3,
		Tri: []int32{0, 1, 2}, Region: []int32{7},
	}
	var buf bytes.Buffer
	err := mesh.WriteVTU(&buf, m, mesh.DataArray{Name: "A_z", PerNode: true, Values: []float64{0, 1e-3, 2e-3}})
	fmt.Println("error:", err)
	fmt.Println(strings.Split(buf.String(), "\n")[3])
	err = mesh.WriteVTU(&buf, m, mesh.DataArray{Name: "B", Values: []float64{math.NaN()}})
	fmt.Println("error:", err)
	// Output:
	// error: <nil>
	//     <Piece NumberOfPoints="3" NumberOfCells="1">
	// error: mesh: data array "B" has non-finite value NaN at index 0
}

func ExampleDiscretizePolygon() {
	// A half disc of radius 10 mm: a straight diameter and a half-circle
	// arc, cut into chords no farther than 0.01 mm from the arc.
	p := mesh.Polygon{X: []float64{-0.01, 0.01}, Y: []float64{0, 0}, Sweep: []float64{0, math.Pi}}
	// Sagitta R(1 - cos(φ/2)) <= 1e-5 m gives φ <= 0.0894 rad: 36 chords,
	// a half 72-gon of area 18 R² sin(π/36).
	x, y := mesh.DiscretizePolygon(p, mesh.GraphOptions{ChordTol: 1e-5})
	fmt.Printf("%d vertices, area %.4f cm² (exact half disc %.4f cm²)\n", len(x), mesh.PolygonArea(x, y)*1e4, math.Pi*0.01*0.01/2*1e4)
	// Output:
	// 37 vertices, area 1.5688 cm² (exact half disc 1.5708 cm²)
}

// A 2 m x 1 m plate with a 0.5 m square inclusion of its own region.
func ExampleTriangulate() {
	in := &mesh.Input{
		X:        []float64{0, 2, 2, 0, 0.75, 1.25, 1.25, 0.75},
		Y:        []float64{0, 0, 1, 1, 0.25, 0.25, 0.75, 0.75},
		Segments: []int32{0, 1, 1, 2, 2, 3, 3, 0, 4, 5, 5, 6, 6, 7, 7, 4},
		Markers:  []int32{1, 1, 1, 1, 2, 2, 2, 2},
		Seeds:    []mesh.Seed{{X: 1, Y: 0.5, Region: 2}},

		DefaultRegion: 1,
	}
	m, err := mesh.Triangulate(in, mesh.Options{Size: mesh.SizeField{Global: 0.1}})
	if err != nil {
		fmt.Println(err)
		return
	}
	err = m.Check(mesh.CheckOptions{MinAngle: 28, Input: in, RegionAreas: map[int32]float64{1: 1.75, 2: 0.25}})
	fmt.Println("check:", err)
	fmt.Println("regions and areas verified; quality >= 28 degrees:", err == nil)
	// Output:
	// check: <nil>
	// regions and areas verified; quality >= 28 degrees: true
}

func ExampleOrient2D() {
	fmt.Println(mesh.Orient2D(0, 0, 1, 0, 0, 1))
	fmt.Println(mesh.Orient2D(0, 0, 1, 0, 2, 0))
	// Points that float rounding would misjudge: c is 1 ulp above the line.
	fmt.Println(mesh.Orient2D(0.5, 0.5, 12, 12, 24, 24.000000000000004))
	// Output:
	// CCW
	// Collinear
	// CCW
}

func ExampleInCircle() {
	// The fourth corner of a square lies exactly on the circle through the other three.
	fmt.Println(mesh.InCircle(0, 0, 1, 0, 1, 1, 0, 1))
	fmt.Println(mesh.InCircle(0, 0, 1, 0, 1, 1, 0.5, 0.5))
	// Output:
	// 0
	// 1
}

func ExampleNearPoint() {
	// Two vertices 3-4-5 apart: within 5, not within the float just below.
	fmt.Println(mesh.NearPoint(0, 0, 3, 4, 5), mesh.NearPoint(0, 0, 3, 4, 4.999999999999999))
	// Output:
	// true false
}

func ExampleNearSegment() {
	// A vertex 1e-12 above an edge is on it at resolution 1e-9, not at 0.
	fmt.Println(mesh.NearSegment(0.5, 1e-12, 0, 0, 1, 0, 1e-9))
	fmt.Println(mesh.NearSegment(0.5, 1e-12, 0, 0, 1, 0, 0))
	// Beyond an end the distance is to the end: (2, 0) is 1 from (1, 0).
	fmt.Println(mesh.NearSegment(2, 0, 0, 0, 1, 0, 1))
	// Output:
	// true
	// false
	// true
}

func ExampleSegmentsNear() {
	// Two edges of a T that miss each other by 1e-12.
	fmt.Println(mesh.SegmentsNear(0, 0, 1, 0, 0.5, 1e-12, 0.5, 1, 1e-9))
	fmt.Println(mesh.SegmentsNear(0, 0, 1, 0, 0.5, 1e-12, 0.5, 1, 0))
	// Output:
	// true
	// false
}

func ExampleSegmentsCross() {
	// The diagonals of a square cross; where, CrossingPoint says.
	fmt.Println(mesh.SegmentsCross(0, 0, 2, 2, 0, 2, 2, 0))
	fmt.Println(mesh.CrossingPoint(0, 0, 2, 2, 0, 2, 2, 0))
	// Edges that only touch at an end do not cross.
	fmt.Println(mesh.SegmentsCross(0, 0, 1, 0, 1, 0, 1, 1))
	// Output:
	// true
	// 1 1
	// false
}

func ExamplePointInPolygon() {
	x, y := []float64{0, 1, 1, 0}, []float64{0, 0, 1, 1}
	fmt.Println(mesh.PointInPolygon(x, y, 0.5, 0.5, 0))
	fmt.Println(mesh.PointInPolygon(x, y, 0.5, 1e-12, 0))
	fmt.Println(mesh.PointInPolygon(x, y, 0.5, 1e-12, 1e-9))
	fmt.Println(mesh.PointInPolygon(x, y, 1.5, 0.5, 0))
	// Output:
	// Inside
	// Inside
	// OnBoundary
	// Outside
}

func ExampleZeroArea() {
	// A triangle 1e-12 high has zero area at resolution 1e-9; 1e-6 high
	// it does not.
	fmt.Println(mesh.ZeroArea([]float64{0, 1, 0.5}, []float64{0, 0, 1e-12}, 1e-9))
	fmt.Println(mesh.ZeroArea([]float64{0, 1, 0.5}, []float64{0, 0, 1e-6}, 1e-9))
	// Output:
	// true
	// false
}

func ExampleSelfIntersection() {
	// Vertex 3 sits 1e-12 above edge 0: at resolution 1e-9 edges 0 and 2
	// (the first pair) meet there; exactly, nothing meets.
	x := []float64{0, 1, 1, 0.5, 0}
	y := []float64{0, 0, 0.2, 1e-12, 0.2}
	fmt.Println(mesh.SelfIntersection(x, y, 1e-9))
	fmt.Println(mesh.SelfIntersection(x, y, 0))
	// Output:
	// 0 2 true
	// -1 -1 false
}

func ExamplePolygonsOverlap() {
	// A unit square and a box whose left side lies 1e-12 inside it: at
	// resolution 1e-9 they share an edge; 1e-6 inside, they overlap.
	sx, sy := []float64{0, 1, 1, 0}, []float64{0, 0, 1, 1}
	_, _, ok := mesh.PolygonsOverlap(sx, sy, []float64{1 - 1e-12, 2, 2, 1 - 1e-12}, []float64{0, 0, 1, 1}, 1e-9)
	fmt.Println(ok)
	x, y, ok := mesh.PolygonsOverlap(sx, sy, []float64{1 - 1e-6, 2, 2, 1 - 1e-6}, []float64{0, 0, 1, 1}, 1e-9)
	fmt.Println(ok, x > 1-1e-6 && x < 1, y > 0 && y < 1)
	// Output:
	// false
	// true true true
}

func ExampleMesh_Check() {
	m := &mesh.Mesh{
		X: []float64{0, 1, 0}, Y: []float64{0, 0, 1}, NumVertices: 3,
		Tri: []int32{0, 2, 1}, Nbr: []int32{-1, -1, -1}, EdgeMarker: []int32{1, 1, 1}, Region: []int32{0},
	}
	fmt.Println(m.Check(mesh.CheckOptions{}))
	// Output:
	// mesh: check area failed at triangle 0 (1 violations): triangle is not counter-clockwise with positive area
}

func ExampleSizeField_At() {
	f := mesh.SizeField{Global: 0.01, Points: []mesh.SizePoint{{X: 0, Y: 0, Size: 0.001}}, Grading: 0.2}
	fmt.Printf("%.4f %.4f\n", f.At(0.01, 0, 0), f.At(1, 0, 0))
	// Output:
	// 0.0030 0.0100
}
