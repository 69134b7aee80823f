package main

import (
	"math"
	"runtime/debug"
	"strings"
	"testing"
)

// TestMemoryGuard pretends a small machine (availableMemory replaced):
// input that cannot fit even at the least measured cost per byte, brace
// and graph is refused before parsing with a clear message, exit status 2
// and nothing on standard output; input that fits only below the typical
// cost runs with a warning (none under -q); input that fits runs
// silently. A file of many tiny graphs is judged by its graphs, not only
// its bytes.
func TestMemoryGuard(t *testing.T) {
	saved, savedFloor := availableMemory, guardFloor
	defer func() { availableMemory, guardFloor = saved, savedFloor }()
	defer debug.SetMemoryLimit(math.MaxInt64) // the guard sets it for the pretended machine
	guardFloor = 0                            // ask the pretended machine even for these small inputs
	src := "graph G { a -- b -- c -- a }\n"   // 29 bytes, one brace, one graph
	least := 29*leastBytesPerByte + leastPerBrace + leastPerGraph
	typical := 29*typicalBytesPerByte + typicalPerBrace + typicalPerGraph
	tiny := strings.Repeat("graph{a--b}\n", 1000) // 12,000 bytes
	for _, tc := range []struct {
		name   string
		src    string
		avail  int64
		args   []string
		code   int
		stderr string
	}{
		{"refused", src, int64(least - 1), nil, exitBadInput, "gridwood: <stdin>: not enough memory: laying out 29 bytes of DOT in 1 braces takes at least 6.0 kB, and 6.0 kB is available\n"},
		{"warned", src, int64(typical - 1), nil, exitOK, "gridwood: <stdin>: laying out 29 bytes of DOT usually takes about 7.9 kB, and 7.9 kB is available: the run may fail for lack of memory\n"},
		{"warned quietly", src, int64(typical - 1), []string{"-q"}, exitOK, ""},
		{"fits", src, 1 << 30, nil, exitOK, ""},
		{"many tiny graphs refused", tiny, 5 << 20, nil, exitBadInput, "gridwood: <stdin>: not enough memory: laying out 11.7 kB of DOT in 1000 braces takes at least 5.2 MB, and 5.0 MB is available\n"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			availableMemory = func() (int64, bool) { return tc.avail, true }
			code, out, errs := runCmd(t, tc.src, tc.args...)
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

// TestMemoryGuardLazy checks that small input does not ask the machine
// (the reads cost a tenth of a small graph's run) and big input does.
func TestMemoryGuardLazy(t *testing.T) {
	saved := availableMemory
	defer func() { availableMemory = saved }()
	defer debug.SetMemoryLimit(math.MaxInt64)
	asked := 0
	availableMemory = func() (int64, bool) { asked++; return 1 << 40, true }
	m := newMemoryGuard()
	note := func(string, ...any) {}
	if err := m.admit("small", inputCost{bytes: 10_000, braces: 1, graphs: 1}, note); err != nil || asked != 0 {
		t.Fatalf("small input: err %v, machine asked %d times, want 0", err, asked)
	}
	big := inputCost{bytes: guardFloor / typicalBytesPerByte, braces: 1, graphs: 1}
	for range 2 {
		if err := m.admit("big", big, note); err != nil {
			t.Fatal(err)
		}
	}
	if asked != 1 {
		t.Fatalf("big input: machine asked %d times, want once", asked)
	}
}
