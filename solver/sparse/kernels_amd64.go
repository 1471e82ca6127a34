//go:build amd64 && !purego

package sparse

// Assembly kernels for amd64 (kernels_amd64.s); the pure-Go kernels in
// kernels.go are used when the CPU lacks AVX2 and FMA or with the purego
// build tag.

func cpuid(eaxArg, ecxArg uint32) (eax, ebx, ecx, edx uint32)
func xgetbv() (eax, edx uint32)

//go:noescape
func axpy2x4(e0, e1, x0, x1, x2, x3 *float64, n int, a *[8]float64)

// useFMA reports whether the AVX2+FMA kernel may run: the CPU has AVX,
// FMA and AVX2, and the OS saves the YMM registers (Intel SDM vol. 1,
// 14.3 "Detection of Intel AVX instructions").
var useFMA = func() bool {
	max, _, _, _ := cpuid(0, 0)
	if max < 7 {
		return false
	}
	_, _, c, _ := cpuid(1, 0)
	const fma, osxsave, avx = 1 << 12, 1 << 27, 1 << 28
	if c&fma == 0 || c&osxsave == 0 || c&avx == 0 {
		return false
	}
	if lo, _ := xgetbv(); lo&6 != 6 {
		return false
	}
	_, b, _, _ := cpuid(7, 0)
	return b&(1<<5) != 0
}()
