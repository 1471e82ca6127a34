package study

import (
	"sync"
	"time"

	"polegap/models"
	"polegap/post/study/probes"
	"polegap/solver"
)

// Result is one converged solve of a study: the parameter values, the
// solution and the probes read off it. A Result does not change when its
// study is solved again; read it from several goroutines only after it
// has computed its field (Field, ElementB), which it caches.
type Result struct {
	Study *Study        // the study solved (for a gap variant: the remeshed one)
	Model *models.Model // the model as solved (Study.Model)
	Disc  *Discretization
	// Params are the parameter values asked for.
	Params Params
	// Remeshed is true when the parameters changed the geometry and the
	// solve ran on a mesh of its own.
	Remeshed bool
	// Problem is the problem as solved (the solver's snapshot).
	Problem  *solver.Problem
	Solution *solver.Solution
	Probes   []probes.Result
	MeshTime time.Duration

	field probes.Field // the field the probes read, made once
	b     [][2]float64 // element flux density, made once

	memoMu sync.Mutex
	memo   map[any]any // Memo's values
}

// Memo returns the value f computes for key on this result, computed
// once and shared by later calls with an equal key: what several reports
// of one solve need alike (the adaptive stop rule's saturation figures
// and the final report's) is computed once this way. key must be
// comparable and say everything besides the result that f depends on;
// callers must not modify the value. Safe for concurrent use (two
// simultaneous first calls may both run f; one value is kept).
func (r *Result) Memo(key any, f func() any) any {
	r.memoMu.Lock()
	v, ok := r.memo[key]
	r.memoMu.Unlock()
	if ok {
		return v
	}
	v = f()
	r.memoMu.Lock()
	defer r.memoMu.Unlock()
	if w, ok := r.memo[key]; ok {
		return w
	}
	if r.memo == nil {
		r.memo = map[any]any{}
	}
	r.memo[key] = v
	return v
}

// ElementB returns the flux density at each triangle's centroid
// (solver.Solution.BTo), computed once and shared: callers must not
// modify it.
func (r *Result) ElementB() [][2]float64 {
	if r.b == nil {
		r.b = r.Solution.BTo(nil)
	}
	return r.b
}

// Probe returns the evaluated probe of that name.
func (r *Result) Probe(name string) (probes.Result, bool) {
	for _, p := range r.Probes {
		if p.Name == name {
			return p, true
		}
	}
	return probes.Result{}, false
}

// Field returns the field the probes read: the solution itself for
// second-order meshes, and the recovered (corner-averaged) flux density
// for first-order ones, whose element values are constant. With an open
// boundary it reports points outside the real boundary as outside the
// mesh: the Kelvin disk there holds the image problem, not the field.
func (r *Result) Field() probes.Field {
	if r.field != nil {
		return r.field
	}
	if r.Disc.Mesh.Order() == 2 {
		r.field = r.Solution
	} else {
		r.field = probes.NewRecovered(r.Solution, r.Study.patches(), r.ElementB(), r.Study.locator())
	}
	if r.Disc.Kelvin != nil {
		r.field = realField{r.field, insideBoundary(r.Disc.outer, r.Disc.Boundary)}
	}
	return r.field
}

// realField is a field limited to the real region of an open boundary.
type realField struct {
	f      probes.Field
	inside func(x, y float64) bool
}

func (f realField) At(x, y float64) (a, bx, by float64, ok bool) {
	if !f.inside(x, y) {
		return 0, 0, 0, false
	}
	return f.f.At(x, y)
}
