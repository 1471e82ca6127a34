package coil

import (
	"fmt"
	"math"

	"polegap/models"
)

// Winding describes where a model coil's turns lie, for coil sizing.
type Winding struct {
	Window Window // one side's cross-section and the mean turn
	// Windings is the number of separate windings in series that make up
	// the coil (a C-core's two pole coils: 2); each carries Turns × I.
	Windings int
}

// CoilWinding derives the coil window from a model coil's side regions.
//
// Planar: the sides come in pairs (a winding's outgoing and return
// conductors). The radial build is the side's extent along the line
// joining the pair's centres, the height its extent across it; the
// winding wraps the span between the pair's inner edges and the depth, so
// its mean turn is MeanTurnRect(span, depth, build, 0).
// Axisymmetric: each side is one winding of mean radius r, mean turn 2πr.
func CoilWinding(m *models.Model, c *models.Coil) (Winding, error) {
	if len(c.Sides) == 0 {
		return Winding{}, m.Errorf(c.Pos, "coil %q has no sides", c.Name)
	}
	bounds := func(s models.CoilSide) (x0, y0, x1, y1 float64, err error) {
		r, ok := m.Region(s.Region)
		if !ok {
			return 0, 0, 0, 0, m.Errorf(s.Pos, "coil %q: side region %q does not exist", c.Name, s.Region)
		}
		x0, y0, x1, y1 = r.Bounds()
		return x0, y0, x1, y1, nil
	}
	x0, y0, x1, y1, err := bounds(c.Sides[0])
	if err != nil {
		return Winding{}, err
	}
	if m.Geometry == models.Axisymmetric {
		w := Window{Width: x1 - x0, Height: y1 - y0}
		w.MeanTurn = MeanTurnRound(x0, w.Width)
		return Winding{Window: w, Windings: len(c.Sides)}, nil
	}
	if len(c.Sides) < 2 {
		return Winding{}, m.Errorf(c.Pos, "coil %q has one side: a planar winding needs its return side to size the coil", c.Name)
	}
	u0, v0, u1, v1, err := bounds(c.Sides[1])
	if err != nil {
		return Winding{}, err
	}
	dx := math.Abs(0.5*(x0+x1) - 0.5*(u0+u1))
	dy := math.Abs(0.5*(y0+y1) - 0.5*(v0+v1))
	var w Window
	var span float64
	if dx >= dy {
		w = Window{Width: x1 - x0, Height: y1 - y0}
		span = math.Max(u0, x0) - math.Min(x1, u1)
	} else {
		w = Window{Width: y1 - y0, Height: x1 - x0}
		span = math.Max(v0, y0) - math.Min(y1, v1)
	}
	if span < 0 {
		return Winding{}, fmt.Errorf("%s: coil %q: its first two sides overlap in the winding direction", m.File, c.Name)
	}
	w.MeanTurn = MeanTurnRect(span, m.Depth, w.Width, 0)
	return Winding{Window: w, Windings: len(c.Sides) / 2}, nil
}
