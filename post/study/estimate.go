package study

import (
	"bufio"
	"fmt"
	"math"
	"os"
	"strconv"
	"strings"

	"polegap/mesh"
	"polegap/models"
)

// Footprint is the predicted size of a model's mesh and solve, computed
// from its size field before any meshing.
type Footprint struct {
	// Triangles is the estimated number of triangles of the quality mesh.
	Triangles int
	// Nodes is the estimated number of mesh nodes: about half the
	// triangles for first-order elements, twice that for second order.
	Nodes int
	// Bytes is the estimated peak memory of meshing and solving: a fixed
	// amount per node plus the sparse Cholesky factor.
	Bytes int64
	// Partial is true when the estimate stopped early because it already
	// exceeded the limit it was checked against; the true figures are
	// larger still.
	Partial bool
	// Feature is the small feature that forces most of the triangles, when
	// small features force at least half of them; nil otherwise.
	Feature *SmallFeature
}

// SmallFeature is a place where two edges of the geometry that do not
// meet come far closer than the mesh size there: a sliver region, a thin
// part of a region, a thin gap between two regions or between a region
// and the outer boundary. Quality meshing puts triangles no larger than
// that distance along it (Ruppert 1995), so a hair-thin feature costs
// millions of triangles the mesh sizes do not show.
type SmallFeature struct {
	// Region and Other are the model region indices of the two edges
	// (equal for a thin part or sliver of one region; -1 for the outer
	// boundary).
	Region, Other int
	// Sliver is true when the whole region is about as thin as Size (its
	// width, twice its area over its perimeter, is below 4 Size).
	Sliver bool
	Size   float64 // the smallest distance across, m
	Length float64 // the length of the feature, m
	X, Y   float64 // where it is thinnest, m
	// Triangles is the estimated number of triangles the feature forces.
	Triangles float64
}

// Describe says what the feature is in the words of the model file:
// `region "gap-shim" is a sliver 3e-05 mm thick over 60 mm`.
func (f *SmallFeature) Describe(m *models.Model) string {
	name := func(i int) string {
		if i < 0 || i >= len(m.Regions) {
			return "the outer boundary"
		}
		return fmt.Sprintf("region %q", m.Regions[i].Name)
	}
	size, length := formatShort(f.Size, m.Units), formatShort(f.Length, m.Units)
	at := fmt.Sprintf("near (%s, %s)", formatShort(f.X, m.Units), formatShort(f.Y, m.Units))
	switch {
	case f.Region == f.Other && f.Sliver:
		return fmt.Sprintf("%s is a sliver %s thick over %s %s", name(f.Region), size, length, at)
	case f.Region == f.Other:
		return fmt.Sprintf("%s has a part %s thin over %s %s", name(f.Region), size, length, at)
	}
	return fmt.Sprintf("%s and %s are %s apart over %s %s", name(f.Region), name(f.Other), size, length, at)
}

// Calibration of the estimate. See estimate_test.go for how the triangle
// factor was measured on the embedded examples.
const (
	// qualityFactor multiplies the count of equilateral triangles of the
	// local size: quality refinement splits edges at midpoints, so most
	// edges end between half and the full size (mesh.SizeField's doc: about
	// 5 triangles per size squared in the interior against 2.31 for
	// equilateral triangles of the full size). Measured on the embedded
	// examples at their own and at half their mesh size (estimate_test.go):
	// real/raw lies between 2.2 and 2.4.
	qualityFactor = 2.3
	// bytesPerNode is the memory of mesh, problem, assembled matrix and
	// vectors per node, excluding the factor: the design budget of 1 KiB
	// per node (DESIGN.md, "Figures it must reach").
	bytesPerNode = 1024
	// factorEntries is c in nnz(L) ≈ c·N·log2(N) for a nested-dissection
	// ordering of a 2D mesh (George 1973, "Nested dissection of a regular
	// finite element mesh", SIAM J. Numer. Anal. 10, gives 31/4 for the
	// 5-point grid); second-order elements couple more nodes per row,
	// which the 2× below accounts for (a rough allowance, common practice).
	factorEntries = 31.0 / 4
	// bytesPerFactorEntry: a float64 value and, amortised over supernodes,
	// well under one int32 index.
	bytesPerFactorEntry = 10
	// maxCells bounds the work of the estimate's quadrature.
	maxCells = 100_000
	// rootCells is the number of cells across the longer side of the
	// domain on the coarsest level.
	rootCells = 32
)

