package models

import "math"

// The c-core template: a planar C-shaped dipole yoke. y = 0 is the gap's
// mid-plane and x = 0 the outer face of the back leg. Lengths in the
// model's units:
//
//	       0    leg-width     window-width      pole-width
//	       |<--------->|<----------------->|<------------->|
//	  yt - +-------------------------------------------------+ -
//	       |                 upper-arm                       | arm-thickness
//	  yr - +-----------+-------------------+-----------------+ -
//	       |           |                    \  upper-pole   /  pole-height
//	       |           |                     |             |   (taper to
//	       | back-leg  |      window         +-+  face   +-+    pole-face-width,
//	 g/2 - |           |                        +-------+       chamfer at
//	   0 - |           |                        :  gap  :  gap  the face corners)
//	-g/2 - |           |                        +-------+
//	       |           |                     lower-pole (mirror)
//	 -yr - +-----------+-------------------+-----------------+
//	       |                 lower-arm                       |
//	 -yt - +-------------------------------------------------+
//
// yr = gap/2 + pole-height, yt = yr + arm-thickness. The pole root spans the
// full pole-width at the arm; the face is pole-face-width wide (default
// pole-width; smaller gives a straight taper), centred on the root, with
// 45°-style chamfers of length chamfer cut along the sides at its corners.
//
// coil: back-leg puts coil-left outside the back leg and coil-right in the
// window, each coil-width by coil-height, centred on y = 0, clearance from
// the iron. coil: poles puts four sides around the two poles (coil-upper-left,
// coil-upper-right, coil-lower-left, coil-lower-right), hanging from the arms
// with clearance. Senses are chosen so a positive current drives the gap
// field along +y. Each side carries turns conductors; with coil: poles the
// two pole coils are in series, giving 2·turns·current ampere-turns.
var cCoreKeys = []string{"gap", "pole-width", "pole-height", "pole-face-width", "chamfer", "arm-thickness",
	"leg-width", "window-width", "coil", "coil-width", "coil-height", "clearance", "turns", "current", "field", "steel",
	"shim-height", "shim-width", "shim-shape", "shim-min"}

var cCoreCoils = []string{"back-leg", "poles"}

func expandCCore(m *Model, t *dims, x *expansion) {
	d := t.d
	g := t.gap()
	x.gap = g
	wp := t.length("pole-width", 0, true, false)
	hp := t.length("pole-height", 0, true, false)
	ta := t.length("arm-thickness", 0, true, false)
	wl := t.length("leg-width", 0, true, false)
	ww := t.length("window-width", 0, true, false)
	wf := t.length("pole-face-width", wp, false, false)
	c := t.length("chamfer", 0, false, true)
	cw := t.length("coil-width", 0, true, false)
	ch := t.length("coil-height", 0, true, false)
	clr := t.length("clearance", cw/10, false, true)
	turns := t.number("turns", true, true, "<conductors in each coil side>")
	current := t.number("current", true, false, "<ampere per conductor>")
	place := "back-leg"
	if v := t.f.get("coil"); v != nil {
		var ok bool
		if place, ok = d.enum(v, t.f.sub("coil"), "coil placement", cCoreCoils); !ok {
			t.ok = false
		}
	}
	steel := t.steel(m, x)
	if !t.ok {
		return
	}

	// Fit checks, with the relative tolerance used elsewhere.
	tol := relTol * (wl + ww + wp + g + hp + ta)
	t.poleFit(wp, hp, wf, c, tol)
	sh := t.shim(x, g, wf-2*c, tol)
	g2, yr := g/2, g/2+hp
	x0, x1 := wl+ww, wl+ww+wp
	xc := (x0 + x1) / 2
	xl, xr := xc-wf/2, xc+wf/2
	switch place {
	case "back-leg":
		if cw+2*clr > ww+tol {
			t.misfit("coil-width", "the coil side in the window needs coil-width + 2·clearance = %s, but window-width is %s", d.fmtLen(cw+2*clr), d.fmtLen(ww))
		}
		if ch+2*clr > 2*yr+tol {
			t.misfit("coil-height", "coil-height + 2·clearance = %s exceeds the back leg between the arms (gap + 2·pole-height = %s)", d.fmtLen(ch+2*clr), d.fmtLen(2*yr))
		}
	case "poles":
		if cw+2*clr > ww+tol {
			t.misfit("coil-width", "the pole coil side in the window needs coil-width + 2·clearance = %s, but window-width is %s", d.fmtLen(cw+2*clr), d.fmtLen(ww))
		}
		if ch+clr > hp+tol {
			t.misfit("coil-height", "coil-height + clearance = %s exceeds pole-height (%s)", d.fmtLen(ch+clr), d.fmtLen(hp))
		}
	}
	if !t.ok {
		return
	}

	yt := yr + ta
	x.regions = append(x.regions,
		t.rect("back-leg", steel, 0, -yr, wl, yr))
	upperArm := t.poly("upper-arm", steel, []float64{0, wl, x0, x1, x1, 0}, []float64{yr, yr, yr, yr, yt, yt})
	x.regions = append(x.regions, upperArm, mirrorY(upperArm, "lower-arm"))

	x.regions = append(x.regions, t.poles(steel, x0, x1, wf, c, g2, yr, sh)...)

	coil := Coil{Name: "main", Turns: turns, Current: current, Pos: t.at}
	switch place {
	case "back-leg":
		t.coilSide(x, &coil, "coil-left", -1, -clr-cw, -ch/2, -clr, ch/2)
		t.coilSide(x, &coil, "coil-right", +1, wl+clr, -ch/2, wl+clr+cw, ch/2)
	case "poles":
		t.poleCoils(x, &coil, x0, x1, yr, cw, ch, clr)
	}
	x.coils = append(x.coils, coil)

	x.probes = append(x.probes, t.gapProbes(xc, wp, wf, g)...)
	t.poleRefine(x, xl+c, xr-c, g, sh)
	t.target(x, "gap-centre")
}

