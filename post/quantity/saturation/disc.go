package saturation

import (
	"math"
	"sort"

	"polegap/mesh"
)

// The disc peak: the largest mean of |B| over a disc of radius R centred
// in the region, the disc clipped to the region.
//
// The mean over a disc centred at c is
//
//	M(c) = Σ_t |B_t| · area(t ∩ D(c, R)) / Σ_t area(t ∩ D(c, R))
//
// over the region's triangles t, with the exact area of each triangle's
// intersection with the disc (triangles wholly inside count whole). With
// a linear field per triangle (Options.LinearB) a triangle cut by the
// circle is split into its four midpoint triangles, each counted by its
// exact share at the value of its centroid. M is continuous in c and
// varies on the scale of R, so the search samples c on a square grid of
// spacing R/2 over the region, at the listed corners and at the raw
// maximum, then climbs from the best few samples by a compass search
// (eight directions, steps from R/2 down to R·1e-4) that keeps c inside
// the region. On the embedded examples a grid of R/4 found the same
// peaks to 4 digits.

// discGrid holds one region's triangles bucketed on a square grid.
type discGrid struct {
	x, y   [][3]float64 // corners of each triangle, counter-clockwise
	lo, hi [][2]float64 // bounding box of each triangle
	area   []float64
	// part holds |B| (T) at the centroids of the four triangles that
	// join each triangle's corners and edge midpoints (corner 0, 1, 2,
	// then the middle one), whole the mean of the four: the linear field
	// of Options.LinearB, or the triangle's constant value.
	part  [][4]float64
	whole []float64

	x0, y0, cell float64
	nx, ny       int
	start        []int32 // bucket k holds items[start[k]:start[k+1]]
	items        []int32

	stamp []uint32 // per triangle: the query that last saw it
	query uint32
}

// newDiscGrid buckets the triangles tris of m (with |B| mag, area and
// optionally the linear field lin of every triangle of m) on a grid of
// cells about cell wide.
func newDiscGrid(m *mesh.Mesh, tris []int32, mag, area []float64, lin [][3][2]float64, cell float64) *discGrid {
	g := &discGrid{area: area}
	n := len(tris)
	g.part, g.whole = make([][4]float64, n), make([]float64, n)
	for j, t := range tris {
		if lin == nil {
			g.part[j] = [4]float64{mag[j], mag[j], mag[j], mag[j]}
			g.whole[j] = mag[j]
			continue
		}
		c := &lin[t]
		// Centroids of the corner triangles: barycentric (2/3, 1/6, 1/6)
		// and its turns; of the middle one: (1/3, 1/3, 1/3).
		for k := 0; k < 3; k++ {
			k1, k2 := (k+1)%3, (k+2)%3
			g.part[j][k] = babs([2]float64{
				(4*c[k][0] + c[k1][0] + c[k2][0]) / 6,
				(4*c[k][1] + c[k1][1] + c[k2][1]) / 6})
		}
		g.part[j][3] = babs([2]float64{(c[0][0] + c[1][0] + c[2][0]) / 3, (c[0][1] + c[1][1] + c[2][1]) / 3})
		g.whole[j] = (g.part[j][0] + g.part[j][1] + g.part[j][2] + g.part[j][3]) / 4
	}
	g.x, g.y = make([][3]float64, n), make([][3]float64, n)
	g.lo, g.hi = make([][2]float64, n), make([][2]float64, n)
	xmin, ymin, xmax, ymax := math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
	for j, t := range tris {
		for k := 0; k < 3; k++ {
			v := m.Tri[3*int(t)+k]
			g.x[j][k], g.y[j][k] = m.X[v], m.Y[v]
		}
		g.lo[j] = [2]float64{min(g.x[j][0], g.x[j][1], g.x[j][2]), min(g.y[j][0], g.y[j][1], g.y[j][2])}
		g.hi[j] = [2]float64{max(g.x[j][0], g.x[j][1], g.x[j][2]), max(g.y[j][0], g.y[j][1], g.y[j][2])}
		xmin, ymin = min(xmin, g.lo[j][0]), min(ymin, g.lo[j][1])
		xmax, ymax = max(xmax, g.hi[j][0]), max(ymax, g.hi[j][1])
	}
	// At most about 4 cells per triangle on average, so the grid stays
	// small when the radius is tiny against the region.
	cell = max(cell, math.Sqrt((xmax-xmin)*(ymax-ymin)/float64(4*n+1)))
	g.x0, g.y0, g.cell = xmin, ymin, cell
	g.nx = int((xmax-xmin)/cell) + 1
	g.ny = int((ymax-ymin)/cell) + 1
	count := make([]int32, g.nx*g.ny+1)
	g.each(func(j int, k int) { count[k+1]++ })
	for k := 1; k < len(count); k++ {
		count[k] += count[k-1]
	}
	g.start = append([]int32(nil), count...)
	g.items = make([]int32, count[len(count)-1])
	g.each(func(j int, k int) { g.items[count[k]] = int32(j); count[k]++ })
	g.stamp = make([]uint32, n)
	return g
}

