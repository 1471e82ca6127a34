package main

import (
	"flag"
	"fmt"
	"strconv"
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
--at (in the model's units) with its axis along --axis (default y, the
gap field's direction in the templates), and the change when it is moved
to --to, or pulled right out of the field when --to is not given: the
reading of an integrating fluxmeter in V·s. --width (model units) averages
the field across the coil's width instead of reading it at the centre.
In an axisymmetric model the coil is a coaxial loop of radius X at height
Y: its linkage is N·2πr·Aφ and --area and --axis are not used.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		turns := fs.Float64("turns", 0, "turns of the search coil")
		area := fs.String("area", "", "area of one turn (e.g. 100mm2)")
		at := fs.String("at", "", "centre of the coil, x,y in the model's units")
		to := fs.String("to", "", "where the coil is moved to (default: out of the field)")
		axis := fs.String("axis", "y", "direction of the coil's axis: x or y")
		width := fs.Float64("width", 0, "width of the coil across the field, in the model's units (0: a point coil)")
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
			p1, err := parsePoint(*at, m.Scale)
			if err != nil {
				return usagef("--at: %v", err)
			}
			var c1, c2 searchcoil.Coil
			axi := m.Geometry == models.Axisymmetric
			if axi {
				c1 = searchcoil.Loop{R: p1[0], Z: p1[1], Turns: *turns}
			} else {
				a, err := models.ParseQuantity(*area, "area")
				if err != nil || !(a > 0) {
					return usagef("--area: give the area of one turn, e.g. 100mm2")
				}
				dir := [2]float64{0, 1}
				if *axis == "x" {
					dir = [2]float64{1, 0}
				} else if *axis != "y" {
					return usagef("--axis must be x or y")
				}
				c1 = searchcoil.Small{Centre: p1, Axis: dir, Turns: *turns, Area: a, Width: *width * m.Scale}
				if *to != "" {
					p2, err := parsePoint(*to, m.Scale)
					if err != nil {
						return usagef("--to: %v", err)
					}
					c2 = searchcoil.Small{Centre: p2, Axis: dir, Turns: *turns, Area: a, Width: *width * m.Scale}
				}
			}
			if axi && *to != "" {
				p2, err := parsePoint(*to, m.Scale)
				if err != nil {
					return usagef("--to: %v", err)
				}
				c2 = searchcoil.Loop{R: p2[0], Z: p2[1], Turns: *turns}
			}
			s, err := study.Run(m, study.Options{})
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

// parsePoint reads "x,y" in model units and returns metres.
func parsePoint(s string, scale float64) ([2]float64, error) {
	a, b, ok := strings.Cut(s, ",")
	x, err1 := strconv.ParseFloat(strings.TrimSpace(a), 64)
	y, err2 := strconv.ParseFloat(strings.TrimSpace(b), 64)
	if !ok || err1 != nil || err2 != nil {
		return [2]float64{}, fmt.Errorf("%q: write x,y in the model's units, e.g. 175,0", s)
	}
	return [2]float64{x * scale, y * scale}, nil
}
