package models

// Pole-edge shims of the c-core and h-core templates: a step of
// shim-height by shim-width standing proud of the flat face at each of its
// two edges (inside the chamfers), on both poles — or, with shim-shape:
// bevel, a ramp rising shim-height over shim-width towards the edge — raising the field near
// the face edges to widen the good-field region (the classical remedy of
// M. E. Rose, Phys. Rev. 53, 715, 1938). shim-min is the smallest step the
// workshop can machine: a shim with either size below it is refused.
//
//	      chamfer      face                face      chamfer
//	   \ +-------+-----------------------+-------+ /     y = gap/2
//	    \|  shim |                       |  shim |/
//	     +-------+                       +-------+       y = gap/2 - shim-height
//	     |<----->|  shim-width
//
// The keys shim-height, shim-width, shim-shape and shim-min are in the
// key lists of both templates.

// shim is a pole-edge step: height h (into the gap) and width w (along the
// face), metres; zero for none.
type shim struct {
	h, w  float64
	bevel bool // a ramp instead of a step
}

// shim reads the shim dimensions (recorded in x) for a pole pair of gap g whose flat face
// runs between the chamfers over width flat, and checks that it fits.
func (t *dims) shim(x *expansion, g, flat, tol float64) shim {
	d := t.d
	h := t.length("shim-height", 0, false, true)
	w := t.length("shim-width", 0, false, true)
	lim := t.length("shim-min", 0, false, true)
	bevel := false
	if v := t.f.get("shim-shape"); v != nil {
		s, ok := d.enum(v, t.f.sub("shim-shape"), "shim shape", []string{"step", "bevel"})
		t.ok = t.ok && ok
		bevel = s == "bevel"
	}
	if !t.ok {
		return shim{}
	}
	x.shim = Shim{Height: h, Width: w, Min: lim, Bevel: bevel}
	if (h == 0) != (w == 0) {
		t.misfit("shim-height", "a shim needs both shim-height and shim-width (or neither), got %s by %s", d.fmtLen(h), d.fmtLen(w))
		return shim{}
	}
	if h == 0 {
		return shim{}
	}
	if h < lim-tol || w < lim-tol {
		t.misfit("shim-height", "the shim (%s high, %s wide) is below shim-min (%s), the smallest step the workshop can machine", d.fmtLen(h), d.fmtLen(w), d.fmtLen(lim))
	}
	if 4*h >= g-tol {
		t.misfit("shim-height", "shim-height (%s) must be below a quarter of the gap (%s): the shims of the two poles face each other", d.fmtLen(h), d.fmtLen(g))
	}
	if 2*w >= flat-tol {
		t.misfit("shim-width", "two shims (2 × %s) must be narrower than the flat face between the chamfers (%s)", d.fmtLen(w), d.fmtLen(flat))
	}
	return shim{h, w, bevel}
}

// face returns the upper pole's flat face from xa to xb at height g2 with
// the shim steps, left to right (the ends at g2 - h when shimmed).
func (s shim) face(xa, xb, g2 float64) (xs, ys []float64) {
	if s.h == 0 {
		return []float64{xa, xb}, []float64{g2, g2}
	}
	lo := g2 - s.h
	if s.bevel {
		return []float64{xa, xa + s.w, xb - s.w, xb}, []float64{lo, g2, g2, lo}
	}
	return []float64{xa, xa + s.w, xa + s.w, xb - s.w, xb - s.w, xb},
		[]float64{lo, lo, g2, g2, lo, lo}
}
