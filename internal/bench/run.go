package bench

import (
	"context"
	"errors"
	"runtime"
	"slices"
	"time"

	"polegap/materials"
	"polegap/models"
	"polegap/post/study"
	"polegap/post/workflow/sweep"
	"polegap/solver"
	"polegap/solver/sparse"
)

// Options control Run. The zero value runs each stage once and draws a
// 20-point excitation curve.
type Options struct {
	// Repeat runs the mesh, linear, PCG and nonlinear stages this many
	// times and keeps the median time; 0 means 1. The excitation curve
	// runs once.
	Repeat int
	// CurvePoints is the number of currents of the excitation curve;
	// 0 means CurvePoints (20).
	CurvePoints int
	// Progress, when set, is called before each stage of each case.
	Progress func(c Case, stage string)
	// Done, when set, is called with each finished case's figures (so that
	// a long run shows its results as it goes).
	Done func(r Result)
	// Accurate adds the figures at the default accuracy (Accurate): the
	// example AccurateModel solved and swept as the commands do.
	Accurate bool
}

// IronMuR is the relative permeability that replaces the steel's B-H
// curve for the linear figures (one Newton step on the same mesh).
const IronMuR = 1000

// PCGTol is the relative residual of the PCG figure, the solver's default
// for an iterative linear solve.
const PCGTol = 1e-10

// PCGMaxIter bounds the PCG figure's iterations: IC(0)-PCG needs O(√N)
// of them on these meshes and the 1M case would otherwise run for many
// minutes. A run that stops here is reported as not converged, with its
// time and residual, and the bench goes on.
const PCGMaxIter = 3000

// Result holds the figures of one case. Times are wall-clock seconds
// (medians over the repeats); bytes are bytes.
type Result struct {
	Case        string  `json:"case"`
	Order       int     `json:"order"`
	TargetNodes int     `json:"target_nodes"`
	MeshSize    float64 `json:"mesh_size_mm"` // element size asked of the mesher
	Nodes       int     `json:"nodes"`
	Triangles   int     `json:"triangles"`
	Unknowns    int     `json:"unknowns"` // free nodes of the linear system

	Mesh               float64 `json:"mesh_s"` // geometry graph and triangulation (and elevation for P2)
	TrianglesPerSecond float64 `json:"triangles_per_s"`

	// The linear solve: the steel replaced by μr = IronMuR, sparse
	// Cholesky; Linear is the whole call, the parts are the solver's own.
	Linear      float64 `json:"linear_s"`
	Assemble    float64 `json:"assemble_s"` // numbering, pattern and element loop
	Analyze     float64 `json:"analyze_s"`  // fill-reducing ordering and symbolic factorization
	Factor      float64 `json:"factor_s"`   // numeric factorization
	Solve       float64 `json:"solve_s"`    // triangular solves
	FactorNNZ   int     `json:"factor_nnz"`
	FactorBytes uint64  `json:"factor_bytes"` // 8 per stored entry of L
	FactorFlops float64 `json:"factor_flops"` // multiply-adds of one factorization

	// The same linear system by IC(0)-preconditioned conjugate gradients
	// to a relative residual of PCGTol (assembly included).
	PCG           float64 `json:"pcg_s"`
	PCGIterations int     `json:"pcg_iterations"`
	PCGConverged  bool    `json:"pcg_converged"`
	PCGResidual   float64 `json:"pcg_residual"`

	// The nonlinear solve (low-carbon-steel B-H curve) to a relative
	// residual of 1e-8, Newton with the Cholesky factor's symbolic
	// analysis reused across steps.
	Nonlinear        float64            `json:"nonlinear_s"`
	NonlinearParts   solver.Timings     `json:"-"`
	NewtonIterations int                `json:"newton_iterations"`
	NewtonResidual   float64            `json:"newton_residual"`
	NonlinearSplit   map[string]float64 `json:"nonlinear_split_s"`

	// The excitation curve through post/workflow/sweep, warm-started point to
	// point; 0 points when not measured. Its setup (a mesh and one solve
	// at the model's own current) is not counted.
	Curve           float64 `json:"curve_s"`
	CurvePoints     int     `json:"curve_points"`
	CurveIterations int     `json:"curve_newton_iterations"` // all points together

	// Process CPU time (user + system, all threads) of the same stages,
	// medians: less sensitive to the machine's load than the wall time.
	MeshCPU      float64 `json:"mesh_cpu_s"`
	LinearCPU    float64 `json:"linear_cpu_s"`
	PCGCPU       float64 `json:"pcg_cpu_s"`
	NonlinearCPU float64 `json:"nonlinear_cpu_s"`
	CurveCPU     float64 `json:"curve_cpu_s"`

	// Memory, from the start of the case to the end of the nonlinear
	// solve: the Go heap's peak above its level at the start (see the
	// package doc), the process's peak resident set (0 where unknown) and
	// the heap peak per node with the Cholesky factor taken out.
	PeakHeap     uint64  `json:"peak_heap_bytes"`
	PeakRSS      uint64  `json:"peak_rss_bytes"`
	BytesPerNode float64 `json:"bytes_per_node_without_factor"`
	// The live heap (after a collection) with everything the nonlinear
	// solve holds at its end, above the start; per node without the
	// factor. The peak above exceeds it by the garbage the collector
	// allows between collections (GOGC=100: up to the live heap again).
	LiveHeap         uint64  `json:"live_heap_bytes"`
	LiveBytesPerNode float64 `json:"live_bytes_per_node_without_factor"`
}

