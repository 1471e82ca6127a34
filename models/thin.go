package models

import (
	"fmt"
	"math"

	"polegap/mesh"
)

// Minimum feature size (mesh.min-feature). A model drawn from an imported
// outline can hold features far below any sensible element size: a sliver
// region, two vertices a hair apart, a hair-thin gap between two regions.
// Quality meshing resolves every one of them with elements no larger than
// the feature, which can cost millions of triangles (post/study refuses
// such a model before meshing and names the feature). MinFeature says
// which of them the user does not mean:
//
//   - a region whose width (twice its area over its perimeter, arcs as
//     5° chords) is below MinFeature is dropped from the model, and
//     Model.Dropped names it; a coil side, a magnet or a region a force
//     part names is not dropped but refused, since the model would mean
//     something else without it;
//   - the mesher merges vertices closer than MinFeature and snaps a vertex
//     that close to an edge onto it (post/study.GraphOptions), which
//     closes gaps narrower than MinFeature between regions.

// Width returns twice the region's area over its perimeter, metres: the
// width of a long thin strip (arcs as 5° chords).
func (r *Region) Width() float64 {
	x, y := r.X, r.Y
	if r.Sweep != nil {
		x, y = mesh.DiscretizePolygon(mesh.Polygon{X: r.X, Y: r.Y, Sweep: r.Sweep},
			mesh.GraphOptions{ChordTol: math.Inf(1), MaxArcAngle: 5 * math.Pi / 180})
	}
	var a, p float64
	n := len(x)
	for i := 0; i < n; i++ {
		j := (i + 1) % n
		a += x[i]*y[j] - x[j]*y[i]
		p += math.Hypot(x[j]-x[i], y[j]-y[i])
	}
	if p == 0 {
		return 0
	}
	return math.Abs(a) / p
}

// dropThin removes the regions thinner than m.Mesh.MinFeature (see above).
func (d *decoder) dropThin(m *Model) {
	mf := m.Mesh.MinFeature
	if mf <= 0 || len(d.errs) > 0 {
		return
	}
	used := map[string]string{}
	for _, c := range m.Coils {
		for _, s := range c.Sides {
			used[s.Region] = fmt.Sprintf("a side of coil %q", c.Name)
		}
	}
	for _, p := range m.Forces {
		for _, r := range p.Regions {
			used[r] = fmt.Sprintf("part of %q under forces", p.Name)
		}
	}
	keep := m.Regions[:0:0]
	for i := range m.Regions {
		r := &m.Regions[i]
		w := r.Width()
		if w >= mf {
			keep = append(keep, *r)
			continue
		}
		why := used[r.Name]
		if mat, ok := m.Material(r.Material); ok && mat.Magnet != nil {
			why = "a permanent magnet"
		}
		if why != "" {
			d.failAt(r.Pos, "region %q is %s wide, below mesh.min-feature (%s), but it is %s and cannot be dropped; thicken it or lower mesh.min-feature",
				r.Name, fmtLen(w, m), fmtLen(mf, m), why)
			keep = append(keep, *r)
			continue
		}
		m.Dropped = append(m.Dropped, fmt.Sprintf("%s:%d:%d: regions[%d]: region %q (%s wide) dropped: thinner than mesh.min-feature (%s)",
			m.File, r.Pos.Line, r.Pos.Column, i, r.Name, fmtLen(w, m), fmtLen(mf, m)))
	}
	if len(keep) == 0 {
		d.failAt(m.Mesh.Pos, "mesh.min-feature (%s) is wider than every region; give a length well below the regions' widths", fmtLen(mf, m))
		return
	}
	m.Regions = keep
}

// fmtLen writes a length in metres in the model's units, 3 digits.
func fmtLen(v float64, m *Model) string {
	if m.Scale > 0 {
		return fmt.Sprintf("%.3g %s", v/m.Scale, m.Units)
	}
	return fmt.Sprintf("%.3g m", v)
}