// DefaultMemory is the memory assumed available when /proc/meminfo cannot
// be read, in bytes.
const DefaultMemory int64 = 16 << 30

// AvailableMemory returns MemAvailable from /proc/meminfo in bytes, or
// DefaultMemory when it cannot be read.
func AvailableMemory() int64 {
	f, err := os.Open("/proc/meminfo")
	if err != nil {
		return DefaultMemory
	}
	defer f.Close()
	sc := bufio.NewScanner(f)
	for sc.Scan() {
		rest, ok := strings.CutPrefix(sc.Text(), "MemAvailable:")
		if !ok {
			continue
		}
		fields := strings.Fields(rest)
		if len(fields) == 0 {
			break
		}
		kb, err := strconv.ParseInt(fields[0], 10, 64)
		if err != nil || kb <= 0 {
			break
		}
		return kb << 10
	}
	return DefaultMemory
}

// Limits bound what CheckFootprint lets through. The zero value means
// mesh.DefaultMaxTriangles and AvailableMemory().
type Limits struct {
	MaxTriangles int   // 0: opt.MaxTriangles, or mesh.DefaultMaxTriangles
	MaxBytes     int64 // 0: AvailableMemory()
}

// Estimate predicts the footprint of meshing m with opt. It integrates the
// number of equilateral triangles of the local size, 1/(√3/4·h²), over the
// domain on an adaptive grid of cells (a cell is split while the size may
// vary by more than a factor 3 across it), and scales the result
// by the quality-refinement factor. It never meshes. maxTriangles > 0 lets
// it stop as soon as a lower bound on the count exceeds that (Partial).
func Estimate(m *models.Model, opt mesh.Options, maxTriangles int) (Footprint, error) {
	bd, err := Boundary(m)
	if err != nil {
		return Footprint{}, err
	}
	e := newEstimator(m, &opt.Size, &bd)
	fp := Footprint{}
	ft, per := e.featureTriangles()
	fp.Feature = e.worst(m, per)
	var tri float64
	var partial bool
	if maxTriangles > 0 && ft*qualityFactor > float64(maxTriangles) {
		tri, partial = ft, false // the features alone pass the limit: no quadrature needed
	} else {
		tri, partial = e.integrate(float64(maxTriangles))
		if !partial && ft > tri {
			tri = ft
		}
	}
	n := tri * qualityFactor
	if partial {
		n = tri // a lower bound: no mesh meeting the size field has fewer
	}
	fp.Partial = partial
	if fp.Feature != nil {
		fp.Feature.Triangles = fp.Feature.Triangles * qualityFactor
		if fp.Feature.Triangles < 0.5*n {
			fp.Feature = nil // not what decides the size
		}
	}
	fp.Triangles = clampInt(n)
	nodes := n / 2
	if opt.Order == 2 {
		nodes = 2 * n
	}
	fp.Nodes = clampInt(nodes)
	fp.Bytes = int64(footprintBytes(n, opt.Order))
	return fp, nil
}

// footprintBytes is the memory model of Estimate for n triangles of the
// given order: bytesPerNode per node plus the sparse Cholesky factor.
func footprintBytes(n float64, order int) float64 {
	nodes := n / 2
	c := factorEntries
	if order == 2 {
		nodes = 2 * n
		c *= 2
	}
	bytes := nodes*bytesPerNode + c*nodes*math.Log2(math.Max(nodes, 2))*bytesPerFactorEntry
	if bytes > math.MaxInt64/2 {
		bytes = math.MaxInt64 / 2
	}
	return bytes
}

// CheckFootprint estimates the footprint of meshing m with opt and returns
// a *TooLargeError when it exceeds the limits. It is cheap (a few
// milliseconds) and runs before meshing.
func CheckFootprint(m *models.Model, opt mesh.Options, lim Limits) (Footprint, error) {
	maxT := lim.MaxTriangles
	if maxT <= 0 {
		maxT = opt.MaxTriangles
	}
	if maxT <= 0 {
		maxT = mesh.DefaultMaxTriangles
	}
	maxB := lim.MaxBytes
	if maxB <= 0 {
		maxB = AvailableMemory()
	}
	fp, err := Estimate(m, opt, maxT)
	if err != nil {
		return fp, err
	}
	if fp.Triangles > maxT || fp.Bytes > maxB {
		e := &TooLargeError{File: m.File, Line: m.Mesh.Pos.Line, Column: m.Mesh.Pos.Column, Footprint: fp, MaxTriangles: maxT, MaxBytes: maxB, Size: m.Mesh.Size, Units: m.Units}
		if m.Mesh.Auto {
			e.Size, e.Auto = 0, true
		}
		if f := fp.Feature; f != nil {
			e.Feature, e.FeatureText = f, f.Describe(m)
			if r := max(f.Region, f.Other); r >= 0 && r < len(m.Regions) {
				e.Line, e.Column = m.Regions[r].Pos.Line, m.Regions[r].Pos.Column
			}
		}
		return fp, e
	}
	return fp, nil
}

