package plot

import (
	"image"
	"image/color"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// VectorDPI is the resolution at which FieldRaster rasterises for vector
// formats (SVG, PDF), which carry the raster as an embedded image.
const VectorDPI = 200

// FieldRaster is a plotter that draws a scalar field given at the corners
// of each triangle, interpolated linearly inside it, as one image at the
// output's resolution: no triangle is filled as a polygon, so no
// anti-aliased seam can show between neighbours. Corner values are per
// triangle (three each), so the field may jump across a region interface
// (CornerAverage makes them from element values).
//
// Colours come from Scale over [Scale.Min, Scale.Max]; values above the
// top take Over (OverColour if nil), NaN values are left transparent, as
// are pixels no triangle covers.
type FieldRaster struct {
	X, Y   []float64 // node coordinates (data units)
	Tri    []int32   // 3 node indices per triangle
	Corner []float64 // 3 values per triangle, in the order of Tri
	Scale  *FieldScale
	Over   color.Color
}

// Plot implements plot.Plotter.
func (f *FieldRaster) Plot(c draw.Canvas, p *plot.Plot) {
	dpi := float64(VectorDPI)
	if d, ok := c.Canvas.(interface{ DPI() float64 }); ok && d.DPI() > 0 {
		dpi = d.DPI()
	}
	w := int(math.Ceil((c.Max.X - c.Min.X).Points() / vg.Inch.Points() * dpi))
	h := int(math.Ceil((c.Max.Y - c.Min.Y).Points() / vg.Inch.Points() * dpi))
	if w < 1 || h < 1 {
		return
	}
	img := f.Image(w, h, p.X.Min, p.X.Max, p.Y.Min, p.Y.Max)
	c.DrawImage(c.Rectangle, img)
}

// Image rasterises the field into a w × h image of the window [x0, x1] ×
// [y0, y1] (data units), sampling each pixel at its centre. It is linear
// scales only, which is what field maps use.
func (f *FieldRaster) Image(w, h int, x0, x1, y0, y1 float64) *image.NRGBA {
	if len(f.Corner) != len(f.Tri) {
		panic("plot: FieldRaster needs three corner values per triangle")
	}
	img := image.NewNRGBA(image.Rect(0, 0, w, h))
	over := f.Over
	if over == nil {
		over = OverColour
	}
	overC := color.NRGBAModel.Convert(over).(color.NRGBA)
	lo, hi := f.Scale.Min(), f.Scale.Max()
	sx, sy := float64(w)/(x1-x0), float64(h)/(y1-y0)
	for t := 0; 3*t < len(f.Tri); t++ {
		var px, py, v [3]float64
		for k := 0; k < 3; k++ {
			n := f.Tri[3*t+k]
			px[k] = (f.X[n] - x0) * sx
			py[k] = (y1 - f.Y[n]) * sy // image rows run downwards
			v[k] = f.Corner[3*t+k]
		}
		// Twice the signed area; skip degenerate triangles.
		det := (px[1]-px[0])*(py[2]-py[0]) - (px[2]-px[0])*(py[1]-py[0])
		if det == 0 || math.IsNaN(det) {
			continue
		}
		i0 := max(0, int(math.Floor(math.Min(px[0], math.Min(px[1], px[2]))-0.5)))
		i1 := min(w-1, int(math.Ceil(math.Max(px[0], math.Max(px[1], px[2]))-0.5)))
		j0 := max(0, int(math.Floor(math.Min(py[0], math.Min(py[1], py[2]))-0.5)))
		j1 := min(h-1, int(math.Ceil(math.Max(py[0], math.Max(py[1], py[2]))-0.5)))
		// A pixel centre on a shared edge belongs to both triangles; the
		// small tolerance makes sure it belongs to at least one.
		const tol = 1e-9
		for j := j0; j <= j1; j++ {
			cy := float64(j) + 0.5
			for i := i0; i <= i1; i++ {
				cx := float64(i) + 0.5
				l1 := ((cx-px[0])*(py[2]-py[0]) - (px[2]-px[0])*(cy-py[0])) / det
				l2 := ((px[1]-px[0])*(cy-py[0]) - (cx-px[0])*(py[1]-py[0])) / det
				l0 := 1 - l1 - l2
				if l0 < -tol || l1 < -tol || l2 < -tol {
					continue
				}
				val := l0*v[0] + l1*v[1] + l2*v[2]
				var col color.NRGBA
				switch {
				case math.IsNaN(val):
					continue
				case val > hi:
					col = overC
				default:
					col = tableColour((val - lo) / (hi - lo))
				}
				img.SetNRGBA(i, j, col)
			}
		}
	}
	return img
}

// DataRange implements plot.DataRanger.
func (f *FieldRaster) DataRange() (xmin, xmax, ymin, ymax float64) {
	t := Triangles{X: f.X, Y: f.Y, Tri: f.Tri}
	return t.DataRange()
}

// CornerAverage returns, for each corner of each triangle, the
// area-weighted mean of the element values v (one per triangle) over the
// triangles that share that node and lie in the same region: the nodal
// recovery of a piecewise-constant field, kept separate on each side of a
// region interface so that the jump of |B| at an iron face stays sharp.
// Triangles with keep false (if keep is not nil) take no part and get NaN.
func CornerAverage(x, y []float64, tri, region []int32, v []float64, keep func(t int) bool) []float64 {
	nt := len(tri) / 3
	if len(region) < nt || len(v) < nt {
		panic("plot: CornerAverage needs a region and a value per triangle")
	}
	type key struct{ node, region int32 }
	sum := make(map[key][2]float64, 2*len(x))
	area := make([]float64, nt)
	for t := 0; t < nt; t++ {
		if keep != nil && !keep(t) {
			continue
		}
		a, b, c := tri[3*t], tri[3*t+1], tri[3*t+2]
		area[t] = 0.5 * math.Abs((x[b]-x[a])*(y[c]-y[a])-(x[c]-x[a])*(y[b]-y[a]))
		if math.IsNaN(v[t]) || math.IsInf(v[t], 0) {
			continue
		}
		for k := 0; k < 3; k++ {
			kk := key{tri[3*t+k], region[t]}
			s := sum[kk]
			sum[kk] = [2]float64{s[0] + area[t]*v[t], s[1] + area[t]}
		}
	}
	out := make([]float64, 3*nt)
	for t := 0; t < nt; t++ {
		for k := 0; k < 3; k++ {
			s := sum[key{tri[3*t+k], region[t]}]
			if (keep != nil && !keep(t)) || s[1] == 0 {
				out[3*t+k] = math.NaN()
				continue
			}
			out[3*t+k] = s[0] / s[1]
		}
	}
	return out
}

// Percentile returns the value below which a fraction q (0..1) of the
// total weight lies, for values v with weights w (e.g. triangle areas):
// the robust top of a colour range, which a single corner element cannot
// move. NaN and infinite values, and non-positive weights, are skipped; it
// returns 0 when nothing is left.
func Percentile(v, w []float64, q float64) float64 {
	type vw struct{ v, w float64 }
	var s []vw
	total := 0.0
	for i := range v {
		if math.IsNaN(v[i]) || math.IsInf(v[i], 0) || !(w[i] > 0) {
			continue
		}
		s = append(s, vw{v[i], w[i]})
		total += w[i]
	}
	if len(s) == 0 {
		return 0
	}
	sortBy(s, func(a, b vw) bool { return a.v < b.v })
	acc := 0.0
	for _, e := range s {
		acc += e.w
		if acc >= q*total {
			return e.v
		}
	}
	return s[len(s)-1].v
}
