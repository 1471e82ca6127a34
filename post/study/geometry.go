package study

import (
	"fmt"
	"math"

	"polegap/mesh"
	"polegap/models"
)

// Edge markers handed to the mesher.
const (
	MarkerInterface int32 = 1 // edges of model regions
	MarkerLeft      int32 = 2 // box sides
	MarkerRight     int32 = 3
	MarkerBottom    int32 = 4
	MarkerTop       int32 = 5
	MarkerCircle    int32 = 6 // a circular outer boundary
)

// AirTag is the region tag of the air around the model's regions.
const AirTag int32 = 0

// Tag returns the mesh region tag of model region i.
func Tag(i int) int32 { return int32(i + 1) }

// SideMarker maps a box side name of the model file to its edge marker.
var SideMarker = map[string]int32{
	"left": MarkerLeft, "right": MarkerRight, "bottom": MarkerBottom, "top": MarkerTop,
}

// Boundary returns the outer boundary polygon of the model: a box or circle
// around its extent with the model's margin (per side for a box with
// boundary.margins), with sides declared in boundary.sides (and the axis of
// an axisymmetric model) lying on the extent; or the box the model gives
// (boundary.box).
func Boundary(m *models.Model) (mesh.Polygon, error) {
	xmin, ymin, xmax, ymax := m.Extent()
	dx, dy := xmax-xmin, ymax-ymin
	if !(dx > 0) || !(dy > 0) {
		return mesh.Polygon{}, fmt.Errorf("%s: the model has no area: regions span %g m by %g m", m.File, dx, dy)
	}
	d := m.Boundary.Margin * math.Max(dx, dy)
	axi := m.Geometry == models.Axisymmetric
	switch m.Boundary.Shape {
	case "circle":
		cx, cy, r := circle(m)
		if axi {
			// A half disc centred on the axis.
			return mesh.Polygon{
				X:           []float64{0, 0},
				Y:           []float64{cy - r, cy + r},
				Sweep:       []float64{math.Pi, 0},
				Region:      AirTag,
				EdgeMarkers: []int32{MarkerCircle, MarkerLeft},
			}, nil
		}
		p := mesh.Polygon{Region: AirTag, Marker: MarkerCircle}
		for k := 0; k < 4; k++ {
			a := float64(k) * math.Pi / 2
			p.X = append(p.X, cx+r*math.Cos(a))
			p.Y = append(p.Y, cy+r*math.Sin(a))
			p.Sweep = append(p.Sweep, math.Pi/2)
		}
		return p, nil
	default: // box
		side := func(name string) bool { _, ok := m.Boundary.Sides[name]; return ok }
		margin := func(name string) float64 {
			if g, ok := m.Boundary.Margins[name]; ok {
				return g * math.Max(dx, dy)
			}
			return d
		}
		x0, x1, y0, y1 := xmin-margin("left"), xmax+margin("right"), ymin-margin("bottom"), ymax+margin("top")
		if b := m.Boundary.Box; b != nil {
			x0, y0, x1, y1 = b[0][0], b[0][1], b[1][0], b[1][1]
			if axi {
				x0 = 0
			}
			return boxPolygon(x0, x1, y0, y1), nil
		}
		if side("left") || axi {
			x0 = xmin
		}
		if axi {
			x0 = 0
		}
		if side("right") {
			x1 = xmax
		}
		if side("bottom") {
			y0 = ymin
		}
		if side("top") {
			y1 = ymax
		}
		return boxPolygon(x0, x1, y0, y1), nil
	}
}

// boxPolygon returns the box boundary with its side markers.
func boxPolygon(x0, x1, y0, y1 float64) mesh.Polygon {
	return mesh.Polygon{
		X:           []float64{x0, x1, x1, x0},
		Y:           []float64{y0, y0, y1, y1},
		Region:      AirTag,
		EdgeMarkers: []int32{MarkerBottom, MarkerRight, MarkerTop, MarkerLeft},
	}
}

// Polygons returns the region polygons of the model, tagged Tag(i).
func Polygons(m *models.Model) []mesh.Polygon {
	ps := make([]mesh.Polygon, len(m.Regions))
	for i := range m.Regions {
		r := &m.Regions[i]
		ps[i] = mesh.Polygon{X: r.X, Y: r.Y, Sweep: r.Sweep, Region: Tag(i), Marker: MarkerInterface}
	}
	return ps
}

// circle returns the centre and radius of a circular boundary: centred on
// the model's extent, the margin beyond its half diagonal. In an
// axisymmetric model the circle is centred on the axis (cx = 0) at the
// extent's mid-height, the margin beyond the extent's farthest corner.
func circle(m *models.Model) (cx, cy, r float64) {
	xmin, ymin, xmax, ymax := m.Extent()
	dx, dy := xmax-xmin, ymax-ymin
	d := m.Boundary.Margin * math.Max(dx, dy)
	if m.Geometry == models.Axisymmetric {
		return 0, 0.5 * (ymin + ymax), math.Hypot(xmax, 0.5*dy) + d
	}
	return 0.5 * (xmin + xmax), 0.5 * (ymin + ymax), 0.5*math.Hypot(dx, dy) + d
}

// CheckProbes returns an error for the first probe with a point outside
// the outer boundary (where no field is computed): a probe beyond a
// symmetry side, or one the margin does not reach.
func CheckProbes(m *models.Model, b mesh.Polygon) error {
	return checkProbes(m, m, b)
}

// checkProbes is CheckProbes inside the boundary b of the model outer.
func checkProbes(m, outer *models.Model, b mesh.Polygon) error {
	inside := insideBoundary(outer, b)
	for i := range m.Probes {
		p := &m.Probes[i]
		var pts [][2]float64
		switch p.Kind {
		case models.ProbePoint:
			pts = [][2]float64{p.Point}
		case models.ProbeLine:
			pts = [][2]float64{p.Line[0], p.Line[1]}
		case models.ProbeBox:
			pts = [][2]float64{p.Box[0], p.Box[1], {p.Box[0][0], p.Box[1][1]}, {p.Box[1][0], p.Box[0][1]}}
		case models.ProbeCircle:
			c, r := p.Centre, p.Radius
			pts = [][2]float64{{c[0] - r, c[1]}, {c[0] + r, c[1]}, {c[0], c[1] - r}, {c[0], c[1] + r}}
		}
		for _, q := range pts {
			if !inside(q[0], q[1]) {
				return m.Errorf(p.Pos, "probe %q reaches (%g, %g) m, outside the model's outer boundary where no field is computed; move it inside, or enlarge boundary.margin", p.Name, q[0], q[1])
			}
		}
	}
	return nil
}

// insideBoundary returns a test for points inside (or on) the boundary.
func insideBoundary(m *models.Model, b mesh.Polygon) func(x, y float64) bool {
	if m.Boundary.Shape == "circle" {
		cx, cy, r := circle(m)
		axi := m.Geometry == models.Axisymmetric
		return func(x, y float64) bool {
			if axi && x < 0 {
				return false
			}
			return math.Hypot(x-cx, y-cy) <= r*(1+1e-9)
		}
	}
	x0, x1 := math.Min(b.X[0], b.X[1]), math.Max(b.X[0], b.X[1])
	y0, y1 := math.Min(b.Y[0], b.Y[2]), math.Max(b.Y[0], b.Y[2])
	tol := 1e-9 * math.Max(x1-x0, y1-y0)
	return func(x, y float64) bool {
		return x >= x0-tol && x <= x1+tol && y >= y0-tol && y <= y1+tol
	}
}
