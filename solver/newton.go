package solver

import (
	"math"
	"time"

	"polegap/internal/num"
	"polegap/solver/sparse"
)

// newton runs Newton-Raphson on the residual R(A) = 0 with the exact
// tangent and a backtracking line search on ‖R‖ (J. E. Dennis,
// R. B. Schnabel, "Numerical Methods for Unconstrained Optimization and
// Nonlinear Equations", 1983, sec. 6.3: Armijo condition with α = 1e-4).
// Convergence: relative residual <= opt.Tol and the next update, estimated
// with the last factorization, <= opt.UpdateTol relative to max |A|.
//
// lin is the linear solver; Analyze is called on it unless analyzed is
// true (a Prepared problem solved again on the same pattern).
func newton(as *assembler, opt Options, s *Solution, lin sparse.Solver, analyzed bool) error {
	d := &as.d
	nn := as.m.NumNodes()
	n := d.n
	A := make([]float64, nn)
	if opt.Initial != nil {
		copy(A, opt.Initial)
	}
	for i := 0; i < nn; i++ {
		if d.dof[i] < 0 {
			A[i] = d.value[i]
		}
	}
	// Identified nodes share their unknown's value: take the first member's.
	if opt.Initial != nil {
		first := make([]float64, n)
		seen := make([]bool, n)
		for i := 0; i < nn; i++ {
			if c := d.dof[i]; c >= 0 {
				if !seen[c] {
					seen[c], first[c] = true, A[i]
				}
				A[i] = first[c]
			}
		}
	}
	s.A = A
	if n == 0 {
		s.Converged = true
		return nil
	}
	R := make([]float64, n)
	Rt := make([]float64, n)
	du := make([]float64, n)
	trial := make([]float64, nn)

	// The ordering and symbolic analysis need only the pattern: they run
	// beside the first assemblies (which write only the values), and are
	// done before this returns whatever happens, even when the field is
	// zero and no factorization follows (a Prepared reuses the analysis).
	analysis := func() error { return nil }
	if !analyzed {
		done := make(chan struct{})
		var anaErr error
		go func() {
			defer close(done)
			t0 := time.Now()
			undo := orderByVertices(as, lin)
			anaErr = lin.Analyze(as.pat.k)
			undo()
			s.Time.Analyze = time.Since(t0)
		}()
		defer func() { <-done }()
		analysis = func() error {
			<-done
			if anaErr != nil {
				return &LinearSolveError{Stage: "analyze", Err: anaErr}
			}
			return nil
		}
	}

	// Reference residual: all unknowns at zero. On a cold start that is
	// the starting point, whose tangent is needed anyway.
	t0 := time.Now()
	var ref float64
	if opt.Initial != nil {
		copy(trial, A)
		for i := 0; i < nn; i++ {
			if d.dof[i] >= 0 {
				trial[i] = 0
			}
		}
		if err := as.assemble(trial, R, false); err != nil {
			return err
		}
		ref = norm2(R)
	}
	if err := as.assemble(A, R, true); err != nil {
		return err
	}
	if opt.Initial == nil {
		ref = norm2(R)
	}
	s.Time.Assemble += time.Since(t0)
	if ref == 0 {
		// No source and no prescribed potential: the field is zero.
		for i := 0; i < nn; i++ {
			if d.dof[i] >= 0 {
				A[i] = 0
			}
		}
		if err := analysis(); err != nil {
			return err
		}
		s.Converged = true
		s.History = []float64{0}
		return nil
	}
	res := norm2(R) / ref
	s.History = append(s.History, res)

	if err := analysis(); err != nil {
		return err
	}

	// The last estimate of the next update, when one was made.
	upd, hasUpd := 0.0, false
	// chord: the next step reuses the last factorization (Options.Steps).
	chord := false
	// stopped puts a *MaterialError met in iteration it (a material that
	// fails at a point it passed before) into a *NotConvergedError with
	// the history of the steps taken; other errors pass unchanged.
	stopped := func(err error, it int) error {
		me, ok := err.(*MaterialError)
		if !ok {
			return err
		}
		return &NotConvergedError{Iterations: it, History: s.History, Residual: res,
			HasUpdate: hasUpd, Update: upd, Reason: me.detail(), Err: me}
	}
	// direction factors the matrix in hand (unless chord: then the last
	// factorization is used again) and solves for the step du.
	direction := func(chord bool) error {
		t0 := time.Now()
		if !chord {
			if err := lin.Factor(as.pat.k); err != nil {
				return &LinearSolveError{Stage: "factor", Err: err}
			}
			s.Time.Factor += time.Since(t0)
		}
		for i := range R {
			R[i] = -R[i]
		}
		t0 = time.Now()
		lr, err := lin.SolveTo(du, R)
		s.Time.Solve += time.Since(t0)
		s.Linear = lr
		for i := range R {
			R[i] = -R[i]
		}
		if err != nil || lr.Status != sparse.Converged {
			return &LinearSolveError{Stage: "solve", Result: lr, Err: err}
		}
		return nil
	}
	// search backtracks along du until ‖R‖ drops enough (trial, Rt hold
	// the accepted point), halving the step. (A quadratic-interpolation
	// backtrack, Dennis and Schnabel 1983 alg. A6.3.1, took more Newton
	// steps on the saturating C-core: it cuts the step to as little as
	// 0.1λ, and each extra step costs a factorization.)
	search := func() (bool, error) {
		rn := res * ref
		step := 1.0
		t0 := time.Now()
		defer func() { s.Time.Assemble += time.Since(t0) }()
		for ls := 0; ls < 20; ls++ {
			for i := 0; i < nn; i++ {
				if c := d.dof[i]; c >= 0 {
					trial[i] = A[i] + step*du[c]
				} else {
					trial[i] = A[i]
				}
			}
			err := as.assemble(trial, Rt, false)
			s.ResidualEvaluations++
			if err == nil {
				rt := norm2(Rt)
				if rt <= (1-1e-4*step)*rn || rt/ref <= opt.Tol {
					return true, nil
				}
			} else if _, ok := err.(*MaterialError); !ok {
				return false, err
			}
			step *= 0.5
		}
		return false, nil
	}
	for it := 1; it <= opt.MaxIter; it++ {
		if opt.Context != nil {
			if err := opt.Context.Err(); err != nil {
				return &NotConvergedError{Iterations: it - 1, History: s.History, Residual: res, HasUpdate: hasUpd, Update: upd,
					Reason: "stopped: " + err.Error(), Err: err}
			}
		}
		ok := false
		err := direction(chord)
		if err == nil {
			if ok, err = search(); err != nil {
				return err
			}
		}
		if !ok && chord {
			// The old factorization gives no descent here: a Newton step.
			chord = false
			t0 := time.Now()
			aerr := as.assemble(A, R, true)
			s.Time.Assemble += time.Since(t0)
			if aerr != nil {
				return stopped(aerr, it)
			}
			if err = direction(false); err == nil {
				if ok, err = search(); err != nil {
					return err
				}
			}
		}
		if !ok {
			// Newton stalled (no descent, or a tangent that is not
			// positive definite): one damped fixed-point step with the
			// secant matrix K(ν(A)), which is positive definite for any
			// positive ν.
			t0 := time.Now()
			as.secant = true
			aerr := as.assemble(A, R, true)
			as.secant = false
			s.Time.Assemble += time.Since(t0)
			if aerr != nil {
				return stopped(aerr, it)
			}
			if derr := direction(false); derr != nil {
				return derr
			}
			if ok, err = search(); err != nil {
				return err
			}
			if !ok {
				return &NotConvergedError{Iterations: it, History: s.History, Residual: res, HasUpdate: hasUpd, Update: upd,
					Reason: "neither the Newton nor the fixed-point direction lowers the residual"}
			}
			s.FixedPointSteps++
		}
		if chord {
			s.ChordSteps++
		}
		copy(A, trial)
		R, Rt = Rt, R
		prev := res
		res = norm2(R) / ref
		s.History = append(s.History, res)
		s.Iterations = it
		s.Residual = res
		if opt.Progress != nil {
			opt.Progress(it, res)
		}
		if !num.Finite(res) {
			return &NotConvergedError{Iterations: it, History: s.History, Residual: res, HasUpdate: hasUpd, Update: upd,
				Reason: "the residual is not finite"}
		}
		if res <= opt.Tol {
			// Estimate the next update with the factorization in hand.
			t0 = time.Now()
			lr, err := lin.SolveTo(du, R)
			s.Time.Solve += time.Since(t0)
			upd, hasUpd = 0, false
			if err == nil && lr.Status == sparse.Converged {
				u := normInf(du) / math.Max(normInfA(A), math.SmallestNonzeroFloat64)
				if num.Finite(u) {
					upd, hasUpd = u, true
				}
				if u <= opt.UpdateTol {
					s.Update = u
					s.Converged = true
					return nil
				}
			}
		}
		// Chord steps: keep the factorization while it contracts the
		// residual well; R already holds the residual at A (the line
		// search's), so such a step needs no assembly of the tangent.
		chord = opt.Steps == Chord && res <= ChordRate*prev
		if chord {
			continue
		}
		t0 = time.Now()
		if err := as.assemble(A, R, true); err != nil {
			return stopped(err, it)
		}
		s.Time.Assemble += time.Since(t0)
	}
	return &NotConvergedError{Iterations: opt.MaxIter, History: s.History, Residual: res, HasUpdate: hasUpd, Update: upd,
		Reason: "iteration limit reached"}
}

func norm2(x []float64) float64 {
	var s float64
	for _, v := range x {
		s += v * v
	}
	return math.Sqrt(s)
}

func normInf(x []float64) float64 {
	var m float64
	for _, v := range x {
		m = math.Max(m, math.Abs(v))
	}
	return m
}

func normInfA(x []float64) float64 { return normInf(x) }