// Run measures the cases in order and returns the table with goals,
// verdicts and growth exponents. It stops at the first failing stage
// (a *StageError) or when ctx is done (ctx.Err()). It panics with no cases.
func Run(ctx context.Context, cases []Case, opt Options) (*Table, error) {
	if len(cases) == 0 {
		panic(errNoCases)
	}
	for _, c := range cases {
		if c.Order != 1 && c.Order != 2 {
			panic(errBadOrder)
		}
	}
	if opt.Repeat < 1 {
		opt.Repeat = 1
	}
	if opt.CurvePoints < 1 {
		opt.CurvePoints = CurvePoints
	}
	t := newTable(opt.Repeat)
	for _, c := range cases {
		if err := ctx.Err(); err != nil {
			return nil, err
		}
		r, err := runCase(ctx, c, MeshSize(c.Nodes, c.Order), opt)
		if err != nil {
			return nil, err
		}
		t.Results = append(t.Results, r)
		if opt.Done != nil {
			opt.Done(r)
		}
	}
	if opt.Accurate {
		if opt.Progress != nil {
			opt.Progress(Case{Name: AccurateModel, Order: 2}, "solve and excitation curve at the default accuracy")
		}
		a, err := runAccurate(ctx, opt)
		if err != nil {
			return nil, err
		}
		t.Accurate = a
	}
	t.finish()
	return t, nil
}

// stage runs f repeat times and returns the median wall time and the
// median process CPU time (s).
func stage(repeat int, f func() error) (wall, cpu float64, err error) {
	ts := make([]float64, 0, repeat)
	cs := make([]float64, 0, repeat)
	for i := 0; i < repeat; i++ {
		start, c0 := time.Now(), cpuSeconds()
		if err := f(); err != nil {
			return 0, 0, err
		}
		ts = append(ts, time.Since(start).Seconds())
		cs = append(cs, cpuSeconds()-c0)
	}
	return median(ts), median(cs), nil
}

func median(x []float64) float64 {
	if len(x) == 0 {
		return 0
	}
	s := slices.Clone(x)
	slices.Sort(s)
	k := len(s) / 2
	if len(s)%2 == 1 {
		return s[k]
	}
	return 0.5 * (s[k-1] + s[k])
}

