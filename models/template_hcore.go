package models

// The h-core template: a planar H-frame dipole, symmetric about x = 0 (the
// pole centre) and y = 0 (the gap's mid-plane). Two side legs close the flux
// path on both sides, so the field is symmetric and the frame does not open
// under the pole force. Lengths in the model's units:
//
//	     leg-width  window-width  pole-width  window-width  leg-width
//	     |<------>|<---------->|<---------->|<---------->|<------>|
//	yt - +----------------------------------------------------------+
//	     |                       upper-yoke                          | yoke-thickness
//	yr - +--------+------------+------------+------------+--------+
//	     |        | [coil-u-l] |  upper-    | [coil-u-r] |        |
//	     |  left- |            |  pole      |            | right- |  pole-height
//	g/2 -|  leg   |            +---face-----+            |  leg   |
//	  0 -|        |            :    gap     :            |        |
//	     |        |            +------------+            |        |
//	     |        | [coil-l-l]   lower-pole   [coil-l-r] |        |
//	-yr -+--------+------------+------------+------------+--------+
//	     |                       lower-yoke                          |
//	-yt -+----------------------------------------------------------+
//
// The poles have pole-face-width and chamfer as in c-core. The coil has four
// sides, coil-width × coil-height, hanging from the yokes beside the poles
// with clearance; each side carries turns conductors, so the two pole coils
// in series give 2·turns·current ampere-turns, driving the gap field along +y.
var hCoreKeys = []string{"gap", "pole-width", "pole-height", "pole-face-width", "chamfer", "yoke-thickness",
	"leg-width", "window-width", "coil-width", "coil-height", "clearance", "turns", "current", "field", "steel",
	"shim-height", "shim-width", "shim-shape", "shim-min"}

func expandHCore(m *Model, t *dims, x *expansion) {
	d := t.d
	g := t.gap()
	x.gap = g
	wp := t.length("pole-width", 0, true, false)
	hp := t.length("pole-height", 0, true, false)
	ty := t.length("yoke-thickness", 0, true, false)
	wl := t.length("leg-width", 0, true, false)
	ww := t.length("window-width", 0, true, false)
	wf := t.length("pole-face-width", wp, false, false)
	c := t.length("chamfer", 0, false, true)
	cw := t.length("coil-width", 0, true, false)
	ch := t.length("coil-height", 0, true, false)
	clr := t.length("clearance", cw/10, false, true)
	turns := t.number("turns", true, true, "<conductors in each coil side>")
	current := t.number("current", true, false, "<ampere per conductor>")
	steel := t.steel(m, x)
	if !t.ok {
		return
	}
	tol := relTol * (wl + ww + wp + g + hp + ty)
	t.poleFit(wp, hp, wf, c, tol)
	sh := t.shim(x, g, wf-2*c, tol)
	if cw+2*clr > ww+tol {
		t.misfit("coil-width", "a coil side in the window needs coil-width + 2·clearance = %s, but window-width is %s", d.fmtLen(cw+2*clr), d.fmtLen(ww))
	}
	if ch+clr > hp+tol {
		t.misfit("coil-height", "coil-height + clearance = %s exceeds pole-height (%s)", d.fmtLen(ch+clr), d.fmtLen(hp))
	}
	if !t.ok {
		return
	}
	g2, yr, yt := g/2, g/2+hp, g/2+hp+ty
	x0, x1 := -wp/2, wp/2
	xo := wp/2 + ww + wl // outer face of the right leg
	x.regions = append(x.regions,
		t.rect("left-leg", steel, -xo, -yr, -xo+wl, yr),
		t.rect("right-leg", steel, xo-wl, -yr, xo, yr))
	up := t.poly("upper-yoke", steel,
		[]float64{-xo, -xo + wl, x0, x1, xo - wl, xo, xo, -xo},
		[]float64{yr, yr, yr, yr, yr, yr, yt, yt})
	x.regions = append(x.regions, up, mirrorY(up, "lower-yoke"))
	x.regions = append(x.regions, t.poles(steel, x0, x1, wf, c, g2, yr, sh)...)
	coil := Coil{Name: "main", Turns: turns, Current: current, Pos: t.at}
	t.poleCoils(x, &coil, x0, x1, yr, cw, ch, clr)
	x.coils = append(x.coils, coil)
	x.probes = append(x.probes, t.gapProbes(0, wp, wf, g)...)
	t.poleRefine(x, -wf/2+c, wf/2-c, g, sh)
	t.target(x, "gap-centre")
}
