package mesh

import (
	"math"
	"slices"
)

// sizeGrid evaluates the point and line sources of a size field exactly
// but fast: a uniform grid over the domain keeps, for each cell, only the
// sources that can be the smallest somewhere in the cell. A source's
// size grows by the grading per metre of distance, so over a cell of
// half-diagonal r whose centre lies at distance d from the source it lies
// between s + g·max(0, d−r) and s + g·(d+r); a source whose lower bound
// exceeds another's upper bound can never win in that cell.
type sizeGrid struct {
	x0, y0, cw, ch float64
	nx, ny         int
	start          []int32 // per cell, into cand
	cand           []int32 // source indices
	src            []SizeLine
	g              float64
}

// newSizeGrid builds the grid over [x0,x1]×[y0,y1] for the sources
// (points as zero-length lines) with grading g.
func newSizeGrid(src []SizeLine, g, x0, y0, x1, y1 float64) *sizeGrid {
	const n = 64
	sg := &sizeGrid{x0: x0, y0: y0, nx: n, ny: n, src: src, g: g,
		cw: (x1 - x0) / n, ch: (y1 - y0) / n}
	r := 0.5 * math.Hypot(sg.cw, sg.ch)
	sg.start = make([]int32, n*n+1)
	if len(src) > bucketSources && g > 0 && sg.cw > 0 && sg.ch > 0 {
		sg.fillBucketed(r)
		return sg
	}
	lb := make([]float64, len(src))
	for j := 0; j < n; j++ {
		for i := 0; i < n; i++ {
			cx, cy := x0+(float64(i)+0.5)*sg.cw, y0+(float64(j)+0.5)*sg.ch
			best := math.Inf(1)
			for k, l := range src {
				d := SegmentDistance(cx, cy, l.X0, l.Y0, l.X1, l.Y1)
				lb[k] = l.Size + g*max(0, d-r)
				best = min(best, l.Size+g*(d+r))
			}
			for k := range src {
				if lb[k] <= best {
					sg.cand = append(sg.cand, int32(k))
				}
			}
			sg.start[j*n+i+1] = int32(len(sg.cand))
		}
	}
	return sg
}

// At returns the smallest source size at (x, y): exactly what the sources
// give (+Inf if there are none).
func (sg *sizeGrid) At(x, y float64, _ int32) float64 {
	i := int((x - sg.x0) / sg.cw)
	j := int((y - sg.y0) / sg.ch)
	h := math.Inf(1)
	if i < 0 || j < 0 || i >= sg.nx || j >= sg.ny || math.IsNaN(x) || math.IsNaN(y) {
		// Outside the grid (the Kelvin disk): all sources.
		for _, l := range sg.src {
			h = min(h, l.Size+sg.g*SegmentDistance(x, y, l.X0, l.Y0, l.X1, l.Y1))
		}
		return h
	}
	c := j*sg.nx + i
	for _, k := range sg.cand[sg.start[c]:sg.start[c+1]] {
		l := &sg.src[k]
		h = min(h, l.Size+sg.g*SegmentDistance(x, y, l.X0, l.Y0, l.X1, l.Y1))
	}
	return h
}

// indexed returns f with its point and line sources moved into a
// sizeGrid over the bounding box of the points (x, y), chained with any
// Func f already has. The field gives the same sizes (to rounding) with a
// few source evaluations per query instead of one per source; fields with
// few sources are returned as they are.
func (f SizeField) indexed(x, y []float64) SizeField {
	if len(f.Points)+len(f.Lines) < 8 || len(x) == 0 {
		return f
	}
	src := make([]SizeLine, 0, len(f.Lines)+len(f.Points))
	for _, l := range f.Lines {
		if l.Size > 0 {
			src = append(src, l)
		}
	}
	for _, p := range f.Points {
		if p.Size > 0 {
			src = append(src, SizeLine{X0: p.X, Y0: p.Y, X1: p.X, Y1: p.Y, Size: p.Size})
		}
	}
	g := f.Grading
	if g <= 0 {
		g = DefaultGrading
	}
	x0, y0, x1, y1 := x[0], y[0], x[0], y[0]
	for i := range x {
		x0, x1 = math.Min(x0, x[i]), math.Max(x1, x[i])
		y0, y1 = math.Min(y0, y[i]), math.Max(y1, y[i])
	}
	if !(x1 > x0) || !(y1 > y0) {
		return f
	}
	sg := newSizeGrid(src, g, x0, y0, x1, y1)
	prev := f.Func
	f.Func = func(x, y float64, region int32) float64 {
		h := sg.At(x, y, region)
		if prev != nil {
			if s := prev(x, y, region); s > 0 {
				h = min(h, s)
			}
		}
		return h
	}
	f.Points, f.Lines = nil, nil
	return f
}

// Indexed returns f with its point and line sources moved into a grid
// over the bounding box of the points (x, y), as Triangulate does before
// refining: the same sizes (to rounding) at a few source evaluations per
// query instead of one per source. Fields with few sources are returned
// as they are.
func (f SizeField) Indexed(x, y []float64) SizeField { return f.indexed(x, y) }

