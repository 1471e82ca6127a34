package coil

import (
	"fmt"
	"math"
)

// Cooling is how the coil sheds its heat.
type Cooling uint8

const (
	AirNatural Cooling = iota // free convection and radiation to still air
	AirForced                 // a fan blowing over the coil
	Water                     // water through hollow conductors or cooling plates
)

func (c Cooling) String() string {
	switch c {
	case AirNatural:
		return "air-natural"
	case AirForced:
		return "air-forced"
	case Water:
		return "water"
	}
	return fmt.Sprintf("Cooling(%d)", uint8(c))
}

// Current-density limits in the copper (A/m²) for each kind of cooling:
// common practice for continuously rated magnet coils. Typical ranges are
// about 1-3 A/mm² for still air, 3-5 A/mm² with a fan and 5-15 A/mm² for
// water-cooled hollow conductor; the limits below are inside those ranges.
const (
	JMaxAirNatural = 2.5e6  // A/m², common practice
	JMaxAirForced  = 4.0e6  // A/m², common practice
	JMaxWater      = 10.0e6 // A/m², common practice
)

// Surface heat-transfer coefficients for the air-cooled heat check
// (W/(m²·K)), convection and radiation together: common practice (from
// memory: about 5 W/(m²·K) of free convection plus about 6 of radiation at
// emissivity 0.9 near 50 °C; a fan of a few m/s gives roughly 30-50).
// The heat the cooling removes is h × Window.CoolingSurface() × (Temperature
// − Ambient); with the defaults (60 °C coil, 20 °C air) still air takes
// about 480 W/m², the 0.05 W/cm² surface loading often quoted for
// air-cooled coils (common practice).
const (
	HAirNatural = 12.0 // W/(m²·K), common practice
	HAirForced  = 40.0 // W/(m²·K), common practice
)

// JMax returns the common-practice current-density limit (A/m²) of the
// cooling.
func (c Cooling) JMax() float64 {
	switch c {
	case AirNatural:
		return JMaxAirNatural
	case AirForced:
		return JMaxAirForced
	case Water:
		return JMaxWater
	}
	panic("coil: unknown Cooling")
}

// Packing is how the number of turns that fit in the window is counted.
type Packing uint8

const (
	// ByFill counts N = floor(FillFactor × window area / envelope area)
	// for round wire (envelope area π d_o²/4, d_o the overall diameter):
	// FillFactor covers the lay of the turns, layer insulation and
	// lead-outs. The count is capped by the Orthocyclic (or ByLayers, if
	// larger) count, which governs in windows only a few wires wide. Bars
	// are counted by layers, as ByLayers.
	ByFill Packing = iota
	// ByLayers counts whole layers of conductors stacked square on one
	// another: floor(Width/w_o) layers of floor(Height/h_o) turns, w_o and
	// h_o the conductor's insulated envelope. FillFactor is not used.
	ByLayers
	// Orthocyclic counts round wire nested in the grooves of the layer
	// below (layer pitch d_o √3/2; a layer lacks one turn when the window
	// Height leaves less than d_o/2 beside a full layer), or ByLayers when
	// that fits more. Bars are counted ByLayers. FillFactor is not used.
	Orthocyclic
)

// Spec is what the coil must deliver and the limits it must respect.
// Units are SI (A, m, V, °C); a zero field takes its documented default.
type Spec struct {
	AmpereTurns float64 // NI the magnet needs, A (> 0)
	Window      Window  // the coil's cross-section and mean turn
	Turns       int     // fixed number of turns; 0 = as many as fit

	Packing     Packing // how turns are counted; default ByFill
	FillFactor  float64 // ByFill: envelope area over window area, 0 = DefaultFillFactor (0.6)
	Temperature float64 // conductor temperature for R, °C; 0 = DefaultTemperature (60 °C)
	Ambient     float64 // air (or water inlet) temperature, °C; 0 = DefaultAmbient (20 °C)

	SupplyVoltage float64 // V, 0 = no limit
	SupplyCurrent float64 // A, 0 = no limit

	Cooling           Cooling // default AirNatural
	MaxCurrentDensity float64 // A/m²; 0 = Cooling.JMax()
	CoolingSurface    float64 // m² for the air heat check; 0 = Window.CoolingSurface()
	WaterRise         float64 // K, water temperature rise; 0 = DefaultWaterRise (20 K)
	WaterCircuits     int     // parallel water circuits in the coil (Hollow); 0 = 1, or chosen (MaxWaterCircuits)
	MaxWaterPressure  float64 // Pa, pressure drop the water supply provides; 0 = no limit
	MaxWaterSpeed     float64 // m/s in the bore; 0 = no limit (CommonWaterSpeed is common practice)
	// MaxWaterCircuits, when WaterCircuits is 0, lets Options choose for
	// each hollow winding the fewest parallel circuits, up to this many
	// (and the turns), that meet the water limits; 0 keeps one circuit.
	MaxWaterCircuits int
}

