//go:build !unix

package scenarios_test

// cpuSeconds is not measured on this platform; the benchmarks then report
// cpu-ns/op as 0.
func cpuSeconds() float64 { return 0 }
