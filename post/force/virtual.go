package force

import (
	"math"

	"polegap/models"
	"polegap/post/circuit"
	"polegap/post/study"
)

// Moved returns a copy of m with the named regions translated by (dx, dy)
// metres; m is not modified. Refinement points and lines and probes stay
// where they are. It returns a *RegionError for an unknown name.
func Moved(m *models.Model, regions []string, dx, dy float64) (*models.Model, error) {
	c := *m
	c.Regions = append([]models.Region(nil), m.Regions...)
	for _, name := range regions {
		i := -1
		for k := range c.Regions {
			if c.Regions[k].Name == name {
				i = k
				break
			}
		}
		if i < 0 {
			return nil, &RegionError{Name: name}
		}
		r := &c.Regions[i]
		x, y := make([]float64, len(r.X)), make([]float64, len(r.Y))
		for k := range x {
			x[k], y[k] = r.X[k]+dx, r.Y[k]+dy
		}
		r.X, r.Y = x, y
	}
	return &c, nil
}

// CoEnergy meshes and solves m and returns its co-energy (J, whole
// magnet), the quantity whose derivative at constant current is the force.
func CoEnergy(m *models.Model, opt study.Options) (float64, error) {
	s, err := study.Run(m, opt)
	if err != nil {
		return 0, err
	}
	_, wco, err := circuit.Energies(s.Solution)
	return wco, err
}

// VirtualWork returns the force component (N) along the unit vector of
// dir on the named regions, by the central difference of the co-energy
// with the regions moved by ±delta (m) along dir, each position meshed
// and solved afresh. It panics if delta is not positive or dir is zero.
// Moving a region into another one is an error from the model's mesher.
func VirtualWork(m *models.Model, regions []string, dir [2]float64, delta float64, opt study.Options) (float64, error) {
	if !(delta > 0) || math.IsInf(delta, 0) {
		panic(errBadDelta)
	}
	n := math.Hypot(dir[0], dir[1])
	if !(n > 0) || math.IsInf(n, 0) {
		panic(errBadDir)
	}
	ux, uy := dir[0]/n, dir[1]/n
	var w [2]float64
	for k, s := range [2]float64{1, -1} {
		mm, err := Moved(m, regions, s*delta*ux, s*delta*uy)
		if err != nil {
			return 0, err
		}
		if w[k], err = CoEnergy(mm, opt); err != nil {
			return 0, err
		}
	}
	f := (w[0] - w[1]) / (2 * delta)
	if !finite(f) {
		return 0, &NotFiniteError{Value: [2]float64{f, 0}}
	}
	return f, nil
}
