package probes_test

import (
	"math"
	"testing"

	"polegap/post/internal/fixture"
	"polegap/post/study"
	"polegap/post/study/probes"
)

const mu0 = 4e-7 * math.Pi // H/m, the SI value before 2019 (within 1e-9 of today's)

// TestProbeOnInterface puts point probes exactly on the faces of a block
// of linear iron (fixture.Block) and checks that each reports both sides,
// with the air side's value as the probe's, and that the two sides obey
// the interface conditions of magnetostatics without surface current:
// B·n continuous and H×n continuous (J. D. Jackson, Classical
// Electrodynamics, 3rd ed. 1998, section 5.9). Second order: B·n is
// continuous to rounding (conforming elements share A's trace on the
// edge, and B·n is its tangential derivative), H×n only weakly, to the
// discretisation error (measured 1e-4 on the top face and 5e-3 on the
// side, 17 mm from a corner, relative to |H| in air, on the 5 mm mesh).
// First order reads the recovered field, averaged over each region's own
// elements, first-order accurate at an interface (measured up to 0.12 for
// B·n and 0.07 for H×n on the 5 mm mesh).
func TestProbeOnInterface(t *testing.T) {
	for _, c := range []struct {
		mur    float64
		order  int
		bn, ht float64 // tolerances relative to |B| and |H| in air
	}{{10, 2, 1e-10, 1e-2}, {1000, 2, 1e-10, 1e-2}, {1000, 1, 0.2, 0.1}} {
		r, err := study.Run(fixture.Block(t, c.mur, 5, c.order), study.Options{})
		if err != nil {
			t.Fatal(err)
		}
		for _, p := range r.Probes {
			if p.Name == "air" {
				if len(p.Sides) != 0 {
					t.Errorf("μr %g P%d: probe in air reports sides %+v", c.mur, c.order, p.Sides)
				}
				continue
			}
			if len(p.Sides) != 2 {
				t.Errorf("μr %g P%d %s: %d sides, want 2", c.mur, c.order, p.Name, len(p.Sides))
				continue
			}
			n := [2]float64{0, 1} // top face
			if p.Name == "side" {
				n = [2]float64{1, 0}
			}
			k := probes.Reported(p.Sides)
			air, iron := p.Sides[k], p.Sides[1-k]
			if air.Region != study.AirTag || iron.Region != study.Tag(0) {
				t.Errorf("μr %g P%d %s: reported region %d, other %d; want air (%d) reported", c.mur, c.order, p.Name, air.Region, iron.Region, study.AirTag)
			}
			if p.Point.Bx != air.Bx || p.Point.By != air.By {
				t.Errorf("μr %g P%d %s: probe reads (%g, %g) T, air side (%g, %g) T", c.mur, c.order, p.Name, p.Point.Bx, p.Point.By, air.Bx, air.By)
			}
			if e := math.Abs(iron.Nu*mu0*c.mur - 1); e > 1e-12 {
				t.Errorf("μr %g P%d %s: iron side ν μ0 μr = %g", c.mur, c.order, p.Name, iron.Nu*mu0*c.mur)
			}
			bn := func(s [2]float64) float64 { return s[0]*n[0] + s[1]*n[1] }
			ht := func(s [2]float64) float64 { return s[1]*n[0] - s[0]*n[1] }
			ba, bi := [2]float64{air.Bx, air.By}, [2]float64{iron.Bx, iron.By}
			b := math.Hypot(air.Bx, air.By)
			dbn := math.Abs(bn(ba)-bn(bi)) / b
			dht := math.Abs(air.Nu*ht(ba)-iron.Nu*ht(bi)) / (air.Nu * b)
			t.Logf("μr %g P%d %s: B·n %.6g | %.6g T (%.2g), H×n %.6g | %.6g A/m (%.2g)", c.mur, c.order, p.Name,
				bn(ba), bn(bi), dbn, air.Nu*ht(ba), iron.Nu*ht(bi), dht)
			if dbn > c.bn {
				t.Errorf("μr %g P%d %s: B·n jumps by %.2g of |B| (tolerance %g)", c.mur, c.order, p.Name, dbn, c.bn)
			}
			if dht > c.ht {
				t.Errorf("μr %g P%d %s: H×n jumps by %.2g of |H| (tolerance %g)", c.mur, c.order, p.Name, dht, c.ht)
			}
			// The tangential B is μr times larger in the iron.
			if !(math.Abs(ht(bi)) > math.Abs(ht(ba))) {
				t.Errorf("μr %g P%d %s: tangential B %g T in iron, %g T in air", c.mur, c.order, p.Name, ht(bi), ht(ba))
			}
		}
	}
}
