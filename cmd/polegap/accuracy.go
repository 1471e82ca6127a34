package main

import (
	"flag"
	"fmt"
	"math"

	"polegap/models"
	"polegap/post/study"
	"polegap/post/workflow/adapt"
	"polegap/post/workflow/design"
	"polegap/solver"
)

// accuracyFlags are the flags of every command that reports solved
// quantities: how accurate they must be, or none (quick).
type accuracyFlags struct {
	accuracy  *float64
	quick     *bool
	refineBy  *string
	maxLevels *int
	maxNodes  *int
}

func addAccuracyFlags(fs *flag.FlagSet) accuracyFlags {
	return accuracyFlags{
		accuracy:  realFlag(fs, "accuracy", 0, numRange{lo: 0, hi: 0.1, hiOpen: true, hint: "a relative error such as 1e-3; 0 takes the model's"}, "relative error allowed in each reported quantity; the mesh is refined adaptively until each changes by less than this (default: the model's mesh.accuracy, else 1e-3)"),
		quick:     fs.Bool("quick", false, "one solve on the model's own mesh, for a preview: no refinement and no error estimates"),
		refineBy:  fs.String("refine-by", "energy", "where refinement goes: energy (the field's own error, serves every quantity) or goal (weighted by a dual solution for the probe field; converges that field only)"),
		maxLevels: intFlag(fs, "max-levels", 10, count(1, 100), "budget of adaptive refinement: meshes solved at most"),
		maxNodes:  intFlag(fs, "max-nodes", 2_000_000, count(1000, 100_000_000), "budget of adaptive refinement: nodes of the finest mesh at most"),
	}
}

// target returns the accuracy asked for, and a usage error for a bad one.
func (a accuracyFlags) target(m *models.Model) (float64, error) {
	acc := *a.accuracy // its range is checked where it is parsed
	if *a.refineBy != "energy" && *a.refineBy != "goal" {
		return 0, usagef("--refine-by is energy or goal, not %q", *a.refineBy)
	}
	if acc == 0 {
		acc = m.Mesh.Accuracy
	}
	if acc == 0 {
		acc = design.DefaultAccuracy
	}
	return acc, nil
}

// solveToAccuracy solves m to the accuracy the flags ask for. It returns
// the final solve, the one on the mesh before it (nil in quick mode or
// after a single round: no estimate) and the record of the refinement.
func solveToAccuracy(env *Env, name string, m *models.Model, a accuracyFlags, so solver.Options) (fine, coarse *study.Result, acc *design.Accuracy, err error) {
	if *a.quick {
		s, err := runStudy(env.Ctx, m, study.Options{Solver: so})
		if err != nil {
			return nil, nil, nil, err
		}
		fmt.Fprintf(env.Stderr, "polegap %s: quick mode: one solve on the model's own mesh; the numbers carry no error estimate\n", name)
		return s, nil, &design.Accuracy{Rounds: 1}, nil
	}
	target, err := a.target(m)
	if err != nil {
		return nil, nil, nil, err
	}
	opt := design.SolveOptions{Accuracy: target, Solver: so, Marking: adapt.Energy, MaxLevels: *a.maxLevels, MaxNodes: *a.maxNodes, Progress: func(r adapt.Round) {
		if math.IsInf(r.Change, 1) {
			fmt.Fprintf(env.Stderr, "polegap %s: mesh of %d nodes solved\n", name, r.Nodes)
			return
		}
		fmt.Fprintf(env.Stderr, "polegap %s: refined to %d nodes: largest change %.2e (%s), asked %.0e\n", name, r.Nodes, r.Change, r.Worst, target)
	}}
	if *a.refineBy == "goal" {
		opt.Marking = adapt.GoalOriented
	}
	fine, coarse, acc, err = design.SolveAccurate(env.Ctx, m, opt)
	if err != nil {
		return nil, nil, nil, err
	}
	switch {
	case acc.Stopped != "":
		fmt.Fprintf(env.Stderr, "polegap %s: refinement stopped after %d mesh(es): %s\n", name, acc.Rounds, acc.Stopped)
	case acc.Limit == "levels" && acc.Rounds == 1:
		fmt.Fprintf(env.Stderr, "polegap %s: stopped at the budget of 1 refinement level (--max-levels): one mesh, so no error estimate; raise --max-levels\n", name)
	case acc.Limit == "levels":
		fmt.Fprintf(env.Stderr, "polegap %s: stopped at the budget of %d refinement levels (--max-levels) before every quantity changed by less than %g (largest change %.2g, of %s); the estimates say how far each can be trusted; raise --max-levels or loosen --accuracy\n", name, *a.maxLevels, target, acc.Change, acc.Worst)
	case !acc.Reached:
		fmt.Fprintf(env.Stderr, "polegap %s: stopped at the budget of %d nodes (--max-nodes) before every quantity changed by less than %g (largest change %.2g, of %s); the estimates say how far each can be trusted; raise --max-nodes or loosen --accuracy\n", name, *a.maxNodes, target, acc.Change, acc.Worst)
	}
	return fine, coarse, acc, nil
}