// TooLargeError reports a model whose mesh or solve would exceed the
// triangle limit or the machine's memory.
type TooLargeError struct {
	File         string
	Line, Column int // of the mesh controls in the model file; 0 when absent
	Footprint    Footprint
	MaxTriangles int
	MaxBytes     int64
	Size         float64 // the model's mesh size in metres (0: none)
	Units        string
	// Auto is true when the sizes were the automatic ones
	// (models.MeshControls.Auto): the file states none to enlarge.
	Auto bool
	// Feature, when set, is the small feature that forces most of the
	// triangles, described in the model's words (SmallFeature.Describe);
	// File, Line and Column are then those of its region.
	Feature     *SmallFeature
	FeatureText string
}

func (e *TooLargeError) Error() string {
	fp := e.Footprint
	at := ""
	if fp.Partial {
		at = "at least "
	}
	var over string
	if fp.Triangles > e.MaxTriangles {
		over = fmt.Sprintf("over the limit of %d triangles", e.MaxTriangles)
	} else {
		over = fmt.Sprintf("over the %s of memory available", formatBytes(e.MaxBytes))
	}
	fix := "enlarge mesh.size, the regions' mesh-size or the refine sizes"
	if e.Auto {
		fix = "the automatic sizes follow the model's narrowest gaps, thinnest iron and sharpest corners; check for a sliver of air or iron you did not mean, or set mesh.size (and refine where it matters) to choose the sizes yourself"
	}
	if e.Size > 0 {
		// Triangles scale as 1/size²: the size that would fit.
		r := math.Sqrt(float64(fp.Triangles) / float64(e.MaxTriangles))
		if b := math.Sqrt(float64(fp.Bytes) / float64(e.MaxBytes)); b > r {
			r = b
		}
		if r > 1 {
			how := "about"
			if fp.Partial {
				how = "at least"
			}
			fix = fmt.Sprintf("enlarge mesh.size (now %s) %s %.3g times, or the regions' mesh-size and refine sizes", formatLength(e.Size, e.Units), how, 1.2*r)
		}
	}
	where := e.File
	if e.Line > 0 {
		where = fmt.Sprintf("%s:%d:%d: mesh", e.File, e.Line, e.Column)
	}
	if e.Feature != nil {
		if e.Line > 0 {
			where = fmt.Sprintf("%s:%d:%d: regions[%d]", e.File, e.Line, e.Column, max(e.Feature.Region, e.Feature.Other))
		}
		fix := "remove or thicken it"
		if e.Feature.Region != e.Feature.Other {
			fix = "close or widen the gap"
		}
		return fmt.Sprintf("%s: %s, far below the mesh size: meshing it would need %s%.3g triangles, %.3g nodes and about %s of memory, %s; "+
			"%s, or set mesh.min-feature (a length above %s) to drop regions thinner than that and close such gaps deliberately",
			where, e.FeatureText, at, float64(fp.Triangles), float64(fp.Nodes), formatBytes(fp.Bytes), over, fix, formatShort(e.Feature.Size, e.Units))
	}
	return fmt.Sprintf("%s: the mesh would need %s%.3g triangles, %.3g nodes and about %s of memory, %s; %s",
		where, at, float64(fp.Triangles), float64(fp.Nodes), formatBytes(fp.Bytes), over, fix)
}

func formatBytes(b int64) string {
	const k = 1024.0
	v := float64(b)
	switch {
	case v >= k*k*k*k:
		return fmt.Sprintf("%.3g TiB", v/(k*k*k*k))
	case v >= k*k*k:
		return fmt.Sprintf("%.3g GiB", v/(k*k*k))
	case v >= k*k:
		return fmt.Sprintf("%.3g MiB", v/(k*k))
	}
	return fmt.Sprintf("%.3g KiB", v/k)
}

