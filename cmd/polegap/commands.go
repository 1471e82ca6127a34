package main

import (
	"context"
	"flag"
	"fmt"
	"os"

	"polegap/models"
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
	cmdBench,
	cmdExamples,
}

// loadModel reads a model file, or an embedded example when no file of
// that name exists.
func loadModel(arg string) (*models.Model, error) {
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
	Long: `Examples lists the example models built into polegap. With a NAME it
prints that model file, so that it can be saved and edited:

	polegap examples bench-dipole > my-magnet.yaml`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		return func(env *Env, args []string) error {
			switch len(args) {
			case 0:
				for _, name := range models.Examples() {
					def := ""
					if name == models.DefaultExample {
						def = "   (default, used by 'polegap demo')"
					}
					fmt.Fprintf(env.Stdout, "%s%s\n", name, def)
				}
				return nil
			case 1:
				data, err := models.Example(args[0])
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
