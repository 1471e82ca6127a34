package study

import (
	"fmt"
	"time"

	"polegap/mesh"
	"polegap/models"
	"polegap/post/study/probes"
	"polegap/solver"
)

// Options control Run. The zero value uses the solver's defaults.
type Options struct {
	Solver solver.Options
	// Params are the parameter values of the solve; the zero value solves
	// the model as its file states it.
	Params Params
}

// Study is a model compiled once: meshed, its materials and coils
// resolved, and its finite-element problem prepared (numbering, sparsity
// pattern, ordering and symbolic factorization, made at the first solve)
// so that solves at other parameter values reuse all of it. The model is
// only read, never written.
//
// A Study is not safe for concurrent use: one solve at a time.
type Study struct {
	Model    *models.Model
	Disc     *Discretization
	MeshTime time.Duration

	src   *sources
	areas map[int32]float64 // meshed area per region tag (m²)
	prep  *solver.Prepared
	prob  *solver.Problem // the Prepared's problem; fill rewrites its values
	loc   *mesh.Locator
	patch *probes.Patches

	// gap is the last variant at another gap length (see SolveAt).
	gap *Study
	// like is the study whose mesh this one's deforms (Deformed): its
	// pattern and symbolic analysis are reused (solver.PrepareLike).
	like *Study
}

// Compile meshes m and resolves its materials and coils.
func Compile(m *models.Model) (*Study, error) {
	return compile(m, m, nil, nil)
}

// compile meshes m inside outer's boundary with an extra size limit and
// the resolved sources src (nil: resolve them from m).
func compile(m, outer *models.Model, size func(x, y float64, region int32) float64, src *sources) (*Study, error) {
	start := time.Now()
	var err error
	if src == nil {
		if src, err = resolve(m); err != nil {
			return nil, err
		}
	}
	d, err := discretize(m, outer, size)
	if err != nil {
		return nil, err
	}
	s := &Study{Model: m, Disc: d, MeshTime: time.Since(start), src: src, areas: d.Mesh.RegionAreas()}
	if err := checkAreas(m, src, s.areas); err != nil {
		return nil, err
	}
	if s.prob, err = newProblem(d, src); err != nil {
		return nil, err
	}
	return s, nil
}

// Refined returns the study of the same model meshed with one more size
// limit (metres, at a point of a region; see mesh.SizeField.Func), as
// adaptive refinement derives from an error estimate on s's mesh. The two
// share the resolved materials.
func (s *Study) Refined(size func(x, y float64, region int32) float64) (*Study, error) {
	return compile(s.Model, s.Disc.outer, size, s.src)
}

// Moved returns the study of s's model with the named regions translated
// by (dx, dy) metres, meshed afresh inside s's unmoved outer boundary (the
// model file places the boundary relative to the regions' extent, which a
// moved part must not move); probes and refinement entries stay where they
// are. Virtual work differentiates the co-energy of such studies. An
// unknown region name is an error naming it.
func (s *Study) Moved(regions []string, dx, dy float64) (*Study, error) {
	m := *s.Model
	m.Regions = append([]models.Region(nil), s.Model.Regions...)
	for _, name := range regions {
		i := -1
		for k := range m.Regions {
			if m.Regions[k].Name == name {
				i = k
				break
			}
		}
		if i < 0 {
			return nil, fmt.Errorf("%s: no region %q to move", s.Model.File, name)
		}
		r := &m.Regions[i]
		x, y := make([]float64, len(r.X)), make([]float64, len(r.Y))
		for k := range x {
			x[k], y[k] = r.X[k]+dx, r.Y[k]+dy
		}
		r.X, r.Y = x, y
	}
	moved, err := compile(&m, s.Disc.outer, nil, s.src)
	if err != nil {
		return nil, fmt.Errorf("moved part: %w", err)
	}
	return moved, nil
}

// atGap returns the study of the model with its gap at g (m), remeshed;
// the last such variant is kept for the next solve at the same gap.
func (s *Study) atGap(g float64) (*Study, error) {
	if s.gap != nil && s.gap.Model.Gap == g {
		return s.gap, nil
	}
	mid, err := s.midPlane()
	if err != nil {
		return nil, err
	}
	mg, err := s.Model.WithGap(mid, g-s.Model.Gap)
	if err != nil {
		return nil, err
	}
	v, err := compile(mg, mg, nil, s.src)
	if err != nil {
		return nil, err
	}
	s.gap = v
	return v, nil
}

// midPlane returns the y of the gap's mid-plane: the gap-centre probe's.
func (s *Study) midPlane() (float64, error) {
	if p, ok := s.Model.CentreProbe(); ok {
		return p.Point[1], nil
	}
	return 0, fmt.Errorf("%s: no point probe at the gap centre to find the gap's mid-plane", s.Model.File)
}

// SolveAt solves the study at the parameter values p and evaluates the
// probes. Source and material parameters reuse the mesh, the numbering and
// the factorization's symbolic analysis; a gap other than the model's
// remeshes (Result.Remeshed) and keeps that mesh for further solves at the
// same gap. opt.Initial, when set, is the starting potential (on the
// mesh of the gap asked for). Only a converged solve returns a Result;
// otherwise the solver's typed error with its residual history.
func (s *Study) SolveAt(p Params, opt solver.Options) (*Result, error) {
	if err := p.check(s.Model); err != nil {
		return nil, err
	}
	if g := p.gap(s.Model); g != 0 {
		v, err := s.atGap(g)
		if err != nil {
			return nil, err
		}
		q := p
		q.Gap = 0
		r, err := v.SolveAt(q, opt)
		if r != nil {
			r.Params, r.Remeshed = p, true
		}
		return r, err
	}
	fill(s.prob, s.Model, s.src, s.areas, p)
	s.prob.Locator = s.locator() // one point locator for the probes and the solver
	if s.prep == nil {
		var like *solver.Prepared
		if s.like != nil {
			like = s.like.prep
		}
		pr, err := solver.PrepareLike(s.prob, like, opt)
		if err != nil {
			return nil, err
		}
		s.prep = pr
	}
	sol, err := s.prep.Solve(opt)
	if err != nil {
		return nil, err
	}
	r := &Result{Study: s, Model: s.Model, Disc: s.Disc, Params: p, Problem: sol.Problem, Solution: sol, MeshTime: s.MeshTime}
	r.Probes = probes.Evaluate(r.Field(), s.Model.Probes)
	return r, nil
}

// Run compiles m and solves it at opt.Params.
func Run(m *models.Model, opt Options) (*Result, error) {
	s, err := Compile(m)
	if err != nil {
		return nil, err
	}
	return s.SolveAt(opt.Params, opt.Solver)
}

// locator returns the point locator on the study's mesh, made once.
func (s *Study) locator() *mesh.Locator {
	if s.loc == nil {
		s.loc = mesh.NewLocator(s.Disc.Mesh)
	}
	return s.loc
}

// patches returns the vertex patches of the mesh for recovery, made once.
func (s *Study) patches() *probes.Patches {
	if s.patch == nil {
		s.patch = probes.NewPatches(s.Disc.Mesh)
	}
	return s.patch
}
