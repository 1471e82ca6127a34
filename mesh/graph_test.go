package mesh

import (
	"errors"
	"math"
	"math/rand/v2"
	"polegap/internal/compsum"
	"strings"
	"testing"
)

func rect(x0, y0, x1, y1 float64, region, marker int32) Polygon {
	return Polygon{X: []float64{x0, x1, x1, x0}, Y: []float64{y0, y0, y1, y1}, Region: region, Marker: marker}
}

// checkGraph asserts the invariants BuildInput promises: no repeated or
// zero-length segments, no two segments meeting other than at a shared end
// vertex, no vertex inside a segment, markers >= 1, seeds off every
// segment.
func checkGraph(t *testing.T, name string, in *Input) {
	t.Helper()
	ns := len(in.Segments) / 2
	if len(in.Markers) != ns || len(in.X) != len(in.Y) {
		t.Fatalf("%s: %d segments, %d markers, %d/%d coordinates", name, ns, len(in.Markers), len(in.X), len(in.Y))
	}
	seen := map[[2]int32]bool{}
	for i := 0; i < ns; i++ {
		a, b := in.Segments[2*i], in.Segments[2*i+1]
		if a == b || seen[[2]int32{min(a, b), max(a, b)}] {
			t.Errorf("%s: segment %d (%d,%d) is zero-length or repeated", name, i, a, b)
		}
		seen[[2]int32{min(a, b), max(a, b)}] = true
		if in.Markers[i] < 1 {
			t.Errorf("%s: segment %d has marker %d", name, i, in.Markers[i])
		}
		ax, ay, bx, by := in.X[a], in.Y[a], in.X[b], in.Y[b]
		for v := range in.X {
			if int32(v) != a && int32(v) != b && Orient2D(ax, ay, bx, by, in.X[v], in.Y[v]) == Collinear && between(ax, ay, bx, by, in.X[v], in.Y[v]) {
				t.Errorf("%s: vertex %d lies inside segment %d", name, v, i)
			}
		}
		for j := i + 1; j < ns; j++ {
			c, d := in.Segments[2*j], in.Segments[2*j+1]
			if a == c || a == d || b == c || b == d {
				continue // shared ends; overlap would put a vertex inside
			}
			if segmentsMeet(ax, ay, bx, by, in.X[c], in.Y[c], in.X[d], in.Y[d]) {
				t.Errorf("%s: segments %d and %d meet", name, i, j)
			}
		}
		for _, s := range in.Seeds {
			if Orient2D(ax, ay, bx, by, s.X, s.Y) == Collinear && between(ax, ay, bx, by, s.X, s.Y) {
				t.Errorf("%s: seed %+v lies on segment %d", name, s, i)
			}
		}
	}
}

// segLength sums the lengths of the segments carrying marker mk.
func segLength(in *Input, mk int32) float64 {
	var s compsum.Sum
	for i := range in.Markers {
		if in.Markers[i] == mk {
			a, b := in.Segments[2*i], in.Segments[2*i+1]
			s.Add(math.Hypot(in.X[b]-in.X[a], in.Y[b]-in.Y[a]))
		}
	}
	return s.Value()
}

func seedsOf(in *Input) map[int32]int {
	n := map[int32]int{}
	for _, s := range in.Seeds {
		n[s.Region]++
	}
	return n
}

