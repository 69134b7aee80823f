package main

import (
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"slices"
	"strings"
	"testing"
	"time"
)

// TestExamplesMakefile runs the documentation-build example on a copy of
// examples/Makefile and examples/*.dot (the tracked files are never touched):
// one make lays out every example (DOT, SVG, removed edges), a second finds
// nothing to do, touching one input rebuilds exactly that one, deleting one
// output rebuilds it, make check lints the built drawings and finds every
// one clean, and deleting an input removes its outputs.
func TestExamplesMakefile(t *testing.T) {
	if testing.Short() {
		t.Skip("builds the command")
	}
	if _, err := exec.LookPath("make"); err != nil {
		t.Skip("make is not installed")
	}
	root, err := filepath.Abs("../..")
	if err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	inputs, _ := filepath.Glob(filepath.Join(root, "examples", "*.dot"))
	if len(inputs) < 2 {
		t.Fatalf("want at least two examples, have %d", len(inputs))
	}
	var names []string
	for _, f := range append([]string{filepath.Join(root, "examples", "Makefile")}, inputs...) {
		b, err := os.ReadFile(f)
		if err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(filepath.Join(dir, filepath.Base(f)), b, 0o644); err != nil {
			t.Fatal(err)
		}
		if strings.HasSuffix(f, ".dot") {
			names = append(names, strings.TrimSuffix(filepath.Base(f), ".dot"))
		}
	}
	out := filepath.Join(dir, "out")
	suffixes := []string{".dot", ".svg", ".removed.dot"}

	mk := func(args ...string) (string, error) {
		cmd := exec.Command("make", append([]string{"ROOT=" + root}, args...)...)
		cmd.Dir = dir
		b, err := cmd.CombinedOutput()
		return string(b), err
	}
	// laidOut lists, in order, the sources make ran the layout (the run that
	// writes all three outputs) on, from the commands it echoed.
	laidOut := func(msg string) []string {
		var srcs []string
		for _, line := range strings.Split(msg, "\n") {
			if f := strings.Fields(line); strings.Contains(line, "--svg") && len(f) > 0 {
				srcs = append(srcs, strings.TrimSuffix(f[len(f)-1], ".dot"))
			}
		}
		return srcs
	}
	upToDate := func(when string) {
		t.Helper()
		if msg, err := mk("-q"); err != nil {
			t.Fatalf("%s, make -q says something is out of date: %v\n%s", when, err, msg)
		}
		msg, err := mk()
		if err != nil {
			t.Fatalf("%s, make: %v\n%s", when, err, msg)
		}
		if srcs := laidOut(msg); len(srcs) != 0 || strings.Contains(msg, "go build") {
			t.Fatalf("%s, make rebuilt something:\n%s", when, msg)
		}
	}

	msg, err := mk()
	if err != nil {
		t.Fatalf("make: %v\n%s", err, msg)
	}
	if srcs := laidOut(msg); !slices.Equal(srcs, names) {
		t.Errorf("first make laid out %q, want each of %q once:\n%s", srcs, names, msg)
	}
	for _, name := range names {
		for _, suffix := range suffixes {
			if fi, err := os.Stat(filepath.Join(out, name+suffix)); err != nil || fi.Size() == 0 {
				t.Errorf("%s%s missing or empty: %v", name, suffix, err)
			}
		}
	}
	upToDate("after the first make")

	// Touch one input: its time must move past its outputs' (set it to now
	// until it does, in case the file system's timestamps are coarse).
	touched := names[0]
	src := filepath.Join(dir, touched+".dot")
	for deadline := time.Now().Add(3 * time.Second); ; time.Sleep(10 * time.Millisecond) {
		now := time.Now()
		if err := os.Chtimes(src, now, now); err != nil {
			t.Fatal(err)
		}
		if makefileNewer(t, src, out, touched, suffixes) {
			break
		}
		if time.Now().After(deadline) {
			t.Fatal("could not make the input newer than its outputs")
		}
	}
	msg, err = mk()
	if err != nil {
		t.Fatalf("make after touch: %v\n%s", err, msg)
	}
	if srcs := laidOut(msg); !slices.Equal(srcs, []string{touched}) {
		t.Errorf("touching %s.dot laid out %q, want only %q:\n%s", touched, srcs, touched, msg)
	}
	upToDate("after rebuilding a touched input")

	// Delete each output of another input in turn.
	other := names[len(names)-1]
	for _, suffix := range suffixes {
		if err := os.Remove(filepath.Join(out, other+suffix)); err != nil {
			t.Fatal(err)
		}
		msg, err := mk()
		if err != nil {
			t.Fatalf("make after deleting %s%s: %v\n%s", other, suffix, err, msg)
		}
		if srcs := laidOut(msg); !slices.Equal(srcs, []string{other}) {
			t.Errorf("deleting %s%s laid out %q, want only %q:\n%s", other, suffix, srcs, other, msg)
		}
		if fi, err := os.Stat(filepath.Join(out, other+suffix)); err != nil || fi.Size() == 0 {
			t.Errorf("%s%s not rebuilt: %v", other, suffix, err)
		}
		upToDate("after rebuilding a deleted " + suffix)
	}

	// make check lints the built drawings, without their removed edges.
	msg, err = mk("check")
	if err != nil {
		t.Fatalf("make check: %v\n%s", err, msg)
	}
	if n := strings.Count(msg, ": clean"); n != len(names) {
		t.Errorf("make check printed %d clean lines, want %d:\n%s", n, len(names), msg)
	}
	for _, name := range names {
		if !strings.Contains(msg, name+".dot: clean") {
			t.Errorf("make check printed nothing for %s.dot:\n%s", name, msg)
		}
	}
	if srcs := laidOut(msg); len(srcs) != 0 {
		t.Errorf("make check laid out %q again:\n%s", srcs, msg)
	}
	// What it checked has the built positions and none of the removed edges.
	setAside := 0
	for _, name := range names {
		built := makefileRead(t, filepath.Join(out, name+".dot"))
		kept := makefileRead(t, filepath.Join(out, name+".kept.dot"))
		if b, k := makefilePositions(built), makefilePositions(kept); len(b) == 0 || !slices.Equal(b, k) {
			t.Errorf("%s: checked positions %q differ from the built ones %q", name, k, b)
		}
		// The Makefile marks removed edges with style=dashed,color=gray.
		removed := 0 // removed.dot has one edge a line
		for _, line := range strings.Split(makefileRead(t, filepath.Join(out, name+".removed.dot")), "\n") {
			if strings.Contains(line, " -- ") || strings.Contains(line, " -> ") {
				removed++
			}
		}
		setAside += removed
		if n := strings.Count(built, "style=dashed, color=gray]"); n != removed {
			t.Errorf("%s: the built drawing marks %d edges, want the %d removed:\n%s", name, n, removed, built)
		}
		if strings.Contains(kept, "style=dashed, color=gray]") {
			t.Errorf("%s: the checked drawing keeps removed edges:\n%s", name, kept)
		}
	}
	if setAside == 0 {
		t.Error("no example has removed edges: make check's dropping them is not tested")
	}
	// A broken drawing in out/ fails make check (it is not laid out again).
	keptFile := filepath.Join(out, touched+".kept.dot")
	broken := regexp.MustCompile(`pos="[^"]*"`).ReplaceAllString(makefileRead(t, keptFile), `pos="0,0"`)
	if err := os.WriteFile(keptFile, []byte(broken), 0o644); err != nil {
		t.Fatal(err)
	}
	if msg, err := mk("check"); err == nil || strings.Contains(msg, "--drop-removed") {
		t.Errorf("make check with every node of %s at 0,0: %v (want a failure, without a new layout)\n%s", touched, err, msg)
	}
	// Deleting an input removes its outputs, and only those.
	if err := os.Remove(filepath.Join(dir, other+".dot")); err != nil {
		t.Fatal(err)
	}
	if msg, err := mk(); err != nil {
		t.Fatalf("make after deleting %s.dot: %v\n%s", other, err, msg)
	}
	for _, name := range names {
		for _, suffix := range append(suffixes, ".kept.dot") {
			_, err := os.Stat(filepath.Join(out, name+suffix))
			if gone := os.IsNotExist(err); gone != (name == other) {
				t.Errorf("after deleting %s.dot: %s%s gone=%v", other, name, suffix, gone)
			}
		}
	}
	upToDate("after deleting an input")
}

// makefileNewer reports whether src is newer than every out/NAME+suffix.
func makefileNewer(t *testing.T, src, out, name string, suffixes []string) bool {
	t.Helper()
	si, err := os.Stat(src)
	if err != nil {
		t.Fatal(err)
	}
	for _, suffix := range suffixes {
		fi, err := os.Stat(filepath.Join(out, name+suffix))
		if err != nil {
			t.Fatal(err)
		}
		if !si.ModTime().After(fi.ModTime()) {
			return false
		}
	}
	return true
}

func makefileRead(t *testing.T, name string) string {
	t.Helper()
	b, err := os.ReadFile(name)
	if err != nil {
		t.Fatal(err)
	}
	return string(b)
}

// makefilePositions returns the lines of a DOT file that set pos or bb, sorted.
func makefilePositions(dot string) []string {
	var lines []string
	for _, line := range strings.Split(dot, "\n") {
		if strings.Contains(line, "pos=") || strings.Contains(line, "bb=") {
			lines = append(lines, strings.TrimSpace(line))
		}
	}
	slices.Sort(lines)
	return lines
}
