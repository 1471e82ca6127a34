package mesh

import (
	"fmt"
	"math"
)

// CheckOptions select the optional invariants Check verifies.
type CheckOptions struct {
	// MinAngle, in degrees, is the smallest angle allowed; 0 skips the test.
	// Triangles whose small angle comes from the input are exempt: an angle
	// between two segment edges at one corner (an input angle), triangles
	// touching a Frozen segment, and, when Input is set, the triangles the
	// refiner leaves near small input angles (see refine.go: the shortest
	// edge joins two points on two segments sharing an input vertex, at equal
	// distances from it).
	MinAngle float64
	// Input is the graph the mesh was made from (optional, for the angle
	// exception above).
	Input *Input
	// Frozen lists segment markers exempt from the angle test nearby:
	// triangles whose centroid is within one frozen edge length of a frozen
	// edge.
	Frozen []int32
	// RegionAreas, when set, gives the expected area of each region tag; the
	// compensated sum of triangle areas must match to 1e-9 relative.
	RegionAreas map[int32]float64
}

// Check verifies the invariants of a first-order mesh: array lengths and
// index ranges, counter-clockwise corners with positive area (exact
// Orient2D), neighbour symmetry (Nbr[3t+k] = n implies n has the same edge,
// reversed, pointing back at t), equal EdgeMarker on both sides of an edge,
// a marker on every boundary edge, the constrained Delaunay property on
// unmarked interior edges (exact InCircle of the opposite corner <= 0), and
// the options' minimum angle and region areas. On meshes with arcs and
// curved triangles it also checks that EdgeArc has 3 entries per triangle,
// in range and equal on both sides of an edge, and that every curved
// triangle keeps a positive Jacobian (at least a quarter of its corner
// triangle's at its corners, edge midpoints and centroid, the bound
// Elevate keeps). It returns a *CheckError describing the first violated
// invariant, or nil.
func (m *Mesh) Check(opt CheckOptions) error {
	nv := m.NumVertices
	nt := len(m.Tri) / 3
	fail := func(inv string, t, count int, format string, args ...any) error {
		return &CheckError{Invariant: inv, Triangle: t, Count: count, Detail: fmt.Sprintf(format, args...)}
	}
	if len(m.X) != len(m.Y) || nv > len(m.X) || len(m.Tri)%3 != 0 || len(m.Nbr) != len(m.Tri) ||
		len(m.EdgeMarker) != len(m.Tri) || len(m.Region) != nt {
		return fail("index", -1, 1, "array lengths: X %d Y %d NumVertices %d Tri %d Nbr %d EdgeMarker %d Region %d",
			len(m.X), len(m.Y), nv, len(m.Tri), len(m.Nbr), len(m.EdgeMarker), len(m.Region))
	}
	for i, v := range m.Tri {
		if v < 0 || int(v) >= nv {
			return fail("index", i/3, 1, "corner %d = %d out of [0,%d)", i%3, v, nv)
		}
	}
	for i, n := range m.Nbr {
		if n < -1 || int(n) >= nt {
			return fail("index", i/3, 1, "neighbour %d = %d out of [-1,%d)", i%3, n, nt)
		}
	}
	for i := range m.X[:nv] {
		if math.IsNaN(m.X[i]) || math.IsNaN(m.Y[i]) || math.IsInf(m.X[i], 0) || math.IsInf(m.Y[i], 0) {
			return fail("index", -1, 1, "vertex %d is not finite", i)
		}
	}
	bad, first := 0, -1
	for t := 0; t < nt; t++ {
		a, b, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		if Orient2D(m.X[a], m.Y[a], m.X[b], m.Y[b], m.X[c], m.Y[c]) != CCW {
			bad++
			if first < 0 {
				first = t
			}
		}
	}
	if bad > 0 {
		return fail("area", first, bad, "triangle is not counter-clockwise with positive area")
	}
	for t := 0; t < nt; t++ {
		for k := 0; k < 3; k++ {
			u, v := m.Tri[3*t+(k+1)%3], m.Tri[3*t+(k+2)%3]
			n := int(m.Nbr[3*t+k])
			if n < 0 {
				if m.EdgeMarker[3*t+k] == 0 {
					return fail("marker", t, 1, "boundary edge %d (%d,%d) has no marker", k, u, v)
				}
				continue
			}
			j := -1
			for i := 0; i < 3; i++ {
				if m.Tri[3*n+(i+1)%3] == v && m.Tri[3*n+(i+2)%3] == u {
					j = i
				}
			}
			if j < 0 || int(m.Nbr[3*n+j]) != t {
				return fail("twin", t, 1, "edge %d (%d,%d): neighbour %d does not point back", k, u, v, n)
			}
			if m.EdgeMarker[3*n+j] != m.EdgeMarker[3*t+k] {
				return fail("marker", t, 1, "edge %d marker %d, twin marker %d", k, m.EdgeMarker[3*t+k], m.EdgeMarker[3*n+j])
			}
			if m.EdgeMarker[3*t+k] == 0 {
				a, b, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
				o := m.Tri[3*n+j]
				if InCircle(m.X[a], m.Y[a], m.X[b], m.Y[b], m.X[c], m.Y[c], m.X[o], m.Y[o]) > 0 {
					bad++
					if first < 0 {
						first = t
					}
				}
			}
		}
	}
	if bad > 0 {
		return fail("delaunay", first, bad, "opposite corner strictly inside the circumcircle across an unmarked edge")
	}
	if err := m.checkCurved(); err != nil {
		return err
	}
	if opt.MinAngle > 0 {
		if err := m.checkAngles(opt); err != nil {
			return err
		}
	}
	if opt.RegionAreas != nil {
		got := m.regionAreas()
		for r, want := range opt.RegionAreas {
			if g := got[r]; math.Abs(g-want) > 1e-9*math.Abs(want) {
				return fail("region-area", -1, 1, "region %d area %.17g, want %.17g (relative error %.3g)", r, g, want, math.Abs(g-want)/math.Abs(want))
			}
		}
		for r, g := range got {
			if _, ok := opt.RegionAreas[r]; !ok {
				return fail("region-area", -1, 1, "unexpected region %d with area %g", r, g)
			}
		}
	}
	return nil
}