// formatLength writes a length in metres in the model's units.
func formatLength(m float64, units string) string {
	f := map[string]float64{"mm": 1e-3, "cm": 1e-2, "m": 1, "in": 0.0254}[units]
	if f == 0 {
		return fmt.Sprintf("%g m", m)
	}
	return fmt.Sprintf("%g %s", m/f, units)
}

// formatShort is formatLength with three significant digits.
func formatShort(m float64, units string) string {
	f := map[string]float64{"mm": 1e-3, "cm": 1e-2, "m": 1, "in": 0.0254}[units]
	if f == 0 {
		return fmt.Sprintf("%.3g m", m)
	}
	return fmt.Sprintf("%.3g %s", m/f, units)
}

func clampInt(x float64) int {
	if !(x < math.MaxInt32*1024.0) {
		return math.MaxInt32 * 1024
	}
	return int(math.Round(x))
}

// estimator integrates the triangle density of a size field over a domain.
type estimator struct {
	f          *mesh.SizeField
	noReg      mesh.SizeField // f without region sizes: g-Lipschitz, for bounds
	g          float64
	dom        ring
	regions    []ring
	tags       []int32
	feat       []mesh.SizeLine // small features, graded by featureGrading
	featInfo   []featureLine   // where each of feat comes from
	minFeature float64         // mesh.min-feature: smaller features close
	featField  mesh.SizeField  // feat as a size field, indexed
	regBoxes   *edgeGrid       // the regions' bounding boxes, as diagonals
	touch      float64         // edges this close touch: the mesher's MergeTol
	regAll     []int32         // 0..len(regions)-1, when regBoxes is nil
	xmin       float64
	ymin       float64
	xmax       float64
	ymax       float64
}

// ring is a closed polyline with its bounding box; arcs are replaced by
// chords of at most 10 degrees.
type ring struct {
	x, y                   []float64
	xmin, ymin, xmax, ymax float64
	grid                   *edgeGrid // for rings of many edges (gridRing)
}

// gridRing is the number of edges from which a ring's queries go through
// an edgeGrid.
const gridRing = 64

func newRing(x, y, sweep []float64) ring {
	var r ring
	n := len(x)
	for i := 0; i < n; i++ {
		j := (i + 1) % n
		r.x, r.y = append(r.x, x[i]), append(r.y, y[i])
		var s float64
		if i < len(sweep) {
			s = sweep[i]
		}
		if s == 0 {
			continue
		}
		// The arc from vertex i to vertex j turns by s (counter-clockwise
		// when positive) about a centre on the chord's left for s > 0.
		mx, my := 0.5*(x[i]+x[j]), 0.5*(y[i]+y[j])
		dx, dy := x[j]-x[i], y[j]-y[i]
		c := math.Hypot(dx, dy)
		if c == 0 {
			continue
		}
		t := 0.5 / math.Tan(0.5*s)
		cx, cy := mx-dy*t, my+dx*t
		k := int(math.Ceil(math.Abs(s) / (10 * math.Pi / 180)))
		for q := 1; q < k; q++ {
			a := s * float64(q) / float64(k)
			ca, sa := math.Cos(a), math.Sin(a)
			px, py := x[i]-cx, y[i]-cy
			r.x, r.y = append(r.x, cx+ca*px-sa*py), append(r.y, cy+sa*px+ca*py)
		}
	}
	r.xmin, r.ymin, r.xmax, r.ymax = math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
	for i := range r.x {
		r.xmin, r.xmax = math.Min(r.xmin, r.x[i]), math.Max(r.xmax, r.x[i])
		r.ymin, r.ymax = math.Min(r.ymin, r.y[i]), math.Max(r.ymax, r.y[i])
	}
	if n := len(r.x); n > gridRing {
		// Segment k runs from vertex k-1 to vertex k, as contains walks them.
		ax, ay := make([]float64, n), make([]float64, n)
		for k := range n {
			j := (k + n - 1) % n
			ax[k], ay[k] = r.x[j], r.y[j]
		}
		r.grid = newEdgeGrid(ax, ay, r.x, r.y)
	}
	return r
}