// gap reads the required, positive dimension "gap".
func (t *dims) gap() float64 {
	v := t.f.get("gap")
	if v == nil {
		t.misfit("gap", "template %s needs dimension \"gap\": the distance between the pole faces", t.name)
		return 0
	}
	x, ok := t.d.number(v, t.f.sub("gap"))
	if !ok {
		t.ok = false
		return 0
	}
	if x <= 0 {
		t.misfit("gap", "gap is %s: the pole faces must stand apart, so gap must be greater than zero", v.Value)
		return 0
	}
	return t.d.m(x)
}

// poleFit checks that a pole of root width wp, height hp, face width wf and
// chamfer c can be built.
func (t *dims) poleFit(wp, hp, wf, c, tol float64) {
	d := t.d
	if wf > wp+tol {
		t.misfit("pole-face-width", "pole-face-width (%s) must not exceed pole-width (%s)", d.fmtLen(wf), d.fmtLen(wp))
	}
	side := math.Hypot((wp-wf)/2, hp) // length of a pole side
	if 2*c >= wf-tol {
		t.misfit("chamfer", "two chamfers (2 × %s) must be narrower than the pole face (%s)", d.fmtLen(c), d.fmtLen(wf))
	} else if c >= side-tol {
		t.misfit("chamfer", "chamfer (%s) must be shorter than the pole side (%s)", d.fmtLen(c), d.fmtLen(side))
	}
}

