package main

import (
	"syscall"
	"testing"
)

// TestAddressSpaceLeft sets an address-space limit on the test process
// (64 GB, far above its use, and put back at the end) and wants
// addressSpaceLeft to see it: ok, and no more than the limit less an
// eighth; with no limit it reports none.
func TestAddressSpaceLeft(t *testing.T) {
	var saved syscall.Rlimit
	if err := syscall.Getrlimit(syscall.RLIMIT_AS, &saved); err != nil {
		t.Skip(err)
	}
	defer syscall.Setrlimit(syscall.RLIMIT_AS, &saved)
	const limit = 64 << 30
	if saved.Max < limit {
		t.Skipf("hard address-space limit %d is below the test's", saved.Max)
	}
	if err := syscall.Setrlimit(syscall.RLIMIT_AS, &syscall.Rlimit{Cur: limit, Max: saved.Max}); err != nil {
		t.Skip(err)
	}
	left, ok := addressSpaceLeft()
	if !ok || left <= 0 || left > limit-limit/8 {
		t.Errorf("with a 64 GB limit: %d bytes left, ok %v", left, ok)
	}
	if err := syscall.Setrlimit(syscall.RLIMIT_AS, &syscall.Rlimit{Cur: saved.Max, Max: saved.Max}); err != nil {
		t.Fatal(err)
	}
	if saved.Max > 1<<62 {
		if _, ok := addressSpaceLeft(); ok {
			t.Error("with no limit: a limit was reported")
		}
	}
}
