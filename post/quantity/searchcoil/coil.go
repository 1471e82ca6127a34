package searchcoil

import (
	"math"

	"gonum.org/v1/gonum/integrate/quad"

	"polegap/internal/num"
)

// Field is what a coil needs of a solution: the potential A (Wb/m) and
// the flux density (T) at a point, ok = false outside the mesh. It has the
// method set of probes.Field and of *solver.Solution.
type Field interface {
	At(x, y float64) (a, bx, by float64, ok bool)
}

// Coil is a search coil at a position.
type Coil interface {
	// Linkage returns the coil's flux linkage in f, Wb-turns.
	Linkage(f Field) (float64, error)
}

var (
	_ Coil = Long{}
	_ Coil = Small{}
	_ Coil = Loop{}
	_ Coil = Winding{}
)

// Change returns the change of flux linkage λ2 − λ1 (Wb-turns) between
// coil c1 in field f1 and coil c2 in field f2: what an integrating
// fluxmeter reads when the coil is moved (c1 → c2 in one field), flipped,
// or the field is switched (f1 → f2 for one coil). The meter's sign
// depends on the wiring.
func Change(f1 Field, c1 Coil, f2 Field, c2 Coil) (float64, error) {
	l1, err := c1.Linkage(f1)
	if err != nil {
		return 0, err
	}
	l2, err := c2.Linkage(f2)
	if err != nil {
		return 0, err
	}
	return l2 - l1, nil
}

// Move returns the change of linkage when a coil is moved in one field
// from position c1 to position c2: Change(f, c1, f, c2).
func Move(f Field, c1, c2 Coil) (float64, error) { return Change(f, c1, f, c2) }

// Long is a planar coil of Turns turns and Length metres along z whose
// sides pass through P (conductors along +z) and Q (the return).
type Long struct {
	P, Q   [2]float64
	Turns  float64
	Length float64 // m along z (the model's depth for a full-length coil)
}

// Linkage returns N L (A(P) − A(Q)), Wb-turns.
func (c Long) Linkage(f Field) (float64, error) {
	checkTurns(c.Turns)
	if !(c.Length > 0) || math.IsInf(c.Length, 0) {
		panic(errLength)
	}
	if c.P == c.Q {
		panic(errSides)
	}
	ap, err := potential(f, c.P, "P")
	if err != nil {
		return 0, err
	}
	aq, err := potential(f, c.Q, "Q")
	if err != nil {
		return 0, err
	}
	return c.Turns * c.Length * (ap - aq), nil
}

// Small is a planar coil of Turns turns and area Area (m²) whose axis
// points along Axis at Centre. Width = 0 reads B at the centre; Width > 0
// averages B·n over a segment of that width (m) through the centre at
// right angles to the axis, in the plane of the model: the coil's extent
// across the field (its extent along z does not matter in a planar field).
type Small struct {
	Centre [2]float64
	Axis   [2]float64 // direction of the coil's axis; need not be unit length
	Turns  float64
	Area   float64 // m²
	Width  float64 // m, 0 for a point coil
}

// Linkage returns N S B·n, with B·n at the centre or averaged over the
// width, Wb-turns.
func (c Small) Linkage(f Field) (float64, error) {
	checkTurns(c.Turns)
	if !(c.Area > 0) || math.IsInf(c.Area, 0) {
		panic(errArea)
	}
	if !(c.Width >= 0) || math.IsInf(c.Width, 0) {
		panic(errWidth)
	}
	l := math.Hypot(c.Axis[0], c.Axis[1])
	if !(l > 0) || math.IsInf(l, 0) {
		panic(errAxis)
	}
	if f == nil {
		panic(errNilField)
	}
	nx, ny := c.Axis[0]/l, c.Axis[1]/l
	if c.Width == 0 {
		_, bx, by, ok := f.At(c.Centre[0], c.Centre[1])
		if !ok || !num.Finite(bx) || !num.Finite(by) {
			return 0, &OutsideError{What: "centre", X: c.Centre[0], Y: c.Centre[1]}
		}
		return c.Turns * c.Area * (bx*nx + by*ny), nil
	}
	// The segment p→q whose left normal is the axis: direction (ny, −nx).
	h := c.Width / 2
	p := [2]float64{c.Centre[0] - h*ny, c.Centre[1] + h*nx}
	q := [2]float64{c.Centre[0] + h*ny, c.Centre[1] - h*nx}
	ap, err := potential(f, p, "width end")
	if err != nil {
		return 0, err
	}
	aq, err := potential(f, q, "width end")
	if err != nil {
		return 0, err
	}
	return c.Turns * c.Area * (ap - aq) / c.Width, nil
}

