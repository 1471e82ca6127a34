package plot

import (
	"fmt"
	"io"
	"math"
	"path/filepath"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgeps"
	"gonum.org/v1/plot/vg/vgimg"
	"gonum.org/v1/plot/vg/vgpdf"
	"gonum.org/v1/plot/vg/vgsvg"

	"polegap/internal/fileout"
)

// DefaultPixels is the width in pixels of a raster figure (PNG, JPEG,
// TIFF) when Options.DPI is zero: enough for a projector or a printed A4
// page at about 200 dpi.
const DefaultPixels = 1600

// Options are a figure file's output settings. The zero value is the
// default: raster formats DefaultPixels wide. The physical size (and so
// the size of text and lines against the picture) is the same in every
// format; only the raster's pixel density changes.
type Options struct {
	// DPI is the resolution of raster formats in dots per inch; 0 sets it
	// so that the picture is DefaultPixels wide. Vector formats (SVG,
	// PDF, EPS) ignore it.
	DPI float64
}

// dpi returns the raster resolution for a figure width wide.
func (o Options) dpi(width vg.Length) int {
	if o.DPI > 0 {
		return max(1, int(math.Round(o.DPI)))
	}
	return max(1, int(math.Floor(DefaultPixels/(width.Points()/vg.Inch.Points()))))
}

func options(opts []Options) Options {
	if len(opts) > 0 {
		return opts[0]
	}
	return Options{}
}

// formatOf returns the lower-case extension of path, or an error naming the
// formats polegap writes.
func formatOf(path string) (string, error) {
	ext := strings.ToLower(strings.TrimPrefix(filepath.Ext(path), "."))
	switch ext {
	case "png", "svg", "pdf", "jpg", "jpeg", "eps", "tif", "tiff":
		return ext, nil
	}
	return "", fmt.Errorf("plot %s: unknown image format %q (use .png, .svg or .pdf)", path, ext)
}

// NewCanvas returns a canvas width by height in the given format (png,
// jpg, tiff, svg, pdf, eps), raster formats at opt's resolution.
func NewCanvas(width, height vg.Length, format string, opts ...Options) (vg.CanvasWriterTo, error) {
	switch format {
	case "svg":
		return vgsvg.New(width, height), nil
	case "pdf":
		return pdfCanvas{vgpdf.New(width, height)}, nil
	case "eps":
		return vgeps.New(width, height), nil
	}
	img := vgimg.NewWith(vgimg.UseWH(width, height), vgimg.UseDPI(options(opts).dpi(width)))
	switch format {
	case "png":
		return vgimg.PngCanvas{Canvas: img}, nil
	case "jpg", "jpeg":
		return vgimg.JpegCanvas{Canvas: img}, nil
	case "tif", "tiff":
		return vgimg.TiffCanvas{Canvas: img}, nil
	}
	return nil, fmt.Errorf("unsupported format: %q", format)
}

// Save writes p to path in the format named by its extension (.png, .svg,
// .pdf, .jpg), width by height, atomically.
func Save(p *plot.Plot, width, height vg.Length, path string, opts ...Options) error {
	ext, err := formatOf(path)
	if err != nil {
		return err
	}
	c, err := NewCanvas(width, height, ext, opts...)
	if err != nil {
		return fmt.Errorf("plot %s: %w", path, err)
	}
	p.Draw(draw.New(c))
	return write(path, c)
}

func write(path string, c io.WriterTo) error {
	return fileout.Write(path, func(w io.Writer) error {
		_, err := c.WriteTo(w)
		return err
	})
}

// SaveGrid writes plots arranged in rows and columns into one figure,
// width by height overall, in the format named by path's extension.
func SaveGrid(plots [][]*plot.Plot, width, height vg.Length, path string, opts ...Options) error {
	ext, err := formatOf(path)
	if err != nil {
		return err
	}
	c, err := RenderGrid(plots, width, height, ext, opts...)
	if err != nil {
		return fmt.Errorf("plot %s: %w", path, err)
	}
	return write(path, c)
}

