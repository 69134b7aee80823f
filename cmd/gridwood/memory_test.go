package main

import (
	"strings"
	"testing"
)

// TestMemoryGuard pretends a small machine (availableMemory replaced):
// input that cannot fit even at the least measured cost per byte is
// refused before parsing with a clear message, exit status 2 and nothing
// on standard output; input that fits only below the typical cost runs
// with a warning (none under -q); input that fits runs silently.
func TestMemoryGuard(t *testing.T) {
	saved := availableMemory
	defer func() { availableMemory = saved }()
	src := "graph G { a -- b -- c -- a }\n" // 29 bytes
	for _, tc := range []struct {
		name   string
		avail  int64
		args   []string
		code   int
		stderr string
	}{
		{"refused", 29*leastBytesPerByte - 1, nil, exitBadInput, "gridwood: <stdin>: not enough memory: laying out 29 bytes of DOT takes at least 1.1 kB (40 bytes per input byte), and 1.1 kB is available\n"},
		{"warned", 29*typicalBytesPerByte - 1, nil, exitOK, "gridwood: <stdin>: laying out 29 bytes of DOT usually takes about 1.4 kB, and 1.4 kB is available: the run may fail for lack of memory\n"},
		{"warned quietly", 29*typicalBytesPerByte - 1, []string{"-q"}, exitOK, ""},
		{"fits", 1 << 30, nil, exitOK, ""},
	} {
		t.Run(tc.name, func(t *testing.T) {
			availableMemory = func() (int64, bool) { return tc.avail, true }
			code, out, errs := runCmd(t, src, tc.args...)
			if code != tc.code || errs != tc.stderr {
				t.Fatalf("exit %d, stderr %q; want %d, %q", code, errs, tc.code, tc.stderr)
			}
			if (code == exitOK) != strings.Contains(out, `pos="`) {
				t.Errorf("exit %d with stdout %q", code, out)
			}
		})
	}
	// The real machine's figure, where the system has one, is positive.
	if avail, ok := saved(); ok && avail <= 0 {
		t.Errorf("available memory %d", avail)
	}
}