func TestBuildInputSharedEdge(t *testing.T) {
	// Two rectangles sharing part of an edge, (1,1)-(2,1); the second one's
	// lower edge continues to (3,1). The lower one also lies on the
	// boundary's bottom edge from (0,-1) to (2,-1), where the boundary
	// marker must win.
	a := rect(0, -1, 2, 1, 10, 2)
	b := rect(1, 1, 3, 2, 20, 3)
	bnd := rect(-1, -1, 4, 3, 0, 1)
	in, err := BuildInput([]Polygon{a, b}, bnd, GraphOptions{})
	if err != nil {
		t.Fatal(err)
	}
	checkGraph(t, "shared edge", in)
	// Vertices: boundary 4, a 4 (two on the boundary's bottom edge), b 4.
	if len(in.X) != 12 {
		t.Errorf("%d vertices, want 12", len(in.X))
	}
	// Segments: boundary 4 + 2 (bottom split at (0,-1), (2,-1));
	// a: left, right, top split at (1,1) = 4 (its bottom is the boundary's);
	// b: 4 + 1 (bottom split at (2,1)) - 1 (the shared piece) = 4.
	if got := len(in.Segments) / 2; got != 14 {
		t.Errorf("%d segments, want 14", got)
	}
	// Marker lengths: boundary perimeter 18; a keeps left 2, right 2, top 2
	// (the shared piece is a's, the first polygon); b keeps 1+1+2+1.
	for _, c := range []struct {
		mk   int32
		want float64
	}{{1, 18}, {2, 6}, {3, 5}} {
		if got := segLength(in, c.mk); math.Abs(got-c.want) > 1e-12 {
			t.Errorf("marker %d: total length %g, want %g", c.mk, got, c.want)
		}
	}
	if n := seedsOf(in); len(in.Seeds) != 2 || n[10] != 1 || n[20] != 1 {
		t.Errorf("seeds %+v", in.Seeds)
	}
	for _, s := range in.Seeds {
		p := a
		if s.Region == 20 {
			p = b
		}
		if PointInPolygon(p.X, p.Y, s.X, s.Y, 0) != Inside {
			t.Errorf("seed %+v not strictly inside its rectangle", s)
		}
	}
	if in.DefaultRegion != 0 {
		t.Errorf("default region %d", in.DefaultRegion)
	}
}

func TestDiscretizeArc(t *testing.T) {
	// A unit square whose right edge is an arc of sweep θ bulging outwards.
	// Exact area: 1 + R²/2 (θ - sin θ), the circular segment of radius
	// R = c / (2 sin(θ/2)) over chord c = 1 (e.g. Abramowitz & Stegun,
	// Handbook of Mathematical Functions, 1964, formula 4.3.146's circle
	// geometry; from memory). Chording loses at most ChordTol times the
	// arc length R θ (the lost sliver is no wider than the sagitta).
	for _, c := range []struct {
		name       string
		theta, tol float64
		maxAngle   float64
	}{
		{"quarter arc, sagitta bound", math.Pi / 2, 1e-4, 0},
		{"half circle, angle bound", math.Pi, 1, 0.2},
		{"deep arc", 1.5 * math.Pi, 1e-3, 0},
		{"concave arc", -math.Pi / 3, 1e-5, 0},
	} {
		p := rect(0, 0, 1, 1, 1, 1)
		p.Sweep = []float64{0, c.theta, 0, 0}
		opt := GraphOptions{ChordTol: c.tol, MaxArcAngle: c.maxAngle}
		x, y := DiscretizePolygon(p, opt)
		th := math.Abs(c.theta)
		r := 1 / (2 * math.Sin(th/2))
		seg := r * r / 2 * (th - math.Sin(th))
		exact := 1 + math.Copysign(seg, c.theta)
		got := PolygonArea(x, y)
		if math.Abs(got-exact) > c.tol*r*th {
			t.Errorf("%s: area %.12g, exact %.12g, allowed chord error %g", c.name, got, exact, c.tol*r*th)
		}
		// n equal chords of a circle: the lost area is exactly
		// R²/2 (θ - n sin(θ/n)).
		n := len(x) - 3
		chords := r * r / 2 * (th - float64(n)*math.Sin(th/float64(n)))
		if math.Abs(got-(exact-math.Copysign(chords, c.theta))) > 1e-12 {
			t.Errorf("%s: area %.15g, want %.15g from %d equal chords", c.name, got, exact-math.Copysign(chords, c.theta), n)
		}
		// Each chord: sagitta R(1 - cos(θ/2n)) <= tol, angle <= max; and
		// n is the smallest count meeting both.
		maxA := c.maxAngle
		if maxA == 0 {
			maxA = 10 * math.Pi / 180
		}
		sag := func(n int) float64 { return r * (1 - math.Cos(th/float64(2*n))) }
		if sag(n) > c.tol*(1+1e-12) || th/float64(n) > maxA*(1+1e-12) {
			t.Errorf("%s: %d chords: sagitta %g (tol %g), angle %g (max %g)", c.name, n, sag(n), c.tol, th/float64(n), maxA)
		}
		if n > 1 && sag(n-1) <= c.tol && th/float64(n-1) <= maxA {
			t.Errorf("%s: %d chords where %d would do", c.name, n, n-1)
		}
		for i := 0; i < 4; i++ {
			// the original corners are kept, exactly
			found := false
			for k := range x {
				found = found || (x[k] == p.X[i] && y[k] == p.Y[i])
			}
			if !found {
				t.Errorf("%s: corner %d lost", c.name, i)
			}
		}
	}
}

