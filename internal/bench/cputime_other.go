//go:build !unix

package bench

// cpuSeconds is unknown on this system.
func cpuSeconds() float64 { return 0 }
