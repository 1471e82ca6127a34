package study

import (
	"math"

	"polegap/mesh"
)

// edgeGrid buckets line segments in a uniform grid over their bounding
// box, so that the estimate's queries (the nearest edge to a point,
// whether a point lies inside a ring, whether an edge comes within a
// distance) look at the edges near the point instead of all of them: a
// region drawn with 100,000 vertices is then estimated in well under a
// second instead of minutes. A segment is listed in every cell its
// bounding box overlaps. Queries give the same answers as a loop over all
// edges (the cells only prune).
type edgeGrid struct {
	x0, y0, cw, ch float64
	nx, ny         int
	start          []int32 // per cell, into idx
	idx            []int32
	ax, ay, bx, by []float64 // the segments
	stamp          []uint32  // per segment, the query that last saw it
	query          uint32
}

// newEdgeGrid builds the grid for segments (ax, ay)-(bx, by), with about
// one segment per cell.
func newEdgeGrid(ax, ay, bx, by []float64) *edgeGrid {
	g := &edgeGrid{ax: ax, ay: ay, bx: bx, by: by, stamp: make([]uint32, len(ax))}
	x0, y0, x1, y1 := math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
	for i := range ax {
		x0, x1 = min(x0, ax[i], bx[i]), max(x1, ax[i], bx[i])
		y0, y1 = min(y0, ay[i], by[i]), max(y1, ay[i], by[i])
	}
	if len(ax) == 0 {
		x0, y0, x1, y1 = 0, 0, 1, 1
	}
	w, h := max(x1-x0, 1e-300), max(y1-y0, 1e-300)
	n := max(1, int(math.Sqrt(float64(len(ax)))))
	n = min(n, 1024)
	g.nx, g.ny = n, n
	g.x0, g.y0 = x0, y0
	g.cw, g.ch = w/float64(n)*(1+1e-12), h/float64(n)*(1+1e-12)
	count := make([]int32, n*n+1)
	g.each(func(c int, _ int) { count[c+1]++ })
	for c := 1; c <= n*n; c++ {
		count[c] += count[c-1]
	}
	g.start = count
	g.idx = make([]int32, count[n*n])
	fill := make([]int32, n*n)
	g.each(func(c int, s int) {
		g.idx[g.start[c]+fill[c]] = int32(s)
		fill[c]++
	})
	return g
}

// each calls f(cell, segment) for every cell a segment's box overlaps.
func (g *edgeGrid) each(f func(c, s int)) {
	for s := range g.ax {
		i0, j0 := g.cell(min(g.ax[s], g.bx[s]), min(g.ay[s], g.by[s]))
		i1, j1 := g.cell(max(g.ax[s], g.bx[s]), max(g.ay[s], g.by[s]))
		for j := j0; j <= j1; j++ {
			for i := i0; i <= i1; i++ {
				f(j*g.nx+i, s)
			}
		}
	}
}

// cell returns the cell of (x, y), clamped to the grid.
func (g *edgeGrid) cell(x, y float64) (int, int) {
	i := int((x - g.x0) / g.cw)
	j := int((y - g.y0) / g.ch)
	return min(max(i, 0), g.nx-1), min(max(j, 0), g.ny-1)
}

// visit calls f for each segment listed in the cells that the box
// [x0,x1]×[y0,y1] overlaps, once each.
func (g *edgeGrid) visit(x0, y0, x1, y1 float64, f func(s int)) {
	g.query++
	if g.query == 0 { // wrapped: clear the stamps
		clear(g.stamp)
		g.query = 1
	}
	i0, j0 := g.cell(x0, y0)
	i1, j1 := g.cell(x1, y1)
	for j := j0; j <= j1; j++ {
		for i := i0; i <= i1; i++ {
			c := j*g.nx + i
			for _, s := range g.idx[g.start[c]:g.start[c+1]] {
				if g.stamp[s] != g.query {
					g.stamp[s] = g.query
					f(int(s))
				}
			}
		}
	}
}

// within reports whether some segment lies within r of (x, y).
func (g *edgeGrid) within(x, y, r float64) bool {
	found := false
	g.visit(x-r, y-r, x+r, y+r, func(s int) {
		if !found && mesh.SegmentDistance(x, y, g.ax[s], g.ay[s], g.bx[s], g.by[s]) <= r {
			found = true
		}
	})
	return found
}

// crossings counts the segments that a ray from (x, y) towards +x
// crosses (the even-odd rule of ring.contains).
func (g *edgeGrid) crossings(x, y float64) int {
	n := 0
	g.visit(x, y, g.x0+float64(g.nx)*g.cw, y, func(s int) {
		xi, yi, xj, yj := g.bx[s], g.by[s], g.ax[s], g.ay[s]
		if (yi > y) != (yj > y) && x < xj+(y-yj)*(xi-xj)/(yi-yj) {
			n++
		}
	})
	return n
}