// bucketSources is the number of sources from which newSizeGrid finds
// each cell's candidates through buckets of nearby sources instead of a
// loop over all of them (64×64 cells times 40,000 sources is 1.6e8
// distances; a model of 10,000 small regions has that many).
const bucketSources = 2048

// fillBucketed fills start and cand with the same candidates as the loop
// over all sources in newSizeGrid (each cell's sources whose lower bound
// is at most the smallest upper bound), visiting only the sources near
// each cell: the sources go into buckets by the cells their bounding box
// overlaps (clamped to the grid), and for a cell the rings of buckets
// around it are searched outwards. A source first met in ring k lies at
// least (k − ½)·min(cw, ch) from the cell's centre, so its upper bound
// is at least sMin + g·((k − ½)·c + r) and its lower bound at least
// sMin + g·max(0, (k − ½)·c − r): the search for the smallest upper
// bound stops at the first ring beyond it, and the candidates are all in
// the rings up to where the lower bound passes it. The candidates are
// listed in increasing source index, as the full loop lists them.
func (sg *sizeGrid) fillBucketed(r float64) {
	n := sg.nx
	src, g := sg.src, sg.g
	cell := func(x, y float64) (int, int) {
		i, j := int((x-sg.x0)/sg.cw), int((y-sg.y0)/sg.ch)
		if !(i >= 0) {
			i = 0
		}
		if !(j >= 0) {
			j = 0
		}
		return min(i, n-1), min(j, n-1)
	}
	sMin := math.Inf(1)
	cnt := make([]int32, n*n+1)
	for _, l := range src {
		sMin = math.Min(sMin, l.Size)
		i0, j0 := cell(math.Min(l.X0, l.X1), math.Min(l.Y0, l.Y1))
		i1, j1 := cell(math.Max(l.X0, l.X1), math.Max(l.Y0, l.Y1))
		for j := j0; j <= j1; j++ {
			for i := i0; i <= i1; i++ {
				cnt[j*n+i+1]++
			}
		}
	}
	for c := 1; c <= n*n; c++ {
		cnt[c] += cnt[c-1]
	}
	bucket := make([]int32, cnt[n*n])
	fill := make([]int32, n*n)
	for k, l := range src {
		i0, j0 := cell(math.Min(l.X0, l.X1), math.Min(l.Y0, l.Y1))
		i1, j1 := cell(math.Max(l.X0, l.X1), math.Max(l.Y0, l.Y1))
		for j := j0; j <= j1; j++ {
			for i := i0; i <= i1; i++ {
				c := j*n + i
				bucket[cnt[c]+fill[c]] = int32(k)
				fill[c]++
			}
		}
	}
	cmin := math.Min(sg.cw, sg.ch)
	stamp := make([]int32, len(src))
	query := int32(0)
	var found []int32
	// ring calls f for each source in the buckets at Chebyshev distance k
	// from cell (ci, cj), once per query.
	ring := func(ci, cj, k int, f func(s int32)) {
		for j := cj - k; j <= cj+k; j++ {
			if j < 0 || j >= n {
				continue
			}
			for i := ci - k; i <= ci+k; i++ {
				if i < 0 || i >= n || (j != cj-k && j != cj+k && i != ci-k && i != ci+k) {
					continue
				}
				c := j*n + i
				for _, s := range bucket[cnt[c]:cnt[c+1]] {
					if stamp[s] != query {
						stamp[s] = query
						f(s)
					}
				}
			}
		}
	}
	for cj := 0; cj < n; cj++ {
		for ci := 0; ci < n; ci++ {
			cx, cy := sg.x0+(float64(ci)+0.5)*sg.cw, sg.y0+(float64(cj)+0.5)*sg.ch
			// The smallest upper bound.
			query++
			best := math.Inf(1)
			for k := 0; k < n; k++ {
				if k > 0 && sMin+g*((float64(k)-0.5)*cmin+r) > best {
					break
				}
				ring(ci, cj, k, func(s int32) {
					l := &src[s]
					best = math.Min(best, l.Size+g*(SegmentDistance(cx, cy, l.X0, l.Y0, l.X1, l.Y1)+r))
				})
			}
			// The candidates.
			query++
			found = found[:0]
			for k := 0; k < n; k++ {
				if k > 0 && sMin+g*math.Max(0, (float64(k)-0.5)*cmin-r) > best {
					break
				}
				ring(ci, cj, k, func(s int32) {
					l := &src[s]
					if l.Size+g*math.Max(0, SegmentDistance(cx, cy, l.X0, l.Y0, l.X1, l.Y1)-r) <= best {
						found = append(found, s)
					}
				})
			}
			slices.Sort(found)
			sg.cand = append(sg.cand, found...)
			sg.start[cj*n+ci+1] = int32(len(sg.cand))
		}
	}
}
