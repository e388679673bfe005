//go:build unix

package main

import (
	"syscall"
	"time"
)

// cpuSeconds is the CPU time the process has used so far, user and
// system, as the kernel counts it (getrusage): unlike the wall time, a
// machine busy with other work does not inflate it.
func cpuSeconds() float64 {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return 0
	}
	tv := func(t syscall.Timeval) time.Duration {
		return time.Duration(t.Sec)*time.Second + time.Duration(t.Usec)*time.Microsecond
	}
	return (tv(ru.Utime) + tv(ru.Stime)).Seconds()
}