func TestDiscretizeCircle(t *testing.T) {
	// A circle from two vertices and two half-circle arcs. The n chords
	// form a regular n-gon of area (n/2) R² sin(2π/n) (elementary
	// geometry), which the discretised polygon must reproduce to rounding.
	const r = 0.035
	p := Polygon{X: []float64{r, -r}, Y: []float64{0, 0}, Sweep: []float64{math.Pi, math.Pi}}
	x, y := DiscretizePolygon(p, GraphOptions{ChordTol: 1e-6})
	n := float64(len(x))
	want := n / 2 * r * r * math.Sin(2*math.Pi/n)
	if got := PolygonArea(x, y); math.Abs(got-want) > 1e-13*want {
		t.Errorf("%g-gon area %.15g, want %.15g", n, got, want)
	}
	if got := PolygonArea(x, y); math.Abs(got-math.Pi*r*r) > 1e-6*2*math.Pi*r {
		t.Errorf("circle area %.12g vs πR² %.12g beyond the chord error", got, math.Pi*r*r)
	}
	if len(x)%2 != 0 {
		t.Errorf("%d vertices: the two half arcs should have equal chord counts", len(x))
	}
	// A disc region inside a box boundary gets one seed inside the disc.
	in, err := BuildInput([]Polygon{{X: p.X, Y: p.Y, Sweep: p.Sweep, Region: 5}}, rect(-0.1, -0.1, 0.1, 0.1, 0, 1), GraphOptions{ChordTol: 1e-6})
	if err != nil {
		t.Fatal(err)
	}
	checkGraph(t, "disc", in)
	if len(in.Seeds) != 1 || in.Seeds[0].Region != 5 || PointInPolygon(x, y, in.Seeds[0].X, in.Seeds[0].Y, 0) != Inside {
		t.Errorf("disc seeds %+v", in.Seeds)
	}
}

func TestBuildInputCrossing(t *testing.T) {
	// A plus sign: a horizontal and a vertical bar crossing. Their 8 edge
	// crossings become vertices; the graph has 5 bounded faces inside the
	// boundary besides the air: left and right ends of the bar (region 1),
	// the middle (both: region 2, the later polygon, under
	// OverlapLaterWins), top and bottom ends (region 2).
	h := rect(0, 1, 3, 2, 1, 2)
	v := rect(1, 0, 2, 3, 2, 3)
	bnd := rect(-1, -1, 4, 4, 0, 1)
	in, err := BuildInput([]Polygon{h, v}, bnd, GraphOptions{Overlap: OverlapLaterWins})
	if err != nil {
		t.Fatal(err)
	}
	checkGraph(t, "plus", in)
	// 4 boundary + 8 bar corners; the crossings are exactly the corners
	// of the middle square, (1,1),(2,1),(2,2),(1,2), 4 new vertices.
	if len(in.X) != 16 {
		t.Errorf("%d vertices, want 16", len(in.X))
	}
	// 4 boundary; each bar edge of length 3 is split in three (2 long
	// edges x 3 pieces x 2 bars = 12) and each short end edge stays (4).
	if got := len(in.Segments) / 2; got != 20 {
		t.Errorf("%d segments, want 20", got)
	}
	if n := seedsOf(in); n[1] != 2 || n[2] != 3 || len(in.Seeds) != 5 {
		t.Errorf("seeds per region %v, want 1:2 2:3", n)
	}
	// A slanted crossing: the intersection point is computed, not found.
	tri := Polygon{X: []float64{0.5, 2.5, 0.7}, Y: []float64{0.2, 0.4, 2.9}, Region: 3}
	sq := rect(1, 1, 3.3, 3.1, 4, 5)
	in, err = BuildInput([]Polygon{tri, sq}, bnd, GraphOptions{Overlap: OverlapLaterWins})
	if err != nil {
		t.Fatal(err)
	}
	checkGraph(t, "slanted", in)
	// Faces: triangle alone, the overlap (to the later square) and the
	// square alone.
	if n := seedsOf(in); n[3] != 1 || n[4] != 2 {
		t.Errorf("slanted: seeds per region %v", n)
	}
	// The default rule refuses the overlap and names both polygons.
	_, err = BuildInput([]Polygon{h, v}, bnd, GraphOptions{})
	var ge *GraphError
	if !errors.As(err, &ge) || ge.Polygon != 0 || ge.Other != 1 || !strings.Contains(err.Error(), "region polygon 0 and region polygon 1: overlap") {
		t.Errorf("overlap error: %v", err)
	}
}

