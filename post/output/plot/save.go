package plot

import (
	"fmt"
	"io"
	"path/filepath"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"polegap/internal/fileout"
)

// Save writes p to path in the format named by its extension (.png, .svg,
// .pdf, .jpg), width by height, atomically.
func Save(p *plot.Plot, width, height vg.Length, path string) error {
	ext := strings.ToLower(strings.TrimPrefix(filepath.Ext(path), "."))
	switch ext {
	case "png", "svg", "pdf", "jpg", "jpeg", "eps", "tif", "tiff":
	default:
		return fmt.Errorf("plot %s: unknown image format %q (use .png, .svg or .pdf)", path, ext)
	}
	wt, err := p.WriterTo(width, height, ext)
	if err != nil {
		return fmt.Errorf("plot %s: %w", path, err)
	}
	return fileout.Write(path, func(w io.Writer) error {
		_, err := wt.WriteTo(w)
		return err
	})
}

// SaveGrid writes plots arranged in rows and columns into one figure,
// width by height overall, in the format named by path's extension.
func SaveGrid(plots [][]*plot.Plot, width, height vg.Length, path string) error {
	ext := strings.ToLower(strings.TrimPrefix(filepath.Ext(path), "."))
	c, err := RenderGrid(plots, width, height, ext)
	if err != nil {
		return fmt.Errorf("plot %s: %w", path, err)
	}
	return fileout.Write(path, func(w io.Writer) error {
		_, err := c.WriteTo(w)
		return err
	})
}

// RenderGrid draws plots arranged in rows and columns on a canvas of the
// given format (png, svg, pdf), ready to be written out.
func RenderGrid(plots [][]*plot.Plot, width, height vg.Length, format string) (vg.CanvasWriterTo, error) {
	c, err := draw.NewFormattedCanvas(width, height, format)
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

// SaveGridWidths writes plots side by side in one row, each given its
// width in centimetres, height tall overall.
func SaveGridWidths(plots []*plot.Plot, widths []float64, height vg.Length, path string) error {
	ext := strings.ToLower(strings.TrimPrefix(filepath.Ext(path), "."))
	c, err := RenderRow(plots, widths, height, ext)
	if err != nil {
		return fmt.Errorf("plot %s: %w", path, err)
	}
	return fileout.Write(path, func(w io.Writer) error {
		_, err := c.WriteTo(w)
		return err
	})
}

// RenderRow draws plots side by side, each given its width in
// centimetres, on a canvas of the given format.
func RenderRow(plots []*plot.Plot, widths []float64, height vg.Length, format string) (vg.CanvasWriterTo, error) {
	total := 0.0
	for _, w := range widths {
		total += w
	}
	c, err := draw.NewFormattedCanvas(vg.Length(total)*vg.Centimeter, height, format)
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
		p.Draw(sub)
		x += w
	}
	return c, nil
}
