package main

import (
	"flag"
	"fmt"
	"strings"

	"polegap/models"
	"polegap/post/quantity/searchcoil"
	"polegap/post/study"
)

var cmdSearchCoil = &Command{
	UsageLine: "searchcoil --turns N --area A --at X,Y [--to X,Y] [--axis x|y] [--width W] MODEL",
	Short:     "predict a search coil's flux linkage, to compare with an integrator reading",
	Long: `Searchcoil solves the model and predicts the flux linkage (Wb-turns) of a
small search coil of --turns turns and --area (e.g. 100mm2) centred at
--at (x,y, e.g. 175,0 in the model's units, or 175mm,0mm) with its axis along --axis (default y, the
gap field's direction in the templates), and the change when it is moved
to --to, or pulled right out of the field when --to is not given: the
reading of an integrating fluxmeter in V·s. --width averages the field
across the coil's width instead of reading it at the centre. Lengths and
areas without a unit are in the model's units (squared for --area).
In an axisymmetric model the coil is a coaxial loop of radius X at height
Y: its linkage is N·2πr·Aφ and --area and --axis are not used.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		turns := realFlag(fs, "turns", 0, positive, "turns of the search coil")
		turnArea := quantity(fs, "area", area, "area of one turn (e.g. 100mm2)").in(positive)
		turnArea.metresBefore = true
		at := fs.String("at", "", "centre of the coil, x,y in the model's units")
		to := fs.String("to", "", "where the coil is moved to (default: out of the field)")
		axis := fs.String("axis", "y", "direction of the coil's axis: x or y")
		width := quantity(fs, "width", length, "width of the coil across the field (e.g. 10mm; 0: a point coil)").in(nonNegative)
		return func(env *Env, args []string) error {
			if err := oneModel(args); err != nil {
				return err
			}
			if !(*turns > 0) || *at == "" {
				return usagef("give --turns and --at (and --area for a planar model)")
			}
			m, err := loadModel(args[0])
			if err != nil {
				return err
			}
			turnArea.noteBare(env.Stderr, m)
			p1, err := parsePoint(*at, m)
			if err != nil {
				return usagef("--at: %v", err)
			}
			var c1, c2 searchcoil.Coil
			axi := m.Geometry == models.Axisymmetric
			if axi {
				c1 = searchcoil.Loop{R: p1[0], Z: p1[1], Turns: *turns}
			} else {
				a := turnArea.SI(m)
				if !(a > 0) {
					return usagef("--area: give the area of one turn, e.g. 100mm2")
				}
				dir := [2]float64{0, 1}
				if *axis == "x" {
					dir = [2]float64{1, 0}
				} else if *axis != "y" {
					return usagef("--axis must be x or y")
				}
				c1 = searchcoil.Small{Centre: p1, Axis: dir, Turns: *turns, Area: a, Width: width.SI(m)}
				if *to != "" {
					p2, err := parsePoint(*to, m)
					if err != nil {
						return usagef("--to: %v", err)
					}
					c2 = searchcoil.Small{Centre: p2, Axis: dir, Turns: *turns, Area: a, Width: width.SI(m)}
				}
			}
			if axi && *to != "" {
				p2, err := parsePoint(*to, m)
				if err != nil {
					return usagef("--to: %v", err)
				}
				c2 = searchcoil.Loop{R: p2[0], Z: p2[1], Turns: *turns}
			}
			s, err := runStudy(env.Ctx, m, study.Options{})
			if err != nil {
				return err
			}
			f := s.Field()
			l1, err := c1.Linkage(f)
			if err != nil {
				return err
			}
			fmt.Fprintf(env.Stdout, "flux linkage at %s: %.6g Wb-turns\n", *at, l1)
			l2 := 0.0
			where := "out of the field"
			if c2 != nil {
				if l2, err = c2.Linkage(f); err != nil {
					return err
				}
				where = *to
				fmt.Fprintf(env.Stdout, "flux linkage at %s: %.6g Wb-turns\n", *to, l2)
			}
			fmt.Fprintf(env.Stdout, "moved to %s the coil links %.6g Wb-turns less: an integrating fluxmeter reads %.6g V·s\n", where, l1-l2, l1-l2)
			return nil
		}
	},
}

// parsePoint reads "x,y", two lengths (bare numbers in the model's
// units), and returns metres.
func parsePoint(s string, m *models.Model) ([2]float64, error) {
	a, b, ok := strings.Cut(s, ",")
	var x, y quantityFlag
	x.kind, y.kind = length, length
	if err1, err2 := x.Set(a), y.Set(b); !ok || err1 != nil || err2 != nil {
		return [2]float64{}, fmt.Errorf("%q: write x,y in the model's units, e.g. 175,0 (or with units, 175mm,0mm)", s)
	}
	return [2]float64{x.SI(m), y.SI(m)}, nil
}
