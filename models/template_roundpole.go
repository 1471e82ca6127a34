package models

// The round-pole template: an axisymmetric dipole with two cylindrical
// poles, a coil around each, end plates and a cylindrical return shell, all
// turned about the pole axis (r = x, z = y; z = 0 is the gap's mid-plane).
// Lengths in the model's units:
//
//	 z
//	 ^         pole-diameter/2   window-width   return-thickness
//	 |<---------------->|<-------------->|<----->|
//	 +-----------------------------------------+  - zt = zr + plate-thickness
//	 |               upper-plate                |
//	 +------------------+--------------+-------+  - zr = gap/2 + pole-height
//	 |   upper-pole     | [upper-coil] |       |
//	 |                  |              |return-|
//	 +--face--------+--+               | yoke  |  - gap/2
//	 :     gap      :                  |       |
//	-:- - - - - - - : - - - - - - - - -|- - - -|-  mid-plane
//	 +--------------+--+               |       |
//	 |   lower-pole (mirror)  [lower-coil]     |
//	 ... (mirror)
//	axis r = 0
//
// The pole face has radius pole-face-diameter/2 (default the pole's; smaller
// gives a conical taper) with a chamfer of length chamfer cut along the side
// at its edge. Each coil is coil-width (radial) × coil-height (axial), hung
// from the plate with clearance beside the pole; both carry turns conductors
// along +φ for a positive current, driving the gap field along +z, so the
// coil "main" gives 2·turns·current ampere-turns around the gap.
var roundPoleKeys = []string{"gap", "pole-diameter", "pole-face-diameter", "pole-height", "chamfer", "plate-thickness",
	"window-width", "return-thickness", "coil-width", "coil-height", "clearance", "turns", "current", "field", "steel"}

func expandRoundPole(m *Model, t *dims, x *expansion) {
	d := t.d
	g := t.gap()
	x.gap = g
	rp := t.length("pole-diameter", 0, true, false) / 2
	rf := t.length("pole-face-diameter", 2*rp, false, false) / 2
	hp := t.length("pole-height", 0, true, false)
	c := t.length("chamfer", 0, false, true)
	tp := t.length("plate-thickness", 0, true, false)
	ww := t.length("window-width", 0, true, false)
	ts := t.length("return-thickness", 0, true, false)
	cw := t.length("coil-width", 0, true, false)
	ch := t.length("coil-height", 0, true, false)
	clr := t.length("clearance", cw/10, false, true)
	turns := t.number("turns", true, true, "<conductors in each coil>")
	current := t.number("current", true, false, "<ampere per conductor>")
	steel := t.steel(m, x)
	if !t.ok {
		return
	}
	tol := relTol * (rp + ww + ts + g + hp + tp)
	if rf > rp+tol {
		t.misfit("pole-face-diameter", "pole-face-diameter (%s) must not exceed pole-diameter (%s)", d.fmtLen(2*rf), d.fmtLen(2*rp))
	}
	if c >= rf-tol {
		t.misfit("chamfer", "chamfer (%s) must be smaller than the face radius (%s)", d.fmtLen(c), d.fmtLen(rf))
	}
	if cw+2*clr > ww+tol {
		t.misfit("coil-width", "a coil beside the pole needs coil-width + 2·clearance = %s, but window-width is %s", d.fmtLen(cw+2*clr), d.fmtLen(ww))
	}
	if ch+clr > hp+tol {
		t.misfit("coil-height", "coil-height + clearance = %s exceeds pole-height (%s)", d.fmtLen(ch+clr), d.fmtLen(hp))
	}
	if !t.ok {
		return
	}
	g2, zr := g/2, g/2+hp
	zt := zr + tp
	rs, ro := rp+ww, rp+ww+ts // return shell inner and outer radius

	ux, uy := sideStep(rf, g2, rp, zr, c)
	px, py := dropDuplicates([]float64{0, rf - c, ux, rp, 0}, []float64{g2, g2, uy, zr, zr})
	up := t.poly("upper-pole", steel, px, py)
	plate := t.poly("upper-plate", steel, []float64{0, rp, rs, ro, ro, 0}, []float64{zr, zr, zr, zr, zt, zt})
	x.regions = append(x.regions, up, mirrorY(up, "lower-pole"),
		plate, mirrorY(plate, "lower-plate"),
		t.rect("return-yoke", steel, rs, -zr, ro, zr),
		t.rect("gap", "air", 0, -g2, rf-c, g2))
	coil := Coil{Name: "main", Turns: turns, Current: current, Pos: t.at}
	t.coilSide(x, &coil, "upper-coil", +1, rp+clr, zr-clr-ch, rp+clr+cw, zr-clr)
	t.coilSide(x, &coil, "lower-coil", +1, rp+clr, -zr+clr, rp+clr+cw, -zr+clr+ch)
	x.coils = append(x.coils, coil)

	hw := rf - g // good field to one gap from the face edge (common practice), at least half the face radius
	if hw < rf/2 {
		hw = rf / 2
	}
	x.probes = append(x.probes,
		t.point("gap-centre", 0, 0),
		t.line("midplane", 0, 0, rp, 0),
		t.box("good-field", 0, -g/4, hw, g/4))
	x.refine = append(x.refine, Refine{Near: "gap", Size: g / 10, Pos: t.at},
		t.refinePoint(rf-c, g2, g/20), t.refinePoint(rf-c, -g2, g/20))
	t.target(x, "gap-centre")
}
