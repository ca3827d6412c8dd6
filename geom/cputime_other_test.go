//go:build !unix

package geom

import "time"

// cpuTime reports that this system gives no process CPU time (WebAssembly under Node).
func cpuTime() (time.Duration, bool) { return 0, false }
