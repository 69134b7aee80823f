package main

import (
	"bytes"
	"fmt"
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
)

// fuzzMaxExpansion keeps a short input from expanding into a graph whose
// layout takes seconds: the fuzzer is after wrong answers, not slow ones.
const fuzzMaxExpansion = "2000"

// inputMessage is the one line gridwood prints for a problem in the input
// read from standard input: the position, then the message (README.md,
// exit status 2; dotio.Error).
var inputMessage = regexp.MustCompile(`^gridwood: <stdin>:([0-9]+):([0-9]+): [^\n]+\n$`)

// FuzzFilter runs random bytes through the command (in-process, via run)
// and checks that it never panics, exits 0, 2 or (with --planar-only) 3,
// and then:
//   - 0: the output parses, every node has an integral pos, the drawing of
//     the kept edges passes geomcheck and nothing is lost (filterCheck, see
//     lossless_test.go), with --mark-removed and --drop-removed too when
//     edges were removed; under --planar-only nothing was removed;
//   - 2: nothing on standard output, no --removed file, and one positioned
//     line on standard error;
//   - 3: as 2, and the input really loses edges without --planar-only.
func FuzzFilter(f *testing.F) {
	for seed := range uint64(16) {
		f.Add([]byte(genDOT(1000+seed, seed%4 == 0)), seed%3 == 0)
	}
	for _, pattern := range []string{"../../examples/*.dot", "testdata/*.dot", "../../dotio/testdata/*.gv"} {
		files, _ := filepath.Glob(pattern)
		for _, name := range files {
			if b, err := os.ReadFile(name); err == nil {
				f.Add(b, false)
			}
		}
	}
	f.Fuzz(func(t *testing.T, src []byte, planarOnly bool) {
		if len(src) > 1<<14 {
			return
		}
		fc := filterCheck{dir: t.TempDir(), extra: []string{"--max-expansion", fuzzMaxExpansion}}
		if planarOnly {
			fc.extra = append(fc.extra, "--planar-only")
		}
		res := fc.check(src)
		if len(res.problems) > 0 {
			t.Fatalf("input %q:\n%s", src, strings.Join(res.problems, "\n"))
		}
		switch res.code {
		case exitOK:
			if planarOnly && res.removed > 0 {
				t.Fatalf("--planar-only accepted input that loses %d edges: %q", res.removed, src)
			}
		case exitBadInput, exitNonPlanar:
			if res.code == exitNonPlanar && !planarOnly {
				t.Fatalf("exit 3 without --planar-only: %q", src)
			}
			if len(res.stdout) > 0 || res.removedFile {
				t.Fatalf("exit %d but output written (stdout %q, removed file %v); input %q", res.code, res.stdout, res.removedFile, src)
			}
			if err := checkInputMessage(res.stderr, src); err != nil {
				t.Fatalf("exit %d: %v; input %q", res.code, err, src)
			}
			if res.code == exitNonPlanar {
				again := filterCheck{dir: t.TempDir(), extra: []string{"--max-expansion", fuzzMaxExpansion}}.check(src)
				if again.code != exitOK || again.removed == 0 || len(again.problems) > 0 {
					t.Fatalf("--planar-only refused input that without it exits %d losing %d edges (%v); input %q", again.code, again.removed, again.problems, src)
				}
			}
		default:
			t.Fatalf("exit status %d (stderr %q) for input %q", res.code, res.stderr, src)
		}
	})
}

// checkInputMessage checks a failed run's standard error: exactly one line
// `gridwood: <stdin>:LINE:COL: message`, the position inside the input
// (one past the end at most).
func checkInputMessage(stderr, src []byte) error {
	m := inputMessage.FindSubmatch(stderr)
	if m == nil {
		return fmt.Errorf("message %q is not one positioned line", stderr)
	}
	var line, col int
	fmt.Sscan(string(m[1]), &line)
	fmt.Sscan(string(m[2]), &col)
	lines := bytes.Split(src, []byte("\n"))
	if line < 1 || line > len(lines) {
		return fmt.Errorf("message %q: line %d outside the input's %d lines", stderr, line, len(lines))
	}
	if col < 1 || col > len(lines[line-1])+1 {
		return fmt.Errorf("message %q: column %d outside line %d of %d bytes", stderr, col, line, len(lines[line-1]))
	}
	return nil
}
