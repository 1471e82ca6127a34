package saturation

import (
	"math"
	"polegap/internal/compsum"

	"polegap/mesh"
)

// DefaultCornerFraction sets the default corner radius: this fraction of
// the square root of the region's area (our choice; see the package
// documentation).
const DefaultCornerFraction = 0.05

// Region is one iron region to report on.
type Region struct {
	Tag  int32  // region tag in the mesh
	Name string // for the report
	// Curve gives the knee when Knee is 0. It may be nil if Knee is set.
	Curve Curve
	// Knee, T, overrides the curve's knee as the level of AboveKnee.
	Knee float64
	// Corners are the points near which the raw maximum is
	// mesh-dependent: the region's re-entrant corners (ReentrantCorners).
	Corners [][2]float64
	// Limit, T, is the largest acceptable MaxAway; 0 means no check.
	Limit float64
}

// Options control Analyse. The zero value uses the defaults.
type Options struct {
	// CornerRadius, m, is the distance from a corner within which
	// triangles are left out of MaxAway; 0 means DefaultCornerFraction
	// times the square root of the region's area.
	CornerRadius float64
	// Levels are further flux densities (T) at which to report the
	// area fraction above.
	Levels []float64
}

// Level is the area fraction of a region where |B| exceeds B.
type Level struct {
	B        float64 // T
	Fraction float64 // of the region's area, 0..1
}

// Report is the saturation of one region.
type Report struct {
	Tag       int32
	Name      string
	Triangles int
	Area      float64 // m²

	// Max is the largest |B| (T) of any triangle, at the centroid MaxAt
	// of triangle MaxTriangle. When MaxAtCorner is true it lies within
	// CornerRadius of a re-entrant corner, where |B| grows without bound
	// under refinement (~ r^(−1/3) at a 90° notch): a mesh-dependent
	// number, not a property of the magnet.
	Max         float64
	MaxAt       [2]float64
	MaxTriangle int
	MaxAtCorner bool

	// MaxAway is the largest |B| (T) over triangles whose centroid lies
	// farther than CornerRadius (m) from every corner, at MaxAwayAt; it
	// equals Max when no corner is listed. AwayTriangles counts those
	// triangles (0: every triangle is near a corner, MaxAway is 0).
	MaxAway       float64
	MaxAwayAt     [2]float64
	AwayTriangles int
	CornerRadius  float64

	Mean      float64 // area-weighted mean |B|, T
	Knee      float64 // T
	AboveKnee float64 // area fraction with |B| > Knee
	Levels    []Level

	// Limit (T, 0 for none) and Pass: MaxAway <= Limit.
	Limit float64
	Pass  bool
}

// Analyse reports on each region of regions, in order, from the mesh m and
// the flux density b per triangle (T). See the package documentation for
// the definitions and errors.
func Analyse(m *mesh.Mesh, b [][2]float64, regions []Region, opt Options) ([]Report, error) {
	if m == nil {
		panic(errNilMesh)
	}
	nt := m.NumTriangles()
	if len(b) != nt {
		panic(errBLen)
	}
	if opt.CornerRadius < 0 {
		panic(errNegative)
	}
	for _, l := range opt.Levels {
		if l < 0 {
			panic(errNegative)
		}
	}
	for t := range b {
		for _, v := range b[t] {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return nil, &NonFiniteError{What: "B", Triangle: t, Value: v}
			}
		}
	}
	// Triangles of each tag asked for, through a tag -> region index table
	// (tags are small non-negative integers; others are never asked for).
	var maxTag int32 = -1
	for _, r := range m.Region {
		maxTag = max(maxTag, r)
	}
	want := make([]int32, maxTag+1)
	for i := range want {
		want[i] = -1
	}
	count := make([]int, len(regions))
	for i, r := range regions {
		if r.Limit < 0 || r.Knee < 0 {
			panic(errNegative)
		}
		if r.Knee == 0 && r.Curve == nil {
			panic(errNoCurve)
		}
		if r.Tag >= 0 && r.Tag <= maxTag {
			want[r.Tag] = int32(i)
		}
	}
	for _, r := range m.Region {
		if r >= 0 && want[r] >= 0 {
			count[want[r]]++
		}
	}
	tris := make([][]int32, len(regions))
	for i := range tris {
		tris[i] = make([]int32, 0, count[i])
	}
	for t, r := range m.Region {
		if r >= 0 && want[r] >= 0 {
			tris[want[r]] = append(tris[want[r]], int32(t))
		}
	}
	out := make([]Report, len(regions))
	for i := range regions {
		rep, err := analyseRegion(m, b, &regions[i], tris[i], opt)
		if err != nil {
			return nil, err
		}
		out[i] = rep
	}
	return out, nil
}

