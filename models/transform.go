package models

import "fmt"

// Clone returns a deep copy of m: regions, coils, probes, materials and
// mesh controls can then be changed without touching m.
func (m *Model) Clone() *Model {
	c := *m
	c.Materials = append([]Material(nil), m.Materials...)
	for i := range c.Materials {
		if t := m.Materials[i].Table; t != nil {
			c.Materials[i].Table = append([][2]float64(nil), t...)
		}
		if mg := m.Materials[i].Magnet; mg != nil {
			v := *mg
			c.Materials[i].Magnet = &v
		}
	}
	c.Regions = append([]Region(nil), m.Regions...)
	for i := range c.Regions {
		r := &c.Regions[i]
		r.X = append([]float64(nil), r.X...)
		r.Y = append([]float64(nil), r.Y...)
		if r.Sweep != nil {
			r.Sweep = append([]float64(nil), r.Sweep...)
		}
	}
	c.Coils = append([]Coil(nil), m.Coils...)
	for i := range c.Coils {
		c.Coils[i].Sides = append([]CoilSide(nil), m.Coils[i].Sides...)
	}
	c.Probes = append([]Probe(nil), m.Probes...)
	c.Mesh.Refine = append([]Refine(nil), m.Mesh.Refine...)
	if m.Boundary.Sides != nil {
		c.Boundary.Sides = make(map[string]string, len(m.Boundary.Sides))
		for k, v := range m.Boundary.Sides {
			c.Boundary.Sides[k] = v
		}
	}
	if m.Boundary.Margins != nil {
		c.Boundary.Margins = make(map[string]float64, len(m.Boundary.Margins))
		for k, v := range m.Boundary.Margins {
			c.Boundary.Margins[k] = v
		}
	}
	if m.Boundary.Box != nil {
		bx := *m.Boundary.Box
		c.Boundary.Box = &bx
	}
	if m.Target != nil {
		t := *m.Target
		c.Target = &t
	}
	return &c
}

// WithGap returns a copy of m whose gap is opened (or closed) by delta
// metres about the horizontal mid-plane y = mid: every region vertex above
// the mid-plane moves up by delta/2 and every vertex below it moves down
// by delta/2, so the poles, arms and the gap region move apart while the
// back leg (which spans the mid-plane) stretches with them. Coil sides
// move with their half; probes stay where they are, the gap centre on the
// mid-plane. Model.Gap grows by delta. Mesh refinements (points and
// lines) move with their half too.
//
// This is the generic way to vary the gap of a magnet whose gap straddles
// a horizontal mid-plane (C-core, H-core, round-pole, planar or
// axisymmetric): it is what a measured excitation curve is calibrated
// against. It returns an error if the gap would close (Gap + delta <= 0)
// or a region has a vertex on the mid-plane that is not an end of a
// vertical edge crossing it (such a region is cut by the stretch).
func (m *Model) WithGap(mid, delta float64) (*Model, error) {
	if m.Gap > 0 && m.Gap+delta <= 0 {
		return nil, fmt.Errorf("%s: a gap change of %g m would close the %g m gap", m.File, delta, m.Gap)
	}
	c := m.Clone()
	shift := func(y float64) float64 {
		switch {
		case y > mid:
			return y + delta/2
		case y < mid:
			return y - delta/2
		}
		return y
	}
	for i := range c.Regions {
		r := &c.Regions[i]
		for k := range r.Y {
			r.Y[k] = shift(r.Y[k])
		}
	}
	for i := range c.Mesh.Refine {
		rf := &c.Mesh.Refine[i]
		if rf.Point != nil {
			p := *rf.Point
			p[1] = shift(p[1])
			rf.Point = &p
		}
		if rf.Line != nil {
			l := *rf.Line
			l[0][1], l[1][1] = shift(l[0][1]), shift(l[1][1])
			rf.Line = &l
		}
	}
	if c.Gap > 0 {
		c.Gap += delta
	}
	return c, nil
}
