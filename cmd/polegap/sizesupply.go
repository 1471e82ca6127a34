package main

import (
	"flag"
	"fmt"
	"math"
	"strconv"

	"polegap/models"
	"polegap/post/workflow/coil"
	"polegap/post/workflow/supply"
	"polegap/post/workflow/sweep"
	"polegap/post/workflow/target"
	"polegap/solver"
)

// exitNoWinding is size's exit status when it prints its result but no
// winding meets every limit.
const exitNoWinding = 3

// waterFlags are size's water-cooling options.
type waterFlags struct {
	circuits *string
	pressure *quantityFlag
	speed    *float64
	rise     *float64
}

func addWaterFlags(fs *flag.FlagSet) *waterFlags {
	return &waterFlags{
		circuits: fs.String("circuits", "auto", "parallel water circuits per winding, or auto: the fewest (up to 32) that meet the water limits"),
		pressure: quantity(fs, "water-pressure", pressure, "pressure drop the water supply gives across a circuit (default 6bar, common practice)").in(positive),
		speed:    realFlag(fs, "water-speed", coil.CommonWaterSpeed, positive, "highest water speed in the bore, m/s (common practice)"),
		rise:     realFlag(fs, "water-rise", coil.DefaultWaterRise, positive, "water temperature rise inlet to outlet, K"),
	}
}

// apply puts the water options into spec (the pressure in Pa).
func (f *waterFlags) apply(spec *coil.Spec, m *models.Model) error {
	switch *f.circuits {
	case "auto", "":
		spec.MaxWaterCircuits = coil.CommonWaterCircuits
	default:
		n, err := strconv.Atoi(*f.circuits)
		if err != nil || n < 1 {
			return usagef("--circuits %q: give a whole number of circuits (1 or more) or auto", *f.circuits)
		}
		spec.WaterCircuits = n
	}
	spec.MaxWaterPressure = coil.CommonWaterPressure
	if f.pressure.set {
		spec.MaxWaterPressure = f.pressure.SI(m)
	}
	if !(spec.MaxWaterPressure > 0) || math.IsInf(spec.MaxWaterPressure, 0) {
		return usagef("--water-pressure %s: give a pressure above zero, e.g. 6bar", f.pressure.text)
	}
	if !(*f.speed > 0) || math.IsInf(*f.speed, 0) {
		return usagef("--water-speed %g: give a speed above zero in m/s", *f.speed)
	}
	if !(*f.rise > 0) || math.IsInf(*f.rise, 0) {
		return usagef("--water-rise %g: give a temperature rise above zero in K", *f.rise)
	}
	spec.MaxWaterSpeed, spec.WaterRise = *f.speed, *f.rise
	return nil
}

// supplyFlags are the supply options of size.
type supplyFlags struct{ ramp, dump *quantityFlag }

func addSupplyFlags(fs *flag.FlagSet) *supplyFlags {
	return &supplyFlags{
		ramp: quantity(fs, "ramp-time", duration, "time to ramp the current from zero to the operating point (default 10s)").in(positive),
		dump: quantity(fs, "discharge-resistor", resistance, "resistor the coil discharges into at switch-off (default: a free-wheeling diode)").in(positive),
	}
}

func (f *supplyFlags) options(m *models.Model) (supply.Options, error) {
	var o supply.Options
	if f.ramp.set {
		o.RampTime = f.ramp.SI(m)
		if !(o.RampTime > 0) || math.IsInf(o.RampTime, 0) {
			return o, usagef("--ramp-time %s: give a time above zero, e.g. 30s", f.ramp.text)
		}
	}
	if f.dump.set {
		o.DischargeResistance = f.dump.SI(m)
		if !(o.DischargeResistance > 0) || math.IsInf(o.DischargeResistance, 0) {
			return o, usagef("--discharge-resistor %s: give a resistance above zero, e.g. 2ohm", f.dump.text)
		}
	}
	return o, nil
}

// sizeSupply solves the excitation curve of the recommended winding at
// a quarter, half and three quarters of the current (besides the
// search's own solves) and records what the supply must do for it.
func sizeSupply(env *Env, r *sweep.Runner, res *target.Result, s *coil.Sizing, opt supply.Options) error {
	b := s.Best
	if b == nil || !res.Reached {
		return nil
	}
	pts := append([]sweep.Point(nil), res.Solves...)
	for _, f := range []float64{0.25, 0.5, 0.75} {
		p, err := r.Solve(f*res.Current, solver.Options{Context: env.Ctx})
		if err != nil {
			return err
		}
		pts = append(pts, p)
	}
	rc := float64(max(s.Windings, 1)) * b.Resistance
	sup, err := supply.New(supply.CurveOf(pts, b.Turns), rc, b.Current, opt)
	if err != nil {
		return fmt.Errorf("supply figures: %w", err)
	}
	sup.FieldEnergy = res.Point.Energy
	s.SetSupply(sup)
	return nil
}