// contains reports whether (x, y) lies inside the ring (even-odd rule). It
// is a magnitude estimate for quadrature, not a geometric decision.
func (r *ring) contains(x, y float64) bool {
	if x < r.xmin || x > r.xmax || y < r.ymin || y > r.ymax {
		return false
	}
	if r.grid != nil {
		return r.grid.crossings(x, y)%2 == 1
	}
	in := false
	n := len(r.x)
	for i, j := 0, n-1; i < n; j, i = i, i+1 {
		if (r.y[i] > y) != (r.y[j] > y) &&
			x < r.x[j]+(y-r.y[j])*(r.x[i]-r.x[j])/(r.y[i]-r.y[j]) {
			in = !in
		}
	}
	return in
}

// within reports whether an edge of the ring lies within d of (x, y).
func (r *ring) within(x, y, d float64) bool {
	if r.grid != nil {
		return r.grid.within(x, y, d)
	}
	return r.dist(x, y) <= d
}

// dist returns the distance from (x, y) to the ring's edges.
func (r *ring) dist(x, y float64) float64 {
	d := math.Inf(1)
	n := len(r.x)
	for i, j := 0, n-1; i < n; j, i = i, i+1 {
		d = min(d, mesh.SegmentDistance(x, y, r.x[j], r.y[j], r.x[i], r.y[i]))
	}
	return d
}

func newEstimator(m *models.Model, f *mesh.SizeField, bd *mesh.Polygon) *estimator {
	e := &estimator{g: f.Grading, minFeature: m.Mesh.MinFeature, touch: GraphOptions(m, f).MergeTol}
	if e.g <= 0 {
		e.g = mesh.DefaultGrading
	}
	e.dom = newRing(bd.X, bd.Y, bd.Sweep)
	// The field's sources in a grid, as the mesher holds them: a model
	// with many edges has as many size lines.
	fi := f.Indexed(e.dom.x, e.dom.y)
	e.f, e.noReg = &fi, fi
	e.noReg.Region = nil
	e.xmin, e.ymin, e.xmax, e.ymax = e.dom.xmin, e.dom.ymin, e.dom.xmax, e.dom.ymax
	all := []ring{e.dom}
	for i := range m.Regions {
		r := &m.Regions[i]
		rg := newRing(r.X, r.Y, r.Sweep)
		all = append(all, rg)
		if s := f.Region[Tag(i)]; s > 0 {
			e.regions = append(e.regions, rg)
			e.tags = append(e.tags, Tag(i))
		}
	}
	e.addFeatures(all)
	return e
}

// featureSamples is the number of pieces each edge is cut into when looking
// for small features.
const featureSamples = 16

