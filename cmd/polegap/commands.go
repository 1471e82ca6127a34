package main

import (
	"context"
	"flag"
	"fmt"
	"io"
	"os"

	"polegap/models"
	"polegap/post/measure"
	"polegap/post/measure/samples"
	"polegap/post/study"
)

// commands is the table of sub-commands, in the order help lists them.
var commands = []*Command{
	cmdDemo,
	cmdSolve,
	cmdSize,
	cmdSweep,
	cmdMerge,
	cmdScan,
	cmdShim,
	cmdLength,
	cmdCheck,
	cmdCompare,
	cmdSearchCoil,
	cmdProfile,
	cmdMesh,
	cmdMaterials,
	cmdGrades,
	cmdBHFit,
	cmdRingCurve,
	cmdBench,
	cmdExamples,
}

// loadModel reads a model file, or an embedded example when no file of
// that name exists.
func loadModel(arg string) (*models.Model, error) {
	m, err := loadModelFile(arg)
	if err == nil {
		for _, d := range m.Dropped {
			fmt.Fprintf(notes, "note: %s\n", d)
		}
	}
	return m, err
}

// notes receives what loading a model has to say besides errors (the
// regions mesh.min-feature dropped); run points it at stderr.
var notes io.Writer = io.Discard

func loadModelFile(arg string) (*models.Model, error) {
	if _, err := os.Stat(arg); err == nil {
		return models.Load(arg)
	}
	for _, name := range models.Examples() {
		if name == arg {
			return models.LoadExample(name)
		}
	}
	return nil, fmt.Errorf("no model file %q (and no embedded example of that name; 'polegap examples' lists them)", arg)
}

// modelArg loads the one MODEL argument (a usage error when there is
// not exactly one).
func modelArg(args []string) (*models.Model, error) {
	if err := oneModel(args); err != nil {
		return nil, err
	}
	return loadModel(args[0])
}

// oneModel checks that exactly one positional argument names the model.
func oneModel(args []string) error {
	switch len(args) {
	case 0:
		return usagef("missing MODEL (a model file, or an example name from 'polegap examples')")
	case 1:
		return nil
	}
	return usagef("too many arguments: %q", args[1:])
}

// runStudy meshes, solves and probes m (study.Run). A Ctrl-C stops the
// Newton solve before its next step (solver.Options.Context); one during
// meshing takes effect when meshing returns. The command then stops
// before it prints or writes anything.
func runStudy(ctx context.Context, m *models.Model, opt study.Options) (*study.Result, error) {
	if err := ctx.Err(); err != nil {
		return nil, err
	}
	if opt.Solver.Context == nil {
		opt.Solver.Context = ctx
	}
	s, err := study.Run(m, opt)
	if err != nil {
		return nil, err
	}
	return s, ctx.Err()
}

var cmdExamples = &Command{
	UsageLine: "examples [NAME]",
	Short:     "list the embedded example models, or print one",
	Long: `Examples lists the example models built into polegap, each with a line
from its opening comment, and the measured-curve samples built in for
compare. With a NAME it prints that model or sample file, so that it can
be saved and edited:

	polegap examples bench-dipole > my-magnet.yaml`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		return func(env *Env, args []string) error {
			switch len(args) {
			case 0:
				for _, name := range models.Examples() {
					def := ""
					if name == models.DefaultExample {
						def = " (the default, used by 'polegap demo')"
					}
					fmt.Fprintf(env.Stdout, "%-22s %s%s\n", name, models.ExampleSummary(name), def)
				}
				fmt.Fprintf(env.Stdout, "\nmeasured samples, for 'polegap compare bench-dipole NAME' (invented data, see testdata/measured/README.md):\n")
				for _, name := range samples.Names() {
					fmt.Fprintf(env.Stdout, "%-30s %s\n", name, samples.Summaries[name])
				}
				return nil
			case 1:
				data, err := models.Example(args[0])
				if err != nil {
					if d, serr := samples.Data(args[0]); serr == nil {
						data, err = d, nil
					}
				}
				if err != nil {
					return err
				}
				_, err = env.Stdout.Write(data)
				return err
			}
			return usagef("too many arguments")
		}
	},
}

// loadMeasured reads a measured-data file, or a built-in sample when no
// file of that name exists ('polegap examples' lists them).
func loadMeasured(arg string) (*measure.Curve, error) {
	if _, err := os.Stat(arg); err != nil {
		if data, serr := samples.Data(arg); serr == nil {
			return measure.Parse(arg, data)
		}
	}
	return measure.Load(arg)
}
