package force_test

import (
	"os"
	"testing"

	"polegap/models"
	"polegap/post/quantity/force"
	"polegap/post/study"
)

// BenchmarkPost times the post-processing of the bench dipole (default
// mesh): the stress force on the upper pole and arm (with a 2 mm slit in
// the back leg, as in the test) and the energies.
func BenchmarkPost(b *testing.B) {
	src, err := os.ReadFile("../../../models/examples/bench-dipole.yaml")
	if err != nil {
		b.Fatal(err)
	}
	m, err := models.Parse("bench-dipole.yaml", src)
	if err != nil {
		b.Fatal(err)
	}
	for i := range m.Regions {
		if m.Regions[i].Name == "back-leg" {
			for k := range m.Regions[i].Y {
				if m.Regions[i].Y[k] > 0 {
					m.Regions[i].Y[k] -= 2e-3
				}
			}
		}
	}
	s, err := study.Run(m, study.Options{})
	if err != nil {
		b.Fatal(err)
	}
	b.Logf("%d nodes", s.Disc.Mesh.NumNodes())
	part := []int32{2, 4} // upper-arm, upper-pole
	b.Run("Stress", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if _, err := force.Stress(s.Solution, part, force.StressOptions{}); err != nil {
				b.Fatal(err)
			}
		}
	})
	b.Run("Energies", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if _, _, err := study.Energies(s.Solution); err != nil {
				b.Fatal(err)
			}
		}
	})
}
