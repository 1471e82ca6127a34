package sparse

// Dense kernels on column-major blocks used by the supernodal Cholesky
// factorization. They are written with fixed 4-wide inner loops so the
// compiler keeps the multipliers in registers; no kernel allocates.

// syrkLowerSub computes the lower trapezoid of D -= X X_top^T: for c in
// [0,q) and i in [c,r),
//
//	d[i+c*ldd] -= sum_{k<kk} x[i+k*ldx] * x[c+k*ldx].
//
// x holds r rows of kk columns (leading dimension ldx); its first q rows
// form X_top.
func syrkLowerSub(d []float64, ldd int, x []float64, ldx, r, q, kk int) {
	c := 0
	for ; c+1 < q; c += 2 {
		n := r - c
		e0 := d[c*ldd+c : c*ldd+r][:n]
		e1 := d[(c+1)*ldd+c : (c+1)*ldd+r][:n]
		k := 0
		for ; k+3 < kk; k += 4 {
			x0 := x[k*ldx+c : k*ldx+r][:n]
			x1 := x[(k+1)*ldx+c : (k+1)*ldx+r][:n]
			x2 := x[(k+2)*ldx+c : (k+2)*ldx+r][:n]
			x3 := x[(k+3)*ldx+c : (k+3)*ldx+r][:n]
			a0, a1, a2, a3 := x0[0], x1[0], x2[0], x3[0]
			b0, b1, b2, b3 := x0[1], x1[1], x2[1], x3[1]
			e0[0] -= a0*a0 + a1*a1 + a2*a2 + a3*a3
			if useFMA && n > 1 {
				co := [8]float64{a0, a1, a2, a3, b0, b1, b2, b3}
				axpy2x4(&e0[1], &e1[1], &x0[1], &x1[1], &x2[1], &x3[1], n-1, &co)
				continue
			}
			for i := 1; i < n; i++ {
				v0, v1, v2, v3 := x0[i], x1[i], x2[i], x3[i]
				e0[i] -= a0*v0 + a1*v1 + a2*v2 + a3*v3
				e1[i] -= b0*v0 + b1*v1 + b2*v2 + b3*v3
			}
		}
		if useFMA && kk-k >= 2 && n > 1 {
			// Two or three columns left: run the vector kernel with the
			// missing columns' coefficients set to zero.
			var co [8]float64
			var xs [4]*float64
			for j := 0; j < 4; j++ {
				xs[j] = &x[k*ldx+c+1]
				if k+j < kk {
					xj := x[(k+j)*ldx+c : (k+j)*ldx+r][:n]
					co[j], co[4+j] = xj[0], xj[1]
					e0[0] -= xj[0] * xj[0]
					xs[j] = &xj[1]
				}
			}
			axpy2x4(&e0[1], &e1[1], xs[0], xs[1], xs[2], xs[3], n-1, &co)
			k = kk
		}
		for ; k < kk; k++ {
			x0 := x[k*ldx+c : k*ldx+r][:n]
			a0, b0 := x0[0], x0[1]
			e0[0] -= a0 * a0
			for i := 1; i < n; i++ {
				v0 := x0[i]
				e0[i] -= a0 * v0
				e1[i] -= b0 * v0
			}
		}
	}
	if c < q {
		n := r - c
		e0 := d[c*ldd+c : c*ldd+r]
		for k := 0; k < kk; k++ {
			x0 := x[k*ldx+c : k*ldx+r][:n]
			a0 := x0[0]
			if a0 == 0 {
				continue
			}
			for i, v := range x0 {
				e0[i] -= a0 * v
			}
		}
	}
}

// panelBlock is the panel width of the blocked dense Cholesky.
const panelBlock = 16

// potrfTrapezoid factors in place the m×nc column-major trapezoid b (leading
// dimension m) of one supernode: the top nc×nc block becomes its Cholesky
// factor L11 and the rows below become L21 = A21 L11^{-T}. It returns the
// local column of the first non-positive or non-finite pivot, or -1, and
// that pivot value.
func potrfTrapezoid(b []float64, m, nc int) (int, float64) {
	for k0 := 0; k0 < nc; k0 += panelBlock {
		k1 := min(k0+panelBlock, nc)
		if k, d := potrfPanel(b, m, k0, k1); k >= 0 {
			return k, d
		}
		if k1 < nc {
			// Trailing update with the whole panel at once.
			syrkLowerSub(b[k1+k1*m:], m, b[k1+k0*m:], m, m-k1, nc-k1, k1-k0)
		}
	}
	return -1, 0
}

// potrfPanel factors columns [k0,k1) of the trapezoid b (leading dimension
// m), whose updates from columns before k0 are already applied. It is
// left-looking inside the panel: each pair of columns first takes the
// updates of the panel columns before it through syrkLowerSub (the vector
// kernel), then the pair is factored.
func potrfPanel(b []float64, m, k0, k1 int) (int, float64) {
	for c := k0; c < k1; c += 2 {
		q := min(2, k1-c)
		if c > k0 {
			syrkLowerSub(b[c+c*m:], m, b[c+k0*m:], m, m-c, q, c-k0)
		}
		for k := c; k < c+q; k++ {
			ck := b[k*m : k*m+m]
			d := ck[k]
			if !(d > 0) || d > maxFinite {
				return k, d
			}
			piv := sqrtf(d)
			ck[k] = piv
			inv := 1 / piv
			for i := k + 1; i < m; i++ {
				ck[i] *= inv
			}
			if k+1 < c+q {
				// Rank-1 update of the pair's second column.
				cc := b[(k+1)*m : (k+1)*m+m]
				if l := ck[k+1]; l != 0 {
					for i := k + 1; i < m; i++ {
						cc[i] -= l * ck[i]
					}
				}
			}
		}
	}
	return -1, 0
}