func TestBuildInputSeedInsideNonConvex(t *testing.T) {
	// A C-shaped yoke outline (invented dimensions, metres) whose longest
	// edge faces its own window: the seed must land in the steel, not in
	// the window, and a coil region sits in the window.
	c := Polygon{
		X:      []float64{0, 0.3, 0.3, 0.05, 0.05, 0.3, 0.3, 0},
		Y:      []float64{0, 0, 0.05, 0.05, 0.25, 0.25, 0.3, 0.3},
		Region: 1, Marker: 2,
	}
	coil := rect(0.08, 0.08, 0.2, 0.22, 2, 3)
	in, err := BuildInput([]Polygon{c, coil}, rect(-0.1, -0.1, 0.4, 0.4, 0, 1), GraphOptions{})
	if err != nil {
		t.Fatal(err)
	}
	checkGraph(t, "C-core", in)
	if len(in.Seeds) != 2 {
		t.Fatalf("seeds %+v", in.Seeds)
	}
	for _, s := range in.Seeds {
		p := c
		if s.Region == 2 {
			p = coil
		}
		if PointInPolygon(p.X, p.Y, s.X, s.Y, 0) != Inside {
			t.Errorf("seed %+v not inside its polygon", s)
		}
	}
}

func TestBuildInputMarkersAndOrientation(t *testing.T) {
	// A clockwise triangle with per-edge markers: after reversal each
	// marker must stay on its own geometric edge.
	tri := Polygon{X: []float64{0, 0, 1}, Y: []float64{0, 1, 0}, EdgeMarkers: []int32{5, 6, 7}, Region: 9}
	in, err := BuildInput([]Polygon{tri}, rect(-1, -1, 2, 2, 0, 1), GraphOptions{})
	if err != nil {
		t.Fatal(err)
	}
	checkGraph(t, "cw triangle", in)
	want := map[[4]float64]int32{{0, 0, 0, 1}: 5, {0, 1, 1, 0}: 6, {1, 0, 0, 0}: 7}
	for i := range in.Markers {
		a, b := in.Segments[2*i], in.Segments[2*i+1]
		for k, mk := range want {
			if (in.X[a] == k[0] && in.Y[a] == k[1] && in.X[b] == k[2] && in.Y[b] == k[3]) ||
				(in.X[b] == k[0] && in.Y[b] == k[1] && in.X[a] == k[2] && in.Y[a] == k[3]) {
				if in.Markers[i] != mk {
					t.Errorf("edge %v has marker %d, want %d", k, in.Markers[i], mk)
				}
				delete(want, k)
			}
		}
	}
	if len(want) != 0 {
		t.Errorf("edges not found: %v", want)
	}
	if PolygonArea(tri.X, tri.Y) != -0.5 {
		t.Errorf("clockwise area %g, want -0.5", PolygonArea(tri.X, tri.Y))
	}
	// Vertices within MergeTol merge; farther ones do not.
	a := rect(0, 0, 1, 1, 1, 2)
	b := rect(1+1e-12, 0, 2, 1, 2, 3)
	in, err = BuildInput([]Polygon{a, b}, rect(-1, -1, 3, 2, 0, 1), GraphOptions{MergeTol: 1e-10})
	if err != nil {
		t.Fatal(err)
	}
	checkGraph(t, "merge", in)
	if len(in.X) != 10 || len(in.Segments)/2 != 11 {
		t.Errorf("merge: %d vertices, %d segments, want 10 and 11", len(in.X), len(in.Segments)/2)
	}
}

