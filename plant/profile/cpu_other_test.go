//go:build !unix

package profile

// cpuSeconds is not measured on this platform; the benchmarks then report
// cpu-ns/op as 0.
func cpuSeconds() float64 { return 0 }
