package solver

import (
	"slices"
	"time"

	"polegap/mesh"
	"polegap/solver/sparse"
)

// PrepareLike is Prepare for a problem on like's mesh with its nodes
// moved (a part displaced for virtual work: post/study's Deformed): the
// same triangles and midside nodes, and the same unknown numbering (the
// same boundary markers, Identify pairs and Fixed nodes). It reuses
// like's sparsity pattern and, once like has been solved, its linear
// solver's ordering and symbolic factorization (sparse.Cholesky.
// ShareAnalysis), so that no solve of the new problem analyses the
// pattern again; the numeric factor is the new problem's own, and the
// two may be solved concurrently. Where the reuse does not apply (another
// topology or numbering, an iterative or caller-supplied linear solver,
// like not solved yet) it prepares p as Prepare does. Errors as Prepare.
func PrepareLike(p *Problem, like *Prepared, opt Options) (*Prepared, error) {
	if like == nil || !sameTopology(p.Mesh, like.p.Mesh) || p.Formulation != like.p.Formulation {
		return Prepare(p, opt)
	}
	if err := p.validate(); err != nil {
		return nil, err
	}
	opt = opt.withDefaults()
	start := time.Now()
	d, err := buildDofMap(p)
	if err != nil {
		return nil, err
	}
	la := like.as
	if d.n != la.d.n || !slices.Equal(d.dof, la.d.dof) {
		return Prepare(p, opt)
	}
	pat := *la.pat
	k := *pat.k
	k.Val = make([]float64, len(k.Val))
	pat.k = &k
	pr := &Prepared{p: p, as: newAssembler(p, d, opt.Workers, &pat)}
	pr.lin = opt.linearSolver(d.n)
	src, ok1 := like.lin.(*sparse.Cholesky)
	dst, ok2 := pr.lin.(*sparse.Cholesky)
	if ok1 && ok2 && like.analyzed && opt.Solver == nil {
		dst.ShareAnalysis(src)
		pr.analyzed = true
	}
	for _, f := range p.Fixed {
		pr.fixed = append(pr.fixed, f.Node)
	}
	pr.setup = time.Since(start)
	return pr, nil
}

// sameTopology reports whether a and b have the same triangles, midside
// nodes and node count (their coordinates may differ).
func sameTopology(a, b *mesh.Mesh) bool {
	return a.NumNodes() == b.NumNodes() && a.NumVertices == b.NumVertices &&
		slices.Equal(a.Tri, b.Tri) && slices.Equal(a.Mid, b.Mid)
}
