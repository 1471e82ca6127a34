package solver

import "polegap/mesh"

// locate finds the triangle containing (x, y) and the reference
// coordinates of the point in it, through a mesh.Locator built on first
// use (about constant time per query; safe for concurrent use).
func (s *Solution) locate(x, y float64) (t int, xi, eta float64, ok bool) {
	s.locOnce.Do(func() { s.loc = mesh.NewLocator(s.as.m) })
	t32, _, b1, b2, ok := s.loc.Find(x, y)
	if !ok {
		return 0, 0, 0, false
	}
	return int(t32), b1, b2, true
}
