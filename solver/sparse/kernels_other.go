//go:build !amd64 || purego

package sparse

const useFMA = false

func axpy2x4(e0, e1, x0, x1, x2, x3 *float64, n int, a *[8]float64) {
	panic("sparse: axpy2x4 without assembly")
}
