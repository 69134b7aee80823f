package main

import (
	"bytes"
	"os"
	"strconv"
	"syscall"
)

// addressSpaceLeft is what an address-space limit (ulimit -v, RLIMIT_AS)
// leaves of virtual memory beyond what the process has mapped already
// (/proc/self/statm), less an eighth of the limit for the runtime's own
// reservations as the heap grows; ok is false when there is no limit.
// Without it a limit below the run's need ends in the runtime's fatal
// out-of-memory dump rather than a message.
func addressSpaceLeft() (int64, bool) {
	var rl syscall.Rlimit
	// RLIM_INFINITY is all ones: no limit.
	if err := syscall.Getrlimit(syscall.RLIMIT_AS, &rl); err != nil || rl.Cur > 1<<62 {
		return 0, false
	}
	limit := int64(rl.Cur)
	var mapped int64
	if b, err := os.ReadFile("/proc/self/statm"); err == nil {
		if f := bytes.Fields(b); len(f) > 0 {
			if pages, err := strconv.ParseInt(string(f[0]), 10, 64); err == nil {
				mapped = pages * int64(os.Getpagesize())
			}
		}
	}
	return max(0, limit-mapped-limit/8), true
}