// addFeatures adds to the size field (the estimator's copy) the local
// feature size of the geometry where it is finer than the field: quality
// refinement cannot leave triangles much larger than the distance between
// two edges that do not meet (Ruppert 1995, "A Delaunay refinement
// algorithm for quality 2-dimensional mesh generation", J. Algorithms 18,
// Theorem 1: the spacing is proportional to the local feature size). A thin
// sliver region or a hair-thin air gap between regions thus costs
// triangles that the model's mesh sizes do not show. Each edge is cut into
// featureSamples pieces; a piece gets a feature line at the smaller feature
// size of its ends when that is below half the field there.
func (e *estimator) addFeatures(rings []ring) {
	type edge struct {
		x0, y0, x1, y1 float64
		ring           int
	}
	var edges []edge
	for k, r := range rings {
		n := len(r.x)
		for i := 0; i < n; i++ {
			j := (i + 1) % n
			edges = append(edges, edge{r.x[i], r.y[i], r.x[j], r.y[j], k})
		}
	}
	ax, ay := make([]float64, len(edges)), make([]float64, len(edges))
	bx, by := make([]float64, len(edges)), make([]float64, len(edges))
	for k, g := range edges {
		ax[k], ay[k], bx[k], by[k] = g.x0, g.y0, g.x1, g.y1
	}
	grid := newEdgeGrid(ax, ay, bx, by)
	// Edges that share an end point (adjacent edges, or regions meeting at
	// a vertex) or lie on each other are not features: the mesher joins them.
	ext := math.Max(e.xmax-e.xmin, e.ymax-e.ymin)
	// Touching is decided at the mesher's resolution (GraphOptions'
	// MergeTol): a sliver just above it is meshed, so it is a feature.
	touch := e.touch
	// lfs returns the distance from (x, y) on edge self to the nearest
	// edge that does not reach self, and that edge, when it is at most r
	// away (+Inf and -1 otherwise): the grid looks at the edges near the
	// point only.
	near1 := func(x, y float64, self int, r float64) (float64, int) {
		d, near := math.Inf(1), -1
		a := edges[self]
		grid.visit(x-r, y-r, x+r, y+r, func(k int) {
			if k == self {
				return
			}
			g := edges[k]
			q := mesh.SegmentDistance(x, y, g.x0, g.y0, g.x1, g.y1)
			if q <= touch || q > r || q > d || q == d && k > near {
				return
			}
			// Skip the edges that reach the sample's own edge.
			if mesh.SegmentDistance(g.x0, g.y0, a.x0, a.y0, a.x1, a.y1) <= touch || mesh.SegmentDistance(g.x1, g.y1, a.x0, a.y0, a.x1, a.y1) <= touch ||
				mesh.SegmentDistance(a.x0, a.y0, g.x0, g.y0, g.x1, g.y1) <= touch || mesh.SegmentDistance(a.x1, a.y1, g.x0, g.y0, g.x1, g.y1) <= touch {
				return
			}
			d, near = q, k
		})
		return d, near
	}
	// The search widens from a few lengths of the sample's own edge: on
	// an outline of many short edges the nearest one is close by.
	lfs := func(x, y float64, self int, r float64) (float64, int) {
		a := edges[self]
		rr := math.Min(r, 4*math.Max(math.Hypot(a.x1-a.x0, a.y1-a.y0), touch))
		for {
			d, near := near1(x, y, self, rr)
			if near >= 0 || rr >= r {
				return d, near
			}
			rr = math.Min(r, 4*rr)
		}
	}
	var added []mesh.SizeLine
	e.featInfo = e.featInfo[:0]
	var mids []float64
	for k, a := range edges {
		// An edge far shorter than the size at it needs fewer samples.
		ln := math.Hypot(a.x1-a.x0, a.y1-a.y0)
		ns := featureSamples
		if h := e.f.At(0.5*(a.x0+a.x1), 0.5*(a.y0+a.y1), AirTag); ln < h {
			ns = max(2, min(featureSamples, int(math.Ceil(featureSamples*ln/h))))
		}
		// The size at each piece's middle; a feature counts where it is
		// below half of that, so no edge farther than half the largest
		// matters.
		mids = mids[:0]
		r := 0.0
		for s := 1; s <= ns; s++ {
			t := (float64(s) - 0.5) / float64(ns)
			h := e.f.At(a.x0+t*(a.x1-a.x0), a.y0+t*(a.y1-a.y0), AirTag)
			mids = append(mids, h)
			r = math.Max(r, 0.5*h)
		}
		if math.IsInf(r, 1) {
			r = 2 * ext
		}
		px, py := a.x0, a.y0
		pl, pn := lfs(px, py, k, r)
		for s := 1; s <= ns; s++ {
			t := float64(s) / float64(ns)
			qx, qy := a.x0+t*(a.x1-a.x0), a.y0+t*(a.y1-a.y0)
			ql, qn := lfs(qx, qy, k, r)
			size, other := pl, pn
			if ql < pl {
				size, other = ql, qn
			}
			// Features below mesh.min-feature close when the graph is built.
			if h := mids[s-1]; size < math.Inf(1) && size < 0.5*h && size >= e.minFeature {
				added = append(added, mesh.SizeLine{X0: px, Y0: py, X1: qx, Y1: qy, Size: size})
				e.featInfo = append(e.featInfo, featureLine{ring: a.ring, other: edges[other].ring, field: h})
			}
			px, py, pl, pn = qx, qy, ql, qn
		}
	}
	e.feat = added
	// The lines of a many-vertex outline merge into chords for the
	// quadrature (featureTriangles counts them one by one).
	e.featField = mesh.SizeField{Lines: simplifyLines(added, featureGrading, 0.25), Grading: featureGrading}.Indexed(e.dom.x, e.dom.y)
}

