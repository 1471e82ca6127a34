package force_test

import (
	"math"
	"os"
	"testing"

	"polegap/models"
	"polegap/post/quantity/force"
)

// TestBenchDipoleStressVsVirtualWork compares the two methods on the
// bench dipole example (models/examples/bench-dipole.yaml, nonlinear
// low-carbon steel near 1 T in the gap): the force pulling the upper arm
// and pole towards the gap. The back leg is shortened by a SLIT mm air
// slit, and the gap's air region is dropped, so that the upper half is a separate part with air all round
// (the stress method's condition) that can be moved for the virtual work.
// Both are the same physical force, the derivative of the co-energy at
// constant current (Coulomb 1983, IEEE Trans. Magn. 19(6)); with the
// virtual displacement on the deformed mesh they differ only by how the
// field's discretisation error falls on a narrow band and on all the air
// around the part (measured 4e-5); 1e-3 bounds it with room (the 2 % the
// project first asked allowed for re-meshing noise).
func TestBenchDipoleStressVsVirtualWork(t *testing.T) {
	if testing.Short() {
		t.Skip("three nonlinear solves of the bench dipole")
	}
	const slit = 2e-3
	src, err := os.ReadFile("../../../models/examples/bench-dipole.yaml")
	if err != nil {
		t.Fatal(err)
	}
	m, err := models.Parse("bench-dipole.yaml", src)
	if err != nil {
		t.Fatal(err)
	}
	m.Mesh.Size = 0.030
	// The gap's own air region only steers the mesh; it would overlap
	// the moved pole.
	for i := range m.Regions {
		if m.Regions[i].Name == "gap" {
			m.Regions = append(m.Regions[:i], m.Regions[i+1:]...)
			break
		}
	}
	leg := &m.Regions[tagOf(t, m, "back-leg")-1]
	for k := range leg.Y {
		if leg.Y[k] > 0 {
			leg.Y[k] -= slit
		}
	}
	s := run(t, m)
	part := []int32{tagOf(t, m, "upper-arm"), tagOf(t, m, "upper-pole")}
	f, err := force.Stress(s.Solution, part, force.StressOptions{})
	if err != nil {
		t.Fatal(err)
	}
	w, err := force.VirtualWork(s, []string{"upper-arm", "upper-pole"}, [2]float64{0, 1}, force.VirtualWorkOptions{})
	if err != nil {
		t.Fatal(err)
	}
	fv := w.F
	t.Logf("stress F = %v N (band %g m, %d elements), virtual work Fy = %g N", f.F, f.Band, f.Elements, fv)
	if f.F[1] >= 0 {
		t.Errorf("stress Fy = %g N: the upper half should be pulled down", f.F[1])
	}
	if e := math.Abs(f.F[1]-fv) / math.Abs(fv); e > 1e-3 {
		t.Errorf("stress Fy = %g N, virtual work %g N: differ by %.2g", f.F[1], fv, e)
	}
}
