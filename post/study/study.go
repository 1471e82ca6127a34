package study

import (
	"time"

	"polegap/mesh"
	"polegap/models"
	"polegap/post/study/probes"
	"polegap/solver"
)

// Options control a run. The zero value uses the solver's defaults.
type Options struct {
	Solver solver.Options
	// Material, when set, replaces the material of each region tag after
	// the problem is built (calibration uses it to scale an iron curve).
	Material func(tag int32, m solver.Material) solver.Material
}

// Study is a solved model.
type Study struct {
	Model    *models.Model
	Disc     *Discretization
	Problem  *solver.Problem
	Solution *solver.Solution
	Probes   []probes.Result
	MeshTime time.Duration

	// prep keeps the numbering, sparsity pattern and symbolic
	// factorization of the mesh for later solves (sweep points, target
	// search): only the problem's values change between them.
	prep     *solver.Prepared
	prepProb *solver.Problem
	field    probes.Field  // the field of the current Solution
	loc      *mesh.Locator // point location on Disc.Mesh, built once
	patches  *probes.Patches
	b        [][2]float64 // element flux density of Solution, made once
}

// Run meshes, solves and probes m.
func Run(m *models.Model, opt Options) (*Study, error) {
	start := time.Now()
	d, err := Discretize(m)
	if err != nil {
		return nil, err
	}
	s := &Study{Model: m, Disc: d, MeshTime: time.Since(start)}
	if err := s.Solve(opt); err != nil {
		return nil, err
	}
	return s, nil
}

// Solve (re)builds the problem from the model on the existing mesh, solves
// it and evaluates the probes. Call it again after changing coil currents.
func (s *Study) Solve(opt Options) error {
	p, err := Problem(s.Disc)
	if err != nil {
		return err
	}
	p.Locator = s.locator() // one point locator for the probes and the solver
	if opt.Material != nil {
		for tag, m := range p.Materials {
			p.Materials[tag] = opt.Material(int32(tag), m)
		}
	}
	var sol *solver.Solution
	if s.prep != nil && sameShape(s.prepProb, p) {
		refill(s.prepProb, p)
		sol, err = s.prep.Solve(opt.Solver)
	} else {
		var pr *solver.Prepared
		if pr, err = solver.Prepare(p, opt.Solver); err != nil {
			return err
		}
		s.prep, s.prepProb = pr, p
		sol, err = pr.Solve(opt.Solver)
	}
	if err != nil {
		return err
	}
	s.Problem, s.Solution, s.field, s.b = p, sol, nil, nil
	s.Probes = probes.Evaluate(s.Field(), s.Model.Probes)
	return nil
}

// ElementB returns the flux density at each triangle's centroid for the
// current solution (solver.Solution.BTo), computed once per solve and
// shared: callers must not modify it.
func (s *Study) ElementB() [][2]float64 {
	if s.b == nil {
		s.b = s.Solution.BTo(nil)
	}
	return s.b
}

// locator returns the point locator on the study's mesh, made once.
func (s *Study) locator() *mesh.Locator {
	if s.loc == nil {
		s.loc = mesh.NewLocator(s.Disc.Mesh)
	}
	return s.loc
}

// Fork returns a study of the same model on the same mesh holding s's
// solution, whose later solves leave s as it is: a sweep or a target
// search can start from a solved study without meshing again while the
// study keeps the solution its report shows. The two share the
// discretization and the point locator (both read-only); the fork makes
// its own numbering and factorization at its first solve.
func (s *Study) Fork() *Study {
	return &Study{Model: s.Model, Disc: s.Disc, Problem: s.Problem, Solution: s.Solution,
		Probes: s.Probes, MeshTime: s.MeshTime, field: s.field, loc: s.locator(), patches: s.patches}
}

// Probe returns the evaluated probe of that name.
func (s *Study) Probe(name string) (probes.Result, bool) {
	for _, r := range s.Probes {
		if r.Name == name {
			return r, true
		}
	}
	return probes.Result{}, false
}

// Field returns the field the probes read: the solution itself for
// second-order meshes, and the recovered (corner-averaged) flux density
// for first-order ones, whose element values are constant.
func (s *Study) Field() probes.Field {
	if s.field != nil {
		return s.field
	}
	m := s.Disc.Mesh
	if m.Order() == 2 {
		s.field = s.Solution
		return s.field
	}
	if s.patches == nil {
		s.patches = probes.NewPatches(m)
	}
	s.field = probes.NewRecovered(s.Solution, s.patches, s.ElementB(), s.locator())
	return s.field
}

// sameShape reports whether q can be solved with the Prepared of p: the
// same mesh and formulation, the same slices' lengths and the same fixed
// and point-current nodes (boundary conditions and identifications come
// from the same discretization).
func sameShape(p, q *solver.Problem) bool {
	if p.Mesh != q.Mesh || p.Formulation != q.Formulation || len(p.Materials) != len(q.Materials) ||
		len(p.CurrentDensity) != len(q.CurrentDensity) || (p.Magnetization == nil) != (q.Magnetization == nil) ||
		len(p.Magnetization) != len(q.Magnetization) || len(p.PointCurrents) != len(q.PointCurrents) ||
		len(p.Fixed) != len(q.Fixed) || len(p.Identify) != len(q.Identify) {
		return false
	}
	for i := range p.Fixed {
		if p.Fixed[i].Node != q.Fixed[i].Node {
			return false
		}
	}
	for i := range p.PointCurrents {
		if p.PointCurrents[i].Node != q.PointCurrents[i].Node {
			return false
		}
	}
	return true
}

// refill copies q's values into p, which a Prepared holds.
func refill(p, q *solver.Problem) {
	copy(p.Materials, q.Materials)
	copy(p.CurrentDensity, q.CurrentDensity)
	copy(p.Magnetization, q.Magnetization)
	copy(p.PointCurrents, q.PointCurrents)
	copy(p.Fixed, q.Fixed)
	p.Depth = q.Depth
}
