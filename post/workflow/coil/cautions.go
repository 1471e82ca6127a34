package coil

// cautions are printed with every coil result (DESIGN.md, "Cautions the
// tool shows").
var cautions = [...]string{
	"Magnet currents and the energy stored in the field can injure or kill: treat the supply and the coil as hazardous.",
	"Switching off or disconnecting a coil under current makes a high voltage across it: provide a free-wheeling path or dump resistor and ramp the current down.",
	"Iron poles attract tools and steel objects with large forces: keep them away from the gap and the yoke while the magnet is energised.",
	"Coils heat: check the temperature rise (and the cooling-water flow) before running at full current.",
	"Disconnect and discharge the supply before touching the coil or its terminals.",
	"Follow local electrical codes and licensed practice for anything built; these figures are design estimates, not a safety assessment.",
}

// Cautions returns the safety cautions to print with any coil result, one
// sentence each. The slice is new on each call.
func Cautions() []string {
	out := make([]string, len(cautions))
	copy(out, cautions[:])
	return out
}
