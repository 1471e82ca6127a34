package mesh

import "math"

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
	lb := make([]float64, len(src))
	sg.start = make([]int32, n*n+1)
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