func TestBuildInputErrors(t *testing.T) {
	bnd := rect(-1, -1, 3, 3, 0, 1)
	ok := rect(0, 0, 1, 1, 1, 1)
	cases := []struct {
		name    string
		regions []Polygon
		bnd     Polygon
		poly    int
		reason  string
	}{
		{"two distinct vertices", []Polygon{ok, {X: []float64{0, 1, 1}, Y: []float64{2, 2, 2 + 1e-15}}}, bnd, 1, "distinct vertices"},
		{"zero area", []Polygon{{X: []float64{0, 1, 2}, Y: []float64{0, 1, 2}}}, bnd, 0, "zero area"},
		{"bow tie", []Polygon{ok, {X: []float64{0, 1, 1, 0}, Y: []float64{1.5, 2.5, 1.5, 2.8}}}, bnd, 1, "intersects itself"},
		{"fold back", []Polygon{{X: []float64{0, 2, 1, 1}, Y: []float64{0, 0, 0, 1}}}, bnd, 0, "intersects itself"},
		{"outside", []Polygon{rect(2, 2, 4, 4, 1, 1)}, bnd, 0, "outside the boundary"},
		{"NaN", []Polygon{{X: []float64{0, math.NaN(), 1}, Y: []float64{0, 0, 1}}}, bnd, 0, "non-finite"},
		{"sweep", []Polygon{{X: []float64{0, 1, 1}, Y: []float64{0, 0, 1}, Sweep: []float64{7, 0, 0}}}, bnd, 0, "sweep"},
		{"bad boundary", []Polygon{ok}, Polygon{X: []float64{0, 1}, Y: []float64{0, 1}}, -1, "boundary polygon: has 2 distinct"},
	}
	for _, c := range cases {
		_, err := BuildInput(c.regions, c.bnd, GraphOptions{})
		var ge *GraphError
		if !errors.As(err, &ge) || ge.Polygon != c.poly || !strings.Contains(err.Error(), c.reason) {
			t.Errorf("%s: got %v, want a GraphError for polygon %d containing %q", c.name, err, c.poly, c.reason)
		}
	}
	defer func() {
		if r, _ := recover().(string); !strings.HasPrefix(r, "mesh: ") {
			t.Errorf("length mismatch: recovered %q", r)
		}
	}()
	BuildInput([]Polygon{{X: []float64{0, 1, 1}, Y: []float64{0, 0}}}, bnd, GraphOptions{})
}

// absArea is the area of p as BuildInput meshes it.
func absArea(p Polygon, opt GraphOptions) float64 {
	x, y := DiscretizePolygon(p, opt)
	return math.Abs(PolygonArea(x, y))
}

// exactArea is the area of p with its arcs: the shoelace area of its
// vertices plus, for each arc of radius R and sweep θ, the circular segment
// R² (|θ| − sin |θ|)/2, signed like θ (an arc running counter-clockwise
// about its centre adds to the counter-clockwise area).
func exactArea(p Polygon) float64 {
	a := PolygonArea(p.X, p.Y)
	for i, th := range p.Sweep {
		if th == 0 {
			continue
		}
		j := (i + 1) % len(p.X)
		c := math.Hypot(p.X[j]-p.X[i], p.Y[j]-p.Y[i])
		r := c / (2 * math.Abs(math.Sin(th/2)))
		a += math.Copysign(r*r/2*(math.Abs(th)-math.Sin(math.Abs(th))), th)
	}
	return math.Abs(a)
}

