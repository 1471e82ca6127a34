package gap

import "testing"

// BenchmarkProfile samples 1001 points across the C-core gap (P2 field,
// point location plus element evaluation per sample).
func BenchmarkProfile(b *testing.B) {
	s := cCore(b, 2)
	dst := make([]Sample, 1001)
	b.ReportAllocs()
	for b.Loop() {
		dst = ProfileTo(dst, s, [2]float64{0.12, 0.1}, [2]float64{0.26, 0.1}, 1001)
	}
}

// BenchmarkFringing reads the fringing of the C-core gap (two potential
// look-ups and two field look-ups).
func BenchmarkFringing(b *testing.B) {
	s := cCore(b, 2)
	opt := FringeOptions{Gap: 0.002, PoleWidth: 0.05, AmpereTurns: 1000}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Fringing(s, [2]float64{0.12, 0.1}, [2]float64{0.26, 0.1}, 0.61, opt); err != nil {
			b.Fatal(err)
		}
	}
}
