package coil

import (
	"fmt"
	"math"
)

// Shape is the cross-section of a conductor.
type Shape uint8

const (
	Round       Shape = iota // solid round wire, enamelled
	Rectangular              // solid rectangular strip or bar with rounded corners
	Hollow                   // rectangular bar with a round cooling bore (water-cooled coils)
)

func (s Shape) String() string {
	switch s {
	case Round:
		return "round"
	case Rectangular:
		return "rectangular"
	case Hollow:
		return "hollow"
	}
	return fmt.Sprintf("Shape(%d)", uint8(s))
}

// Wire is one conductor size. All lengths are metres.
//
// A Round wire has its bare Diameter and its insulated Overall diameter.
// A Rectangular or Hollow bar has bare Width × Height with corner radius
// Corner, insulated OverallWidth × OverallHeight, and (Hollow) a round
// cooling Bore. The Width lies along the window's Width (the radial build).
type Wire struct {
	Name   string `json:"name"`
	Shape  Shape  `json:"shape"`  // "round", "rectangular" or "hollow" (Shape.MarshalText)
	Source string `json:"source"` // where the dimensions come from

	Diameter float64 `json:"diameter_m,omitempty"` // bare conductor (Round)
	Overall  float64 `json:"overall_m,omitempty"`  // insulated (Round)

	Width         float64 `json:"width_m,omitempty"`          // bare conductor (Rectangular, Hollow)
	Height        float64 `json:"height_m,omitempty"`         // bare conductor (Rectangular, Hollow)
	Corner        float64 `json:"corner_radius_m,omitempty"`  // corner radius of the bare bar
	Bore          float64 `json:"bore_m,omitempty"`           // cooling-hole diameter (Hollow)
	OverallWidth  float64 `json:"overall_width_m,omitempty"`  // insulated (Rectangular, Hollow)
	OverallHeight float64 `json:"overall_height_m,omitempty"` // insulated (Rectangular, Hollow)
}

// Area returns the copper cross-section (m²): π d²/4 for a round wire,
// w h − (4 − π) r² for a bar with corner radius r, less π b²/4 for a bore b.
func (w *Wire) Area() float64 {
	switch w.Shape {
	case Round:
		return math.Pi / 4 * w.Diameter * w.Diameter
	case Rectangular, Hollow:
		a := w.Width*w.Height - (4-math.Pi)*w.Corner*w.Corner
		if w.Shape == Hollow {
			a -= math.Pi / 4 * w.Bore * w.Bore
		}
		return a
	}
	return 0
}

// Envelope returns the insulated outer width and height of the conductor
// (m); for a round wire both are the overall diameter.
func (w *Wire) Envelope() (width, height float64) {
	if w.Shape == Round {
		return w.Overall, w.Overall
	}
	return w.OverallWidth, w.OverallHeight
}

// BoreArea returns the cross-section of the cooling bore (m²), 0 unless
// the wire is Hollow.
func (w *Wire) BoreArea() float64 {
	if w.Shape != Hollow {
		return 0
	}
	return math.Pi / 4 * w.Bore * w.Bore
}

// Check reports a wire whose dimensions are not physical: a non-finite or
// non-positive size, insulation thinner than nothing, a corner radius over
// half the bar, a bore that leaves no wall.
func (w *Wire) Check() error {
	bad := func(format string, a ...any) error {
		return &WireError{Name: w.Name, Reason: fmt.Sprintf(format, a...)}
	}
	pos := func(v float64) bool { return v > 0 && !math.IsInf(v, 0) }
	switch w.Shape {
	case Round:
		if !pos(w.Diameter) || !pos(w.Overall) {
			return bad("diameter %g m and overall %g m must be finite and > 0", w.Diameter, w.Overall)
		}
		if w.Overall < w.Diameter {
			return bad("overall diameter %g m is smaller than the conductor %g m", w.Overall, w.Diameter)
		}
	case Rectangular, Hollow:
		if !pos(w.Width) || !pos(w.Height) || !pos(w.OverallWidth) || !pos(w.OverallHeight) {
			return bad("width, height and overall sizes must be finite and > 0")
		}
		if w.OverallWidth < w.Width || w.OverallHeight < w.Height {
			return bad("overall %g x %g m is smaller than the conductor %g x %g m", w.OverallWidth, w.OverallHeight, w.Width, w.Height)
		}
		if !(w.Corner >= 0) || 2*w.Corner > math.Min(w.Width, w.Height) {
			return bad("corner radius %g m must be >= 0 and at most half the smaller side", w.Corner)
		}
		if w.Shape == Hollow && (!pos(w.Bore) || w.Bore >= math.Min(w.Width, w.Height)) {
			return bad("bore %g m must be > 0 and leave a wall inside %g x %g m", w.Bore, w.Width, w.Height)
		}
	default:
		return bad("unknown shape %v", w.Shape)
	}
	if !(w.Area() > 0) {
		return bad("no copper cross-section")
	}
	return nil
}

// RoundWire returns a round wire of bare diameter d and insulated
// diameter overall (m), for sizes not in the built-in tables. Check it
// before use.
func RoundWire(name string, d, overall float64) Wire {
	return Wire{Name: name, Shape: Round, Source: "user", Diameter: d, Overall: overall}
}

// BarWire returns a solid rectangular bar w × h with corner radius r and
// insulation ins on every side (m). Check it before use.
func BarWire(name string, w, h, r, ins float64) Wire {
	return Wire{Name: name, Shape: Rectangular, Source: "user", Width: w, Height: h, Corner: r,
		OverallWidth: w + 2*ins, OverallHeight: h + 2*ins}
}

// HollowBar returns a hollow bar w × h with corner radius r, a round bore
// and insulation ins on every side (m). Check it before use.
func HollowBar(name string, w, h, r, bore, ins float64) Wire {
	b := BarWire(name, w, h, r, ins)
	b.Shape, b.Bore = Hollow, bore
	return b
}
