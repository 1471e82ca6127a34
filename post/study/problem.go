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

// sources are a model's materials and coils resolved once: the material
// and magnetisation of every region tag (B-H tables read and checked, CSV
// files read, stacking applied) and the region tags of every coil side.
// They depend on the model's regions, not on the mesh, so every variant
// of a study (another gap, a moved part, a refined mesh) shares them.
type sources struct {
	materials []solver.Material // per region tag
	magnet    [][2]float64      // per region tag; nil without magnets
	sides     [][]coilSide      // per model coil
}

type coilSide struct {
	tag   int32
	sense float64
	pos   models.Pos
}

// resolve resolves the materials and coil sides of m.
func resolve(m *models.Model) (*sources, error) {
	n := len(m.Regions) + 2 // air, the regions, the Kelvin disk
	src := &sources{materials: make([]solver.Material, n)}
	src.materials[AirTag] = materials.Linear{MuR: 1}
	src.materials[KelvinTag(m)] = materials.Linear{MuR: 1}
	for i := range m.Regions {
		mat, mag, err := Material(m, &m.Regions[i])
		if err != nil {
			return nil, err
		}
		src.materials[Tag(i)] = mat
		if mag != [2]float64{} {
			if src.magnet == nil {
				src.magnet = make([][2]float64, n)
			}
			src.magnet[Tag(i)] = mag
		}
	}
	src.sides = make([][]coilSide, len(m.Coils))
	for ci := range m.Coils {
		c := &m.Coils[ci]
		for _, s := range c.Sides {
			idx := regionIndex(m, s.Region)
			if idx < 0 {
				return nil, m.Errorf(s.Pos, "coil %q: side region %q does not exist", c.Name, s.Region)
			}
			src.sides[ci] = append(src.sides[ci], coilSide{tag: Tag(idx), sense: s.Sense, pos: s.Pos})
		}
	}
	return src, nil
}

// newProblem builds the finite-element problem of a meshed model with its
// sources: boundary conditions per edge marker, the magnetisation, and
// material and current-density slices that fill sets for each solve.
func newProblem(d *Discretization, src *sources) (*solver.Problem, error) {
	m := d.Model
	n := len(src.materials)
	p := &solver.Problem{
		Mesh:           d.Mesh,
		Depth:          m.Depth,
		Materials:      append([]solver.Material(nil), src.materials...),
		CurrentDensity: make([]float64, n),
		Magnetization:  src.magnet,
		Boundary:       map[int32]solver.Condition{},
	}
	if m.Geometry == models.Axisymmetric {
		p.Formulation = solver.Axisymmetric
	}
	if d.Kelvin != nil {
		// The rim of the model and the rim of the exterior disk share
		// their unknowns; the point at infinity holds A = 0 (and takes up
		// any net current of the model, whose return path is at infinity).
		p.Boundary[MarkerCircle] = solver.FluxNormal
		p.Identify = d.Kelvin.Pairs
		p.Fixed = []solver.NodeValue{{Node: d.Kelvin.Infinity, A: 0}}
		if d.Kelvin.Half {
			// Axisymmetric: the image of the space outside the sphere
			// carries the reluctivity factor ρ'²/R² (solver.Exterior);
			// the axis of both half discs holds A = 0.
			p.Boundary[MarkerLeft] = solver.ZeroPotential
			p.Exterior = []solver.Exterior{{Region: KelvinTag(m), CX: d.Kelvin.CX, CY: d.Kelvin.CY, Radius: d.Kelvin.Radius}}
		}
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

// checkAreas reports a coil side without area in the mesh.
func checkAreas(m *models.Model, src *sources, areas map[int32]float64) error {
	for ci, sides := range src.sides {
		for _, s := range sides {
			if !(areas[s.tag] > 0) {
				return m.Errorf(s.pos, "coil %q: side region %q has no area in the mesh", m.Coils[ci].Name, m.Regions[s.tag-1].Name)
			}
		}
	}
	return nil
}

// fill writes the values of a solve at params into p: every region's
// material (nonlinear curves scaled by the iron factor) and the coil
// current densities, each side's ampere-turns over its meshed area (so
// the total current is exact on the mesh).
func fill(p *solver.Problem, m *models.Model, src *sources, areas map[int32]float64, params Params) {
	for tag, mat := range src.materials {
		if c, ok := mat.(*materials.Curve); ok && params.IronScale != 0 && params.IronScale != 1 {
			mat = scaledCurve{c, params.IronScale}
		}
		p.Materials[tag] = mat
	}
	clear(p.CurrentDensity)
	for ci, sides := range src.sides {
		turns, current := params.turns(m, ci), params.current(m, ci)
		for _, s := range sides {
			p.CurrentDensity[s.tag] += turns * current * s.sense / areas[s.tag]
		}
	}
}

// scaledCurve is an iron curve whose permeability is multiplied by s: the
// reluctivity and its derivative divided by s.
type scaledCurve struct {
	c *materials.Curve
	s float64
}

func (m scaledCurve) Nu(b2 float64) (nu, dnu float64) {
	nu, dnu = m.c.Nu(b2)
	return nu / m.s, dnu / m.s
}

// Problem builds the finite-element problem of a meshed model at the
// model's own currents and materials (a one-off solve; a Study reuses
// its problem across solves).
func Problem(d *Discretization) (*solver.Problem, error) {
	src, err := resolve(d.Model)
	if err != nil {
		return nil, err
	}
	areas := d.Mesh.RegionAreas()
	if err := checkAreas(d.Model, src, areas); err != nil {
		return nil, err
	}
	p, err := newProblem(d, src)
	if err != nil {
		return nil, err
	}
	fill(p, d.Model, src, areas, Params{})
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
