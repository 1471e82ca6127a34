//go:build !unix

package mesh

func cpuSeconds() float64 { return 0 }
