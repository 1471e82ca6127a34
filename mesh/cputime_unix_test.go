//go:build unix

package mesh

import "syscall"

// cpuSeconds returns the process's user+system CPU time, so benchmarks can
// report work done independent of other load on a shared machine.
func cpuSeconds() float64 {
	var ru syscall.Rusage
	if syscall.Getrusage(syscall.RUSAGE_SELF, &ru) != nil {
		return 0
	}
	return float64(ru.Utime.Sec+ru.Stime.Sec) + float64(ru.Utime.Usec+ru.Stime.Usec)/1e6
}
