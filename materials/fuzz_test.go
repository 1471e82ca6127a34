package materials

import (
	"encoding/binary"
	"math"
	"testing"
)

// FuzzNewCurve builds tables from bytes: each 4 bytes give a step in H,
// spread over 1e-6..1e10 A/m on a log scale, and the relative slope of that
// step, 0.1..1e8 on a log scale, so that most inputs are near the
// validation bounds and many are accepted. Every accepted curve must pass
// Check and give positive finite ν, rising H = ν B and finite energy at
// sample points; every rejected one a *TableError. Never a panic.
func FuzzNewCurve(f *testing.F) {
	f.Add([]byte{0x80, 0x00, 0xf0, 0x00, 0x90, 0x00, 0xa0, 0x00, 0xa0, 0x00, 0x30, 0x00})
	f.Add([]byte{0x10, 0x00, 0xff, 0xff, 0x20, 0x00, 0x00, 0x10, 0xf0, 0x00, 0x40, 0x00, 0xff, 0xff, 0x30, 0x00})
	f.Add([]byte{0, 0, 0, 0, 1, 1, 1, 1, 2, 2, 2, 2})
	f.Fuzz(func(t *testing.T, data []byte) {
		if len(data) > 4*64 {
			data = data[:4*64]
		}
		var h, b []float64
		hv, bv := 0.0, 0.0
		for k := 0; k+4 <= len(data); k += 4 {
			u1 := float64(binary.LittleEndian.Uint16(data[k:])) / 65535
			u2 := float64(binary.LittleEndian.Uint16(data[k+2:])) / 65535
			dh := math.Pow(10, -6+16*u1)
			mur := math.Pow(10, -1+9*u2)
			hv += dh
			bv += mur * Mu0 * dh
			h = append(h, hv)
			b = append(b, bv)
		}
		c, err := NewCurve(h, b)
		if err != nil {
			if _, ok := err.(*TableError); !ok {
				t.Fatalf("error %T: %v", err, err)
			}
			return
		}
		if err := c.Check(); err != nil {
			t.Fatalf("Check: %v\nh %v\nb %v", err, h, b)
		}
		prev := -1.0
		for k := 0; k <= 64; k++ {
			x := c.bl * 1.25 * float64(k) / 64
			nu, g := c.Nu(x * x)
			if !(nu > 0) || math.IsInf(nu, 0) || math.IsNaN(g) || math.IsInf(g, 0) || !(nu*x > prev) {
				t.Fatalf("B = %g: ν = %g, dν/db2 = %g, H = %g after %g\nh %v\nb %v", x, nu, g, nu*x, prev, h, b)
			}
			prev = nu * x
			if w := c.Energy(x * x); math.IsNaN(w) || math.IsInf(w, 0) || w < 0 {
				t.Fatalf("B = %g: energy %g", x, w)
			}
		}
	})
}
