package force

import (
	"fmt"
	"math"

	"polegap/mesh"
	"polegap/post/study"
	"polegap/solver"

	"polegap/internal/num"
	"polegap/models"
	"polegap/post/quantity/circuit"
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

// CoEnergy meshes and solves moved inside the outer boundary of orig (so
// that moving a part does not move the boundary, which the model file
// places relative to the regions' extent) and returns its co-energy (J,
// whole magnet), the quantity whose derivative at constant current is
// the force.
func CoEnergy(orig, moved *models.Model, opt study.Options) (float64, error) {
	d, err := discretize(orig, moved)
	if err != nil {
		return 0, err
	}
	p, err := study.Problem(d)
	if err != nil {
		return 0, err
	}
	sol, err := solver.Solve(p, opt.Solver)
	if err != nil {
		return 0, err
	}
	_, wco, err := circuit.Energies(sol)
	return wco, err
}

// discretize is study.Discretize with the outer boundary of orig.
func discretize(orig, m *models.Model) (*study.Discretization, error) {
	d := &study.Discretization{Model: m, Options: study.MeshOptions(m)}
	var err error
	if d.Boundary, err = study.Boundary(orig); err != nil {
		return nil, err
	}
	d.Input, err = mesh.BuildInput(study.Polygons(m), d.Boundary, mesh.GraphOptions{ChordTol: m.Mesh.Chord})
	if err != nil {
		return nil, fmt.Errorf("%s: moved part: %w", m.File, err)
	}
	if !study.Open(m) {
		if d.Mesh, err = mesh.Triangulate(d.Input, d.Options); err != nil {
			return nil, fmt.Errorf("%s: moved part: meshing: %w", m.File, err)
		}
		return d, nil
	}
	// The Kelvin disk of the open boundary, as prepare builds it, on the
	// circle of the unmoved model (prepare's formula: centred on the
	// extent, radius half its diagonal plus margin × largest side).
	opt := d.Options
	opt.Order = 1
	inner, err := mesh.Triangulate(d.Input, opt)
	if err != nil {
		return nil, fmt.Errorf("%s: moved part: meshing: %w", m.File, err)
	}
	xmin, ymin, xmax, ymax := orig.Extent()
	dx, dy := xmax-xmin, ymax-ymin
	r := 0.5*math.Hypot(dx, dy) + orig.Boundary.Margin*math.Max(dx, dy)
	k, err := mesh.AddKelvinDisk(inner, study.MarkerCircle, 0.5*(xmin+xmax), 0.5*(ymin+ymax), r, study.KelvinTag(m))
	if err != nil {
		return nil, fmt.Errorf("%s: moved part: open boundary: %w", m.File, err)
	}
	if d.Options.Order == 2 {
		k.ElevateKelvin()
	}
	d.Kelvin, d.Mesh = k, k.Mesh
	return d, nil
}

// VirtualWork returns the force component (N) along the unit vector of
// dir on the named regions, by the central difference of the co-energy
// with the regions moved by ±delta (m) along dir, each position meshed
// and solved afresh inside the unmoved model's outer boundary. It panics if delta is not positive or dir is zero.
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
		if w[k], err = CoEnergy(m, mm, opt); err != nil {
			return 0, err
		}
	}
	f := (w[0] - w[1]) / (2 * delta)
	if !num.Finite(f) {
		return 0, &NotFiniteError{Value: [2]float64{f, 0}}
	}
	return f, nil
}
