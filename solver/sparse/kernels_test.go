package sparse

import (
	"math"
	"math/rand/v2"
	"syscall"
	"testing"
)

// cpuSeconds returns the process's user+system CPU time, a steadier
// measure than wall time on a shared machine.
func cpuSeconds() float64 {
	var ru syscall.Rusage
	syscall.Getrusage(syscall.RUSAGE_SELF, &ru)
	return float64(ru.Utime.Sec+ru.Stime.Sec) + float64(ru.Utime.Usec+ru.Stime.Usec)*1e-6
}

// TestSyrkLowerSub compares the blocked kernel with a plain triple loop.
func TestSyrkLowerSub(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for _, sz := range [][3]int{{1, 1, 1}, {5, 3, 2}, {9, 9, 7}, {40, 13, 9}, {33, 32, 1}} {
		r, q, kk := sz[0], sz[1], sz[2]
		ldx, ldd := r+3, r+1
		x := make([]float64, ldx*kk)
		for i := range x {
			x[i] = rng.NormFloat64()
		}
		d := make([]float64, ldd*q)
		for i := range d {
			d[i] = rng.NormFloat64()
		}
		want := append([]float64(nil), d...)
		for c := 0; c < q; c++ {
			for i := c; i < r; i++ {
				for k := 0; k < kk; k++ {
					want[i+c*ldd] -= x[i+k*ldx] * x[c+k*ldx]
				}
			}
		}
		syrkLowerSub(d, ldd, x, ldx, r, q, kk)
		for k := range d {
			// Sums of kk products in a different order: a few ulps of
			// the magnitude kk (entries are of unit size).
			if math.Abs(d[k]-want[k]) > 1e-13*float64(kk+1) {
				t.Fatalf("r=%d q=%d kk=%d: entry %d = %v, want %v", r, q, kk, k, d[k], want[k])
			}
		}
	}
}

// TestPotrfTrapezoid factors a random SPD trapezoid and checks L L^T = A on
// the stored part.
func TestPotrfTrapezoid(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for _, sz := range [][2]int{{1, 1}, {7, 3}, {60, 60}, {130, 100}} {
		m, nc := sz[0], sz[1]
		// A = B B^T + m I restricted to the trapezoid.
		b := make([]float64, m*m)
		for i := range b {
			b[i] = rng.NormFloat64()
		}
		a := make([]float64, m*nc)
		for c := 0; c < nc; c++ {
			for i := c; i < m; i++ {
				s := 0.0
				for k := 0; k < m; k++ {
					s += b[i+k*m] * b[c+k*m]
				}
				if i == c {
					s += float64(m)
				}
				a[i+c*m] = s
			}
		}
		l := append([]float64(nil), a...)
		if k, _ := potrfTrapezoid(l, m, nc); k >= 0 {
			t.Fatalf("m=%d nc=%d: pivot %d failed", m, nc, k)
		}
		for c := 0; c < nc; c++ {
			for i := c; i < m; i++ {
				s := 0.0
				for k := 0; k <= c; k++ {
					s += l[i+k*m] * l[c+k*m]
				}
				// Backward error of Cholesky: |A - LL^T| <= c(n) u |L||L^T|
				// (Higham, Accuracy and Stability of Numerical Algorithms,
				// 2002, Thm 10.3, number from memory); entries here are O(m).
				if math.Abs(s-a[i+c*m]) > 1e-13*float64(m*m) {
					t.Fatalf("m=%d nc=%d: (LL^T)[%d,%d]=%v, want %v", m, nc, i, c, s, a[i+c*m])
				}
			}
		}
	}
}

func BenchmarkSyrkKernel(b *testing.B) {
	r, q, kk := 1000, 200, 200
	x := make([]float64, r*kk)
	for i := range x {
		x[i] = float64(i%7) * 0.1
	}
	d := make([]float64, r*q)
	b.ResetTimer()
	c0 := cpuSeconds()
	for it := 0; it < b.N; it++ {
		syrkLowerSub(d, r, x, r, r, q, kk)
	}
	madds := float64(kk) * float64(q) * (float64(r) - float64(q)/2)
	b.ReportMetric(madds*float64(b.N)/b.Elapsed().Seconds()/1e9, "Gmadd/s")
	b.ReportMetric(madds*float64(b.N)/(cpuSeconds()-c0)/1e9, "Gmadd/cpu-s")
}

func BenchmarkPotrfKernel(b *testing.B) {
	m, nc := 600, 300
	a := make([]float64, m*nc)
	for c := 0; c < nc; c++ {
		for i := c; i < m; i++ {
			a[i+c*m] = 0.001
		}
		a[c+c*m] = float64(m)
	}
	l := make([]float64, len(a))
	b.ResetTimer()
	c0 := cpuSeconds()
	for it := 0; it < b.N; it++ {
		copy(l, a)
		potrfTrapezoid(l, m, nc)
	}
	madds := float64(nc) * float64(nc) * (float64(m) - float64(nc)/3) / 2
	b.ReportMetric(madds*float64(b.N)/b.Elapsed().Seconds()/1e9, "Gmadd/s")
	b.ReportMetric(madds*float64(b.N)/(cpuSeconds()-c0)/1e9, "Gmadd/cpu-s")
}