// linearized returns a copy of p whose nonlinear materials are replaced by
// a linear one of relative permeability IronMuR.
func linearized(p *solver.Problem) *solver.Problem {
	lp := *p
	lp.Materials = slices.Clone(p.Materials)
	for i, m := range lp.Materials {
		if m == nil {
			continue
		}
		// A material is nonlinear when dν/d(B²) is non-zero somewhere in
		// the working range (checked at 1 T and 2 T).
		_, d1 := m.Nu(1)
		_, d2 := m.Nu(4)
		if d1 != 0 || d2 != 0 {
			lp.Materials[i] = materials.Linear{MuR: IronMuR}
		}
	}
	return &lp
}

func runCase(ctx context.Context, c Case, h float64, opt Options) (Result, error) {
	r := Result{Case: c.Name, Order: c.Order, TargetNodes: c.Nodes, MeshSize: h}
	fail := func(stage string, err error) (Result, error) {
		return Result{}, &StageError{Case: c.Name, Stage: stage, Err: err}
	}
	progress := func(s string) error {
		if opt.Progress != nil {
			opt.Progress(c, s)
		}
		return ctx.Err()
	}
	m, err := CCore(c.Name, h, c.Order)
	if err != nil {
		return fail("model", err)
	}
	rssOK := resetPeakRSS()
	mem := startSampler()
	base := mem.peak

	if err := progress("mesh"); err != nil {
		return Result{}, err
	}
	var d *study.Discretization
	r.Mesh, r.MeshCPU, err = stage(opt.Repeat, func() error {
		d = nil
		var err error
		d, err = study.Discretize(m)
		return err
	})
	if err != nil {
		return fail("mesh", err)
	}
	mem.mark()
	r.Nodes, r.Triangles = d.Mesh.NumNodes(), d.Mesh.NumTriangles()
	if r.Mesh > 0 {
		r.TrianglesPerSecond = float64(r.Triangles) / r.Mesh
	}
	p, err := study.Problem(d)
	if err != nil {
		return fail("problem", err)
	}
	lp := linearized(p)

	if err := progress("linear"); err != nil {
		return Result{}, err
	}
	var asm, ana, fac, sol []float64
	r.Linear, r.LinearCPU, err = stage(opt.Repeat, func() error {
		ch := &sparse.Cholesky{}
		s, err := solver.Solve(lp, solver.Options{Solver: ch})
		if err != nil {
			return err
		}
		asm = append(asm, s.Time.Assemble.Seconds())
		ana = append(ana, s.Time.Analyze.Seconds())
		fac = append(fac, s.Time.Factor.Seconds())
		sol = append(sol, s.Time.Solve.Seconds())
		r.Unknowns = s.NumUnknowns
		r.FactorNNZ, r.FactorFlops = ch.NNZL(), ch.Flops()
		mem.mark()
		return nil
	})
	if err != nil {
		return fail("linear", err)
	}
	r.Assemble, r.Analyze, r.Factor, r.Solve = median(asm), median(ana), median(fac), median(sol)
	r.FactorBytes = 8 * uint64(r.FactorNNZ)

	if err := progress("pcg"); err != nil {
		return Result{}, err
	}
	pcgStage := func(f func() error) (float64, float64, error) {
		if !c.PCG {
			return 0, 0, nil
		}
		return stage(opt.Repeat, f)
	}
	r.PCG, r.PCGCPU, err = pcgStage(func() error {
		pcg := &sparse.PCG{Options: sparse.PCGOptions{Tol: PCGTol, MaxIter: PCGMaxIter}}
		s, err := solver.Solve(lp, solver.Options{Solver: pcg, LinearTol: PCGTol})
		mem.mark()
		var le *solver.LinearSolveError
		if errors.As(err, &le) && le.Stage == "solve" && le.Result.Status == sparse.IterationLimit {
			r.PCGIterations, r.PCGResidual, r.PCGConverged = le.Result.Iterations, le.Result.Residual, false
			return nil
		}
		if err != nil {
			return err
		}
		r.PCGIterations, r.PCGResidual, r.PCGConverged = s.Linear.Iterations, s.Linear.Residual, true
		return nil
	})
	if err != nil {
		return fail("pcg", err)
	}

	if err := progress("nonlinear"); err != nil {
		return Result{}, err
	}
	var parts []solver.Timings
	var held *solver.Prepared // the last solve's numbering, pattern, analysis and factor
	var heldSol *solver.Solution
	r.Nonlinear, r.NonlinearCPU, err = stage(opt.Repeat, func() error {
		held, heldSol = nil, nil
		o := solver.Options{Solver: &sparse.Cholesky{}, Tol: 1e-8}
		pr, err := solver.Prepare(p, o)
		if err != nil {
			return err
		}
		s, err := pr.Solve(o)
		if err != nil {
			return err
		}
		held, heldSol = pr, s
		r.NewtonIterations, r.NewtonResidual = s.Iterations, s.Residual
		parts = append(parts, s.Time)
		mem.mark()
		return nil
	})
	if err != nil {
		return fail("nonlinear", err)
	}
	r.NonlinearParts = medianTimings(parts)
	r.NonlinearSplit = map[string]float64{
		"assemble": r.NonlinearParts.Assemble.Seconds(), "analyze": r.NonlinearParts.Analyze.Seconds(),
		"factor": r.NonlinearParts.Factor.Seconds(), "solve": r.NonlinearParts.Solve.Seconds(),
	}
	if peak := mem.finish(); peak > base {
		r.PeakHeap = peak - base
	}
	// The working set: what the nonlinear solve holds at its end (mesh,
	// problem, pattern, symbolic analysis, factor, solution), after a
	// collection.
	runtime.GC()
	if live := heapNow(mem.s); live > base {
		r.LiveHeap = live - base
	}
	runtime.KeepAlive(held)
	runtime.KeepAlive(heldSol)
	held, heldSol = nil, nil
	if rssOK {
		r.PeakRSS = peakRSS()
	}
	if r.Nodes > 0 {
		r.BytesPerNode = (float64(r.PeakHeap) - float64(r.FactorBytes)) / float64(r.Nodes)
		r.LiveBytesPerNode = (float64(r.LiveHeap) - float64(r.FactorBytes)) / float64(r.Nodes)
	}
	d, p, lp = nil, nil, nil
	runtime.GC()

	if c.Curve {
		if err := progress("curve"); err != nil {
			return Result{}, err
		}
		if err := curve(ctx, m, opt.CurvePoints, &r); err != nil {
			if ctx.Err() != nil {
				return Result{}, ctx.Err()
			}
			return fail("curve", err)
		}
	}
	return r, nil
}