// each calls f for every triangle j and every cell k its bounding box
// overlaps.
func (g *discGrid) each(f func(j, k int)) {
	for j := range g.x {
		i0, i1 := g.cellX(g.lo[j][0]), g.cellX(g.hi[j][0])
		k0, k1 := g.cellY(g.lo[j][1]), g.cellY(g.hi[j][1])
		for kk := k0; kk <= k1; kk++ {
			for i := i0; i <= i1; i++ {
				f(j, kk*g.nx+i)
			}
		}
	}
}

func (g *discGrid) cellX(x float64) int {
	return min(max(int((x-g.x0)/g.cell), 0), g.nx-1)
}

func (g *discGrid) cellY(y float64) int {
	return min(max(int((y-g.y0)/g.cell), 0), g.ny-1)
}

// next starts a new query: every triangle is seen at most once per query.
func (g *discGrid) next() uint32 {
	g.query++
	if g.query == 0 { // wrapped: clear the stamps
		clear(g.stamp)
		g.query = 1
	}
	return g.query
}

// inside reports whether (x, y) lies in a triangle of the region (on an
// edge counts).
func (g *discGrid) inside(x, y float64) bool {
	i, k := g.cellX(x), g.cellY(y)
	if x < g.x0 || y < g.y0 || x > g.x0+float64(g.nx)*g.cell || y > g.y0+float64(g.ny)*g.cell {
		return false
	}
	for _, j := range g.items[g.start[k*g.nx+i]:g.start[k*g.nx+i+1]] {
		if x < g.lo[j][0] || x > g.hi[j][0] || y < g.lo[j][1] || y > g.hi[j][1] {
			continue
		}
		tx, ty := &g.x[j], &g.y[j]
		if mesh.Orient2D(tx[0], ty[0], tx[1], ty[1], x, y) != mesh.CW &&
			mesh.Orient2D(tx[1], ty[1], tx[2], ty[2], x, y) != mesh.CW &&
			mesh.Orient2D(tx[2], ty[2], tx[0], ty[0], x, y) != mesh.CW {
			return true
		}
	}
	return false
}

// mean returns the mean |B| over the disc of radius r about (cx, cy)
// clipped to the region, and the area it covers.
func (g *discGrid) mean(cx, cy, r float64) (mean, area float64) {
	q := g.next()
	r2 := r * r
	var sa, sb float64
	for k := g.cellY(cy - r); k <= g.cellY(cy+r); k++ {
		for i := g.cellX(cx - r); i <= g.cellX(cx+r); i++ {
			for _, j := range g.items[g.start[k*g.nx+i]:g.start[k*g.nx+i+1]] {
				if g.stamp[j] == q {
					continue
				}
				g.stamp[j] = q
				// Nearest point of the bounding box to the centre.
				nx := min(max(cx, g.lo[j][0]), g.hi[j][0]) - cx
				ny := min(max(cy, g.lo[j][1]), g.hi[j][1]) - cy
				if nx*nx+ny*ny >= r2 {
					continue
				}
				tx, ty := &g.x[j], &g.y[j]
				in := 0
				for v := 0; v < 3; v++ {
					dx, dy := tx[v]-cx, ty[v]-cy
					if dx*dx+dy*dy <= r2 {
						in++
					}
				}
				if in == 3 {
					sa += g.area[j]
					sb += g.area[j] * g.whole[j]
					continue
				}
				p := &g.part[j]
				if p[0] == p[1] && p[1] == p[2] && p[2] == p[3] {
					a := triangleDiscArea(tx, ty, cx, cy, r)
					sa += a
					sb += a * p[0]
					continue
				}
				// Cut by the circle: each quarter by its exact share.
				mx := [3]float64{(tx[0] + tx[1]) / 2, (tx[1] + tx[2]) / 2, (tx[2] + tx[0]) / 2}
				my := [3]float64{(ty[0] + ty[1]) / 2, (ty[1] + ty[2]) / 2, (ty[2] + ty[0]) / 2}
				for k := 0; k < 4; k++ {
					// Quarter k < 3: corner k and the midpoints of its two
					// edges; quarter 3: the three midpoints.
					qx, qy := mx, my
					if k < 3 {
						qx, qy = [3]float64{tx[k], mx[k], mx[(k+2)%3]}, [3]float64{ty[k], my[k], my[(k+2)%3]}
					}
					in := 0
					for v := 0; v < 3; v++ {
						dx, dy := qx[v]-cx, qy[v]-cy
						if dx*dx+dy*dy <= r2 {
							in++
						}
					}
					a := g.area[j] / 4
					if in < 3 {
						a = triangleDiscArea(&qx, &qy, cx, cy, r)
					}
					sa += a
					sb += a * p[k]
				}
			}
		}
	}
	if sa == 0 {
		return 0, 0
	}
	return sb / sa, sa
}

