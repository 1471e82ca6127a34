package coil

import "math"

// Window is the space one coil occupies, seen in cross-section. Lengths
// are metres.
//
//	 core  |<- Width ->|
//	 ______|___________|___
//	|      |  winding  |  ^
//	|      |  cross-   | Height
//	|      |  section  |  v
//	|______|___________|___
//
// Width is the radial build (away from the core), Height the length along
// the core; MeanTurn is the length of the turn through the centre of the
// cross-section, so that the copper volume is turns × area × MeanTurn.
type Window struct {
	Width, Height float64 // m, one coil side's cross-section
	MeanTurn      float64 // m, mean length of one turn
}

// Area returns Width × Height (m²).
func (w Window) Area() float64 { return w.Width * w.Height }

// MeanTurnRect returns the mean turn length (m) of a coil of radial build
// c wound around a rectangular core of width a and depth b, with a
// clearance g (former or ground insulation) between core and winding, the
// coil's corners being rounded (each corner of the winding is a quarter
// annulus centred on the core corner):
//
//	l = 2 (a + b) + π (c + 2 g)
//
// The straight parts add 2(a + b); the four quarter circles of the mean
// turn have radius g + c/2 and add 2π (g + c/2). With g = 0 this is the
// textbook 2 (a + b) + π c.
func MeanTurnRect(a, b, c, g float64) float64 {
	if !(a >= 0) || !(b >= 0) || !(c > 0) || !(g >= 0) || math.IsInf(a+b+c+g, 0) {
		panic(errBadMeanTurn)
	}
	return 2*(a+b) + math.Pi*(c+2*g)
}

// MeanTurnRound returns the mean turn length (m) of an axisymmetric coil
// of inner radius r and radial build c: 2π r_mean with r_mean = r + c/2.
func MeanTurnRound(r, c float64) float64 {
	if !(r >= 0) || !(c > 0) || math.IsInf(r+c, 0) {
		panic(errBadMeanTurn)
	}
	return 2 * math.Pi * (r + c/2)
}

// CoolingSurface estimates the surface (m²) through which an air-cooled
// coil sheds heat: its outer face, of perimeter MeanTurn + π Width (the
// mean turn moved out by Width/2; exact for a round coil and for
// MeanTurnRect's rounded corners) and length Height, plus its two end
// faces of MeanTurn × Width each. The inner face against the core is not
// counted.
func (w Window) CoolingSurface() float64 {
	return (w.MeanTurn+math.Pi*w.Width)*w.Height + 2*w.MeanTurn*w.Width
}
