package plot

import (
	"fmt"
	"io"
	"path/filepath"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"

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