// worst returns the group of feature lines (the pair of rings they lie
// between) that forces the most triangles, per holding each line's count.
func (e *estimator) worst(m *models.Model, per []float64) *SmallFeature {
	type pair struct{ a, b int }
	groups := map[pair]*SmallFeature{}
	var best *SmallFeature
	for i, l := range e.feat {
		fi := e.featInfo[i]
		p := pair{min(fi.ring, fi.other), max(fi.ring, fi.other)}
		g := groups[p]
		if g == nil {
			g = &SmallFeature{Region: p.a - 1, Other: p.b - 1, Size: math.Inf(1)}
			groups[p] = g
		}
		g.Triangles += per[i]
		g.Length += math.Hypot(l.X1-l.X0, l.Y1-l.Y0)
		if l.Size < g.Size {
			g.Size, g.X, g.Y = l.Size, 0.5*(l.X0+l.X1), 0.5*(l.Y0+l.Y1)
		}
		if best == nil || g.Triangles > best.Triangles || g.Triangles == best.Triangles && (g.Region < best.Region || g.Region == best.Region && g.Other < best.Other) {
			best = g
		}
	}
	if best == nil || best.Triangles == 0 {
		return nil
	}
	// Each side of a thin part or gap is one line; it is as long as one side.
	best.Length *= 0.5
	if best.Region == best.Other {
		if r := best.Region; r >= 0 && r < len(m.Regions) {
			best.Sliver = regionWidth(&m.Regions[r]) < 4*best.Size
		}
	}
	return best
}

// regionWidth returns twice a region's area over its perimeter (arcs as
// chords): the width of a long thin strip.
func regionWidth(r *models.Region) float64 {
	rg := newRing(r.X, r.Y, r.Sweep)
	var a, p float64
	n := len(rg.x)
	for i := 0; i < n; i++ {
		j := (i + 1) % n
		a += rg.x[i]*rg.y[j] - rg.x[j]*rg.y[i]
		p += math.Hypot(rg.x[j]-rg.x[i], rg.y[j]-rg.y[i])
	}
	if p == 0 {
		return 0
	}
	return math.Abs(a) / p
}

// featureLine says where a feature line of the estimator comes from: the
// ring (0 the outer boundary, i+1 region i) of the edge it lies on, the
// ring of the nearest edge that makes it a feature, and the size the
// model's field asks for there.
type featureLine struct {
	ring, other int
	field       float64
}

// featureTriangles returns a lower bound on the number of equilateral
// triangles the small features force, counted band by band: along a
// feature line of length ℓ and feature size s the size grows with slope
// featureGrading away from the line until it meets the field H, so one
// side of the line holds ∫ ds/(√3/4·(s+d)²) = ℓ/(√3/4)·(1/s − 1/H)
// triangles per unit length (the two sides of a sliver are the two lines
// of its faces). The cell quadrature of integrate cannot resolve a band
// far thinner than its cells; this count can.
func (e *estimator) featureTriangles() (total float64, per []float64) {
	const eq = 0.4330127018922193 // √3/4
	per = make([]float64, len(e.feat))
	for i, l := range e.feat {
		h := e.featInfo[i].field
		if !(l.Size > 0) || !(h > l.Size) {
			continue
		}
		ln := math.Hypot(l.X1-l.X0, l.Y1-l.Y0)
		per[i] = ln / eq * (1/l.Size - 1/h) / featureGrading
		total += per[i]
	}
	return total, per
}

// featureGrading is the growth of the mesh size per unit distance away
// from a small feature: the local feature size itself grows with slope 1
// (Ruppert 1995, Lemma 2), and the measured sliver meshes grade about so.
const featureGrading = 1.0

// featureSize returns the size the small features ask for at (x, y), +Inf
// where there are none.
func (e *estimator) featureSize(x, y float64) float64 {
	return e.featField.At(x, y, AirTag)
}

// cell is one rectangle of the adaptive grid.
type cell struct{ x0, y0, x1, y1 float64 }

