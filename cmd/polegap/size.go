package main

import (
	"flag"
	"fmt"
	"io"
	"math"
	"strings"

	"polegap/internal/fileout"
	"polegap/models"
	"polegap/post/output/report"
	"polegap/post/workflow/check"
	"polegap/post/workflow/coil"
	"polegap/post/workflow/sweep"
	"polegap/post/workflow/target"
	"polegap/solver"
)

var cmdSize = &Command{
	UsageLine: "size [--field B] [--coil NAME] [--probe NAME] [--fill F] [--temperature T] [--cooling KIND] [--wires TABLE] [--supply-voltage V] [--supply-current I] [--circuits N|auto] [--water-pressure P] [--water-speed V] [--water-rise K] [--ramp-time T] [--discharge-resistor R] [--max-ampere-turns NI] [--csv FILE] [--json] MODEL",
	Short:     "find the ampere-turns for a target field and a coil that delivers them",
	Long: `Size finds, by nonlinear solves on the model's mesh, the ampere-turns at
which the target probe reaches the target field (--field, or the model's
target), to 1e-4 relative. A target beyond reach (more than five times the
ideal circuit's ampere-turns: the iron is deep in saturation) is reported
with the highest field reached.

Then it lists the windings that deliver those ampere-turns in the coil's
window (one side's cross-section from the model; the mean turn from the
span between the sides and the depth): for each wire of the table
(--wires iec, awg, hollow or all) the turns that fit at the fill factor,
current, current density, resistance at the coil temperature, voltage,
power and copper mass, flagging supply limits and the common-practice
current-density and heat limits of the cooling (air-natural, air-forced
or water), and recommends (marks "*") the one with the least power among
those that meet every limit. The limits used are printed above the table.

Air cooling: the table gives the surface heat flux (W/m²) against the
common-practice limit h × (coil − air temperature). Water cooling: for
hollow conductors the table gives the parallel circuits (--circuits N,
or auto: the fewest, up to 32, that meet the water limits), the flow for
the water's temperature rise (--water-rise, default 20 K), the speed in
the bore, the Reynolds number, the pressure drop of one circuit by
Darcy–Weisbach with the Blasius (1913) friction factor (64/Re when
laminar; straight bore, fittings add to it), and the hottest conductor
(outlet water plus the film drop by the Gnielinski (1976) correlation),
flagged against the common-practice limits: pressure drop 6 bar
(--water-pressure), bore speed 3 m/s (--water-speed) and the coil
temperature (--temperature). Windings too far from buildable (above
1500 V, over three times the current-density limit or ten times the
pressure limit) are left out of the table and counted; --csv and --json
keep them.

For the recommended winding it then states what the supply must do:
from the excitation curve (three more solves at a quarter, half and
three quarters of the current) the incremental inductance, the voltage
V = L_inc dI/dt + I R over a linear ramp of --ramp-time (default 10 s),
its peak and profile, the L/R time constant and the stored energy, and
the switch-off through a free-wheeling diode or, with
--discharge-resistor, a resistor: its peak voltage I R_d, the time to
fall to 1 % and the energy it absorbs.

A number without a unit is in tesla (--field), ampere (--supply-current),
volts (--supply-voltage), ampere-turns (--max-ampere-turns), °C
(--temperature), bar (--water-pressure), seconds (--ramp-time) or ohm
(--discharge-resistor).

Exit status: 0 with a recommended winding, 3 when the result is printed
but no winding meets every limit, 1 on failure, 2 on a usage error.

The currents, voltages and stored energy of a real magnet can injure:
the cautions printed with the result, quantified from the design,
apply.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		want := quantity(fs, "field", field, "target field (e.g. 1.2T; default the model's target)").in(positive)
		coilName := fs.String("coil", "", "the coil to size (default the first)")
		probe := fs.String("probe", "", "the probe that must reach the field (default the model's target probe)")
		fill := realFlag(fs, "fill", 0, numRange{lo: 0, hi: 0.9069, loOpen: true, hint: "0.9069 is the densest packing of round wires"}, "fill factor: wire envelope area over window area (default 0.6)")
		temp := quantity(fs, "temperature", temperature, "coil temperature for the resistance, °C (default 60)").in(numRange{lo: -50, hi: 250, hint: "the range of copper's linear resistance law and of magnet-wire insulation"})
		cooling := fs.String("cooling", "air-natural", "air-natural, air-forced or water")
		wires := fs.String("wires", "auto", "wire table: iec, awg, hollow or all (auto: iec, or hollow for water)")
		supplyV := quantity(fs, "supply-voltage", voltage, "supply voltage limit (e.g. 60V)").in(positive)
		supplyI := quantity(fs, "supply-current", current, "supply current limit (e.g. 50A)").in(positive)
		maxNI := quantity(fs, "max-ampere-turns", ampereTurns, "give up beyond this (default 5 × the ideal)").in(positive)
		wf := addWaterFlags(fs)
		sf := addSupplyFlags(fs)
		csvOut := fs.String("csv", "", "write the winding options to this CSV file")
		asJSON := fs.Bool("json", false, "print the result as JSON")
		af := addAccuracyFlags(fs)
		html := addHTMLFlag(fs, "size")
		return func(env *Env, args []string) error {
			m, err := modelArg(args)
			if err != nil {
				return err
			}
			bt, pname, err := sizeTarget(m, want, *probe)
			if err != nil {
				return err
			}
			spec := coil.Spec{FillFactor: *fill, Temperature: temp.SI(m), SupplyVoltage: supplyV.SI(m), SupplyCurrent: supplyI.SI(m)}
			if spec.Cooling, err = parseCooling(*cooling); err != nil {
				return usagef("--cooling: %v", err)
			}
			if err := wf.apply(&spec, m); err != nil {
				return err
			}
			sopt, err := sf.options(m)
			if err != nil {
				return err
			}
			table, err := wireTable(*wires, spec.Cooling)
			if err != nil {
				return usagef("--wires: %v", err)
			}
			topt := target.Options{GapLength: m.Gap, MaxAmpereTurns: maxNI.SI(m)}
			fine, coarse, acc, err := solveToAccuracy(env, "size", m, af, solver.Options{})
			if err != nil {
				return err
			}
			r, err := sweep.NewRunnerFrom(fine, *coilName, pname)
			if err != nil {
				return err
			}
			res, err := target.Search(env.Ctx, r, bt, topt)
			if err != nil {
				return err
			}
			var niEst float64
			if coarse != nil {
				// The same search on the mesh before the last: the change of
				// the answer is its error estimate.
				rc, err := sweep.NewRunnerFrom(coarse, *coilName, pname)
				if err != nil {
					return err
				}
				cres, err := target.Search(env.Ctx, rc, bt, topt)
				if err != nil {
					return err
				}
				niEst = math.Abs(res.AmpereTurns - cres.AmpereTurns)
			}
			c := &m.Coils[0]
			if *coilName != "" {
				c, _ = m.Coil(*coilName)
			}
			w, err := coil.CoilWinding(m, c)
			if err != nil {
				return err
			}
			spec.AmpereTurns, spec.Window = res.AmpereTurns, w.Window
			if err := spec.Validate(); err != nil {
				return err
			}
			opts := coil.Options(spec, table)
			s := coil.NewSizing(m.Name, pname, &res, w, spec, opts)
			s.AmpereTurnsEstimate, s.Accuracy = niEst, accuracyNote(acc)
			s.IronLimit, s.Planar = check.IronLimit(m), m.Geometry != models.Axisymmetric
			if err := sizeSupply(env, r, &res, s, sopt); err != nil {
				return err
			}
			if *csvOut != "" {
				if err := fileout.Write(*csvOut, func(w io.Writer) error { return coil.WriteCSV(w, opts) }); err != nil {
					return err
				}
			}
			if html.set() {
				if err := htmlSize(html, args[0], fine, acc, s); err != nil {
					return err
				}
			}
			if *asJSON {
				err = writeJSON(env.Stdout, "size", s)
			} else {
				err = report.WriteSizing(env.Stdout, s)
			}
			if err == nil && s.Best == nil {
				return exitError{exitNoWinding, nil}
			}
			return err
		}
	},
}

// sizeTarget returns the target field and probe from the flags or the model.
func sizeTarget(m *models.Model, want *quantityFlag, probe string) (float64, string, error) {
	var bt float64
	if want.set {
		bt = want.SI(m)
	} else if m.Target != nil {
		bt = m.Target.Field
	} else {
		return 0, "", fmt.Errorf("%s: no target field: give --field or add target: {probe: ..., field: ...} to the model", m.File)
	}
	if probe == "" {
		probe = probeFor(m, "")
	}
	return bt, probe, nil
}

// parseCooling reads the --cooling flag.
func parseCooling(s string) (coil.Cooling, error) {
	for _, c := range []coil.Cooling{coil.AirNatural, coil.AirForced, coil.Water} {
		if strings.EqualFold(s, c.String()) {
			return c, nil
		}
	}
	return 0, fmt.Errorf("unknown cooling %q: use air-natural, air-forced or water", s)
}

// wireTable returns the wire table the --wires flag names: iec, awg,
// hollow, all, or auto (the cooling's own, coil.DefaultWires).
func wireTable(name string, cooling coil.Cooling) ([]coil.Wire, error) {
	switch name {
	case "awg":
		return coil.AWGWires(coil.Grade2), nil
	case "iec":
		return coil.IECWires(coil.R20, coil.Grade2), nil
	case "hollow":
		return coil.HollowWires(), nil
	case "", "auto":
		return coil.DefaultWires(cooling), nil
	case "all":
		return append(append(coil.IECWires(coil.R20, coil.Grade2), coil.AWGWires(coil.Grade2)...), coil.HollowWires()...), nil
	}
	return nil, fmt.Errorf("unknown wire table %q: use iec, awg, hollow or all", name)
}
