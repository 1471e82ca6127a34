package models

import "math"

// The solenoid template: an axisymmetric winding, r = x, z = y, z = 0 at the
// winding's mid-plane. Lengths in the model's units:
//
//	   z                                   yoke-thickness
//	   ^                                      |<->|
//	   +---------------------------------------+  -  zo = length/2 + clearance + yoke-thickness
//	   |  upper-pole  |        yoke (end plate)|
//	   |  (r <= bore- +------------------+     |  -  zi = length/2 + clearance
//	   |   radius)    |                  |     |
//	   |              |  +-----------+   |     |  -  length/2
//	   +--------------+  |           |   |yoke |
//	   :  pole-gap       |  winding  |   |shell|
//	0 -:- - - - - - - - -|           |- -|- - -|- -  mid-plane
//	   +--------------+  |           |   |     |
//	   |  lower-pole  |  +-----------+   |     |  - -length/2
//	   ... (mirror)
//	   |<-- inner-radius -->|<-thickness->|<- clearance
//	 axis r = 0
//
// The winding is always there. yoke-thickness > 0 adds an iron return yoke
// (a shell and two end plates with a hole of bore-radius, default
// inner-radius, clearance from the winding, default thickness/10);
// pole-gap > 0 (needs a yoke) fills the holes with cylindrical pole pieces
// whose faces are pole-gap apart. The winding carries turns conductors of
// current each, positive along +φ, which drives the field along +z.
var solenoidKeys = []string{"inner-radius", "thickness", "length", "clearance", "yoke-thickness", "bore-radius",
	"pole-gap", "turns", "current", "field", "steel"}

func expandSolenoid(m *Model, t *dims, x *expansion) {
	d := t.d
	ri := t.length("inner-radius", 0, true, false)
	th := t.length("thickness", 0, true, false)
	l := t.length("length", 0, true, false)
	clr := t.length("clearance", th/10, false, true)
	ty := t.length("yoke-thickness", 0, false, true)
	rb := t.length("bore-radius", ri, false, true)
	pg := t.length("pole-gap", 0, false, true)
	turns := t.number("turns", true, true, "<conductors in the winding section>")
	current := t.number("current", true, false, "<ampere per conductor>")
	steel := ""
	if ty > 0 {
		steel = t.steel(m, x)
	} else {
		for _, k := range []string{"bore-radius", "pole-gap", "steel"} {
			if t.f.get(k) != nil {
				t.misfit(k, "%s needs a return yoke; add yoke-thickness: <length> or remove %s", k, k)
			}
		}
	}
	if !t.ok {
		return
	}
	tol := relTol * (ri + th + l + ty)
	zi, zo := l/2+clr, l/2+clr+ty
	ro := ri + th + clr
	if ty > 0 {
		if rb > ro-tol {
			t.misfit("bore-radius", "bore-radius (%s) must be smaller than the yoke shell's inner radius (%s)", d.fmtLen(rb), d.fmtLen(ro))
		}
		if pg > 0 {
			if rb == 0 {
				t.misfit("pole-gap", "pole pieces fill the end-plate hole, so bore-radius must be greater than zero")
			}
			if rb > ri+tol {
				t.misfit("bore-radius", "with pole pieces, bore-radius (%s) must not exceed the winding's inner-radius (%s)", d.fmtLen(rb), d.fmtLen(ri))
			}
			if pg/2 >= zi-tol {
				t.misfit("pole-gap", "pole-gap (%s) must be shorter than the space between the end plates (%s)", d.fmtLen(pg), d.fmtLen(2*zi))
			}
		}
	}
	if !t.ok {
		return
	}
	x.regions = append(x.regions, t.rect("winding", "copper", ri, -l/2, ri+th, l/2))
	x.coils = append(x.coils, Coil{Name: "main", Turns: turns, Current: current, Pos: t.at,
		Sides: []CoilSide{{Region: "winding", Sense: 1, Pos: t.at}}})
	if ty > 0 {
		x.regions = append(x.regions, t.poly("yoke", steel,
			[]float64{rb, ro + ty, ro + ty, rb, rb, ro, ro, rb},
			[]float64{-zo, -zo, zo, zo, zi, zi, -zi, -zi}))
		if pg > 0 {
			up := t.poly("upper-pole", steel, []float64{0, rb, rb, rb, 0}, []float64{pg / 2, pg / 2, zi, zo, zo})
			x.regions = append(x.regions, up, mirrorY(up, "lower-pole"))
			for _, s := range []float64{1, -1} {
				x.refine = append(x.refine, t.refinePoint(rb, s*pg/2, pg/20))
			}
		}
	}
	// Good-field box: half the bore each way; between pole pieces, a
	// quarter of the pole gap axially and out to one gap from the pole edge
	// (common practice), at least half the pole radius.
	hr, hz := ri/2, ri/2
	if ty > 0 && pg > 0 {
		hr, hz = math.Max(rb-pg, rb/2), pg/4
	}
	x.probes = append(x.probes,
		t.point("centre", 0, 0),
		t.line("axis", 0, -l, 0, l),
		t.box("good-field", 0, -hz, hr, hz))
	x.refine = append(x.refine, Refine{Near: "winding", Size: th / 4, Pos: t.at})
	if ty > 0 && pg > 0 {
		x.gap = pg
	}
	t.target(x, "centre")
}