// checkCurved checks EdgeArc and Curved (see Check).
func (m *Mesh) checkCurved() error {
	nt := len(m.Tri) / 3
	fail := func(inv string, t int, format string, args ...any) error {
		return &CheckError{Invariant: inv, Triangle: t, Count: 1, Detail: fmt.Sprintf(format, args...)}
	}
	if m.EdgeArc != nil {
		if len(m.EdgeArc) != 3*nt {
			return fail("arc", -1, "len(EdgeArc) = %d, want %d", len(m.EdgeArc), 3*nt)
		}
		for i, a := range m.EdgeArc {
			if a < -1 || int(a) >= len(m.Arcs) {
				return fail("arc", i/3, "edge %d: arc %d of %d", i%3, a, len(m.Arcs))
			}
			if n := m.Nbr[i]; n >= 0 {
				t := int32(i / 3)
				for j := 0; j < 3; j++ {
					if m.Nbr[3*n+int32(j)] == t && m.EdgeArc[3*n+int32(j)] != a {
						return fail("arc", i/3, "edge %d on arc %d, twin on arc %d", i%3, a, m.EdgeArc[3*n+int32(j)])
					}
				}
			}
		}
	}
	if m.Curved == nil {
		return nil
	}
	if len(m.Curved) != nt || len(m.Mid) != 3*nt {
		return fail("curved", -1, "len(Curved) = %d, len(Mid) = %d for %d triangles", len(m.Curved), len(m.Mid), nt)
	}
	for t, c := range m.Curved {
		if c && !m.curvedValid(t) {
			return fail("curved", t, "the quadratic map of the curved triangle folds (Jacobian below a quarter of the corner triangle's)")
		}
	}
	return nil
}

// regionAreas sums triangle areas per region with Neumaier's compensated
// summation (A. Neumaier, ZAMM 54, 1974).
func (m *Mesh) regionAreas() map[int32]float64 {
	type acc struct{ s, c float64 }
	sums := map[int32]*acc{}
	for t := 0; t < len(m.Tri)/3; t++ {
		a, b, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		area := 0.5 * Orient2DDet(m.X[a], m.Y[a], m.X[b], m.Y[b], m.X[c], m.Y[c])
		s := sums[m.Region[t]]
		if s == nil {
			s = &acc{}
			sums[m.Region[t]] = s
		}
		x := s.s + area
		if math.Abs(s.s) >= math.Abs(area) {
			s.c += (s.s - x) + area
		} else {
			s.c += (area - x) + s.s
		}
		s.s = x
	}
	out := make(map[int32]float64, len(sums))
	for r, s := range sums {
		out[r] = s.s + s.c
	}
	return out
}

// minAngle returns the smallest angle of triangle t in degrees and the
// corner where it sits.
func (m *Mesh) minAngle(t int) (float64, int) {
	best, at := math.Inf(1), 0
	for k := 0; k < 3; k++ {
		p := m.Tri[3*t+k]
		q, r := m.Tri[3*t+(k+1)%3], m.Tri[3*t+(k+2)%3]
		ux, uy := m.X[q]-m.X[p], m.Y[q]-m.Y[p]
		vx, vy := m.X[r]-m.X[p], m.Y[r]-m.Y[p]
		a := math.Atan2(math.Abs(ux*vy-uy*vx), ux*vx+uy*vy) * 180 / math.Pi
		if a < best {
			best, at = a, k
		}
	}
	return best, at
}

