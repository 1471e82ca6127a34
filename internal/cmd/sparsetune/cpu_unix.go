//go:build unix

package main

import "syscall"

// cpuSeconds returns the process's user and system CPU time: on a shared
// machine the wall time varies with the load, the CPU time much less.
func cpuSeconds() float64 {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return 0
	}
	return float64(ru.Utime.Nano()+ru.Stime.Nano()) * 1e-9
}