func TestBuildInputTriangulateAreas(t *testing.T) {
	// Mesh each graph and compare the compensated area of every region
	// with the area of its polygon. The triangulation covers the chorded
	// polygons BuildInput makes, except that refinement splits arcs at
	// points on the arc: each region's area lies between that of its
	// chorded polygon and its exact area with arcs, up to rounding (1e-9
	// relative, the bound Mesh.Check applies), and the regions fill the
	// straight boundary exactly.
	yoke := Polygon{
		X:      []float64{0, 0.3, 0.3, 0.05, 0.05, 0.3, 0.3, 0},
		Y:      []float64{0, 0, 0.05, 0.05, 0.25, 0.25, 0.3, 0.3},
		Sweep:  []float64{0, 0, 0, 0, 0, 0, 0, 0},
		Region: 1, Marker: 2,
	}
	yoke.Sweep[6] = 0.8 // rounded back, bulging outwards
	coil := rect(0.08, 0.08, 0.2, 0.22, 2, 3)
	pole := Polygon{X: []float64{0.22, 0.28, 0.25}, Y: []float64{0.1, 0.1, 0.16}, Region: 3, Marker: 4}
	disc := Polygon{X: []float64{0.012, -0.012}, Y: []float64{0.5, 0.5}, Sweep: []float64{math.Pi, math.Pi}, Region: 4}
	cases := []struct {
		name    string
		regions []Polygon
		bnd     Polygon
		size    float64
	}{
		{"C-core, coil, pole", []Polygon{yoke, coil, pole}, rect(-0.2, -0.2, 0.6, 0.55, 0, 1), 0.02},
		{"disc on a shared edge pair", []Polygon{disc, rect(-0.05, 0.3, 0.05, 0.45, 5, 2), rect(0.05, 0.3, 0.1, 0.4, 6, 3)}, rect(-0.2, 0.2, 0.2, 0.7, 0, 1), 0.01},
	}
	for _, c := range cases {
		opt := GraphOptions{}.WithDefaults(c.regions, c.bnd)
		in, err := BuildInput(c.regions, c.bnd, opt)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		checkGraph(t, c.name, in)
		m, err := Triangulate(in, Options{Size: SizeField{Global: c.size}})
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		chorded, exact := map[int32]float64{}, map[int32]float64{}
		total := absArea(c.bnd, opt)
		restC, restE := total, total
		for _, p := range c.regions {
			a, e := absArea(p, opt), exactArea(p)
			chorded[p.Region] += a
			exact[p.Region] += e
			restC -= a
			restE -= e
		}
		chorded[c.bnd.Region] += restC
		exact[c.bnd.Region] += restE
		if err := m.Check(CheckOptions{MinAngle: DefaultMinAngle, Input: in}); err != nil {
			t.Errorf("%s: %v", c.name, err)
		}
		got := m.RegionAreas()
		var sum float64
		for r, a := range chorded {
			lo, hi := math.Min(a, exact[r]), math.Max(a, exact[r])
			if got[r] < lo-1e-9*a || got[r] > hi+1e-9*a {
				t.Errorf("%s: region %d area %.15g, outside [%.15g, %.15g] (chorded, exact)", c.name, r, got[r], lo, hi)
			}
			sum += got[r]
		}
		if math.Abs(sum-total) > 1e-9*total {
			t.Errorf("%s: regions cover %.15g, boundary %.15g", c.name, sum, total)
		}
		if len(got) != len(chorded) {
			t.Errorf("%s: regions %v, want %v", c.name, got, chorded)
		}
	}
}

// TestBuildInputRandomOverlaps throws random overlapping rectangles (on a
// coarse lattice, so edges overlap, touch and share vertices) and random
// triangles (so edges cross at computed points) at BuildInput with the
// later-wins rule, meshes the result and checks the region of the mesh at
// random points against the last polygon that contains each point.
func TestBuildInputRandomOverlaps(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	bnd := rect(-1, -1, 11, 11, 0, 1)
	for trial := 0; trial < 25; trial++ {
		var regions []Polygon
		for k := 0; k < 5; k++ {
			if rng.IntN(2) == 0 {
				x0, y0 := float64(rng.IntN(8)), float64(rng.IntN(8))
				regions = append(regions, rect(x0, y0, x0+1+float64(rng.IntN(4)), y0+1+float64(rng.IntN(4)), int32(k+1), int32(k+2)))
				continue
			}
			p := Polygon{Region: int32(k + 1), Marker: int32(k + 2)}
			for len(p.X) < 3 {
				p.X, p.Y = append(p.X, 10*rng.Float64()), append(p.Y, 10*rng.Float64())
			}
			if math.Abs(PolygonArea(p.X, p.Y)) < 0.5 {
				continue
			}
			regions = append(regions, p)
		}
		name := "trial " + itoa(trial)
		in, err := BuildInput(regions, bnd, GraphOptions{Overlap: OverlapLaterWins})
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		checkGraph(t, name, in)
		m, err := Triangulate(in, Options{Size: SizeField{Global: 1}})
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		if err := m.Check(CheckOptions{Input: in, RegionAreas: nil}); err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		if s := m.Stats(); math.Abs(s.Area-144) > 1e-12*144 {
			t.Errorf("%s: total area %.15g, want 144", name, s.Area)
		}
		l := NewLocator(m)
		for i := 0; i < 200; i++ {
			x, y := -1+12*rng.Float64(), -1+12*rng.Float64()
			want := int32(0)
			near := false
			for _, p := range regions {
				for e := range p.X {
					f := (e + 1) % len(p.X)
					ex, ey := p.X[f]-p.X[e], p.Y[f]-p.Y[e]
					u := math.Min(math.Max(((x-p.X[e])*ex+(y-p.Y[e])*ey)/(ex*ex+ey*ey), 0), 1)
					near = near || math.Hypot(p.X[e]+u*ex-x, p.Y[e]+u*ey-y) < 1e-6
				}
				if PointInPolygon(p.X, p.Y, x, y, 0) == Inside {
					want = p.Region
				}
			}
			if near {
				continue
			}
			tr, _, _, _, ok := l.Find(x, y)
			if !ok || m.Region[tr] != want {
				t.Fatalf("%s: region at (%g, %g) is %d (found %v), want %d", name, x, y, m.Region[tr], ok, want)
			}
		}
	}
}

