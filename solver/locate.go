package solver

// locate finds the triangle containing (x, y) and the reference
// coordinates of the point in it, through the problem's Locator or a
// mesh.Locator built on first use and shared by the solutions of one
// Prepared (about constant time per query; safe for concurrent use).
func (s *Solution) locate(x, y float64) (t int, xi, eta float64, ok bool) {
	t32, _, b1, b2, ok := s.as.loc.get(s.as.m).Find(x, y)
	if !ok {
		return 0, 0, 0, false
	}
	return int(t32), b1, b2, true
}
