package mesh

import "math"

// At returns the target edge length at (x, y) in region, in metres, or +Inf
// where the field sets no limit. A nil receiver has no limit.
func (f *SizeField) At(x, y float64, region int32) float64 {
	if f == nil {
		return math.Inf(1)
	}
	h := math.Inf(1)
	if f.Global > 0 {
		h = f.Global
	}
	if s := f.Region[region]; s > 0 && s < h {
		h = s
	}
	g := f.Grading
	if g <= 0 {
		g = DefaultGrading
	}
	for _, p := range f.Points {
		if p.Size <= 0 {
			continue
		}
		if s := p.Size + g*math.Sqrt((x-p.X)*(x-p.X)+(y-p.Y)*(y-p.Y)); s < h {
			h = s
		}
	}
	for _, l := range f.Lines {
		if l.Size <= 0 {
			continue
		}
		if s := l.Size + g*SegmentDistance(x, y, l.X0, l.Y0, l.X1, l.Y1); s < h {
			h = s
		}
	}
	if f.Func != nil {
		if s := f.Func(x, y, region); s > 0 && s < h {
			h = s
		}
	}
	return h
}

// isZero reports whether the field sets no limit anywhere.
func (f *SizeField) isZero() bool {
	if f.Global > 0 || f.Func != nil {
		return false
	}
	for _, s := range f.Region {
		if s > 0 {
			return false
		}
	}
	for _, p := range f.Points {
		if p.Size > 0 {
			return false
		}
	}
	for _, l := range f.Lines {
		if l.Size > 0 {
			return false
		}
	}
	return true
}

// SegmentDistance is the Euclidean distance from (x, y) to the segment
// (x0, y0)-(x1, y1). It is a magnitude, not a decision (the exact
// predicates decide on which side a point lies).
func SegmentDistance(x, y, x0, y0, x1, y1 float64) float64 {
	dx, dy := x1-x0, y1-y0
	l2 := dx*dx + dy*dy
	t := 0.0
	if l2 > 0 {
		t = ((x-x0)*dx + (y-y0)*dy) / l2
		t = max(0, min(1, t))
	}
	ex, ey := x-(x0+t*dx), y-(y0+t*dy)
	return math.Sqrt(ex*ex + ey*ey) // coordinates are below 1e60: no overflow
}
