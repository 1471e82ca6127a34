package main

import (
	"flag"

	"polegap/post/output/library"
)

var cmdGrades = &Command{
	UsageLine: "grades [CURVE [GRADE]]",
	Short:     "list electrical-steel grades, or check a B-H curve against one",
	Long: `Grades lists the non-oriented electrical-steel grades of IEC 60404-8-4 /
EN 10106 with their minimum polarisation at 2500, 5000 and 10000 A/m.
With a CURVE (a built-in curve name or a CSV file of H and B) it prints
the curve's polarisation J = B - μ0 H at those field strengths beside the
grade's minimum: the GRADE given, or the built-in curve's own. A shortfall
is a warning; the exit status stays 0.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		return func(env *Env, args []string) error {
			switch len(args) {
			case 0:
				return library.WriteGrades(env.Stdout)
			case 1, 2:
				grade := ""
				if len(args) == 2 {
					grade = args[1]
				}
				_, err := library.CheckGrade(env.Stdout, args[0], grade)
				return err
			}
			return usagef("too many arguments")
		}
	},
}