func analyseRegion(m *mesh.Mesh, b [][2]float64, r *Region, tris []int32, opt Options) (Report, error) {
	rep := Report{Tag: r.Tag, Name: r.Name, Limit: r.Limit, Knee: r.Knee, Triangles: len(tris), MaxTriangle: -1}
	if len(tris) == 0 {
		return rep, &EmptyRegionError{Tag: r.Tag, Name: r.Name}
	}
	if rep.Knee == 0 {
		k, err := Knee(r.Curve)
		if err != nil {
			return rep, err
		}
		rep.Knee = k
	}
	area := make([]float64, len(tris))
	mag := make([]float64, len(tris))
	cx := make([]float64, len(tris))
	cy := make([]float64, len(tris))
	var totalS, sumS compsum.Sum
	for j, t := range tris {
		a, bb, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		area[j] = 0.5 * ((m.X[bb]-m.X[a])*(m.Y[c]-m.Y[a]) - (m.X[c]-m.X[a])*(m.Y[bb]-m.Y[a]))
		cx[j] = (m.X[a] + m.X[bb] + m.X[c]) / 3
		cy[j] = (m.Y[a] + m.Y[bb] + m.Y[c]) / 3
		totalS.Add(area[j])
		mag[j] = babs(b[t])
		sumS.Add(area[j] * mag[j])
	}
	total := totalS.Value()
	rep.Area = total
	rep.Mean = sumS.Value() / total
	rep.CornerRadius = opt.CornerRadius
	if rep.CornerRadius == 0 {
		rep.CornerRadius = DefaultCornerFraction * math.Sqrt(total)
	}
	rep.Levels = make([]Level, len(opt.Levels))
	var above compsum.Sum
	aboveL := make([]compsum.Sum, len(opt.Levels))
	rad2 := rep.CornerRadius * rep.CornerRadius
	rep.Max = -1
	for j, t := range tris {
		v := mag[j]
		if v > rep.Knee {
			above.Add(area[j])
		}
		for k, l := range opt.Levels {
			if v > l {
				aboveL[k].Add(area[j])
			}
		}
		near := false
		for _, c := range r.Corners {
			dx, dy := cx[j]-c[0], cy[j]-c[1]
			if dx*dx+dy*dy <= rad2 {
				near = true
				break
			}
		}
		if v > rep.Max {
			rep.Max, rep.MaxAt, rep.MaxTriangle, rep.MaxAtCorner = v, [2]float64{cx[j], cy[j]}, int(t), near
		}
		if !near {
			rep.AwayTriangles++
			if v > rep.MaxAway || rep.AwayTriangles == 1 {
				rep.MaxAway, rep.MaxAwayAt = v, [2]float64{cx[j], cy[j]}
			}
		}
	}
	rep.AboveKnee = above.Value() / total
	for k, l := range opt.Levels {
		rep.Levels[k] = Level{B: l, Fraction: aboveL[k].Value() / total}
	}
	rep.Pass = r.Limit == 0 || rep.MaxAway <= r.Limit
	return rep, nil
}

// babs returns |B|; flux densities are far from overflow, so no Hypot.
func babs(v [2]float64) float64 { return math.Sqrt(v[0]*v[0] + v[1]*v[1]) }

// ReentrantCorners returns the vertices of the polygon (x, y) (either
// orientation, first vertex not repeated) whose interior angle exceeds
// 180° + minTurn degrees (0 means DefaultMinTurn): the corners where the
// field inside a highly permeable region is singular. Corners finds the
// convex ones too. The orientation of
// each vertex is decided by mesh.Orient2D. It panics if the polygon has
// fewer than 3 vertices or minTurn is outside [0, 180).
func ReentrantCorners(x, y []float64, minTurn float64) [][2]float64 {
	n := len(x)
	if n != len(y) || n < 3 {
		panic(errPolygonLen)
	}
	if !(minTurn >= 0 && minTurn < 180) {
		panic(errMinTurn)
	}
	if minTurn == 0 {
		minTurn = DefaultMinTurn
	}
	ccw := mesh.PolygonArea(x, y) > 0
	cosMax := math.Cos(minTurn * math.Pi / 180)
	var out [][2]float64
	for i := range n {
		p, q := (i+n-1)%n, (i+1)%n
		o := mesh.Orient2D(x[p], y[p], x[i], y[i], x[q], y[q])
		// A right turn on a counter-clockwise polygon is a reflex vertex.
		reflex := (ccw && o == mesh.CW) || (!ccw && o == mesh.CCW)
		if !reflex {
			continue
		}
		// The turn angle between the incoming and outgoing edges.
		ux, uy := x[i]-x[p], y[i]-y[p]
		vx, vy := x[q]-x[i], y[q]-y[i]
		cos := (ux*vx + uy*vy) / (math.Hypot(ux, uy) * math.Hypot(vx, vy))
		if cos < cosMax {
			out = append(out, [2]float64{x[i], y[i]})
		}
	}
	return out
}