// RenderGrid draws plots arranged in rows and columns on a canvas of the
// given format (png, svg, pdf), ready to be written out. Rows share the
// height equally; see RenderStack for rows of different heights.
func RenderGrid(plots [][]*plot.Plot, width, height vg.Length, format string, opts ...Options) (vg.CanvasWriterTo, error) {
	c, err := NewCanvas(width, height, format, opts...)
	if err != nil {
		return nil, err
	}
	rows, cols := len(plots), 0
	for _, r := range plots {
		cols = max(cols, len(r))
	}
	tiles := draw.Tiles{Rows: rows, Cols: cols, PadX: vg.Millimeter * 4, PadY: vg.Millimeter * 4,
		PadTop: vg.Millimeter * 2, PadBottom: vg.Millimeter * 2, PadLeft: vg.Millimeter * 2, PadRight: vg.Millimeter * 2}
	canvases := plot.Align(plots, tiles, draw.New(c))
	for i := range plots {
		for j, p := range plots[i] {
			if p != nil {
				p.Draw(canvases[i][j])
			}
		}
	}
	return c, nil
}

// RenderStack draws plots one above the other in a single column, each
// given its share of the height (shares are relative, e.g. 3 and 1 for a
// curve over its residual panel), with their plotting areas aligned on the
// left so that their x axes line up.
func RenderStack(plots []*plot.Plot, shares []float64, width, height vg.Length, format string, opts ...Options) (vg.CanvasWriterTo, error) {
	if len(plots) != len(shares) {
		panic("plot: RenderStack with unequal plots and shares")
	}
	c, err := NewCanvas(width, height, format, opts...)
	if err != nil {
		return nil, err
	}
	dc := draw.New(c)
	pad := vg.Millimeter * 2
	total := 0.0
	for _, s := range shares {
		total += s
	}
	// Align the left edges: the widest y-axis decides.
	left := vg.Length(0)
	for _, p := range plots {
		left = max(left, yAxisWidth(p))
	}
	top := dc.Max.Y - pad
	avail := dc.Max.Y - dc.Min.Y - 2*pad
	for i, p := range plots {
		h := avail * vg.Length(shares[i]/total)
		sub := draw.Canvas{Canvas: dc.Canvas, Rectangle: vg.Rectangle{
			Min: vg.Point{X: dc.Min.X + pad + left - yAxisWidth(p), Y: top - h},
			Max: vg.Point{X: dc.Max.X - pad, Y: top},
		}}
		p.Draw(sub)
		top -= h
	}
	return c, nil
}

// yAxisWidth is the width p's y axis (label, tick labels) takes on the left.
func yAxisWidth(p *plot.Plot) vg.Length {
	c := draw.New(vgimg.New(10*vg.Centimeter, 10*vg.Centimeter))
	full := p.DataCanvas(c)
	return full.Min.X - c.Min.X
}

// SaveStack writes plots stacked in one column (RenderStack) to path.
func SaveStack(plots []*plot.Plot, shares []float64, width, height vg.Length, path string, opts ...Options) error {
	ext, err := formatOf(path)
	if err != nil {
		return err
	}
	c, err := RenderStack(plots, shares, width, height, ext, opts...)
	if err != nil {
		return fmt.Errorf("plot %s: %w", path, err)
	}
	return write(path, c)
}

// SaveGridWidths writes plots side by side in one row, each given its
// width in centimetres, height tall overall.
func SaveGridWidths(plots []*plot.Plot, widths []float64, height vg.Length, path string, opts ...Options) error {
	ext, err := formatOf(path)
	if err != nil {
		return err
	}
	c, err := RenderRow(plots, widths, height, ext, opts...)
	if err != nil {
		return fmt.Errorf("plot %s: %w", path, err)
	}
	return write(path, c)
}

// RenderRow draws plots side by side, each given its width in
// centimetres, on a canvas of the given format.
func RenderRow(plots []*plot.Plot, widths []float64, height vg.Length, format string, opts ...Options) (vg.CanvasWriterTo, error) {
	total := 0.0
	for _, w := range widths {
		total += w
	}
	c, err := NewCanvas(vg.Length(total)*vg.Centimeter, height, format, opts...)
	if err != nil {
		return nil, err
	}
	dc := draw.New(c)
	x := vg.Length(0)
	for i, p := range plots {
		w := vg.Length(widths[i]) * vg.Centimeter
		sub := draw.Canvas{Canvas: dc.Canvas, Rectangle: vg.Rectangle{
			Min: vg.Point{X: dc.Min.X + x, Y: dc.Min.Y},
			Max: vg.Point{X: dc.Min.X + x + w, Y: dc.Max.Y},
		}}
		if p != nil {
			p.Draw(sub)
		}
		x += w
	}
	return c, nil
}
