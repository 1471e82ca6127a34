package mesh

import (
	"math"
	"polegap/internal/compsum"
	"sort"
)

// Stats summarises the size and shape quality of a mesh.
type Stats struct {
	Nodes     int // all nodes, corners and midside nodes
	Vertices  int // corner nodes
	Triangles int

	// MinAngle is the smallest interior angle of any triangle, in degrees.
	MinAngle float64
	// MeanAngle is the mean over triangles of each triangle's smallest
	// angle, in degrees (the mean of all angles is always 60 and says
	// nothing). 60 for a mesh of equilateral triangles.
	MeanAngle float64
	// WorstAspect is the largest aspect ratio of any triangle, where the
	// aspect ratio of a triangle is its longest edge divided by
	// 2*sqrt(3) times its inradius. It is 1 for an equilateral triangle,
	// (1+√2)/√3 ≈ 1.394 for a right isosceles one, and grows without bound as a
	// triangle flattens (+Inf for zero area).
	WorstAspect float64
	// Area is the total area, in m², summed with compensation.
	Area float64
	// PerRegion has one entry per region tag, sorted by tag.
	PerRegion []RegionStats
}

// RegionStats are the triangle count and area of one region.
type RegionStats struct {
	Region    int32
	Triangles int
	Area      float64 // m², compensated sum
}

// Stats computes the size and quality summary of m. An empty mesh gives
// zero values.
func (m *Mesh) Stats() Stats {
	nt := m.NumTriangles()
	s := Stats{Nodes: m.NumNodes(), Vertices: m.NumVertices, Triangles: nt}
	if nt == 0 {
		return s
	}
	s.MinAngle = 180
	var total, meanMin compsum.Sum
	per := make(map[int32]*struct {
		n int
		a compsum.Sum
	})
	for t := 0; t < nt; t++ {
		a, b, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		q := triShape(m.X[a], m.Y[a], m.X[b], m.Y[b], m.X[c], m.Y[c])
		if m.IsCurved(t) {
			q.area = m.TriangleArea(t)
		}
		s.MinAngle = math.Min(s.MinAngle, q.minAngle)
		meanMin.Add(q.minAngle)
		if q.aspect > s.WorstAspect || math.IsInf(q.aspect, 1) {
			s.WorstAspect = q.aspect
		}
		total.Add(q.area)
		var r int32
		if m.Region != nil {
			r = m.Region[t]
		}
		e := per[r]
		if e == nil {
			e = &struct {
				n int
				a compsum.Sum
			}{}
			per[r] = e
		}
		e.n++
		e.a.Add(q.area)
	}
	s.MeanAngle = meanMin.Value() / float64(nt)
	s.Area = total.Value()
	for r, e := range per {
		s.PerRegion = append(s.PerRegion, RegionStats{Region: r, Triangles: e.n, Area: e.a.Value()})
	}
	sort.Slice(s.PerRegion, func(i, j int) bool { return s.PerRegion[i].Region < s.PerRegion[j].Region })
	return s
}

// RegionAreas returns the area of each region tag in m², each a
// compensated sum over its triangles (TriangleArea: curved triangles count
// with their curved sides). A mesh without Region tags counts as region 0.
func (m *Mesh) RegionAreas() map[int32]float64 {
	acc := make(map[int32]*compsum.Sum)
	for t := 0; t < m.NumTriangles(); t++ {
		var r int32
		if m.Region != nil {
			r = m.Region[t]
		}
		s := acc[r]
		if s == nil {
			s = new(compsum.Sum)
			acc[r] = s
		}
		s.Add(m.TriangleArea(t))
	}
	out := make(map[int32]float64, len(acc))
	for r, s := range acc {
		out[r] = s.Value()
	}
	return out
}

// triArea is the signed area of triangle abc (positive when
// counter-clockwise), computed relative to a to limit cancellation.
func triArea(ax, ay, bx, by, cx, cy float64) float64 {
	return 0.5 * ((bx-ax)*(cy-ay) - (by-ay)*(cx-ax))
}

type shape struct {
	area, minAngle, aspect float64
}

// triShape returns the signed area, the smallest angle in degrees and the
// aspect ratio (see Stats.WorstAspect) of triangle abc.
func triShape(ax, ay, bx, by, cx, cy float64) shape {
	area := triArea(ax, ay, bx, by, cx, cy)
	// Edge vectors e0 = c-b (opposite a), e1 = a-c, e2 = b-a.
	e := [3][2]float64{{cx - bx, cy - by}, {ax - cx, ay - cy}, {bx - ax, by - ay}}
	var l [3]float64
	for k := range e {
		l[k] = math.Hypot(e[k][0], e[k][1])
	}
	// The angle at corner k lies between the two edges that meet there:
	// angle = atan2(|u x v|, u.v), accurate for small and large angles
	// alike (unlike acos of the cosine).
	minA := math.Pi
	for k := 0; k < 3; k++ {
		// From corner k, e[(k+2)%3] points to the next corner and
		// -e[(k+1)%3] to the previous one.
		u, v := e[(k+2)%3], e[(k+1)%3]
		cross := u[0]*v[1] - u[1]*v[0]
		dot := u[0]*v[0] + u[1]*v[1]
		minA = math.Min(minA, math.Atan2(math.Abs(cross), -dot))
	}
	per := l[0] + l[1] + l[2]
	longest := math.Max(l[0], math.Max(l[1], l[2]))
	aspect := math.Inf(1)
	if area != 0 {
		// Inradius r = 2|A|/perimeter; equilateral side s has r = s/(2√3).
		r := 2 * math.Abs(area) / per
		aspect = longest / (2 * math.Sqrt(3) * r)
	}
	return shape{area: area, minAngle: minA * 180 / math.Pi, aspect: aspect}
}