// density returns the number of equilateral triangles of the local size
// per unit area at the cell's centre, a lower bound on it over the whole
// cell (0 unless the whole cell lies in the domain), and whether the size
// may vary by more than a factor 3 across the cell (so that it should be
// split).
func (e *estimator) density(c cell) (est, low float64, split bool) {
	x, y := 0.5*(c.x0+c.x1), 0.5*(c.y0+c.y1)
	if !e.dom.contains(x, y) {
		return 0, 0, false
	}
	rad := 0.5 * math.Hypot(c.x1-c.x0, c.y1-c.y0)
	// Bounds on h over the cell: the region-free field is g-Lipschitz; a
	// region's size caps both bounds when the cell lies inside the region,
	// and the lower one when the cell straddles its edge.
	hn := e.noReg.At(x, y, AirTag)
	lo, hi := math.Max(hn-e.g*rad, 0), hn+e.g*rad
	hf := e.featureSize(x, y)
	lo, hi = math.Min(lo, math.Max(hf-featureGrading*rad, 0)), math.Min(hi, hf+featureGrading*rad)
	tag := AirTag
	for _, k := range e.regionsAt(x, y) {
		if e.regions[k].contains(x, y) {
			tag = e.tags[k]
			s := e.f.Region[tag]
			lo = math.Min(lo, s)
			if !e.regions[k].within(x, y, rad) {
				hi = math.Min(hi, s)
			}
			break
		}
	}
	// f.At(x, y, tag) without evaluating the lines twice: the region-free
	// field capped by the region's size.
	h := math.Min(hn, hf)
	if s := e.f.Region[tag]; s > 0 && s < h {
		h = s
	}
	const eq = 0.4330127018922193 // √3/4: area of the unit equilateral triangle
	est = 1 / (eq * h * h)
	inside := e.dom.contains(c.x0, c.y0) && e.dom.contains(c.x1, c.y0) &&
		e.dom.contains(c.x0, c.y1) && e.dom.contains(c.x1, c.y1)
	if inside && hi < math.Inf(1) {
		low = 1 / (eq * hi * hi)
	}
	return est, low, hi > 3*lo
}

// integrate returns the number of equilateral triangles of the local size
// that fill the domain. With limit > 0 it stops once a lower bound on that
// number exceeds limit, returning the bound and partial = true.
func (e *estimator) integrate(limit float64) (n float64, partial bool) {
	w, h := e.xmax-e.xmin, e.ymax-e.ymin
	if !(w > 0) || !(h > 0) {
		return 0, false
	}
	side := math.Max(w, h) / rootCells
	nx, ny := int(math.Ceil(w/side)), int(math.Ceil(h/side))
	dx, dy := w/float64(nx), h/float64(ny)
	level := make([]cell, 0, nx*ny)
	for j := 0; j < ny; j++ {
		for i := 0; i < nx; i++ {
			x0, y0 := e.xmin+float64(i)*dx, e.ymin+float64(j)*dy
			level = append(level, cell{x0, y0, x0 + dx, y0 + dy})
		}
	}
	var done, doneLow float64
	cells := len(level)
	var next []cell
	for len(level) > 0 {
		next = next[:0]
		var pendLow float64
		for _, c := range level {
			area := (c.x1 - c.x0) * (c.y1 - c.y0)
			est, low, split := e.density(c)
			// Split while the size may change by more than a factor 3
			// across the cell, within the cell budget.
			if split && cells+4 <= maxCells {
				xm := 0.5 * (c.x0 + c.x1)
				ym := 0.5 * (c.y0 + c.y1)
				next = append(next, cell{c.x0, c.y0, xm, ym}, cell{xm, c.y0, c.x1, ym},
					cell{c.x0, ym, xm, c.y1}, cell{xm, ym, c.x1, c.y1})
				cells += 4
				pendLow += low * area
				continue
			}
			done += est * area
			doneLow += low * area
		}
		if limit > 0 && doneLow+pendLow > limit {
			return doneLow + pendLow, true
		}
		level, next = next, level
	}
	return done, false
}

// regionsAt returns the indices, increasing, of the regions of e.regions
// whose bounding box may hold (x, y): all of them for a few regions, the
// ones listed in the grid cell of (x, y) for many.
func (e *estimator) regionsAt(x, y float64) []int32 {
	if e.regBoxes == nil {
		if len(e.regAll) != len(e.regions) {
			e.regAll = make([]int32, len(e.regions))
			for k := range e.regAll {
				e.regAll[k] = int32(k)
			}
		}
		if len(e.regions) <= gridRing {
			return e.regAll
		}
		n := len(e.regions)
		ax, ay, bx, by := make([]float64, n), make([]float64, n), make([]float64, n), make([]float64, n)
		for k := range e.regions {
			r := &e.regions[k]
			ax[k], ay[k], bx[k], by[k] = r.xmin, r.ymin, r.xmax, r.ymax
		}
		e.regBoxes = newEdgeGrid(ax, ay, bx, by)
	}
	g := e.regBoxes
	if x < g.x0 || y < g.y0 || x > g.x0+float64(g.nx)*g.cw || y > g.y0+float64(g.ny)*g.ch {
		return nil
	}
	i, j := g.cell(x, y)
	c := j*g.nx + i
	return g.idx[g.start[c]:g.start[c+1]]
}
