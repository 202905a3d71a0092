//go:build !unix

package engine_test

// cpuTime is not measured here: the benchmark's CPU figure reads 0.
func cpuTime() int64 { return 0 }
