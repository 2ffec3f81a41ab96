//go:build !unix

package ringdown

import "time"

// cpuTime is not measured on this system; the benchmark's cpu-ms/op reads 0.
func cpuTime() time.Duration { return 0 }
