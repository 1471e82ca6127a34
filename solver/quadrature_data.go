package solver

// Dunavant's symmetric rules on the triangle, degrees 1 to 6:
// D. A. Dunavant, "High degree efficient symmetrical Gaussian quadrature
// rules for the triangle", International Journal for Numerical Methods in
// Engineering 21 (1985) 1129-1148, Table I (degrees 1-6; 1, 3, 4, 6, 7 and
// 12 points). Each entry is one symmetry orbit: barycentric coordinates and
// the weight of each of its points (weights normalised to sum to 1).
//
// Generator: the values are the ones tabulated in the paper; TestRuleExactness
// checks every rule against the exact monomial integrals
// ∫ ξ^i η^j = i! j! / (i+j+2)! up to its degree, to 1e-14.
var dunavant = [MaxRuleDegree + 1][]orbit{
	1: {
		{[3]float64{1.0 / 3, 1.0 / 3, 1.0 / 3}, 1},
	},
	2: {
		{[3]float64{2.0 / 3, 1.0 / 6, 1.0 / 6}, 1.0 / 3},
	},
	3: {
		{[3]float64{1.0 / 3, 1.0 / 3, 1.0 / 3}, -27.0 / 48},
		{[3]float64{0.6, 0.2, 0.2}, 25.0 / 48},
	},
	4: {
		{[3]float64{0.108103018168070, 0.445948490915965, 0.445948490915965}, 0.223381589678011},
		{[3]float64{0.816847572980459, 0.091576213509771, 0.091576213509771}, 0.109951743655322},
	},
	5: {
		{[3]float64{1.0 / 3, 1.0 / 3, 1.0 / 3}, 0.225},
		{[3]float64{0.059715871789770, 0.470142064105115, 0.470142064105115}, 0.132394152788506},
		{[3]float64{0.797426985353087, 0.101286507323456, 0.101286507323456}, 0.125939180544827},
	},
	6: {
		{[3]float64{0.501426509658179, 0.249286745170910, 0.249286745170910}, 0.116786275726379},
		{[3]float64{0.873821971016996, 0.063089014491502, 0.063089014491502}, 0.050844906370207},
		{[3]float64{0.053145049844817, 0.310352451033784, 0.636502499121399}, 0.082851075618374},
	},
}