// curve times an excitation curve of n currents from a tenth to twice the
// model's coil current, through post/workflow/sweep's runner (warm starts).
func curve(ctx context.Context, m *models.Model, n int, r *Result) error {
	run, err := sweep.NewRunner(ctx, m, "", "", solver.Options{})
	if err != nil {
		return err
	}
	i0 := run.BaseCurrent()
	currents := sweep.Range(0.1*i0, 2*i0, n)
	start, c0 := time.Now(), cpuSeconds()
	for _, i := range currents {
		if err := ctx.Err(); err != nil {
			return err
		}
		pt, err := run.Solve(i, solver.Options{})
		if err != nil {
			return err
		}
		r.CurveIterations += pt.Iterations
	}
	r.Curve = time.Since(start).Seconds()
	r.CurveCPU = cpuSeconds() - c0
	r.CurvePoints = n
	return nil
}

func medianTimings(ts []solver.Timings) solver.Timings {
	pick := func(f func(solver.Timings) time.Duration) time.Duration {
		x := make([]float64, len(ts))
		for i, t := range ts {
			x[i] = float64(f(t))
		}
		return time.Duration(median(x))
	}
	return solver.Timings{
		Assemble: pick(func(t solver.Timings) time.Duration { return t.Assemble }),
		Analyze:  pick(func(t solver.Timings) time.Duration { return t.Analyze }),
		Factor:   pick(func(t solver.Timings) time.Duration { return t.Factor }),
		Solve:    pick(func(t solver.Timings) time.Duration { return t.Solve }),
	}
}
