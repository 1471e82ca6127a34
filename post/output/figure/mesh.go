package figure

import (
	"math"

	gplot "gonum.org/v1/plot"

	"polegap/models"
	"polegap/post/output/plot"
	"polegap/post/study"
)

// Mesh returns the mesh figure of a discretised model, each triangle in
// its region kind's colour with a legend of the kinds, cropped to the
// magnet and a margin (ModelWindow) unless whole is set.
func Mesh(d *study.Discretization, whole bool) *gplot.Plot {
	m := d.Mesh
	p := plot.MeshFigure(d.Model.Name+": mesh", m.X, m.Y, m.Tri, m.Region, d.RegionKind)
	plot.AxisNames(p, d.Model.Geometry == models.Axisymmetric)
	if !whole {
		p.X.Min, p.X.Max, p.Y.Min, p.Y.Max = ModelWindow(d.Model)
	}
	return p
}

// DrawMesh saves the mesh figure (Mesh) to path, with equal scales.
func DrawMesh(path string, d *study.Discretization, whole bool, out plot.Options) error {
	p := Mesh(d, whole)
	w := CM(18)
	return plot.Save(p, w, plot.EqualAspectHeight(p, w), path, out)
}

// ModelWindow returns the drawing window in millimetres: the magnet (the
// model's extent) with a margin of a tenth of its larger side around it,
// not past the axis of an axisymmetric model.
func ModelWindow(m *models.Model) (x0, x1, y0, y1 float64) {
	xmin, ymin, xmax, ymax := m.Extent()
	d := 0.1 * math.Max(xmax-xmin, ymax-ymin)
	x0, x1, y0, y1 = (xmin-d)*1e3, (xmax+d)*1e3, (ymin-d)*1e3, (ymax+d)*1e3
	if m.Geometry == models.Axisymmetric {
		x0 = math.Max(x0, 0)
	}
	return x0, x1, y0, y1
}
