package gap

import (
	"bufio"
	"io"
	"math"
	"strconv"

	"polegap/internal/num"
)

// Field is what this package needs of a solution: the potential A (Wb/m)
// and the flux density (T) at a point, ok = false outside the mesh. It has
// the method set of probes.Field and of *solver.Solution.
type Field interface {
	At(x, y float64) (a, bx, by float64, ok bool)
}

// Sample is the field at one point of a line.
type Sample struct {
	S      float64 // distance from the line's start, m
	X, Y   float64 // m
	A      float64 // Wb/m
	Bx, By float64 // T
	Inside bool    // false: outside the mesh, A and B are zero
	Nx, Ny float64 // the line's left unit normal (the tangent turned 90° counter-clockwise)
}

// B returns |B| in T.
func (s Sample) B() float64 { return math.Hypot(s.Bx, s.By) }

// Bn returns the component of B along the line's left normal, T.
func (s Sample) Bn() float64 { return s.Bx*s.Nx + s.By*s.Ny }

// Component selects which scalar of B a uniformity figure uses.
type Component int

const (
	// Magnitude is |B| (the zero value).
	Magnitude Component = iota
	// ComponentX is Bx (Br axisymmetric).
	ComponentX
	// ComponentY is By (Bz axisymmetric), the main component of a dipole
	// whose gap is horizontal.
	ComponentY
	// Normal is the component along the line's left normal (Sample.Bn).
	Normal
)

// Of returns the selected component of s.
func (c Component) Of(s Sample) float64 {
	switch c {
	case Magnitude:
		return s.B()
	case ComponentX:
		return s.Bx
	case ComponentY:
		return s.By
	case Normal:
		return s.Bn()
	}
	panic(errComponent)
}

func (c Component) String() string {
	switch c {
	case Magnitude:
		return "|B|"
	case ComponentX:
		return "Bx"
	case ComponentY:
		return "By"
	case Normal:
		return "Bn"
	}
	return "Component(" + strconv.Itoa(int(c)) + ")"
}

// ProfileTo samples f at n equally spaced points from p to q (both ends
// included) into dst and returns it; a nil or short dst is grown. Points
// outside the mesh, or where f is not finite, have Inside = false and zero
// field. It panics if f is nil, n < 2 or p = q.
func ProfileTo(dst []Sample, f Field, p, q [2]float64, n int) []Sample {
	if f == nil {
		panic(errNilField)
	}
	if n < 2 {
		panic(errFewPoints)
	}
	dx, dy := q[0]-p[0], q[1]-p[1]
	l := math.Hypot(dx, dy)
	if !(l > 0) {
		panic(errSamePoints)
	}
	nx, ny := -dy/l, dx/l
	if cap(dst) < n {
		dst = make([]Sample, n)
	}
	dst = dst[:n]
	for k := range n {
		t := float64(k) / float64(n-1)
		x, y := p[0]+t*dx, p[1]+t*dy
		if k == n-1 {
			x, y = q[0], q[1]
		}
		s := Sample{S: t * l, X: x, Y: y, Nx: nx, Ny: ny}
		if a, bx, by, ok := f.At(x, y); ok && num.Finite(a) && num.Finite(bx) && num.Finite(by) {
			s.A, s.Bx, s.By, s.Inside = a, bx, by, true
		}
		dst[k] = s
	}
	return dst
}

// WriteCSV writes the samples inside the mesh as CSV with the header
// x_m,y_m,bx_T,by_T,b_T, one row per sample in order, numbers in the
// shortest form that reads back exactly. Samples outside the mesh are left
// out. It returns the first error of w. Writing to a temporary file and
// renaming it (atomic output) is the caller's business.
func WriteCSV(w io.Writer, ss []Sample) error { return WriteCSVAxes(w, ss, false) }

// WriteCSVAxes is WriteCSV for a planar or an axisymmetric model; for the
// second the header is r_m,z_m,br_T,bz_T,b_T (x, y are r, z).
func WriteCSVAxes(w io.Writer, ss []Sample, axisymmetric bool) error {
	bw := bufio.NewWriter(w)
	if axisymmetric {
		bw.WriteString("r_m,z_m,br_T,bz_T,b_T\n")
	} else {
		bw.WriteString("x_m,y_m,bx_T,by_T,b_T\n")
	}
	var buf []byte
	for _, s := range ss {
		if !s.Inside {
			continue
		}
		buf = buf[:0]
		for i, v := range [5]float64{s.X, s.Y, s.Bx, s.By, s.B()} {
			if i > 0 {
				buf = append(buf, ',')
			}
			buf = strconv.AppendFloat(buf, v, 'g', -1, 64)
		}
		buf = append(buf, '\n')
		bw.Write(buf)
	}
	return bw.Flush()
}

// potential returns A at pt or an *OutsideError naming the point.
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

// Flux returns the flux per metre of depth (Wb/m) crossing the segment
// from p to q, positive along its left normal (the direction p→q turned
// 90° counter-clockwise): exactly A(p) − A(q), by Stokes' theorem. It is
// independent of the path between p and q. Planar fields only (see
// AxialFlux).
func Flux(f Field, p, q [2]float64) (float64, error) {
	ap, err := potential(f, p, "P")
	if err != nil {
		return 0, err
	}
	aq, err := potential(f, q, "Q")
	if err != nil {
		return 0, err
	}
	return ap - aq, nil
}

// MeanNormal returns the mean over the segment p→q of the left-normal
// component of B (T): Flux / |pq|. Laid across the gap mid-plane under a
// pole face, it is the face's average field. It panics if p = q.
func MeanNormal(f Field, p, q [2]float64) (float64, error) {
	l := math.Hypot(q[0]-p[0], q[1]-p[1])
	if !(l > 0) {
		panic(errSamePoints)
	}
	phi, err := Flux(f, p, q)
	return phi / l, err
}

// AxialFlux returns the flux (Wb) through the disc of radius r at height z
// of an axisymmetric field: 2π r Aφ(r, z), exactly (Stokes' theorem on the
// disc's rim). Divided by π r² it is the mean Bz over the disc.
func AxialFlux(f Field, r, z float64) (float64, error) {
	a, err := potential(f, [2]float64{r, z}, "rim")
	return 2 * math.Pi * r * a, err
}

// TrapezoidFlux integrates the left-normal component of B over the samples
// of a profile by the trapezoid rule (Wb/m): the sampled counterpart of
// Flux, for checks and for fields that carry no potential. Every sample
// must lie inside the mesh; otherwise it returns an *EmptyError.
func TrapezoidFlux(ss []Sample) (float64, error) {
	in := 0
	for _, s := range ss {
		if s.Inside {
			in++
		}
	}
	if in != len(ss) || len(ss) < 2 {
		return 0, &EmptyError{Samples: len(ss), Inside: in}
	}
	var sum float64
	for k := 1; k < len(ss); k++ {
		sum += 0.5 * (ss[k].S - ss[k-1].S) * (ss[k].Bn() + ss[k-1].Bn())
	}
	return sum, nil
}