// poles returns the upper and lower pole pieces between x0 and x1 (root
// width) with a face pole-face-width wf wide, chamfered by c, faces at
// y = ±g2 and roots at ±yr, shimmed at the face edges by sh, and the air
// region "gap" between the faces (notched by the shims).
func (t *dims) poles(steel string, x0, x1, wf, c, g2, yr float64, sh shim) []Region {
	xc := (x0 + x1) / 2
	xl, xr := xc-wf/2, xc+wf/2
	// Upper pole, counter-clockwise from the face's left end.
	ux, uy := sideStep(xr, g2, x1, yr, c)
	vx, vy := sideStep(xl, g2, x0, yr, c)
	fx, fy := sh.face(xl+c, xr-c, g2)
	if sh.h > 0 {
		// The shims' outer sides rise to the face level at the chamfers.
		fx = append(append([]float64{xl + c}, fx...), xr-c)
		fy = append(append([]float64{g2}, fy...), g2)
	}
	px, py := dropDuplicates(
		append(fx, ux, x1, x0, vx),
		append(fy, uy, yr, yr, vy))
	up := t.poly("upper-pole", steel, px, py)
	gap := t.rect("gap", "air", xl+c, -g2, xr-c, g2)
	if sh.h > 0 {
		// Lower face left to right, then the upper face right to left.
		lx, ly := sh.face(xl+c, xr-c, g2)
		gx, gy := make([]float64, 0, 2*len(lx)), make([]float64, 0, 2*len(lx))
		for i := range lx {
			gx, gy = append(gx, lx[i]), append(gy, -ly[i])
		}
		for i := len(lx) - 1; i >= 0; i-- {
			gx, gy = append(gx, lx[i]), append(gy, ly[i])
		}
		gap = t.poly("gap", "air", gx, gy)
	}
	return []Region{up, mirrorY(up, "lower-pole"), gap}
}

// poleRefine asks for fine elements in the gap (gap/10) and at the four
// corners xa, xb of the flat faces (gap/20), and at the shims' inner
// corners.
func (t *dims) poleRefine(x *expansion, xa, xb, g float64, sh shim) {
	x.refine = append(x.refine, Refine{Near: "gap", Size: g / 10, Pos: t.at})
	for _, s := range []float64{1, -1} {
		x.refine = append(x.refine, t.refinePoint(xa, s*g/2, g/20), t.refinePoint(xb, s*g/2, g/20))
		if sh.h > 0 {
			y := s * (g/2 - sh.h) // a step's inner corners
			if sh.bevel {
				y = s * g / 2 // a ramp's top ends
			}
			x.refine = append(x.refine, t.refinePoint(xa+sh.w, y, g/20), t.refinePoint(xb-sh.w, y, g/20))
		}
	}
}

// gapProbes returns gap-centre, midplane and good-field for a pole pair
// centred on xc. The good-field box reaches to one gap from the face edges
// (common practice for a flat pole), but at least half the face width.
func (t *dims) gapProbes(xc, wp, wf, g float64) []Probe {
	hw := wf/2 - g
	if hw < wf/4 {
		hw = wf / 4
	}
	return []Probe{
		t.point("gap-centre", xc, 0),
		t.line("midplane", xc-wp, 0, xc+wp, 0),
		t.box("good-field", xc-hw, -g/4, xc+hw, g/4),
	}
}

// coilSide adds a copper rectangle and makes it a side of coil.
func (t *dims) coilSide(x *expansion, coil *Coil, name string, sense, x0, y0, x1, y1 float64) {
	x.regions = append(x.regions, t.rect(name, "copper", x0, y0, x1, y1))
	coil.Sides = append(coil.Sides, CoilSide{Region: name, Sense: sense, Pos: t.at})
}

// poleCoils adds four coil sides around poles spanning x0..x1 whose roots
// are at y = ±yr: cw × ch each, clr from the pole sides and the arms. The
// senses drive the gap field along +y.
func (t *dims) poleCoils(x *expansion, coil *Coil, x0, x1, yr, cw, ch, clr float64) {
	t.coilSide(x, coil, "coil-upper-left", +1, x0-clr-cw, yr-clr-ch, x0-clr, yr-clr)
	t.coilSide(x, coil, "coil-upper-right", -1, x1+clr, yr-clr-ch, x1+clr+cw, yr-clr)
	t.coilSide(x, coil, "coil-lower-left", +1, x0-clr-cw, -yr+clr, x0-clr, -yr+clr+ch)
	t.coilSide(x, coil, "coil-lower-right", -1, x1+clr, -yr+clr, x1+clr+cw, -yr+clr+ch)
}

// sideStep returns the point at distance c from (ax, ay) towards (bx, by).
func sideStep(ax, ay, bx, by, c float64) (x, y float64) {
	l := math.Hypot(bx-ax, by-ay)
	return ax + c*(bx-ax)/l, ay + c*(by-ay)/l
}
