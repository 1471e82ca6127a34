package materials

import (
	"fmt"
	"math"
)

// Material is what the finite-element solver needs of a material: its
// reluctivity ν = H/B in m/H at b2 = |B|² in T², and dν/db2. *Curve, Linear
// and Magnet implement it.
type Material interface {
	Nu(b2 float64) (nu, dnudb2 float64)
}

var (
	_ Material = (*Curve)(nil)
	_ Material = Linear{}
	_ Material = Magnet{}
)

// Linear is a material of constant relative permeability MuR: B = μ0 MuR H.
// The zero value (MuR = 0) means vacuum, MuR = 1.
type Linear struct {
	MuR float64
}

func (l Linear) mur() float64 {
	if l.MuR == 0 {
		return 1
	}
	return l.MuR
}

// Nu returns ν = 1/(μ0 MuR) and dν/db2 = 0. It panics if MuR is negative,
// NaN or infinite; check user input with Check.
func (l Linear) Nu(b2 float64) (nu, dnudb2 float64) {
	m := l.mur()
	if !(m > 0 && m <= math.MaxFloat64) {
		panic(errBadLinear)
	}
	return 1 / (Mu0 * m), 0
}

// Check reports whether MuR is usable: finite and positive (or 0 for vacuum).
func (l Linear) Check() error {
	m := l.mur()
	if !(m > 0 && m <= math.MaxFloat64) {
		return fmt.Errorf("materials: relative permeability %g: %w; give a finite mu_r > 0 (1 for air and copper)", l.MuR, ErrBadValue)
	}
	return nil
}

// Magnet is a permanent magnet on its linear recoil line (common practice
// for sintered rare-earth and hard ferrite magnets in their working range;
// see e.g. E. P. Furlani, "Permanent Magnet and Electromechanical Devices",
// 2001):
//
//	B = μ0 MuRecoil H + Br û,   û = (cos Direction, sin Direction),
//
// with Br = Remanence in T, MuRecoil the relative recoil permeability
// (zero means 1) and Direction the angle of magnetisation in radians from
// the x axis (the r axis in axisymmetric models), counter-clockwise.
// Inverted, H = ν (B - Br û) with ν = 1/(μ0 MuRecoil): the magnet behaves as
// a linear material of reluctivity ν with the source term ν Br û = Hc û,
// Hc = Br/(μ0 MuRecoil), entering the weak form as ∫ Hc û × ∇N (see
// Magnetization).
type Magnet struct {
	Remanence float64 // Br, T
	MuRecoil  float64 // relative recoil permeability; 0 means 1
	Direction float64 // radians, counter-clockwise from the x (or r) axis
}

func (m Magnet) mur() float64 {
	if m.MuRecoil == 0 {
		return 1
	}
	return m.MuRecoil
}

func (m Magnet) valid() bool {
	r := m.mur()
	return r > 0 && r <= math.MaxFloat64 && m.Remanence >= 0 && m.Remanence <= math.MaxFloat64 &&
		!math.IsNaN(m.Direction) && !math.IsInf(m.Direction, 0)
}

// Nu returns ν = 1/(μ0 MuRecoil) and 0. It panics on invalid fields; check
// user input with Check.
func (m Magnet) Nu(b2 float64) (nu, dnudb2 float64) {
	if !m.valid() {
		panic(errBadMagnet)
	}
	return 1 / (Mu0 * m.mur()), 0
}

// Magnetization returns the source vector of the magnet in A/m,
//
//	(mx, my) = Br/(μ0 MuRecoil) · (cos Direction, sin Direction),
//
// the H-field offset of the recoil line (its magnitude is the coercivity Hc
// of the linear model). In the planar Az formulation the magnet adds
// ∫ (mx ∂N/∂y - my ∂N/∂x) dΩ to the right-hand side of node function N,
// the term from ∫ ν (∇×A - Br û)·∇×(N ẑ) = 0. It panics on invalid fields.
func (m Magnet) Magnetization() (mx, my float64) {
	if !m.valid() {
		panic(errBadMagnet)
	}
	hc := m.Remanence / (Mu0 * m.mur())
	s, c := math.Sincos(m.Direction)
	return hc * c, hc * s
}

// Check reports whether the magnet's fields are usable.
func (m Magnet) Check() error {
	if !m.valid() {
		return fmt.Errorf("materials: magnet Br = %g T, mu_recoil = %g, direction = %g rad: %w; give a finite Br >= 0, mu_recoil > 0 (about 1.05 for sintered rare-earth magnets, from memory: typical values) and a finite direction",
			m.Remanence, m.MuRecoil, m.Direction, ErrBadValue)
	}
	return nil
}

// NuTo evaluates m.Nu at every b2[i], writing ν into nu[i] and dν/db2 into
// dnu[i], and returns the two slices. A destination that is nil or too short
// is replaced by a new slice of len(b2); otherwise it is resliced to
// len(b2). *Curve and Linear take fast paths without an interface call per
// point. NuTo allocates only when it grows a destination.
func NuTo(nu, dnu []float64, m Material, b2 []float64) ([]float64, []float64) {
	n := len(b2)
	if cap(nu) < n {
		nu = make([]float64, n)
	}
	if cap(dnu) < n {
		dnu = make([]float64, n)
	}
	nu, dnu = nu[:n], dnu[:n]
	switch m := m.(type) {
	case *Curve:
		for i, x := range b2 {
			nu[i], dnu[i] = m.Nu(x)
		}
	case Linear:
		v, _ := m.Nu(0)
		for i, x := range b2 {
			if x != x {
				panic(errNaNArgument)
			}
			nu[i], dnu[i] = v, 0
		}
	default:
		for i, x := range b2 {
			nu[i], dnu[i] = m.Nu(x)
		}
	}
	return nu, dnu
}