func (m *Mesh) checkAngles(opt CheckOptions) error {
	nt := len(m.Tri) / 3
	var frozenE []int32 // frozen edges as vertex pairs
	if len(opt.Frozen) > 0 {
		for i, mk := range m.EdgeMarker {
			for _, f := range opt.Frozen {
				if mk == f {
					t, k := i/3, i%3
					frozenE = append(frozenE, m.Tri[3*t+(k+1)%3], m.Tri[3*t+(k+2)%3])
				}
			}
		}
	}
	in := opt.Input
	if in != nil && len(in.Segments) == 0 && len(in.X) >= 3 {
		// Triangulate bounds a point set by its convex hull.
		pts := make([]int32, len(in.X))
		for i := range pts {
			pts[i] = int32(i)
		}
		h := convexHull(in.X, in.Y, pts)
		hin := &Input{X: in.X, Y: in.Y}
		for i := range h {
			hin.Segments = append(hin.Segments, h[i], h[(i+1)%len(h)])
		}
		in = hin
	}
	bad, first, worst := 0, -1, 180.0
	// A tolerance of 1e-9 degrees absorbs the rounding of atan2 against the
	// refiner's sine test.
	for t := 0; t < nt; t++ {
		a, k := m.minAngle(t)
		if a >= opt.MinAngle-1e-9 {
			continue
		}
		if m.EdgeMarker[3*t+(k+1)%3] != 0 && m.EdgeMarker[3*t+(k+2)%3] != 0 {
			continue // an input angle
		}
		if m.nearFrozen(t, frozenE) {
			continue
		}
		if in != nil && m.shellException(t, in) {
			continue
		}
		bad++
		if first < 0 {
			first = t
		}
		worst = math.Min(worst, a)
	}
	if bad > 0 {
		return &CheckError{Invariant: "angle", Triangle: first, Count: bad,
			Detail: fmt.Sprintf("smallest angle %.4g degrees below %g", worst, opt.MinAngle)}
	}
	return nil
}

// nearFrozen reports whether the centroid of t lies within one edge length
// of a frozen edge: the refiner cannot put vertices on such an edge, so the
// triangles it faces keep the shape its fixed vertices impose.
func (m *Mesh) nearFrozen(t int, frozenE []int32) bool {
	a, b, c := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
	gx := (m.X[a] + m.X[b] + m.X[c]) / 3
	gy := (m.Y[a] + m.Y[b] + m.Y[c]) / 3
	for i := 0; i < len(frozenE); i += 2 {
		u, v := frozenE[i], frozenE[i+1]
		l := math.Hypot(m.X[v]-m.X[u], m.Y[v]-m.Y[u])
		if SegmentDistance(gx, gy, m.X[u], m.Y[u], m.X[v], m.Y[v]) <= l {
			return true
		}
	}
	return false
}

// shellException reports whether the shortest edge of t joins points on two
// input segments sharing an end point, at equal distances (0.1%) from it.
func (m *Mesh) shellException(t int, in *Input) bool {
	// Shortest edge (u, v).
	var u, v int32
	best := math.Inf(1)
	for k := 0; k < 3; k++ {
		p, q := m.Tri[3*t+(k+1)%3], m.Tri[3*t+(k+2)%3]
		if l := math.Hypot(m.X[p]-m.X[q], m.Y[p]-m.Y[q]); l < best {
			best, u, v = l, p, q
		}
	}
	onSegXY := func(x, y float64, s int) bool {
		a, b := in.Segments[2*s], in.Segments[2*s+1]
		l := math.Hypot(in.X[b]-in.X[a], in.Y[b]-in.Y[a])
		// Split points are rounded to the coordinates' precision: allow a
		// few ulps of the coordinate magnitude besides 1e-12 of the length.
		mag := math.Abs(in.X[a]) + math.Abs(in.Y[a]) + math.Abs(in.X[b]) + math.Abs(in.Y[b])
		return SegmentDistance(x, y, in.X[a], in.Y[a], in.X[b], in.Y[b]) <= 1e-12*l+1e-14*mag
	}
	onSeg := func(p int32, s int) bool { return onSegXY(m.X[p], m.Y[p], s) }
	ns := len(in.Segments) / 2
	for s1 := 0; s1 < ns; s1++ {
		if !onSeg(u, s1) {
			continue
		}
		for s2 := 0; s2 < ns; s2++ {
			if s2 == s1 || !onSeg(v, s2) {
				continue
			}
			// The apex is an input vertex on both segments: an end point
			// of one lying anywhere on the other, or the end point of a
			// third segment lying on both (overlapping or collinear
			// input, where recovery splits both segments at it).
			for a := range in.X {
				ax, ay := in.X[a], in.Y[a]
				if !onSegXY(ax, ay, s1) || !onSegXY(ax, ay, s2) {
					continue
				}
				du := math.Hypot(m.X[u]-ax, m.Y[u]-ay)
				dv := math.Hypot(m.X[v]-ax, m.Y[v]-ay)
				if du > 0 && dv > 0 && du < 1.001*dv && dv < 1.001*du {
					return true
				}
			}
		}
	}
	return false
}