// BenchmarkBuildInput builds an invented model of n×n round conductors
// (two half-circle arcs each) sitting on shared-edge square cells.
func BenchmarkBuildInput(b *testing.B) {
	for _, n := range []int{5, 20} {
		var regions []Polygon
		for i := 0; i < n; i++ {
			for j := 0; j < n; j++ {
				x, y := float64(i), float64(j)
				regions = append(regions,
					Polygon{X: []float64{x + 0.5 + 0.3, x + 0.5 - 0.3}, Y: []float64{y + 0.5, y + 0.5}, Sweep: []float64{math.Pi, math.Pi}, Region: 2, Marker: 3},
					rect(x, y+0.9, x+1, y+0.95, 3, 4))
			}
		}
		bnd := rect(-1, -1, float64(n)+1, float64(n)+2, 0, 1)
		in, err := BuildInput(regions, bnd, GraphOptions{})
		if err != nil {
			b.Fatal(err)
		}
		b.Run(itoa(len(regions))+"-polygons/"+itoa(len(in.Segments)/2)+"-segments", func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				if _, err := BuildInput(regions, bnd, GraphOptions{}); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// FuzzBuildInput reads up to four polygons of lattice points (so edges
// overlap, touch and cross often), some edges arcs, and checks that
// BuildInput either returns a GraphError or a graph that keeps checkGraph's
// invariants and that Triangulate accepts.
func FuzzBuildInput(f *testing.F) {
	f.Add([]byte{4, 0, 0, 4, 0, 4, 4, 0, 4, 3, 2, 2, 6, 2, 4, 6})
	f.Add([]byte{3, 0, 0, 5, 1, 1, 5, 3, 1, 4, 6, 2, 2, 6, 4, 3, 3, 0, 0, 7, 7, 0})
	f.Add([]byte{2, 1, 1, 5, 1, 0x82, 0x82, 4, 2, 2, 3, 2, 3, 3, 2, 3})
	f.Fuzz(func(t *testing.T, data []byte) {
		var regions []Polygon
		for len(data) > 0 && len(regions) < 4 {
			n := int(data[0]%6) + 2
			data = data[1:]
			if len(data) < 2*n {
				break
			}
			p := Polygon{Region: int32(len(regions) + 1), Marker: int32(len(regions) + 2), Sweep: make([]float64, n)}
			for i := 0; i < n; i++ {
				p.X = append(p.X, float64(data[2*i]&15))
				p.Y = append(p.Y, float64(data[2*i+1]&15))
				if data[2*i]&0x80 != 0 {
					p.Sweep[i] = float64(int(data[2*i+1]>>4)-8) * 0.35
				}
			}
			data = data[2*n:]
			regions = append(regions, p)
		}
		bnd := rect(-2, -2, 18, 18, 0, 1)
		in, err := BuildInput(regions, bnd, GraphOptions{Overlap: OverlapLaterWins, ChordTol: 0.05})
		if err != nil {
			var ge *GraphError
			if !errors.As(err, &ge) {
				t.Fatalf("error of type %T: %v", err, err)
			}
			return
		}
		checkGraph(t, "fuzz", in)
		m, err := Triangulate(in, Options{MinAngle: -1})
		if err != nil {
			t.Fatalf("Triangulate: %v", err)
		}
		if s := m.Stats(); math.Abs(s.Area-400) > 1e-9*400 {
			t.Fatalf("area %.15g, want 400", s.Area)
		}
	})
}
