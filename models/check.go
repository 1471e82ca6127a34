package models

import (
	"fmt"
	"math"
)

// Check verifies the invariants listed in the package documentation and
// returns the first one broken, or nil. Parse only returns models that pass;
// tests and fuzz targets call Check on every model they see, and code that
// builds or edits a Model by hand can call it before meshing.
func (m *Model) Check() error {
	if m == nil {
		return fmt.Errorf("models: nil model")
	}
	bad := func(format string, args ...any) error {
		return fmt.Errorf("models: invalid model %q: "+format, append([]any{m.Name}, args...)...)
	}
	finite := func(xs ...float64) bool {
		for _, x := range xs {
			if math.IsNaN(x) || math.IsInf(x, 0) {
				return false
			}
		}
		return true
	}
	if !(m.Scale > 0) || unitScale[m.Units] != m.Scale {
		return bad("units %q with scale %g", m.Units, m.Scale)
	}
	if m.Geometry == Planar && !(m.Depth > 0 && finite(m.Depth)) {
		return bad("planar depth %g", m.Depth)
	}
	if m.Geometry == Axisymmetric && m.Depth != 0 {
		return bad("axisymmetric model with depth %g", m.Depth)
	}
	if !(m.Gap >= 0) || !finite(m.Gap) {
		return bad("gap %g", m.Gap)
	}
	if len(m.Regions) == 0 {
		return bad("no regions")
	}
	for _, mat := range m.Materials {
		kinds := 0
		if mat.Curve != "" {
			kinds++
		}
		if mat.Table != nil {
			kinds++
		}
		if mat.TableFile != "" {
			kinds++
		}
		if mat.MuR > 0 {
			kinds++
		}
		if mat.Magnet != nil {
			kinds++
			if !finite(mat.Magnet.Remanence, mat.Magnet.MuRecoil, mat.Magnet.Direction) || mat.Magnet.MuRecoil <= 0 {
				return bad("material %q: magnet %+v", mat.Name, *mat.Magnet)
			}
		}
		if kinds != 1 || !(mat.Stacking > 0 && mat.Stacking <= 1) || !finite(mat.MuR) {
			return bad("material %q: %d kinds, stacking %g", mat.Name, kinds, mat.Stacking)
		}
		for _, row := range mat.Table {
			if !finite(row[0], row[1]) {
				return bad("material %q: table row %v", mat.Name, row)
			}
		}
	}
	for _, name := range []string{"air", "copper"} {
		if _, ok := m.Material(name); !ok {
			return bad("implicit material %q missing", name)
		}
	}
	size := 0.0
	for i := range m.Regions {
		size = math.Max(size, regionScale(&m.Regions[i]))
	}
	names := map[string]bool{}
	for i := range m.Regions {
		r := &m.Regions[i]
		if names[r.Name] || r.Name == "" {
			return bad("region name %q empty or repeated", r.Name)
		}
		names[r.Name] = true
		if _, ok := m.Material(r.Material); !ok {
			return bad("region %q: material %q undefined", r.Name, r.Material)
		}
		n := len(r.X)
		if n < 3 || len(r.Y) != n || (r.Sweep != nil && len(r.Sweep) != n) {
			return bad("region %q: %d x, %d y, %d sweep", r.Name, n, len(r.Y), len(r.Sweep))
		}
		if !finite(r.X...) || !finite(r.Y...) || !finite(r.Sweep...) || !finite(r.MeshSize) || r.MeshSize < 0 {
			return bad("region %q: non-finite coordinate or size", r.Name)
		}
		for _, s := range r.Sweep {
			if math.Abs(s) >= 2*math.Pi {
				return bad("region %q: arc sweep %g", r.Name, s)
			}
		}
		if a := r.Area(); !(a > 0) {
			return bad("region %q: area %g (not counter-clockwise?)", r.Name, a)
		}
		if m.Geometry == Axisymmetric {
			x0, _, _, _ := r.Bounds()
			if x0 < -relTol*size {
				return bad("region %q: reaches r = %g < 0", r.Name, x0)
			}
		}
	}
	sides := map[string]bool{}
	for _, c := range m.Coils {
		if !(c.Turns > 0) || !finite(c.Turns, c.Current, c.FillFactor, c.Temperature, c.SupplyVoltage, c.SupplyCurrent) || len(c.Sides) == 0 {
			return bad("coil %q: turns %g current %g, %d sides", c.Name, c.Turns, c.Current, len(c.Sides))
		}
		for _, s := range c.Sides {
			if !names[s.Region] || sides[s.Region] || (s.Sense != 1 && s.Sense != -1) {
				return bad("coil %q: side %q sense %g", c.Name, s.Region, s.Sense)
			}
			sides[s.Region] = true
		}
	}
	b := m.Boundary
	if !contains(boundaryShapes, b.Shape) || !contains(boundaryConditions, b.Condition) || !(b.Margin > 0) || !finite(b.Margin) {
		return bad("boundary %+v", b)
	}
	for side, g := range b.Margins {
		if !contains(boxSides, side) || !(g > 0) || !finite(g) || b.Shape != "box" {
			return bad("boundary margin %s = %g", side, g)
		}
	}
	if bx := b.Box; bx != nil {
		if b.Shape != "box" || !finite(bx[0][0], bx[0][1], bx[1][0], bx[1][1]) || !(bx[0][0] < bx[1][0] && bx[0][1] < bx[1][1]) {
			return bad("boundary box %v", *bx)
		}
	}
	mc := m.Mesh
	if !(mc.Size > 0) || (mc.Order != 1 && mc.Order != 2) || !(mc.MinAngle > 0) || !(mc.Grading > 0) || mc.Chord < 0 ||
		!finite(mc.Size, mc.MinAngle, mc.Grading, mc.Chord) {
		return bad("mesh controls %+v", mc)
	}
	probes := map[string]bool{}
	for _, p := range m.Probes {
		if probes[p.Name] {
			return bad("probe %q repeated", p.Name)
		}
		probes[p.Name] = true
		if !finite(p.Point[0], p.Point[1], p.Line[0][0], p.Line[0][1], p.Line[1][0], p.Line[1][1],
			p.Box[0][0], p.Box[0][1], p.Box[1][0], p.Box[1][1], p.Centre[0], p.Centre[1], p.Radius) {
			return bad("probe %q: non-finite coordinate", p.Name)
		}
		switch p.Kind {
		case ProbePoint:
		case ProbeLine:
			if p.Samples < 2 {
				return bad("probe %q: %d samples", p.Name, p.Samples)
			}
		case ProbeBox:
			if !(p.Box[0][0] < p.Box[1][0] && p.Box[0][1] < p.Box[1][1]) {
				return bad("probe %q: box %v", p.Name, p.Box)
			}
		case ProbeCircle:
			if !(p.Radius > 0) || p.Samples < 2 {
				return bad("probe %q: radius %g samples %d", p.Name, p.Radius, p.Samples)
			}
		default:
			return bad("probe %q: kind %q", p.Name, p.Kind)
		}
	}
	for _, r := range mc.Refine {
		if !(r.Size > 0) || !finite(r.Size) {
			return bad("refine size %g", r.Size)
		}
		if r.Near != "" && !names[r.Near] && !probes[r.Near] {
			return bad("refine near %q", r.Near)
		}
	}
	if t := m.Target; t != nil && (!probes[t.Probe] || !(t.Field > 0) || !finite(t.Field)) {
		return bad("target %+v", *t)
	}
	return nil
}

func regionScale(r *Region) float64 {
	s := 0.0
	for i := range r.X {
		s = math.Max(s, math.Max(math.Abs(r.X[i]), math.Abs(r.Y[i])))
	}
	return s
}