// Loop is an axisymmetric coaxial loop of Turns turns at radius R and
// height Z (m).
type Loop struct {
	R, Z  float64
	Turns float64
}

// Linkage returns N 2π R Aφ(R, Z), Wb-turns.
func (c Loop) Linkage(f Field) (float64, error) {
	checkTurns(c.Turns)
	if !(c.R >= 0) || math.IsInf(c.R, 0) || math.IsNaN(c.Z) || math.IsInf(c.Z, 0) {
		panic(errRadius)
	}
	a, err := potential(f, [2]float64{c.R, c.Z}, "loop")
	if err != nil {
		return 0, err
	}
	return c.Turns * 2 * math.Pi * c.R * a, nil
}

// Winding is an axisymmetric coil of Turns turns spread uniformly over the
// section R0 <= r <= R1, Z0 <= z <= Z1 (m).
type Winding struct {
	R0, R1, Z0, Z1 float64
	Turns          float64
	// Order is the number of Gauss-Legendre points per direction, 1 to 5;
	// 0 means 3 (exact for a linkage density 2π r A that is a polynomial
	// of degree 5 in each direction over the section).
	Order int
}

// Linkage returns N times the mean of 2π r Aφ over the section, Wb-turns.
func (c Winding) Linkage(f Field) (float64, error) {
	checkTurns(c.Turns)
	for _, v := range [4]float64{c.R0, c.R1, c.Z0, c.Z1} {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			panic(errRadius)
		}
	}
	if !(c.R0 >= 0 && c.R0 < c.R1 && c.Z0 < c.Z1) {
		panic(errRadius)
	}
	n := c.Order
	if n == 0 {
		n = 3
	}
	if n < 1 || n > len(gauss) {
		panic(errQuadOrder)
	}
	xs, ws := gauss[n-1].x, gauss[n-1].w
	var sum float64
	for i := range n {
		r := c.R0 + (c.R1-c.R0)*xs[i]
		for j := range n {
			z := c.Z0 + (c.Z1-c.Z0)*xs[j]
			a, err := potential(f, [2]float64{r, z}, "winding")
			if err != nil {
				return 0, err
			}
			sum += ws[i] * ws[j] * 2 * math.Pi * r * a
		}
	}
	return c.Turns * sum, nil
}

// gauss[n-1] holds the n-point Gauss-Legendre nodes and weights on [0, 1]
// for n = 1 to 5, computed once by gonum's quad.Legendre (they agree to
// rounding with Abramowitz and Stegun, "Handbook of Mathematical
// Functions", 1964, table 25.4, mapped from [−1, 1]).
var gauss = func() (r [5]struct{ x, w []float64 }) {
	for i := range r {
		r[i].x, r[i].w = make([]float64, i+1), make([]float64, i+1)
		quad.Legendre{}.FixedLocations(r[i].x, r[i].w, 0, 1)
	}
	return r
}()

func checkTurns(n float64) {
	if !(n > 0) || math.IsInf(n, 0) {
		panic(errTurns)
	}
}

func potential(f Field, pt [2]float64, what string) (float64, error) {
	if f == nil {
		panic(errNilField)
	}
	a, bx, by, ok := f.At(pt[0], pt[1])
	if !ok || !num.Finite(a) || !num.Finite(bx) || !num.Finite(by) {
		return 0, &OutsideError{What: what, X: pt[0], Y: pt[1]}
	}
	return a, nil
}
