//go:build unix

package scenarios_test

import "syscall"

// cpuSeconds returns the user and system CPU time of the process. The
// benchmarks report it per operation (cpu-ns/op) next to the wall-clock
// ns/op, because on a shared, loaded machine the wall clock also counts
// the time the benchmark waited for a core.
func cpuSeconds() float64 {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return 0
	}
	return float64(ru.Utime.Sec+ru.Stime.Sec) + float64(ru.Utime.Usec+ru.Stime.Usec)*1e-6
}
