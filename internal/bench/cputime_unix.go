//go:build unix

package bench

import "syscall"

// cpuSeconds returns the user and system CPU time of the process so far
// (all threads), or 0 where unknown. On a loaded machine the wall time of
// a stage grows with the load; its CPU time much less.
func cpuSeconds() float64 {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return 0
	}
	return float64(ru.Utime.Nano()+ru.Stime.Nano()) * 1e-9
}