// triangleDiscArea returns the area of the triangle (x, y) inside the
// disc of radius r about (cx, cy): the sum over its edges of the signed
// area that the disc shares with the triangle (centre, edge).
func triangleDiscArea(x, y *[3]float64, cx, cy, r float64) float64 {
	var s float64
	for k := 0; k < 3; k++ {
		j := (k + 1) % 3
		s += sectorTriangleArea(x[k]-cx, y[k]-cy, x[j]-cx, y[j]-cy, r)
	}
	return math.Abs(s)
}

// sectorTriangleArea returns the signed area of the disc of radius r
// about the origin intersected with the triangle (origin, p, q): the edge
// pq is cut where it crosses the circle, pieces inside contribute their
// triangle, pieces outside the circular sector they subtend.
func sectorTriangleArea(px, py, qx, qy, r float64) float64 {
	dx, dy := qx-px, qy-py
	a := dx*dx + dy*dy
	b := px*dx + py*dy
	c := px*px + py*py - r*r
	var ts [4]float64
	n := 0
	ts[n] = 0
	n++
	if a > 0 {
		if disc := b*b - a*c; disc > 0 {
			s := math.Sqrt(disc)
			for _, t := range [2]float64{(-b - s) / a, (-b + s) / a} {
				if t > 0 && t < 1 {
					ts[n] = t
					n++
				}
			}
		}
	}
	ts[n] = 1
	n++
	var sum float64
	for k := 0; k+1 < n; k++ {
		ax, ay := px+ts[k]*dx, py+ts[k]*dy
		bx, by := px+ts[k+1]*dx, py+ts[k+1]*dy
		mx, my := 0.5*(ax+bx), 0.5*(ay+by)
		cr := ax*by - ay*bx
		if mx*mx+my*my <= r*r {
			sum += 0.5 * cr
		} else {
			sum += 0.5 * r * r * math.Atan2(cr, ax*bx+ay*by)
		}
	}
	return sum
}

// Search constants of the disc peak: the sampling grid spacing and the
// smallest compass step, as fractions of the radius, and how many of the
// best samples the climb starts from.
const (
	discGridFraction = 0.5
	discStepFraction = 1e-4
	discClimbs       = 6
)

// peak returns the largest disc mean of radius r over centres inside the
// region, and that centre. seeds are extra sample centres (corners, the
// raw maximum); those outside the region are skipped.
func (g *discGrid) peak(r float64, seeds [][2]float64) (best float64, at [2]float64) {
	type sample struct {
		v float64
		c [2]float64
	}
	var samples []sample
	try := func(x, y float64) {
		if g.inside(x, y) {
			v, _ := g.mean(x, y, r)
			samples = append(samples, sample{v, [2]float64{x, y}})
		}
	}
	s := discGridFraction * r
	xmax, ymax := g.x0+float64(g.nx)*g.cell, g.y0+float64(g.ny)*g.cell
	for y := g.y0 + 0.5*s; y < ymax; y += s {
		for x := g.x0 + 0.5*s; x < xmax; x += s {
			try(x, y)
		}
	}
	for _, c := range seeds {
		try(c[0], c[1])
	}
	// Every triangle's centroid when the grid missed a thin region.
	if len(samples) < discClimbs {
		for j := range g.x {
			try((g.x[j][0]+g.x[j][1]+g.x[j][2])/3, (g.y[j][0]+g.y[j][1]+g.y[j][2])/3)
		}
	}
	sort.SliceStable(samples, func(i, j int) bool { return samples[i].v > samples[j].v })
	best, at = -1, [2]float64{}
	dirs := [8][2]float64{{1, 0}, {-1, 0}, {0, 1}, {0, -1}, {0.7071067811865476, 0.7071067811865476},
		{-0.7071067811865476, 0.7071067811865476}, {0.7071067811865476, -0.7071067811865476}, {-0.7071067811865476, -0.7071067811865476}}
	for _, sm := range samples[:min(discClimbs, len(samples))] {
		v, c := sm.v, sm.c
		for step := s; step >= discStepFraction*r; {
			moved := false
			for _, d := range dirs {
				x, y := c[0]+step*d[0], c[1]+step*d[1]
				if !g.inside(x, y) {
					continue
				}
				if w, _ := g.mean(x, y, r); w > v {
					v, c, moved = w, [2]float64{x, y}, true
				}
			}
			if !moved {
				step /= 2
			}
		}
		if v > best {
			best, at = v, c
		}
	}
	return best, at
}