// withDefaults returns s with its zero fields replaced by the defaults.
func (s Spec) withDefaults() Spec {
	if s.FillFactor == 0 {
		s.FillFactor = DefaultFillFactor
	}
	if s.Temperature == 0 {
		s.Temperature = DefaultTemperature
	}
	if s.Ambient == 0 {
		s.Ambient = DefaultAmbient
	}
	if s.MaxCurrentDensity == 0 && s.Cooling <= Water {
		s.MaxCurrentDensity = s.Cooling.JMax()
	}
	if s.CoolingSurface == 0 {
		s.CoolingSurface = s.Window.CoolingSurface()
	}
	if s.WaterRise == 0 {
		s.WaterRise = DefaultWaterRise
	}
	if s.WaterCircuits == 0 && s.MaxWaterCircuits == 0 {
		s.WaterCircuits = 1
	}
	return s
}

// maxFill is the densest packing of equal circles, π/(2√3) (hexagonal);
// no count of round wires can exceed it.
var maxFill = math.Pi / (2 * math.Sqrt(3))

// Validate reports the first field of s that cannot describe a coil, as a
// *SpecError; nil when s (with its defaults) is usable.
func (s Spec) Validate() error {
	bad := func(field string, v float64, reason string) error {
		return &SpecError{Field: field, Value: v, Reason: reason}
	}
	fin := func(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
	switch {
	case !fin(s.AmpereTurns) || s.AmpereTurns <= 0:
		return bad("AmpereTurns", s.AmpereTurns, "must be finite and > 0")
	case !fin(s.Window.Width) || s.Window.Width <= 0:
		return bad("Window.Width", s.Window.Width, "must be finite and > 0 m")
	case !fin(s.Window.Height) || s.Window.Height <= 0:
		return bad("Window.Height", s.Window.Height, "must be finite and > 0 m")
	case !fin(s.Window.MeanTurn) || s.Window.MeanTurn <= 0:
		return bad("Window.MeanTurn", s.Window.MeanTurn, "must be finite and > 0 m")
	case s.Turns < 0:
		return bad("Turns", float64(s.Turns), "must be >= 0 (0 = as many as fit)")
	case s.Packing > Orthocyclic:
		return bad("Packing", float64(s.Packing), "unknown packing")
	case !fin(s.FillFactor) || s.FillFactor < 0 || s.FillFactor > maxFill:
		return bad("FillFactor", s.FillFactor, fmt.Sprintf("must be in (0, %.4f], the densest packing of circles", maxFill))
	case !fin(s.SupplyVoltage) || s.SupplyVoltage < 0:
		return bad("SupplyVoltage", s.SupplyVoltage, "must be finite and >= 0 (0 = no limit)")
	case !fin(s.SupplyCurrent) || s.SupplyCurrent < 0:
		return bad("SupplyCurrent", s.SupplyCurrent, "must be finite and >= 0 (0 = no limit)")
	case s.Cooling > Water:
		return bad("Cooling", float64(s.Cooling), "unknown cooling")
	case !fin(s.MaxCurrentDensity) || s.MaxCurrentDensity < 0:
		return bad("MaxCurrentDensity", s.MaxCurrentDensity, "must be finite and >= 0 A/m² (0 = the cooling's limit)")
	case !fin(s.CoolingSurface) || s.CoolingSurface < 0:
		return bad("CoolingSurface", s.CoolingSurface, "must be finite and >= 0 m² (0 = estimate from the window)")
	case !fin(s.WaterRise) || s.WaterRise < 0:
		return bad("WaterRise", s.WaterRise, "must be finite and >= 0 K (0 = 20 K)")
	case s.WaterCircuits < 0:
		return bad("WaterCircuits", float64(s.WaterCircuits), "must be >= 0 (0 = one circuit)")
	case !fin(s.MaxWaterPressure) || s.MaxWaterPressure < 0:
		return bad("MaxWaterPressure", s.MaxWaterPressure, "must be finite and >= 0 Pa (0 = no limit)")
	case !fin(s.MaxWaterSpeed) || s.MaxWaterSpeed < 0:
		return bad("MaxWaterSpeed", s.MaxWaterSpeed, "must be finite and >= 0 m/s (0 = no limit)")
	case s.MaxWaterCircuits < 0:
		return bad("MaxWaterCircuits", float64(s.MaxWaterCircuits), "must be >= 0 (0 = do not choose)")
	}
	d := s.withDefaults()
	switch {
	case !fin(d.Temperature) || 1+CopperAlpha20*(d.Temperature-20) <= 0 || d.Temperature > 250:
		return bad("Temperature", s.Temperature, "must be a conductor temperature up to 250 °C")
	case !fin(d.Ambient) || d.Ambient >= d.Temperature:
		return bad("Ambient", s.Ambient, fmt.Sprintf("must be below the conductor temperature %g °C", d.Temperature))
	}
	return nil
}
