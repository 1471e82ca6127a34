package saturation

import (
	"math"
	"polegap/internal/compsum"

	"polegap/mesh"
)

// Default disc radius of Peak (our choice; see the package
// documentation): GapFraction of the model's gap, but at least
// SizeFraction of the iron's size.
const (
	GapFraction  = 0.5   // a disc one gap across
	SizeFraction = 0.025 // of the longer side of the box around the iron
)

// Region is one iron region to report on.
type Region struct {
	Tag  int32  // region tag in the mesh
	Name string // for the report
	// Curve gives the knee when Knee is 0. It may be nil if Knee is set.
	Curve Curve
	// Knee, T, overrides the curve's knee as the level of AboveKnee.
	Knee float64
	// Corners are the points near which the raw maximum is
	// mesh-dependent: the geometric corners of the iron (Corners).
	Corners [][2]float64
	// Limit, T, is the largest acceptable Peak; 0 means no check.
	Limit float64
	// TableEnd, T, is the flux density at the last point of the
	// curve's table (materials.Curve.TableEnd): above it the curve is
	// extrapolated, and Report.BeyondTable says over how much of the
	// region. 0 means not reported.
	TableEnd float64
}

// Options control Analyse. The zero value uses the defaults.
type Options struct {
	// Radius, m, is the radius of the discs over which Peak averages
	// |B|. 0 means the default: the larger of GapFraction × Gap and
	// SizeFraction × the iron's size, the longer side of the box around
	// the triangles of all the regions asked for.
	Radius float64
	// Gap, m, is the model's air gap, 0 when it has none; it only sets
	// the default Radius.
	Gap float64
	// LinearB optionally gives each triangle's own flux density at its
	// three corners (T, in the order of the corners in m.Tri), for
	// elements whose field varies linearly (second order): Peak then
	// integrates that linear field. nil treats B as constant (b) in each
	// triangle. The raw maximum, the mean and the fractions use b alone.
	LinearB [][3][2]float64
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

	// Peak is the largest mean |B| (T) over a disc of radius Radius (m)
	// centred in the region, at PeakAt, the disc clipped to the region:
	// the figure that converges as the mesh is refined, and the one the
	// limit is checked against.
	Peak   float64
	PeakAt [2]float64
	Radius float64

	// Max is the largest |B| (T) of any triangle, at the centroid MaxAt
	// of triangle MaxTriangle: a mesh-dependent number when it sits at a
	// corner, where |B| grows without bound under refinement (~ r^(−1/3)
	// at a 90° corner). MaxAtCorner is true when MaxAt lies within Radius
	// of a listed corner.
	Max         float64
	MaxAt       [2]float64
	MaxTriangle int
	MaxAtCorner bool

	Mean      float64 // area-weighted mean |B|, T
	Knee      float64 // T
	AboveKnee float64 // area fraction with |B| > Knee
	Levels    []Level

	// TableEnd (T, from Region) and BeyondTable, the area fraction with
	// |B| > TableEnd: how much of the iron ran on the curve's
	// extrapolation past its last table point (0 when TableEnd is 0).
	TableEnd    float64
	BeyondTable float64

	// Limit (T, 0 for none) and Pass: Peak <= Limit.
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
	if opt.Radius < 0 || opt.Gap < 0 {
		panic(errNegative)
	}
	if opt.LinearB != nil && len(opt.LinearB) != nt {
		panic(errBLen)
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
	for t := range opt.LinearB {
		for _, c := range opt.LinearB[t] {
			for _, v := range c {
				if math.IsNaN(v) || math.IsInf(v, 0) {
					return nil, &NonFiniteError{What: "B", Triangle: t, Value: v}
				}
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
		if r.Limit < 0 || r.Knee < 0 || r.TableEnd < 0 {
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
	if opt.Radius == 0 {
		opt.Radius = defaultRadius(m, tris, opt.Gap)
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
	rep := Report{Tag: r.Tag, Name: r.Name, Limit: r.Limit, Knee: r.Knee, TableEnd: r.TableEnd, Triangles: len(tris), MaxTriangle: -1}
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
	rep.Radius = opt.Radius
	rep.Levels = make([]Level, len(opt.Levels))
	var above, beyond compsum.Sum
	aboveL := make([]compsum.Sum, len(opt.Levels))
	rad2 := rep.Radius * rep.Radius
	rep.Max = -1
	for j, t := range tris {
		v := mag[j]
		if v > rep.Knee {
			above.Add(area[j])
		}
		if r.TableEnd > 0 && v > r.TableEnd {
			beyond.Add(area[j])
		}
		for k, l := range opt.Levels {
			if v > l {
				aboveL[k].Add(area[j])
			}
		}
		if v > rep.Max {
			rep.Max, rep.MaxAt, rep.MaxTriangle = v, [2]float64{cx[j], cy[j]}, int(t)
		}
	}
	for _, c := range r.Corners {
		dx, dy := rep.MaxAt[0]-c[0], rep.MaxAt[1]-c[1]
		rep.MaxAtCorner = rep.MaxAtCorner || dx*dx+dy*dy <= rad2
	}
	rep.AboveKnee = above.Value() / total
	rep.BeyondTable = beyond.Value() / total
	for k, l := range opt.Levels {
		rep.Levels[k] = Level{B: l, Fraction: aboveL[k].Value() / total}
	}
	g := newDiscGrid(m, tris, mag, area, opt.LinearB, rep.Radius)
	seeds := append(append(make([][2]float64, 0, len(r.Corners)+1), r.Corners...), rep.MaxAt)
	rep.Peak, rep.PeakAt = g.peak(rep.Radius, seeds)
	rep.Pass = r.Limit == 0 || rep.Peak <= r.Limit
	return rep, nil
}

// babs returns |B|; flux densities are far from overflow, so no Hypot.
func babs(v [2]float64) float64 { return math.Sqrt(v[0]*v[0] + v[1]*v[1]) }

// defaultRadius returns the default disc radius (see Options.Radius) for
// the triangles tris of m.
func defaultRadius(m *mesh.Mesh, tris [][]int32, gap float64) float64 {
	xmin, ymin, xmax, ymax := math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
	for _, ts := range tris {
		for _, t := range ts {
			for k := 0; k < 3; k++ {
				v := m.Tri[3*int(t)+k]
				xmin, xmax = min(xmin, m.X[v]), max(xmax, m.X[v])
				ymin, ymax = min(ymin, m.Y[v]), max(ymax, m.Y[v])
			}
		}
	}
	return max(GapFraction*gap, SizeFraction*max(xmax-xmin, ymax-ymin, 0))
}
