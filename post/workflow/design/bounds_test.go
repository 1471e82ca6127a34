package design

import (
	"context"
	"math"
	"strings"
	"testing"

	"polegap/models"
)

// The co-energy bounds on the bench dipole at the default accuracy: with
// its steel replaced by a linear one (μr = 1000) they are rigorous, hold
// the stored energy the vector potential gives (its lower end) and, as
// W = ½LI² for a linear circuit, the coil's apparent inductance; with the
// nonlinear steel (asked for) they bracket the co-energy. The gap is far
// below the accuracy the adaptive run was asked for (1e-3): the bounds
// say how far the energy can be trusted without a second mesh.
func TestDesignBounds(t *testing.T) {
	src, err := models.Example("bench-dipole")
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		name, steel string
		mode        BoundsMode
	}{
		{"linear", "yoke-steel: {mu-r: 1000}", LinearBounds},
		{"nonlinear", "yoke-steel: {curve: low-carbon-steel}", AllBounds},
	} {
		text := strings.Replace(string(src), "yoke-steel: {curve: low-carbon-steel}", c.steel, 1)
		m, err := models.Parse("bench-dipole.yaml", []byte(text))
		if err != nil {
			t.Fatal(err)
		}
		fine, _, _, err := SolveAccurate(context.Background(), m, SolveOptions{})
		if err != nil {
			t.Fatal(err)
		}
		d := NewDesign(fine, DesignOptions{StressOnly: true, NoPoleForce: true, Bounds: c.mode})
		b := d.Energy.Bounds
		if b == nil {
			t.Fatalf("%s: no bounds; notes %q", c.name, d.Notes)
		}
		gap := (b.Upper - b.Lower) / b.Lower
		t.Logf("%s: co-energy in [%.8g, %.8g] J (gap %.2g), W' %.8g J, guaranteed %v %s", c.name, b.Lower, b.Upper, gap, d.Energy.CoEnergy, b.Guaranteed, b.Note)
		if w := d.Energy.CoEnergy; w < b.Lower*(1-1e-6) || w > b.Upper || gap > 1e-3 {
			t.Errorf("%s: W' %g J against [%g, %g]", c.name, w, b.Lower, b.Upper)
		}
		if c.mode == LinearBounds {
			if !b.Guaranteed || b.InductanceH == nil || len(d.Coils) != 1 {
				t.Fatalf("%s: %+v", c.name, b)
			}
			if l := d.Coils[0].Apparent; l < b.InductanceH[0]*(1-1e-6) || l > b.InductanceH[1] || math.Abs(d.Energy.Energy-d.Energy.CoEnergy) > 1e-9*d.Energy.Energy {
				t.Errorf("%s: L %g H against [%g, %g]", c.name, l, b.InductanceH[0], b.InductanceH[1])
			}
		} else if b.Guaranteed || b.InductanceH != nil {
			t.Errorf("%s: %+v", c.name, b)
		}
		if NewDesign(fine, DesignOptions{StressOnly: true, NoPoleForce: true, Bounds: LinearBounds}).Energy.Bounds != nil && c.mode == AllBounds {
			t.Errorf("%s: LinearBounds computed bounds for a nonlinear model", c.name)
		}
	}
}
