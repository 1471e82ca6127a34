package study

import (
	"errors"
	"os"

	"polegap/materials"
	"polegap/models"
	"polegap/solver"
)

// Material resolves a region's material name into the solver's material
// and, for a permanent magnet, its magnetisation (A/m). Names are looked up
// first among the model's own materials, then in the built-in library.
func Material(m *models.Model, r *models.Region) (solver.Material, [2]float64, error) {
	var zero [2]float64
	def, ok := m.Material(r.Material)
	if !ok {
		mat, _, found := materials.Lookup(r.Material)
		if !found {
			return nil, zero, m.Errorf(r.Pos, "region %q: material %q is neither defined under materials nor built in; 'polegap materials' lists the built-in ones", r.Name, r.Material)
		}
		if mg, isMagnet := mat.(materials.Magnet); isMagnet {
			mx, my := mg.Magnetization()
			return mat, [2]float64{mx, my}, nil
		}
		return mat, zero, nil
	}
	var curve *materials.Curve
	switch {
	case def.Magnet != nil:
		mg := materials.Magnet{Remanence: def.Magnet.Remanence, MuRecoil: def.Magnet.MuRecoil, Direction: def.Magnet.Direction}
		if err := mg.Check(); err != nil {
			return nil, zero, m.Errorf(def.Pos, "material %q: %v", def.Name, err)
		}
		mx, my := mg.Magnetization()
		return mg, [2]float64{mx, my}, nil
	case def.MuR > 0:
		return materials.Linear{MuR: def.MuR}, zero, nil
	case def.Curve != "":
		mat, _, found := materials.Lookup(def.Curve)
		if !found {
			return nil, zero, m.Errorf(def.Pos, "material %q: no built-in curve %q; 'polegap materials' lists them", def.Name, def.Curve)
		}
		c, isCurve := mat.(*materials.Curve)
		if !isCurve {
			if def.Stacking != 0 && def.Stacking != 1 {
				return nil, zero, m.Errorf(def.Pos, "material %q: a stacking factor applies to B-H curves, and %q is linear", def.Name, def.Curve)
			}
			return mat, zero, nil
		}
		curve = c
	case len(def.Table) > 0:
		h, b := make([]float64, len(def.Table)), make([]float64, len(def.Table))
		for i, row := range def.Table {
			h[i], b[i] = row[0], row[1]
		}
		c, err := materials.NewCurve(h, b)
		if err != nil {
			var te *materials.TableError
			if errors.As(err, &te) && te.Row >= 1 && te.Row <= len(def.TablePos) {
				return nil, zero, m.Errorf(def.TablePos[te.Row-1], "material %q: row %d of the B-H table (H = %g A/m, B = %g T): %s", def.Name, te.Row, te.H, te.B, te.Reason)
			}
			return nil, zero, m.Errorf(def.Pos, "material %q: %v", def.Name, err)
		}
		curve = c
	case def.TableFile != "":
		f, err := os.Open(def.TableFile)
		if err != nil {
			return nil, zero, m.Errorf(def.Pos, "material %q: %v", def.Name, err)
		}
		c, err := materials.ReadCurveCSV(f, def.TableFile)
		f.Close()
		if err != nil {
			return nil, zero, m.Errorf(def.Pos, "material %q: %v", def.Name, err)
		}
		curve = c
	default:
		return nil, zero, m.Errorf(def.Pos, "material %q defines no curve, table, mu-r or magnet", def.Name)
	}
	if def.Stacking != 0 && def.Stacking != 1 {
		c, err := curve.Stacked(def.Stacking)
		if err != nil {
			return nil, zero, m.Errorf(def.Pos, "material %q: stacking: %v", def.Name, err)
		}
		curve = c
	}
	return curve, zero, nil
}

// Conditions maps the model's boundary keywords to solver conditions.
var Conditions = map[string]solver.Condition{
	"zero-potential": solver.ZeroPotential,
	"flux-normal":    solver.FluxNormal,
}

// Problem builds the finite-element problem of a meshed model: a material
// and current density per region tag and a condition per boundary marker.
// Coil current densities are the ampere-turns of each side over the side's
// meshed area, so the total current is exact on the mesh.
func Problem(d *Discretization) (*solver.Problem, error) {
	m := d.Model
	n := len(m.Regions) + 2 // air, the regions, the Kelvin disk
	p := &solver.Problem{
		Mesh:           d.Mesh,
		Depth:          m.Depth,
		Materials:      make([]solver.Material, n),
		CurrentDensity: make([]float64, n),
		Boundary:       map[int32]solver.Condition{},
	}
	if m.Geometry == models.Axisymmetric {
		p.Formulation = solver.Axisymmetric
	}
	p.Materials[AirTag] = materials.Linear{MuR: 1}
	p.Materials[KelvinTag(m)] = materials.Linear{MuR: 1}
	var magnets [][2]float64
	for i := range m.Regions {
		mat, mag, err := Material(m, &m.Regions[i])
		if err != nil {
			return nil, err
		}
		p.Materials[Tag(i)] = mat
		if mag != [2]float64{} {
			if magnets == nil {
				magnets = make([][2]float64, n)
			}
			magnets[Tag(i)] = mag
		}
	}
	p.Magnetization = magnets
	areas := d.Mesh.RegionAreas()
	for ci := range m.Coils {
		c := &m.Coils[ci]
		for _, s := range c.Sides {
			idx := regionIndex(m, s.Region)
			if idx < 0 {
				return nil, m.Errorf(s.Pos, "coil %q: side region %q does not exist", c.Name, s.Region)
			}
			a := areas[Tag(idx)]
			if !(a > 0) {
				return nil, m.Errorf(s.Pos, "coil %q: side region %q has no area in the mesh", c.Name, s.Region)
			}
			p.CurrentDensity[Tag(idx)] += c.Turns * c.Current * s.Sense / a
		}
	}
	if d.Kelvin != nil {
		// The rim of the model and the rim of the exterior disk share
		// their unknowns; the point at infinity holds A = 0 (and takes up
		// any net current of the model, whose return path is at infinity).
		p.Boundary[MarkerCircle] = solver.FluxNormal
		p.Identify = d.Kelvin.Pairs
		p.Fixed = []solver.NodeValue{{Node: d.Kelvin.Infinity, A: 0}}
		return p, nil
	}
	cond, ok := Conditions[m.Boundary.Condition]
	if !ok {
		return nil, m.Errorf(m.Boundary.Pos, "unknown boundary condition %q", m.Boundary.Condition)
	}
	for _, mk := range []int32{MarkerLeft, MarkerRight, MarkerBottom, MarkerTop, MarkerCircle} {
		p.Boundary[mk] = cond
	}
	for side, c := range m.Boundary.Sides {
		sc, ok := Conditions[c]
		if !ok {
			return nil, m.Errorf(m.Boundary.Pos, "boundary side %s: condition %q cannot be used on one side", side, c)
		}
		p.Boundary[SideMarker[side]] = sc
	}
	if m.Geometry == models.Axisymmetric {
		// The axis carries A = 0 whatever the model says.
		p.Boundary[MarkerLeft] = solver.ZeroPotential
	}
	return p, nil
}

func regionIndex(m *models.Model, name string) int {
	for i := range m.Regions {
		if m.Regions[i].Name == name {
			return i
		}
	}
	return -1
}
